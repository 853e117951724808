import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { and, eq } from "drizzle-orm";
import { afterAll, describe, expect, it } from "vitest";
import { auditLog, packetRevisions } from "../../db/schema";
import { projectRecordSchema } from "../../lib/schemas/project-record";
import type { ServiceContext } from "../../lib/services/context";
import { ServiceError } from "../../lib/services/errors";
import { createProject } from "../../lib/services/projects/create";
import { getProjectRecord } from "../../lib/services/projects/get-record";
import { saveProjectRecord } from "../../lib/services/projects/save-record";
import { generateRevisionArtifacts, startRevision } from "../../lib/services/revisions";
import { decideReview, getReviewWorkspace, saveOwnLicence, sendForReview } from "../../lib/services/reviews";
import { addUser, setUserRoles } from "../../lib/services/users/manage";
import { DiskFileStore, setFileStore } from "../../lib/storage";
import { makeContext, makeJurisdiction, makeOrg, tempDatabase } from "./factories";

const env = tempDatabase();
const { db } = env;
const scratch = fs.mkdtempSync(path.join(os.tmpdir(), "sundocket-independence-"));
const packetsDir = path.join(scratch, "packets");
setFileStore(new DiskFileStore(path.join(scratch, "uploads")));
afterAll(() => {
  setFileStore(undefined);
  env.cleanup();
  fs.rmSync(scratch, { recursive: true, force: true });
});

const noDelivery = async () => undefined;
const render = (id: string) => generateRevisionArtifacts(db, id, { packetsDir });
const NOW = new Date("2026-12-01T12:00:00Z");
const LICENCE = { licenceNumber: "PE-E-100200", region: "Westmark", discipline: "Electrical", expiresOn: "2029-06-30" };

const org = makeOrg(db, "Independence Test Firm");
const designer = makeContext(db, org.id, ["designer"]);
/** One person holding both roles: the case a stamp must not let through on their own work. */
const dual = makeContext(db, org.id, ["designer", "reviewer"]);
const independent = makeContext(db, org.id, ["reviewer"]);
const admin = makeContext(db, org.id, ["admin"]);
const record = projectRecordSchema.parse(JSON.parse(fs.readFileSync("examples/tamarack-hut.json", "utf8")));
const westmark = makeJurisdiction(db, org.id, record.jurisdiction.necEdition, { region: "Westmark" });
const eastfold = makeJurisdiction(db, org.id, record.jurisdiction.necEdition, { region: "Eastfold" });
const unplaced = makeJurisdiction(db, org.id, record.jurisdiction.necEdition, { region: "" });
saveOwnLicence(dual, LICENCE, { now: NOW });
saveOwnLicence(independent, LICENCE, { now: NOW });

function newProject(ctx: ServiceContext, name: string, jurisdictionId = westmark.id): string {
  const { id } = createProject(ctx, { name, client: record.client, systemKind: record.systemKind, jurisdictionId, address: record.site.address });
  saveProjectRecord(ctx, id, { ...record, name }, getProjectRecord(ctx, id).version);
  return id;
}

async function revisionInReview(by: ServiceContext, projectId: string): Promise<string> {
  const { revisionId } = startRevision(by, projectId, { dispatch: () => undefined });
  expect((await render(revisionId)).state).toBe("ready");
  // A message goes with it: a set whose checks fail is not sent without one.
  await sendForReview(by, revisionId, { deliver: noDelivery, message: "Ready for your review." });
  return revisionId;
}

async function refusal(fn: () => Promise<unknown>): Promise<ServiceError> {
  const error = await fn().then(
    () => undefined,
    (e: unknown) => e,
  );
  expect(error, "the call was refused").toBeInstanceOf(ServiceError);
  return error as ServiceError;
}

const returning = (ctx: ServiceContext, revisionId: string) =>
  decideReview(ctx, { revisionId, decision: "returned", generalNotes: "Checked." }, { deliver: noDelivery, dispatch: () => undefined, now: NOW });
const approving = (ctx: ServiceContext, revisionId: string) =>
  decideReview(ctx, { revisionId, decision: "approved", confirmStamp: true }, { deliver: noDelivery, dispatch: () => undefined, now: NOW });

function reviewState(id: string) {
  return db.select({ s: packetRevisions.reviewState }).from(packetRevisions).where(eq(packetRevisions.id, id)).get()!.s;
}

describe("separation of duties", () => {
  it("refuses a reviewer the revision they generated themselves, naming why, on the page and in the service", async () => {
    const projectId = newProject(dual, "Own design");
    const revisionId = await revisionInReview(dual, projectId);
    const ws = getReviewWorkspace(dual, revisionId);
    expect(ws.mayDecide).toBe(false);
    expect(ws.decisionRefusal).toMatch(/You generated revision 1/);

    for (const attempt of [returning, approving]) {
      const error = await refusal(() => attempt(dual, revisionId));
      expect(error.code).toBe("forbidden");
      expect(error.message).toMatch(/You generated revision 1, so you cannot decide it/);
    }
    expect(reviewState(revisionId)).toBe("in-review");
    // Someone who took no part may.
    expect(getReviewWorkspace(independent, revisionId).mayDecide).toBe(true);
  }, 90_000);

  it("refuses a reviewer who edited the project since its last approved revision, though a colleague generated it", async () => {
    const projectId = newProject(designer, "Edited by the reviewer");
    const stored = getProjectRecord(dual, projectId);
    saveProjectRecord(dual, projectId, { ...stored.record, client: `${stored.record.client} (corrected)` }, stored.version);
    const revisionId = await revisionInReview(designer, projectId);

    const error = await refusal(() => returning(dual, revisionId));
    expect(error.code).toBe("forbidden");
    expect(error.message).toMatch(/You edited Edited by the reviewer \(project saved on .* UTC\) and it has no approved revision yet/);
    expect(getReviewWorkspace(dual, revisionId).decisionRefusal).toBe(error.message);
    expect(reviewState(revisionId)).toBe("in-review");
  }, 90_000);

  it("lets the same reviewer decide once an approved revision separates them from their edit", async () => {
    const projectId = newProject(designer, "Edited long ago");
    const stored = getProjectRecord(dual, projectId);
    saveProjectRecord(dual, projectId, { ...stored.record, client: `${stored.record.client} (old edit)` }, stored.version);
    const first = await revisionInReview(designer, projectId);
    // Revision 1 was approved by someone independent; the rendering of its stamp is not what this test is about.
    db.update(packetRevisions).set({ reviewState: "approved" }).where(eq(packetRevisions.id, first)).run();
    const second = await revisionInReview(designer, projectId);

    expect(getReviewWorkspace(dual, second).decisionRefusal).toBeNull();
    await returning(dual, second);
    expect(reviewState(second)).toBe("returned");
  }, 90_000);
});

describe("a licence covers the jurisdiction's region and the discipline", () => {
  it("refuses an approval where the licence was issued in another region, naming both", async () => {
    const projectId = newProject(designer, "Across the border", eastfold.id);
    const revisionId = await revisionInReview(designer, projectId);
    expect(getReviewWorkspace(independent, revisionId).licenceCoverage).toMatch(/issued in Westmark; .* is in Eastfold/);
    const error = await refusal(() => approving(independent, revisionId));
    expect(error.code).toBe("invalid");
    expect(error.message).toMatch(/issued in Westmark; .* is in Eastfold/);
    expect(error.issues[0]).toMatchObject({ path: "licence.region" });
    // Returning needs no licence for the region: the reviewer may still send it back.
    await returning(independent, revisionId);
    expect(reviewState(revisionId)).toBe("returned");
  }, 90_000);

  it("refuses when the jurisdiction's region is not recorded: a missing region is never a match", async () => {
    const projectId = newProject(designer, "Unplaced jurisdiction", unplaced.id);
    const revisionId = await revisionInReview(designer, projectId);
    const error = await refusal(() => approving(independent, revisionId));
    expect(error.issues[0]).toMatchObject({ path: "licence.region" });
    expect(error.message).toMatch(/has no region recorded/);
  }, 90_000);

  it("refuses a licence of another discipline", async () => {
    const structural = makeContext(db, org.id, ["reviewer"]);
    saveOwnLicence(structural, { ...LICENCE, discipline: "Structural" }, { now: NOW });
    const projectId = newProject(designer, "Structural reviewer");
    const revisionId = await revisionInReview(designer, projectId);
    const error = await refusal(() => approving(structural, revisionId));
    expect(error.issues[0]).toMatchObject({ path: "licence.region" });
    expect(error.message).toMatch(/is for Structural; .* needs an electrical licence/);
  }, 90_000);

  it("matches a region whatever its case or spacing, so the refusal that follows is the next one (a draft)", async () => {
    const spaced = makeContext(db, org.id, ["reviewer"]);
    saveOwnLicence(spaced, { ...LICENCE, region: "westmark " }, { now: NOW });
    const projectId = newProject(designer, "Same region spelt differently");
    const revisionId = await revisionInReview(designer, projectId);
    expect(getReviewWorkspace(spaced, revisionId).licenceCoverage).toBeNull();
    const error = await refusal(() => approving(spaced, revisionId));
    expect(error.issues[0]?.path).not.toBe("licence.region");
  }, 90_000);
});

describe("the audit log names who granted each role", () => {
  it("records the roles granted and revoked and the administrator who did it", async () => {
    const { id } = await addUser(admin, { name: "Pat Newhire", email: "pat.newhire@example.test", roles: ["designer"], password: "a long enough password" });
    const added = db.select().from(auditLog).where(and(eq(auditLog.action, "user.added"), eq(auditLog.entityId, id))).get()!;
    expect(added.userId).toBe(admin.user.id);
    expect(added.detail).toMatchObject({ granted: ["designer"], revoked: [], grantedBy: { id: admin.user.id, name: admin.user.name } });

    setUserRoles(admin, { userId: id, roles: ["reviewer", "office"], version: 1 });
    const changed = db.select().from(auditLog).where(and(eq(auditLog.action, "user.roles-set"), eq(auditLog.entityId, id))).get()!;
    expect(changed.detail).toMatchObject({ granted: ["reviewer", "office"], revoked: ["designer"], grantedBy: { id: admin.user.id, name: admin.user.name } });
  });
});
