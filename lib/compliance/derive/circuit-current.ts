/**
 * The current each circuit is sized for (690.8(A) for PV circuits, the
 * equipment's continuous rating for the rest), its operating current and
 * voltage for voltage drop, and its highest voltage for device ratings: one
 * computation per circuit kind, so a new kind is one entry in `BY_KIND`.
 */
import type { Circuit } from "../../schemas/project-record";
import { isPvCircuit, memo, Trace, type CheckContext, type Derived, type Indexed } from "../context";
import { branchCurrent, generatorOutputCurrent, inverterOutputCurrent } from "./circuit-current-ac";
import { pvCircuitCurrent, storageCircuitCurrent } from "./circuit-current-dc";
import type { CircuitCurrent, CurrentComputation } from "./circuit-current-kind";

export type { CircuitCurrent } from "./circuit-current-kind";

const BY_KIND: Record<Circuit["kind"], CurrentComputation> = {
  "pv-source": pvCircuitCurrent,
  "pv-output": pvCircuitCurrent,
  battery: storageCircuitCurrent,
  "inverter-dc-input": storageCircuitCurrent,
  "inverter-ac-output": inverterOutputCurrent,
  "generator-output": generatorOutputCurrent,
  "ac-branch": branchCurrent,
};

export function circuitCurrent(ctx: CheckContext, c: Indexed<Circuit>): Derived<CircuitCurrent> {
  return memo(ctx, `circuit-current:${c.item.tag}`, () => {
    const t = new Trace();
    t.read(`${c.path}.kind`, "Circuit kind", c.item.kind);
    const d = BY_KIND[c.item.kind](ctx, c, t);
    // Where no equipment sets the voltage, the circuit's own nominal voltage does.
    const nominal = c.item.nominalVoltageV;
    if (d.ok && nominal !== undefined && !isPvCircuit(c.item)) {
      if (d.value.operatingVoltageV === undefined) d.value.operatingVoltageV = nominal;
      if (d.value.maxVoltageV === undefined) d.value.maxVoltageV = nominal;
    }
    return d;
  });
}
