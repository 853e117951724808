import { createHash } from "node:crypto";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { eq } from "drizzle-orm";
import type { Db } from "../../../db/client";
import { attachments, equipmentLibrary, packetRevisions, projects, reviews, submissionEvents, users } from "../../../db/schema";
import type { Role } from "../../../lib/auth/roles";
import { ROLES } from "../../../lib/auth/roles";
import { projectRecordSchema, type ProjectRecord } from "../../../lib/schemas/project-record";
import { uploadAttachment } from "../../../lib/services/attachments/upload";
import { contextForUser, type ServiceContext } from "../../../lib/services/context";
import { getProjectRecord } from "../../../lib/services/projects/get-record";
import { saveProjectRecord } from "../../../lib/services/projects/save-record";
import { saveOwnLicence, sendForReview } from "../../../lib/services/reviews";
import { createSubmission } from "../../../lib/services/submissions";
import { writePacketFile } from "../../../lib/services/revisions/packet-files";
import { makePdf, makePng } from "../../unit/uploads/fixtures";
import { makeJurisdiction, makeOrg, makeProject, makeUser } from "../factories";

/**
 * Two firms on one database: "own" holds the rows every request addresses,
 * "foreign" holds the same five roles and nothing the requests name. Every
 * actor is a real user row; requests resolve them through the session.
 */

export type Actor = { kind: "signed-out" } | { kind: "user"; org: "own" | "foreign"; role: Role; userId: string };

export const noDelivery = async () => undefined;
const HUT = projectRecordSchema.parse(JSON.parse(fs.readFileSync("examples/tamarack-hut.json", "utf8")));

export interface World {
  db: Db;
  packetsRoot: string;
  uploadsRoot: string;
  ownOrgId: string;
  actors: Actor[];
  ctx: Record<Role, ServiceContext>;
  record: ProjectRecord;
  jurisdictionId: string;
  jurisdictionVersion: number;
  projectId: string;
  projectVersion: number;
  datasheetId: string;
  libraryItemId: string;
  approvedRevisionId: string;
  submissionId: string;
  submissionEventId: string;
  spareUserId: string;
  /** Ids of the own firm's rows: none may appear in an answer to the foreign firm. */
  ownIds: () => string[];
  /** Fresh rows for a request that changes or consumes what it addresses. */
  fresh: {
    project(): string;
    draftRevision(): Promise<string>;
    inReviewRevision(): Promise<string>;
    approvedRevision(): Promise<string>;
    datasheet(): Promise<string>;
    photo(): string;
    libraryItem(retired?: boolean): string;
  };
}

let revisionNumber = 100;

export async function buildWorld(db: Db, packetsRoot: string, uploadsRoot: string): Promise<World> {
  const own = makeOrg(db, "Larch and Vane Electric");
  const foreign = makeOrg(db, "Osier Bay Power");
  const actors: Actor[] = [{ kind: "signed-out" }];
  const ctx = {} as Record<Role, ServiceContext>;
  for (const org of [own, foreign]) {
    for (const role of ROLES) {
      const user = makeUser(db, org.id, [role]);
      actors.push({ kind: "user", org: org === own ? "own" : "foreign", role, userId: user.id });
      if (org === own) ctx[role] = contextForUser(db, user.id);
    }
  }
  const spare = makeUser(db, own.id, ["designer"]);
  saveOwnLicence(ctx.reviewer, { licenceNumber: "PE-E-300411", region: "Westmark", discipline: "Electrical", expiresOn: "2029-06-30" });
  const jurisdiction = makeJurisdiction(db, own.id);

  const project = (): string => {
    const row = makeProject(db, own.id, jurisdiction.id);
    saveProjectRecord(ctx.designer, row.id, { ...HUT, name: row.name }, getProjectRecord(ctx.designer, row.id).version);
    return row.id;
  };
  const projectId = project();
  const equipmentTag = HUT.equipment.find((e) => e.kind === "inverter")?.tag ?? HUT.equipment[0]!.tag;

  const datasheetFor = async (id: string) => {
    const upload = await uploadAttachment(ctx.designer, {
      projectId: id,
      kind: "datasheet",
      equipmentTag,
      fileName: `datasheet-${Math.random().toString(36).slice(2, 8)}.pdf`,
      bytes: await makePdf(1, `Datasheet ${Math.random()}`),
    });
    return upload.attachment.id;
  };

  const revision = async (id: string, reviewState: "draft" | "approved", attachmentIds: string[] = []) => {
    const pdf = await writePacketFile(packetsRoot, await makePdf(2, `Packet ${Math.random()}`), "pdf");
    const docx = await writePacketFile(packetsRoot, new TextEncoder().encode(`PK docx stand-in ${Math.random()}`), "docx");
    const stored = getProjectRecord(ctx.designer, id);
    const recordSha256 = createHash("sha256").update(JSON.stringify(stored.record)).digest("hex");
    const row = db
      .insert(packetRevisions)
      .values({
        orgId: own.id,
        projectId: id,
        number: ++revisionNumber,
        state: "ready",
        reviewState,
        isDraft: false,
        recordSnapshot: stored.record as unknown as Record<string, unknown>,
        resultsSnapshot: {},
        recordSha256,
        attachmentIds,
        pdfPath: pdf.key,
        pdfSha256: pdf.sha256,
        docxPath: docx.key,
        docxSha256: docx.sha256,
        createdBy: ctx.designer.user.id,
        createdAt: "2026-11-20T09:00:00.000Z",
      })
      .returning()
      .get();
    // An approved set carries the reviewer's approval, as the review page records it.
    if (reviewState === "approved") db.insert(reviews).values({ orgId: own.id, revisionId: row.id, reviewerId: ctx.reviewer.user.id, decision: "approved", approvedSha256: recordSha256 }).run();
    return row.id;
  };

  const datasheetId = await datasheetFor(projectId);
  const approvedRevisionId = await revision(projectId, "approved", [datasheetId]);
  db.update(projects).set({ status: "approved" }).where(eq(projects.id, projectId)).run();
  const library = () =>
    db.insert(equipmentLibrary).values({ orgId: own.id, kind: "inverter", manufacturer: "Ferrule Works", model: `FW-${Math.random().toString(36).slice(2, 7)}` }).returning().get().id;
  const libraryItemId = library();

  const submitted = await createSubmission(ctx.office, { revisionId: approvedRevisionId, method: "counter", occurredOn: "2026-11-25" }, { deliver: noDelivery });
  const submissionId = submitted.submissionId;
  const event = db.select().from(submissionEvents).where(eq(submissionEvents.submissionId, submissionId)).get();
  if (!event) throw new Error("the submission has no first event");

  const world: World = {
    db,
    packetsRoot,
    uploadsRoot,
    ownOrgId: own.id,
    actors,
    ctx,
    record: HUT,
    jurisdictionId: jurisdiction.id,
    jurisdictionVersion: jurisdiction.version,
    projectId,
    projectVersion: getProjectRecord(ctx.designer, projectId).version,
    datasheetId,
    libraryItemId,
    approvedRevisionId,
    submissionId,
    submissionEventId: event.id,
    spareUserId: spare.id,
    ownIds: () => [projectId, datasheetId, libraryItemId, approvedRevisionId, submissionId, jurisdiction.id, spare.id],
    fresh: {
      project,
      draftRevision: async () => revision(project(), "draft"),
      inReviewRevision: async () => {
        const id = await revision(project(), "draft");
        await sendForReview(ctx.designer, id, { deliver: noDelivery, message: "Ready for review." });
        return id;
      },
      approvedRevision: async () => {
        const id = project();
        const revisionId = await revision(id, "approved");
        db.update(projects).set({ status: "approved" }).where(eq(projects.id, id)).run();
        return revisionId;
      },
      datasheet: async () => datasheetFor(projectId),
      photo: () =>
        db
          .insert(attachments)
          .values({ orgId: own.id, projectId, kind: "photo", fileName: "nameplate.png", mimeType: "image/png", sizeBytes: makePng().length, sha256: createHash("sha256").update(makePng()).digest("hex") })
          .returning()
          .get().id,
      libraryItem: (retired = false) => {
        const id = library();
        if (retired) db.update(equipmentLibrary).set({ retiredAt: "2026-11-01T00:00:00.000Z" }).where(eq(equipmentLibrary.id, id)).run();
        return id;
      },
    },
  };
  return world;
}

/** The session the app would read for this actor: the user's id and current session version. */
export function sessionOf(db: Db, actor: Actor): { user: { id: string; sessionVersion: number } } | null {
  if (actor.kind === "signed-out") return null;
  const user = db.select({ sessionVersion: users.sessionVersion }).from(users).where(eq(users.id, actor.userId)).get()!;
  return { user: { id: actor.userId, sessionVersion: user.sessionVersion } };
}

/** Every row of every table, and every stored file, as one digest: equal before and after means nothing changed. */
export function stateDigest(world: Pick<World, "db" | "packetsRoot" | "uploadsRoot">): string {
  const hash = createHash("sha256");
  const tables = world.db.$client.prepare("select name from sqlite_master where type = 'table' order by name").all() as { name: string }[];
  for (const { name } of tables) {
    hash.update(`\n${name}\n`);
    for (const row of world.db.$client.prepare(`select * from "${name}" order by rowid`).all()) hash.update(JSON.stringify(row));
  }
  for (const root of [world.packetsRoot, world.uploadsRoot]) {
    if (!fs.existsSync(root)) continue;
    for (const file of fs.readdirSync(root, { recursive: true }).map(String).sort()) hash.update(`\n${path.relative(os.tmpdir(), path.join(root, file))}`);
  }
  return hash.digest("hex");
}
