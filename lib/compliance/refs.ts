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
  /** Stand-alone systems' inverter input circuit current (690.8(A) list). */
  "inverter-output-current": "690.8(A)",
  /** Parallel conductors: 1/0 and larger. */
  "parallel-conductors": "310.10(G)",
} as const;

export type LocalTopic = keyof typeof SAME_IN_ALL_EDITIONS;

export function localRef(edition: NecEdition, topic: LocalTopic | "ess-circuit-current"): string {
  // Storage circuit current: 706.20(A) in 2017 (706.30 is installation there), 706.30(A) from 2020 (from memory).
  if (topic === "ess-circuit-current") return `NEC ${edition} ${edition === "2017" ? "706.20(A)" : "706.30(A)"}`;
  if (topic === "parallel-conductors") return `NEC ${edition} ${edition === "2017" ? "310.10(H)" : "310.10(G)"}`;
  return `NEC ${edition} ${SAME_IN_ALL_EDITIONS[topic]}`;
}

/** Storage topics whose article depends on the edition and the battery voltage. */
export type StorageTopic = "ess-disconnect" | "ess-label" | "ess-listing" | "ess-ocpd" | "ess-circuit-current";

/**
 * 2017 Article 706 covers storage operating over 60 V DC (706.1, from memory); a lower-voltage battery
 * falls under Article 480 in that edition. From 2020, Article 706 covers storage of any voltage over 1 kWh.
 */
const ARTICLE_480_2017: Record<StorageTopic, string | undefined> = {
  "ess-disconnect": "480.7(A)",
  "ess-label": "480.7(F)",
  "ess-listing": "480.3",
  // Article 480 has no overcurrent section of its own; 240.21(H) is cited beside it.
  "ess-ocpd": undefined,
  // The PV system's DC circuit currents (stand-alone inverter input, converter output).
  "ess-circuit-current": "690.8(A)",
};

export function storageUnder480(ctx: { edition: NecEdition; record: { equipment: readonly { kind: string; nominalVoltageV?: number }[] } }): boolean {
  if (ctx.edition !== "2017") return false;
  const volts = ctx.record.equipment.filter((e) => e.kind === "battery").map((e) => e.nominalVoltageV);
  return volts.length > 0 && volts.every((x) => x !== undefined && x <= 60);
}

/** The storage reference for the edition and the battery's voltage (Article 480 for a 60 V or lower battery under NEC 2017). */
export function storageRefs(ctx: { edition: NecEdition; record: { equipment: readonly { kind: string; nominalVoltageV?: number }[] } }, topic: StorageTopic): string[] {
  if (storageUnder480(ctx)) {
    const section = ARTICLE_480_2017[topic];
    return section ? [`NEC 2017 ${section}`] : [];
  }
  return topic === "ess-circuit-current" ? [localRef(ctx.edition, topic)] : refs(ctx.edition, topic);
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
