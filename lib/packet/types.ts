import type { CheckRun } from "../compliance/types";
import type { LabelRequirement } from "../labels/types";
import type { ProjectRecord } from "../schemas/project-record";

export const SHEET_TEMPLATE_NAMES = [
  "cover",
  "general-notes",
  "site-plan",
  "one-line",
  "energy-storage",
  "calculations",
  "schedules",
  "label-schedule",
  "grounding",
  "review-record",
] as const;
export type SheetTemplateName = (typeof SHEET_TEMPLATE_NAMES)[number];

export interface PacketRevision {
  number: number;
  /** ISO 8601, supplied by the caller so rendering stays free of the clock. */
  createdAt: string;
  preparedBy: string;
  organisation: string;
  /** The contractor's licence and contact as the organisation record holds them. */
  organisationLicence?: { number: string; classification?: string; state?: string };
  organisationContact?: { phone?: string; email?: string; address?: string };
}

/** One line of the cover's revision history. */
export interface RevisionHistoryEntry {
  number: number;
  /** ISO 8601. */
  date: string;
  change: string;
  by: string;
}

export interface PacketApproval {
  reviewerName: string;
  licenceNumber: string;
  licenceState: string;
  licenceDiscipline: string;
  /** ISO 8601. */
  approvedAt: string;
  stampImage?: { bytes: Uint8Array; type: "png" | "jpeg" };
  /** The approval is bound to this hash of the revision's record snapshot. */
  recordSha256: string;
  /** The reviewer's disposition of each attest item, printed in the review record. */
  dispositions?: { item: string; disposition: "accepted" | "returned"; note: string }[];
}

export interface ReviewNote {
  /** A check result id or a sheet code. */
  target: string;
  text: string;
  author: string;
}

export interface SitePlanAttachment {
  bytes: Uint8Array;
  type: "pdf" | "png" | "jpeg";
  fileName: string;
}

export interface DatasheetAttachment {
  title: string;
  equipmentTag?: string;
  /** A PDF. */
  bytes: Uint8Array;
}

export interface PacketInput {
  record: ProjectRecord;
  run: CheckRun;
  labels: LabelRequirement[];
  revision: PacketRevision;
  approval?: PacketApproval;
  reviewNotes?: ReviewNote[];
  sitePlan?: SitePlanAttachment;
  datasheets: DatasheetAttachment[];
  /** Handlebars sources replacing the shipped sheet templates (a jurisdiction's cover letter, general notes). */
  templateOverrides?: Partial<Record<SheetTemplateName, string>>;
  /** Earlier revisions of the project and this one, oldest first. Without it the cover lists this revision alone. */
  revisionHistory?: RevisionHistoryEntry[];
}

export interface SheetPages {
  sheet: string;
  title: string;
  /** 1-based page number in the packet. */
  firstPage: number;
  pageCount: number;
}

export interface PacketPdf {
  bytes: Uint8Array;
  pageCount: number;
  sheetPages: SheetPages[];
}
