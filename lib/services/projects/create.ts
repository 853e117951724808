import "server-only";
import { and, eq } from "drizzle-orm";
import { z } from "zod";
import { circuits, jurisdictions, loads, projectEquipment, projects, pvArrays } from "../../../db/schema";
import { formatIssues, requiredText, text } from "../../schemas/fields";
import { projectRecordSchema, systemKindSchema } from "../../schemas/project-record";
import { audit, requirePermission, type ServiceContext } from "../context";
import { invalid, notFound } from "../errors";
import { findTemplateInOrg } from "../templates/list";
import { keepOwnLibraryLinks } from "./library-links";
import { recordToRows } from "./mapping";

export const newProjectSchema = z.object({
  name: requiredText(200),
  client: text(200).default(""),
  systemKind: systemKindSchema,
  jurisdictionId: z.string().min(1, { message: "choose a jurisdiction" }),
  address: text(300).default(""),
  /** Start from one of the organisation's templates: its equipment, arrays, circuits and loads are copied in. */
  templateId: z.string().max(64).optional(),
});
export type NewProjectInput = z.input<typeof newProjectSchema>;

export function createProject(ctx: ServiceContext, input: unknown): { id: string } {
  requirePermission(ctx, "project:create", "create projects");
  const parsed = newProjectSchema.safeParse(input);
  if (!parsed.success) throw invalid("The project was not created: some fields are not valid.", formatIssues(parsed.error));
  const { templateId, ...fields } = parsed.data;
  const jurisdiction = ctx.db
    .select({ id: jurisdictions.id, name: jurisdictions.name, necEdition: jurisdictions.necEdition })
    .from(jurisdictions)
    .where(and(eq(jurisdictions.id, fields.jurisdictionId), eq(jurisdictions.orgId, ctx.orgId)))
    .get();
  if (!jurisdiction) throw notFound("Jurisdiction");
  if (!templateId) {
    return ctx.db.transaction((tx) => {
      const row = tx
        .insert(projects)
        .values({ ...fields, orgId: ctx.orgId, createdBy: ctx.user.id })
        .returning({ id: projects.id })
        .get();
      audit(tx, ctx, "project.created", "project", row.id, { name: fields.name });
      return row;
    });
  }

  const template = findTemplateInOrg(ctx, templateId);
  // The template's design under this project's names and site, checked by the record's own rules before anything is written.
  const record = projectRecordSchema.safeParse({
    ...template.design,
    name: fields.name,
    client: fields.client,
    site: { address: fields.address, occupancy: "one-two-family-dwelling", mounting: "ground" },
    jurisdiction: { name: jurisdiction.name, necEdition: jurisdiction.necEdition },
  });
  if (!record.success) {
    throw invalid(`The template "${template.name}" no longer passes validation; save it again from a project that does.`, formatIssues(record.error));
  }
  const rows = recordToRows({ ...record.data, equipment: keepOwnLibraryLinks(ctx, record.data.equipment) } as never);
  return ctx.db.transaction((tx) => {
    const row = tx
      .insert(projects)
      .values({ ...(rows.project as object), orgId: ctx.orgId, jurisdictionId: jurisdiction.id, createdBy: ctx.user.id } as typeof projects.$inferInsert)
      .returning({ id: projects.id })
      .get();
    if (rows.equipment.length) tx.insert(projectEquipment).values(rows.equipment.map((r) => ({ ...r, projectId: row.id }))).run();
    if (rows.arrays.length) tx.insert(pvArrays).values(rows.arrays.map((r) => ({ ...r, projectId: row.id }))).run();
    if (rows.circuits.length) tx.insert(circuits).values(rows.circuits.map((r) => ({ ...r, projectId: row.id }))).run();
    if (rows.loads.length) tx.insert(loads).values(rows.loads.map((r) => ({ ...r, projectId: row.id }))).run();
    audit(tx, ctx, "project.created", "project", row.id, { name: fields.name, templateId: template.id, template: template.name });
    return row;
  });
}
