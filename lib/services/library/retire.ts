import "server-only";
import { and, eq, sql } from "drizzle-orm";
import { equipmentLibrary } from "../../../db/schema";
import type { LibraryItemView } from "../../schemas/library-item";
import { audit, requirePermission, type ServiceContext } from "../context";
import { conflict } from "../errors";
import { findLibraryRowInOrg, toLibraryView } from "./view";

/**
 * Takes an item out of the project picker. The row stays: projects that used
 * it keep their copy of the ratings, and the item can be restored.
 */
export function retireLibraryItem(ctx: ServiceContext, id: string, expectedVersion?: number): LibraryItemView {
  requirePermission(ctx, "library:edit", "edit the equipment library");
  return setRetired(ctx, id, true, expectedVersion);
}

export function setRetired(ctx: ServiceContext, id: string, retired: boolean, expectedVersion?: number): LibraryItemView {
  requirePermission(ctx, "library:edit", "edit the equipment library");
  const current = findLibraryRowInOrg(ctx, id);
  if (retired === (current.retiredAt !== null)) return toLibraryView(current);
  const version = expectedVersion ?? current.version;
  return ctx.db.transaction((tx) => {
    const now = new Date().toISOString();
    const updated = tx
      .update(equipmentLibrary)
      .set({ retiredAt: retired ? now : null, version: sql`${equipmentLibrary.version} + 1`, updatedAt: now })
      .where(and(eq(equipmentLibrary.id, id), eq(equipmentLibrary.orgId, ctx.orgId), eq(equipmentLibrary.version, version)))
      .returning()
      .get();
    if (!updated) throw conflict("Someone changed this item after you opened it. Reload and try again.");
    audit(tx, ctx, retired ? "library.retired" : "library.restored", "equipment-library", id, { manufacturer: current.manufacturer, model: current.model });
    return toLibraryView(updated);
  });
}
