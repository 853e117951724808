import type { CheckResult, CheckStatus } from "../compliance/types";
import type { LabelRequirement } from "../labels/types";

/**
 * The structured text both writers lay out. Sheet templates produce it as a
 * small line-based markup (see templates/packet/README.md); code adds tables,
 * check cards, figures and label artwork.
 */
export type Cell = string | { text: string; status?: CheckStatus; bold?: boolean };

export interface TableColumn {
  header: string;
  /** Relative width; the writers scale the weights to the space they have. */
  weight: number;
  align?: "left" | "right" | "center";
}

export type Block =
  | { kind: "heading"; level: 1 | 2 | 3; text: string }
  | { kind: "paragraph"; text: string }
  | { kind: "list"; ordered: boolean; items: string[] }
  | { kind: "caution"; text: string }
  | { kind: "fields"; rows: [string, string][] }
  | { kind: "table"; columns: TableColumn[]; rows: Cell[][]; caption?: string }
  | { kind: "check"; result: CheckResult }
  | { kind: "figure"; figure: "site-plan" | "one-line" | "split-phase"; caption: string }
  | { kind: "labels"; labels: LabelRequirement[] }
  | { kind: "column-break" };

const HEADING = /^(#{1,3})\s+(.*)$/;
const BULLET = /^[-*]\s+(.*)$/;
const NUMBERED = /^\d+[.)]\s+(.*)$/;
const CAUTION = /^!\s*(.*)$/;
const FIELD = /^(.+?)\s::\s?(.*)$/;
const TABLE_SEPARATOR = /^\|\s*:?-{3,}/;

/**
 * Column widths from the header separator, as a plain-text table shows them:
 * `|---|-----|------------|` gives the third column four times the first.
 */
function columnWeights(separator: string): number[] {
  return splitRow(separator).map((cell) => Math.max(1, (cell.match(/-/g)?.length ?? 3) / 3));
}

function splitRow(line: string): string[] {
  const inner = line.trim().replace(/^\|/, "").replace(/\|$/, "");
  return inner.split("|").map((c) => c.trim());
}

/**
 * Markup, one construct per line:
 *   # / ## / ### heading      - bullet      1. numbered item      ! caution
 *   Label :: value            | table | row |  (a `|---|` line after the first row makes it the header;
 *                             its dashes set the column widths: `|---|---------|` gives 1 : 3)
 *   ~~~ column break          blank line ends a paragraph; other lines join into one.
 */
export function parseMarkup(source: string): Block[] {
  const blocks: Block[] = [];
  let paragraph: string[] = [];
  let list: { ordered: boolean; items: string[] } | null = null;
  let caution: string[] = [];
  let fields: [string, string][] = [];
  let table: string[][] = [];
  let tableHeader: string[] | null = null;
  let tableWeights: number[] = [];

  const flush = (keep?: "list" | "caution" | "fields" | "table") => {
    if (paragraph.length) blocks.push({ kind: "paragraph", text: paragraph.join(" ") });
    paragraph = [];
    if (keep !== "list" && list) {
      blocks.push({ kind: "list", ...list });
      list = null;
    }
    if (keep !== "caution" && caution.length) {
      blocks.push({ kind: "caution", text: caution.join(" ") });
      caution = [];
    }
    if (keep !== "fields" && fields.length) {
      blocks.push({ kind: "fields", rows: fields });
      fields = [];
    }
    if (keep !== "table" && (table.length || tableHeader)) {
      const width = Math.max(tableHeader?.length ?? 0, ...table.map((r) => r.length));
      const header = tableHeader ?? Array.from({ length: width }, () => "");
      blocks.push({
        kind: "table",
        columns: header.map((h, i) => ({ header: h, weight: tableWeights[i] ?? 1 })),
        rows: table.map((r) => Array.from({ length: width }, (_, i) => r[i] ?? "")),
      });
      table = [];
      tableHeader = null;
      tableWeights = [];
    }
  };

  for (const raw of source.split(/\r?\n/)) {
    const line = raw.trim();
    if (line === "") {
      flush();
      continue;
    }
    if (line === "~~~") {
      flush();
      blocks.push({ kind: "column-break" });
      continue;
    }
    if (line.startsWith("|")) {
      flush("table");
      if (TABLE_SEPARATOR.test(line)) {
        if (!tableHeader && table.length === 1) {
          tableHeader = table.pop() ?? null;
          tableWeights = columnWeights(line);
        }
        continue;
      }
      table.push(splitRow(line));
      continue;
    }
    let m = HEADING.exec(line);
    if (m) {
      flush();
      blocks.push({ kind: "heading", level: m[1]!.length as 1 | 2 | 3, text: m[2]!.trim() });
      continue;
    }
    m = BULLET.exec(line) ?? NUMBERED.exec(line);
    if (m) {
      const ordered = NUMBERED.test(line);
      flush("list");
      if (!list) list = { ordered, items: [] };
      list.items.push(m[1]!.trim());
      continue;
    }
    m = CAUTION.exec(line);
    if (m) {
      flush();
      caution.push(m[1]!.trim());
      flush();
      continue;
    }
    m = FIELD.exec(line);
    if (m) {
      flush("fields");
      fields.push([m[1]!.trim(), m[2]!.trim()]);
      continue;
    }
    if (list || caution.length || fields.length || table.length) flush();
    paragraph.push(line);
  }
  flush();
  return blocks;
}

/** Keeps a substituted value on its own line and out of the markup. */
export function markupSafe(value: string): string {
  return value.replace(/[\r\n]+/g, " ").replace(/\|/g, "/").replace(/::/g, ":");
}
