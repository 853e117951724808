import type { Block, Cell } from "../markup";
import type { PacketInput } from "../types";
import { KIND_LABEL, LOCATION_LABEL, describe, table } from "./shared";
import { structuralBlocks } from "./structural";

export function sitePlanBlocks(input: PacketInput): Block[] {
  const { record } = input;
  const rows: Cell[][] = record.equipment.map((e) => {
    let where = "As shown on the plan";
    if (e.kind === "battery") {
      where = [record.site.batteryLocation ? LOCATION_LABEL[record.site.batteryLocation] : "location not given", record.site.batteryLocationNote]
        .filter(Boolean)
        .join(" — ");
    } else if (e.kind === "pv-module") {
      where = `${record.site.mounting === "roof" ? "Roof" : "Ground"}-mounted array`;
    }
    return [e.tag, KIND_LABEL[e.kind], describe(e) || "—", String(e.quantity), where];
  });
  for (const a of record.arrays) {
    rows.push([a.tag, "PV array", `${a.modulesInSeries} × ${a.stringsInParallel} of ${a.moduleTag}`, String(a.modulesInSeries * a.stringsInParallel), `${record.site.mounting === "roof" ? "Roof" : "Ground"} mount, feeds ${a.feedsTag}`]);
  }
  return [
    { kind: "figure", figure: "site-plan", caption: input.sitePlan ? `Site plan: ${input.sitePlan.fileName}` : "Site plan not attached" },
    table([["Tag", 1], ["Equipment", 2], ["Make and model", 3], ["Qty", 0.6, "right"], ["Location", 5]], rows, "Equipment and battery locations"),
    ...structuralBlocks(input),
  ];
}
