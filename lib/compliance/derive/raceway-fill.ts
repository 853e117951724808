import { CHAPTER_9_TABLE_4, CHAPTER_9_TABLE_5, TRADE_SIZES, fillLimitPct, tradeSize, type TradeSize } from "../tables/chapter9-fill";
import { insulationType, racewayType } from "../tables/wiring-types";
import type { ConductorSize } from "../../schemas/project-record";

export interface RacewayFillInput {
  racewayType: string;
  racewaySize: string;
  insulation: string;
  size?: ConductorSize;
  /** Insulated circuit conductors in the raceway (all sets, neutral included). */
  conductors?: number;
  /** The equipment grounding conductor, taken as insulated like the circuit conductors (common practice in a raceway). */
  egcSize?: ConductorSize;
}

export type RacewayFill =
  | { status: "not-applicable"; reason: string }
  | { status: "needs-input"; reason: string }
  | {
      status: "pass" | "fail";
      racewayLabel: string;
      article: string;
      racewayAreaIn2: number;
      conductorAreaIn2: number;
      egcAreaIn2: number;
      count: number;
      totalAreaIn2: number;
      fillPct: number;
      limitPct: number;
      /** On a fail: the smallest trade size of the same raceway type the conductors fit. */
      fitsIn?: TradeSize;
    };

/**
 * Fill of one raceway: Chapter 9 Table 5 conductor areas over the Table 4
 * internal area, against the Table 1 limit for the number of conductors
 * (EGCs counted, Chapter 9 Note 3). A value the tables cannot give is
 * needs-input, never a pass.
 */
export function racewayFill(input: RacewayFillInput): RacewayFill {
  const raceway = racewayType(input.racewayType);
  if (!input.racewayType.trim()) return { status: "needs-input", reason: "wiring method not given" };
  if (raceway && !raceway.isRaceway) return { status: "not-applicable", reason: `${raceway.label}: not a raceway, no Chapter 9 fill` };
  const table4 = raceway ? CHAPTER_9_TABLE_4[raceway.code] : undefined;
  if (!raceway || !table4) return { status: "needs-input", reason: `"${input.racewayType}" is not a raceway type of Chapter 9 Table 4` };
  const size = tradeSize(input.racewaySize);
  const racewayAreaIn2 = size ? table4.areas[size] : undefined;
  if (!input.racewaySize.trim()) return { status: "needs-input", reason: "raceway trade size not given" };
  if (racewayAreaIn2 === undefined) return { status: "needs-input", reason: `trade size "${input.racewaySize}" not in Table 4 for ${raceway.code}` };
  if (!input.size) return { status: "needs-input", reason: "conductor size not given" };
  if (input.conductors === undefined) return { status: "needs-input", reason: "number of conductors not known" };
  const insulation = insulationType(input.insulation);
  const table5 = insulation ? CHAPTER_9_TABLE_5[insulation.code] : undefined;
  if (!table5) return { status: "needs-input", reason: `${input.insulation || "insulation"} is not in Chapter 9 Table 5: give its area from the cable datasheet` };
  const conductorAreaIn2 = table5[input.size];
  if (conductorAreaIn2 === undefined) return { status: "needs-input", reason: `${input.size} ${insulation!.code} is not in Chapter 9 Table 5` };
  const egcAreaIn2 = input.egcSize ? table5[input.egcSize] : 0;
  if (egcAreaIn2 === undefined) return { status: "needs-input", reason: `EGC ${input.egcSize} ${insulation!.code} is not in Chapter 9 Table 5` };
  const count = input.conductors + (input.egcSize ? 1 : 0);
  const totalAreaIn2 = input.conductors * conductorAreaIn2 + egcAreaIn2;
  const fillPct = (totalAreaIn2 / racewayAreaIn2) * 100;
  const limitPct = fillLimitPct(count);
  const fits = (area: number | undefined) => area !== undefined && (totalAreaIn2 / area) * 100 <= limitPct;
  const fitsIn = fillPct <= limitPct ? undefined : TRADE_SIZES.find((t) => fits(table4.areas[t]));
  return {
    ...(fitsIn ? { fitsIn } : {}),
    status: fillPct <= limitPct ? "pass" : "fail",
    racewayLabel: `${size} in ${raceway.code}`,
    article: raceway.article,
    racewayAreaIn2,
    conductorAreaIn2,
    egcAreaIn2,
    count,
    totalAreaIn2,
    fillPct,
    limitPct,
  };
}
