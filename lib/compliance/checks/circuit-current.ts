/** 3. Circuit current (690.8(A)): the figure every conductor and device on the circuit is sized from. */
import { isInverterKind } from "../../schemas/vocabulary";
import { endpoint, kindIs, Trace, v, type CheckContext } from "../context";
import { batteries } from "../derive/battery";
import { circuitCurrent } from "../derive/circuit-current";
import { refs } from "../refs";
import { makeResult, needsInput, type CheckDefinition } from "../result";
import type { CheckResult } from "../types";

export const circuitCurrentCheck: CheckDefinition = {
  id: "circuit-current",
  title: "Circuit current",
  scopeTopic: "pv-circuit-current",
  formula:
    "PV: 1.25 × Isc × strings; inverter DC input: continuous W ÷ (lowest battery V × efficiency); AC: the equipment's continuous output",
  run(ctx: CheckContext): CheckResult[] {
    const out: CheckResult[] = [];
    for (const ci of ctx.circuits) {
      const c = ci.item;
      const d = circuitCurrent(ctx, ci);
      const base = refs(ctx.edition, "pv-circuit-current");
      if (!d.ok) {
        out.push(needsInput(this, { subject: c.tag, inputs: d.inputs, missing: d.missing, reason: d.reason, codeRefs: base }));
        continue;
      }
      const t = new Trace().merge(d);
      const values = [...d.values];
      let status: "pass" | "warning" = "pass";
      let reason: string | undefined;
      // A battery that cannot supply the inverter's draw trips its management system under full load.
      if (c.kind === "inverter-dc-input" || c.kind === "battery") {
        const bat = endpoint(ctx, c, kindIs("battery")) ?? batteries(ctx)[0];
        const inverterEnd = c.kind === "inverter-dc-input" || [c.toTag, c.fromTag].some((tag) => isInverterKind(ctx.equipment.get(tag)?.item.kind ?? ""));
        if (bat && inverterEnd && bat.item.maxContinuousDischargeA !== undefined) {
          const avail = bat.item.maxContinuousDischargeA * bat.item.quantity;
          t.read(`${bat.path}.maxContinuousDischargeA`, `Continuous discharge of ${bat.item.tag}`, bat.item.maxContinuousDischargeA, "A");
          values.push(v("batteryDischargeA", `Continuous discharge of ${bat.item.quantity} × ${bat.item.tag}`, avail, "A"));
          if (d.value.currentA > avail) {
            status = "warning";
            reason = `the inverter can draw ${d.value.currentA.toFixed(1)} A but the battery bank is rated for ${avail} A continuous; its management system may disconnect under full load`;
          }
        }
      }
      out.push(
        makeResult(this, {
          subject: c.tag,
          status,
          message:
            status === "pass"
              ? `${c.tag}: ${d.value.currentA.toFixed(2)} A (${d.value.basis}).`
              : `${c.tag}: ${reason}.`,
          ...(reason ? { reason } : {}),
          values,
          formula: d.formula,
          inputs: t.inputs,
          codeRefs: d.value.codeRefs.length ? d.value.codeRefs : base,
        }),
      );
    }
    return out;
  },
};
