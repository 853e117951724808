/**
 * What every circuit kind's current computation returns, and the two ways it
 * ends, shared by the DC and AC computations.
 */
import type { Circuit } from "../../schemas/project-record";
import type { CheckContext, Derived, EquipmentOf, Indexed, Trace } from "../context";
import type { CheckValue } from "../types";

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

export type Inverter = EquipmentOf<"inverter" | "inverter-charger" | "hybrid-inverter">;

/** One circuit kind's computation; the trace already holds the circuit's kind. */
export type CurrentComputation = (ctx: CheckContext, ci: Indexed<Circuit>, t: Trace) => Derived<CircuitCurrent>;

export function cannotDerive(reason: string, t: Trace): Derived<CircuitCurrent> {
  return { ok: false, reason, inputs: t.inputs, missing: t.missing, values: [], formula: "" };
}

export function derived(value: CircuitCurrent, values: CheckValue[], formula: string, t: Trace): Derived<CircuitCurrent> {
  return { ok: true, value, values, formula, inputs: t.inputs, missing: t.missing };
}
