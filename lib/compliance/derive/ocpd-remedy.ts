/**
 * Remedies for overcurrent protection: the standard device (240.6(A)) that carries 125 % of the current, and the
 * smallest conductor that device protects (240.4(B), 240.4(D)).
 */
import type { Circuit, Equipment } from "../../schemas/project-record";
import type { OcpdKind } from "../tables";
import { sizeLabel, type CheckContext, type Indexed } from "../context";
import type { Remedy, RemedyChange } from "../types";
import { conductorAmpacity } from "./conductor";
import { conductorProtectedBy, largestStandardRatingA, nextStandardRatingA, remedy, smallestConductor } from "./remedy";

/**
 * A device that covers `minA` and protects the conductor. Keeps the recorded device when it already covers the
 * current and only the conductor is short; lowers it to a standard rating the conductor allows when that still
 * covers the current; otherwise sizes the device from the current and the conductor from the device.
 */
export function ocpdRemedy(
  ctx: CheckContext,
  ci: Indexed<Circuit>,
  dev: Indexed<Equipment>,
  kind: OcpdKind,
  ratingA: number,
  minA: number,
  /** The module's maximum series fuse rating, where the device protects a string (110.3(B), 690.9). */
  seriesFuseA?: number,
): Remedy {
  const c = ci.item;
  const ed = ctx.edition;
  const amp = conductorAmpacity(ctx, ci);
  const size = c.size;
  const fits = (r: number) => amp.ok && size !== undefined && conductorProtectedBy(amp.value, c, size, r);
  const nextUp = nextStandardRatingA(ed, kind, minA);
  if (nextUp === undefined) return remedy(`No standard ${kind} of 240.6(A) reaches ${minA.toFixed(1)} A: split the circuit or use a device of an engineered rating.`);
  const ratingPath = `${dev.path}.ratingA`;
  if (seriesFuseA !== undefined && nextUp > seriesFuseA) {
    return remedy(`No standard ${kind} lies between ${minA.toFixed(1)} A and the module's ${seriesFuseA} A series fuse rating: use modules with a higher series fuse rating.`);
  }
  // A device that already covers the current and is a standard rating stays; else the next standard rating up.
  const isStandard = nextStandardRatingA(ed, kind, ratingA) === ratingA;
  let target = ratingA >= minA && isStandard ? ratingA : nextUp;
  // Where the conductor cannot be protected at that rating, a smaller standard device may still cover the current.
  if (!fits(target) && amp.ok && amp.value.allowedA !== undefined) {
    const lower = largestStandardRatingA(ed, kind, Math.min(target, amp.value.allowedA));
    if (lower !== undefined && lower >= minA && fits(lower)) target = lower;
  }
  // The module's series fuse rating caps the device; nextUp fits under it (checked above).
  if (seriesFuseA !== undefined && target > seriesFuseA) target = largestStandardRatingA(ed, kind, seriesFuseA) ?? nextUp;
  const changes: RemedyChange[] = [];
  const lines: string[] = [];
  if (target !== ratingA) {
    changes.push({ path: ratingPath, value: target });
    lines.push(`${target < ratingA ? "Lower" : "Raise"} ${dev.item.tag} to ${target} A, the ${target === nextUp ? "next standard rating (240.6(A)) at or above" : "standard rating (240.6(A)) that still covers"} ${minA.toFixed(1)} A.`);
  }
  if (!fits(target)) {
    const choice = smallestConductor(ctx, ci, target);
    if (!choice) return remedy(`${lines.join(" ")} No single conductor size is protected by a ${target} A device here: run conductors in parallel.`.trim());
    changes.push({ path: `${ci.path}.size`, value: choice.size });
    lines.push(`Use ${sizeLabel(choice.size, c.material)}: it allows ${choice.ampacity.allowedA!.toFixed(1)} A and may be protected at ${target} A (240.4(B), 240.4(D)).`);
  }
  return { text: lines.join(" "), changes };
}

/** A circuit with no device: the standard rating it needs, and the conductor that rating requires. */
export function missingDeviceRemedy(ctx: CheckContext, ci: Indexed<Circuit>, minA: number): Remedy {
  const rating = nextStandardRatingA(ctx.edition, "breaker", minA);
  if (rating === undefined) return remedy(`Add an overcurrent device of at least ${minA.toFixed(1)} A and name it as the circuit's overcurrent device.`);
  const amp = conductorAmpacity(ctx, ci);
  const size = ci.item.size;
  const protectedNow = amp.ok && size !== undefined && conductorProtectedBy(amp.value, ci.item, size, rating);
  const choice = protectedNow ? undefined : smallestConductor(ctx, ci, rating);
  return remedy(
    `Add a ${rating} A breaker or fuse (next standard rating at or above ${minA.toFixed(1)} A, 240.6(A)) and name it as ${ci.item.tag}'s overcurrent device.` +
      (choice ? ` The conductor must then be at least ${sizeLabel(choice.size, ci.item.material)}.` : ""),
  );
}

/**
 * String fuses: at least 1.25 × the source circuit current (1.25 × Isc), so 1.56 × Isc (690.8(A)(1), 690.9(B)), and
 * no more than the module's maximum series fuse rating.
 */
export function stringFuseRemedy(ctx: CheckContext, arrayTag: string, iscA: number, maxSeriesFuseA: number): Remedy {
  const minA = 1.25 * 1.25 * iscA;
  const rating = nextStandardRatingA(ctx.edition, "fuse", minA);
  if (rating === undefined || rating > maxSeriesFuseA) {
    return remedy(`No standard fuse lies between ${minA.toFixed(1)} A (1.56 × Isc) and the module's ${maxSeriesFuseA} A series fuse rating: use modules with a higher series fuse rating or no more than two strings per input.`);
  }
  return remedy(`Fuse each string of ${arrayTag} at ${rating} A: at least 1.56 × Isc = ${minA.toFixed(1)} A and no more than the module's ${maxSeriesFuseA} A series fuse rating. Record the fuses on the PV source circuits.`);
}
