import "server-only";
import { and, asc, eq, inArray, isNull, type SQL } from "drizzle-orm";
import { equipmentLibrary } from "../../../db/schema";
import { libraryKindSchema, type LibraryItemView } from "../../schemas/library-item";
import { requirePermission, type ServiceContext } from "../context";
import { invalid } from "../errors";
import { toLibraryView } from "./view";

export interface ListLibraryOptions {
  /** One kind, or several separated by commas. */
  kind?: string;
  /** Retired items stay readable for the projects that use them; the picker leaves them out. */
  includeRetired?: boolean;
}

export function listLibraryItems(ctx: ServiceContext, options: ListLibraryOptions = {}): LibraryItemView[] {
  requirePermission(ctx, "library:read", "read the equipment library");
  const where: SQL[] = [eq(equipmentLibrary.orgId, ctx.orgId)];
  if (options.kind !== undefined && options.kind.trim() !== "") {
    // Several kinds may be asked for at once ("inverter,inverter-charger,hybrid-inverter") for one picker.
    const kinds = options.kind.split(",").map((k) => k.trim()).filter(Boolean);
    const parsed = kinds.map((k) => libraryKindSchema.safeParse(k));
    const bad = parsed.findIndex((p) => !p.success);
    if (bad >= 0) throw invalid("Unknown equipment kind.", [{ path: "kind", message: `"${kinds[bad]}" ${parsed[bad]?.error?.issues[0]?.message ?? "is not a kind"}` }]);
    where.push(inArray(equipmentLibrary.kind, kinds));
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
