/**
 * 14. Stand-alone supply (710.15): the inverter may be smaller than the
 * calculated load but must carry the largest single load; a 120 V-only supply
 * feeding a 120/240 V panel needs the single-supply warning, no multiwire
 * branch circuits, and an output device no larger than the neutral bus.
 */
import type { Circuit } from "../../schemas/project-record";
import { equipmentOfKind, isInverter, Trace, v, type CheckContext, type EquipmentOf, type Indexed, isProtective } from "../context";
import { loadSummary } from "../load-summary";
import { remedy } from "../derive/remedy";
import { refs } from "../refs";
import { makeResult, needsInput, worst, type CheckDefinition } from "../result";
import type { CheckResult, CheckStatus } from "../types";

type Panel = EquipmentOf<"ac-panel">;
type Inverter = EquipmentOf<"inverter" | "inverter-charger" | "hybrid-inverter">;

function is120Only(inv: Inverter): boolean {
  if (inv.acOutput !== undefined) return inv.acOutput === "120";
  return inv.acOutputVoltageV !== undefined && inv.acOutputVoltageV <= 130;
}

/** Panels rated 120/240 V fed by a 120 V-only inverter, in a stand-alone system. */
export function singleSupplyPanels(ctx: CheckContext): { panel: Indexed<Panel>; inverter: Indexed<Inverter>; circuit: Indexed<Circuit> }[] {
  if (ctx.record.systemKind === "hybrid") return [];
  const out: { panel: Indexed<Panel>; inverter: Indexed<Inverter>; circuit: Indexed<Circuit> }[] = [];
  for (const p of equipmentOfKind(ctx, "ac-panel")) {
    if (p.item.voltage !== "120/240") continue;
    for (const c of ctx.circuitsByEndpoint.get(p.item.tag) ?? []) {
      if (c.item.kind !== "inverter-ac-output") continue;
      const other = ctx.equipment.get(c.item.fromTag === p.item.tag ? c.item.toTag : c.item.fromTag);
      if (other && isInverter(other.item) && is120Only(other.item)) {
        out.push({ panel: p, inverter: other as Indexed<Inverter>, circuit: c });
      }
    }
  }
  return out;
}

export const standAloneSupply: CheckDefinition = {
  id: "stand-alone-supply",
  title: "Stand-alone supply",
  scopeTopic: "stand-alone-supply",
  formula:
    "inverter output ≥ largest single load; 120 V-only supply to a 120/240 V panel: warning label, no multiwire branch circuits",
  run(ctx: CheckContext): CheckResult[] {
    const codeRefs = refs(ctx.edition, "stand-alone-supply");
    if (ctx.record.systemKind === "hybrid") {
      return [makeResult(this, { status: "not-applicable", message: "Grid-interactive system: 710.15 covers stand-alone systems.", reason: "system kind is hybrid", codeRefs })];
    }
    const inverters = ctx.record.equipment.map((item, index) => ({ item, index, path: `equipment.${index}` })).filter((e) => isInverter(e.item));
    if (inverters.length === 0) {
      return [needsInput(this, { message: "A stand-alone system needs its inverter recorded.", missing: ["equipment"], codeRefs })];
    }
    if (ctx.record.loads.length === 0) return [needsInput(this, { message: "Record the loads to check the supply against.", missing: ["loads"], codeRefs })];
    const t = new Trace();
    let continuousW = 0;
    for (const inv of inverters) {
      const w = isInverter(inv.item) ? t.need(`${inv.path}.continuousW`, `Continuous output of ${inv.item.tag}`, inv.item.continuousW, "W") : undefined;
      if (w !== undefined) continuousW += w * inv.item.quantity;
    }
    if (t.missing.length) return [needsInput(this, { inputs: t.inputs, missing: t.missing, codeRefs })];
    const s = loadSummary(ctx.record);
    const statuses: CheckStatus[] = ["pass"];
    const notes: string[] = [];
    /** What makes each failing point pass, with its figure. */
    const fixes: string[] = [];
    const values = [v("continuousW", "Inverter continuous output", continuousW, "W"), v("largestSingleLoadW", "Largest single load", s.largestSingleLoadW, "W")];
    if (continuousW < s.largestSingleLoadW) {
      statuses.push("fail");
      notes.push(`${continuousW} W cannot carry the largest single load of ${s.largestSingleLoadW} W (710.15(A))`);
      fixes.push(`Use inverter output of at least ${s.largestSingleLoadW} W continuous, the largest single load.`);
    }
    const refsOut = [...codeRefs];
    for (const { panel, inverter, circuit } of singleSupplyPanels(ctx)) {
      refsOut.push(...refs(ctx.edition, "stand-alone-label"));
      const mwbc = t.need(`${panel.path}.hasMultiwireBranchCircuits`, `Multiwire branch circuits in ${panel.item.tag}`, panel.item.hasMultiwireBranchCircuits);
      if (mwbc === undefined) statuses.push("needs-input");
      else if (mwbc) {
        statuses.push("fail");
        notes.push(`${panel.item.tag} is fed by 120 V-only ${inverter.item.tag} and has multiwire branch circuits, which would overload the neutral (710.15(C))`);
        fixes.push(`Replace the multiwire branch circuits in ${panel.item.tag} with two-wire circuits, or supply it at 120/240 V.`);
      }
      const dev = circuit.item.ocpdTag ? ctx.equipment.get(circuit.item.ocpdTag) : undefined;
      const rating = dev && isProtective(dev.item) ? dev.item.ratingA : undefined;
      const bus = t.need(`${panel.path}.busRatingA`, `Bus (neutral) rating of ${panel.item.tag}`, panel.item.busRatingA, "A");
      if (rating !== undefined && bus !== undefined) {
        values.push(v("outputDeviceA", `Output device of ${inverter.item.tag}`, rating, "A"), v("neutralBusA", `Neutral bus of ${panel.item.tag} (taken as the bus rating)`, bus, "A"));
        if (rating > bus) {
          statuses.push("fail");
          notes.push(`output device ${rating} A exceeds the ${bus} A neutral bus of ${panel.item.tag}`);
          fixes.push(`Use a panel whose neutral bus is rated at least ${rating} A, or an output device of at most ${bus} A that still carries the inverter's current.`);
        }
      }
      notes.push(`the "single 120-volt supply" warning is required on ${panel.item.tag}`);
    }
    const status = worst(...statuses);
    const failing = status === "fail" || status === "needs-input";
    return [
      status === "needs-input"
        ? needsInput(this, { inputs: t.inputs, missing: t.missing, values, codeRefs: refsOut })
        : makeResult(this, {
            status,
            message: failing
              ? `${notes.join("; ")}.`
              : `${continuousW} W carries the largest single load (${s.largestSingleLoadW} W)${notes.length ? `; ${notes.join("; ")}` : ""}.`,
            ...(failing ? { reason: notes.join("; ") } : {}),
            remedy: () => (fixes.length ? remedy(fixes.join(" ")) : undefined),
            values,
            formula: `inverter ${continuousW} W ≥ largest single load ${s.largestSingleLoadW} W`,
            inputs: t.inputs,
            codeRefs: refsOut,
          }),
    ];
  },
};
