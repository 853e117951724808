/** 4. Conductor ampacity with conditions of use (690.8(B), 310.15, Table 310.16, 110.14(C)). */
import { isPvCircuit, sizeLabel, type CheckContext, type Indexed } from "../context";
import type { Circuit } from "../../schemas/project-record";
import { ampacityShortfalls, conductorAmpacity, type ConductorAmpacity } from "../derive/conductor";
import { conductorRemedy, remedy, smallestConductor } from "../derive/remedy";
import { localRef, refs } from "../refs";
import { makeResult, needsInput, type CheckDefinition } from "../result";
import type { CheckResult, Remedy } from "../types";

export const conductorAmpacityCheck: CheckDefinition = {
  id: "conductor-ampacity",
  title: "Conductor ampacity with conditions of use",
  scopeTopic: "ampacity-table",
  formula:
    "terminal-column ampacity ≥ 1.25 × current, and table ampacity × ambient correction × adjustment ≥ current",
  run(ctx: CheckContext): CheckResult[] {
    const out: CheckResult[] = [];
    for (const ci of ctx.circuits) {
      const c = ci.item;
      const codeRefs = [
        ...(isPvCircuit(c) ? refs(ctx.edition, "pv-conductor-sizing", "conditions-of-use") : []),
        ...(c.kind === "generator-output" ? [localRef(ctx.edition, "generator-conductors")] : []),
        ...(c.kind === "ac-branch" ? [localRef(ctx.edition, "branch-conductors")] : []),
        ...refs(ctx.edition, "ampacity-table", "ambient-correction", "conductor-adjustment"),
        ...(c.onRooftop ? refs(ctx.edition, "rooftop-adder") : []),
        ...refs(ctx.edition, "terminal-rating"),
        ...(c.parallelSets > 1 ? [localRef(ctx.edition, "parallel-conductors")] : []),
      ];
      const d = conductorAmpacity(ctx, ci);
      if (!d.ok) {
        out.push(needsInput(this, { subject: c.tag, inputs: d.inputs, missing: d.missing, reason: d.reason, codeRefs }));
        continue;
      }
      const a = d.value;
      const problems = ampacityShortfalls(a, c, c.size!);
      const status = problems.length ? "fail" : "pass";
      out.push(
        makeResult(this, {
          subject: c.tag,
          status,
          message:
            status === "pass"
              ? `${c.tag}: ${sizeLabel(c.size!, c.material)} allows ${a.allowedA!.toFixed(1)} A for a ${a.current.currentA.toFixed(1)} A circuit${a.terminalAssumed ? ` (terminals taken as ${a.terminalRatingC} °C per 110.14(C)(1); record the rating)` : ""}.`
              : `${c.tag}: ${problems.join("; ")}.`,
          ...(status === "fail" ? { reason: problems.join("; ") } : a.terminalAssumed ? { reason: "terminal temperature rating not recorded; the 110.14(C)(1) default was used" } : {}),
          remedy: () => ampacityRemedy(ctx, ci, a),
          values: d.values,
          formula: d.formula,
          inputs: d.inputs,
          codeRefs,
        }),
      );
    }
    return out;
  },
};

function ampacityRemedy(ctx: CheckContext, ci: Indexed<Circuit>, a: ConductorAmpacity): Remedy {
  const need = `${Math.max(a.requiredUnadjustedA, a.requiredAdjustedA).toFixed(1)} A`;
  const choice = smallestConductor(ctx, ci);
  if (choice) return conductorRemedy(ci, choice, `for the ${need} required`);
  return remedy(
    a.correction === undefined
      ? `${a.insulationRatingC} °C insulation cannot be used at ${a.ambientC} °C: choose insulation rated 90 °C, or route the run where it is cooler.`
      : `No single conductor size carries ${need} here: run conductors in parallel (1/0 and larger), or change the conditions of use (fewer conductors in the raceway, a cooler route).`,
  );
}
