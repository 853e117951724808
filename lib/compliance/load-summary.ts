/** Daily energy, peak power and storage of a stand-alone system (common practice sizing). */
import type { ProjectRecord } from "../schemas/project-record";
import { batteryKWh, isInverter } from "../schemas/vocabulary";

export interface LoadSummary {
  /** Σ watts × quantity × hours per day × duty × days a week ÷ 7, Wh. */
  dailyLoadWh: number;
  /** Inverter idle draw over 24 h, Wh (0 where no idle figure is recorded). */
  idleWh: number;
  /** Efficiency the AC loads are drawn through, %: the lowest recorded among the inverters; null when none is recorded. */
  inverterEfficiencyPct: number | null;
  /** Energy lost converting the loads' AC energy from the battery: daily load ÷ efficiency − daily load, Wh (0 without an efficiency). */
  conversionLossWh: number;
  /** What the battery supplies a day: loads ÷ inverter efficiency + idle draw over 24 h, Wh. */
  dailyTotalWh: number;
  /** Σ watts × quantity of the loads that run together, W. */
  peakSimultaneousW: number;
  /** The largest starting surge of a single load, W. */
  largestSurgeW: number;
  /** The largest running load of a single unit, W. */
  largestSingleLoadW: number;
  perLoad: { name: string; dailyWh: number }[];
  /** Σ unit energy × quantity × usable depth of discharge, Wh; null when a battery lacks its energy or depth of discharge. */
  usableStorageWh: number | null;
  /** Usable storage ÷ daily total, days; null when either is unknown or the daily total is zero. */
  autonomyDays: number | null;
  /** Inverters lacking an idle figure (their tags). */
  inverterIdleMissing: string[];
  /** Inverters lacking an efficiency (their tags). */
  inverterEfficiencyMissing: string[];
}

/**
 * A load's average daily energy, Wh: watts × quantity × hours a day × duty × days a week ÷ 7, the load
 * worksheet of stand-alone design practice, where a load used some days a week is averaged over the week.
 */
export function loadDailyWh(load: ProjectRecord["loads"][number]): number {
  const duty = (load.dutyPct ?? 100) / 100;
  const week = (load.daysPerWeek ?? 7) / 7;
  return load.watts * load.quantity * load.hoursPerDay * duty * week;
}

/** The load's energy in words, for a reader following the figure: "150 W × 24 h × 33 % duty". */
export function loadEnergyFormula(load: ProjectRecord["loads"][number]): string {
  const parts = [`${load.watts} W`];
  if (load.quantity > 1) parts.push(`${load.quantity}`);
  parts.push(`${load.hoursPerDay} h`);
  if (load.dutyPct !== undefined && load.dutyPct !== 100) parts.push(`${load.dutyPct} % duty`);
  const formula = parts.join(" × ");
  return load.daysPerWeek !== undefined && load.daysPerWeek !== 7 ? `${formula} × ${load.daysPerWeek}/7 days` : formula;
}

export function loadSummary(record: ProjectRecord): LoadSummary {
  let dailyLoadWh = 0;
  let peakSimultaneousW = 0;
  let largestSurgeW = 0;
  let largestSingleLoadW = 0;
  const perLoad = record.loads.map((l) => {
    const dailyWh = loadDailyWh(l);
    dailyLoadWh += dailyWh;
    if (l.simultaneous) peakSimultaneousW += l.watts * l.quantity;
    largestSurgeW = Math.max(largestSurgeW, l.surgeW ?? l.watts);
    largestSingleLoadW = Math.max(largestSingleLoadW, l.watts);
    return { name: l.name, dailyWh };
  });
  // A load that never runs with the others still has to be carried on its own.
  peakSimultaneousW = Math.max(peakSimultaneousW, largestSingleLoadW);
  let idleWh = 0;
  const inverterIdleMissing: string[] = [];
  const inverterEfficiencyMissing: string[] = [];
  let efficiencyPct: number | null = null;
  let usable: number | null = 0;
  for (const e of record.equipment) {
    if (isInverter(e)) {
      const idleW = e.idleW;
      if (idleW === undefined) inverterIdleMissing.push(e.tag);
      else idleWh += idleW * 24 * e.quantity;
      const eff = e.efficiencyPct;
      if (eff === undefined) inverterEfficiencyMissing.push(e.tag);
      // Several inverters: the lowest efficiency, so the need is never understated.
      else efficiencyPct = efficiencyPct === null ? eff : Math.min(efficiencyPct, eff);
    }
    if (e.kind === "battery") {
      const kwh = batteryKWh(e);
      if (kwh === undefined || e.usableDodPct === undefined || usable === null) usable = null;
      else usable += kwh * 1000 * e.quantity * (e.usableDodPct / 100);
    }
  }
  // The loads are AC: the battery supplies them through the inverter, so their energy is divided by its efficiency; the idle draw is already battery-side.
  const conversionLossWh = efficiencyPct !== null ? dailyLoadWh / (efficiencyPct / 100) - dailyLoadWh : 0;
  const dailyTotalWh = dailyLoadWh + conversionLossWh + idleWh;
  const autonomyDays = usable !== null && dailyTotalWh > 0 ? usable / dailyTotalWh : null;
  return {
    dailyLoadWh,
    idleWh,
    inverterEfficiencyPct: efficiencyPct,
    conversionLossWh,
    dailyTotalWh,
    peakSimultaneousW,
    largestSurgeW,
    largestSingleLoadW,
    perLoad,
    usableStorageWh: usable,
    autonomyDays,
    inverterIdleMissing,
    inverterEfficiencyMissing,
  };
}
