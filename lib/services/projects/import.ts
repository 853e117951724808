import { and, eq } from "drizzle-orm";
import { jurisdictions, loads, circuits, projectEquipment, projects, pvArrays } from "../../../db/schema";
import { parseProjectFile } from "../../compliance";
import { audit, requirePermission, type ServiceContext } from "../context";
import { invalid, notFound } from "../errors";
import { keepOwnLibraryLinks } from "./library-links";
import { recordToRows } from "./mapping";

export interface ImportResult {
  id: string;
  jurisdictionId: string;
  /** Attachment references in the file: their files are not in it, so they are listed, not imported. */
  attachmentsNotImported: number;
}

/**
 * Creates a new project from a project file. The file is validated field by
 * field first and the project is written in one transaction, so a refused
 * file leaves nothing behind. The jurisdiction is the organisation's one of
 * the same name unless the caller names one; with neither, the import is
 * refused with a "jurisdiction" issue so the user can choose.
 */
export function importProject(ctx: ServiceContext, file: unknown, jurisdictionId?: string): ImportResult {
  requirePermission(ctx, "project:create", "create projects");
  const parsed = parseProjectFile(file);
  if (!parsed.ok) throw invalid("The project file was not imported: some fields are not valid.", parsed.issues);
  const record = parsed.record;

  let jurisdiction: { id: string } | undefined;
  if (jurisdictionId) {
    jurisdiction = ctx.db
      .select({ id: jurisdictions.id })
      .from(jurisdictions)
      .where(and(eq(jurisdictions.id, jurisdictionId), eq(jurisdictions.orgId, ctx.orgId)))
      .get();
    if (!jurisdiction) throw notFound("Jurisdiction");
  } else {
    const wanted = record.jurisdiction.name.trim().toLowerCase();
    jurisdiction = ctx.db
      .select({ id: jurisdictions.id, name: jurisdictions.name })
      .from(jurisdictions)
      .where(eq(jurisdictions.orgId, ctx.orgId))
      .all()
      .find((j) => j.name.trim().toLowerCase() === wanted);
    if (!jurisdiction) {
      throw invalid(`No jurisdiction of your organisation is named "${record.jurisdiction.name}". Choose one for the imported project.`, [
        { path: "jurisdiction", message: `no jurisdiction named "${record.jurisdiction.name}"; choose one` },
      ]);
    }
  }

  const rows = recordToRows({ ...record, equipment: keepOwnLibraryLinks(ctx, record.equipment) } as never);

  const jurisdictionIdChosen = jurisdiction.id;
  const id = ctx.db.transaction((tx) => {
    const row = tx
      .insert(projects)
      .values({ ...(rows.project as object), orgId: ctx.orgId, jurisdictionId: jurisdictionIdChosen, createdBy: ctx.user.id } as typeof projects.$inferInsert)
      .returning({ id: projects.id })
      .get();
    if (rows.equipment.length) tx.insert(projectEquipment).values(rows.equipment.map((r) => ({ ...r, projectId: row.id }))).run();
    if (rows.arrays.length) tx.insert(pvArrays).values(rows.arrays.map((r) => ({ ...r, projectId: row.id }))).run();
    if (rows.circuits.length) tx.insert(circuits).values(rows.circuits.map((r) => ({ ...r, projectId: row.id }))).run();
    if (rows.loads.length) tx.insert(loads).values(rows.loads.map((r) => ({ ...r, projectId: row.id }))).run();
    audit(tx, ctx, "project.imported", "project", row.id, {
      name: record.name,
      equipment: rows.equipment.length,
      circuits: rows.circuits.length,
      attachmentsNotImported: record.attachments.length,
    });
    return row.id;
  });
  return { id, jurisdictionId: jurisdictionIdChosen, attachmentsNotImported: record.attachments.length };
}
