import type { Block } from "./markup";
import type { SheetTemplateName } from "./types";

export type SheetKind =
  | "cover"
  | "general-notes"
  | "site-plan"
  | "one-line"
  | "energy-storage"
  | "calculations"
  | "conductor-schedule"
  | "equipment-schedule"
  | "label-schedule"
  | "grounding"
  | "review-record";

export interface Sheet {
  code: string;
  title: string;
  kind: SheetKind;
  /** Text columns on a 17 in sheet; tables and figures span them all. */
  columns: 1 | 2 | 3;
  blocks: Block[];
}

export interface PacketDatasheet {
  code: string;
  title: string;
  equipmentTag?: string;
  bytes: Uint8Array;
}

export interface PacketMarking {
  approved: boolean;
  /** Printed on every page of an unapproved revision. */
  reviewText: string;
  /** Printed on every page of an approved revision. */
  approvalLines: string[];
  footer: string;
}

export interface PacketModel {
  titleBlock: {
    firm: string;
    /** The contractor's licence, from the organisation record ("" when not recorded). */
    firmLicence: string;
    firmContact: string;
    preparedBy: string;
    project: string;
    client: string;
    address: string;
    jurisdiction: string;
    edition: string;
    revision: string;
    date: string;
  };
  sheets: Sheet[];
  datasheets: PacketDatasheet[];
  marking: PacketMarking;
  draft: { isDraft: boolean; reasons: string[] };
  missingDocuments: string[];
}

export const REVIEW_MARKING = "PREPARED FOR REVIEW BY A LICENSED PROFESSIONAL — NOT FOR CONSTRUCTION UNTIL STAMPED";
export const AHJ_FOOTER = "Local codes and the Authority Having Jurisdiction govern.";

/** Sheet list in packet order: the index, the page headers and both writers read it. */
export const SHEET_PLAN: { code: string; title: string; kind: SheetKind; template: SheetTemplateName; columns: 1 | 2 | 3 }[] = [
  { code: "G-001", title: "Cover sheet and sheet index", kind: "cover", template: "cover", columns: 2 },
  { code: "G-002", title: "General notes and cautions", kind: "general-notes", template: "general-notes", columns: 3 },
  { code: "G-003", title: "Site plan and equipment locations", kind: "site-plan", template: "site-plan", columns: 1 },
  { code: "E-001", title: "One-line diagram", kind: "one-line", template: "one-line", columns: 1 },
  { code: "E-002", title: "Energy storage", kind: "energy-storage", template: "energy-storage", columns: 1 },
  { code: "E-003", title: "Calculations", kind: "calculations", template: "calculations", columns: 3 },
  { code: "E-004", title: "Conductor and overcurrent schedule", kind: "conductor-schedule", template: "schedules", columns: 1 },
  { code: "E-005", title: "Equipment schedule", kind: "equipment-schedule", template: "schedules", columns: 1 },
  { code: "E-006", title: "Label schedule", kind: "label-schedule", template: "label-schedule", columns: 1 },
  { code: "E-007", title: "Grounding and bonding", kind: "grounding", template: "grounding", columns: 1 },
  { code: "G-004", title: "Review record", kind: "review-record", template: "review-record", columns: 2 },
];
