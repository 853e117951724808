import "server-only";
import type { LibraryItemView } from "../../schemas/library-item";
import { requirePermission, type ServiceContext } from "../context";
import { findLibraryRowInOrg, toLibraryView } from "./view";

/** Retired items are still served: projects that used them keep reading their ratings. */
export function getLibraryItem(ctx: ServiceContext, id: string): LibraryItemView {
  requirePermission(ctx, "library:read", "read the equipment library");
  return toLibraryView(findLibraryRowInOrg(ctx, id));
}
