import type { Equipment } from "../../schemas/project-record";
import { CIRCUIT_KIND_TITLES, conductorSizeText } from "../../schemas/vocabulary";
import { dash, formatNumber } from "../format";
import type { Block, Cell } from "../markup";
import type { PacketInput } from "../types";
import { KIND_LABEL, describe, equipmentByTag, findValue, resultsFor, statusCell, table } from "./shared";

/** Checks whose failure on a circuit is also its overcurrent device's. */
const OCPD_CHECK = /overcurrent|ocpd|ampacity/;

export function conductorBlocks(input: PacketInput): Block[] {
  const { record, run } = input;
  const eq = equipmentByTag(record);
  const rows: Cell[][] = record.circuits.map((c) => {
    const ocpd = c.ocpdTag ? eq.get(c.ocpdTag) : undefined;
    const rating = ocpd && (ocpd.kind === "fuse" || ocpd.kind === "breaker" || ocpd.kind === "disconnect") ? dash(ocpd.ratingA, "A") : "—";
    const results = resultsFor(run, c.tag);
    return [
      { text: c.tag, bold: true },
      `${c.fromTag} → ${c.toTag}`,
      CIRCUIT_KIND_TITLES[c.kind],
      `${c.parallelSets > 1 ? `${c.parallelSets} × ` : ""}${c.size ? conductorSizeText(c.size, c.material) : `— ${c.material === "cu" ? "Cu" : "Al"}`}`,
      [c.insulation, c.insulationTempRatingC ? `${c.insulationTempRatingC} °C` : ""].filter(Boolean).join(" ") || "—",
      dash(c.currentCarryingConductors),
      [c.racewayType, c.racewaySize].filter(Boolean).join(" ") || "—",
      dash(c.lengthFt, "ft"),
      [c.ambientTempC !== undefined ? `${formatNumber(c.ambientTempC)} °C` : "site", c.onRooftop ? "rooftop" : ""].filter(Boolean).join(", "),
      c.terminalTempRatingC ? `${c.terminalTempRatingC} °C` : "—",
      c.arrayTag ? findValue(resultsFor(run, c.arrayTag), "max-pv-voltage", ["maxVoltageV"]) : "—",
      findValue(results, "circuit-current", ["currentA"]) === "—"
        ? findValue(results, "conductor-ampacity", ["currentA"])
        : findValue(results, "circuit-current", ["currentA"]),
      findValue(results, "conductor-ampacity", ["allowedA", "correctedA"]),
      c.ocpdTag ? `${c.ocpdTag} ${rating}` : "—",
      c.egcSize ? conductorSizeText(c.egcSize, c.egcMaterial) : "—",
      statusCell(results),
    ];
  });
  const devices = record.equipment.filter(
    (e): e is Extract<Equipment, { kind: "disconnect" | "fuse" | "breaker" }> =>
      e.kind === "disconnect" || e.kind === "fuse" || e.kind === "breaker",
  );
  const deviceRows: Cell[][] = devices.map((d) => {
    const protectsOrOn = record.circuits.filter((c) => c.ocpdTag === d.tag || c.disconnectTags.includes(d.tag)).map((c) => c.tag);
    return [
      { text: d.tag, bold: true },
      KIND_LABEL[d.kind],
      describe(d) || "—",
      dash(d.ratingA, "A"),
      dash(d.voltageRatingV, "V"),
      d.currentType ? d.currentType.toUpperCase().replace("AC-DC", "AC/DC") : "—",
      dash(d.interruptingRatingA, "A"),
      dash(d.distanceFromBatteryFt, "ft"),
      protectsOrOn.join(", ") || "—",
      // A device that does not protect its conductor fails with it, so the row shows the circuit's failing check too.
      statusCell([
        ...resultsFor(run, d.tag),
        ...record.circuits.filter((c) => c.ocpdTag === d.tag).flatMap((c) => resultsFor(run, c.tag).filter((r) => r.status === "fail" && OCPD_CHECK.test(r.checkId))),
      ]),
    ];
  });
  return [
    table(
      [["Circuit", 0.7], ["From → to", 1.5], ["Kind", 1.3], ["Conductor", 1.3], ["Insulation", 1.1], ["CCC", 0.5, "right"], ["Raceway", 1.2], ["Length", 0.7, "right"], ["Ambient", 0.9], ["Terminal", 0.7], ["Max voltage", 0.8, "right"], ["Current", 0.8, "right"], ["Ampacity", 0.8, "right"], ["OCPD", 1], ["EGC", 0.9], ["Checks", 1]],
      rows.length ? rows : [["—", "No circuits entered", "", "", "", "", "", "", "", "", "", "", "", "", "", ""]],
      "Conductor schedule",
    ),
    table(
      [["Tag", 0.7], ["Device", 1.2], ["Make and model", 2], ["Rating", 0.8, "right"], ["Voltage", 0.8, "right"], ["AC / DC", 0.7], ["Interrupting", 1, "right"], ["From battery", 0.9, "right"], ["Circuits", 1.4], ["Checks", 1]],
      deviceRows.length ? deviceRows : [["—", "No disconnects or overcurrent devices entered", "", "", "", "", "", "", "", ""]],
      "Overcurrent devices and disconnects",
    ),
  ];
}
