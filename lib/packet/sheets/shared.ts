import type { CheckResult, CheckStatus } from "../../compliance/types";
import { EQUIPMENT_KIND_LABELS, type Circuit, type Equipment, type ProjectRecord } from "../../schemas/project-record";
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

export const CIRCUIT_KIND_LABEL: Record<Circuit["kind"], string> = {
  "pv-source": "PV source",
  "pv-output": "PV output",
  battery: "Battery",
  "inverter-dc-input": "Inverter DC input",
  "inverter-ac-output": "Inverter AC output",
  "generator-output": "Generator output",
  "ac-branch": "AC branch",
};


const STATUS_ORDER: CheckStatus[] = ["fail", "needs-input", "warning", "attest", "pass", "not-applicable"];

export function worstStatus(results: CheckResult[]): CheckStatus | null {
  let worst: CheckStatus | null = null;
  for (const r of results) {
    if (worst === null || STATUS_ORDER.indexOf(r.status) < STATUS_ORDER.indexOf(worst)) worst = r.status;
  }
  return worst;
}

export function equipmentByTag(record: ProjectRecord): Map<string, Equipment> {
  return new Map(record.equipment.map((e) => [e.tag, e]));
}

export function describe(e: Equipment | undefined): string {
  if (!e) return "";
  return [e.manufacturer, e.model].filter(Boolean).join(" ");
}

export function batteryKWh(e: Extract<Equipment, { kind: "battery" }>): number | undefined {
  if (e.capacityKWh !== undefined) return e.capacityKWh;
  if (e.capacityAh !== undefined && e.nominalVoltageV !== undefined) return (e.capacityAh * e.nominalVoltageV) / 1000;
  return undefined;
}

export function table(columns: [string, number, ("left" | "right" | "center")?][], rows: Cell[][], caption?: string): Block {
  const cols: TableColumn[] = columns.map(([header, weight, align]) => ({ header, weight, align: align ?? "left" }));
  return { kind: "table", columns: cols, rows, caption };
}

export function resultsFor(run: PacketInput["run"], subject: string): CheckResult[] {
  return run.results.filter((r) => r.subject === subject);
}

export function statusCell(results: CheckResult[]): Cell {
  const worst = worstStatus(results);
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
