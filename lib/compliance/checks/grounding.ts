/**
 * 7. Equipment grounding and grounding electrode conductors (690.43, 690.45,
 * 250.122, 250.166): each EGC sized from the device that protects the circuit
 * (for an unprotected PV circuit, the device 690.9(B) would call for).
 */
import { compareConductorSize, minimumEgcSize, nextStandardOcpdRatingA } from "../tables";
import { isPvCircuit, sizeLabel, Trace, v, type CheckContext, isProtective } from "../context";
import { circuitCurrent } from "../derive/circuit-current";
import { remedy } from "../derive/remedy";
import { refs } from "../refs";
import { makeResult, needsInput, type CheckDefinition } from "../result";
import type { CheckResult } from "../types";

export const grounding: CheckDefinition = {
  id: "grounding",
  title: "Equipment grounding conductor",
  scopeTopic: "egc-table",
  formula:
    "EGC ≥ Table 250.122 size for the protecting device (for unprotected PV circuits, the device 690.9(B) would require)",
  run(ctx: CheckContext): CheckResult[] {
    const ed = ctx.edition;
    const out: CheckResult[] = [];
    for (const ci of ctx.circuits) {
      const c = ci.item;
      const pv = isPvCircuit(c);
      const codeRefs = refs(ed, "egc-table", ...(pv ? (["pv-egc"] as const) : []));
      const t = new Trace();
      const egc = t.need(`${ci.path}.egcSize`, "EGC size", c.egcSize, "AWG/kcmil");
      t.read(`${ci.path}.egcMaterial`, "EGC material", c.egcMaterial);
      let ocpdA: number | undefined;
      let basis = "";
      const dev = c.ocpdTag ? ctx.equipment.get(c.ocpdTag) : undefined;
      if (dev && isProtective(dev.item)) {
        ocpdA = t.need(`${dev.path}.ratingA`, `Rating of ${dev.item.tag}`, dev.item.ratingA, "A");
        basis = `${dev.item.tag} ${ocpdA ?? "—"} A`;
      } else if (pv) {
        const cur = circuitCurrent(ctx, ci);
        t.merge(cur);
        if (cur.ok) {
          // 690.45: without a device, the one 690.9(B) would require is assumed.
          ocpdA = nextStandardOcpdRatingA(1.25 * cur.value.currentA);
          basis = `assumed ${ocpdA} A device (125 % of ${cur.value.currentA.toFixed(1)} A, 690.45)`;
        }
      } else {
        t.need(`${ci.path}.ocpdTag`, "Overcurrent device", undefined);
      }
      if (egc === undefined || ocpdA === undefined || t.missing.length) {
        out.push(needsInput(this, { subject: c.tag, inputs: t.inputs, missing: t.missing, codeRefs }));
        continue;
      }
      const table = minimumEgcSize(ocpdA, c.egcMaterial);
      if (table === undefined) {
        out.push(
          makeResult(this, {
            subject: c.tag,
            status: "fail",
            message: `${c.tag}: Table 250.122 has no EGC size for a ${ocpdA} A device.`,
            reason: "device rating outside Table 250.122",
            remedy: remedy(`Table 250.122 stops at 6000 A: size the EGC by engineering supervision, or divide the circuit so each device is within the table.`),
            inputs: t.inputs,
            codeRefs,
          }),
        );
        continue;
      }
      // 250.122(A): the EGC need not be larger than the circuit conductors.
      const required = c.size !== undefined && c.egcMaterial === c.material && compareConductorSize(c.size, table) < 0 ? c.size : table;
      const ok = compareConductorSize(egc, required) >= 0;
      const values = [v("ocpdA", "Device the EGC is sized from", ocpdA, "A"), v("requiredEgc", "Minimum EGC (Table 250.122)", required, "AWG/kcmil"), v("egc", "EGC recorded", egc, "AWG/kcmil")];
      out.push(
        makeResult(this, {
          subject: c.tag,
          status: ok ? "pass" : "fail",
          message: ok
            ? `${c.tag}: ${sizeLabel(egc, c.egcMaterial)} EGC meets the ${sizeLabel(required)} minimum for ${basis}.`
            : `${c.tag}: ${sizeLabel(egc, c.egcMaterial)} EGC is smaller than the ${sizeLabel(required)} that Table 250.122 requires for ${basis}.`,
          ...(ok ? {} : { reason: `EGC ${egc} below ${required}` }),
          remedy: remedy(`Use a ${sizeLabel(required, c.egcMaterial)} EGC, the Table 250.122 size for ${basis}.`, { path: `${ci.path}.egcSize`, value: required }),
          values,
          formula: `Table 250.122 at ${ocpdA} A, ${c.egcMaterial} → ${table}${required !== table ? `, limited to the circuit conductor ${required} (250.122(A))` : ""}`,
          inputs: t.inputs,
          codeRefs,
        }),
      );
    }
    return out;
  },
};
