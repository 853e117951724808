/**
 * The current each circuit is sized for (690.8(A) for PV circuits, the
 * equipment's continuous rating for the rest), its operating current and
 * voltage for voltage drop, and its highest voltage for device ratings.
 */
import type { Circuit } from "../../schemas/project-record";
import {
  circuitArrayTag,
  endpoint,
  isInverter,
  isPvCircuit,
  kindIs,
  memo,
  Trace,
  v,
  type CheckContext,
  type Derived,
  type EquipmentOf,
  type Indexed,
} from "../context";
import { refs, localRef, storageRefs } from "../refs";
import type { CheckValue } from "../types";
import { batteryMaxVoltage, systemBattery, type Battery } from "./battery";
import { arrayIsc, arrayMaxVoltage } from "./pv";

export interface CircuitCurrent {
  /** 690.8(A) maximum current for PV circuits; the continuous current otherwise. */
  currentA: number;
  /** Factor the conductor and device must carry above `currentA`: 1.25 continuous (690.8(B), 210.19), 1.15 generators (445.13). */
  sizingFactor: number;
  /** Current at normal operation, for voltage drop (Imp for PV). */
  operatingCurrentA?: number;
  /** Voltage at normal operation, for voltage drop. */
  operatingVoltageV?: number;
  /** Highest voltage of the circuit, for device voltage ratings. */
  maxVoltageV?: number;
  side: "dc" | "ac";
  /** AC circuits: 1 (single or split phase) or 3; the voltage is then line to line. */
  phases?: 1 | 3;
  basis: string;
  codeRefs: string[];
}

type Inverter = EquipmentOf<"inverter" | "inverter-charger" | "hybrid-inverter">;

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

function acVoltage(inv: Inverter): number | undefined {
  if (inv.acOutputVoltageV !== undefined) return inv.acOutputVoltageV;
  if (inv.acOutput === undefined) return undefined;
  // Line-to-line of a split or wye output: the figure its power divides by.
  return { "120": 120, "240": 240, "120/240": 240, "208": 208, "277/480": 480 }[inv.acOutput];
}

/**
 * Phases of an AC circuit: its own field, else the inverter's or generator's at its ends, else single
 * phase (for the same power, single phase gives the larger current and drop, so the guess errs safe).
 */
export function circuitPhases(ctx: CheckContext, ci: Indexed<Circuit>, t: Trace): 1 | 3 {
  const own = t.read(`${ci.path}.phases`, "Phases", ci.item.phases);
  if (own !== undefined) return own;
  const inverter = endpoint(ctx, ci.item, isInverter) as Indexed<Inverter> | undefined;
  if (inverter) {
    return t.read(`${inverter.path}.acOutputPhases`, `AC output phases of ${inverter.item.tag}`, inverter.item.acOutputPhases) === 3 ? 3 : 1;
  }
  const gen = endpoint(ctx, ci.item, kindIs("generator"));
  if (gen) return t.read(`${gen.path}.phases`, `Phases of ${gen.item.tag}`, gen.item.phases) === 3 ? 3 : 1;
  return 1;
}

/** Line current from power: P ÷ V single phase, P ÷ (√3 × V line to line) three phase. */
export function currentFromPowerA(watts: number, voltageV: number, phases: 1 | 3): number {
  return phases === 3 ? watts / (Math.sqrt(3) * voltageV) : watts / voltageV;
}

function powerFormula(watts: number, voltageV: number, phases: 1 | 3, currentA: number): string {
  return phases === 3
    ? `${watts} W ÷ (√3 × ${voltageV} V line to line) = ${currentA.toFixed(1)} A`
    : `${watts} W ÷ ${voltageV} V = ${currentA.toFixed(1)} A`;
}

function fail(reason: string, t: Trace): Derived<CircuitCurrent> {
  return { ok: false, reason, inputs: t.inputs, missing: t.missing, values: [], formula: "" };
}

export function circuitCurrent(ctx: CheckContext, c: Indexed<Circuit>): Derived<CircuitCurrent> {
  return memo(ctx, `circuit-current:${c.item.tag}`, () => {
    const d = computeCircuitCurrent(ctx, c);
    // Where no equipment sets the voltage, the circuit's own nominal voltage does.
    const nominal = c.item.nominalVoltageV;
    if (d.ok && nominal !== undefined && !isPvCircuit(c.item)) {
      if (d.value.operatingVoltageV === undefined) d.value.operatingVoltageV = nominal;
      if (d.value.maxVoltageV === undefined) d.value.maxVoltageV = nominal;
    }
    return d;
  });
}

function computeCircuitCurrent(ctx: CheckContext, ci: Indexed<Circuit>): Derived<CircuitCurrent> {
  const c = ci.item;
  const t = new Trace();
  const ed = ctx.edition;
  t.read(`${ci.path}.kind`, "Circuit kind", c.kind);
  const values: CheckValue[] = [];

  if (c.kind === "pv-source" || c.kind === "pv-output") {
    const arrayTag = circuitArrayTag(ctx, c);
    if (arrayTag === undefined || !ctx.arrays.has(arrayTag)) {
      t.need(`${ci.path}.arrayTag`, "Array carried", undefined);
      return fail("a PV circuit needs the array it carries", t);
    }
    const isc = arrayIsc(ctx, arrayTag);
    t.merge(isc);
    if (!isc.ok) return fail(isc.reason, t);
    const arr = ctx.arrays.get(arrayTag)!;
    const strings =
      c.kind === "pv-output"
        ? isc.value.strings
        : (t.read(`${ci.path}.stringsCarried`, "Strings carried", c.stringsCarried) ?? 1);
    const currentA = 1.25 * isc.value.iscA * strings;
    const vmax = arrayMaxVoltage(ctx, arrayTag);
    t.merge(vmax);
    values.push(v("iscA", "Module Isc", isc.value.iscA, "A"), v("strings", "Strings carried", strings, ""), v("currentA", "Maximum circuit current, 690.8(A)(1)", currentA, "A"));
    const imp = isc.value.impA;
    const vmp = isc.value.vmpV;
    return {
      ok: true,
      value: {
        currentA,
        sizingFactor: 1.25,
        ...(imp !== undefined ? { operatingCurrentA: imp * strings } : {}),
        ...(vmp !== undefined ? { operatingVoltageV: vmp * arr.item.modulesInSeries } : {}),
        ...(vmax.ok ? { maxVoltageV: vmax.value.maxVoltageV } : {}),
        side: "dc",
        basis: `125 % of Isc × ${strings} string${strings === 1 ? "" : "s"} of ${arrayTag}`,
        codeRefs: refs(ed, "pv-circuit-current"),
      },
      values,
      formula: `1.25 × Isc ${isc.value.iscA} A × ${strings} = ${currentA.toFixed(2)} A`,
      inputs: t.inputs,
      missing: t.missing,
    };
  }

  const design = t.read(`${ci.path}.designCurrentA`, "Design current", c.designCurrentA, "A");

  if (c.kind === "battery" || c.kind === "inverter-dc-input") {
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
        codeRefs.push(localRef(ed, "inverter-output-current"));
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
      return fail("the circuit current cannot be derived from the record", t);
    }
    values.push(v("currentA", "Continuous current", currentA, "A"));
    return {
      ok: true,
      value: {
        currentA,
        sizingFactor: 1.25,
        ...(operatingCurrentA !== undefined ? { operatingCurrentA } : {}),
        ...(nominal !== undefined ? { operatingVoltageV: nominal } : inverter?.item.nominalBatteryVoltageV !== undefined ? { operatingVoltageV: inverter.item.nominalBatteryVoltageV } : {}),
        ...(maxV !== undefined ? { maxVoltageV: maxV } : {}),
        side: "dc",
        basis,
        codeRefs,
      },
      values,
      formula,
      inputs: t.inputs,
      missing: t.missing,
    };
  }

  if (c.kind === "inverter-ac-output") {
    const inverter = endpoint(ctx, c, isInverter) as Indexed<Inverter> | undefined;
    if (!inverter) {
      if (design === undefined) {
        t.need(`${ci.path}.fromTag`, "Inverter at one end", undefined);
        return fail("an inverter AC output circuit needs an inverter at one end", t);
      }
    }
    let currentA = design;
    let formula = design !== undefined ? `design current ${design} A` : "";
    let voltage: number | undefined;
    const phases = circuitPhases(ctx, ci, t);
    if (inverter) {
      const e = inverter.item;
      voltage = acVoltage(e);
      t.read(`${inverter.path}.acOutputVoltageV`, `AC output voltage of ${e.tag}`, voltage, "V");
      const plate = t.read(`${inverter.path}.maxAcOutputCurrentA`, `Maximum AC output current of ${e.tag}`, e.maxAcOutputCurrentA, "A");
      const w = t.read(`${inverter.path}.continuousW`, `Continuous output of ${e.tag}`, e.continuousW, "W");
      const fromW = w !== undefined && voltage !== undefined ? currentFromPowerA(w, voltage, phases) : undefined;
      const derived = plate ?? fromW;
      if (derived === undefined && design === undefined) {
        t.need(`${inverter.path}.maxAcOutputCurrentA`, `Maximum AC output current of ${e.tag}`, undefined, "A");
        return fail("the inverter's output current is needed", t);
      }
      if (derived !== undefined && (currentA === undefined || derived > currentA)) {
        currentA = derived;
        formula = plate !== undefined ? `inverter ${e.tag} maximum continuous output ${plate} A` : powerFormula(w!, voltage!, phases, fromW!);
      }
    }
    values.push(v("currentA", "Continuous output current", currentA!, "A"));
    return {
      ok: true,
      value: {
        currentA: currentA!,
        sizingFactor: 1.25,
        operatingCurrentA: currentA!,
        ...(voltage !== undefined ? { operatingVoltageV: voltage, maxVoltageV: voltage } : {}),
        side: "ac",
        phases,
        basis: "the inverter's continuous output current",
        codeRefs: [localRef(ed, "inverter-output-current")],
      },
      values,
      formula,
      inputs: t.inputs,
      missing: t.missing,
    };
  }

  if (c.kind === "generator-output") {
    const gen = endpoint(ctx, c, kindIs("generator"));
    let currentA = design;
    let formula = design !== undefined ? `design current ${design} A` : "";
    let voltage: number | undefined;
    const phases = circuitPhases(ctx, ci, t);
    if (gen) {
      const kw = t.need(`${gen.path}.ratedKW`, `Rating of ${gen.item.tag}`, gen.item.ratedKW, "kW");
      voltage = t.need(`${gen.path}.voltageV`, `Voltage of ${gen.item.tag}`, gen.item.voltageV, "V");
      if (kw !== undefined && voltage !== undefined) {
        const fromPlate = currentFromPowerA(kw * 1000, voltage, phases);
        if (currentA === undefined || fromPlate > currentA) {
          currentA = fromPlate;
          formula = powerFormula(kw * 1000, voltage, phases, fromPlate);
        }
      }
    } else if (design === undefined) {
      t.need(`${ci.path}.fromTag`, "Generator at one end", undefined);
    }
    if (currentA === undefined) return fail("the generator's nameplate current is needed", t);
    values.push(v("currentA", "Generator nameplate current", currentA, "A"));
    return {
      ok: true,
      value: {
        currentA,
        sizingFactor: 1.15,
        operatingCurrentA: currentA,
        ...(voltage !== undefined ? { operatingVoltageV: voltage, maxVoltageV: voltage } : {}),
        side: "ac",
        phases,
        basis: "the generator's nameplate current",
        codeRefs: [localRef(ed, "generator-conductors")],
      },
      values,
      formula,
      inputs: t.inputs,
      missing: t.missing,
    };
  }

  // AC branch: the load current is taken as continuous (210.19(A)(1)), the conservative reading.
  const load = t.read(`${ci.path}.loadCurrentA`, "Load current", c.loadCurrentA, "A");
  const currentA = load !== undefined && design !== undefined ? Math.max(load, design) : (load ?? design);
  if (currentA === undefined) {
    t.need(`${ci.path}.loadCurrentA`, "Load current", undefined, "A");
    return fail("an AC branch circuit needs its load current", t);
  }
  const inverter = endpoint(ctx, c, isInverter) as Indexed<Inverter> | undefined;
  const phases = circuitPhases(ctx, ci, t);
  const voltage =
    t.read(`${ci.path}.nominalVoltageV`, "Nominal voltage", c.nominalVoltageV, "V") ?? (inverter ? acVoltage(inverter.item) : undefined);
  values.push(v("currentA", "Load current (taken as continuous)", currentA, "A"));
  return {
    ok: true,
    value: {
      currentA,
      sizingFactor: 1.25,
      operatingCurrentA: currentA,
      ...(voltage !== undefined ? { operatingVoltageV: voltage, maxVoltageV: voltage } : {}),
      side: "ac",
      phases,
      basis: "the load current, taken as continuous",
      codeRefs: [localRef(ed, "branch-conductors")],
    },
    values,
    formula: `load current ${currentA} A`,
    inputs: t.inputs,
    missing: t.missing,
  };
}
