/**
 * Currents of the DC circuits: PV source and output circuits from the array's
 * Isc (690.8(A)), battery and inverter DC input circuits from the charge
 * controller, the inverter or the battery at their ends (706.30 / 2017
 * 706.20(A)), else the design current.
 */
import { circuitArrayTag, endpoint, isInverter, kindIs, Trace, v, type Indexed } from "../context";
import { localRef, refs, storageRefs } from "../refs";
import { batteryMaxVoltage, systemBattery, type Battery } from "./battery";
import { cannotDerive, derived, type CurrentComputation, type Inverter } from "./circuit-current-kind";
import { arrayIsc, arrayMaxVoltage } from "./pv";

/** Continuous DC input current of an inverter at its lowest battery voltage and efficiency, or its nameplate figure. */
export function inverterDcInputCurrent(inv: Indexed<Inverter>, t: Trace): { currentA: number; formula: string } | undefined {
  const e = inv.item;
  const w = t.read(`${inv.path}.continuousW`, `Continuous output of ${e.tag}`, e.continuousW, "W");
  const vmin = t.read(`${inv.path}.minBatteryVoltageV`, `Lowest battery voltage of ${e.tag}`, e.minBatteryVoltageV, "V");
  const eff = t.read(`${inv.path}.efficiencyPct`, `Efficiency of ${e.tag}`, e.efficiencyPct, "%");
  const plate = t.read(`${inv.path}.maxDcInputCurrentA`, `Maximum DC input current of ${e.tag}`, e.maxDcInputCurrentA, "A");
  const computed = w !== undefined && vmin !== undefined && eff !== undefined ? w / (vmin * (eff / 100)) : undefined;
  if (computed === undefined && plate === undefined) {
    for (const [p, val] of [
      [`${inv.path}.continuousW`, w],
      [`${inv.path}.minBatteryVoltageV`, vmin],
      [`${inv.path}.efficiencyPct`, eff],
    ] as const) {
      if (val === undefined && !t.missing.includes(p)) t.missing.push(p);
    }
    return undefined;
  }
  const currentA = Math.max(computed ?? 0, plate ?? 0);
  const parts: string[] = [];
  if (computed !== undefined) parts.push(`${w} W ÷ (${vmin} V × ${eff} %) = ${computed.toFixed(1)} A`);
  if (plate !== undefined) parts.push(`nameplate ${plate} A`);
  return { currentA, formula: parts.length > 1 ? `larger of ${parts.join(" and ")}` : parts[0]! };
}

/** PV source and output circuits: 125 % of the module Isc times the strings carried (690.8(A)(1)). */
export const pvCircuitCurrent: CurrentComputation = (ctx, ci, t) => {
  const c = ci.item;
  const arrayTag = circuitArrayTag(ctx, c);
  if (arrayTag === undefined || !ctx.arrays.has(arrayTag)) {
    t.need(`${ci.path}.arrayTag`, "Array carried", undefined);
    return cannotDerive("a PV circuit needs the array it carries", t);
  }
  const isc = arrayIsc(ctx, arrayTag);
  t.merge(isc);
  if (!isc.ok) return cannotDerive(isc.reason, t);
  const arr = ctx.arrays.get(arrayTag)!;
  const strings =
    c.kind === "pv-output"
      ? isc.value.strings
      : (t.read(`${ci.path}.stringsCarried`, "Strings carried", c.stringsCarried) ?? 1);
  const currentA = 1.25 * isc.value.iscA * strings;
  const vmax = arrayMaxVoltage(ctx, arrayTag);
  t.merge(vmax);
  const values = [v("iscA", "Module Isc", isc.value.iscA, "A"), v("strings", "Strings carried", strings, ""), v("currentA", "Maximum circuit current, 690.8(A)(1)", currentA, "A")];
  const imp = isc.value.impA;
  const vmp = isc.value.vmpV;
  return derived(
    {
      currentA,
      sizingFactor: 1.25,
      ...(imp !== undefined ? { operatingCurrentA: imp * strings } : {}),
      ...(vmp !== undefined ? { operatingVoltageV: vmp * arr.item.modulesInSeries } : {}),
      ...(vmax.ok ? { maxVoltageV: vmax.value.maxVoltageV } : {}),
      side: "dc",
      basis: `125 % of Isc × ${strings} string${strings === 1 ? "" : "s"} of ${arrayTag}`,
      codeRefs: refs(ctx.edition, "pv-circuit-current"),
    },
    values,
    `1.25 × Isc ${isc.value.iscA} A × ${strings} = ${currentA.toFixed(2)} A`,
    t,
  );
};

/**
 * Battery and inverter DC input circuits: the charge controller's rated output, else the inverter's DC input at
 * its lowest battery voltage, else one battery unit's continuous discharge; a larger design current wins.
 */
export const storageCircuitCurrent: CurrentComputation = (ctx, ci, t) => {
  const c = ci.item;
  const design = t.read(`${ci.path}.designCurrentA`, "Design current", c.designCurrentA, "A");
  const bat = endpoint(ctx, c, kindIs("battery")) ?? systemBattery(ctx);
  const maxV = bat ? batteryMaxVoltage(bat as Indexed<Battery>, new Trace()) : undefined;
  const nominal = bat?.item.nominalVoltageV;
  const controller = endpoint(ctx, c, kindIs("charge-controller"));
  const inverter = endpoint(ctx, c, isInverter) as Indexed<Inverter> | undefined;
  let currentA: number | undefined;
  let formula = "";
  let basis = "";
  let operatingCurrentA: number | undefined;
  const codeRefs = storageRefs(ctx, "ess-circuit-current");
  if (controller) {
    const rated = t.need(`${controller.path}.ratedOutputCurrentA`, `Rated output of ${controller.item.tag}`, controller.item.ratedOutputCurrentA, "A");
    if (rated !== undefined) {
      currentA = rated;
      operatingCurrentA = rated;
      formula = `controller ${controller.item.tag} rated output ${rated} A`;
      basis = "the charge controller's rated output current";
    }
  } else if (inverter) {
    const dc = inverterDcInputCurrent(inverter, t);
    if (dc) {
      currentA = dc.currentA;
      formula = dc.formula;
      basis = `inverter ${inverter.item.tag} at rated power and its lowest battery voltage`;
      codeRefs.push(localRef(ctx.edition, "inverter-output-current"));
      const w = inverter.item.continuousW;
      const eff = inverter.item.efficiencyPct;
      const vn = inverter.item.nominalBatteryVoltageV ?? nominal;
      operatingCurrentA = w !== undefined && eff !== undefined && vn !== undefined ? w / (vn * (eff / 100)) : currentA;
    }
  } else if (bat && design === undefined) {
    const dis = t.need(`${bat.path}.maxContinuousDischargeA`, `Continuous discharge of ${bat.item.tag}`, bat.item.maxContinuousDischargeA, "A");
    if (dis !== undefined) {
      // One unit's lead: a bank of several units lands each on its own circuit to the bus.
      currentA = dis;
      operatingCurrentA = currentA;
      formula = `maximum continuous discharge of one ${bat.item.tag} unit, ${dis} A`;
      basis = "one battery unit's maximum continuous discharge current";
    }
  }
  if (design !== undefined && (currentA === undefined || design > currentA)) {
    currentA = design;
    operatingCurrentA ??= design;
    formula = `design current ${design} A`;
    basis = "the design current recorded for the circuit";
  }
  if (currentA === undefined) {
    if (!t.missing.length) t.need(`${ci.path}.designCurrentA`, "Design current", undefined, "A");
    return cannotDerive("the circuit current cannot be derived from the record", t);
  }
  return derived(
    {
      currentA,
      sizingFactor: 1.25,
      ...(operatingCurrentA !== undefined ? { operatingCurrentA } : {}),
      ...(nominal !== undefined ? { operatingVoltageV: nominal } : inverter?.item.nominalBatteryVoltageV !== undefined ? { operatingVoltageV: inverter.item.nominalBatteryVoltageV } : {}),
      ...(maxV !== undefined ? { maxVoltageV: maxV } : {}),
      side: "dc",
      basis,
      codeRefs,
    },
    [v("currentA", "Continuous current", currentA, "A")],
    formula,
    t,
  );
};
