import "server-only";
import { and, eq } from "drizzle-orm";
import { equipmentLibrary, type EquipmentLibraryItem } from "../../../db/schema";
import type { LibraryItemView } from "../../schemas/library-item";
import type { EquipmentKind } from "../../schemas/project-record";
import type { ServiceContext } from "../context";
import { notFound } from "../errors";

export function toLibraryView(row: EquipmentLibraryItem): LibraryItemView {
  return {
    id: row.id,
    kind: row.kind as EquipmentKind,
    manufacturer: row.manufacturer,
    model: row.model,
    ratings: row.ratings,
    retiredAt: row.retiredAt,
    version: row.version,
  };
}

/** Another organisation's item answers "not found", so ids do not leak. */
export function findLibraryRowInOrg(ctx: ServiceContext, id: string): EquipmentLibraryItem {
  const row = ctx.db
    .select()
    .from(equipmentLibrary)
    .where(and(eq(equipmentLibrary.id, id), eq(equipmentLibrary.orgId, ctx.orgId)))
    .get();
  if (!row) throw notFound("Library item");
  return row;
}

/** Maker and model compare without case or surrounding space: "Brightfell BF-540H" is one item however it is typed. */
export function identityKey(kind: string, manufacturer: string, model: string): string {
  return [kind, manufacturer.trim().toLowerCase().replace(/\s+/g, " "), model.trim().toLowerCase().replace(/\s+/g, " ")].join("\u0000");
}
