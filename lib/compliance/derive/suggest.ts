/**
 * What the record already implies about a circuit, offered to the designer as
 * a suggestion (never written by itself): its kind from the equipment at its
 * two ends, and, from the engine's own current and ampacity figures, the
 * smallest conductor, the standard overcurrent rating and the equipment
 * grounding conductor that would pass.
 */
import { INVERTER_KINDS, type Circuit, type ConductorSize, type Equipment, type ProjectRecord } from "../../schemas/project-record";
import { DEFAULT_VOLTAGE_DROP_LIMIT_PCT } from "../../schemas/vocabulary";
import { buildContext, type Indexed } from "../context";
import {
  CONDUCTOR_SIZES_ASCENDING,
  compareConductorSize,
  dcResistanceOhmPerKft,
  minimumEgcSize,
  nextStandardOcpdRatingForA,
  smallConductorMaxOcpdA,
} from "../tables";
import { insulationType } from "../tables/wiring-types";
import { circuitCurrent } from "./circuit-current";
import { conductorAmpacity } from "./conductor";

type CircuitKind = Circuit["kind"];
type EndKind = Equipment["kind"] | "array";

const INVERTERS: readonly EndKind[] = INVERTER_KINDS;
const DC_BUS: readonly EndKind[] = ["battery", "busbar", "fuse", "disconnect"];
const AC_SIDE: readonly EndKind[] = ["ac-panel", "breaker"];

/**
 * The circuit kind two ends imply, in either direction: array → controller or
 * inverter is PV source; controller → battery is battery; battery → inverter
 * is inverter DC input; generator → inverter or panel is generator output;
 * inverter → panel is inverter AC output; panel → anything else is an AC branch.
 */
export function circuitKindFromEnds(a: EndKind | undefined, b: EndKind | undefined): CircuitKind | undefined {
  if (a === undefined || b === undefined) return undefined;
  const has = (k: EndKind | readonly EndKind[]) => {
    const list = typeof k === "string" ? [k] : k;
    return list.includes(a) || list.includes(b);
  };
  const both = (x: readonly EndKind[], y: readonly EndKind[]) => (x.includes(a) && y.includes(b)) || (x.includes(b) && y.includes(a));
  if (has("array")) return has("array") && (a === "array") !== (b === "array") ? "pv-source" : undefined;
  if (both(["charge-controller"], DC_BUS)) return "battery";
  if (both(INVERTERS, DC_BUS)) return "inverter-dc-input";
  if (both(["charge-controller"], INVERTERS)) return "battery";
  if (has("generator")) return "generator-output";
  if (both(INVERTERS, AC_SIDE)) return "inverter-ac-output";
  if (has("ac-panel")) return "ac-branch";
  if (both(["battery"], DC_BUS)) return "battery";
  return undefined;
}

/** The insulation temperature rating a type implies: the lower of its wet and dry ratings, as conduit outdoors is a wet location (300.9). */
export function insulationRatingFor(insulation: string | undefined): 60 | 75 | 90 | undefined {
  const t = insulationType(insulation);
  if (!t) return undefined;
  return (t.wetRatingC !== undefined ? Math.min(t.wetRatingC, t.dryRatingC) : t.dryRatingC) as 60 | 75 | 90;
}

export interface CircuitSuggestion {
  /** AC or DC: a DC circuit needs a DC-rated device. */
  side?: "ac" | "dc";
  /** Continuous current × sizing factor the conductor and device must carry, A. */
  requiredA?: number;
  size?: ConductorSize;
  /** Smallest standard device rating that covers the current. */
  ocpdA?: number;
  /** Largest device the suggested conductor may sit behind (240.4(B), 240.4(D)). */
  maxOcpdA?: number;
  /** False where the code lets the circuit go without a device (one or two PV strings, 690.9(A)). */
  ocpdRequired?: boolean;
  egcSize?: ConductorSize;
  /** In words: what the suggestion rests on, including any assumption. */
  basis: string;
  /** Record paths still needed before a size can be suggested. */
  missing: string[];
}

/** Insulation and raceway figures assumed where the row leaves them empty, named in the basis. */
const ASSUMED_INSULATION_C = 90;
const ASSUMED_CONDUCTORS = 2;

export function suggestCircuit(record: ProjectRecord, index: number): CircuitSuggestion {
  const ctx = buildContext(record, record.jurisdiction.necEdition);
  const ci = ctx.circuits[index];
  if (!ci) return { basis: "", missing: [] };
  const current = circuitCurrent(ctx, ci);
  if (!current.ok) return { basis: current.reason, missing: current.missing };
  const { currentA, sizingFactor, operatingCurrentA, operatingVoltageV, side } = current.value;
  const c = ci.item;
  const requiredA = currentA * sizingFactor;
  const ocpdKind = side === "dc" ? "fuse" : "breaker";
  const ocpdA = nextStandardOcpdRatingForA(ctx.edition, ocpdKind, requiredA);
  const assumptions: string[] = [];
  const insulationC = c.insulationTempRatingC ?? insulationRatingFor(c.insulation);
  if (insulationC === undefined) assumptions.push(`${ASSUMED_INSULATION_C} °C insulation`);
  if (c.currentCarryingConductors === undefined) assumptions.push(`${ASSUMED_CONDUCTORS} current-carrying conductors`);
  const dropLimit = record.jurisdiction.voltageDropLimitPct ?? DEFAULT_VOLTAGE_DROP_LIMIT_PCT;

  let size: ConductorSize | undefined;
  let maxOcpdA: number | undefined;
  for (const trial of CONDUCTOR_SIZES_ASCENDING) {
    if (compareConductorSize(trial, "14") < 0) continue;
    const item: Circuit = {
      ...c,
      // A distinct tag keeps each trial out of the run's cache.
      tag: `${c.tag}\u0000${trial}`,
      size: trial,
      insulationTempRatingC: insulationC ?? ASSUMED_INSULATION_C,
      currentCarryingConductors: c.currentCarryingConductors ?? ASSUMED_CONDUCTORS,
    };
    const trialCi: Indexed<Circuit> = { item, index, path: ci.path };
    const amp = conductorAmpacity(ctx, trialCi);
    if (!amp.ok) return { requiredA, ...(ocpdA !== undefined ? { ocpdA } : {}), basis: amp.reason, missing: amp.missing };
    const allowed = amp.value.allowedA;
    if (allowed === undefined || allowed < amp.value.requiredUnadjustedA || allowed < amp.value.requiredAdjustedA) continue;
    const smallLimit = smallConductorMaxOcpdA(c.material, trial);
    if (ocpdA !== undefined && smallLimit !== undefined && ocpdA > smallLimit) continue;
    // 240.4(B): the device may be the next standard rating above the ampacity, up to 800 A.
    if (ocpdA !== undefined && ocpdA > allowed && (ocpdA > 800 || (nextStandardOcpdRatingForA(ctx.edition, ocpdKind, allowed) ?? 0) < ocpdA)) continue;
    if (c.lengthFt !== undefined && operatingCurrentA !== undefined && operatingVoltageV) {
      const r = dcResistanceOhmPerKft(c.material, trial);
      if (r !== undefined && ((2 * c.lengthFt * r * operatingCurrentA) / (1000 * c.parallelSets) / operatingVoltageV) * 100 > dropLimit) continue;
    }
    size = trial;
    const above = nextStandardOcpdRatingForA(ctx.edition, ocpdKind, allowed);
    maxOcpdA = Math.min(allowed > 800 ? allowed : (above ?? allowed), smallLimit ?? Infinity);
    break;
  }
  const egc = ocpdA !== undefined ? minimumEgcSize(ocpdA, c.egcMaterial) : undefined;
  // 250.122(A): the EGC need not be larger than the circuit conductors.
  const egcSize = egc !== undefined && size !== undefined && compareConductorSize(egc, size) > 0 ? size : egc;
  const basis =
    `${currentA.toFixed(1)} A × ${sizingFactor} = ${requiredA.toFixed(1)} A` +
    (c.lengthFt !== undefined ? `, within ${dropLimit} % drop over ${c.lengthFt} ft` : "") +
    (assumptions.length ? `; assumes ${assumptions.join(" and ")}` : "");
  // 690.9(A)(1): PV circuits of one or two strings need no overcurrent device where no other source feeds back into them.
  const strings = c.kind === "pv-source" || c.kind === "pv-output" ? ctx.arrays.get(c.arrayTag ?? (ctx.arrays.has(c.fromTag) ? c.fromTag : c.toTag))?.item.stringsInParallel : undefined;
  const ocpdRequired = strings === undefined || strings > 2;
  return {
    side,
    requiredA,
    ocpdRequired,
    ...(maxOcpdA !== undefined ? { maxOcpdA } : {}),
    ...(size !== undefined ? { size } : {}),
    ...(ocpdA !== undefined ? { ocpdA } : {}),
    ...(egcSize !== undefined ? { egcSize } : {}),
    basis,
    missing: [],
  };
}
