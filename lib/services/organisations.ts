import "server-only";
import { eq } from "drizzle-orm";
import { organisations } from "../../db/schema";
import type { ServiceContext } from "./context";

export function currentOrganisation(ctx: ServiceContext) {
  return ctx.db.select().from(organisations).where(eq(organisations.id, ctx.orgId)).get();
}
