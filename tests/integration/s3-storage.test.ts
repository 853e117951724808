import { createHash } from "node:crypto";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { PutObjectCommand } from "@aws-sdk/client-s3";
import { PDFDocument, StandardFonts } from "pdf-lib";
import S3rver from "s3rver";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { projectRecordSchema } from "../../lib/schemas/project-record";
import { uploadAttachment } from "../../lib/services/attachments";
import { createProject } from "../../lib/services/projects/create";
import { getProjectRecord } from "../../lib/services/projects/get-record";
import { saveProjectRecord } from "../../lib/services/projects/save-record";
import { generateRevisionArtifacts, getRevisionFile, startRevision } from "../../lib/services/revisions";
import { S3FileStore, setFileStore, StoredFileCorruptError, StoredFileMissingError } from "../../lib/storage";
import { createBackup, restoreBackup } from "../../db/backup";
import { readPdfText } from "../unit/packet/pdf-text";
import { makePdf } from "../unit/uploads/fixtures";
import { makeContext, makeJurisdiction, makeOrg, tempDatabase } from "./factories";

/** The S3 backend against s3rver, a local S3 stand-in, on loopback. */
const scratch = fs.mkdtempSync(path.join(os.tmpdir(), "sundocket-s3-"));
const BUCKET = "sundocket-test";
let server: S3rver;
let store: S3FileStore;

beforeAll(async () => {
  server = new S3rver({ address: "127.0.0.1", port: 0, silent: true, directory: path.join(scratch, "s3"), configureBuckets: [{ name: BUCKET }] });
  const { port } = await server.run();
  // s3rver accepts signed requests with these fixed credentials.
  store = new S3FileStore({ bucket: BUCKET, endpoint: `http://127.0.0.1:${port}`, region: "us-east-1", accessKeyId: "S3RVER", secretAccessKey: "S3RVER", prefix: "uploads/" });
});
afterAll(async () => {
  setFileStore(undefined);
  store?.client.destroy();
  await server?.close();
  fs.rmSync(scratch, { recursive: true, force: true });
});

const sha256 = (bytes: Uint8Array) => createHash("sha256").update(bytes).digest("hex");

describe("S3 file store", () => {
  const bytes = new TextEncoder().encode("%PDF-1.7 a stand-in datasheet");

  it("uploads under the content's SHA-256 and stores identical bytes once", async () => {
    const first = await store.put(bytes, "pdf");
    expect(first).toEqual({ key: `${sha256(bytes).slice(0, 2)}/${sha256(bytes)}.pdf`, sha256: sha256(bytes), sizeBytes: bytes.length, created: true });
    expect(await store.put(bytes, "pdf")).toMatchObject({ key: first.key, created: false });
    expect(await store.exists(first.key)).toBe(true);
    expect(await store.get(first.key)).toEqual(bytes);
  });

  it("refuses bytes changed in the bucket: the read is checked against the key's SHA-256", async () => {
    const original = new TextEncoder().encode("%PDF-1.7 the genuine sheet");
    const { key } = await store.put(original, "pdf");
    await store.client.send(new PutObjectCommand({ Bucket: BUCKET, Key: `uploads/${key}`, Body: new TextEncoder().encode("%PDF-1.7 altered") }));
    await expect(store.get(key)).rejects.toBeInstanceOf(StoredFileCorruptError);
  });

  it("deletes, after which the key is missing, and deleting again is not an error", async () => {
    const other = new TextEncoder().encode("%PDF-1.7 to be deleted");
    const { key } = await store.put(other, "pdf");
    await store.remove(key);
    expect(await store.exists(key)).toBe(false);
    await expect(store.get(key)).rejects.toBeInstanceOf(StoredFileMissingError);
    await expect(store.remove(key)).resolves.toBeUndefined();
  });

  it("refuses a key that is not a content key, so no request leaves the store's prefix", async () => {
    await expect(store.get("../etc/passwd")).rejects.toThrow(/not a storage key/);
  });
});

describe("a packet merged from datasheets held in S3", () => {
  const database = tempDatabase();
  afterAll(() => database.cleanup());

  it("renders with the datasheet's pages, read back from the bucket", async () => {
    setFileStore(store);
    const { db } = database;
    const org = makeOrg(db);
    const designer = makeContext(db, org.id, ["designer"]);
    const record = projectRecordSchema.parse(JSON.parse(fs.readFileSync("examples/tamarack-hut.json", "utf8")));
    const jurisdiction = makeJurisdiction(db, org.id, record.jurisdiction.necEdition);
    const { id } = createProject(designer, { name: "S3 copy", client: record.client, systemKind: record.systemKind, jurisdictionId: jurisdiction.id, address: record.site.address });
    saveProjectRecord(designer, id, { ...record, name: "S3 copy" }, getProjectRecord(designer, id).version);

    const doc = await PDFDocument.create();
    const font = await doc.embedFont(StandardFonts.Helvetica);
    for (let i = 1; i <= 2; i++) doc.addPage([612, 792]).drawText(`Bucket-held INV-1 datasheet page ${i}`, { x: 72, y: 700, size: 14, font });
    const datasheet = await doc.save();
    await uploadAttachment(designer, { projectId: id, kind: "datasheet", equipmentTag: "INV-1", fileName: "inv-1.pdf", bytes: datasheet });
    // The bytes are in the bucket (not on a local disk) under their digest.
    expect(await store.exists(`${sha256(datasheet).slice(0, 2)}/${sha256(datasheet)}.pdf`)).toBe(true);

    const { revisionId } = startRevision(designer, id, { dispatch: () => undefined });
    const packetsDir = path.join(scratch, "packets");
    const row = await generateRevisionArtifacts(db, revisionId, { packetsDir });
    expect(row.error).toBeNull();
    expect(row.state).toBe("ready");
    const pdf = (await getRevisionFile(designer, revisionId, "pdf", { packetsDir })).bytes;
    const text = await readPdfText(pdf);
    expect(text.pages.filter((p) => p.includes("Bucket-held INV-1 datasheet page")).length).toBe(2);
  }, 60_000);
});

describe("backup and restore with the files in a bucket", () => {
  const database = tempDatabase();
  afterAll(() => database.cleanup());

  it("backs up the files the rows name from the bucket, leaves out an altered one, and restores the rest into another prefix", async () => {
    setFileStore(store);
    const { db } = database;
    const org = makeOrg(db);
    const designer = makeContext(db, org.id, ["designer"]);
    const { id: projectId } = createProject(designer, { name: "Bucket hut", systemKind: "stand-alone", jurisdictionId: makeJurisdiction(db, org.id).id });
    const kept = await uploadAttachment(designer, { projectId, kind: "other", fileName: "kept.pdf", bytes: await makePdf(1, "Kept in the bucket") });
    const altered = await uploadAttachment(designer, { projectId, kind: "other", fileName: "altered.pdf", bytes: await makePdf(1, "Altered in the bucket") });
    const alteredKey = `${altered.attachment.sha256.slice(0, 2)}/${altered.attachment.sha256}.pdf`;
    await store.client.send(new PutObjectCommand({ Bucket: BUCKET, Key: `uploads/${alteredKey}`, Body: new TextEncoder().encode("%PDF-1.7 not what was uploaded") }));

    const dir = path.join(scratch, "backup");
    const packetsRoot = path.join(scratch, "packets");
    const manifest = await createBackup(db, { uploads: store, packetsRoot }, dir);
    expect(manifest.files.map((f) => f.sha256)).toEqual([kept.attachment.sha256]);
    expect(manifest.missing.map((f) => f.key)).toEqual([alteredKey]);

    const restoredStore = new S3FileStore({ ...store.config, prefix: "restored/" });
    try {
      const report = await restoreBackup(dir, path.join(scratch, "restored.db"), { uploads: restoredStore, packetsRoot });
      expect(report.integrity).toBe("ok");
      expect(report.files).toBe(1);
      // The altered file was never in the backup: the restored copy names it and cannot read it, and says so.
      expect(report.unreadable.map((f) => f.key)).toEqual([alteredKey]);
      expect(sha256(await restoredStore.get(`${kept.attachment.sha256.slice(0, 2)}/${kept.attachment.sha256}.pdf`))).toBe(kept.attachment.sha256);
    } finally {
      restoredStore.client.destroy();
    }
  }, 60_000);
});
