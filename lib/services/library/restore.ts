import "server-only";
import type { LibraryItemView } from "../../schemas/library-item";
import { requirePermission, type ServiceContext } from "../context";
import { setRetired } from "./retire";

/** Puts a retired item back in the project picker. */
export function restoreLibraryItem(ctx: ServiceContext, id: string, expectedVersion?: number): LibraryItemView {
  requirePermission(ctx, "library:edit", "edit the equipment library");
  return setRetired(ctx, id, false, expectedVersion);
}
