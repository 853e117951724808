import { spawn, type ChildProcess } from "node:child_process";
import { createHash } from "node:crypto";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import Database from "better-sqlite3";
import { and, eq } from "drizzle-orm";
import { afterAll, describe, expect, it } from "vitest";
import { attachments, auditLog, jobs, packetRevisions, projects, submissionEvents, submissions } from "../../db/schema";
import { removeStalePartFiles } from "../../lib/jobs/recover";
import { projectRecordSchema } from "../../lib/schemas/project-record";
import { getProjectRecord } from "../../lib/services/projects/get-record";
import { saveProjectRecord } from "../../lib/services/projects/save-record";
import { startRevision } from "../../lib/services/revisions";
import { createSubmission, recordSubmissionEvent } from "../../lib/services/submissions";
import { DiskFileStore, setFileStore } from "../../lib/storage";
import { makeContext, makeJurisdiction, makeOrg, makeProject, tempDatabase } from "./factories";

/**
 * Processes killed outright (SIGKILL: no handler runs, nothing is flushed) in
 * the middle of rendering a packet, recording a permit event and storing an
 * upload. Afterwards the database passes its integrity check, no row is half
 * made, every stored file is whole or absent, and the next start finishes or
 * fails (with its reason) whatever was left in progress.
 */

const t = tempDatabase();
const { db } = t;
const scratch = fs.mkdtempSync(path.join(os.tmpdir(), "sundocket-faults-"));
const uploadsDir = path.join(scratch, "uploads");
const packetsDir = path.join(scratch, "packets");
setFileStore(new DiskFileStore(uploadsDir));
const children = new Set<ChildProcess>();
afterAll(() => {
  for (const child of children) child.kill("SIGKILL");
  setFileStore(undefined);
  t.cleanup();
  fs.rmSync(scratch, { recursive: true, force: true });
});

const org = makeOrg(db);
const designer = makeContext(db, org.id, ["designer"]);
const office = makeContext(db, org.id, ["office"]);
const jurisdiction = makeJurisdiction(db, org.id);
const hut = projectRecordSchema.parse(JSON.parse(fs.readFileSync("examples/tamarack-hut.json", "utf8")));
const processEnv = {
  ...process.env,
  DATABASE_PATH: t.file,
  UPLOADS_DIR: uploadsDir,
  PACKETS_DIR: packetsDir,
  JOBS_BACKEND: "sqlite",
  // A killed worker's job is claimed again a second after its last renewal.
  JOBS_LEASE_S: "1",
  JOBS_BACKOFF_S: "0",
  // One job at a time: a worker finishes the job the last kill cut short before it reaches the next one to kill.
  JOBS_CONCURRENCY: "1",
};

function hutProject(name: string): string {
  const row = makeProject(db, org.id, jurisdiction.id);
  saveProjectRecord(designer, row.id, { ...hut, name }, getProjectRecord(designer, row.id).version);
  return row.id;
}

/** tsx as a loader in this very process (not its CLI, which runs a second one), so the kill lands on the writer itself. */
function start(script: string, extraEnv: Record<string, string> = {}): ChildProcess {
  const child = spawn(process.execPath, ["--conditions=react-server", "--import", "tsx", path.resolve(script)], { env: { ...processEnv, ...extraEnv }, stdio: ["ignore", "pipe", "inherit"] });
  children.add(child);
  child.once("exit", () => children.delete(child));
  return child;
}

async function kill(child: ChildProcess): Promise<void> {
  if (child.exitCode !== null || child.signalCode !== null) return;
  const exited = new Promise((resolve) => child.once("exit", resolve));
  child.kill("SIGKILL");
  await exited;
}

async function until(condition: () => boolean, timeoutMs: number, pollMs = 10): Promise<boolean> {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    if (condition()) return true;
    await new Promise((r) => setTimeout(r, pollMs));
  }
  return condition();
}

function integrity(): string {
  const check = new Database(t.file, { readonly: true });
  try {
    return (check.pragma("integrity_check") as { integrity_check: string }[]).map((r) => r.integrity_check).join("; ");
  } finally {
    check.close();
  }
}

/** Every file under its final name holds the bytes its name's SHA-256 says: whole, never half. */
function filesWholeOrAbsent(root: string): { whole: number; parts: number } {
  let whole = 0;
  let parts = 0;
  if (!fs.existsSync(root)) return { whole, parts };
  for (const name of fs.readdirSync(root, { recursive: true }).map(String)) {
    const file = path.join(root, name);
    if (!fs.statSync(file).isFile()) continue;
    if (name.endsWith(".part")) {
      parts++;
      continue;
    }
    const sha = path.basename(name).split(".")[0]!;
    expect(createHash("sha256").update(fs.readFileSync(file)).digest("hex"), `${name} is not whole`).toBe(sha);
    whole++;
  }
  return { whole, parts };
}

const revisionRow = (id: string) => db.select().from(packetRevisions).where(eq(packetRevisions.id, id)).get()!;

describe("a packet worker killed at each step of a rendering", () => {
  const STEPS = ["queued", "snapshot", "checks", "sheets", "datasheets", "docx"] as const;
  const killedAt: { revisionId: string; wanted: string; at: string }[] = [];

  it("leaves the database whole and no half-written packet file, whichever step it was in", async () => {
    for (const step of STEPS) {
      const { revisionId } = startRevision(designer, hutProject(`Hut killed at ${step}`));
      const worker = start("scripts/worker.ts");
      // "queued": this worker has claimed the job and not yet begun; each later step is written as it begins.
      const claimed = () => db.select().from(jobs).all().some((j) => j.payload.revisionId === revisionId && j.state === "running" && (j.leaseOwner ?? "").includes(`:${worker.pid}:`));
      await until(() => {
        const row = revisionRow(revisionId);
        return row.state !== "generating" || (step === "queued" ? claimed() : row.progressStep === step);
      }, 150_000, 5);
      await kill(worker);
      killedAt.push({ revisionId, wanted: step, at: `${revisionRow(revisionId).state}/${revisionRow(revisionId).progressStep}` });
      expect(integrity()).toBe("ok");
      filesWholeOrAbsent(packetsDir);
    }
    console.log(`killed the worker at: ${killedAt.map((k) => `${k.wanted} → ${k.at}`).join(", ")}`);
    // A step can pass faster than the poll sees it (snapshot and checks take milliseconds on a quiet machine); the kill
    // then lands in a later step or after the end. The claim and the sheets are long enough to be hit every time.
    expect(killedAt.filter((k) => k.at.startsWith("generating/")).length).toBeGreaterThanOrEqual(2);
  }, 600_000);

  it("the next worker finishes every one of them, each file matching the hash its revision records", async () => {
    const worker = start("scripts/worker.ts");
    try {
      const done = await until(() => killedAt.every((k) => revisionRow(k.revisionId).state !== "generating"), 300_000, 200);
      expect(done).toBe(true);
    } finally {
      await kill(worker);
    }
    for (const { revisionId } of killedAt) {
      const row = revisionRow(revisionId);
      expect(row.error).toBeNull();
      expect(row.state).toBe("ready");
      for (const [key, sha] of [
        [row.pdfPath, row.pdfSha256],
        [row.docxPath, row.docxSha256],
      ]) {
        expect(createHash("sha256").update(fs.readFileSync(path.join(packetsDir, key!))).digest("hex")).toBe(sha);
      }
    }
    expect(integrity()).toBe("ok");
    filesWholeOrAbsent(packetsDir);
  }, 320_000);
});

describe("a revision left generating with no job (the server killed between its commit and the queue)", () => {
  it("is marked failed with its reason when the next worker starts, a stamped set as well as a new one", async () => {
    const fresh = startRevision(designer, hutProject("Hut whose job was lost"), { dispatch: () => undefined });
    const stampedProject = hutProject("Hut whose re-stamp was lost");
    const stamped = db
      .insert(packetRevisions)
      .values({ orgId: org.id, projectId: stampedProject, number: 1, state: "generating", progressStep: "queued", reviewState: "approved", recordSnapshot: {}, resultsSnapshot: {}, recordSha256: "5".repeat(64) })
      .returning()
      .get();
    // A part file left by a killed writer long ago, and one being written now by someone else.
    fs.mkdirSync(path.join(packetsDir, "ab"), { recursive: true });
    const oldPart = path.join(packetsDir, "ab", `${"ab".repeat(32)}.pdf.1234.part`);
    const newPart = path.join(packetsDir, "ab", `${"ab".repeat(32)}.pdf.5678.part`);
    fs.writeFileSync(oldPart, "half a pa");
    fs.writeFileSync(newPart, "half a pa");
    const hourAgo = new Date(Date.now() - 60 * 60 * 1000);
    fs.utimesSync(oldPart, hourAgo, hourAgo);

    const worker = start("scripts/worker.ts");
    try {
      expect(await until(() => revisionRow(fresh.revisionId).state === "failed" && revisionRow(stamped.id).state === "failed", 60_000, 100)).toBe(true);
      expect(await until(() => !fs.existsSync(oldPart), 10_000, 100)).toBe(true);
    } finally {
      await kill(worker);
    }
    expect(revisionRow(fresh.revisionId).error).toMatch(/^Step "queued": the server stopped before this rendering was queued, so it never ran; generate a new revision\.$/);
    expect(revisionRow(stamped.id).error).toMatch(/render the stamped packet again\.$/);
    expect(fs.existsSync(newPart)).toBe(true);
    fs.rmSync(newPart);
  }, 90_000);
});

describe("a server killed while recording permit events", () => {
  it("keeps each event with its audit row and the submission's version, never one without the others", async () => {
    const projectId = hutProject("Hut before the county");
    const revision = db
      .insert(packetRevisions)
      .values({ orgId: org.id, projectId, number: 1, state: "ready", reviewState: "approved", isDraft: false, recordSnapshot: getProjectRecord(designer, projectId).record as never, resultsSnapshot: {}, recordSha256: "7".repeat(64), createdBy: designer.user.id, createdAt: "2026-11-20T09:00:00.000Z" })
      .returning()
      .get();
    db.update(projects).set({ status: "approved" }).where(eq(projects.id, projectId)).run();
    const { submissionId } = await createSubmission(office, { revisionId: revision.id, method: "counter", occurredOn: "2026-11-25" }, { deliver: async () => undefined });
    await recordSubmissionEvent(office, { submissionId, kind: "in-plan-review", occurredOn: "2026-11-26" }, { deliver: async () => undefined });
    const eventCount = () => db.select().from(submissionEvents).where(eq(submissionEvents.submissionId, submissionId)).all().length;
    const before = { events: eventCount(), version: db.select().from(submissions).where(eq(submissions.id, submissionId)).get()!.version };

    for (let round = 0; round < 3; round++) {
      const writer = start("tests/fixtures/fault-writer.ts", { FAULT_MODE: "events", FAULT_USER: office.user.id, FAULT_SUBMISSION: submissionId });
      const reached = eventCount() + 20 + round * 7;
      expect(await until(() => eventCount() >= reached, 60_000, 2)).toBe(true);
      await kill(writer);
    }

    expect(integrity()).toBe("ok");
    const events = db.select().from(submissionEvents).where(eq(submissionEvents.submissionId, submissionId)).all();
    const audited = db
      .select()
      .from(auditLog)
      .where(and(eq(auditLog.entity, "submission"), eq(auditLog.entityId, submissionId), eq(auditLog.action, "submission.event")))
      .all();
    const submission = db.select().from(submissions).where(eq(submissions.id, submissionId)).get()!;
    expect(events.length).toBeGreaterThan(before.events + 40);
    expect(submission.version - before.version).toBe(events.length - before.events);
    expect(new Set(audited.map((a) => (a.detail as { eventId?: string }).eventId))).toEqual(new Set(events.filter((e) => e.kind !== "submitted").map((e) => e.id)));
    expect(submission.status).toBe("in-plan-review");
  }, 200_000);
});

describe("a server killed while storing uploads", () => {
  it("never leaves a row whose file is missing or partial; a part file is tidied once it is old", async () => {
    const projectId = makeProject(db, org.id, jurisdiction.id).id;
    const rows = () => db.select().from(attachments).where(eq(attachments.projectId, projectId)).all();
    for (let round = 0; round < 4; round++) {
      const writer = start("tests/fixtures/fault-writer.ts", { FAULT_MODE: "uploads", FAULT_USER: designer.user.id, FAULT_PROJECT: projectId });
      const reached = rows().length + 3 + round;
      expect(await until(() => rows().length >= reached, 90_000, 2)).toBe(true);
      await kill(writer);
    }
    expect(integrity()).toBe("ok");
    for (const row of rows()) {
      const file = path.join(uploadsDir, row.sha256.slice(0, 2), `${row.sha256}.pdf`);
      expect(fs.existsSync(file), `${row.fileName} has a row but no file`).toBe(true);
      expect(createHash("sha256").update(fs.readFileSync(file)).digest("hex")).toBe(row.sha256);
    }
    const { whole, parts } = filesWholeOrAbsent(uploadsDir);
    expect(whole).toBeGreaterThanOrEqual(rows().length);
    console.log(`uploads: ${rows().length} rows, ${whole} whole files, ${parts} part file(s) left by the kills`);
    // Tidied at the next start once no writer can still own them.
    const removed = await removeStalePartFiles([uploadsDir], 0);
    expect(removed.length).toBe(parts);
    expect(filesWholeOrAbsent(uploadsDir).parts).toBe(0);
  }, 400_000);
});
