/**
 * The product's vocabulary, written once and read by the editor, the engine's
 * messages, the diagram, the packet and the pages: the words for the record's
 * kinds and counts (a circuit is "an inverter DC input circuit" everywhere and
 * never "a inverter-dc-input"), the order of the check statuses, the figures
 * every view derives the same way (battery energy, conductor sizes), the
 * documents a jurisdiction asks for, and when a packet is a draft.
 * Pure: no framework, no clock; it reads the record's schema for its kinds.
 */
import { INVERTER_KINDS, type Circuit, type Equipment, type JurisdictionRules } from "./project-record";

/** Circuit kinds in running text (lower case except for acronyms). */
export const CIRCUIT_KIND_WORDS: Record<Circuit["kind"], string> = {
  "pv-source": "PV source",
  "pv-output": "PV output",
  battery: "battery",
  "inverter-dc-input": "inverter DC input",
  "inverter-ac-output": "inverter AC output",
  "generator-output": "generator output",
  "ac-branch": "AC branch",
};

/** Circuit kinds as a heading or a pick-list entry ("Inverter DC input"). */
export const CIRCUIT_KIND_TITLES: Record<Circuit["kind"], string> = Object.fromEntries(
  Object.entries(CIRCUIT_KIND_WORDS).map(([k, w]) => [k, capitalise(w)]),
) as Record<Circuit["kind"], string>;

export function capitalise(words: string): string {
  return words.charAt(0).toUpperCase() + words.slice(1);
}

/**
 * "an inverter DC input", "a PV source", "an AC panel", "a battery": the
 * article follows the sound of the first word; an initialism is read letter
 * by letter, so it takes "an" before A, E, F, H, I, L, M, N, O, R, S, X.
 */
export function withArticle(phrase: string): string {
  const first = phrase.trim().split(/\s+/)[0] ?? "";
  const initialism = /^[A-Z]{2,}\b/.test(first);
  const an = initialism ? /^[AEFHILMNORSX]/.test(first) : /^[aeiou]/i.test(first) && !/^(one|uni|use|eu)/i.test(first);
  return `${an ? "an" : "a"} ${phrase}`;
}

/** "1 field", "3 fields", "2 batteries"; `many` for plurals that do not just add an s. */
export function plural(count: number, one: string, many = `${one}s`): string {
  return `${count} ${count === 1 ? one : many}`;
}

/** Nouns that have no plural in the designer's speech ("No equipment yet", not "No equipments yet"). */
export function pluralNoun(noun: string): string {
  if (/(equipment|information)$/i.test(noun)) return noun;
  if (/[^aeiou]y$/i.test(noun)) return `${noun.slice(0, -1)}ies`;
  if (/(s|x|ch|sh)$/i.test(noun)) return `${noun}es`;
  return `${noun}s`;
}

/* ---------------------------------------------------------------- statuses */

/** Every status a check result can take, most severe first: results are listed in this order, and "worst" reads it. */
export const CHECK_STATUSES = ["fail", "needs-input", "warning", "attest", "pass", "not-applicable"] as const;
export type CheckStatus = (typeof CHECK_STATUSES)[number];

const SEVERITY = new Map<CheckStatus, number>(CHECK_STATUSES.map((s, i) => [s, i]));

/** The most severe of the statuses, or undefined when there are none. */
export function worstStatus(statuses: Iterable<CheckStatus>): CheckStatus | undefined {
  let worst: CheckStatus | undefined;
  for (const s of statuses) if (worst === undefined || SEVERITY.get(s)! < SEVERITY.get(worst)!) worst = s;
  return worst;
}

/** The most severe of several statuses; with none, "not-applicable" (nothing to report). */
export function worst(...statuses: CheckStatus[]): CheckStatus {
  return worstStatus(statuses) ?? "not-applicable";
}

/** Statuses in running text ("2 results need input", "was needs input"). */
export const STATUS_WORDS: Record<CheckStatus, string> = {
  fail: "fail",
  "needs-input": "needs input",
  warning: "warning",
  attest: "attest",
  pass: "pass",
  "not-applicable": "not applicable",
};

/* --------------------------------------------------------------- equipment */

export type InverterKind = (typeof INVERTER_KINDS)[number];
export type InverterEquipment = Extract<Equipment, { kind: InverterKind }>;
const INVERTER_KIND_SET: ReadonlySet<string> = new Set(INVERTER_KINDS);

/** Inverters, inverter-chargers and hybrid inverters: everything that turns the battery's DC into AC. */
export function isInverterKind(kind: string): kind is InverterKind {
  return INVERTER_KIND_SET.has(kind);
}

export function isInverter(e: Equipment): e is InverterEquipment {
  return INVERTER_KIND_SET.has(e.kind);
}

/** One battery unit's energy: its rated kWh, else Ah × nominal V ÷ 1000; undefined while neither is known. */
export function batteryKWh(e: Extract<Equipment, { kind: "battery" }>): number | undefined {
  if (e.capacityKWh !== undefined) return e.capacityKWh;
  if (e.capacityAh !== undefined && e.nominalVoltageV !== undefined) return (e.capacityAh * e.nominalVoltageV) / 1000;
  return undefined;
}

/* ------------------------------------------------------------------ phases */

/** How an AC output or circuit is recorded: 1 single phase, 2 split phase (120/240 V), 3 three phase. */
export type PhaseCount = 1 | 2 | 3;

export const PHASE_WORDS: Record<PhaseCount, string> = { 1: "single phase", 2: "split phase", 3: "three phase" };

/**
 * The voltage a circuit's power divides by. A split-phase (120/240 V) output carries its power between its two
 * lines, so the current is single phase at the line-to-line voltage: a figure of 130 V or less recorded for it is
 * line to neutral and doubles (120 → 240 V). Other voltages are taken as recorded.
 */
export function lineToLineV(voltageV: number, phases: PhaseCount): number {
  return phases === 2 && voltageV <= 130 ? voltageV * 2 : voltageV;
}

/* -------------------------------------------------------------- conductors */

/**
 * Voltage drop a circuit is held to where the jurisdiction sets none: 3 %, the figure of the
 * informational notes to 210.19(A) and 215.2(A) (NEC 2020; not a requirement) — common practice.
 */
export const DEFAULT_VOLTAGE_DROP_LIMIT_PCT = 3;

/** Sizes from 250 up are in kcmil (circular mils ÷ 1000); smaller ones, including 1/0 to 4/0, are AWG. */
export function isKcmilSize(size: string): boolean {
  return /^\d+$/.test(size) && Number(size) >= 250;
}

/** "10 AWG", "3/0 AWG", "250 kcmil", with "Cu" or "Al" when the material is given, as a conductor schedule writes it. */
export function conductorSizeText(size: string, material?: "cu" | "al"): string {
  return `${size} ${isKcmilSize(size) ? "kcmil" : "AWG"}${material ? (material === "cu" ? " Cu" : " Al") : ""}`;
}

/* --------------------------------------------------------------- documents */

export type RequiredDocument = JurisdictionRules["requiredDocuments"][number];

/** What a permit office asks for when the project has no jurisdiction record yet. */
export const DEFAULT_REQUIRED_DOCUMENTS: readonly RequiredDocument[] = ["equipment-datasheets", "storage-listing", "site-plan"];

/** A required document as a jurisdiction's list names it. */
export const REQUIRED_DOCUMENT_LABELS: Record<RequiredDocument, string> = {
  "equipment-datasheets": "Datasheet for each major piece of equipment",
  "storage-listing": "Listing of the energy storage units",
  "site-plan": "Site plan",
  "structural-letter": "Structural letter (roof mounts)",
};

/* ------------------------------------------------------------------- draft */

/** What a packet's draft verdict reads: the run's counts, and the gaps already put in words. */
export interface DraftFacts {
  counts: Readonly<Record<CheckStatus, number>>;
  /** Required labels that cannot be printed as they stand ("label X (Title) lacks …"). */
  labelGaps: readonly string[];
  /** What a sheet finds wrong beyond the checks ("raceway fill over the Chapter 9 limit: C-3"). */
  sheetGaps: readonly string[];
  /** Required documents not on file ("no datasheet for INV-1"). */
  missingDocuments: readonly string[];
}

/**
 * Why a packet is a draft; empty when it is not. A packet is a draft while any check fails or needs
 * input, a required label cannot be printed, a sheet finds a gap, or a required document is missing. The preflight shows
 * these lines to the designer and the cover prints them, so both say the same.
 */
export function draftReasons(f: DraftFacts): string[] {
  const reasons: string[] = [];
  const fail = f.counts.fail;
  const needs = f.counts["needs-input"];
  if (fail > 0) reasons.push(`${plural(fail, "check")} ${fail === 1 ? "fails" : "fail"}`);
  if (needs > 0) reasons.push(`${plural(needs, "check")} ${needs === 1 ? "needs" : "need"} input`);
  reasons.push(...f.labelGaps, ...f.sheetGaps, ...f.missingDocuments);
  return reasons;
}

/** A required label's gap in words, or undefined when it can be printed. */
export function labelGap(label: { id: string; title: string; lines: readonly string[]; missing?: readonly string[] }): string | undefined {
  if (label.lines.length === 0) return `label ${label.id} (${label.title}) has no wording`;
  if (label.missing?.length) return `label ${label.id} (${label.title}) lacks ${label.missing.join(", ")}`;
  return undefined;
}
