import "server-only";
import { eq } from "drizzle-orm";
import { equipmentLibrary } from "../../../db/schema";
import { formatIssues } from "../../schemas/fields";
import { libraryItemSchema, splitLibraryItem, type LibraryItemView } from "../../schemas/library-item";
import { audit, requirePermission, type ServiceContext } from "../context";
import { conflict, invalid } from "../errors";
import { identityKey, toLibraryView } from "./view";

export function createLibraryItem(ctx: ServiceContext, input: unknown): LibraryItemView {
  requirePermission(ctx, "library:edit", "edit the equipment library");
  const parsed = libraryItemSchema.safeParse(input);
  if (!parsed.success) throw invalid("The item was not added: some fields are not valid.", formatIssues(parsed.error));
  const item = splitLibraryItem(parsed.data);
  return ctx.db.transaction((tx) => {
    const key = identityKey(item.kind, item.manufacturer, item.model);
    const same = tx
      .select()
      .from(equipmentLibrary)
      .where(eq(equipmentLibrary.orgId, ctx.orgId))
      .all()
      .find((r) => identityKey(r.kind, r.manufacturer, r.model) === key);
    if (same) {
      throw conflict(
        same.retiredAt
          ? `${item.manufacturer} ${item.model} is already in the library, retired. Restore it instead of adding it again.`
          : `${item.manufacturer} ${item.model} is already in the library. Edit that item instead of adding it again.`,
      );
    }
    const row = tx
      .insert(equipmentLibrary)
      .values({ orgId: ctx.orgId, ...item })
      .returning()
      .get();
    audit(tx, ctx, "library.created", "equipment-library", row.id, { kind: item.kind, manufacturer: item.manufacturer, model: item.model });
    return toLibraryView(row);
  });
}
