/**
 * Code references the shared code-reference table does not carry. Each is a
 * section whose number is the same in NEC 2017, 2020 and 2023 (from memory;
 * a reviewer should confirm against the adopted edition).
 */
import type { NecEdition } from "../schemas/project-record";
import { codeRef, type CodeTopic } from "./tables";

const SAME_IN_ALL_EDITIONS = {
  /** Conductors from a generator: at least 115 % of nameplate current. */
  "generator-conductors": "445.13(A)",
  /** Generator overcurrent protection. */
  "generator-ocpd": "445.12",
  /** Next standard rating above a conductor's ampacity, up to 800 A. */
  "next-size-up": "240.4(B)",
  /** Branch-circuit conductors: 125 % of the continuous load. */
  "branch-conductors": "210.19(A)(1)",
  /** Branch-circuit overcurrent devices: 125 % of the continuous load. */
  "branch-ocpd": "210.20(A)",
  /** Battery conductors: protection as close as practicable to the terminals. */
  "battery-conductor-ocpd": "240.21(H)",
  /** Storage circuit current. */
  "ess-circuit-current": "706.30(A)",
  /** Stand-alone systems' inverter input circuit current (690.8(A) list). */
  "inverter-output-current": "690.8(A)",
  /** Parallel conductors: 1/0 and larger. */
  "parallel-conductors": "310.10(G)",
} as const;

export type LocalTopic = keyof typeof SAME_IN_ALL_EDITIONS;

export function localRef(edition: NecEdition, topic: LocalTopic): string {
  if (topic === "parallel-conductors") return `NEC ${edition} ${edition === "2017" ? "310.10(H)" : "310.10(G)"}`;
  return `NEC ${edition} ${SAME_IN_ALL_EDITIONS[topic]}`;
}

const cache: Partial<Record<NecEdition, Map<CodeTopic, string>>> = {};

/** Code references for several topics in one edition (cached: the same strings recur on every circuit). */
export function refs(edition: NecEdition, ...topics: CodeTopic[]): string[] {
  const byTopic = (cache[edition] ??= new Map());
  const out: string[] = [];
  for (const t of topics) {
    let ref = byTopic.get(t);
    if (ref === undefined) {
      ref = codeRef(edition, t);
      byTopic.set(t, ref);
    }
    out.push(ref);
  }
  return out;
}
