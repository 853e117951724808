/**
 * The product's words for the record's kinds and counts, shared by the
 * editor, the engine's messages, the diagram and the packet, so a circuit is
 * "an inverter DC input circuit" everywhere and never "a inverter-dc-input".
 * Pure: no imports beyond types.
 */
import type { Circuit } from "./project-record";

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
