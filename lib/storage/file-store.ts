/**
 * Where uploaded bytes live, addressed by their SHA-256. The same bytes are
 * stored once however many projects attach them. A store for another medium
 * (object storage, say) implements this and is installed with useFileStore.
 */
export interface FileStore {
  /** Stores the bytes (a no-op when already there) and answers their key and digest. */
  put(bytes: Uint8Array, extension: string): Promise<StoredFile>;
  /** The bytes under a key; throws StoredFileMissingError when there are none. */
  get(key: string): Promise<Uint8Array>;
  exists(key: string): Promise<boolean>;
  /** Removes the bytes; a missing key is not an error. */
  remove(key: string): Promise<void>;
}

export interface StoredFile {
  key: string;
  sha256: string;
  sizeBytes: number;
  /** False when identical bytes were stored already. */
  created: boolean;
}

export class StoredFileMissingError extends Error {
  constructor(readonly key: string) {
    super(`Stored file ${key} is missing.`);
    this.name = "StoredFileMissingError";
  }
}

const SHA256_HEX = /^[0-9a-f]{64}$/;
const EXTENSION = /^[a-z0-9]{1,8}$/;

/** "ab/abcdef….pdf": two hex digits of fan-out keep any one folder small. */
export function storageKey(sha256: string, extension: string): string {
  if (!SHA256_HEX.test(sha256)) throw new Error(`not a SHA-256 digest: ${sha256}`);
  if (!EXTENSION.test(extension)) throw new Error(`not a file extension: ${extension}`);
  return `${sha256.slice(0, 2)}/${sha256}.${extension}`;
}

const KEY = /^([0-9a-f]{2})\/([0-9a-f]{64})\.([a-z0-9]{1,8})$/;

/** Refuses anything that is not a key storageKey makes, so a key never walks out of the store's folder. */
export function assertStorageKey(key: string): void {
  const match = KEY.exec(key);
  if (!match || match[2]!.slice(0, 2) !== match[1]) throw new Error(`not a storage key: ${key}`);
}

export function extensionForMime(mimeType: string): string {
  switch (mimeType) {
    case "application/pdf":
      return "pdf";
    case "image/png":
      return "png";
    case "image/jpeg":
      return "jpg";
    default:
      throw new Error(`no stored extension for ${mimeType}`);
  }
}
