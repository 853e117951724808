import { spawn, spawnSync } from "node:child_process";
import { createHash } from "node:crypto";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import Database from "better-sqlite3";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { BACKUP_DATABASE_FILE, BackupInvalidError, createBackup, restoreBackup, type BackupManifest } from "../../db/backup";
import { openDatabase } from "../../db/client";
import { attachments, auditLog, packetRevisions } from "../../db/schema";
import { uploadAttachment } from "../../lib/services/attachments/upload";
import { contextForUser } from "../../lib/services/context";
import { getProjectRecord } from "../../lib/services/projects/get-record";
import { writePacketFile } from "../../lib/services/revisions/packet-files";
import { DiskFileStore, setFileStore } from "../../lib/storage";
import { makePdf, makePng } from "../unit/uploads/fixtures";
import { makeContext, makeJurisdiction, makeOrg, makeProject, tempDatabase } from "./factories";

/**
 * A backup taken while the app writes restores into an empty place, and the
 * restored copy holds the same rows and the same bytes, checked by digest.
 */

const sha = (bytes: Uint8Array) => createHash("sha256").update(bytes).digest("hex");
const root = fs.mkdtempSync(path.join(os.tmpdir(), "sundocket-backup-"));
const t = tempDatabase();
const uploads = new DiskFileStore(path.join(root, "uploads"));
const packetsRoot = path.join(root, "packets");
const org = makeOrg(t.db);
const designer = makeContext(t.db, org.id, ["designer"]);
const project = makeProject(t.db, org.id, makeJurisdiction(t.db, org.id).id);
let datasheet: Uint8Array;
let photo: Uint8Array;
let packet: Uint8Array;

beforeAll(async () => {
  setFileStore(uploads);
  datasheet = await makePdf(2, "Inverter datasheet");
  photo = makePng(8, 6);
  await uploadAttachment(designer, { projectId: project.id, kind: "other", fileName: "inverter.pdf", bytes: datasheet });
  await uploadAttachment(designer, { projectId: project.id, kind: "other", fileName: "site.png", bytes: photo });
  packet = await makePdf(3, "Packet");
  const written = await writePacketFile(packetsRoot, packet, "pdf");
  t.db
    .insert(packetRevisions)
    .values({ orgId: org.id, projectId: project.id, number: 1, state: "ready", recordSnapshot: {}, resultsSnapshot: {}, recordSha256: "1".repeat(64), pdfPath: written.key, pdfSha256: written.sha256 })
    .run();
});

afterAll(() => {
  setFileStore(undefined);
  t.cleanup();
  fs.rmSync(root, { recursive: true, force: true });
});

/** A second process writing audit rows as fast as it can, standing in for the app serving while the backup runs. */
function startWriter(file: string, orgId: string) {
  const code = `
    const Database = require("better-sqlite3");
    const db = new Database(process.argv[1]);
    db.pragma("busy_timeout = 5000");
    const insert = db.prepare("insert into audit_log (id, org_id, action, entity, detail, created_at) values (?, ?, 'test.write', 'test', '{}', ?)");
    let n = 0;
    process.stdout.write("started\\n");
    const tick = () => { for (let i = 0; i < 50; i++) insert.run(require("crypto").randomUUID(), process.argv[2], new Date().toISOString()); n += 50; setImmediate(tick); };
    process.on("SIGTERM", () => { process.stdout.write(n + "\\n"); process.exit(0); });
    tick();
  `;
  const child = spawn(process.execPath, ["-e", code, file, orgId], { stdio: ["ignore", "pipe", "inherit"] });
  let out = "";
  child.stdout.on("data", (d: Buffer) => (out += d.toString()));
  const started = new Promise<void>((resolve) => child.stdout.on("data", () => resolve()));
  const stop = () =>
    new Promise<number>((resolve) => {
      child.on("exit", () => resolve(Number(out.trim().split("\n").pop())));
      child.kill("SIGTERM");
    });
  return { started, stop };
}

describe("db:backup and db:restore", () => {
  let backupDir = "";
  let manifest: BackupManifest;
  let auditRowsInBackup = 0;

  it("backs up while another process writes, with a consistent database and every named file", async () => {
    const writer = startWriter(t.file, org.id);
    await writer.started;
    backupDir = path.join(root, "backup-1");
    manifest = await createBackup(t.db, { uploads, packetsRoot }, backupDir);
    const written = await writer.stop();
    expect(written).toBeGreaterThan(0);
    expect(manifest.database.integrity).toBe("ok");
    expect(manifest.missing).toEqual([]);
    expect(manifest.files.map((f) => [f.area, f.sha256]).sort()).toEqual(
      [
        ["packets", sha(packet)],
        ["uploads", sha(datasheet)],
        ["uploads", sha(photo)],
      ].sort(),
    );
    // The copy is a single file (no -wal beside it) that opens on its own.
    expect(fs.existsSync(path.join(backupDir, `${BACKUP_DATABASE_FILE}-wal`))).toBe(false);
    const copy = new Database(path.join(backupDir, BACKUP_DATABASE_FILE), { readonly: true });
    auditRowsInBackup = (copy.prepare("select count(*) as n from audit_log").get() as { n: number }).n;
    copy.close();
    expect(auditRowsInBackup).toBeGreaterThan(0);
  });

  it("restores into a fresh folder, and the app's services read the same project and the same bytes", async () => {
    const target = path.join(root, "restored");
    const restoredUploads = new DiskFileStore(path.join(target, "uploads"));
    const report = await restoreBackup(backupDir, path.join(target, "sundocket.db"), { uploads: restoredUploads, packetsRoot: path.join(target, "packets") });
    expect(report.integrity).toBe("ok");
    expect(report.files).toBe(3);
    expect(report.unreadable).toEqual([]);

    const db = openDatabase(path.join(target, "sundocket.db"));
    try {
      const ctx = contextForUser(db, designer.user.id);
      expect(getProjectRecord(ctx, project.id).record.name).toBe(project.name);
      const rows = db.select().from(attachments).all();
      expect(rows.map((r) => r.fileName).sort()).toEqual(["inverter.pdf", "site.png"]);
      for (const row of rows) {
        const bytes = await restoredUploads.get(`${row.sha256.slice(0, 2)}/${row.sha256}.${row.mimeType === "image/png" ? "png" : "pdf"}`);
        expect(sha(bytes)).toBe(row.sha256);
      }
      const revision = db.select().from(packetRevisions).get()!;
      expect(sha(fs.readFileSync(path.join(target, "packets", revision.pdfPath!)))).toBe(sha(packet));
      expect(db.select().from(auditLog).all().length).toBe(auditRowsInBackup);
    } finally {
      db.$client.close();
    }
  });

  it("refuses a backup whose file was altered, writing nothing", async () => {
    const dir = path.join(root, "backup-tampered");
    fs.cpSync(backupDir, dir, { recursive: true });
    const victim = manifest.files.find((f) => f.area === "uploads")!;
    const file = path.join(dir, "files", "uploads", victim.key);
    const bytes = fs.readFileSync(file);
    bytes[bytes.length - 3]! ^= 0x01;
    fs.writeFileSync(file, bytes);
    const target = path.join(root, "restored-tampered");
    const error = await restoreBackup(dir, path.join(target, "sundocket.db"), { uploads: new DiskFileStore(path.join(target, "uploads")), packetsRoot: path.join(target, "packets") }).catch(
      (e: unknown) => e,
    );
    expect(error).toBeInstanceOf(BackupInvalidError);
    expect((error as Error).message).toContain(`uploads/${victim.key}: its SHA-256 does not match`);
    expect(fs.existsSync(target)).toBe(false);
  });

  it("will not overwrite a database that exists unless forced", async () => {
    const target = path.join(root, "restored");
    await expect(restoreBackup(backupDir, path.join(target, "sundocket.db"), { uploads, packetsRoot })).rejects.toThrow(/exists; restore into a new path, or pass --force/);
  });

  it("runs as npm run db:backup and db:restore against the configured paths", () => {
    const cli = path.join(root, "cli");
    const run = (script: string, args: string[], env: Record<string, string>) =>
      spawnSync(process.execPath, ["--import", "tsx", "--conditions=react-server", script, ...args], {
        env: { ...process.env, ...env },
        encoding: "utf8",
        timeout: 60_000,
      });
    const backup = run("scripts/db-backup.ts", [path.join(cli, "backup")], { DATABASE_PATH: t.file, UPLOADS_DIR: uploads.root, PACKETS_DIR: packetsRoot });
    expect(backup.stderr).toBe("");
    expect(backup.status).toBe(0);
    expect(backup.stdout).toMatch(/integrity ok/);
    expect(backup.stdout).toMatch(/files: 3 /);
    const restore = run("scripts/db-restore.ts", [path.join(cli, "backup")], {
      DATABASE_PATH: path.join(cli, "restored", "sundocket.db"),
      UPLOADS_DIR: path.join(cli, "restored", "uploads"),
      PACKETS_DIR: path.join(cli, "restored", "packets"),
    });
    expect(restore.stderr).toBe("");
    expect(restore.status).toBe(0);
    expect(restore.stdout).toMatch(/integrity: ok; files: 3, every one read back/);
  });
});
