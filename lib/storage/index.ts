import { env, resolvePath } from "../env";
import { DiskFileStore } from "./disk-store";
import type { FileStore } from "./file-store";
import { S3FileStore } from "./s3-store";

export { DiskFileStore } from "./disk-store";
export { S3FileStore, StoredFileCorruptError, type S3StoreConfig } from "./s3-store";
export { assertStorageKey, extensionForMime, storageKey, StoredFileMissingError, type FileStore, type StoredFile } from "./file-store";

let current: FileStore | undefined;

/** The configured store (STORAGE_BACKEND): the UPLOADS_DIR folder or an S3 bucket. */
export function configuredFileStore(): FileStore {
  const e = env();
  if (e.STORAGE_BACKEND === "disk") return new DiskFileStore(resolvePath(e.UPLOADS_DIR));
  if (!e.S3_BUCKET) throw new Error("STORAGE_BACKEND=s3 needs S3_BUCKET");
  return new S3FileStore({
    bucket: e.S3_BUCKET,
    region: e.S3_REGION,
    prefix: e.S3_PREFIX,
    ...(e.S3_ENDPOINT ? { endpoint: e.S3_ENDPOINT } : {}),
    ...(e.S3_ACCESS_KEY_ID ? { accessKeyId: e.S3_ACCESS_KEY_ID } : {}),
    ...(e.S3_SECRET_ACCESS_KEY ? { secretAccessKey: e.S3_SECRET_ACCESS_KEY } : {}),
    ...(e.S3_FORCE_PATH_STYLE ? { forcePathStyle: e.S3_FORCE_PATH_STYLE === "true" } : {}),
  });
}

/** The store uploads go to: the configured one unless another was installed. */
export function fileStore(): FileStore {
  current ??= configuredFileStore();
  return current;
}

/** Installs another store (tests, or a deployment that keeps files elsewhere); undefined restores the default. */
export function setFileStore(store: FileStore | undefined): void {
  current = store;
}
