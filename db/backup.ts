/**
 * A backup is one folder: a consistent copy of the database taken with
 * SQLite's online backup API (the app may go on serving and writing while it
 * runs), every stored file a row names (uploads by their SHA-256, generated
 * packets by theirs), and a manifest of digests. A restore checks every digest
 * before it writes anything, and checks the restored copy again after.
 */
import { createHash } from "node:crypto";
import fs from "node:fs";
import path from "node:path";
import { extensionForMime, storageKey, type FileStore } from "../lib/storage";
import { packetPath, readPacketFile, writePacketFile } from "../lib/services/revisions/packet-files";
import { openDatabase, type Db } from "./client";
import { attachments, packetRevisions } from "./schema";

export const BACKUP_DATABASE_FILE = "sundocket.db";
export const MANIFEST_FILE = "manifest.json";
const FORMAT = 1;

/** Where a file lives: the upload store (UPLOADS_DIR or S3) or the generated packets (PACKETS_DIR). */
export type FileArea = "uploads" | "packets";

export interface ReferencedFile {
  area: FileArea;
  key: string;
  sha256: string;
}

export interface BackedUpFile extends ReferencedFile {
  sizeBytes: number;
}

export interface BackupManifest {
  format: number;
  createdAt: string;
  database: { file: string; sha256: string; sizeBytes: number; integrity: string };
  files: BackedUpFile[];
  /** Files a row names that were not in the store when the backup ran. */
  missing: ReferencedFile[];
}

export interface FileLocations {
  uploads: FileStore;
  packetsRoot: string;
}

const sha256Of = (bytes: Uint8Array) => createHash("sha256").update(bytes).digest("hex");

/** Every stored file some row names, once each. */
export function referencedFiles(db: Db): ReferencedFile[] {
  const seen = new Map<string, ReferencedFile>();
  const add = (file: ReferencedFile) => seen.set(`${file.area}:${file.key}`, file);
  for (const row of db.select({ sha256: attachments.sha256, mimeType: attachments.mimeType }).from(attachments).all()) {
    add({ area: "uploads", key: storageKey(row.sha256, extensionForMime(row.mimeType)), sha256: row.sha256 });
  }
  const revisions = db
    .select({ pdfPath: packetRevisions.pdfPath, pdfSha256: packetRevisions.pdfSha256, docxPath: packetRevisions.docxPath, docxSha256: packetRevisions.docxSha256 })
    .from(packetRevisions)
    .all();
  for (const row of revisions) {
    if (row.pdfPath && row.pdfSha256) add({ area: "packets", key: row.pdfPath, sha256: row.pdfSha256 });
    if (row.docxPath && row.docxSha256) add({ area: "packets", key: row.docxPath, sha256: row.docxSha256 });
  }
  return [...seen.values()].sort((a, b) => `${a.area}/${a.key}`.localeCompare(`${b.area}/${b.key}`));
}

async function readFrom(locations: FileLocations, file: ReferencedFile): Promise<Uint8Array | null> {
  if (file.area === "packets") return readPacketFile(locations.packetsRoot, file.key);
  if (!(await locations.uploads.exists(file.key))) return null;
  return locations.uploads.get(file.key);
}

function integrityOf(db: Db): string {
  const rows = db.$client.pragma("integrity_check") as { integrity_check: string }[];
  return rows.map((r) => r.integrity_check).join("; ");
}

function copyPathFor(dir: string, file: ReferencedFile): string {
  // packetPath refuses anything that is not "ab/<sha>.ext", so a key from the database cannot leave the folder.
  return file.area === "packets" ? packetPath(path.join(dir, "files", "packets"), file.key) : path.join(dir, "files", "uploads", file.key);
}

/**
 * Copies the database through the online backup API, then every file the copy
 * names (read from the copy, so files and rows agree), checking each digest.
 */
export async function createBackup(db: Db, locations: FileLocations, dir: string): Promise<BackupManifest> {
  if (fs.existsSync(dir) && fs.readdirSync(dir).length) throw new Error(`${dir} is not empty; give a new folder for the backup.`);
  fs.mkdirSync(dir, { recursive: true });
  const databaseFile = path.join(dir, BACKUP_DATABASE_FILE);
  await db.$client.backup(databaseFile);

  const copy = openDatabase(databaseFile);
  let files: BackedUpFile[] = [];
  const missing: ReferencedFile[] = [];
  let integrity: string;
  try {
    // One file, no -wal beside it, so the folder can be moved as it is.
    copy.$client.pragma("journal_mode = DELETE");
    integrity = integrityOf(copy);
    for (const file of referencedFiles(copy)) {
      // A store that refuses the read (S3 finds the bytes altered, say) leaves the file out, named in `missing`.
      const bytes = await readFrom(locations, file).catch(() => null);
      if (!bytes || sha256Of(bytes) !== file.sha256) {
        missing.push(file);
        continue;
      }
      const target = copyPathFor(dir, file);
      fs.mkdirSync(path.dirname(target), { recursive: true });
      fs.writeFileSync(target, bytes);
      files.push({ ...file, sizeBytes: bytes.length });
    }
  } finally {
    copy.$client.close();
  }
  files = files.sort((a, b) => `${a.area}/${a.key}`.localeCompare(`${b.area}/${b.key}`));
  const databaseBytes = fs.readFileSync(databaseFile);
  const manifest: BackupManifest = {
    format: FORMAT,
    createdAt: new Date().toISOString(),
    database: { file: BACKUP_DATABASE_FILE, sha256: sha256Of(databaseBytes), sizeBytes: databaseBytes.length, integrity },
    files,
    missing,
  };
  fs.writeFileSync(path.join(dir, MANIFEST_FILE), JSON.stringify(manifest, null, 2) + "\n");
  return manifest;
}

export class BackupInvalidError extends Error {
  constructor(readonly problems: string[]) {
    super(`The backup cannot be restored; nothing was written:\n${problems.map((p) => `  - ${p}`).join("\n")}`);
    this.name = "BackupInvalidError";
  }
}

export interface RestoreReport {
  databasePath: string;
  files: number;
  integrity: string;
  /** Files the restored database names that cannot be read back with their digest. */
  unreadable: ReferencedFile[];
}

/** Reads and checks every digest in the backup; throws BackupInvalidError listing each problem. */
export function readVerifiedBackup(dir: string): { manifest: BackupManifest; database: Buffer; files: Map<BackedUpFile, Buffer> } {
  const problems: string[] = [];
  let manifest: BackupManifest;
  try {
    manifest = JSON.parse(fs.readFileSync(path.join(dir, MANIFEST_FILE), "utf8")) as BackupManifest;
  } catch (error) {
    throw new BackupInvalidError([`${MANIFEST_FILE} cannot be read: ${(error as Error).message}`]);
  }
  if (manifest.format !== FORMAT) throw new BackupInvalidError([`format ${String(manifest.format)} is not one this version restores (${FORMAT})`]);
  let database = Buffer.alloc(0);
  try {
    database = fs.readFileSync(path.join(dir, BACKUP_DATABASE_FILE));
    if (sha256Of(database) !== manifest.database.sha256) problems.push(`${BACKUP_DATABASE_FILE}: its SHA-256 does not match the manifest`);
  } catch {
    problems.push(`${BACKUP_DATABASE_FILE} is missing`);
  }
  const files = new Map<BackedUpFile, Buffer>();
  for (const file of manifest.files) {
    try {
      const bytes = fs.readFileSync(copyPathFor(dir, file));
      if (sha256Of(bytes) !== file.sha256) problems.push(`${file.area}/${file.key}: its SHA-256 does not match`);
      else files.set(file, bytes);
    } catch {
      problems.push(`${file.area}/${file.key} is missing`);
    }
  }
  if (problems.length) throw new BackupInvalidError(problems);
  return { manifest, database, files };
}

/** Every file the database names, read back from where it now lives and checked against its digest. */
export async function unreadableFiles(db: Db, locations: FileLocations): Promise<ReferencedFile[]> {
  const bad: ReferencedFile[] = [];
  for (const file of referencedFiles(db)) {
    const bytes = await readFrom(locations, file).catch(() => null);
    if (!bytes || sha256Of(bytes) !== file.sha256) bad.push(file);
  }
  return bad;
}

/**
 * Restores a backup into `databasePath` and the given file locations. Refuses
 * an existing database unless `force` (then it is replaced whole). Files are
 * added by digest, so restoring into a store that holds some of them already
 * is harmless.
 */
export async function restoreBackup(dir: string, databasePath: string, locations: FileLocations, options: { force?: boolean } = {}): Promise<RestoreReport> {
  const { database, files } = readVerifiedBackup(dir);
  if (fs.existsSync(databasePath) && !options.force) {
    throw new Error(`${databasePath} exists; restore into a new path, or pass --force to replace it (stop the app first).`);
  }
  for (const [file, bytes] of files) {
    if (file.area === "packets") {
      await writePacketFile(locations.packetsRoot, bytes, path.extname(file.key).slice(1) as "pdf" | "docx");
    } else {
      const stored = await locations.uploads.put(bytes, path.extname(file.key).slice(1));
      if (stored.key !== file.key) throw new Error(`${file.key} was stored as ${stored.key}`);
    }
  }
  fs.mkdirSync(path.dirname(databasePath), { recursive: true });
  // Written beside the target and renamed, so the app never opens half a database.
  const partial = `${databasePath}.restoring`;
  fs.writeFileSync(partial, database);
  for (const suffix of ["-wal", "-shm"]) fs.rmSync(`${databasePath}${suffix}`, { force: true });
  fs.renameSync(partial, databasePath);

  const restored = openDatabase(databasePath);
  try {
    return { databasePath, files: files.size, integrity: integrityOf(restored), unreadable: await unreadableFiles(restored, locations) };
  } finally {
    restored.$client.close();
  }
}
