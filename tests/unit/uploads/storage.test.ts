import { createHash } from "node:crypto";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { assertStorageKey, DiskFileStore, storageKey, StoredFileMissingError } from "../../../lib/storage";
import { formatBytes } from "../../../lib/uploads/format-bytes";
import { makePdf, makePng } from "./fixtures";

const root = fs.mkdtempSync(path.join(os.tmpdir(), "sundocket-store-"));
afterAll(() => fs.rmSync(root, { recursive: true, force: true }));

describe("the disk store keeps files by SHA-256", () => {
  it("stores under ab/abcdef….pdf and reads the same bytes back", async () => {
    const store = new DiskFileStore(root);
    const bytes = await makePdf(1);
    const sha = createHash("sha256").update(bytes).digest("hex");
    const stored = await store.put(bytes, "pdf");
    expect(stored).toEqual({ key: `${sha.slice(0, 2)}/${sha}.pdf`, sha256: sha, sizeBytes: bytes.length, created: true });
    expect(fs.existsSync(path.join(root, sha.slice(0, 2), `${sha}.pdf`))).toBe(true);
    expect(await store.exists(stored.key)).toBe(true);
    expect(Buffer.from(await store.get(stored.key)).equals(Buffer.from(bytes))).toBe(true);
  });

  it("recognises the same bytes the second time and writes nothing new", async () => {
    const store = new DiskFileStore(root);
    const bytes = makePng();
    const first = await store.put(bytes, "png");
    const second = await store.put(new Uint8Array(bytes), "png");
    expect(second.key).toBe(first.key);
    expect(second.created).toBe(false);
    expect(fs.readdirSync(path.join(root, first.sha256.slice(0, 2))).filter((f) => f.includes(first.sha256))).toHaveLength(1);
  });

  it("answers a missing key with a typed error, and removes idempotently", async () => {
    const store = new DiskFileStore(root);
    const stored = await store.put(await makePdf(2), "pdf");
    await store.remove(stored.key);
    await store.remove(stored.key);
    expect(await store.exists(stored.key)).toBe(false);
    await expect(store.get(stored.key)).rejects.toBeInstanceOf(StoredFileMissingError);
  });

  it("refuses keys that could leave the store's folder", () => {
    const sha = "a".repeat(64);
    expect(storageKey(sha, "pdf")).toBe(`aa/${sha}.pdf`);
    expect(() => assertStorageKey(`../${sha}.pdf`)).toThrow();
    expect(() => assertStorageKey(`bb/${sha}.pdf`)).toThrow();
    expect(() => new DiskFileStore(root).pathFor("../../etc/passwd")).toThrow();
    expect(() => storageKey("not-a-digest", "pdf")).toThrow();
  });
});

describe("sizes as shown in the list", () => {
  it("uses binary multiples", () => {
    expect(formatBytes(512)).toBe("512 B");
    expect(formatBytes(1536)).toBe("1.5 KB");
    expect(formatBytes(25 * 1024 * 1024)).toBe("25 MB");
  });
});
