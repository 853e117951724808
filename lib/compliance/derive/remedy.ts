/**
 * The searches behind remedies: the smallest conductor that carries and is protected, the next standard device,
 * the string length that fits. Each returns the figure that makes the failing check pass, so the remedy can say it.
 */
import type { Circuit, ConductorSize, NecEdition } from "../../schemas/project-record";
import {
  compareConductorSize,
  CONDUCTOR_SIZES_ASCENDING,
  smallConductorMaxOcpdA,
  STANDARD_OCPD_RATINGS_A,
  nextStandardOcpdRatingA,
  standardOcpdRatingsA,
  type OcpdKind,
} from "../tables";
import { sizeLabel, type CheckContext, type Indexed } from "../context";
import type { Remedy, RemedyChange } from "../types";
import { ampacityShortfalls, conductorAmpacityWithSize, type ConductorAmpacity } from "./conductor";

export function remedy(text: string, ...changes: RemedyChange[]): Remedy {
  return { text, changes };
}

/** Largest device that protects a conductor of `allowedA`: the ampacity, or the next standard rating up to 800 A (240.4(B)). */
export function maxProtectiveRatingA(allowedA: number): number {
  if (STANDARD_OCPD_RATINGS_A.includes(allowedA)) return allowedA;
  if (allowedA <= 800) return nextStandardOcpdRatingA(allowedA) ?? allowedA;
  return allowedA;
}

/** Whether a conductor with this ampacity may be protected by a device of `ratingA` (240.4(B), 240.4(D)). */
export function conductorProtectedBy(a: ConductorAmpacity, c: Pick<Circuit, "material">, size: ConductorSize, ratingA: number): boolean {
  if (a.allowedA === undefined) return false;
  const small = smallConductorMaxOcpdA(c.material, size);
  if (small !== undefined && ratingA > small) return false;
  return ratingA <= maxProtectiveRatingA(a.allowedA);
}

export interface ConductorChoice {
  size: ConductorSize;
  ampacity: ConductorAmpacity;
}

/**
 * The smallest conductor, larger than the circuit's own, that carries the circuit under its conditions of use and,
 * when `protectedByA` is given, may be protected by a device of that rating. Undefined when no single size does.
 */
export function smallestConductor(ctx: CheckContext, ci: Indexed<Circuit>, protectedByA?: number): ConductorChoice | undefined {
  const c = ci.item;
  for (const size of CONDUCTOR_SIZES_ASCENDING) {
    if (c.size !== undefined && compareConductorSize(size, c.size) <= 0) continue;
    const d = conductorAmpacityWithSize(ctx, ci, size);
    if (!d.ok) return undefined;
    if (ampacityShortfalls(d.value, c, size).length > 0) continue;
    if (protectedByA !== undefined && !conductorProtectedBy(d.value, c, size, protectedByA)) continue;
    return { size, ampacity: d.value };
  }
  return undefined;
}

/** The change of a circuit's conductor size, with the ampacity that proves it. */
export function conductorRemedy(ci: Indexed<Circuit>, choice: ConductorChoice, why: string): Remedy {
  return remedy(
    `Use ${sizeLabel(choice.size, ci.item.material)}${ci.item.parallelSets > 1 ? ` (${ci.item.parallelSets} sets)` : ""}: it allows ${choice.ampacity.allowedA!.toFixed(1)} A ${why}.`,
    { path: `${ci.path}.size`, value: choice.size },
  );
}

/** Next standard rating of 240.6(A) for the edition and device kind at or above `minimumA`. */
export function nextStandardRatingA(edition: NecEdition, kind: OcpdKind, minimumA: number): number | undefined {
  return standardOcpdRatingsA(edition, kind).find((r) => r >= minimumA - 1e-9);
}

/** Largest standard rating of 240.6(A) at or below `maximumA`. */
export function largestStandardRatingA(edition: NecEdition, kind: OcpdKind, maximumA: number): number | undefined {
  const list = standardOcpdRatingsA(edition, kind);
  let best: number | undefined;
  for (const r of list) if (r <= maximumA + 1e-9) best = r;
  return best;
}
