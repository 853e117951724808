/**
 * 14. Stand-alone supply (710.15): the inverter may be smaller than the
 * calculated load but must carry the largest single load; a 120 V-only supply
 * feeding a 120/240 V panel needs the single-supply warning, no multiwire
 * branch circuits, no 240 V outlets, and the sum of the sources' ratings below
 * the panel's neutral bus rating (710.15(C)).
 */
import { isInverter, round, Trace, v, type CheckContext, type EquipmentOf } from "../context";
import { loadSummary } from "../load-summary";
import { remedy } from "../derive/remedy";
import { sourceRatings } from "../derive/sources";
import { singleSupplyPanels } from "../derive/single-supply";
import { refs } from "../refs";
import { makeResult, needsInput, worst, type CheckDefinition } from "../result";
import type { CheckResult, CheckStatus } from "../types";

type Inverter = EquipmentOf<"inverter" | "inverter-charger" | "hybrid-inverter">;

function supplyVoltageKnown(inv: Inverter): boolean {
  return inv.acOutput !== undefined || inv.acOutputVoltageV !== undefined;
}

function feeds120240Panel(ctx: CheckContext, inverterTag: string): boolean {
  return (ctx.circuitsByEndpoint.get(inverterTag) ?? []).some((c) => {
    if (c.item.kind !== "inverter-ac-output") return false;
    const other = ctx.equipment.get(c.item.fromTag === inverterTag ? c.item.toTag : c.item.fromTag)?.item;
    return other?.kind === "ac-panel" && other.voltage === "120/240";
  });
}

export const standAloneSupply: CheckDefinition = {
  id: "stand-alone-supply",
  title: "Stand-alone supply",
  scopeTopic: "stand-alone-supply",
  formula:
    "inverter output ≥ largest single load; 120 V-only supply to a 120/240 V panel: warning label, no multiwire branch circuits, no 240 V outlets, sum of the sources' output ratings < neutral bus rating",
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
    const formulas: string[] = [];
    /** What makes each failing point pass, with its figure. */
    const fixes: string[] = [];
    const values = [v("continuousW", "Inverter continuous output", continuousW, "W"), v("largestSingleLoadW", "Largest single load", s.largestSingleLoadW, "W")];
    if (continuousW < s.largestSingleLoadW) {
      statuses.push("fail");
      notes.push(`${continuousW} W cannot carry the largest single load of ${s.largestSingleLoadW} W (710.15(A))`);
      fixes.push(`Use inverter output of at least ${s.largestSingleLoadW} W continuous, the largest single load.`);
    }
    const refsOut = [...codeRefs];
    for (const inv of inverters) {
      // An output of unknown voltage into a 120/240 V panel may be a single 120 V supply: never assume it is not.
      if (!isInverter(inv.item) || supplyVoltageKnown(inv.item) || !feeds120240Panel(ctx, inv.item.tag)) continue;
      t.need(`${inv.path}.acOutput`, `AC output of ${inv.item.tag}`, undefined);
      statuses.push("needs-input");
    }
    for (const { panel, inverter } of singleSupplyPanels(ctx)) {
      refsOut.push(...refs(ctx.edition, "stand-alone-label"));
      const mwbc = t.need(`${panel.path}.hasMultiwireBranchCircuits`, `Multiwire branch circuits in ${panel.item.tag}`, panel.item.hasMultiwireBranchCircuits);
      if (mwbc === undefined) statuses.push("needs-input");
      else if (mwbc) {
        statuses.push("fail");
        notes.push(`${panel.item.tag} is fed by 120 V-only ${inverter.item.tag} and has multiwire branch circuits, which would overload the neutral (710.15(C))`);
        fixes.push(`Replace the multiwire branch circuits in ${panel.item.tag} with two-wire circuits, or supply it at 120/240 V.`);
      }
      const outlets240 = ctx.record.loads.filter((l) => l.voltageV === 240);
      if (outlets240.length) {
        statuses.push("fail");
        notes.push(`a single 120 V supply may not serve 240 V outlets (${outlets240.map((l) => l.name).join(", ")}) (710.15(C))`);
      }
      // 710.15(C): the sum of the ratings of the power sources stays below the neutral bus rating; one breaker is not the measure.
      const neutral = t.need(`${panel.path}.neutralBusRatingA`, `Neutral bus rating of ${panel.item.tag}`, panel.item.neutralBusRatingA, "A");
      const sources = sourceRatings(ctx, panel.item.tag, t);
      if (neutral === undefined || sources === undefined) {
        statuses.push("needs-input");
      } else {
        const sumA = sources.reduce((a, s) => a + s.currentA, 0);
        values.push(
          v("sourcesSumA", `Sum of the source ratings into ${panel.item.tag}`, sumA, "A"),
          v("neutralBusA", `Neutral bus of ${panel.item.tag}`, neutral, "A"),
        );
        formulas.push(`${sources.map((s) => `${s.tag} ${round(s.currentA, 1)} A`).join(" + ")} = ${round(sumA, 1)} A < neutral bus ${neutral} A`);
        if (!(sumA < neutral)) {
          statuses.push("fail");
          notes.push(`the sources into ${panel.item.tag} sum to ${round(sumA, 1)} A, not less than its ${neutral} A neutral bus (710.15(C))`);
          fixes.push(`Use a panel whose neutral bus is rated above ${round(sumA, 1)} A, the sum of the sources into it, or supply it at 120/240 V.`);
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
            formula: [`inverter ${continuousW} W ≥ largest single load ${s.largestSingleLoadW} W`, ...formulas].join("; "),
            inputs: t.inputs,
            codeRefs: refsOut,
          }),
    ];
  },
};
