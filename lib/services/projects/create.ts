import "server-only";
import { and, eq } from "drizzle-orm";
import { z } from "zod";
import { jurisdictions, projects } from "../../../db/schema";
import { formatIssues, requiredText, text } from "../../schemas/fields";
import { systemKindSchema } from "../../schemas/project-record";
import { audit, requirePermission, type ServiceContext } from "../context";
import { invalid, notFound } from "../errors";

export const newProjectSchema = z.object({
  name: requiredText(200),
  client: text(200).default(""),
  systemKind: systemKindSchema,
  jurisdictionId: z.string().min(1, { message: "choose a jurisdiction" }),
  address: text(300).default(""),
});
export type NewProjectInput = z.input<typeof newProjectSchema>;

export function createProject(ctx: ServiceContext, input: unknown): { id: string } {
  requirePermission(ctx, "project:create", "create projects");
  const parsed = newProjectSchema.safeParse(input);
  if (!parsed.success) throw invalid("The project was not created: some fields are not valid.", formatIssues(parsed.error));
  const jurisdiction = ctx.db
    .select({ id: jurisdictions.id })
    .from(jurisdictions)
    .where(and(eq(jurisdictions.id, parsed.data.jurisdictionId), eq(jurisdictions.orgId, ctx.orgId)))
    .get();
  if (!jurisdiction) throw notFound("Jurisdiction");
  return ctx.db.transaction((tx) => {
    const row = tx
      .insert(projects)
      .values({ ...parsed.data, orgId: ctx.orgId, createdBy: ctx.user.id })
      .returning({ id: projects.id })
      .get();
    audit(tx, ctx, "project.created", "project", row.id, { name: parsed.data.name });
    return row;
  });
}
