/**
 * Whether 690.12 rapid shutdown applies to the record and why: PV circuits on
 * or in a building. The rapid-shutdown check and the label list read the same
 * answer, so a label is asked for exactly where the check applies.
 */
import type { Circuit } from "../../schemas/project-record";
import { isPvCircuit, type CheckContext, type Indexed } from "../context";

export interface RapidShutdownScope {
  applies: boolean;
  reason: string;
  /** The array is on a building, so 690.12(B)(2) inside the array boundary applies too. */
  insideBoundary: boolean;
  /** PV circuits of a ground-mounted array whose entersBuilding is empty (taken as entering). */
  unknownCircuits: Indexed<Circuit>[];
}

export function rapidShutdownApplies(ctx: CheckContext): RapidShutdownScope {
  const none = { insideBoundary: false, unknownCircuits: [] };
  if (ctx.arrays.size === 0) return { applies: false, reason: "no PV array in the record", ...none };
  if (ctx.record.site.mounting !== "ground") {
    return { applies: true, reason: "roof-mounted array: PV circuits on a building", insideBoundary: true, unknownCircuits: [] };
  }
  const pv = ctx.circuits.filter((c) => isPvCircuit(c.item));
  const entering = pv.filter((c) => c.item.entersBuilding === true);
  const unknownCircuits = pv.filter((c) => c.item.entersBuilding === undefined);
  if (entering.length === 0 && unknownCircuits.length === 0) {
    return {
      applies: false,
      reason: pv.length === 0 ? "ground-mounted array with no PV circuit recorded" : "ground-mounted array whose PV circuits stay outside buildings (690.12 covers PV circuits on or in buildings)",
      ...none,
    };
  }
  if (ctx.record.site.pvOnlyBuilding === true) {
    return {
      applies: false,
      reason: "ground-mounted array whose PV circuits enter only a building that houses PV equipment only, as the designer states (690.12 exception)",
      ...none,
    };
  }
  const named = (entering.length ? entering : unknownCircuits).map((c) => c.item.tag).join(", ");
  return {
    applies: true,
    reason: entering.length
      ? `PV circuit ${named} of the ground-mounted array enters a building`
      : `PV circuit ${named} of the ground-mounted array is not recorded as staying outside buildings`,
    insideBoundary: false,
    unknownCircuits: entering.length ? [] : unknownCircuits,
  };
}
