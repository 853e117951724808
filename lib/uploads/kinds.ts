import { ATTACHMENT_KINDS } from "../schemas/project-record";
import type { Role } from "../auth/roles";

export { ATTACHMENT_KINDS };
export type AttachmentKind = (typeof ATTACHMENT_KINDS)[number];
export type AcceptedMimeType = "application/pdf" | "image/png" | "image/jpeg";

export interface KindRule {
  label: string;
  /** What the file may be, checked by content. */
  accepts: readonly AcceptedMimeType[];
  /** Datasheets document one piece of project equipment; the submittal check counts them per tag. */
  equipment: "required" | "optional";
  /** The equipment kinds it may be linked to, where only some make sense (a storage listing is a battery's). */
  equipmentKinds?: readonly string[];
  hint: string;
}

const PDF = ["application/pdf"] as const;
const IMAGES = ["image/png", "image/jpeg"] as const;
const PDF_OR_IMAGE = ["application/pdf", "image/png", "image/jpeg"] as const;

/**
 * Documents go into the packet as PDF pages; photos and stamps are drawn onto
 * sheets as images; a site plan may be a drawing (PDF) or a photo of one.
 */
export const KIND_RULES: Record<AttachmentKind, KindRule> = {
  datasheet: { label: "Datasheet", accepts: PDF, equipment: "required", hint: "Manufacturer's datasheet, PDF, for one equipment tag" },
  "site-plan": { label: "Site plan", accepts: PDF_OR_IMAGE, equipment: "optional", hint: "Drawing as PDF, or a PNG/JPEG image" },
  "storage-listing": { label: "Storage listing", accepts: PDF, equipment: "required", equipmentKinds: ["battery"], hint: "Listing or certificate of one battery, PDF" },
  "structural-letter": { label: "Structural letter", accepts: PDF, equipment: "optional", hint: "Engineer's letter, PDF" },
  "attachment-detail": { label: "Footing or attachment detail", accepts: PDF, equipment: "optional", hint: "Footing, pier or roof attachment drawing, PDF" },
  photo: { label: "Photo", accepts: IMAGES, equipment: "optional", hint: "PNG or JPEG, e.g. a nameplate or a placed label" },
  stamp: { label: "Stamp image", accepts: IMAGES, equipment: "optional", hint: "Reviewer's stamp, PNG or JPEG" },
  other: { label: "Other", accepts: PDF_OR_IMAGE, equipment: "optional", hint: "PDF, PNG or JPEG" },
};

/**
 * Which kinds each role attaches. Installers add site photos; reviewers add
 * stamps and marked-up sets; the packet's documents come from the designer.
 */
export const KINDS_BY_ROLE: Record<Role, readonly AttachmentKind[]> = {
  designer: ATTACHMENT_KINDS,
  reviewer: ["stamp", "photo", "other"],
  installer: ["photo"],
  office: [],
  admin: [],
};

export function kindsForRoles(roles: readonly Role[]): AttachmentKind[] {
  return ATTACHMENT_KINDS.filter((kind) => roles.some((role) => KINDS_BY_ROLE[role].includes(kind)));
}

/** "a PDF", "a PNG or JPEG image", "a PDF, PNG or JPEG file": what a kind must be, for messages. */
export function describeAccepted(kind: AttachmentKind): string {
  const accepts = KIND_RULES[kind].accepts;
  const pdf = accepts.includes("application/pdf");
  const images = accepts.includes("image/png");
  if (pdf && images) return "a PDF, PNG or JPEG file";
  return pdf ? "a PDF" : "a PNG or JPEG image";
}

