import { createHash } from "node:crypto";
import { DeleteObjectCommand, GetObjectCommand, HeadObjectCommand, PutObjectCommand, S3Client, type S3ClientConfig } from "@aws-sdk/client-s3";
import { assertStorageKey, storageKey, StoredFileMissingError, type FileStore, type StoredFile } from "./file-store";

export interface S3StoreConfig {
  bucket: string;
  /** An S3-compatible endpoint (a local or self-hosted object store); omitted for AWS itself. */
  endpoint?: string;
  region: string;
  accessKeyId?: string;
  secretAccessKey?: string;
  /** Key prefix inside the bucket, so one bucket can hold several deployments. */
  prefix?: string;
  /** bucket.host/key or host/bucket/key; most self-hosted stores want the path form. */
  forcePathStyle?: boolean;
}

export class StoredFileCorruptError extends Error {
  constructor(readonly key: string) {
    super(`Stored file ${key} does not match its SHA-256; it was changed or damaged in storage.`);
    this.name = "StoredFileCorruptError";
  }
}

function isNotFound(error: unknown): boolean {
  const e = error as { name?: string; $metadata?: { httpStatusCode?: number } };
  return e?.name === "NoSuchKey" || e?.name === "NotFound" || e?.$metadata?.httpStatusCode === 404;
}

/**
 * Files in an S3 bucket under the same content-addressed keys as on disk, so a
 * deployment can move its files between the two by copying. The key carries
 * the SHA-256, and every read is checked against it: bytes changed in the
 * bucket are refused, never merged into a packet.
 */
export class S3FileStore implements FileStore {
  readonly client: S3Client;

  constructor(readonly config: S3StoreConfig) {
    const clientConfig: S3ClientConfig = {
      region: config.region,
      forcePathStyle: config.forcePathStyle ?? Boolean(config.endpoint),
      ...(config.endpoint ? { endpoint: config.endpoint } : {}),
      ...(config.accessKeyId && config.secretAccessKey
        ? { credentials: { accessKeyId: config.accessKeyId, secretAccessKey: config.secretAccessKey } }
        : {}),
    };
    this.client = new S3Client(clientConfig);
  }

  private objectKey(key: string): string {
    assertStorageKey(key);
    return `${this.config.prefix ?? ""}${key}`;
  }

  async put(bytes: Uint8Array, extension: string): Promise<StoredFile> {
    const sha256 = createHash("sha256").update(bytes).digest("hex");
    const key = storageKey(sha256, extension);
    if (await this.exists(key)) return { key, sha256, sizeBytes: bytes.length, created: false };
    // A put is whole or not at all in S3: a reader never sees half an object.
    await this.client.send(
      new PutObjectCommand({
        Bucket: this.config.bucket,
        Key: this.objectKey(key),
        Body: bytes,
        ContentLength: bytes.length,
        Metadata: { sha256 },
      }),
    );
    return { key, sha256, sizeBytes: bytes.length, created: true };
  }

  async get(key: string): Promise<Uint8Array> {
    let bytes: Uint8Array;
    try {
      const object = await this.client.send(new GetObjectCommand({ Bucket: this.config.bucket, Key: this.objectKey(key) }));
      bytes = await object.Body!.transformToByteArray();
    } catch (error) {
      if (isNotFound(error)) throw new StoredFileMissingError(key);
      throw error;
    }
    const expected = key.split("/")[1]!.split(".")[0]!;
    if (createHash("sha256").update(bytes).digest("hex") !== expected) throw new StoredFileCorruptError(key);
    return bytes;
  }

  async exists(key: string): Promise<boolean> {
    try {
      await this.client.send(new HeadObjectCommand({ Bucket: this.config.bucket, Key: this.objectKey(key) }));
      return true;
    } catch (error) {
      if (isNotFound(error)) return false;
      throw error;
    }
  }

  async remove(key: string): Promise<void> {
    // Deleting a key that is not there succeeds in S3, as the interface asks.
    await this.client.send(new DeleteObjectCommand({ Bucket: this.config.bucket, Key: this.objectKey(key) }));
  }
}
