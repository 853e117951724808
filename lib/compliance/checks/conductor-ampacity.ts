/** 4. Conductor ampacity with conditions of use (690.8(B), 310.15, Table 310.16, 110.14(C)). */
import { isPvCircuit, sizeLabel, type CheckContext } from "../context";
import { conductorAmpacity } from "../derive/conductor";
import { localRef, refs } from "../refs";
import { makeResult, needsInput, type CheckDefinition } from "../result";
import type { CheckResult } from "../types";

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
      const problems: string[] = [];
      if (a.tableAtTerminalA === undefined || a.tableAtInsulationA === undefined) {
        problems.push(`Table 310.16 gives no ${a.terminalRatingC} °C ampacity for ${sizeLabel(c.size!, c.material)}`);
      } else {
        if (a.correction === undefined) problems.push(`${a.insulationRatingC} °C insulation may not be used at ${a.ambientC} °C`);
        if (a.tableAtTerminalA * a.sets < a.requiredUnadjustedA) {
          problems.push(
            `${sizeLabel(c.size!, c.material)} at the ${a.terminalRatingC} °C terminal column carries ${a.tableAtTerminalA * a.sets} A, less than the ${a.requiredUnadjustedA.toFixed(1)} A required`,
          );
        }
        const corrected = a.correction !== undefined ? a.tableAtInsulationA * a.correction * a.adjustment * a.sets : 0;
        if (a.correction !== undefined && corrected < a.requiredAdjustedA) {
          problems.push(`under conditions of use it carries ${corrected.toFixed(1)} A, less than the ${a.requiredAdjustedA.toFixed(1)} A required`);
        }
      }
      if (c.parallelSets > 1 && c.size !== undefined && ["18", "16", "14", "12", "10", "8", "6", "4", "3", "2", "1"].includes(c.size)) {
        problems.push(`conductors in parallel must be 1/0 or larger`);
      }
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
