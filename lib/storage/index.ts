import { env, resolvePath } from "../env";
import { DiskFileStore } from "./disk-store";
import type { FileStore } from "./file-store";

export { DiskFileStore } from "./disk-store";
export { assertStorageKey, extensionForMime, storageKey, StoredFileMissingError, type FileStore, type StoredFile } from "./file-store";

let current: FileStore | undefined;

/** The store uploads go to: the disk folder UPLOADS_DIR unless another was installed. */
export function fileStore(): FileStore {
  current ??= new DiskFileStore(resolvePath(env().UPLOADS_DIR));
  return current;
}

/** Installs another store (tests, or a deployment that keeps files elsewhere); undefined restores the default. */
export function setFileStore(store: FileStore | undefined): void {
  current = store;
}
