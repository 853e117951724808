import { create, type Delta } from "jsondiffpatch";

/**
 * What changed between two project records (or two check runs), as a reader
 * wants it: field by field, old → new, grouped by the item they belong to
 * ("Circuit C-2: size 10 → 8"). Items of a list are matched by their tag (or
 * id, or name), so inserting a circuit does not read as every later circuit
 * changing. Pure: no clock, no database.
 */

export type ChangeKind = "added" | "removed" | "changed";

export interface FieldChange {
  /** The item the field belongs to: "Site", "Circuit C-2", "Attachment site-plan.pdf". */
  group: string;
  /** The field within the item, dotted ("conditions.ambientC"); empty when the whole item came or went. */
  field: string;
  kind: ChangeKind;
  before: unknown;
  after: unknown;
}

export interface ChangeGroup {
  group: string;
  changes: FieldChange[];
}

/** Words for the record's lists and sections. */
const SECTION_WORDS: Record<string, string> = {
  site: "Site",
  jurisdiction: "Jurisdiction",
  grounding: "Grounding",
  equipment: "Equipment",
  arrays: "Array",
  circuits: "Circuit",
  loads: "Load",
  attachments: "Attachment",
  results: "Check",
  electrodes: "Electrode",
};

function itemKey(item: unknown): string | undefined {
  if (!item || typeof item !== "object") return undefined;
  const o = item as Record<string, unknown>;
  for (const k of ["tag", "id", "sha256", "name", "fileName"]) if (typeof o[k] === "string" && o[k]) return `${k}:${o[k] as string}`;
  return undefined;
}

function itemName(item: unknown, index: number): string {
  if (!item || typeof item !== "object") return `#${index + 1}`;
  const o = item as Record<string, unknown>;
  for (const k of ["tag", "id", "name", "fileName"]) if (typeof o[k] === "string" && o[k]) return o[k] as string;
  return `#${index + 1}`;
}

const differ = create({
  objectHash: (item, index) => itemKey(item) ?? `#${index ?? 0}`,
  arrays: { detectMove: false },
});

type Path = { key: string; group?: string }[];

function groupAndField(path: Path): { group: string; field: string } {
  // The innermost list item names the group; the keys after it are the field.
  let last = -1;
  for (let i = 0; i < path.length; i++) if (path[i]!.group) last = i;
  if (last < 0) {
    const top = path[0]?.key ?? "";
    if (path.length > 1 && SECTION_WORDS[top]) return { group: SECTION_WORDS[top]!, field: path.slice(1).map((p) => p.key).join(".") };
    return { group: "Project", field: path.map((p) => p.key).join(".") };
  }
  return { group: path[last]!.group!, field: path.slice(last + 1).map((p) => p.key).join(".") };
}

function walk(delta: Delta, before: unknown, after: unknown, path: Path, out: FieldChange[]): void {
  if (delta === undefined) return;
  if (Array.isArray(delta)) {
    const { group, field } = groupAndField(path);
    if (delta.length === 1) out.push({ group, field, kind: "added", before: undefined, after: delta[0] });
    else if (delta.length === 2) out.push({ group, field, kind: "changed", before: delta[0], after: delta[1] });
    else if (delta.length === 3 && delta[2] === 0) out.push({ group, field, kind: "removed", before: delta[0], after: undefined });
    return;
  }
  const d = delta as Record<string, Delta>;
  if ((d._t as unknown) === "a") {
    const section = path.at(-1)?.key ?? "";
    const word = SECTION_WORDS[section] ?? section;
    const beforeList = Array.isArray(before) ? before : [];
    const afterList = Array.isArray(after) ? after : [];
    for (const [k, sub] of Object.entries(d)) {
      if (k === "_t") continue;
      const removed = k.startsWith("_");
      const index = Number(removed ? k.slice(1) : k);
      const item = removed ? beforeList[index] : afterList[index];
      const name = `${word} ${itemName(item, index)}`;
      const subPath = [...path, { key: String(index), group: name }];
      if (Array.isArray(sub) && (sub.length === 1 || (sub.length === 3 && sub[2] === 0))) {
        walk(sub, undefined, undefined, subPath, out);
        continue;
      }
      // A changed item: its old self is found by key in the old list.
      const key = itemKey(item);
      const old = key ? beforeList.find((b) => itemKey(b) === key) : beforeList[index];
      walk(sub, old, item, subPath, out);
    }
    return;
  }
  for (const [k, sub] of Object.entries(d)) {
    walk(sub, (before as Record<string, unknown> | undefined)?.[k], (after as Record<string, unknown> | undefined)?.[k], [...path, { key: k }], out);
  }
}

/** Every field that differs between `before` and `after`, in record order. */
export function diffValues(before: unknown, after: unknown): FieldChange[] {
  const delta = differ.diff(before, after);
  const out: FieldChange[] = [];
  walk(delta, before, after, [], out);
  return out;
}

/** The changes gathered under the item they belong to, in the order the items first appear. */
export function groupChanges(changes: readonly FieldChange[]): ChangeGroup[] {
  const groups = new Map<string, FieldChange[]>();
  for (const c of changes) {
    const list = groups.get(c.group) ?? [];
    list.push(c);
    groups.set(c.group, list);
  }
  return [...groups.entries()].map(([group, list]) => ({ group, changes: list }));
}

/** A value as one line of text: "10", "copper", "(none)", or a short summary of an item. */
export function formatValue(value: unknown): string {
  if (value === undefined || value === null || value === "") return "(none)";
  if (typeof value === "string") return value;
  if (typeof value === "number" || typeof value === "boolean") return String(value);
  if (Array.isArray(value)) return value.map(formatValue).join(", ") || "(none)";
  const name = itemKey(value);
  if (name) return name.slice(name.indexOf(":") + 1);
  return JSON.stringify(value);
}

/** "C-2 size: 10 → 8", one line per change; what a reviewer or an e-mail reads. */
export function describeChange(c: FieldChange): string {
  const where = c.field ? `${c.group} ${c.field}` : c.group;
  if (c.kind === "added") return `${where}: added${c.field ? ` ${formatValue(c.after)}` : ""}`;
  if (c.kind === "removed") return `${where}: removed${c.field ? ` (was ${formatValue(c.before)})` : ""}`;
  return `${where}: ${formatValue(c.before)} → ${formatValue(c.after)}`;
}

/**
 * The part of a project record that an approval covers: the design, without
 * the installer's photos, which document the work and do not change it.
 */
export function designOf<T extends { attachments?: { kind: string }[] }>(record: T): T {
  return { ...record, attachments: (record.attachments ?? []).filter((a) => a.kind !== "photo") };
}

/** A check result as the diff reads it. */
export interface ResultLike {
  id: string;
  title: string;
  subject?: string | null;
  status: string;
  values: { key: string; label: string; value: number | string | boolean; unit: string }[];
}

export interface ResultChange {
  id: string;
  title: string;
  subject: string | null;
  kind: ChangeKind;
  statusBefore: string | null;
  statusAfter: string | null;
  /** Values whose figure changed, old → new, with their unit. */
  values: { label: string; before: string; after: string }[];
}

const valueText = (v: { value: number | string | boolean; unit: string } | undefined) => (v === undefined ? "(none)" : `${v.value}${v.unit ? ` ${v.unit}` : ""}`);

/**
 * Check results whose status or values changed between two runs, matched by
 * result id ("ampacity:C-2"); results that appear or disappear are listed as
 * added or removed. Results that read the same are left out.
 */
export function diffResults(before: readonly ResultLike[], after: readonly ResultLike[]): ResultChange[] {
  const old = new Map(before.map((r) => [r.id, r]));
  const now = new Map(after.map((r) => [r.id, r]));
  const out: ResultChange[] = [];
  for (const r of after) {
    const o = old.get(r.id);
    if (!o) {
      out.push({ id: r.id, title: r.title, subject: r.subject ?? null, kind: "added", statusBefore: null, statusAfter: r.status, values: [] });
      continue;
    }
    const keys = [...new Set([...o.values.map((v) => v.key), ...r.values.map((v) => v.key)])];
    const values = keys
      .map((k) => {
        const a = o.values.find((v) => v.key === k);
        const b = r.values.find((v) => v.key === k);
        return { label: (b ?? a)!.label, before: valueText(a), after: valueText(b) };
      })
      .filter((v) => v.before !== v.after);
    if (o.status !== r.status || values.length) {
      out.push({ id: r.id, title: r.title, subject: r.subject ?? null, kind: "changed", statusBefore: o.status, statusAfter: r.status, values });
    }
  }
  for (const o of before) {
    if (!now.has(o.id)) out.push({ id: o.id, title: o.title, subject: o.subject ?? null, kind: "removed", statusBefore: o.status, statusAfter: null, values: [] });
  }
  return out;
}
