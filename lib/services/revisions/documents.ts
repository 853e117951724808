import "server-only";
import { missingDocuments as missingOnFile } from "../../compliance/documents";
import type { ProjectRecord } from "../../schemas/project-record";
import type { RequiredDocument } from "../../schemas/vocabulary";

/** The attachment fields the packet's document selection reads. */
export interface DocumentRef {
  id: string;
  kind: string;
  equipmentTag: string | null;
  fileName: string;
  mimeType: string;
  createdAt: string;
}

export interface PacketDocuments {
  sitePlan: DocumentRef | null;
  /** PDFs merged after the sheets, in this order. */
  merged: DocumentRef[];
  /** Attachment ids in packet order: the site plan, then the merged PDFs. */
  attachmentIds: string[];
}

const MERGED_KINDS = ["datasheet", "storage-listing", "structural-letter", "attachment-detail"] as const;

/**
 * Chooses the documents a packet carries: the newest site plan, then the
 * datasheets in the equipment schedule's order, then storage listings and
 * structural letters, so the merged pages read in the order the sheets
 * mention them.
 */
export function selectPacketDocuments(record: ProjectRecord, attachments: readonly DocumentRef[]): PacketDocuments {
  const sitePlans = attachments.filter((a) => a.kind === "site-plan");
  const sitePlan = sitePlans.length ? [...sitePlans].sort((a, b) => a.createdAt.localeCompare(b.createdAt)).at(-1)! : null;
  const order = new Map(record.equipment.map((e, i) => [e.tag, i]));
  const rank = (a: DocumentRef) => (a.equipmentTag != null && order.has(a.equipmentTag) ? order.get(a.equipmentTag)! : Number.MAX_SAFE_INTEGER);
  const merged: DocumentRef[] = [];
  for (const kind of MERGED_KINDS) {
    const ofKind = attachments
      .map((a, i) => ({ a, i }))
      .filter(({ a }) => a.kind === kind && a.mimeType === "application/pdf")
      .sort((x, y) => rank(x.a) - rank(y.a) || x.i - y.i)
      .map(({ a }) => a);
    merged.push(...ofKind);
  }
  return { sitePlan, merged, attachmentIds: [...(sitePlan ? [sitePlan.id] : []), ...merged.map((m) => m.id)] };
}

/** How a merged document is titled in the sheet index and on its page margins. */
export function documentTitle(record: ProjectRecord, doc: Pick<DocumentRef, "kind" | "equipmentTag" | "fileName">): string {
  const equipment = doc.equipmentTag ? record.equipment.find((e) => e.tag === doc.equipmentTag) : undefined;
  const model = equipment ? [equipment.manufacturer, equipment.model].filter(Boolean).join(" ") : "";
  switch (doc.kind) {
    case "datasheet":
      return model ? `${model} datasheet` : `Datasheet, ${doc.fileName}`;
    case "storage-listing":
      return model ? `${model} storage listing` : `Storage listing, ${doc.fileName}`;
    case "structural-letter":
      return `Structural letter, ${doc.fileName}`;
    case "attachment-detail":
      return `Footing or attachment detail, ${doc.fileName}`;
    default:
      return doc.fileName;
  }
}

/** Each required document the project lacks, as the submittal check names it. */
export function missingDocuments(record: ProjectRecord, attachments: readonly DocumentRef[], required: readonly RequiredDocument[]): string[] {
  return missingOnFile(record, attachments, required);
}
