"use client";

import { useId } from "react";
import { Bar, BarChart, CartesianGrid, Cell, LabelList, ReferenceLine, Tooltip, XAxis, YAxis } from "recharts";
import { loadEnergyFormula, loadSummary } from "@/lib/compliance";
import type { ProjectRecord } from "@/lib/schemas/project-record";
import { isInverter } from "@/lib/schemas/vocabulary";

/** Days of autonomy when the record names none: two to three by common practice; the check engine takes 2. */
const COMMON_PRACTICE_DAYS = 2;


// Palette of app/globals.css: slate for loads, brass for the inverter's own losses (conversion, idle draw),
// caution for a shortfall (sizing is common practice, not code, so it warns rather than fails).
const SLATE = "#2f3e52";
const BRASS = "#8a6a1f";
const CAUTION = "#8a5a00";
const OK = "#2f6b3a";
const RULE = "#c9c3b3";
const INK_SOFT = "#4a5262";

const wh = (n: number) => Math.round(n).toLocaleString("en-US");
const kwh = (n: number) => (n / 1000).toLocaleString("en-US", { minimumFractionDigits: 2, maximumFractionDigits: 2 });

interface EnergyBar {
  name: string;
  wh: number;
  detail: string;
  idle: boolean;
}

export interface LoadsChartProps {
  record: ProjectRecord;
  className?: string;
}

/**
 * Daily energy by load (the inverter's conversion loss and idle draw over 24 h as bars of their own) and
 * usable storage against the target days of autonomy. Every figure is also in
 * the table beside its chart, so the chart is never the only way to read it.
 */
export function LoadsChart({ record, className }: LoadsChartProps) {
  const uid = useId();
  const s = loadSummary(record);

  const idleInverters = record.equipment.filter((e) => isInverter(e) && e.idleW !== undefined);
  const idleDetail = idleInverters
    .map((e) => `${e.tag}: ${"idleW" in e ? e.idleW : 0} W × 24 h${e.quantity > 1 ? ` × ${e.quantity}` : ""}`)
    .join("; ");

  const bars: EnergyBar[] = record.loads.map((l, i) => ({
    name: l.name,
    wh: s.perLoad[i]?.dailyWh ?? 0,
    detail: loadEnergyFormula(l),
    idle: false,
  }));
  if (s.conversionLossWh > 0) {
    bars.push({ name: "Inverter conversion loss", wh: s.conversionLossWh, detail: `loads ÷ ${s.inverterEfficiencyPct} % efficiency`, idle: true });
  }
  if (idleInverters.length > 0) {
    bars.push({ name: "Inverter idle, 24 h", wh: s.idleWh, detail: idleDetail, idle: true });
  }

  const daysGiven = record.daysOfAutonomy;
  const targetDays = daysGiven ?? COMMON_PRACTICE_DAYS;
  const neededWh = s.dailyTotalWh * targetDays;
  const usableWh = s.usableStorageWh;
  const shortWh = usableWh !== null ? neededWh - usableWh : null;
  const batteries = record.equipment.filter((e) => e.kind === "battery");
  // A grid-interactive system has the grid for the days without sun: storage is backup, so a shortfall is no warning.
  const hybrid = record.systemKind === "hybrid";
  const SLATE_SOFT = "#8796a8";

  const energyHeight = Math.max(120, 44 + bars.length * 30);
  const storageData = [
    { name: `Needed, ${targetDays} d`, kwh: neededWh / 1000, fill: SLATE },
    ...(usableWh !== null ? [{ name: "Usable storage", kwh: usableWh / 1000, fill: hybrid ? SLATE_SOFT : shortWh !== null && shortWh > 0 ? CAUTION : OK }] : []),
  ];

  return (
    <section className={`space-y-6 ${className ?? ""}`} aria-label="Loads and autonomy">
      {/* Figure 1: daily energy by load */}
      <div className="grid items-start gap-4 lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
        <figure className="sheet px-3 py-3" aria-labelledby={`${uid}-energy-cap`}>
          <figcaption id={`${uid}-energy-cap`} className="field-label mb-2">
            Daily energy by load
          </figcaption>
          {bars.length > 0 && record.loads.length === 0 ? (
            <p className="px-2 pb-2 text-sm text-ink-soft">No loads recorded yet; only the inverter idle draw is counted.</p>
          ) : null}
          {bars.length === 0 ? (
            <p className="px-2 py-6 text-sm text-ink-soft">No loads recorded yet. Add the loads to see the daily energy.</p>
          ) : (
            <div style={{ width: "100%", height: energyHeight }}>
              <BarChart
                responsive
                style={{ width: "100%", height: "100%" }}
                data={bars}
                layout="vertical"
                margin={{ top: 4, right: 56, bottom: 28, left: 8 }}
              >
                <CartesianGrid horizontal={false} stroke={RULE} strokeDasharray="2 3" />
                <XAxis
                  type="number"
                  tick={{ fontSize: 11, fill: INK_SOFT }}
                  tickFormatter={(v: number) => v.toLocaleString("en-US")}
                  label={{ value: "Energy per day (Wh)", position: "insideBottom", offset: -16, fontSize: 11, fill: INK_SOFT }}
                />
                <YAxis
                  type="category"
                  dataKey="name"
                  width={140}
                  tick={{ fontSize: 11, fill: INK_SOFT }}
                  label={{ value: "Load", angle: -90, position: "insideLeft", fontSize: 11, fill: INK_SOFT }}
                />
                <Tooltip formatter={(v) => [`${wh(Number(v))} Wh/day`, "Energy"]} cursor={{ fill: "rgba(47,62,82,0.08)" }} />
                <Bar dataKey="wh" isAnimationActive={false} name="Energy per day (Wh)">
                  {bars.map((b, i) => (
                    <Cell key={i} fill={b.idle ? BRASS : SLATE} />
                  ))}
                  <LabelList dataKey="wh" position="right" formatter={(v) => wh(Number(v))} style={{ fontSize: 11, fill: INK_SOFT }} />
                </Bar>
              </BarChart>
            </div>
          )}
        </figure>
        <div className="sheet overflow-x-auto">
          <table className="data-table" aria-label="Daily energy by load">
            <thead>
              <tr>
                <th>Load</th>
                <th>How it adds up</th>
                <th className="text-right">Wh/day</th>
              </tr>
            </thead>
            <tbody>
              {bars.map((b, i) => (
                <tr key={i}>
                  <td>
                    {b.idle ? <span aria-hidden="true" className="mr-1 text-brass">◆</span> : null}
                    {b.name}
                  </td>
                  <td className="figure text-xs text-ink-soft">{b.detail}</td>
                  <td className="figure whitespace-nowrap text-right">{wh(b.wh)}</td>
                </tr>
              ))}
              <tr>
                <td className="font-semibold" colSpan={2}>
                  Daily need
                </td>
                <td className="figure whitespace-nowrap text-right font-semibold">{wh(s.dailyTotalWh)} Wh</td>
              </tr>
              <tr>
                <td colSpan={2}>Peak simultaneous power</td>
                <td className="figure whitespace-nowrap text-right">{wh(s.peakSimultaneousW)} W</td>
              </tr>
              <tr>
                <td colSpan={2}>Largest starting surge</td>
                <td className="figure whitespace-nowrap text-right">{wh(s.largestSurgeW)} W</td>
              </tr>
            </tbody>
          </table>
          {s.inverterIdleMissing.length > 0 ? (
            <p className="border-t border-grid px-3 py-2 text-xs text-caution">
              <span aria-hidden="true">▲ </span>
              {s.inverterIdleMissing.join(", ")} {s.inverterIdleMissing.length === 1 ? "has" : "have"} no idle figure; {s.inverterIdleMissing.length === 1 ? "its" : "their"} idle
              draw is not counted. Enter idle watts from the datasheet.
            </p>
          ) : null}
        </div>
      </div>

      {/* Figure 2: usable storage against the target days of autonomy */}
      <div className="grid items-start gap-4 lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
        <figure className="sheet px-3 py-3" aria-labelledby={`${uid}-storage-cap`}>
          <figcaption id={`${uid}-storage-cap`} className="field-label mb-2">
            Usable storage against {targetDays} days of autonomy
          </figcaption>
          {s.dailyTotalWh <= 0 ? (
            <p className="px-2 py-6 text-sm text-ink-soft">No daily energy yet, so there is nothing to store for.</p>
          ) : (
            <div style={{ width: "100%", height: 150 }}>
              <BarChart
                responsive
                style={{ width: "100%", height: "100%" }}
                data={storageData}
                layout="vertical"
                margin={{ top: 4, right: 56, bottom: 28, left: 8 }}
              >
                <CartesianGrid horizontal={false} stroke={RULE} strokeDasharray="2 3" />
                <XAxis
                  type="number"
                  tick={{ fontSize: 11, fill: INK_SOFT }}
                  tickFormatter={(v: number) => v.toLocaleString("en-US", { maximumFractionDigits: 1 })}
                  label={{ value: "Energy (kWh)", position: "insideBottom", offset: -16, fontSize: 11, fill: INK_SOFT }}
                />
                <YAxis type="category" dataKey="name" width={140} tick={{ fontSize: 11, fill: INK_SOFT }} />
                <ReferenceLine x={neededWh / 1000} stroke={SLATE} strokeDasharray="4 3" />
                <Tooltip formatter={(v) => [`${kwh(Number(v) * 1000)} kWh`, "Energy"]} cursor={{ fill: "rgba(47,62,82,0.08)" }} />
                <Bar dataKey="kwh" isAnimationActive={false} name="Energy (kWh)">
                  {storageData.map((d, i) => (
                    <Cell key={i} fill={d.fill} />
                  ))}
                  <LabelList dataKey="kwh" position="right" formatter={(v) => kwh(Number(v) * 1000)} style={{ fontSize: 11, fill: INK_SOFT }} />
                </Bar>
              </BarChart>
            </div>
          )}
        </figure>
        <div className="sheet overflow-x-auto">
          <table className="data-table" aria-label="Storage and autonomy">
            <tbody>
              <tr>
                <td>Daily need</td>
                <td className="figure whitespace-nowrap text-right">{wh(s.dailyTotalWh)} Wh</td>
              </tr>
              <tr>
                <td>{daysGiven !== undefined ? "Days of autonomy designed for" : "Days of autonomy (common practice, not set)"}</td>
                <td className="figure whitespace-nowrap text-right">{targetDays} d</td>
              </tr>
              <tr>
                <td>Needed: daily need × days</td>
                <td className="figure whitespace-nowrap text-right">{kwh(neededWh)} kWh</td>
              </tr>
              <tr>
                <td>Usable storage: Σ kWh × qty × depth of discharge</td>
                <td className="figure whitespace-nowrap text-right">{usableWh !== null ? `${kwh(usableWh)} kWh` : "unknown"}</td>
              </tr>
              <tr>
                <td className="font-semibold">Days the storage carries</td>
                <td className="figure whitespace-nowrap text-right font-semibold">{s.autonomyDays !== null ? `${s.autonomyDays.toFixed(1)} d` : "—"}</td>
              </tr>
            </tbody>
          </table>
          <p className="border-t border-grid px-3 py-2 text-xs">
            {usableWh === null ? (
              <span className="text-caution">
                <span aria-hidden="true">◇ </span>
                {batteries.length === 0
                  ? "No battery in the equipment yet."
                  : "Usable storage needs each battery's energy (kWh, or Ah and nominal voltage) and usable depth of discharge."}
              </span>
            ) : hybrid ? (
              <span className="text-ink-soft">
                Grid-interactive: the grid carries the days without sun; the storage carries {s.autonomyDays?.toFixed(1) ?? "—"} d of the full daily need as backup.
              </span>
            ) : shortWh !== null && shortWh > 0 ? (
              <span className="text-caution">
                <span aria-hidden="true">▲ </span>Short of the target by {kwh(shortWh)} kWh.
              </span>
            ) : (
              <span className="text-ok">
                <span aria-hidden="true">● </span>Covers the target with {kwh(-(shortWh ?? 0))} kWh to spare.
              </span>
            )}{" "}
            <span className="text-ink-soft">Sizing by common practice; the designer and the AHJ decide.</span>
          </p>
        </div>
      </div>
    </section>
  );
}
