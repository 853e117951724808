import { and, asc, eq, isNull, type SQL } from "drizzle-orm";
import { equipmentLibrary } from "../../../db/schema";
import { libraryKindSchema, type LibraryItemView } from "../../schemas/library-item";
import { requirePermission, type ServiceContext } from "../context";
import { invalid } from "../errors";
import { toLibraryView } from "./view";

export interface ListLibraryOptions {
  kind?: string;
  /** Retired items stay readable for the projects that use them; the picker leaves them out. */
  includeRetired?: boolean;
}

export function listLibraryItems(ctx: ServiceContext, options: ListLibraryOptions = {}): LibraryItemView[] {
  requirePermission(ctx, "library:read", "read the equipment library");
  const where: SQL[] = [eq(equipmentLibrary.orgId, ctx.orgId)];
  if (options.kind !== undefined && options.kind !== "") {
    const kind = libraryKindSchema.safeParse(options.kind);
    if (!kind.success) throw invalid("Unknown equipment kind.", [{ path: "kind", message: kind.error.issues[0]?.message ?? "unknown kind" }]);
    where.push(eq(equipmentLibrary.kind, kind.data));
  }
  if (!options.includeRetired) where.push(isNull(equipmentLibrary.retiredAt));
  return ctx.db
    .select()
    .from(equipmentLibrary)
    .where(and(...where))
    .orderBy(asc(equipmentLibrary.kind), asc(equipmentLibrary.manufacturer), asc(equipmentLibrary.model))
    .all()
    .map(toLibraryView);
}
