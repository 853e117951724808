import type { Equipment } from "../../schemas/project-record";
import { dash, formatNumber } from "../format";
import type { Block, Cell } from "../markup";
import type { PacketInput } from "../types";
import { batteryKWh } from "../../schemas/vocabulary";
import { LOCATION_LABEL, describe, table } from "./shared";

export function storageBlocks(input: PacketInput): Block[] {
  const { record, run } = input;
  const batteries = record.equipment.filter((e): e is Extract<Equipment, { kind: "battery" }> => e.kind === "battery");
  const rows: Cell[][] = batteries.map((b) => {
    const kwh = batteryKWh(b);
    return [
      b.tag,
      describe(b) || "—",
      b.chemistry?.toUpperCase() ?? "—",
      String(b.quantity),
      dash(b.nominalVoltageV, "V"),
      dash(b.capacityAh, "Ah"),
      kwh !== undefined ? `${formatNumber(kwh)} kWh` : "—",
      kwh !== undefined ? `${formatNumber(kwh * b.quantity)} kWh` : "—",
      b.listing || "—",
      b.largeScaleFireTested ? "yes" : "no",
    ];
  });
  const s = record.site;
  const storageChecks = run.results.filter((r) => /storage|siting|battery/.test(r.checkId));
  const blocks: Block[] = [
    table(
      [["Tag", 0.8], ["Make and model", 2.4], ["Chemistry", 1], ["Units", 0.6, "right"], ["Nominal", 0.9, "right"], ["Capacity", 0.9, "right"], ["Energy / unit", 1, "right"], ["Energy total", 1, "right"], ["Listing", 1.8], ["Large-scale fire tested", 1.1]],
      rows.length ? rows : [["—", "No energy storage in this system", "", "", "", "", "", "", "", ""]],
      "Storage units",
    ),
    {
      kind: "fields",
      rows: [
        ["Location", s.batteryLocation ? LOCATION_LABEL[s.batteryLocation] ?? s.batteryLocation : "not given"],
        ["Location note", s.batteryLocationNote || "—"],
        ["Spacing between units", dash(s.batterySpacingIn, "in")],
        ["Smoke or heat detection", s.hasSmokeOrHeatDetection === undefined ? "not given" : s.hasSmokeOrHeatDetection ? "provided" : "not provided"],
        ["Vehicle-impact protection", s.hasVehicleImpactProtection === undefined ? "not given" : s.hasVehicleImpactProtection ? "provided" : "not provided"],
        ["Aggregate energy", `${formatNumber(batteries.reduce((t, b) => t + (batteryKWh(b) ?? 0) * b.quantity, 0))} kWh`],
      ],
    },
  ];
  if (storageChecks.length) {
    blocks.push({ kind: "heading", level: 2, text: "Storage checks" });
    blocks.push(...storageChecks.map((result): Block => ({ kind: "check", result })));
  }
  return blocks;
}
