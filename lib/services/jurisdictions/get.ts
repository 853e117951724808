import "server-only";
import { and, eq } from "drizzle-orm";
import { jurisdictions, type Jurisdiction } from "../../../db/schema";
import { requirePermission, type ServiceContext } from "../context";
import { notFound } from "../errors";

/** A jurisdiction of the actor's organisation, or not-found (also for other organisations' ids). */
export function findJurisdictionInOrg(ctx: ServiceContext, id: string): Jurisdiction {
  const row = ctx.db
    .select()
    .from(jurisdictions)
    .where(and(eq(jurisdictions.id, id), eq(jurisdictions.orgId, ctx.orgId)))
    .get();
  if (!row) throw notFound("Jurisdiction");
  return row;
}

export function getJurisdiction(ctx: ServiceContext, id: string): Jurisdiction {
  requirePermission(ctx, "jurisdiction:read", "read jurisdictions");
  return findJurisdictionInOrg(ctx, id);
}
