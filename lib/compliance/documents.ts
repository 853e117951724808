/**
 * The documents a jurisdiction requires, item by item, and which of them a
 * project lacks, each named so the designer knows what to attach ("no
 * datasheet for INV-1", "no storage listing for BAT-1", "no site plan"). One
 * list, read by the submittal check, the packet preflight, the packet's cover
 * and the attachments page, so all four say the same.
 */
import type { ProjectRecord } from "../schemas/project-record";
import type { RequiredDocument } from "../schemas/vocabulary";

/** Equipment kinds a datasheet is expected for; protective devices, bus bars and panels are listed on the schedule instead. */
export const DATASHEET_KINDS: readonly string[] = ["pv-module", "charge-controller", "inverter", "inverter-charger", "hybrid-inverter", "battery", "generator", "rapid-shutdown"];

export interface DocumentOnFile {
  kind: string;
  equipmentTag?: string | null;
}

/** One document the jurisdiction asks for. */
export interface ChecklistEntry {
  document: RequiredDocument;
  /** The item in a list: "Datasheet", "Storage listing", "Site plan", "Structural letter". */
  label: string;
  /** The equipment it is for, where it is for one piece. */
  tag?: string;
  attached: boolean;
  /** What the submittal check says while it is not attached. */
  missing: string;
}

export function documentChecklist(
  record: Pick<ProjectRecord, "equipment" | "site">,
  documents: readonly DocumentOnFile[],
  required: readonly string[],
): ChecklistEntry[] {
  const need = new Set(required);
  const items: ChecklistEntry[] = [];
  const has = (kind: string, tag?: string) => documents.some((d) => d.kind === kind && (tag === undefined || d.equipmentTag === tag));
  if (need.has("equipment-datasheets")) {
    for (const e of record.equipment) {
      if (!DATASHEET_KINDS.includes(e.kind)) continue;
      items.push({ document: "equipment-datasheets", label: "Datasheet", tag: e.tag, attached: has("datasheet", e.tag), missing: `no datasheet for ${e.tag}` });
    }
  }
  if (need.has("storage-listing")) {
    // A listing counts for the battery it is linked to: one filed against nothing shows no reviewer which battery is listed.
    for (const e of record.equipment) {
      if (e.kind !== "battery") continue;
      items.push({ document: "storage-listing", label: "Storage listing", tag: e.tag, attached: has("storage-listing", e.tag), missing: `no storage listing for ${e.tag}` });
    }
  }
  if (need.has("site-plan")) items.push({ document: "site-plan", label: "Site plan", attached: has("site-plan"), missing: "no site plan" });
  // Structural letters concern the roof carrying the array.
  if (need.has("structural-letter") && record.site.mounting === "roof") {
    items.push({ document: "structural-letter", label: "Structural letter", attached: has("structural-letter"), missing: "no structural letter for the roof mount" });
  }
  return items;
}

export function missingDocuments(
  record: Pick<ProjectRecord, "equipment" | "site">,
  documents: readonly DocumentOnFile[],
  required: readonly string[],
): string[] {
  return documentChecklist(record, documents, required)
    .filter((i) => !i.attached)
    .map((i) => i.missing);
}
