/**
 * 10. Inverter capacity: continuous watts cover the loads that run together,
 * surge covers the largest starting load. A missing surge figure is estimated
 * at twice the continuous rating (common practice for small inverters) and
 * flagged for confirmation on the datasheet.
 */
import { isInverter, Trace, v, type CheckContext } from "../context";
import { loadSummary } from "../load-summary";
import { remedy } from "../derive/remedy";
import { refs } from "../refs";
import { makeResult, needsInput, worst, type CheckDefinition } from "../result";
import type { CheckResult, CheckStatus } from "../types";

/** Surge ÷ continuous of a small inverter where the datasheet gives none (common practice). */
export const ASSUMED_SURGE_RATIO = 2;

export const inverterCapacity: CheckDefinition = {
  id: "inverter-capacity",
  title: "Inverter capacity",
  scopeTopic: "stand-alone-supply",
  formula:
    "continuous W ≥ loads running together; surge W ≥ largest start + other running loads",
  run(ctx: CheckContext): CheckResult[] {
    const codeRefs = refs(ctx.edition, "stand-alone-supply", "listing-use");
    const inverters = ctx.record.equipment.map((item, index) => ({ item, path: `equipment.${index}` })).filter((e) => isInverter(e.item));
    if (inverters.length === 0) {
      return [makeResult(this, { status: "not-applicable", message: "No inverter in the record.", reason: "no inverter", codeRefs })];
    }
    const t = new Trace();
    if (ctx.record.loads.length === 0) {
      return [needsInput(this, { message: "Record the loads to size the inverter against.", missing: ["loads"], codeRefs })];
    }
    const s = loadSummary(ctx.record);
    let continuousW = 0;
    let surgeW = 0;
    let surgeAssumed = false;
    for (const inv of inverters) {
      if (!isInverter(inv.item)) continue;
      const w = t.need(`${inv.path}.continuousW`, `Continuous output of ${inv.item.tag}`, inv.item.continuousW, "W");
      const sw = t.read(`${inv.path}.surgeW`, `Surge output of ${inv.item.tag}`, inv.item.surgeW, "W");
      if (w !== undefined) {
        continuousW += w * inv.item.quantity;
        if (sw === undefined) surgeAssumed = true;
        surgeW += (sw ?? w * ASSUMED_SURGE_RATIO) * inv.item.quantity;
      }
    }
    if (t.missing.length) return [needsInput(this, { inputs: t.inputs, missing: t.missing, codeRefs })];
    ctx.record.loads.forEach((l, i) => {
      t.read(`loads.${i}.watts`, `${l.name} watts`, l.watts, "W");
      if (l.surgeW !== undefined) t.read(`loads.${i}.surgeW`, `${l.name} surge`, l.surgeW, "W");
    });
    // The surge arrives while the other loads keep running.
    const surgeLoad = ctx.record.loads.reduce((best, l) => ((l.surgeW ?? l.watts) > (best?.surgeW ?? best?.watts ?? -1) ? l : best), ctx.record.loads[0]);
    const surgeNeedW = s.largestSurgeW + Math.max(0, s.peakSimultaneousW - (surgeLoad?.simultaneous ? surgeLoad.watts : 0));
    const statuses: CheckStatus[] = ["pass"];
    const problems: string[] = [];
    if (continuousW < s.peakSimultaneousW) {
      statuses.push("fail");
      problems.push(`${continuousW} W continuous is below the ${s.peakSimultaneousW} W of loads that run together`);
    }
    if (surgeW < surgeNeedW) {
      statuses.push("fail");
      problems.push(`${surgeW} W surge${surgeAssumed ? " (estimated)" : ""} is below the ${surgeNeedW} W needed to start ${surgeLoad?.name ?? "the largest load"} with the others running`);
    }
    if (surgeAssumed && problems.length === 0) {
      statuses.push("warning");
      problems.push(`surge not recorded; taken as ${ASSUMED_SURGE_RATIO} × continuous (common practice) — confirm on the datasheet`);
    }
    const status = worst(...statuses);
    return [
      makeResult(this, {
        status,
        message:
          status === "pass"
            ? `${continuousW} W continuous carries ${s.peakSimultaneousW} W of simultaneous loads; ${surgeW} W surge covers ${surgeNeedW} W.`
            : `${problems.join("; ")}.`,
        ...(status === "pass" ? {} : { reason: problems.join("; ") }),
        remedy: () =>
          continuousW < s.peakSimultaneousW || surgeW < surgeNeedW
            ? remedy(
                `Use inverter capacity of at least ${Math.max(continuousW, s.peakSimultaneousW)} W continuous and ${Math.max(surgeW, surgeNeedW)} W surge, or keep fewer loads running together (${continuousW} W continuous and ${surgeW} W surge are available now).`,
              )
            : undefined,
        values: [
          v("continuousW", "Inverter continuous output", continuousW, "W"),
          v("peakSimultaneousW", "Loads running together", s.peakSimultaneousW, "W"),
          v("surgeW", `Inverter surge${surgeAssumed ? " (estimated)" : ""}`, surgeW, "W"),
          v("surgeNeedW", "Largest start with the others running", surgeNeedW, "W"),
        ],
        formula: `continuous ${continuousW} W ≥ Σ simultaneous ${s.peakSimultaneousW} W; surge ${surgeW} W ≥ largest surge ${s.largestSurgeW} W + other running loads`,
        inputs: t.inputs,
        codeRefs,
      }),
    ];
  },
};
