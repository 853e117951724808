import fs from "node:fs";
import { eq } from "drizzle-orm";
import * as accountPasswordActions from "../../../app/(app)/account/password/actions";
import * as shellActions from "../../../app/(app)/shell/actions";
import * as resetActions from "../../../app/(auth)/forgot-password/actions";
import * as linkActions from "../../../app/(auth)/set-password/actions";
import * as adminUserActions from "../../../app/(app)/admin/users/actions";
import * as installActions from "../../../app/(app)/install/[revisionId]/actions";
import * as templateActions from "../../../app/(app)/jurisdictions/[id]/actions";
import * as reviewActions from "../../../app/(app)/reviews/actions";
import * as submissionActions from "../../../app/(app)/submissions/actions";
import * as attachmentRoute from "../../../app/api/attachments/[id]/route";
import * as checksRoute from "../../../app/api/checks/route";
import * as healthRoute from "../../../app/api/health/route";
import * as labelsRoute from "../../../app/api/install/[revisionId]/labels/route";
import * as libraryRestoreRoute from "../../../app/api/library/[id]/restore/route";
import * as libraryRetireRoute from "../../../app/api/library/[id]/retire/route";
import * as libraryItemRoute from "../../../app/api/library/[id]/route";
import * as libraryExampleRoute from "../../../app/api/library/example-csv/route";
import * as libraryImportRoute from "../../../app/api/library/import/route";
import * as libraryRoute from "../../../app/api/library/route";
import * as projectChecksRoute from "../../../app/api/projects/[id]/checks/route";
import * as projectExportRoute from "../../../app/api/projects/[id]/export/route";
import * as preflightRoute from "../../../app/api/projects/[id]/revisions/preflight/route";
import * as projectRevisionsRoute from "../../../app/api/projects/[id]/revisions/route";
import * as projectArchiveRoute from "../../../app/api/projects/[id]/archive/route";
import * as projectRoute from "../../../app/api/projects/[id]/route";
import * as projectImportRoute from "../../../app/api/projects/import/route";
import * as projectsRoute from "../../../app/api/projects/route";
import * as reviewPdfRoute from "../../../app/api/reviews/[revisionId]/pdf/route";
import * as stampRoute from "../../../app/api/reviews/licence/stamp/route";
import * as reviewsRoute from "../../../app/api/reviews/route";
import * as revisionDocxRoute from "../../../app/api/revisions/[id]/docx/route";
import * as revisionPdfRoute from "../../../app/api/revisions/[id]/pdf/route";
import * as revisionRoute from "../../../app/api/revisions/[id]/route";
import * as sendRoute from "../../../app/api/revisions/[id]/send/route";
import * as submissionRoute from "../../../app/api/submissions/[id]/route";
import * as submissionsRoute from "../../../app/api/submissions/route";
import * as templateRoute from "../../../app/api/templates/[id]/route";
import * as correctionRoute from "../../../app/api/corrections/[itemId]/route";
import * as reviewNoteRoute from "../../../app/api/review-notes/[noteId]/route";
import * as responseSheetRoute from "../../../app/api/submissions/[id]/response-sheet/route";
import * as templatesRoute from "../../../app/api/templates/route";
import * as uploadsRoute from "../../../app/api/uploads/route";
import * as verifyRoute from "../../../app/api/verify/route";
import { correctionItems, equipmentLibrary, jurisdictions, projectTemplates, reviewNotes, reviews, submissionEvents, submissions, users } from "../../../db/schema";
import type { Role } from "../../../lib/auth/roles";
import { getProjectRecord } from "../../../lib/services/projects/get-record";
import { createSubmission } from "../../../lib/services/submissions";
import { saveTemplateFromProject } from "../../../lib/services/templates/save";
import { makePng } from "../../unit/uploads/fixtures";
import { action, form, http, type Outcome } from "./requests";
import { noDelivery, type World } from "./world";

/**
 * Who may do what, written from the product's description of each role (not
 * read from the permissions module): designers draw and send, reviewers
 * review and stamp, the permit office submits and records, installers work
 * from approved sets, administrators manage people and read what the office reads.
 */
const EVERYONE: readonly Role[] = ["designer", "reviewer", "office", "installer", "admin"];
/** People who read projects and their checks; installers see approved sets only. */
const PROJECT_READERS: readonly Role[] = ["designer", "reviewer", "office", "admin"];
const DESIGNER: readonly Role[] = ["designer"];
const REVIEWER: readonly Role[] = ["reviewer"];
const OFFICE: readonly Role[] = ["office"];
const INSTALLER: readonly Role[] = ["installer"];
const ADMIN: readonly Role[] = ["admin"];
/** Submissions are the office's; designers follow their projects' permits, administrators oversee. */
const SUBMISSION_READERS: readonly Role[] = ["designer", "office", "admin"];
/** The site's view of an approved set: installers, and the office and administrators who send them. */
const INSTALL_READERS: readonly Role[] = ["installer", "office", "admin"];

export interface Entry {
  /** "GET /api/projects/[id]" for a route handler, the export's name for a server action. */
  name: string;
  allowed: readonly Role[] | "public";
  /** Names one of the own firm's rows, so another firm's users are refused whatever their role. */
  scoped: boolean;
  /** What a role outside `allowed` is answered; 403 unless the answer must not show that the row exists. */
  refusedWith?: number;
  /** Fresh rows for an entry that changes what it addresses; run once, before the entry's cells. */
  setup?: (w: World) => Promise<Record<string, string>> | Record<string, string>;
  call: (w: World, ids: Record<string, string>) => Promise<Outcome>;
}

let unique = 0;
const png = () => new File([makePng(4 + (++unique % 50), 3) as Uint8Array<ArrayBuffer>], "stamp.png", { type: "image/png" });
const userVersion = (w: World, id: string) => String(w.db.select({ v: users.version }).from(users).where(eq(users.id, id)).get()!.v);
const libraryVersion = (w: World, id: string) => w.db.select({ v: equipmentLibrary.version }).from(equipmentLibrary).where(eq(equipmentLibrary.id, id)).get()!.v;
const jurisdictionVersion = (w: World) => w.db.select({ v: jurisdictions.version }).from(jurisdictions).where(eq(jurisdictions.id, w.jurisdictionId)).get()!.v;
const libraryCsv = () => fs.readFileSync("examples/equipment-library.csv", "utf8").split("\n").slice(0, 2).join("\n").replace("BF-410M", `BF-${++unique}`);
const templateVersion = (w: World, id: string) => w.db.select({ v: projectTemplates.version }).from(projectTemplates).where(eq(projectTemplates.id, id)).get()!.v;
const freshTemplate = (w: World) => ({ id: saveTemplateFromProject(w.ctx.designer, w.projectId, { name: `Cabin kit ${++unique}` }).id });
const equipmentTag = (w: World) => w.record.equipment.find((e) => e.kind === "inverter")?.tag ?? w.record.equipment[0]!.tag;

/** One comment of the AHJ's letter on a fresh submission, as the office records it. */
export async function freshCorrection(w: World): Promise<Record<string, string>> {
  const { submissionId, eventId } = await freshSubmission(w);
  const row = w.db.select({ projectId: submissions.projectId }).from(submissions).where(eq(submissions.id, submissionId!)).get()!;
  const item = w.db
    .insert(correctionItems)
    .values({ orgId: w.ownOrgId, projectId: row.projectId, submissionId: submissionId!, eventId: eventId!, number: 1, comment: "Show the grounding electrode conductor size." })
    .returning()
    .get();
  return { itemId: item.id };
}

/** A reviewer's note on a returned revision, which the designer and the reviewer answer. */
export async function freshReviewNote(w: World): Promise<Record<string, string>> {
  const revisionId = await w.fresh.inReviewRevision();
  const review = w.db.insert(reviews).values({ orgId: w.ownOrgId, revisionId, reviewerId: w.ctx.reviewer.user.id, decision: "returned", generalNotes: "See the note." }).returning().get();
  const note = w.db.insert(reviewNotes).values({ reviewId: review.id, targetKind: "general", text: "Label the battery disconnect." }).returning().get();
  return { noteId: note.id };
}

async function freshSubmission(w: World): Promise<Record<string, string>> {
  const revisionId = await w.fresh.approvedRevision();
  const { submissionId } = await createSubmission(w.ctx.office, { revisionId, method: "portal", occurredOn: "2026-11-25" }, { deliver: noDelivery });
  const event = w.db.select().from(submissionEvents).where(eq(submissionEvents.submissionId, submissionId)).get()!;
  return { submissionId, eventId: event.id };
}

export const ENTRIES: Entry[] = [
  // Projects
  { name: "GET /api/projects", allowed: PROJECT_READERS, scoped: false, call: () => http(projectsRoute.GET, "GET", "/api/projects") },
  {
    name: "POST /api/projects",
    allowed: DESIGNER,
    scoped: true,
    call: (w) => http(projectsRoute.POST, "POST", "/api/projects", { json: { name: `Fernhollow ${++unique}`, client: "P. Adeyemi", systemKind: "stand-alone", jurisdictionId: w.jurisdictionId, address: "4 Weir Lane" } }),
  },
  { name: "GET /api/projects/[id]", allowed: PROJECT_READERS, scoped: true, call: (w) => http(projectRoute.GET, "GET", `/api/projects/${w.projectId}`, { params: { id: w.projectId } }) },
  {
    name: "POST /api/projects/[id]/archive",
    allowed: DESIGNER,
    scoped: true,
    setup: (w) => ({ id: w.fresh.project() }),
    call: (_w, { id }) => http(projectArchiveRoute.POST, "POST", `/api/projects/${id}/archive`, { params: { id: id! } }),
  },
  {
    name: "DELETE /api/projects/[id]/archive",
    allowed: DESIGNER,
    scoped: true,
    setup: (w) => ({ id: w.fresh.project() }),
    call: (_w, { id }) => http(projectArchiveRoute.DELETE, "DELETE", `/api/projects/${id}/archive`, { params: { id: id! } }),
  },
  {
    name: "PUT /api/projects/[id]",
    allowed: DESIGNER,
    scoped: true,
    setup: (w) => ({ id: w.fresh.project() }),
    call: (w, { id }) => {
      const stored = getProjectRecord(w.ctx.designer, id!);
      return http(projectRoute.PUT, "PUT", `/api/projects/${id}`, { params: { id: id! }, json: { version: stored.version, record: { ...stored.record, notes: `Edited ${++unique}` } } });
    },
  },
  {
    name: "POST /api/projects/import",
    allowed: DESIGNER,
    scoped: true,
    call: (w) => http(projectImportRoute.POST, "POST", "/api/projects/import", { json: { file: { ...w.record, name: `Imported ${++unique}` }, jurisdictionId: w.jurisdictionId } }),
  },
  { name: "GET /api/projects/[id]/checks", allowed: PROJECT_READERS, scoped: true, call: (w) => http(projectChecksRoute.GET, "GET", `/api/projects/${w.projectId}/checks`, { params: { id: w.projectId } }) },
  { name: "GET /api/projects/[id]/export", allowed: PROJECT_READERS, scoped: true, call: (w) => http(projectExportRoute.GET, "GET", `/api/projects/${w.projectId}/export`, { params: { id: w.projectId } }) },
  {
    name: "GET /api/projects/[id]/revisions/preflight",
    allowed: PROJECT_READERS,
    scoped: true,
    call: (w) => http(preflightRoute.GET, "GET", `/api/projects/${w.projectId}/revisions/preflight`, { params: { id: w.projectId } }),
  },
  { name: "GET /api/projects/[id]/revisions", allowed: EVERYONE, scoped: true, call: (w) => http(projectRevisionsRoute.GET, "GET", `/api/projects/${w.projectId}/revisions`, { params: { id: w.projectId } }) },
  {
    name: "POST /api/projects/[id]/revisions",
    allowed: DESIGNER,
    scoped: true,
    setup: (w) => ({ id: w.fresh.project() }),
    call: (_w, { id }) => http(projectRevisionsRoute.POST, "POST", `/api/projects/${id}/revisions`, { params: { id: id! } }),
  },

  // Project templates: a firm's standard kits, kept by its designers
  { name: "GET /api/templates", allowed: PROJECT_READERS, scoped: false, call: () => http(templatesRoute.GET, "GET", "/api/templates") },
  {
    name: "POST /api/templates",
    allowed: DESIGNER,
    scoped: true,
    call: (w) => http(templatesRoute.POST, "POST", "/api/templates", { json: { projectId: w.projectId, name: `Hut kit ${++unique}` } }),
  },
  {
    name: "PATCH /api/templates/[id]",
    allowed: DESIGNER,
    scoped: true,
    setup: freshTemplate,
    call: (w, { id }) => http(templateRoute.PATCH, "PATCH", `/api/templates/${id}`, { params: { id: id! }, json: { version: templateVersion(w, id!), name: `Renamed kit ${++unique}` } }),
  },
  {
    name: "DELETE /api/templates/[id]",
    allowed: DESIGNER,
    scoped: true,
    setup: freshTemplate,
    call: (_w, { id }) => http(templateRoute.DELETE, "DELETE", `/api/templates/${id}`, { params: { id: id! } }),
  },

  // Archive, corrections, review-note conversations
  {
    name: "GET /api/submissions/[id]/response-sheet",
    allowed: PROJECT_READERS,
    scoped: true,
    setup: async (w) => {
      const { itemId } = await freshCorrection(w);
      return { id: w.db.select().from(correctionItems).where(eq(correctionItems.id, itemId!)).get()!.submissionId };
    },
    call: (_w, { id }) => http(responseSheetRoute.GET, "GET", `/api/submissions/${id}/response-sheet`, { params: { id: id! } }),
  },
  {
    name: "POST /api/corrections/[itemId]",
    // Whoever carries a comment forward may hand it to someone: the designer, the reviewer and the office.
    allowed: ["designer", "reviewer", "office"],
    scoped: true,
    setup: freshCorrection,
    call: (w, { itemId }) => {
      const version = w.db.select({ v: correctionItems.version }).from(correctionItems).where(eq(correctionItems.id, itemId!)).get()!.v;
      return http(correctionRoute.POST, "POST", `/api/corrections/${itemId}`, { params: { itemId: itemId! }, json: { action: "assign", assigneeId: w.ctx.designer.user.id, version } });
    },
  },
  {
    name: "POST /api/review-notes/[noteId]",
    // A review note is a conversation between the designer and the reviewer.
    allowed: ["designer", "reviewer"],
    scoped: true,
    setup: freshReviewNote,
    call: (_w, { noteId }) => http(reviewNoteRoute.POST, "POST", `/api/review-notes/${noteId}`, { params: { noteId: noteId! }, json: { action: "reply", body: "Added on E-004." } }),
  },

  // Files
  { name: "GET /api/attachments/[id]", allowed: EVERYONE, scoped: true, call: (w) => http(attachmentRoute.GET, "GET", `/api/attachments/${w.datasheetId}`, { params: { id: w.datasheetId } }) },
  {
    name: "PATCH /api/attachments/[id]",
    allowed: DESIGNER,
    scoped: true,
    setup: async (w) => ({ id: await w.fresh.datasheet() }),
    call: (w, { id }) => http(attachmentRoute.PATCH, "PATCH", `/api/attachments/${id}`, { params: { id: id! }, json: { equipmentTag: equipmentTag(w) } }),
  },
  {
    name: "DELETE /api/attachments/[id]",
    allowed: DESIGNER,
    scoped: true,
    setup: async (w) => ({ id: await w.fresh.datasheet() }),
    call: (_w, { id }) => http(attachmentRoute.DELETE, "DELETE", `/api/attachments/${id}`, { params: { id: id! } }),
  },
  {
    name: "POST /api/uploads",
    allowed: ["designer", "reviewer", "installer"],
    scoped: true,
    call: (w) => http(uploadsRoute.POST, "POST", "/api/uploads", { form: form({ projectId: w.projectId, kind: "photo" }, { file: png() }) }),
  },
  { name: "POST /api/checks", allowed: PROJECT_READERS, scoped: false, call: (w) => http(checksRoute.POST, "POST", "/api/checks", { json: w.record }) },
  {
    name: "GET /api/install/[revisionId]/labels",
    allowed: INSTALL_READERS,
    scoped: true,
    call: (w) => http(labelsRoute.GET, "GET", `/api/install/${w.approvedRevisionId}/labels`, { params: { revisionId: w.approvedRevisionId } }),
  },

  // Equipment library
  { name: "GET /api/library", allowed: PROJECT_READERS, scoped: false, call: () => http(libraryRoute.GET, "GET", "/api/library") },
  {
    name: "POST /api/library",
    allowed: DESIGNER,
    scoped: false,
    call: () => http(libraryRoute.POST, "POST", "/api/library", { json: { kind: "inverter", manufacturer: "Ferrule Works", model: `FW-${++unique}` } }),
  },
  { name: "GET /api/library/[id]", allowed: PROJECT_READERS, scoped: true, call: (w) => http(libraryItemRoute.GET, "GET", `/api/library/${w.libraryItemId}`, { params: { id: w.libraryItemId } }) },
  {
    name: "PATCH /api/library/[id]",
    allowed: DESIGNER,
    scoped: true,
    setup: (w) => ({ id: w.fresh.libraryItem() }),
    call: (w, { id }) =>
      http(libraryItemRoute.PATCH, "PATCH", `/api/library/${id}`, { params: { id: id! }, json: { version: libraryVersion(w, id!), item: { kind: "inverter", manufacturer: "Ferrule Works", model: `FW-${++unique}` } } }),
  },
  {
    name: "POST /api/library/[id]/retire",
    allowed: DESIGNER,
    scoped: true,
    setup: (w) => ({ id: w.fresh.libraryItem() }),
    call: (w, { id }) => http(libraryRetireRoute.POST, "POST", `/api/library/${id}/retire`, { params: { id: id! }, json: { version: libraryVersion(w, id!) } }),
  },
  {
    name: "POST /api/library/[id]/restore",
    allowed: DESIGNER,
    scoped: true,
    setup: (w) => ({ id: w.fresh.libraryItem(true) }),
    call: (w, { id }) => http(libraryRestoreRoute.POST, "POST", `/api/library/${id}/restore`, { params: { id: id! }, json: { version: libraryVersion(w, id!) } }),
  },
  { name: "GET /api/library/example-csv", allowed: PROJECT_READERS, scoped: false, call: () => http(libraryExampleRoute.GET, "GET", "/api/library/example-csv") },
  { name: "POST /api/library/import", allowed: DESIGNER, scoped: false, call: () => http(libraryImportRoute.POST, "POST", "/api/library/import", { text: { body: libraryCsv(), type: "text/csv" } }) },

  // Reviews and packets
  { name: "GET /api/reviews", allowed: PROJECT_READERS, scoped: true, call: (w) => http(reviewsRoute.GET, "GET", `/api/reviews?revisionId=${w.approvedRevisionId}`) },
  {
    name: "GET /api/reviews/[revisionId]/pdf",
    allowed: EVERYONE,
    scoped: true,
    call: (w) => http(reviewPdfRoute.GET, "GET", `/api/reviews/${w.approvedRevisionId}/pdf`, { params: { revisionId: w.approvedRevisionId } }),
  },
  { name: "POST /api/reviews/licence/stamp", allowed: REVIEWER, scoped: false, call: () => http(stampRoute.POST, "POST", "/api/reviews/licence/stamp", { form: form({}, { file: png() }) }) },
  { name: "GET /api/revisions/[id]", allowed: EVERYONE, scoped: true, call: (w) => http(revisionRoute.GET, "GET", `/api/revisions/${w.approvedRevisionId}`, { params: { id: w.approvedRevisionId } }) },
  { name: "GET /api/revisions/[id]/pdf", allowed: EVERYONE, scoped: true, call: (w) => http(revisionPdfRoute.GET, "GET", `/api/revisions/${w.approvedRevisionId}/pdf`, { params: { id: w.approvedRevisionId } }) },
  { name: "GET /api/revisions/[id]/docx", allowed: EVERYONE, scoped: true, call: (w) => http(revisionDocxRoute.GET, "GET", `/api/revisions/${w.approvedRevisionId}/docx`, { params: { id: w.approvedRevisionId } }) },
  {
    name: "POST /api/revisions/[id]/send",
    allowed: DESIGNER,
    scoped: true,
    setup: async (w) => ({ id: await w.fresh.draftRevision() }),
    call: (_w, { id }) => http(sendRoute.POST, "POST", `/api/revisions/${id}/send`, { params: { id: id! }, json: { message: "Ready for your review." } }),
  },

  // Submissions
  { name: "GET /api/submissions", allowed: SUBMISSION_READERS, scoped: false, call: () => http(submissionsRoute.GET, "GET", "/api/submissions") },
  { name: "GET /api/submissions/[id]", allowed: SUBMISSION_READERS, scoped: true, call: (w) => http(submissionRoute.GET, "GET", `/api/submissions/${w.submissionId}`, { params: { id: w.submissionId } }) },

  // Public: an AHJ checks a stamped packet without an account.
  { name: "GET /api/health", allowed: "public", scoped: false, call: () => http(healthRoute.GET, "GET", "/api/health") },
  {
    name: "GET /api/verify",
    allowed: "public",
    scoped: false,
    call: () => http(verifyRoute.GET, "GET", `/api/verify?sha256=${"ab".repeat(32)}`, { headers: { "x-forwarded-for": `198.51.100.${++unique % 250}` } }),
  },
  {
    name: "POST /api/verify",
    allowed: "public",
    scoped: false,
    call: () => http(verifyRoute.POST, "POST", "/api/verify", { json: { sha256: "cd".repeat(32) }, headers: { "x-forwarded-for": `203.0.113.${++unique % 250}` } }),
  },

  // Server actions: administrators
  {
    name: "addUserAction",
    allowed: ADMIN,
    scoped: false,
    call: () => action(adminUserActions.addUserAction(null, form({ name: "Rowan Teague", email: `rowan-${++unique}@larch.test`, password: "a sound long password 26", "role-designer": "on" }))),
  },
  {
    name: "setRolesAction",
    allowed: ADMIN,
    scoped: true,
    call: (w) => action(adminUserActions.setRolesAction(null, form({ userId: w.spareUserId, version: userVersion(w, w.spareUserId), "role-designer": "on" }))),
  },
  {
    name: "inviteUserAction",
    allowed: ADMIN,
    scoped: false,
    call: () => action(adminUserActions.inviteUserAction(null, form({ name: "Wren Aldous", email: `wren-${++unique}@larch.test`, "role-office": "on" }))),
  },
  {
    name: "setPasswordAction",
    allowed: ADMIN,
    scoped: true,
    call: (w) => action(adminUserActions.setPasswordAction(null, form({ userId: w.spareUserId, version: userVersion(w, w.spareUserId), password: "an admin's pick 2026" }))),
  },
  {
    name: "setActiveAction",
    allowed: ADMIN,
    scoped: true,
    call: (w) => action(adminUserActions.setActiveAction(null, form({ userId: w.spareUserId, version: userVersion(w, w.spareUserId), active: "true" }))),
  },

  // Server actions: the permit office
  {
    name: "createSubmissionAction",
    allowed: OFFICE,
    scoped: true,
    setup: async (w) => ({ revisionId: await w.fresh.approvedRevision() }),
    call: (_w, { revisionId }) => action(submissionActions.createSubmissionAction(null, form({ revisionId: revisionId!, method: "email", occurredOn: "2026-11-26" }))),
  },
  {
    name: "recordEventAction",
    allowed: OFFICE,
    scoped: true,
    setup: freshSubmission,
    call: (_w, { submissionId }) => action(submissionActions.recordEventAction(null, form({ submissionId: submissionId!, kind: "in-plan-review", occurredOn: "2026-11-27" }))),
  },
  {
    name: "voidEventAction",
    allowed: OFFICE,
    scoped: true,
    setup: freshSubmission,
    call: (_w, { submissionId, eventId }) => action(submissionActions.voidEventAction(null, form({ submissionId: submissionId!, eventId: eventId!, reason: "Entered twice." }))),
  },
  {
    name: "sendDigestAction",
    // The office's own digest of overdue permits, sent to its own people.
    allowed: OFFICE,
    scoped: false,
    call: () => action(submissionActions.sendDigestAction()),
  },
  {
    name: "saveSheetTemplateAction",
    allowed: OFFICE,
    scoped: true,
    call: (w) => action(templateActions.saveSheetTemplateAction({ jurisdictionId: w.jurisdictionId, name: "general-notes", source: "{{project.name}}\n", version: jurisdictionVersion(w) })),
  },
  {
    name: "previewSheetTemplateAction",
    allowed: OFFICE,
    scoped: true,
    call: (w) => action(templateActions.previewSheetTemplateAction({ jurisdictionId: w.jurisdictionId, name: "general-notes", source: "{{#each" })),
  },

  {
    name: "saveJurisdictionAction",
    allowed: OFFICE,
    scoped: true,
    call: (w) => action(templateActions.saveJurisdictionAction(w.jurisdictionId, { version: jurisdictionVersion(w), typicalReviewDays: 12 })),
  },
  {
    name: "previewJurisdictionAction",
    allowed: OFFICE,
    scoped: true,
    call: (w) => action(templateActions.previewJurisdictionAction(w.jurisdictionId, { version: jurisdictionVersion(w), necEdition: "2020" })),
  },
  {
    name: "addJurisdictionNoteAction",
    allowed: OFFICE,
    scoped: true,
    call: (w) => action(templateActions.addJurisdictionNoteAction({ jurisdictionId: w.jurisdictionId, text: "The counter wants two printed sets." })),
  },

  // Server actions: reviewers
  {
    name: "decideReviewAction",
    allowed: REVIEWER,
    scoped: true,
    setup: async (w) => ({ revisionId: await w.fresh.inReviewRevision() }),
    call: (_w, { revisionId }) => action(reviewActions.decideReviewAction({ revisionId: revisionId!, decision: "returned", generalNotes: "Show the grounding electrode.", notes: [] } as never)),
  },
  {
    name: "renderStampedPacketAgainAction",
    allowed: ["reviewer", "designer"],
    scoped: true,
    setup: async (w) => ({ revisionId: await w.fresh.approvedRevision() }),
    call: (_w, { revisionId }) => action(reviewActions.renderStampedPacketAgainAction(revisionId!)),
  },
  {
    name: "saveLicenceAction",
    allowed: REVIEWER,
    scoped: false,
    call: () => action(reviewActions.saveLicenceAction(null, form({ licenceNumber: `PE-E-${400000 + ++unique}`, region: "Westmark", discipline: "Electrical", expiresOn: "2029-06-30" }))),
  },
  {
    name: "signPacketAction",
    allowed: REVIEWER,
    scoped: true,
    setup: async (w) => ({ revisionId: await w.fresh.approvedRevision() }),
    call: (_w, { revisionId }) => action(reviewActions.signPacketAction(revisionId!, "not the password")),
  },
  {
    name: "uploadCertificateAction",
    allowed: REVIEWER,
    scoped: false,
    call: () =>
      action(reviewActions.uploadCertificateAction(null, form({ certificatePassword: "secret" }, { certificate: new File([new Uint8Array([0x30, 0x82, 0x01])], "me.p12", { type: "application/x-pkcs12" }) }))),
  },

  // Server actions open to anyone: asking for a reset link (the same answer whether or not the e-mail has an
  // account), choosing a password from a link (a made-up token is refused by the link's check, not the caller's role),
  // and signing out.
  {
    name: "requestResetAction",
    allowed: "public",
    scoped: false,
    call: () => action(resetActions.requestResetAction(null, form({ email: `nobody-${++unique}@larch.test` }))),
  },
  {
    name: "redeemLinkAction",
    allowed: "public",
    scoped: false,
    call: () => action(linkActions.redeemLinkAction(null, form({ token: "A".repeat(43), newPassword: "a made-up link's pick", confirmPassword: "a made-up link's pick" }))),
  },
  { name: "signOutAction", allowed: "public", scoped: false, call: () => action(shellActions.signOutAction()) },

  // Server actions: everyone signed in, and installers
  {
    name: "changePasswordAction",
    allowed: EVERYONE,
    scoped: false,
    call: () => action(accountPasswordActions.changePasswordAction(null, form({ currentPassword: "not my password", newPassword: "an entirely new passphrase" }))),
  },
  {
    name: "toggleConfirmationAction",
    allowed: INSTALLER,
    scoped: true,
    call: (w) =>
      action(installActions.toggleConfirmationAction(null, form({ revisionId: w.approvedRevisionId, itemKind: "equipment", itemId: equipmentTag(w), confirmed: "true" }))),
  },
  {
    name: "attachPhotoAction",
    allowed: INSTALLER,
    scoped: true,
    setup: (w) => ({ photoId: w.fresh.photo() }),
    call: (w, { photoId }) => action(installActions.attachPhotoAction({ revisionId: w.approvedRevisionId, itemKind: "equipment", itemId: equipmentTag(w), photoAttachmentId: photoId! })),
  },
];

/**
 * Handlers left out of the table, each with the reason. Sign-in is next-auth's
 * own handler and action: everyone may try it, and tests/integration/sign-in
 * and accounts prove what it answers.
 */
export const OUTSIDE_THE_TABLE: Record<string, string> = {
  "GET /api/auth/[...nextauth]": "next-auth's sign-in handler; public by design (accounts.test.ts, sign-in.test.ts)",
  "POST /api/auth/[...nextauth]": "next-auth's sign-in handler; public by design (accounts.test.ts, sign-in.test.ts)",
  signInAction: "the sign-in form itself; public by design (sign-in.test.ts, sign-in.spec.ts)",
};
