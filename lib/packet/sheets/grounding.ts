import { GROUNDING_ELECTRODE_KINDS, type Equipment, type ProjectRecord } from "../../schemas/project-record";
import { conductorSizeText, isInverter } from "../../schemas/vocabulary";
import type { Block, Cell } from "../markup";
import { notGiven } from "../record-words";
import type { PacketInput } from "../types";
import { KIND_LABEL, equipmentByTag, resultsFor, statusCell, table } from "./shared";

const ELECTRODE_LABEL: Record<(typeof GROUNDING_ELECTRODE_KINDS)[number], string> = {
  "ground-rod": "Ground rod",
  "concrete-encased": "Concrete-encased electrode",
  "ground-ring": "Ground ring",
  "metal-water-pipe": "Metal underground water pipe",
  "building-steel": "Metal frame of the building",
  plate: "Plate electrode",
  "existing-building-system": "Existing building electrode system",
};

type Source = Extract<Equipment, { kind: "inverter" | "inverter-charger" | "hybrid-inverter" | "generator" | "ac-panel" }>;

function isBondable(e: Equipment): e is Source {
  return isInverter(e) || e.kind === "generator" || e.kind === "ac-panel";
}

function sizeText(size: string | undefined, material: "cu" | "al" | undefined): string {
  return size ? conductorSizeText(size, material ?? "cu") : "";
}

/** A 120 V-only inverter feeding a 120/240 V panel: the panel's two legs are jumpered and its neutral carries both. */
export function splitPhaseFeeds(record: ProjectRecord): { inverter: string; panel: string; circuit: string }[] {
  const eq = equipmentByTag(record);
  const out: { inverter: string; panel: string; circuit: string }[] = [];
  for (const c of record.circuits) {
    const from = eq.get(c.fromTag);
    const to = eq.get(c.toTag);
    if (!from || !to || to.kind !== "ac-panel" || to.voltage !== "120/240") continue;
    if (isInverter(from) && from.acOutput === "120") {
      out.push({ inverter: from.tag, panel: to.tag, circuit: c.tag });
    }
  }
  return out;
}

export function groundingBlocks(input: PacketInput): Block[] {
  const { record, run } = input;
  const g = record.grounding;
  const eq = equipmentByTag(record);
  const bond = g.neutralGroundBondTag ? eq.get(g.neutralGroundBondTag) : undefined;
  const blocks: Block[] = [
    {
      kind: "fields",
      rows: [
        ["Grounding electrode system", g.electrodes.length ? g.electrodes.map((e) => ELECTRODE_LABEL[e]).join(", ") : notGiven(record, "grounding.electrodes")],
        ["Grounding electrode conductor (GEC)", g.gecSize ? sizeText(g.gecSize, g.gecMaterial) : notGiven(record, "grounding.gecSize")],
        [
          "Neutral-to-ground bond",
          g.neutralGroundBondTag ? `at ${g.neutralGroundBondTag}${bond ? ` (${KIND_LABEL[bond.kind]})` : ""}, the only bond in the system` : notGiven(record, "grounding.neutralGroundBondTag"),
        ],
      ],
    },
  ];
  const sources = record.equipment.filter(isBondable);
  if (sources.length) {
    blocks.push(
      table(
        [["Tag", 0.8], ["Equipment", 1.6], ["Neutral", 3]],
        sources.map((e): Cell[] => [
          { text: e.tag, bold: true },
          KIND_LABEL[e.kind],
          !g.neutralGroundBondTag
            ? "bond location not given"
            : e.tag === g.neutralGroundBondTag
              ? "BONDED TO GROUND HERE (main or system bonding jumper); GEC lands here"
              : "isolated from the enclosure; no bonding jumper fitted",
        ]),
        "Where the neutral is bonded",
      ),
    );
  }
  const egcRows: Cell[][] = record.circuits.map((c) => {
    const ocpd = c.ocpdTag ? eq.get(c.ocpdTag) : undefined;
    const rating = ocpd && "ratingA" in ocpd && ocpd.ratingA !== undefined ? `${c.ocpdTag} ${ocpd.ratingA} A` : c.ocpdTag ?? "—";
    const egcResults = resultsFor(run, c.tag).filter((r) => /ground/.test(r.checkId));
    return [{ text: c.tag, bold: true }, `${c.fromTag} → ${c.toTag}`, rating, sizeText(c.egcSize, c.egcMaterial) || "NOT GIVEN", statusCell(egcResults)];
  });
  blocks.push(
    table(
      [["Circuit", 0.8], ["From → to", 1.6], ["Overcurrent device", 1.3], ["EGC", 1.2], ["EGC check", 1]],
      egcRows.length ? egcRows : [["—", "No circuits entered", "", "", ""]],
      "Equipment grounding conductors",
    ),
  );
  for (const feed of splitPhaseFeeds(record)) {
    blocks.push({ kind: "heading", level: 2, text: `Three-line detail: ${feed.inverter} (120 V) feeding ${feed.panel} (120/240 V)` });
    blocks.push({ kind: "figure", figure: "split-phase", caption: `${feed.inverter}|${feed.panel}|${feed.circuit}|${g.neutralGroundBondTag ?? ""}` });
    blocks.push({
      kind: "list",
      ordered: false,
      items: [
        `The inverter's single line conductor lands on ${feed.panel} bus L1; a jumper joins L1 and L2 so both legs carry 120 V in phase.`,
        "No 240 V loads and no multiwire branch circuits on this panel: with the legs in phase, a shared neutral carries the sum of both circuits.",
        `The neutral from ${feed.inverter} to ${feed.panel} is sized for the inverter's full output current, like the line conductor.`,
        "The SINGLE 120-VOLT SUPPLY label goes on the panel (label schedule).",
      ],
    });
  }
  const groundingChecks = run.results.filter((r) => /ground|bond/.test(r.checkId));
  if (groundingChecks.length) {
    blocks.push({ kind: "heading", level: 2, text: "Grounding and bonding checks" });
    blocks.push(...groundingChecks.map((result): Block => ({ kind: "check", result })));
  }
  return blocks;
}
