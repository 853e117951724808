import { and, eq, inArray } from "drizzle-orm";
import { equipmentLibrary } from "../../../db/schema";
import type { ServiceContext } from "../context";

/**
 * Equipment as saved or imported, with library links kept only where they
 * name this organisation's own items: an id from another organisation's
 * library would otherwise show that item's data through our project.
 */
export function keepOwnLibraryLinks<E extends { libraryItemId?: string | null }>(ctx: ServiceContext, equipment: readonly E[]): E[] {
  const linked = equipment.map((e) => e.libraryItemId).filter((id): id is string => Boolean(id));
  if (linked.length === 0) return [...equipment];
  const own = new Set(
    ctx.db
      .select({ id: equipmentLibrary.id })
      .from(equipmentLibrary)
      .where(and(eq(equipmentLibrary.orgId, ctx.orgId), inArray(equipmentLibrary.id, linked)))
      .all()
      .map((r) => r.id),
  );
  return equipment.map((e) => (e.libraryItemId && !own.has(e.libraryItemId) ? { ...e, libraryItemId: undefined } : e));
}
