/**
 * Record paths in the designer's words. The record addresses a value as
 * "equipment.0.maxSystemVoltageV"; a designer knows it as "MOD-1 · max system
 * voltage", the item's tag and the field's label on the form. This module
 * reads the labels the editor itself draws (the grid columns, the ratings
 * forms, the site and project fields), so a message and the field it points
 * at always use the same words. Row numbers count from 1.
 */
import { EQUIPMENT_COLUMNS, MPPT_INPUT_COLUMNS, RATING_FIELDS } from "./equipment-fields";
import { ARRAY_COLUMN_LABELS, CIRCUIT_COLUMN_LABELS, LOAD_COLUMNS } from "./grid-columns";
import { PROJECT_FIELDS, SITE_FIELDS } from "./field-specs";

type Values = Record<string, unknown>;

const TOP: Record<string, string> = Object.fromEntries([...PROJECT_FIELDS, ...SITE_FIELDS].map((f) => [f.path, f.label]));
const EQUIPMENT_COMMON: Record<string, string> = {
  ...Object.fromEntries(EQUIPMENT_COLUMNS.map((c) => [c.key, c.header])),
  libraryItemId: "Library item",
};
const MPPT: Record<string, string> = Object.fromEntries(MPPT_INPUT_COLUMNS.map((c) => [c.key, c.header]));
const CIRCUIT: Record<string, string> = CIRCUIT_COLUMN_LABELS;
const LOAD: Record<string, string> = Object.fromEntries(LOAD_COLUMNS.map((c) => [c.key, c.header]));
const ATTACHMENT: Record<string, string> = { kind: "Kind", equipmentTag: "Equipment", fileName: "File", pageCount: "Pages", sha256: "File fingerprint" };
const GROUNDING: Record<string, string> = {
  electrodes: "Grounding electrodes",
  gecSize: "GEC size",
  gecMaterial: "GEC material",
  neutralGroundBondTag: "Neutral-to-ground bond at",
};
const JURISDICTION: Record<string, string> = {
  name: "Name",
  necEdition: "NEC edition",
  residentialCode: "Residential code",
  voltageDropLimitPct: "Voltage-drop limit",
  storageAggregateLimitKWh: "Stored-energy limit",
  requiredDocuments: "Required documents",
};
const ROW_NOUN: Record<string, string> = {
  equipment: "Equipment row",
  arrays: "Array row",
  circuits: "Circuit row",
  loads: "Load",
  attachments: "Attachment",
};
const SECTION: Record<string, string> = {
  equipment: "Equipment",
  arrays: "PV arrays",
  circuits: "Circuits",
  loads: "Loads",
  attachments: "Attachments",
  site: "Site",
  grounding: "Grounding",
  jurisdiction: "Jurisdiction",
};

/** Abbreviations that keep their capitals inside a phrase. */
const KEEP_CASE = /^(Voc|Vmp|Isc|Imp|Pmax|MPPT|PV|AC|DC|EGC|GEC|OCPD|NEC|CCCs?|Qty)$/;

/** "Max system voltage" → "max system voltage"; "Voc" and "MPPT input" keep their capitals. */
function inSentence(label: string): string {
  const [first = "", ...rest] = label.split(" ");
  if (KEEP_CASE.test(first) || /^[A-Z]{2,}/.test(first)) return label;
  return [first.charAt(0).toLowerCase() + first.slice(1), ...rest].join(" ");
}

/** A field name the form does not label, as words: "maxChargeVoltageV" → "max charge voltage". */
function words(key: string): string {
  return key
    .replace(/(PctPerC|Pct|KWh|KW|Ah|Ft|In|V|A|W|C)$/, "")
    .replace(/([a-z0-9])([A-Z])/g, "$1 $2")
    .toLowerCase();
}

function rowName(section: string, row: Values | undefined, index: number): string {
  const tag = typeof row?.tag === "string" && row.tag.trim() ? row.tag.trim() : "";
  if (tag) return tag;
  if (section === "loads" && typeof row?.name === "string" && row.name.trim()) return row.name.trim();
  if (section === "attachments" && typeof row?.fileName === "string" && row.fileName.trim()) return row.fileName.trim();
  return `${ROW_NOUN[section] ?? section} ${index + 1}`;
}

function fieldLabel(section: string, row: Values | undefined, key: string): string {
  switch (section) {
    case "equipment": {
      const kind = typeof row?.kind === "string" ? row.kind : "";
      const rating = RATING_FIELDS[kind as keyof typeof RATING_FIELDS]?.find((f) => f.key === key);
      return rating?.label ?? EQUIPMENT_COMMON[key] ?? words(key);
    }
    case "arrays":
      return ARRAY_COLUMN_LABELS[key] ?? words(key);
    case "circuits":
      return CIRCUIT[key] ?? words(key);
    case "loads":
      return LOAD[key] ?? words(key);
    case "attachments":
      return ATTACHMENT[key] ?? words(key);
    default:
      return words(key);
  }
}

/**
 * "equipment.0.maxSystemVoltageV" → "MOD-1 · max system voltage";
 * "circuits.5.toTag" → "C-6 · to"; "site.designLowTempC" → "Design low temperature".
 * `values` is the record the path was taken from, for the item's tag.
 */
export function describePath(values: unknown, path: string): string {
  const record = (values && typeof values === "object" ? values : {}) as Values;
  if (path === "(record)" || path === "") return "The project";
  if (TOP[path]) return TOP[path]!;
  const parts = path.split(".");
  const [section = "", second, third, ...rest] = parts;
  if (section === "grounding" && second) return GROUNDING[second] ?? `Grounding · ${words(second)}`;
  if (section === "jurisdiction") return second ? `Jurisdiction · ${inSentence(JURISDICTION[second] ?? words(second))}` : "Jurisdiction";
  if (section === "site" && second) return `Site · ${words(second)}`;
  const rows = record[section];
  if (!Array.isArray(rows) || second === undefined || !/^\d+$/.test(second)) {
    return SECTION[section] ?? (TOP[section] || words(section));
  }
  const index = Number(second);
  const row = rows[index] as Values | undefined;
  const name = rowName(section, row, index);
  if (third === undefined) return name;
  if (section === "equipment" && third === "mpptInputs") {
    const [inputIndex, key] = rest;
    if (inputIndex === undefined) return `${name} · MPPT inputs`;
    const input = (row?.mpptInputs as Values[] | undefined)?.[Number(inputIndex)];
    const id = typeof input?.id === "string" && input.id ? input.id : String(Number(inputIndex) + 1);
    return key ? `${name} · MPPT input ${id} · ${inSentence(MPPT[key] ?? words(key))}` : `${name} · MPPT input ${id}`;
  }
  const label = inSentence(fieldLabel(section, row, third));
  // A list inside a row ("disconnectTags.1") names the entry by its place, counted from 1.
  const entry = rest[0] !== undefined && /^\d+$/.test(rest[0]) ? ` (entry ${Number(rest[0]) + 1})` : "";
  return `${name} · ${label}${entry}`;
}

const PATH_IN_TEXT = /\b(?:equipment|arrays|circuits|loads|attachments|site|grounding|jurisdiction)(?:\.[A-Za-z0-9]+)+/g;

/** Replaces every record path inside a message with its description. */
export function humaniseText(values: unknown, text: string): string {
  return text.replace(PATH_IN_TEXT, (p) => describePath(values, p));
}

export interface RowIssues {
  /** The record path of the row (or of the field, outside rows), for focusing. */
  path: string;
  /** Every field path of the row that has a problem, first first. */
  paths: string[];
  title: string;
  /** One line per field: "to: is required". */
  problems: string[];
}

/**
 * Field errors grouped so that a half-filled row gives one entry and a field
 * one problem: the first message of each path, the fields of a row together.
 */
export function groupIssues(values: unknown, issues: { path: string; message: string }[]): RowIssues[] {
  const byPath = new Map<string, string>();
  for (const i of issues) if (!byPath.has(i.path)) byPath.set(i.path, i.message);
  const groups = new Map<string, RowIssues>();
  for (const [path, message] of byPath) {
    const m = /^(equipment|arrays|circuits|loads|attachments)\.(\d+)(?:\.(.+))?$/.exec(path);
    const rowPath = m ? `${m[1]}.${m[2]}` : path;
    const full = describePath(values, path);
    const rowTitle = m ? describePath(values, rowPath) : full;
    const field = m && m[3] ? full.slice(rowTitle.length + 3) : "";
    const g = groups.get(rowPath) ?? { path: rowPath, paths: [], title: rowTitle, problems: [] };
    g.paths.push(path);
    g.problems.push(field ? `${field} ${humaniseText(values, message)}` : humaniseText(values, message));
    groups.set(rowPath, g);
  }
  return [...groups.values()];
}
