/**
 * The documents a jurisdiction requires that a project lacks, each named so
 * the designer knows what to attach ("no datasheet for INV-1", "no storage
 * listing for BAT-1", "no site plan"). One list, read by the submittal check,
 * the packet preflight and the packet's cover, so all three say the same.
 */
import type { ProjectRecord } from "../schemas/project-record";

/** Equipment kinds a datasheet is expected for; protective devices, bus bars and panels are listed on the schedule instead. */
export const DATASHEET_KINDS: readonly string[] = ["pv-module", "charge-controller", "inverter", "inverter-charger", "hybrid-inverter", "battery", "generator", "rapid-shutdown"];

export interface DocumentOnFile {
  kind: string;
  equipmentTag?: string | null;
}

export function missingDocuments(
  record: Pick<ProjectRecord, "equipment" | "site">,
  documents: readonly DocumentOnFile[],
  required: readonly string[],
): string[] {
  const need = new Set(required);
  const missing: string[] = [];
  const has = (kind: string, tag?: string) => documents.some((d) => d.kind === kind && (tag === undefined || d.equipmentTag === tag));
  if (need.has("equipment-datasheets")) {
    for (const e of record.equipment) if (DATASHEET_KINDS.includes(e.kind) && !has("datasheet", e.tag)) missing.push(`no datasheet for ${e.tag}`);
  }
  if (need.has("storage-listing")) {
    // A listing counts for the battery it is linked to: one filed against nothing shows no reviewer which battery is listed.
    for (const e of record.equipment) {
      if (e.kind === "battery" && !has("storage-listing", e.tag)) missing.push(`no storage listing for ${e.tag}`);
    }
  }
  if (need.has("site-plan") && !has("site-plan")) missing.push("no site plan");
  // Structural letters concern the roof carrying the array.
  if (need.has("structural-letter") && record.site.mounting === "roof" && !has("structural-letter")) missing.push("no structural letter for the roof mount");
  return missing;
}
