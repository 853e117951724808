import "server-only";
import { createHash, randomUUID } from "node:crypto";
import fs from "node:fs/promises";
import path from "node:path";
import { env, resolvePath } from "../../env";

/**
 * Generated packets live under PACKETS_DIR by their own SHA-256
 * ("ab/abcdef….pdf"), so the file a reviewer approved is the file the hash in
 * the revision row names, and identical bytes are stored once.
 */
export type PacketFileKind = "pdf" | "docx";

const KEY = /^([0-9a-f]{2})\/([0-9a-f]{64})\.(pdf|docx)$/;

export function packetsRoot(): string {
  return resolvePath(env().PACKETS_DIR);
}

export function packetKey(sha256: string, kind: PacketFileKind): string {
  return `${sha256.slice(0, 2)}/${sha256}.${kind}`;
}

/** Refuses anything that is not a key packetKey makes, so a stored path never walks out of the folder. */
export function packetPath(root: string, key: string): string {
  const match = KEY.exec(key);
  if (!match || match[2]!.slice(0, 2) !== match[1]) throw new Error(`not a packet file key: ${key}`);
  return path.join(root, key);
}

export interface WrittenPacketFile {
  key: string;
  sha256: string;
  /** False when identical bytes were there already (another revision may own them). */
  created: boolean;
}

export async function writePacketFile(root: string, bytes: Uint8Array, kind: PacketFileKind): Promise<WrittenPacketFile> {
  const sha256 = createHash("sha256").update(bytes).digest("hex");
  const key = packetKey(sha256, kind);
  const target = packetPath(root, key);
  try {
    if ((await fs.stat(target)).isFile()) return { key, sha256, created: false };
  } catch {
    // not there yet
  }
  await fs.mkdir(path.dirname(target), { recursive: true });
  // Written beside the target and renamed, so a download never sees half a file.
  const partial = `${target}.${randomUUID()}.part`;
  try {
    await fs.writeFile(partial, bytes, { flag: "wx" });
    await fs.rename(partial, target);
  } catch (error) {
    await fs.rm(partial, { force: true });
    throw error;
  }
  return { key, sha256, created: true };
}

export async function readPacketFile(root: string, key: string): Promise<Uint8Array | null> {
  try {
    return new Uint8Array(await fs.readFile(packetPath(root, key)));
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code === "ENOENT") return null;
    throw error;
  }
}

export async function removePacketFile(root: string, key: string): Promise<void> {
  await fs.rm(packetPath(root, key), { force: true });
}
