import "server-only";
import { and, desc, eq } from "drizzle-orm";
import { jurisdictionNotes, projects, users } from "../../../db/schema";
import { formatIssues } from "../../schemas/fields";
import { jurisdictionNoteSchema } from "../../schemas/jurisdiction";
import { audit, requirePermission, type ServiceContext } from "../context";
import { invalid } from "../errors";
import { findItemInOrg } from "../corrections/shared";
import { findJurisdictionInOrg } from "./get";

export interface JurisdictionNoteView {
  id: string;
  text: string;
  who: string | null;
  at: string;
  projectId: string | null;
  projectName: string | null;
  correctionNumber: number | null;
}

/** The jurisdiction's notes log, newest first. */
export function listJurisdictionNotes(ctx: ServiceContext, jurisdictionId: string): JurisdictionNoteView[] {
  requirePermission(ctx, "jurisdiction:read", "read jurisdictions");
  const j = findJurisdictionInOrg(ctx, jurisdictionId);
  return ctx.db
    .select({ note: jurisdictionNotes, who: users.name, projectName: projects.name })
    .from(jurisdictionNotes)
    .leftJoin(users, eq(users.id, jurisdictionNotes.userId))
    .leftJoin(projects, eq(projects.id, jurisdictionNotes.projectId))
    .where(and(eq(jurisdictionNotes.orgId, ctx.orgId), eq(jurisdictionNotes.jurisdictionId, j.id)))
    .orderBy(desc(jurisdictionNotes.createdAt))
    .all()
    .map(({ note, who, projectName }) => ({
      id: note.id,
      text: note.text,
      who,
      at: note.createdAt,
      projectId: note.projectId,
      projectName,
      correctionNumber: null,
    }));
}

/**
 * Writes one of the AHJ's unwritten rules into its log. Promoted from a
 * correction, the note records the project it came from, so the next designer
 * there reads where the rule was learnt.
 */
export function addJurisdictionNote(ctx: ServiceContext, input: unknown): { id: string; message: string } {
  requirePermission(ctx, "jurisdiction:edit", "write jurisdiction notes");
  const parsed = jurisdictionNoteSchema.safeParse(input);
  if (!parsed.success) throw invalid("The note was not saved: some fields are not valid.", formatIssues(parsed.error));
  const j = findJurisdictionInOrg(ctx, parsed.data.jurisdictionId);
  let projectId: string | null = null;
  let correctionId: string | null = null;
  if (parsed.data.correctionId) {
    const item = findItemInOrg(ctx, parsed.data.correctionId);
    const project = ctx.db.select({ jurisdictionId: projects.jurisdictionId }).from(projects).where(eq(projects.id, item.projectId)).get();
    if (project?.jurisdictionId !== j.id) {
      throw invalid("That correction came from a project in another jurisdiction.", [{ path: "correctionId", message: "is not from a project in this jurisdiction" }]);
    }
    projectId = item.projectId;
    correctionId = item.id;
  }
  const id = ctx.db.transaction((tx) => {
    const row = tx
      .insert(jurisdictionNotes)
      .values({ orgId: ctx.orgId, jurisdictionId: j.id, text: parsed.data.text, userId: ctx.user.id, projectId, correctionId })
      .returning({ id: jurisdictionNotes.id })
      .get();
    audit(tx, ctx, "jurisdiction.note", "jurisdiction", j.id, { noteId: row.id, text: parsed.data.text, projectId, correctionId });
    return row.id;
  });
  return { id, message: `Note added to ${j.name}'s log.` };
}

/** A correction promoted to its project's jurisdiction: the comment (or the office's wording of it) goes into the log. */
export function promoteCorrection(ctx: ServiceContext, input: { itemId?: unknown; text?: unknown }): { id: string; message: string } {
  requirePermission(ctx, "jurisdiction:edit", "write jurisdiction notes");
  const item = findItemInOrg(ctx, typeof input.itemId === "string" ? input.itemId : "");
  const project = ctx.db.select({ jurisdictionId: projects.jurisdictionId }).from(projects).where(and(eq(projects.id, item.projectId), eq(projects.orgId, ctx.orgId))).get();
  if (!project?.jurisdictionId) throw invalid("This project has no jurisdiction record to learn from the correction.", [{ path: "itemId", message: "has no jurisdiction" }]);
  const text = typeof input.text === "string" && input.text.trim() ? input.text : item.comment;
  return addJurisdictionNote(ctx, { jurisdictionId: project.jurisdictionId, text, correctionId: item.id });
}
