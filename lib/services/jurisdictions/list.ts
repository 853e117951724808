import "server-only";
import { asc, eq } from "drizzle-orm";
import { jurisdictions, type Jurisdiction } from "../../../db/schema";
import { requirePermission, type ServiceContext } from "../context";

export function listJurisdictions(ctx: ServiceContext): Jurisdiction[] {
  requirePermission(ctx, "jurisdiction:read", "read jurisdictions");
  return ctx.db.select().from(jurisdictions).where(eq(jurisdictions.orgId, ctx.orgId)).orderBy(asc(jurisdictions.name)).all();
}
