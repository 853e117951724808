/**
 * 8. Voltage drop per circuit and along each array's path. The NEC only
 * recommends a limit (informational notes), so a breach warns; 3 % by common
 * practice unless the jurisdiction sets its own.
 */
import { CONDUCTOR_SIZES_ASCENDING, compareConductorSize, dcResistanceOhmPerKft } from "../tables";
import type { Circuit, ConductorSize } from "../../schemas/project-record";
import { circuitArrayTag, isPvCircuit, sizeLabel, Trace, v, type CheckContext, type Indexed } from "../context";
import { arrayParts } from "../derive/pv";
import { DEFAULT_VOLTAGE_DROP_LIMIT_PCT } from "../../schemas/vocabulary";
import { circuitCurrent } from "../derive/circuit-current";
import { remedy } from "../derive/remedy";
import { refs } from "../refs";
import { makeResult, needsInput, type CheckDefinition } from "../result";
import type { CheckResult, Remedy } from "../types";

/**
 * Drop, V, through the conductor's resistance (Chapter 9 Table 8 at 75 °C): out and back (2 × I × R × L) on DC and
 * single-phase circuits; √3 × I × R × L line to line on a balanced three-phase circuit.
 */
export function voltageDropV(lengthFt: number, ohmPerKft: number, currentA: number, sets = 1, phases: 1 | 3 = 1): number {
  return (phaseFactor(phases) * lengthFt * ohmPerKft * currentA) / (1000 * sets);
}

function phaseFactor(phases: 1 | 3): number {
  return phases === 3 ? Math.sqrt(3) : 2;
}

function pvModuleOf(ctx: CheckContext, c: Circuit) {
  const arrayTag = circuitArrayTag(ctx, c);
  return arrayTag !== undefined ? arrayParts(ctx, arrayTag)?.module : undefined;
}

export const voltageDrop: CheckDefinition = {
  id: "voltage-drop",
  title: "Voltage drop",
  scopeTopic: "voltage-drop",
  formula:
    "k × one-way length × Ω/kft × operating current ÷ 1000 ÷ operating voltage ≤ limit, with k = 2 on DC and single-phase circuits and √3 on three-phase circuits (line-to-line voltage)",
  run(ctx: CheckContext): CheckResult[] {
    const ed = ctx.edition;
    const codeRefs = refs(ed, "voltage-drop", "dc-resistance");
    const local = ctx.record.jurisdiction.voltageDropLimitPct;
    const limit = local ?? DEFAULT_VOLTAGE_DROP_LIMIT_PCT;
    const limitNote = local !== undefined ? `${ctx.record.jurisdiction.name} limit ${limit} %` : `${limit} % (common practice)`;
    const out: CheckResult[] = [];
    const pctByCircuit = new Map<string, number | undefined>();
    for (const ci of ctx.circuits) {
      const c = ci.item;
      const t = new Trace();
      if (local !== undefined) t.read("jurisdiction.voltageDropLimitPct", "Local voltage-drop limit", local, "%");
      const cur = circuitCurrent(ctx, ci);
      t.merge(cur);
      const len = t.need(`${ci.path}.lengthFt`, "One-way length", c.lengthFt, "ft");
      const size = t.need(`${ci.path}.size`, "Conductor size", c.size, "AWG/kcmil");
      let I: number | undefined;
      let V: number | undefined;
      const phases = cur.ok ? (cur.value.phases ?? 1) : 1;
      const side = cur.ok ? cur.value.side : "dc";
      if (cur.ok) {
        I = cur.value.operatingCurrentA;
        V = cur.value.operatingVoltageV;
        // A PV circuit runs at the module's Imp and Vmp; other circuits take the design current and nominal voltage.
        const module = isPvCircuit(c) ? pvModuleOf(ctx, c) : undefined;
        if (I === undefined) {
          if (module) t.need(`${module.path}.impA`, `Imp of ${module.item.tag}`, undefined, "A");
          else t.need(`${ci.path}.designCurrentA`, "Operating current", undefined, "A");
        }
        if (V === undefined) {
          if (module) t.need(`${module.path}.vmpV`, `Vmp of ${module.item.tag}`, undefined, "V");
          else t.need(`${ci.path}.nominalVoltageV`, "Operating voltage", undefined, "V");
        }
      }
      const r = size !== undefined ? dcResistanceOhmPerKft(c.material, size) : undefined;
      if (len === undefined || size === undefined || I === undefined || V === undefined || r === undefined || t.missing.length) {
        pctByCircuit.set(c.tag, undefined);
        out.push(needsInput(this, { subject: c.tag, inputs: t.inputs, missing: t.missing.length ? t.missing : [`${ci.path}.size`], codeRefs, ...(cur.ok ? {} : { reason: cur.reason }) }));
        continue;
      }
      const dropV = voltageDropV(len, r, I, c.parallelSets, phases);
      const pct = (dropV / V) * 100;
      pctByCircuit.set(c.tag, pct);
      const over = pct > limit;
      out.push(
        makeResult(this, {
          subject: c.tag,
          status: over ? "warning" : "pass",
          message: over
            ? `${c.tag}: ${pct.toFixed(2)} % drop exceeds ${limitNote}; a larger conductor or shorter run is recommended.`
            : `${c.tag}: ${pct.toFixed(2)} % drop, within ${limitNote}.`,
          ...(over ? { reason: `${pct.toFixed(2)} % is above ${limit} %; the NEC recommends, it does not require, a limit` } : {}),
          remedy: () => dropRemedy(ci, size, r, pct, limit),
          values: [
            v("resistanceOhmPerKft", `Resistance of ${size} ${c.material}`, r, "Ω/kft"),
            v("currentA", "Operating current", I, "A"),
            v("voltageV", phases === 3 ? "Operating voltage, line to line" : "Operating voltage", V, "V"),
            v("phases", "Phases", side === "dc" ? "DC" : phases, ""),
            v("dropV", "Voltage drop", dropV, "V"),
            v("dropPct", "Voltage drop", pct, "%"),
            v("limitPct", "Limit", limit, "%"),
          ],
          formula: `${phases === 3 ? "√3" : "2"} × ${len} ft × ${r} Ω/kft × ${I.toFixed(2)} A ÷ 1000${c.parallelSets > 1 ? ` ÷ ${c.parallelSets} sets` : ""} = ${dropV.toFixed(3)} V; ÷ ${V.toFixed(1)} V = ${pct.toFixed(2)} %`,
          inputs: t.inputs,
          codeRefs,
        }),
      );
    }
    for (const [arrayTag, circuits] of ctx.circuitsByArray) {
      if (circuits.length < 2) continue;
      const parts = circuits.map((c) => pctByCircuit.get(c.item.tag));
      if (parts.some((p) => p === undefined)) {
        out.push(
          needsInput(this, {
            subject: arrayTag,
            message: `${arrayTag}: the path total needs every PV circuit's drop.`,
            missing: circuits.filter((c) => pctByCircuit.get(c.item.tag) === undefined).map((c) => `${c.path}.lengthFt`),
            codeRefs,
          }),
        );
        continue;
      }
      const total = parts.reduce<number>((a, b) => a + (b ?? 0), 0);
      const over = total > limit;
      out.push(
        makeResult(this, {
          subject: arrayTag,
          status: over ? "warning" : "pass",
          message: over ? `${arrayTag}: ${total.toFixed(2)} % from array to input exceeds ${limitNote}.` : `${arrayTag}: ${total.toFixed(2)} % from array to input, within ${limitNote}.`,
          ...(over ? { reason: `total ${total.toFixed(2)} % above ${limit} %` } : {}),
          values: [v("totalPct", "Total drop along the path", total, "%"), v("limitPct", "Limit", limit, "%")],
          formula: `sum of ${circuits.map((c) => c.item.tag).join(" + ")}`,
          codeRefs,
        }),
      );
    }
    return out;
  },
};

/** The drop scales with the conductor's resistance, so the smallest size whose resistance brings it within the limit. */
function dropRemedy(ci: Indexed<Circuit>, size: ConductorSize, ohmPerKft: number, pct: number, limitPct: number): Remedy | undefined {
  for (const candidate of CONDUCTOR_SIZES_ASCENDING) {
    if (compareConductorSize(candidate, size) <= 0) continue;
    const r = dcResistanceOhmPerKft(ci.item.material, candidate);
    if (r === undefined) continue;
    const newPct = (pct * r) / ohmPerKft;
    if (newPct <= limitPct) {
      return remedy(`Use ${sizeLabel(candidate, ci.item.material)}: the drop falls to ${newPct.toFixed(2)} %, within ${limitPct} %.`, {
        path: `${ci.path}.size`,
        value: candidate,
      });
    }
  }
  return undefined;
}
