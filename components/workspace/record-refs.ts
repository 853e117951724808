/**
 * Where a tag is used across the record, so renaming an item renames every
 * reference to it and deleting one can first name what points at it. Pure:
 * takes and returns plain record values.
 */
import { describePath } from "./record-labels";

type Row = Record<string, unknown>;
type Values = Record<string, unknown>;

/** Fields that hold one tag, per row list. */
const SINGLE_REFS: Record<string, readonly string[]> = {
  arrays: ["moduleTag", "feedsTag"],
  circuits: ["fromTag", "toTag", "arrayTag", "ocpdTag", "buildingDisconnectTag"],
  attachments: ["equipmentTag"],
  equipment: ["locatedAtTag"],
};
/** Fields that hold a list of tags. */
const LIST_REFS: Record<string, readonly string[]> = { circuits: ["disconnectTags"] };

export interface Referrer {
  /** Record path of the field that holds the tag, e.g. "circuits.2.fromTag" or "circuits.2.disconnectTags". */
  path: string;
  /** "C-3 · from", in the designer's words. */
  label: string;
}

/** Every field of the record that names `tag`, in record order. */
export function referrersOf(values: Values, tag: string): Referrer[] {
  if (!tag) return [];
  const out: Referrer[] = [];
  for (const section of ["equipment", "arrays", "circuits", "attachments"]) {
    const rows = (values[section] ?? []) as Row[];
    rows.forEach((row, i) => {
      for (const key of SINGLE_REFS[section] ?? []) if (row?.[key] === tag) out.push({ path: `${section}.${i}.${key}`, label: describePath(values, `${section}.${i}.${key}`) });
      for (const key of LIST_REFS[section] ?? []) {
        const list = row?.[key];
        if (Array.isArray(list) && list.includes(tag)) out.push({ path: `${section}.${i}.${key}`, label: describePath(values, `${section}.${i}.${key}`) });
      }
    });
  }
  const grounding = values.grounding as Row | undefined;
  if (grounding?.neutralGroundBondTag === tag) out.push({ path: "grounding.neutralGroundBondTag", label: describePath(values, "grounding.neutralGroundBondTag") });
  return out;
}

/**
 * The record with every reference to `from` pointing at `to` instead; `to`
 * undefined removes the reference (an optional field is cleared, a required
 * one left empty for the designer to choose, a list entry dropped).
 */
export function repointReferences(values: Values, from: string, to: string | undefined): Values {
  const next: Values = { ...values };
  for (const section of ["equipment", "arrays", "circuits", "attachments"]) {
    const rows = values[section];
    if (!Array.isArray(rows)) continue;
    next[section] = (rows as Row[]).map((row) => {
      let copy: Row | undefined;
      const edit = () => (copy ??= { ...row });
      for (const key of SINGLE_REFS[section] ?? []) {
        if (row?.[key] !== from) continue;
        const required = key === "fromTag" || key === "toTag" || key === "moduleTag" || key === "feedsTag";
        edit()[key] = to ?? (required ? "" : undefined);
      }
      for (const key of LIST_REFS[section] ?? []) {
        const list = row?.[key];
        if (!Array.isArray(list) || !list.includes(from)) continue;
        edit()[key] = to === undefined ? list.filter((t) => t !== from) : [...new Set(list.map((t) => (t === from ? to : t)))];
      }
      return copy ?? row;
    });
  }
  const grounding = values.grounding as Row | undefined;
  if (grounding?.neutralGroundBondTag === from) next.grounding = { ...grounding, neutralGroundBondTag: to };
  return next;
}
