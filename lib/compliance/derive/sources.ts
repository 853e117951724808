/** The stand-alone sources (inverters, generators) that land on a panel, and their output ratings. */
import type { Equipment } from "../../schemas/project-record";
import { isInverter, Trace, type CheckContext, type Indexed } from "../context";

export interface SourceRating {
  tag: string;
  /** Output rating times the quantity, A. */
  currentA: number;
}

/**
 * Output rating of one source: an inverter's maximum continuous output current (else its continuous watts at
 * 120 V), a generator's nameplate current; times the quantity. Undefined while a rating is missing (named in the
 * trace) or when the equipment is not a source.
 */
export function sourceOutputA(src: Indexed<Equipment>, t: Trace): number | undefined {
  const e = src.item;
  if (isInverter(e)) {
    const plate = t.read(`${src.path}.maxAcOutputCurrentA`, `Maximum AC output current of ${e.tag}`, e.maxAcOutputCurrentA, "A");
    const w = plate === undefined ? t.read(`${src.path}.continuousW`, `Continuous output of ${e.tag}`, e.continuousW, "W") : undefined;
    const currentA = plate ?? (w !== undefined ? w / 120 : undefined);
    if (currentA === undefined) {
      t.need(`${src.path}.maxAcOutputCurrentA`, `Maximum AC output current of ${e.tag}`, undefined, "A");
      return undefined;
    }
    return currentA * e.quantity;
  }
  if (e.kind === "generator") {
    const kw = t.need(`${src.path}.ratedKW`, `Rating of ${e.tag}`, e.ratedKW, "kW");
    const volts = t.need(`${src.path}.voltageV`, `Voltage of ${e.tag}`, e.voltageV, "V");
    if (kw === undefined || volts === undefined) return undefined;
    return ((kw * 1000) / volts) * e.quantity;
  }
  return undefined;
}

/**
 * Output rating of every stand-alone source landing on a panel through an inverter or generator output circuit.
 * Undefined while a rating is missing (named in the trace).
 */
export function sourceRatings(ctx: CheckContext, panelTag: string, t: Trace): SourceRating[] | undefined {
  const out: SourceRating[] = [];
  let complete = true;
  for (const c of ctx.circuitsByEndpoint.get(panelTag) ?? []) {
    if (c.item.kind !== "inverter-ac-output" && c.item.kind !== "generator-output") continue;
    const src = ctx.equipment.get(c.item.fromTag === panelTag ? c.item.toTag : c.item.fromTag);
    if (!src || (!isInverter(src.item) && src.item.kind !== "generator")) continue;
    const currentA = sourceOutputA(src, t);
    if (currentA === undefined) complete = false;
    else out.push({ tag: src.item.tag, currentA });
  }
  return complete ? out : undefined;
}
