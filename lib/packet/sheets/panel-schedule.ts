import type { Equipment, ProjectRecord } from "../../schemas/project-record";
import { CIRCUIT_KIND_TITLES } from "../../schemas/vocabulary";
import { dash, formatNumber } from "../format";
import type { Block, Cell } from "../markup";
import type { PacketInput } from "../types";
import { describe, equipmentByTag, resultsFor, statusCell, table } from "./shared";

type Panel = Extract<Equipment, { kind: "ac-panel" | "busbar" }>;

function sizeText(size: string | undefined, material: "cu" | "al"): string {
  if (!size) return "—";
  return `${Number(size) >= 250 ? `${size} kcmil` : `${size} AWG`} ${material === "al" ? "Al" : "Cu"}`;
}

/** 240 V and 120/240 V two-wire circuits take a two-pole breaker; 120 V ones a single pole. */
function poles(volts: number | undefined): string {
  if (volts === undefined) return "—";
  return volts >= 208 ? "2" : "1";
}

/**
 * The panel schedule of one AC panel, from the record: what feeds it, each
 * branch circuit with its breaker, conductor and load, and the sum of the
 * breakers against the bus. A panel without branch circuits says so and names
 * the loads it is to serve, rather than printing an empty schedule.
 */
function panelBlocks(panel: Panel, record: ProjectRecord, input: PacketInput): Block[] {
  const eq = equipmentByTag(record);
  const feeds = record.circuits.filter((c) => c.toTag === panel.tag);
  const branches = record.circuits.filter((c) => c.fromTag === panel.tag);
  const blocks: Block[] = [
    { kind: "heading", level: 2, text: `Panel schedule: ${panel.tag} ${describe(panel)}`.trim() },
    {
      kind: "fields",
      rows: [
        ["Voltage", panel.voltage ?? "NOT GIVEN"],
        ["Bus rating", dash(panel.busRatingA, "A")],
        ["Main breaker", panel.mainBreakerA !== undefined ? `${formatNumber(panel.mainBreakerA)} A` : "none (main lug)"],
        ["Neutral bus", dash(panel.neutralBusRatingA, "A")],
        ["Fed by", feeds.length ? feeds.map((c) => `${c.fromTag} over ${c.tag} (${CIRCUIT_KIND_TITLES[c.kind]})`).join("; ") : "no circuit into the panel entered"],
      ],
    },
  ];
  const rows: Cell[][] = branches.map((c, i) => {
    const breaker = c.ocpdTag ? eq.get(c.ocpdTag) : undefined;
    const rating = breaker && "ratingA" in breaker && breaker.ratingA !== undefined ? breaker.ratingA : undefined;
    const volts = c.nominalVoltageV;
    return [
      String(i + 1),
      { text: c.tag, bold: true },
      c.toTag,
      c.ocpdTag ? `${c.ocpdTag} ${dash(rating, "A")}` : "NOT GIVEN",
      poles(volts),
      sizeText(c.size, c.material),
      dash(volts, "V"),
      dash(c.loadCurrentA, "A"),
      c.loadCurrentA !== undefined && volts !== undefined ? `${formatNumber(Math.round(c.loadCurrentA * volts))} VA` : "—",
      statusCell(resultsFor(input.run, c.tag)),
    ];
  });
  const sumOfBreakers = branches.reduce((t, c) => {
    const b = c.ocpdTag ? eq.get(c.ocpdTag) : undefined;
    return t + (b && "ratingA" in b && b.ratingA !== undefined ? b.ratingA : 0);
  }, 0);
  if (rows.length) {
    rows.push(["", { text: "Sum of branch breakers", bold: true }, "", `${formatNumber(sumOfBreakers)} A`, "", "", "", "", "", ""]);
    blocks.push(
      table(
        [["No.", 0.4], ["Circuit", 0.7], ["Serves", 1.2], ["Breaker", 1], ["Poles", 0.5, "right"], ["Conductor", 1], ["Volts", 0.6, "right"], ["Load", 0.7, "right"], ["Load VA", 0.8, "right"], ["Checks", 0.9]],
        rows,
        `Branch circuits of ${panel.tag}`,
      ),
    );
  } else {
    const loads = record.loads.map((l) => `${l.quantity > 1 ? `${l.quantity} × ` : ""}${l.name} (${formatNumber(l.watts)} W, ${l.voltageV} V)`);
    blocks.push({
      kind: "paragraph",
      text: `NOT GIVEN: the branch circuits of ${panel.tag} (Circuits section of the design: a circuit from ${panel.tag} with its breaker). Until they are entered the breakers are not scheduled.${loads.length ? ` Loads to be served from the load list: ${loads.join("; ")}.` : ""}`,
    });
  }
  return blocks;
}

export function panelScheduleBlocks(input: PacketInput): Block[] {
  const panels = input.record.equipment.filter((e): e is Panel => e.kind === "ac-panel");
  return panels.flatMap((p) => panelBlocks(p, input.record, input));
}
