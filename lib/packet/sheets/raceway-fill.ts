import { racewayFill } from "../../compliance/derive/raceway-fill";
import { conductorsPerSet, sizeText } from "../../diagram/describe";
import type { Circuit, ProjectRecord } from "../../schemas/project-record";
import { formatNumber } from "../format";
import type { Block, Cell } from "../markup";
import type { PacketInput } from "../types";
import { table } from "./shared";

const in2 = (v: number) => `${v.toFixed(4).replace(/0+$/, "").replace(/\.$/, "")} in²`;

function conductorCount(c: Circuit, record: ProjectRecord): number | undefined {
  const perSet = conductorsPerSet(c, record);
  return perSet === undefined ? undefined : perSet * c.parallelSets;
}

/** One row per circuit's raceway: what fills it and against which limit. */
export function racewayFillRows(record: ProjectRecord): { row: Cell[]; status: "pass" | "fail" | "needs-input" | "not-applicable"; circuit: string }[] {
  return record.circuits.map((c) => {
    const conductors = conductorCount(c, record);
    const fill = racewayFill({
      racewayType: c.racewayType,
      racewaySize: c.racewaySize,
      insulation: c.insulation,
      ...(c.size ? { size: c.size } : {}),
      ...(conductors !== undefined ? { conductors } : {}),
      ...(c.egcSize ? { egcSize: c.egcSize } : {}),
    });
    const raceway = [c.racewaySize && /^[\d\s/-]+$/.test(c.racewaySize.trim()) ? `${c.racewaySize.trim()} in` : c.racewaySize, c.racewayType].filter(Boolean).join(" ") || "—";
    if (fill.status === "not-applicable" || fill.status === "needs-input") {
      return {
        circuit: c.tag,
        status: fill.status,
        row: [{ text: c.tag, bold: true }, raceway, "—", "—", "—", "—", "—", { text: "", status: fill.status }, fill.reason],
      };
    }
    const parts = [`${conductors} × ${c.size ? sizeText(c.size) : ""} ${c.insulation.toUpperCase()} at ${in2(fill.conductorAreaIn2)}`];
    if (c.egcSize) parts.push(`1 × ${sizeText(c.egcSize)} EGC at ${in2(fill.egcAreaIn2)}`);
    return {
      circuit: c.tag,
      status: fill.status,
      row: [
        { text: c.tag, bold: true },
        `${raceway} (Art. ${fill.article})`,
        in2(fill.racewayAreaIn2),
        parts.join("; "),
        in2(fill.totalAreaIn2),
        `${formatNumber(Math.round(fill.fillPct * 10) / 10)} %`,
        `${fill.limitPct} % (${fill.count} conductor${fill.count === 1 ? "" : "s"})`,
        { text: "", status: fill.status },
        fill.status === "fail"
          ? `Over the Table 1 limit. Fix: ${fill.fitsIn ? `${fill.fitsIn} in ${c.racewayType}` : "split the run"}`
          : "",
      ],
    };
  });
}

export function racewayFillBlocks(input: PacketInput): Block[] {
  const rows = racewayFillRows(input.record).map((r) => r.row);
  return [
    table(
      [["Circuit", 0.6], ["Raceway", 1.3], ["Raceway area (Table 4)", 1], ["Conductors (Table 5 areas)", 2.6], ["Conductor area", 0.9, "right"], ["Fill", 0.6, "right"], ["Limit (Table 1)", 1.1], ["Check", 1], ["Note", 1.8]],
      rows.length ? rows : [["—", "No circuits entered", "", "", "", "", "", "", ""]],
      "Raceway fill, NEC Chapter 9 Tables 1, 4 and 5 (EGC counted, Note 3; insulated EGC as the circuit conductors)",
    ),
  ];
}
