import type { CheckResult } from "../../compliance/types";
import { EQUIPMENT_KIND_LABELS, type Equipment, type ProjectRecord } from "../../schemas/project-record";
import { worstStatus } from "../../schemas/vocabulary";
import { formatNumber } from "../format";
import type { Block, Cell, TableColumn } from "../markup";
import type { PacketInput } from "../types";

export const SYSTEM_KIND_LABEL: Record<ProjectRecord["systemKind"], string> = {
  "stand-alone": "Stand-alone PV and battery system",
  "stand-alone-generator": "Stand-alone PV and battery system with generator",
  hybrid: "Hybrid (grid-interactive) PV and battery system",
};

export const OCCUPANCY_LABEL: Record<ProjectRecord["site"]["occupancy"], string> = {
  "one-two-family-dwelling": "One- and two-family dwelling",
  "other-building": "Other building",
};

export const LOCATION_LABEL: Record<string, string> = {
  "utility-closet": "utility closet",
  basement: "basement",
  "storage-room": "storage room",
  garage: "garage",
  "accessory-building": "accessory building",
  "exterior-wall": "exterior wall",
  outdoors: "outdoors",
  "habitable-room": "habitable room",
};

// A schedule spells out the two kinds that read ambiguously on a permit sheet.
export const KIND_LABEL: Record<Equipment["kind"], string> = {
  ...EQUIPMENT_KIND_LABELS,
  breaker: "Circuit breaker",
  "ac-panel": "AC distribution panel",
};


export function equipmentByTag(record: ProjectRecord): Map<string, Equipment> {
  return new Map(record.equipment.map((e) => [e.tag, e]));
}

export function describe(e: Equipment | undefined): string {
  if (!e) return "";
  return [e.manufacturer, e.model].filter(Boolean).join(" ");
}

export function table(columns: [string, number, ("left" | "right" | "center")?][], rows: Cell[][], caption?: string): Block {
  const cols: TableColumn[] = columns.map(([header, weight, align]) => ({ header, weight, align: align ?? "left" }));
  return { kind: "table", columns: cols, rows, caption };
}

export function resultsFor(run: PacketInput["run"], subject: string): CheckResult[] {
  return run.results.filter((r) => r.subject === subject);
}

export function statusCell(results: CheckResult[]): Cell {
  const worst = worstStatus(results.map((r) => r.status));
  return worst ? { text: "", status: worst } : "—";
}

/** A figure from the first result of the check that carries one of the keys, in key order of preference. */
export function findValue(results: CheckResult[], checkId: string, keys: string[]): string {
  for (const key of keys) {
    for (const r of results) {
      if (r.checkId !== checkId) continue;
      const v = r.values.find((x) => x.key === key);
      if (v && typeof v.value === "number") return `${formatNumber(v.value)}${v.unit ? " " + v.unit : ""}`;
    }
  }
  return "—";
}
