/**
 * 17. Panel busbar (705.12(B)): a hybrid inverter on the load side of a panel
 * meets the 120 % rule or the sum-of-breakers rule; a stand-alone inverter
 * feeding a panel has bus and main rated for its output device.
 */
import { equipmentOfKind, isInverter, Trace, v, type CheckContext, isProtective } from "../context";
import { circuitCurrent } from "../derive/circuit-current";
import { largestStandardRatingA, nextStandardRatingA, remedy } from "../derive/remedy";
import { refs } from "../refs";
import { makeResult, needsInput, type CheckDefinition } from "../result";
import type { CheckResult } from "../types";

export const panelBusbar: CheckDefinition = {
  id: "panel-busbar",
  title: "Panel busbar",
  scopeTopic: "busbar",
  formula:
    "1.25 × inverter output current + main ≤ 1.2 × bus (or sum of breakers ≤ bus); stand-alone: output device ≤ bus",
  run(ctx: CheckContext): CheckResult[] {
    const codeRefs = refs(ctx.edition, "busbar");
    const out: CheckResult[] = [];
    for (const p of equipmentOfKind(ctx, "ac-panel")) {
      const feeds = (ctx.circuitsByEndpoint.get(p.item.tag) ?? []).filter((c) => {
        if (c.item.kind !== "inverter-ac-output") return false;
        const other = ctx.equipment.get(c.item.fromTag === p.item.tag ? c.item.toTag : c.item.fromTag);
        return other !== undefined && isInverter(other.item);
      });
      if (feeds.length === 0) {
        out.push(makeResult(this, { subject: p.item.tag, status: "not-applicable", message: `${p.item.tag}: no inverter output lands on this panel.`, reason: "no inverter AC output circuit to the panel", codeRefs }));
        continue;
      }
      const t = new Trace();
      const bus = t.need(`${p.path}.busRatingA`, `Bus rating of ${p.item.tag}`, p.item.busRatingA, "A");
      let sourceA = 0;
      let deviceSumA = 0;
      for (const c of feeds) {
        const cur = circuitCurrent(ctx, c);
        t.merge(cur);
        if (cur.ok) sourceA += cur.value.currentA;
        const dev = c.item.ocpdTag ? ctx.equipment.get(c.item.ocpdTag) : undefined;
        const rating = dev && isProtective(dev.item) ? t.need(`${dev.path}.ratingA`, `Rating of ${dev.item.tag}`, dev.item.ratingA, "A") : t.need(`${c.path}.ocpdTag`, `Output device of ${c.item.tag}`, undefined);
        if (typeof rating === "number") deviceSumA += rating;
      }
      if (ctx.record.systemKind === "hybrid") {
        const main = t.need(`${p.path}.mainBreakerA`, `Main breaker of ${p.item.tag}`, p.item.mainBreakerA, "A");
        const sum = t.read(`${p.path}.sumOfBreakersA`, `Sum of breakers in ${p.item.tag}`, p.item.sumOfBreakersA, "A");
        if (bus === undefined || main === undefined || t.missing.length) {
          out.push(needsInput(this, { subject: p.item.tag, inputs: t.inputs, missing: t.missing, codeRefs }));
          continue;
        }
        const lhs = 1.25 * sourceA + main;
        const rhs = 1.2 * bus;
        const rule120 = lhs <= rhs;
        // Sum-of-breakers: every breaker except the main, the inverter's included, within the bus rating.
        const ruleSum = sum !== undefined && sum - main <= bus;
        const ok = rule120 || ruleSum;
        out.push(
          makeResult(this, {
            subject: p.item.tag,
            status: ok ? "pass" : "fail",
            message: ok
              ? rule120
                ? `${p.item.tag}: 125 % of ${sourceA.toFixed(1)} A + ${main} A main = ${lhs.toFixed(1)} A ≤ 120 % of the ${bus} A bus (${rhs.toFixed(0)} A). Place the inverter breaker at the end opposite the main.`
                : `${p.item.tag}: breakers other than the main total ${sum! - main} A ≤ the ${bus} A bus (sum-of-breakers rule).`
              : `${p.item.tag}: 125 % of ${sourceA.toFixed(1)} A + ${main} A main = ${lhs.toFixed(1)} A exceeds 120 % of the ${bus} A bus (${rhs.toFixed(0)} A); downsize the main, upsize the bus or connect on the supply side.`,
            ...(ok ? {} : { reason: "neither the 120 % rule nor the sum-of-breakers rule is met" }),
            remedy: () => {
              const mainFit = largestStandardRatingA(ctx.edition, "breaker", rhs - 1.25 * sourceA);
              const busNeed = Math.ceil(lhs / 1.2);
              return remedy(
                mainFit !== undefined
                  ? `Lower the main of ${p.item.tag} to ${mainFit} A where the load calculation allows (1.25 × ${sourceA.toFixed(1)} A + ${mainFit} A ≤ ${rhs.toFixed(0)} A); or use a bus of at least ${busNeed} A, or connect on the supply side.`
                  : `Use a bus of at least ${busNeed} A, or connect on the supply side.`,
                ...(mainFit !== undefined ? [{ path: `${p.path}.mainBreakerA`, value: mainFit }] : []),
              );
            },
            values: [
              v("sourceA", "Inverter output current", sourceA, "A"),
              v("mainA", "Main breaker", main, "A"),
              v("busA", "Bus rating", bus, "A"),
              v("lhsA", "125 % of source + main", lhs, "A"),
              v("rhsA", "120 % of bus", rhs, "A"),
              ...(sum !== undefined ? [v("sumOfBreakersA", "Sum of breakers", sum, "A")] : []),
            ],
            formula: `1.25 × ${sourceA.toFixed(1)} A + ${main} A ≤ 1.2 × ${bus} A`,
            inputs: t.inputs,
            codeRefs: [...codeRefs, ...refs(ctx.edition, "busbar-120-percent", "busbar-sum-of-breakers")],
          }),
        );
      } else {
        const main = t.read(`${p.path}.mainBreakerA`, `Main breaker of ${p.item.tag}`, p.item.mainBreakerA, "A");
        if (bus === undefined || t.missing.length) {
          out.push(needsInput(this, { subject: p.item.tag, inputs: t.inputs, missing: t.missing, codeRefs }));
          continue;
        }
        const problems: string[] = [];
        if (deviceSumA > bus) problems.push(`the inverter output device${feeds.length > 1 ? "s" : ""} (${deviceSumA} A) exceed${feeds.length > 1 ? "" : "s"} the ${bus} A bus`);
        if (main !== undefined && main < deviceSumA) problems.push(`the ${main} A main is smaller than the ${deviceSumA} A inverter output device and would trip before it`);
        if (main !== undefined && main > bus) problems.push(`the ${main} A main exceeds the ${bus} A bus`);
        out.push(
          makeResult(this, {
            subject: p.item.tag,
            status: problems.length ? "fail" : "pass",
            message: problems.length ? `${p.item.tag}: ${problems.join("; ")}.` : `${p.item.tag}: ${bus} A bus${main !== undefined ? ` and ${main} A main` : ""} rated for the ${deviceSumA} A inverter output device.`,
            ...(problems.length ? { reason: problems.join("; ") } : {}),
            remedy: () => {
              if (deviceSumA > bus) return remedy(`Use a panel whose bus is rated at least ${deviceSumA} A, the inverter output device${feeds.length > 1 ? "s" : ""} it carries.`);
              const mainFit = nextStandardRatingA(ctx.edition, "breaker", deviceSumA);
              return mainFit !== undefined && mainFit <= bus
                ? remedy(`Use a ${mainFit} A main: at least the ${deviceSumA} A output device and within the ${bus} A bus.`, { path: `${p.path}.mainBreakerA`, value: mainFit })
                : remedy(`Use a main rated between ${deviceSumA} A and ${bus} A.`);
            },
            values: [v("busA", "Bus rating", bus, "A"), v("outputDeviceA", "Inverter output device", deviceSumA, "A"), ...(main !== undefined ? [v("mainA", "Main breaker", main, "A")] : [])],
            formula: `output device ${deviceSumA} A ≤ bus ${bus} A${main !== undefined ? ` and ≤ main ${main} A` : ""}`,
            inputs: t.inputs,
            codeRefs,
          }),
        );
      }
    }
    return out;
  },
};
