/** Ampacity of a circuit's conductors under its conditions of use (310.15, 690.8(B), 110.14(C)). */
import type { Circuit, ConductorSize } from "../../schemas/project-record";
import {
  ampacityA,
  ambientCorrectionFactor,
  compareConductorSize,
  conductorCountAdjustment,
  rooftopTemperatureAdderC,
  type TempRatingC,
} from "../tables";
import { memo, sizeLabel, Trace, v, type CheckContext, type Derived, type Indexed } from "../context";
import type { CheckValue } from "../types";
import { circuitCurrent, type CircuitCurrent } from "./circuit-current";

export interface ConductorAmpacity {
  current: CircuitCurrent;
  insulationRatingC: TempRatingC;
  terminalRatingC: TempRatingC;
  terminalAssumed: boolean;
  ambientC: number;
  adderC: number;
  correction: number | undefined;
  adjustment: number;
  tableAtInsulationA: number | undefined;
  tableAtTerminalA: number | undefined;
  sets: number;
  /** Ampacity after correction and adjustment, limited by the terminal column; undefined when the conductor may not be used. */
  allowedA: number | undefined;
  /** 690.8(B)(1) / 210.19: the current × factor the terminal-limited ampacity must carry. */
  requiredUnadjustedA: number;
  /** 690.8(B)(2): the current the corrected ampacity must carry. */
  requiredAdjustedA: number;
}

export function conductorAmpacity(ctx: CheckContext, ci: Indexed<Circuit>): Derived<ConductorAmpacity> {
  return memo(ctx, `conductor-ampacity:${ci.item.tag}`, () => compute(ctx, ci));
}

/** The ampacity the circuit would have with another conductor size (uncached: the remedy search tries several). */
export function conductorAmpacityWithSize(ctx: CheckContext, ci: Indexed<Circuit>, size: ConductorSize): Derived<ConductorAmpacity> {
  return compute(ctx, { ...ci, item: { ...ci.item, size } });
}

/** 310.10(G) (310.10(H) in 2017): conductors in parallel are 1/0 AWG and larger. */
export function parallelSizeAllowed(c: Pick<Circuit, "parallelSets">, size: ConductorSize): boolean {
  return c.parallelSets <= 1 || compareConductorSize(size, "1/0") >= 0;
}

/** Why a conductor of `size` does not carry its circuit; empty when it does. */
export function ampacityShortfalls(a: ConductorAmpacity, c: Pick<Circuit, "parallelSets" | "material">, size: ConductorSize): string[] {
  const problems: string[] = [];
  if (a.tableAtTerminalA === undefined || a.tableAtInsulationA === undefined) {
    problems.push(`Table 310.16 gives no ${a.terminalRatingC} °C ampacity for ${sizeLabel(size, c.material)}`);
  } else {
    if (a.correction === undefined) problems.push(`${a.insulationRatingC} °C insulation may not be used at ${a.ambientC} °C`);
    if (a.tableAtTerminalA * a.sets < a.requiredUnadjustedA) {
      problems.push(
        `${sizeLabel(size, c.material)} at the ${a.terminalRatingC} °C terminal column carries ${a.tableAtTerminalA * a.sets} A, less than the ${a.requiredUnadjustedA.toFixed(1)} A required`,
      );
    }
    const corrected = a.correction !== undefined ? a.tableAtInsulationA * a.correction * a.adjustment * a.sets : 0;
    if (a.correction !== undefined && corrected < a.requiredAdjustedA) {
      problems.push(`under conditions of use it carries ${corrected.toFixed(1)} A, less than the ${a.requiredAdjustedA.toFixed(1)} A required`);
    }
  }
  if (!parallelSizeAllowed(c, size)) problems.push(`conductors in parallel must be 1/0 or larger`);
  return problems;
}

function compute(ctx: CheckContext, ci: Indexed<Circuit>): Derived<ConductorAmpacity> {
  const c = ci.item;
  const t = new Trace();
  const current = circuitCurrent(ctx, ci);
  t.merge(current);
  const size = t.need(`${ci.path}.size`, "Conductor size", c.size, "AWG/kcmil");
  t.read(`${ci.path}.material`, "Conductor material", c.material);
  const ins = t.need(`${ci.path}.insulationTempRatingC`, "Insulation temperature rating", c.insulationTempRatingC, "°C");
  const ccc = t.need(`${ci.path}.currentCarryingConductors`, "Current-carrying conductors in the raceway", c.currentCarryingConductors);
  const ambientGiven = t.read(`${ci.path}.ambientTempC`, "Ambient along the run", c.ambientTempC, "°C");
  const ambient = ambientGiven ?? t.need("site.designHighTempC", "Design high temperature", ctx.record.site.designHighTempC, "°C");
  let clearance: number | undefined;
  if (c.onRooftop) {
    t.read(`${ci.path}.onRooftop`, "Exposed to sunlight on the roof", true);
    clearance =
      t.read(`${ci.path}.roofClearanceIn`, "Clearance above the roof", c.roofClearanceIn, "in") ??
      t.need("site.roofClearanceIn", "Raceway clearance above the roof", ctx.record.site.roofClearanceIn, "in");
    if (clearance === undefined && !t.missing.includes(`${ci.path}.roofClearanceIn`)) t.missing.push(`${ci.path}.roofClearanceIn`);
  }
  const sets = c.parallelSets;
  if (!current.ok || size === undefined || ins === undefined || ccc === undefined || ambient === undefined || (c.onRooftop && clearance === undefined)) {
    return { ok: false, reason: current.ok ? "the ampacity needs the inputs named" : current.reason, inputs: t.inputs, missing: t.missing, values: [], formula: "" };
  }
  const I = current.value.currentA;
  const termGiven = t.read(`${ci.path}.terminalTempRatingC`, "Terminal temperature rating", c.terminalTempRatingC, "°C");
  // 110.14(C)(1)(a): 100 A or less, or 14 through 1 AWG, 60 °C unless the equipment is marked otherwise; (b) above that 75 °C.
  const terminal: TempRatingC = termGiven ?? (I * current.value.sizingFactor <= 100 || compareConductorSize(size, "1") <= 0 ? 60 : 75);
  const terminalRatingC = Math.min(terminal, ins) as TempRatingC;
  const adderC = c.onRooftop && clearance !== undefined ? rooftopTemperatureAdderC(ctx.edition, clearance, c.insulation) : 0;
  const ambientC = ambient + adderC;
  const correction = ambientCorrectionFactor(ctx.edition, ambientC, ins);
  const adjustment = conductorCountAdjustment(ctx.edition, ccc);
  const tableAtInsulationA = ampacityA(ctx.edition, c.material, size, ins);
  const tableAtTerminalA = ampacityA(ctx.edition, c.material, size, terminalRatingC);
  const corrected = tableAtInsulationA !== undefined && correction !== undefined ? tableAtInsulationA * correction * adjustment * sets : undefined;
  const terminalLimited = tableAtTerminalA !== undefined ? tableAtTerminalA * sets : undefined;
  const allowedA = corrected !== undefined && terminalLimited !== undefined ? Math.min(corrected, terminalLimited) : undefined;
  const factor = current.value.sizingFactor;
  const requiredUnadjustedA = I * factor;
  // Generators: 115 % of nameplate after conditions of use (445.13(A)); elsewhere the current itself (690.8(B)(2), 310.15).
  const requiredAdjustedA = factor === 1.15 ? I * factor : I;
  const values: CheckValue[] = [
    v("currentA", "Circuit current", I, "A"),
    v("requiredUnadjustedA", `${Math.round(factor * 100)} % of the current (no adjustment)`, requiredUnadjustedA, "A"),
    v("requiredAdjustedA", "Current the conductor must carry under conditions of use", requiredAdjustedA, "A"),
    v("tableAtTerminalA", `Table ampacity at the ${terminalRatingC} °C terminal column${termGiven === undefined ? " (110.14(C)(1) default)" : ""}`, tableAtTerminalA ?? "none", tableAtTerminalA === undefined ? "" : "A"),
    v("ambientC", `Ambient${adderC ? ` + rooftop adder ${adderC} °C` : ""}`, ambientC, "°C"),
    v("correction", `Ambient correction at ${ins} °C`, correction ?? "not permitted", ""),
    v("adjustment", `Adjustment for ${ccc} current-carrying conductors`, adjustment, ""),
    v("tableAtInsulationA", `Table ampacity at ${ins} °C`, tableAtInsulationA ?? "none", tableAtInsulationA === undefined ? "" : "A"),
    v("correctedA", "Ampacity under conditions of use", corrected ?? "none", corrected === undefined ? "" : "A"),
    v("allowedA", "Allowed ampacity", allowedA ?? "none", allowedA === undefined ? "" : "A"),
  ];
  if (sets > 1) values.push(v("parallelSets", "Parallel sets", sets, ""));
  const formula =
    `needs terminal-column ampacity ≥ ${factor} × ${I.toFixed(2)} A = ${requiredUnadjustedA.toFixed(2)} A, and ` +
    `table ${tableAtInsulationA ?? "—"} A × ${correction ?? "—"} × ${adjustment}${sets > 1 ? ` × ${sets} sets` : ""} = ${corrected?.toFixed(2) ?? "—"} A ≥ ${requiredAdjustedA.toFixed(2)} A`;
  return {
    ok: true,
    value: {
      current: current.value,
      insulationRatingC: ins,
      terminalRatingC,
      terminalAssumed: termGiven === undefined,
      ambientC,
      adderC,
      correction,
      adjustment,
      tableAtInsulationA,
      tableAtTerminalA,
      sets,
      allowedA,
      requiredUnadjustedA,
      requiredAdjustedA,
    },
    values,
    formula,
    inputs: t.inputs,
    missing: t.missing,
  };
}
