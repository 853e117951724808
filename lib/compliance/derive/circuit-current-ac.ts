/**
 * Currents of the AC circuits: an inverter's output, a generator's output and
 * a branch circuit, each single or three phase (P ÷ V, or P ÷ (√3 × V line to
 * line)); a larger design current wins.
 */
import type { Circuit } from "../../schemas/project-record";
import { lineToLineV, type PhaseCount } from "../../schemas/vocabulary";
import { endpoint, isInverter, kindIs, v, type CheckContext, type Indexed, type Trace } from "../context";
import { localRef } from "../refs";
import { cannotDerive, derived, type CurrentComputation, type Inverter } from "./circuit-current-kind";

function acVoltage(inv: Inverter): number | undefined {
  if (inv.acOutputVoltageV !== undefined) return inv.acOutputVoltageV;
  if (inv.acOutput === undefined) return undefined;
  // Line-to-line of a split or wye output: the figure its power divides by.
  return { "120": 120, "240": 240, "120/240": 240, "208": 208, "277/480": 480 }[inv.acOutput];
}

/**
 * Phases of an AC circuit as recorded: its own field, else the source's at its ends (the generator's on a
 * generator output, which may land on an inverter-charger's AC input; the inverter's otherwise), else single
 * phase (for the same power, single phase gives the larger current and drop, so the guess errs safe).
 */
export function recordedPhases(ctx: CheckContext, ci: Indexed<Circuit>, t: Trace): PhaseCount {
  const own = t.read(`${ci.path}.phases`, "Phases", ci.item.phases);
  if (own !== undefined) return own;
  const gen = endpoint(ctx, ci.item, kindIs("generator"));
  const inverter = endpoint(ctx, ci.item, isInverter) as Indexed<Inverter> | undefined;
  if (inverter && !(gen && ci.item.kind === "generator-output")) {
    return t.read(`${inverter.path}.acOutputPhases`, `AC output phases of ${inverter.item.tag}`, inverter.item.acOutputPhases) ?? 1;
  }
  if (gen) return t.read(`${gen.path}.phases`, `Phases of ${gen.item.tag}`, gen.item.phases) ?? 1;
  return 1;
}

/**
 * Phases for the current and drop formulas, and the voltage they divide by: split phase is single phase at the
 * line-to-line voltage (P ÷ 240 V, 2 × I × R × L), three phase is √3 with the line-to-line voltage.
 */
function acSystem(ctx: CheckContext, ci: Indexed<Circuit>, t: Trace): { phases: 1 | 3; voltage: (v: number | undefined) => number | undefined } {
  const recorded = recordedPhases(ctx, ci, t);
  return { phases: recorded === 3 ? 3 : 1, voltage: (v) => (v === undefined ? undefined : lineToLineV(v, recorded)) };
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

/** An inverter's AC output: its maximum continuous output current, else its continuous watts over its voltage. */
export const inverterOutputCurrent: CurrentComputation = (ctx, ci, t) => {
  const c = ci.item;
  const design = t.read(`${ci.path}.designCurrentA`, "Design current", c.designCurrentA, "A");
  const inverter = endpoint(ctx, c, isInverter) as Indexed<Inverter> | undefined;
  if (!inverter && design === undefined) {
    t.need(`${ci.path}.fromTag`, "Inverter at one end", undefined);
    return cannotDerive("an inverter AC output circuit needs an inverter at one end", t);
  }
  let currentA = design;
  let formula = design !== undefined ? `design current ${design} A` : "";
  let voltage: number | undefined;
  const ac = acSystem(ctx, ci, t);
  const phases = ac.phases;
  if (inverter) {
    const e = inverter.item;
    voltage = ac.voltage(acVoltage(e));
    t.read(`${inverter.path}.acOutputVoltageV`, `AC output voltage of ${e.tag}`, voltage, "V");
    const plate = t.read(`${inverter.path}.maxAcOutputCurrentA`, `Maximum AC output current of ${e.tag}`, e.maxAcOutputCurrentA, "A");
    const w = t.read(`${inverter.path}.continuousW`, `Continuous output of ${e.tag}`, e.continuousW, "W");
    const fromW = w !== undefined && voltage !== undefined ? currentFromPowerA(w, voltage, phases) : undefined;
    const fromEquipment = plate ?? fromW;
    if (fromEquipment === undefined && design === undefined) {
      t.need(`${inverter.path}.maxAcOutputCurrentA`, `Maximum AC output current of ${e.tag}`, undefined, "A");
      return cannotDerive("the inverter's output current is needed", t);
    }
    if (fromEquipment !== undefined && (currentA === undefined || fromEquipment > currentA)) {
      currentA = fromEquipment;
      formula = plate !== undefined ? `inverter ${e.tag} maximum continuous output ${plate} A` : powerFormula(w!, voltage!, phases, fromW!);
    }
  }
  return derived(
    {
      currentA: currentA!,
      sizingFactor: 1.25,
      operatingCurrentA: currentA!,
      ...(voltage !== undefined ? { operatingVoltageV: voltage, maxVoltageV: voltage } : {}),
      side: "ac",
      phases,
      basis: "the inverter's continuous output current",
      codeRefs: [localRef(ctx.edition, "inverter-output-current")],
    },
    [v("currentA", "Continuous output current", currentA!, "A")],
    formula,
    t,
  );
};

/** A generator's output: its nameplate kW over its voltage, sized at 115 % (445.13). */
export const generatorOutputCurrent: CurrentComputation = (ctx, ci, t) => {
  const c = ci.item;
  const design = t.read(`${ci.path}.designCurrentA`, "Design current", c.designCurrentA, "A");
  const gen = endpoint(ctx, c, kindIs("generator"));
  let currentA = design;
  let formula = design !== undefined ? `design current ${design} A` : "";
  let voltage: number | undefined;
  const ac = acSystem(ctx, ci, t);
  const phases = ac.phases;
  if (gen) {
    const kw = t.need(`${gen.path}.ratedKW`, `Rating of ${gen.item.tag}`, gen.item.ratedKW, "kW");
    voltage = ac.voltage(t.need(`${gen.path}.voltageV`, `Voltage of ${gen.item.tag}`, gen.item.voltageV, "V"));
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
  if (currentA === undefined) return cannotDerive("the generator's nameplate current is needed", t);
  return derived(
    {
      currentA,
      sizingFactor: 1.15,
      operatingCurrentA: currentA,
      ...(voltage !== undefined ? { operatingVoltageV: voltage, maxVoltageV: voltage } : {}),
      side: "ac",
      phases,
      basis: "the generator's nameplate current",
      codeRefs: [localRef(ctx.edition, "generator-conductors")],
    },
    [v("currentA", "Generator nameplate current", currentA, "A")],
    formula,
    t,
  );
};

/** An AC branch circuit: the load current, taken as continuous (210.19(A)(1)), the conservative reading. */
export const branchCurrent: CurrentComputation = (ctx, ci, t) => {
  const c = ci.item;
  const design = t.read(`${ci.path}.designCurrentA`, "Design current", c.designCurrentA, "A");
  const load = t.read(`${ci.path}.loadCurrentA`, "Load current", c.loadCurrentA, "A");
  const currentA = load !== undefined && design !== undefined ? Math.max(load, design) : (load ?? design);
  if (currentA === undefined) {
    t.need(`${ci.path}.loadCurrentA`, "Load current", undefined, "A");
    return cannotDerive("an AC branch circuit needs its load current", t);
  }
  const inverter = endpoint(ctx, c, isInverter) as Indexed<Inverter> | undefined;
  const ac = acSystem(ctx, ci, t);
  const phases = ac.phases;
  const voltage = ac.voltage(
    t.read(`${ci.path}.nominalVoltageV`, "Nominal voltage", c.nominalVoltageV, "V") ?? (inverter ? acVoltage(inverter.item) : undefined),
  );
  return derived(
    {
      currentA,
      sizingFactor: 1.25,
      operatingCurrentA: currentA,
      ...(voltage !== undefined ? { operatingVoltageV: voltage, maxVoltageV: voltage } : {}),
      side: "ac",
      phases,
      basis: "the load current, taken as continuous",
      codeRefs: [localRef(ctx.edition, "branch-conductors")],
    },
    [v("currentA", "Load current (taken as continuous)", currentA, "A")],
    `load current ${currentA} A`,
    t,
  );
};
