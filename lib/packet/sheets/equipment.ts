import { DATASHEET_KINDS as DATASHEET_KIND_LIST } from "../../compliance/documents";
import { loadDailyWh } from "../../compliance/load-summary";
import type { Equipment } from "../../schemas/project-record";
import { dash, formatNumber } from "../format";
import type { Block, Cell } from "../markup";
import type { PacketDatasheet } from "../plan";
import type { PacketInput } from "../types";
import { batteryKWh, PHASE_WORDS } from "../../schemas/vocabulary";
import { KIND_LABEL, describe, equipmentByTag, resultsFor, statusCell, table } from "./shared";

/** Equipment whose datasheet a permit office asks for (the submittal check's list). */
const DATASHEET_KINDS = new Set<string>(DATASHEET_KIND_LIST);

function keyRatings(e: Equipment): string {
  switch (e.kind) {
    case "pv-module":
      return [dash(e.pmaxW, "W"), `Voc ${dash(e.vocV, "V")}`, `Isc ${dash(e.iscA, "A")}`, `Vmp ${dash(e.vmpV, "V")}`, `Imp ${dash(e.impA, "A")}`, `max system ${dash(e.maxSystemVoltageV, "V")}`].join(", ");
    case "charge-controller":
      return [e.controllerType?.toUpperCase() ?? "type —", `PV in max ${dash(e.maxPvInputVoltageV, "V")} / ${dash(e.maxPvInputCurrentA, "A")}`, `output ${dash(e.ratedOutputCurrentA, "A")}`, `battery ${e.batteryVoltagesV.length ? e.batteryVoltagesV.join("/") + " V" : "—"}`].join(", ");
    case "inverter":
    case "inverter-charger":
    case "hybrid-inverter":
      return [`${dash(e.continuousW, "W")} continuous`, `${dash(e.surgeW, "W")} surge`, `battery ${dash(e.nominalBatteryVoltageV, "V")}`, `AC ${e.acOutput ?? dash(e.acOutputVoltageV, "V")} ${PHASE_WORDS[e.acOutputPhases]}`, `listed ${e.listedMode ?? "—"}`].join(", ");
    case "battery":
      return [e.chemistry?.toUpperCase() ?? "chemistry —", dash(e.nominalVoltageV, "V"), dash(e.capacityAh, "Ah"), dash(batteryKWh(e) !== undefined ? formatNumber(batteryKWh(e)!) : undefined, "kWh"), `max discharge ${dash(e.maxContinuousDischargeA, "A")}`, `short-circuit ${dash(e.shortCircuitCurrentA, "A")}`].join(", ");
    case "generator":
      return [dash(e.ratedKW, "kW"), e.output ?? dash(e.voltageV, "V"), e.fuel ?? "fuel —"].join(", ");
    case "disconnect":
    case "fuse":
    case "breaker":
      return [dash(e.ratingA, "A"), dash(e.voltageRatingV, "V"), e.currentType?.toUpperCase() ?? "AC/DC —", `AIC ${dash(e.interruptingRatingA, "A")}`].join(", ");
    case "rapid-shutdown":
      return [e.method ?? "method —", e.controls].filter(Boolean).join(", ");
    case "ac-panel":
    case "busbar":
      return [`bus ${dash(e.busRatingA, "A")}`, `main ${dash(e.mainBreakerA, "A")}`, e.voltage ? `${e.voltage} V` : "voltage —"].join(", ");
  }
}

export function equipmentBlocks(input: PacketInput, datasheets: PacketDatasheet[]): Block[] {
  const { record, run } = input;
  const sheetFor = new Map<string, string>();
  for (const d of datasheets) if (d.equipmentTag && !sheetFor.has(d.equipmentTag)) sheetFor.set(d.equipmentTag, d.code);
  const rows: Cell[][] = record.equipment.map((e) => [
    { text: e.tag, bold: true },
    KIND_LABEL[e.kind],
    e.manufacturer || "—",
    e.model || "—",
    String(e.quantity),
    keyRatings(e),
    e.listing || "—",
    sheetFor.get(e.tag) ?? (DATASHEET_KINDS.has(e.kind) ? "MISSING" : "—"),
    statusCell(resultsFor(run, e.tag)),
  ]);
  const blocks: Block[] = [
    table(
      [["Tag", 0.7], ["Kind", 1.2], ["Manufacturer", 1.2], ["Model", 1.2], ["Qty", 0.4, "right"], ["Ratings", 5], ["Listing", 1.3], ["Datasheet", 0.8], ["Checks", 0.9]],
      rows.length ? rows : [["—", "No equipment entered", "", "", "", "", "", "", ""]],
      "Equipment",
    ),
  ];
  if (record.arrays.length) {
    const eq = equipmentByTag(record);
    blocks.push(
      table(
        [["Array", 0.7], ["Module", 1.6], ["In series", 0.8, "right"], ["Strings", 0.8, "right"], ["Modules", 0.8, "right"], ["DC rating", 1, "right"], ["Feeds", 1.2], ["Checks", 1]],
        record.arrays.map((a) => {
          const m = eq.get(a.moduleTag);
          const n = a.modulesInSeries * a.stringsInParallel;
          return [
            { text: a.tag, bold: true },
            `${a.moduleTag} ${describe(m)}`.trim(),
            String(a.modulesInSeries),
            String(a.stringsInParallel),
            String(n),
            m?.kind === "pv-module" && m.pmaxW ? `${formatNumber((n * m.pmaxW) / 1000)} kW` : "—",
            `${a.feedsTag}${a.mpptInputId ? ` / ${a.mpptInputId}` : ""}`,
            statusCell(resultsFor(run, a.tag)),
          ];
        }),
        "PV arrays",
      ),
    );
  }
  if (record.loads.length) {
    blocks.push(
      table(
        [["Load", 2], ["Watts", 0.8, "right"], ["Qty", 0.5, "right"], ["Hours / day", 0.8, "right"], ["Energy / day", 1, "right"], ["Surge", 0.8, "right"], ["Voltage", 0.7, "right"], ["Simultaneous", 0.9]],
        record.loads.map((l) => [
          l.name,
          `${formatNumber(l.watts)} W`,
          String(l.quantity),
          `${formatNumber(l.hoursPerDay)} h${l.dutyPct !== undefined && l.dutyPct !== 100 ? ` × ${formatNumber(l.dutyPct)} %` : ""}${l.daysPerWeek !== undefined && l.daysPerWeek !== 7 ? `, ${l.daysPerWeek} d/wk` : ""}`,
          `${formatNumber(loadDailyWh(l))} Wh`,
          dash(l.surgeW, "W"),
          `${l.voltageV} V`,
          l.simultaneous ? "yes" : "no",
        ]),
        "Loads (stand-alone sizing)",
      ),
    );
  }
  return blocks;
}
