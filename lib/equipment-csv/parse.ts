/**
 * Reads an equipment library CSV: one `kind` column, `manufacturer`, `model`,
 * and one column per rating named exactly as the schema field, the unit in the
 * name (`vocV`, `iscA`, `tempCoeffVocPctPerC`). Values are numbers only: a
 * unit in a header or a value is refused with the row, the column and the
 * expected form, because a misread unit is a wrong rating on a permit set.
 * Pure: text in, rows out; the service writes what was taken.
 */
import Papa from "papaparse";
import {
  EQUIPMENT_KINDS,
  KIND_LABELS,
  librarySchemaForKind,
  mpptInputFields,
  ratingFieldsForKind,
  unitOfField,
  type LibraryItemData,
  type RatingField,
} from "../schemas/library-item";
import type { EquipmentKind } from "../schemas/project-record";
import { inUnit, readNumberCell, type Read } from "./cells";

export { readNumberCell };

export const REQUIRED_COLUMNS = ["kind", "manufacturer", "model"] as const;
/** One request, one transaction: a library file is tens to hundreds of rows. */
export const MAX_ROWS = 2000;
/** Hybrid inverters carry one to four PV inputs; eight leaves room. */
export const MAX_MPPT_INPUTS = 8;

export interface RowProblem {
  column: string;
  message: string;
  /** The whole sentence, e.g. `row 4, vocV: write the number only, in volts`. */
  text: string;
}

export interface ParsedRow {
  /** Row as a spreadsheet numbers it: the header is row 1. */
  row: number;
  kind: string;
  manufacturer: string;
  model: string;
  /** Present when the row is valid. */
  item?: LibraryItemData;
  problems: RowProblem[];
}

export type CsvParseResult =
  | { ok: true; columns: string[]; rows: ParsedRow[] }
  | { ok: false; message: string; missingColumns: string[]; columnProblems: { column: string; message: string }[] };

const KIND_SET: ReadonlySet<string> = new Set(EQUIPMENT_KINDS);
const MPPT_COLUMN = /^mpptInputs\.(\d+)\.([A-Za-z]+)$/;

/** Every column name the import knows, keyed by lower case so `Kind` or `VOCV` still land. */
function knownColumns(): Map<string, string> {
  const names = new Map<string, string>();
  for (const c of REQUIRED_COLUMNS) names.set(c, c);
  for (const kind of EQUIPMENT_KINDS) {
    for (const f of ratingFieldsForKind(kind)) if (f.type !== "mppt-inputs") names.set(f.name.toLowerCase(), f.name);
  }
  for (let n = 1; n <= MAX_MPPT_INPUTS; n++) {
    for (const f of mpptInputFields()) names.set(`mpptinputs.${n}.${f.name.toLowerCase()}`, `mpptInputs.${n}.${f.name}`);
  }
  return names;
}

let known: Map<string, string> | undefined;
const KNOWN = () => (known ??= knownColumns());

const stem = (s: string) => s.replace(/[([{].*?[)\]}]/g, "").replace(/[^A-Za-z0-9]/g, "").toLowerCase();

/** The column a header most likely meant ("Voc (V)" → vocV), for the refusal's suggestion. */
function suggestColumn(header: string): string | undefined {
  const wanted = stem(header);
  if (!wanted) return undefined;
  for (const name of KNOWN().values()) {
    if (name.includes(".")) continue;
    const bare = name.slice(0, name.length - unitOfField(name).suffix.length);
    if (bare.toLowerCase() === wanted || name.toLowerCase() === wanted) return name;
  }
  return undefined;
}

const looksLikeUnitInHeader = (h: string) => /[([{]/.test(h) || /\s(v|a|w|kw|kwh|ah|%|°c|ft|in)$/i.test(h.trim());

interface HeaderPlan {
  columns: (string | null)[];
  problems: { column: string; message: string }[];
}

function readHeader(header: string[], body: string[][]): HeaderPlan {
  const columns: (string | null)[] = [];
  const problems: { column: string; message: string }[] = [];
  const seen = new Set<string>();
  header.forEach((raw, i) => {
    const h = raw.trim();
    if (h === "") {
      // A trailing separator leaves an unnamed empty column; only a column holding values needs a name.
      if (body.some((r) => (r[i] ?? "").trim() !== "")) problems.push({ column: `column ${i + 1}`, message: "has values but no name in the header row" });
      columns.push(null);
      return;
    }
    const name = KNOWN().get(h.toLowerCase());
    if (name) {
      if (seen.has(name)) problems.push({ column: h, message: "appears twice in the header row" });
      seen.add(name);
      columns.push(name);
      return;
    }
    const mppt = MPPT_COLUMN.exec(h);
    const suggestion = suggestColumn(h);
    if (mppt && Number(mppt[1]) > MAX_MPPT_INPUTS) {
      problems.push({ column: h, message: `at most ${MAX_MPPT_INPUTS} MPPT inputs are read (mpptInputs.1 … mpptInputs.${MAX_MPPT_INPUTS})` });
    } else if (looksLikeUnitInHeader(h)) {
      problems.push({
        column: h,
        message: suggestion
          ? `the unit goes in the column name, not beside it: write ${suggestion}`
          : "the unit goes in the column name, not beside it (e.g. vocV, iscA); see the example file for the names",
      });
    } else {
      problems.push({
        column: h,
        message: suggestion
          ? `not a column the import knows: write ${suggestion} (the unit is part of the name)`
          : "not a column the import knows; rename it as in the example file, or remove it so nothing is dropped unseen",
      });
    }
    columns.push(null);
  });
  return { columns, problems };
}

const YES = new Set(["yes", "y", "true", "1"]);
const NO = new Set(["no", "n", "false", "0"]);

function readCell(field: RatingField, raw: string): Read<unknown> {
  switch (field.type) {
    case "number":
    case "integer":
      return readNumberCell(raw, field.unitWords);
    case "boolean": {
      const v = raw.trim().toLowerCase();
      if (YES.has(v)) return { ok: true, value: true };
      if (NO.has(v)) return { ok: true, value: false };
      return { ok: false, message: "write yes or no" };
    }
    case "enum": {
      const v = raw.trim().toLowerCase();
      const hit = field.options?.find((o) => o.toLowerCase() === v);
      if (hit !== undefined) return { ok: true, value: hit };
      return { ok: false, message: `"${raw.trim()}" is not one of ${field.options?.join(", ")}` };
    }
    case "number-list": {
      const parts = raw.split(/[;/\s]+/).filter((p) => p !== "");
      const values: number[] = [];
      for (const p of parts) {
        const n = readNumberCell(p, field.unitWords);
        if (!n.ok) return { ok: false, message: `write the numbers only, separated by semicolons${inUnit(field.unitWords)} (e.g. 12;24;48)` };
        values.push(n.value);
      }
      return { ok: true, value: values };
    }
    case "text":
    case "mppt-inputs":
      return { ok: true, value: raw.trim() };
  }
}

function rowProblem(row: number, column: string, message: string): RowProblem {
  return { column, message, text: `row ${row}, ${column}: ${message}` };
}

const mpptInputId = (n: number) => (n <= 26 ? String.fromCharCode(64 + n) : String(n));

function readRow(rowNumber: number, cells: string[], columns: (string | null)[]): ParsedRow {
  const get = (name: string) => {
    const i = columns.indexOf(name);
    return i < 0 ? "" : (cells[i] ?? "").trim();
  };
  const kindRaw = get("kind");
  const manufacturer = get("manufacturer");
  const model = get("model");
  const out: ParsedRow = { row: rowNumber, kind: kindRaw, manufacturer, model, problems: [] };
  const problem = (column: string, message: string) => out.problems.push(rowProblem(rowNumber, column, message));

  if (cells.length > columns.length && cells.slice(columns.length).some((c) => c.trim() !== "")) {
    problem("(row)", `holds ${cells.length} cells but the header names ${columns.length} columns; check for an unquoted comma`);
    return out;
  }
  const kindLower = kindRaw.toLowerCase();
  if (kindRaw === "") {
    problem("kind", `is empty; write one of ${EQUIPMENT_KINDS.join(", ")}`);
    return out;
  }
  if (!KIND_SET.has(kindLower)) {
    problem("kind", `"${kindRaw}" is not a kind; write one of ${EQUIPMENT_KINDS.join(", ")}`);
    return out;
  }
  const kind = kindLower as EquipmentKind;
  out.kind = kind;
  const fields = new Map(ratingFieldsForKind(kind).map((f) => [f.name, f]));
  const mpptFields = new Map(mpptInputFields().map((f) => [f.name, f]));
  const candidate: Record<string, unknown> = { kind, manufacturer, model };
  const mppt = new Map<number, Record<string, unknown>>();

  columns.forEach((column, i) => {
    if (column === null || column === "kind" || column === "manufacturer" || column === "model") return;
    const raw = (cells[i] ?? "").trim();
    if (raw === "") return;
    const m = MPPT_COLUMN.exec(column);
    if (m) {
      if (!fields.has("mpptInputs")) {
        problem(column, `a ${KIND_LABELS[kind].toLowerCase()} has no MPPT inputs; leave it empty for this kind`);
        return;
      }
      const n = Number(m[1]);
      const f = mpptFields.get(m[2] ?? "");
      if (!f) return;
      const read = readCell(f, raw);
      if (!read.ok) return problem(column, read.message);
      const input = mppt.get(n) ?? {};
      input[f.name] = read.value;
      mppt.set(n, input);
      return;
    }
    const f = fields.get(column);
    if (!f) {
      problem(column, `not a rating of a ${KIND_LABELS[kind].toLowerCase()}; leave it empty for this kind`);
      return;
    }
    const read = readCell(f, raw);
    if (!read.ok) return problem(column, read.message);
    candidate[column] = read.value;
  });

  const mpptNumbers = [...mppt.keys()].sort((a, b) => a - b);
  if (mpptNumbers.length) {
    candidate.mpptInputs = mpptNumbers.map((n) => ({ id: mpptInputId(n), ...mppt.get(n) }));
  }
  if (out.problems.length) return out;

  const parsed = librarySchemaForKind(kind).safeParse(candidate);
  if (parsed.success) {
    out.item = parsed.data as LibraryItemData;
    return out;
  }
  for (const issue of parsed.error.issues) {
    const [head, index, sub] = issue.path;
    let column = typeof head === "string" ? head : "kind";
    if (column === "mpptInputs" && typeof index === "number") {
      column = `mpptInputs.${mpptNumbers[index] ?? index + 1}${typeof sub === "string" ? `.${sub}` : ""}`;
    }
    if (!out.problems.some((p) => p.column === column)) problem(column, issue.message);
  }
  return out;
}

export function parseEquipmentCsv(text: string): CsvParseResult {
  const clean = text.replace(/^\uFEFF/, "");
  const parsed = Papa.parse<string[]>(clean, { skipEmptyLines: false });
  const data = parsed.data.filter((r): r is string[] => Array.isArray(r));
  const header = data[0];
  if (!header || header.every((h) => h.trim() === "")) {
    return { ok: false, message: "The file is empty: the first row must name the columns.", missingColumns: [...REQUIRED_COLUMNS], columnProblems: [] };
  }
  const body = data.slice(1);
  const plan = readHeader(header, body);
  const missing = REQUIRED_COLUMNS.filter((c) => !plan.columns.includes(c));
  if (missing.length || plan.problems.length) {
    const parts: string[] = [];
    if (missing.length) parts.push(`missing column${missing.length > 1 ? "s" : ""} ${missing.join(", ")}`);
    if (plan.problems.length) parts.push(`${plan.problems.length} column${plan.problems.length > 1 ? "s" : ""} not understood`);
    return {
      ok: false,
      message: `The file was not imported: ${parts.join("; ")}. Nothing was added.`,
      missingColumns: missing,
      columnProblems: plan.problems,
    };
  }
  const quoteErrors = new Map<number, string>();
  for (const e of parsed.errors) {
    if (e.type === "Quotes" && e.row !== undefined) quoteErrors.set(e.row, "a quoted cell is not closed; check the quotes in this row");
  }
  const rows: ParsedRow[] = [];
  body.forEach((cells, i) => {
    if (cells.every((c) => c.trim() === "")) return;
    const rowNumber = i + 2;
    const quote = quoteErrors.get(i + 1);
    if (quote) {
      rows.push({ row: rowNumber, kind: cells[0] ?? "", manufacturer: "", model: "", problems: [rowProblem(rowNumber, "(row)", quote)] });
      return;
    }
    rows.push(readRow(rowNumber, cells, plan.columns));
  });
  if (rows.length > MAX_ROWS) {
    return {
      ok: false,
      message: `The file holds ${rows.length} rows; import at most ${MAX_ROWS} at a time. Nothing was added.`,
      missingColumns: [],
      columnProblems: [],
    };
  }
  return { ok: true, columns: plan.columns.filter((c): c is string => c !== null), rows };
}
