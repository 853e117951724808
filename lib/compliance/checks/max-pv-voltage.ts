/** 1. Maximum PV system voltage at the design low temperature (690.7). */
import { Trace, v, type CheckContext, isProtective } from "../context";
import { arrayMaxVoltage, arrayParts, pvInputOf } from "../derive/pv";
import { refs } from "../refs";
import { makeResult, needsInput, type CheckDefinition } from "../result";
import type { CheckResult, Remedy } from "../types";
import { remedy } from "../derive/remedy";

/**
 * A ground-mounted array whose PV circuits are all recorded as staying outside buildings. An empty
 * entersBuilding, or an array with no circuit recorded, keeps the building limit (the stricter reading).
 */
function outsideBuildings(ctx: CheckContext, arrayTag: string, t: Trace): boolean {
  if (ctx.record.site.mounting !== "ground") return false;
  const circuits = ctx.circuitsByArray.get(arrayTag) ?? [];
  for (const c of circuits) t.read(`${c.path}.entersBuilding`, `${c.item.tag} enters a building`, c.item.entersBuilding);
  return circuits.length > 0 && circuits.every((c) => c.item.entersBuilding === false);
}

export const maxPvVoltage: CheckDefinition = {
  id: "max-pv-voltage",
  title: "Maximum PV system voltage at the design low temperature",
  scopeTopic: "max-voltage",
  formula:
    "Voc × modules in series × cold correction (module coefficient, else Table 690.7(A)) ≤ every rating on the circuit and the building limit (600 V on or in one- and two-family dwellings, 1000 V on or in other buildings, 1500 V with listed equipment where the PV circuits are not on or in a building)",
  run(ctx: CheckContext): CheckResult[] {
    const codeRefs = refs(ctx.edition, "max-voltage", "voltage-correction-table", "building-voltage-limit");
    const out: CheckResult[] = [];
    for (const { item: array } of ctx.arrays.values()) {
      const t = new Trace();
      const d = arrayMaxVoltage(ctx, array.tag);
      t.merge(d);
      const parts = arrayParts(ctx, array.tag)!;
      const input = pvInputOf(ctx, parts);
      if (input?.unresolved) t.need(input.unresolved, "MPPT input the string lands on", undefined);
      if (!d.ok || input?.unresolved) {
        out.push(needsInput(this, { subject: array.tag, inputs: t.inputs, missing: t.missing, codeRefs, ...(d.ok ? {} : { reason: d.reason }) }));
        continue;
      }
      const vmax = d.value.maxVoltageV;
      const limits: { label: string; limitV: number }[] = [];
      const dwelling = ctx.record.site.occupancy === "one-two-family-dwelling";
      t.read("site.occupancy", "Occupancy", ctx.record.site.occupancy);
      if (outsideBuildings(ctx, array.tag, t)) {
        // 690.7: PV DC circuits not on or in buildings may reach 1500 V with equipment listed for it.
        limits.push({ label: "limit for PV circuits not on or in a building (listed equipment)", limitV: 1500 });
      } else {
        // 690.7: up to 600 V on or in one- and two-family dwellings, 1000 V on or in other buildings.
        limits.push({ label: dwelling ? "one- and two-family dwelling limit" : "limit on or in other buildings", limitV: dwelling ? 600 : 1000 });
      }
      if (input) {
        const max = t.need(input.maxVoltagePath, `Maximum input voltage of ${input.label}`, input.maxVoltageV, "V");
        if (max !== undefined) limits.push({ label: `${input.label} maximum input`, limitV: max });
      }
      const modRating = parts.module
        ? t.need(`${parts.module.path}.maxSystemVoltageV`, `Maximum system voltage of ${parts.module.item.tag}`, parts.module.item.maxSystemVoltageV, "V")
        : undefined;
      if (modRating !== undefined) limits.push({ label: `module ${parts.module!.item.tag} system voltage rating`, limitV: modRating });
      for (const c of ctx.circuitsByArray.get(array.tag) ?? []) {
        for (const tag of c.item.disconnectTags) {
          const dev = ctx.equipment.get(tag);
          if (!dev || !isProtective(dev.item)) continue;
          const rating = t.need(`${dev.path}.voltageRatingV`, `Voltage rating of ${tag}`, dev.item.voltageRatingV, "V");
          if (rating !== undefined) limits.push({ label: `disconnect ${tag} on ${c.item.tag}`, limitV: rating });
        }
      }
      const values = [...d.values, ...limits.map((l, i) => v(`limit${i}`, l.label, l.limitV, "V"))];
      const exceeded = limits.filter((l) => vmax > l.limitV);
      if (exceeded.length > 0) {
        out.push(
          makeResult(this, {
            subject: array.tag,
            status: "fail",
            message: `${array.tag}: ${vmax.toFixed(1)} V at ${d.value.lowTempC} °C exceeds the ${exceeded.map((l) => `${l.label} (${l.limitV} V)`).join(", ")}.`,
            reason: `maximum string voltage ${vmax.toFixed(1)} V is above ${exceeded.map((l) => `${l.limitV} V`).join(", ")}; fewer modules in series or equipment rated higher`,
            remedy: () => seriesRemedy(parts.array.path, array.modulesInSeries, vmax, limits),
            values,
            formula: d.formula,
            inputs: t.inputs,
            codeRefs,
          }),
        );
      } else if (t.missing.length > 0) {
        out.push(needsInput(this, { subject: array.tag, values, formula: d.formula, inputs: t.inputs, missing: t.missing, codeRefs }));
      } else {
        const tightest = limits.reduce((a, b) => (b.limitV < a.limitV ? b : a));
        out.push(
          makeResult(this, {
            subject: array.tag,
            status: "pass",
            message: `${array.tag}: ${vmax.toFixed(1)} V at ${d.value.lowTempC} °C, within the ${tightest.label} of ${tightest.limitV} V.`,
            values,
            formula: d.formula,
            inputs: t.inputs,
            codeRefs,
          }),
        );
      }
    }
    return out;
  },
};

/** 690.7: the longest string whose cold Voc stays within the lowest limit on the circuit (voltage scales with the count). */
function seriesRemedy(arrayPath: string, n: number, vmaxV: number, limits: { label: string; limitV: number }[]): Remedy {
  const tightest = limits.reduce((a, b) => (b.limitV < a.limitV ? b : a));
  const perModuleV = vmaxV / n;
  const fit = Math.floor(tightest.limitV / perModuleV + 1e-9);
  if (fit < 1) return remedy(`One module alone reaches ${perModuleV.toFixed(1)} V at the design low temperature, above the ${tightest.label} (${tightest.limitV} V): choose equipment rated higher.`);
  return remedy(
    `Put at most ${fit} modules in series: ${fit} × ${perModuleV.toFixed(2)} V = ${(fit * perModuleV).toFixed(1)} V ≤ the ${tightest.label} (${tightest.limitV} V). Or choose equipment rated higher.`,
    { path: `${arrayPath}.modulesInSeries`, value: fit },
  );
}
