"use client";

import { loadSummary } from "@/lib/compliance";
import { useLive } from "./live-checks";
import { LoadsGrid } from "./row-sections";
import { Section } from "./site-section";

const wh = (v: number) => `${Math.round(v).toLocaleString("en-US")} Wh`;

function LoadFigures() {
  const { record } = useLive();
  if (!record) return null;
  const s = loadSummary(record);
  const rows: [string, string][] = [
    ["Daily energy of the loads", wh(s.dailyLoadWh)],
    ["Inverter idle draw over 24 h", s.inverterIdleMissing.length ? `${wh(s.idleWh)} (no idle figure for ${s.inverterIdleMissing.join(", ")})` : wh(s.idleWh)],
    ["Daily total", wh(s.dailyTotalWh)],
    ["Peak simultaneous power", `${Math.round(s.peakSimultaneousW).toLocaleString("en-US")} W`],
    ["Largest surge", `${Math.round(s.largestSurgeW).toLocaleString("en-US")} W`],
    ["Usable storage", s.usableStorageWh === null ? "— (battery energy or depth of discharge missing)" : wh(s.usableStorageWh)],
    [
      "Autonomy",
      s.autonomyDays === null
        ? "—"
        : `${s.autonomyDays.toFixed(1)} days${record.daysOfAutonomy ? ` (target ${record.daysOfAutonomy} days)` : ""}`,
    ],
  ];
  return (
    <table className="data-table mt-4 max-w-xl" aria-label="Load summary">
      <tbody>
        {rows.map(([label, value]) => (
          <tr key={label}>
            <th scope="row" className="text-left font-normal text-ink-soft">
              {label}
            </th>
            <td className="figure text-right">{value}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}

export function LoadsSection() {
  return (
    <Section id="loads" title="Loads and autonomy" sheet="A · 6">
      <LoadsGrid />
      {/* The loads chart (components/loads/loads-chart.tsx) goes here once it exists; the figures stand in for it. */}
      <LoadFigures />
    </Section>
  );
}
