import "server-only";
import { createHash } from "node:crypto";
import { requirePermission, type ServiceContext } from "../context";
import { conflict, notFound } from "../errors";
import { packetsRoot, readPacketFile } from "./packet-files";
import { findRevisionInOrg } from "./view";

export const PACKET_CONTENT_TYPES = {
  pdf: "application/pdf",
  docx: "application/vnd.openxmlformats-officedocument.wordprocessingml.document",
} as const;

/** "ferncliff-farmhouse-rev3.pdf": letters, digits and dashes, so every browser and file system takes it. */
export function packetFileName(projectName: string, number: number, kind: "pdf" | "docx"): string {
  const slug = projectName
    .normalize("NFKD")
    .replace(/[^\w\s-]/g, "")
    .trim()
    .toLowerCase()
    .replace(/[\s_]+/g, "-")
    .replace(/-+/g, "-")
    .slice(0, 80);
  return `${slug || "packet"}-rev${number}.${kind}`;
}

export interface PacketDownload {
  bytes: Uint8Array;
  fileName: string;
  contentType: string;
  sha256: string;
}

/**
 * A ready revision's PDF or DOCX, checked against the SHA-256 recorded when
 * it was generated, so what is downloaded is what was reviewed.
 */
export async function getRevisionFile(ctx: ServiceContext, revisionId: string, kind: "pdf" | "docx", options: { packetsDir?: string } = {}): Promise<PacketDownload> {
  requirePermission(ctx, "packet:read", "read packets");
  const { row } = findRevisionInOrg(ctx, revisionId);
  if (row.state === "generating") throw conflict(`Revision ${row.number} is still being generated.`);
  if (row.state === "failed") throw notFound(`The ${kind.toUpperCase()} of failed revision ${row.number}`);
  const key = kind === "pdf" ? row.pdfPath : row.docxPath;
  const expected = kind === "pdf" ? row.pdfSha256 : row.docxSha256;
  if (!key || !expected) throw notFound(`The ${kind.toUpperCase()} of revision ${row.number}`);
  const bytes = await readPacketFile(options.packetsDir ?? packetsRoot(), key);
  if (!bytes) throw notFound(`The stored ${kind.toUpperCase()} of revision ${row.number}`);
  if (createHash("sha256").update(bytes).digest("hex") !== expected) {
    throw conflict(`The stored ${kind.toUpperCase()} of revision ${row.number} no longer matches its SHA-256; generate a new revision.`);
  }
  const name = typeof row.recordSnapshot?.name === "string" ? row.recordSnapshot.name : "packet";
  return { bytes, fileName: packetFileName(name, row.number, kind), contentType: PACKET_CONTENT_TYPES[kind], sha256: expected };
}
