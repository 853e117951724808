/**
 * The per-run view of a record: lookups by tag and a cache for the figures
 * several checks share (string voltage, circuit current, ampacity), so a run
 * stays linear in the number of circuits.
 */
import type { Circuit, Equipment, NecEdition, ProjectRecord, PvArray } from "../schemas/project-record";
import { conductorSizeText, isInverterKind } from "../schemas/vocabulary";
import type { CheckInput, CheckValue } from "./types";

export interface Indexed<T> {
  item: T;
  index: number;
  /** Record path of the item, e.g. "circuits.4". */
  path: string;
}

/** The equipment variants whose kind is among K (a variant may carry several kinds, e.g. ac-panel | busbar). */
export type EquipmentOf<K extends Equipment["kind"]> = Equipment extends infer E
  ? E extends { kind: infer EK }
    ? [Extract<EK, K>] extends [never]
      ? never
      : E & { kind: Extract<EK, K> }
    : never
  : never;

export interface CheckContext {
  record: ProjectRecord;
  edition: NecEdition;
  equipment: Map<string, Indexed<Equipment>>;
  arrays: Map<string, Indexed<PvArray>>;
  circuits: Indexed<Circuit>[];
  circuitsByEndpoint: Map<string, Indexed<Circuit>[]>;
  circuitsByArray: Map<string, Indexed<Circuit>[]>;
  /** Circuits naming a device as their ocpdTag or among their disconnectTags. */
  circuitsByDevice: Map<string, Indexed<Circuit>[]>;
  memo: Map<string, unknown>;
}

function push<K, V>(map: Map<K, V[]>, key: K, value: V): void {
  const list = map.get(key);
  if (list) list.push(value);
  else map.set(key, [value]);
}

export const PV_CIRCUIT_KINDS: readonly Circuit["kind"][] = ["pv-source", "pv-output"];
export const DC_CIRCUIT_KINDS: readonly Circuit["kind"][] = ["pv-source", "pv-output", "battery", "inverter-dc-input"];

export function isPvCircuit(c: Circuit): boolean {
  return PV_CIRCUIT_KINDS.includes(c.kind);
}
export function isDcCircuit(c: Circuit): boolean {
  return DC_CIRCUIT_KINDS.includes(c.kind);
}
export function isInverter(e: Equipment): e is EquipmentOf<"inverter" | "inverter-charger" | "hybrid-inverter"> {
  return isInverterKind(e.kind);
}

export function buildContext(record: ProjectRecord, edition: NecEdition): CheckContext {
  const equipment = new Map<string, Indexed<Equipment>>();
  record.equipment.forEach((item, index) => {
    if (!equipment.has(item.tag)) equipment.set(item.tag, { item, index, path: `equipment.${index}` });
  });
  const arrays = new Map<string, Indexed<PvArray>>();
  record.arrays.forEach((item, index) => {
    if (!arrays.has(item.tag)) arrays.set(item.tag, { item, index, path: `arrays.${index}` });
  });
  const circuits = record.circuits.map((item, index) => ({ item, index, path: `circuits.${index}` }));
  const circuitsByEndpoint = new Map<string, Indexed<Circuit>[]>();
  const circuitsByArray = new Map<string, Indexed<Circuit>[]>();
  const circuitsByDevice = new Map<string, Indexed<Circuit>[]>();
  for (const c of circuits) {
    push(circuitsByEndpoint, c.item.fromTag, c);
    if (c.item.toTag !== c.item.fromTag) push(circuitsByEndpoint, c.item.toTag, c);
    const arrayTag = circuitArrayTag({ arrays } as CheckContext, c.item);
    if (arrayTag !== undefined && isPvCircuit(c.item)) push(circuitsByArray, arrayTag, c);
    if (c.item.ocpdTag !== undefined) push(circuitsByDevice, c.item.ocpdTag, c);
    for (const d of new Set(c.item.disconnectTags)) if (d !== c.item.ocpdTag) push(circuitsByDevice, d, c);
  }
  return { record, edition, equipment, arrays, circuits, circuitsByEndpoint, circuitsByArray, circuitsByDevice, memo: new Map() };
}

/** The array a PV circuit carries: its arrayTag, else an endpoint that is an array. */
export function circuitArrayTag(ctx: Pick<CheckContext, "arrays">, c: Circuit): string | undefined {
  if (c.arrayTag !== undefined) return c.arrayTag;
  if (ctx.arrays.has(c.fromTag)) return c.fromTag;
  if (ctx.arrays.has(c.toTag)) return c.toTag;
  return undefined;
}

export function memo<T>(ctx: CheckContext, key: string, compute: () => T): T {
  if (ctx.memo.has(key)) return ctx.memo.get(key) as T;
  const value = compute();
  ctx.memo.set(key, value);
  return value;
}

/** The equipment at either end of a circuit that satisfies `pred`. */
export function endpoint<E extends Equipment>(
  ctx: CheckContext,
  c: Circuit,
  pred: (e: Equipment) => e is E,
): Indexed<E> | undefined {
  for (const tag of [c.fromTag, c.toTag]) {
    const found = ctx.equipment.get(tag);
    if (found && pred(found.item)) return found as Indexed<E>;
  }
  return undefined;
}

/** Disconnects, fuses and breakers: the devices with ratingA, voltageRatingV, currentType. */
export function isProtective(e: Equipment): e is EquipmentOf<"disconnect" | "fuse" | "breaker"> {
  return e.kind === "disconnect" || e.kind === "fuse" || e.kind === "breaker";
}

export function kindIs<K extends Equipment["kind"]>(...kinds: K[]) {
  return (e: Equipment): e is EquipmentOf<K> => (kinds as Equipment["kind"][]).includes(e.kind);
}

/** Equipment of the given kinds in record order; cached per run, so callers inside per-circuit loops stay linear. */
export function equipmentOfKind<K extends Equipment["kind"]>(ctx: CheckContext, ...kinds: K[]): Indexed<EquipmentOf<K>>[] {
  return memo(ctx, `kinds:${kinds.join(",")}`, () => {
    const out: Indexed<EquipmentOf<K>>[] = [];
    ctx.record.equipment.forEach((item, index) => {
      if ((kinds as Equipment["kind"][]).includes(item.kind)) {
        out.push({ item: item as EquipmentOf<K>, index, path: `equipment.${index}` });
      }
    });
    return out;
  });
}

/**
 * Collects the inputs a computation read and the ones it found missing, so a
 * result can name every field it used and every field it still needs.
 */
export class Trace {
  inputs: CheckInput[] = [];
  missing: string[] = [];

  /** Reads a value the computation cannot do without; records it as missing when absent. */
  need<T extends number | string | boolean>(path: string, label: string, value: T | undefined | null, unit = ""): T | undefined {
    this.add({ path, label, value: value ?? null, unit });
    if (value === undefined || value === null || (typeof value === "number" && !Number.isFinite(value))) {
      if (!this.missing.includes(path)) this.missing.push(path);
      return undefined;
    }
    return value;
  }

  /** Records a value read but not required (it may be absent). */
  read<T extends number | string | boolean>(path: string, label: string, value: T | undefined | null, unit = ""): T | undefined {
    this.add({ path, label, value: value ?? null, unit, ...(value === undefined || value === null ? { optional: true } : {}) });
    return value ?? undefined;
  }

  /** Reads an optional value, falling back to a stated default; the result says the default was used. */
  readOr<T extends number | string | boolean>(path: string, label: string, value: T | undefined | null, fallback: T, unit = ""): T {
    if (value === undefined || value === null) {
      this.add({ path, label, value: null, unit, optional: true, defaultValue: fallback });
      return fallback;
    }
    this.add({ path, label, value, unit });
    return value;
  }

  /** Takes over another computation's inputs (shared, not copied: results are read-only) and missing fields. */
  merge(other: { inputs: CheckInput[]; missing: string[] }): this {
    for (const i of other.inputs) this.add(i);
    for (const m of other.missing) if (!this.missing.includes(m)) this.missing.push(m);
    return this;
  }

  // A check reads a handful of fields: a scan is cheaper than a Set per trace.
  private add(input: CheckInput): void {
    for (const i of this.inputs) if (i.path === input.path) return;
    this.inputs.push(input);
  }
}

/** A derived figure shared by checks, with the trace of what it read. */
export type Derived<T> =
  | { ok: true; value: T; values: CheckValue[]; formula: string; inputs: CheckInput[]; missing: string[] }
  | { ok: false; reason: string; inputs: CheckInput[]; missing: string[]; values: CheckValue[]; formula: string };

/** Rounds for display and comparison-free reporting; the checks compare unrounded figures. */
export function round(value: number, digits = 2): number {
  const f = 10 ** digits;
  return Math.round(value * f) / f;
}

export function v(key: string, label: string, value: number | string | boolean, unit = ""): CheckValue {
  return { key, label, value: typeof value === "number" ? round(value, 3) : value, unit };
}

/** "10 AWG", "3/0 AWG", "250 kcmil" — as written on a conductor schedule. */
export function sizeLabel(size: string, material?: "cu" | "al"): string {
  return conductorSizeText(size, material);
}

export function tagLabel(e: { tag: string; manufacturer?: string; model?: string }): string {
  const name = [e.manufacturer, e.model].filter((s) => s && s.length > 0).join(" ");
  return name ? `${e.tag} (${name})` : e.tag;
}
