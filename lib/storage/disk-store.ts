import { createHash, randomUUID } from "node:crypto";
import fs from "node:fs/promises";
import path from "node:path";
import { assertStorageKey, storageKey, StoredFileMissingError, type FileStore, type StoredFile } from "./file-store";

/** Files on the local disk under one folder (UPLOADS_DIR), as uploads/ab/abcdef….pdf. */
export class DiskFileStore implements FileStore {
  constructor(readonly root: string) {}

  pathFor(key: string): string {
    assertStorageKey(key);
    return path.join(this.root, key);
  }

  async put(bytes: Uint8Array, extension: string): Promise<StoredFile> {
    const sha256 = createHash("sha256").update(bytes).digest("hex");
    const key = storageKey(sha256, extension);
    const target = this.pathFor(key);
    if (await this.exists(key)) return { key, sha256, sizeBytes: bytes.length, created: false };
    await fs.mkdir(path.dirname(target), { recursive: true });
    // Written beside the target and renamed, so a reader never sees half a file.
    const partial = `${target}.${randomUUID()}.part`;
    try {
      await fs.writeFile(partial, bytes, { flag: "wx" });
      await fs.rename(partial, target);
    } catch (error) {
      await fs.rm(partial, { force: true });
      throw error;
    }
    return { key, sha256, sizeBytes: bytes.length, created: true };
  }

  async get(key: string): Promise<Uint8Array> {
    try {
      return new Uint8Array(await fs.readFile(this.pathFor(key)));
    } catch (error) {
      if ((error as NodeJS.ErrnoException).code === "ENOENT") throw new StoredFileMissingError(key);
      throw error;
    }
  }

  async exists(key: string): Promise<boolean> {
    try {
      return (await fs.stat(this.pathFor(key))).isFile();
    } catch {
      return false;
    }
  }

  async remove(key: string): Promise<void> {
    await fs.rm(this.pathFor(key), { force: true });
  }
}
