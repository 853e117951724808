import "server-only";
import { and, eq, sql } from "drizzle-orm";
import { equipmentLibrary } from "../../../db/schema";
import { formatIssues } from "../../schemas/fields";
import { libraryItemSchema, splitLibraryItem, type LibraryItemView } from "../../schemas/library-item";
import { audit, requirePermission, type ServiceContext } from "../context";
import { conflict, invalid } from "../errors";
import { findLibraryRowInOrg, identityKey, toLibraryView } from "./view";

/**
 * Replaces an item's maker, model and ratings. Projects keep their own copy of
 * the ratings they took, so an edit here changes no saved design. A save made
 * from a stale version is refused so nobody's edit is overwritten silently.
 */
export function updateLibraryItem(ctx: ServiceContext, id: string, input: unknown, expectedVersion: number): LibraryItemView {
  requirePermission(ctx, "library:edit", "edit the equipment library");
  if (!Number.isInteger(expectedVersion)) throw invalid("Say which version of the item you edited.", [{ path: "version", message: "is required" }]);
  const current = findLibraryRowInOrg(ctx, id);
  const parsed = libraryItemSchema.safeParse(input);
  if (!parsed.success) throw invalid("The item was not saved: some fields are not valid.", formatIssues(parsed.error));
  const item = splitLibraryItem(parsed.data);
  if (item.kind !== current.kind) {
    throw invalid("The kind of a library item cannot change; add a new item of the other kind.", [
      { path: "kind", message: `stays ${current.kind}` },
    ]);
  }
  return ctx.db.transaction((tx) => {
    const key = identityKey(item.kind, item.manufacturer, item.model);
    const same = tx
      .select()
      .from(equipmentLibrary)
      .where(eq(equipmentLibrary.orgId, ctx.orgId))
      .all()
      .find((r) => r.id !== id && identityKey(r.kind, r.manufacturer, r.model) === key);
    if (same) throw conflict(`Another item is already ${item.manufacturer} ${item.model}. Edit that one, or name this one differently.`);
    const updated = tx
      .update(equipmentLibrary)
      .set({
        manufacturer: item.manufacturer,
        model: item.model,
        ratings: item.ratings,
        version: sql`${equipmentLibrary.version} + 1`,
        updatedAt: new Date().toISOString(),
      })
      .where(and(eq(equipmentLibrary.id, id), eq(equipmentLibrary.orgId, ctx.orgId), eq(equipmentLibrary.version, expectedVersion)))
      .returning()
      .get();
    if (!updated) {
      throw conflict("Someone saved this item after you opened it. Reload to see their changes; yours were not saved.");
    }
    audit(tx, ctx, "library.updated", "equipment-library", id, { fromVersion: expectedVersion, manufacturer: item.manufacturer, model: item.model });
    return toLibraryView(updated);
  });
}
