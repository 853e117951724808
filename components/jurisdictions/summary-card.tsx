"use client";

import { Bar, BarChart, CartesianGrid, LabelList, XAxis, YAxis } from "recharts";
import type { JurisdictionSummary } from "@/lib/schemas/jurisdiction-summary";
import { EVENT_LABELS } from "@/lib/schemas/submission";

// Slate of app/globals.css, as the loads chart draws its bars.
const SLATE = "#2f3e52";
const RULE = "#c9c3b3";

const pct = (v: number | null) => (v === null ? "—" : `${Math.round(v * 100)} %`);

/** The office's figures for one jurisdiction, with open applications by status as a chart. */
export function SummaryCard({ summary }: { summary: JurisdictionSummary }) {
  const data = summary.openByStatus.map((s) => ({ name: EVENT_LABELS[s.status], count: s.count }));
  return (
    <section aria-labelledby="summary-title" className="sheet px-4 py-3">
      <h2 id="summary-title" className="mb-2 text-sm font-semibold">
        Submissions here <span className="figure font-normal text-ink-soft">({summary.submissions})</span>
      </h2>
      <dl className="grid grid-cols-3 gap-2 text-sm" aria-label="Jurisdiction figures">
        <div>
          <dt className="field-label">Median days to permit</dt>
          <dd className="figure">{summary.medianDaysToPermit === null ? "—" : `${summary.medianDaysToPermit} d`}</dd>
          <dd className="text-xs text-ink-soft">over {summary.permitted} permitted</dd>
        </div>
        <div>
          <dt className="field-label">Approved as first sent</dt>
          <dd className="figure">{pct(summary.firstTimeApprovalRate)}</dd>
          <dd className="text-xs text-ink-soft">of {summary.decided} decided</dd>
        </div>
        <div>
          <dt className="field-label">Corrections per submission</dt>
          <dd className="figure">{summary.correctionsPerSubmission === null ? "—" : summary.correctionsPerSubmission.toFixed(2)}</dd>
        </div>
      </dl>
      {data.length ? (
        <figure className="mt-3" aria-label="Open submissions by status">
          <BarChart width={300} height={40 + data.length * 32} data={data} layout="vertical" margin={{ top: 4, right: 32, bottom: 4, left: 8 }}>
            <CartesianGrid horizontal={false} stroke={RULE} />
            <XAxis type="number" allowDecimals={false} tick={{ fontSize: 11 }} />
            <YAxis type="category" dataKey="name" width={130} tick={{ fontSize: 12 }} />
            <Bar dataKey="count" fill={SLATE} isAnimationActive={false}>
              <LabelList dataKey="count" position="right" style={{ fontSize: 12 }} />
            </Bar>
          </BarChart>
          <figcaption className="text-xs text-ink-soft">Open submissions by status. Days are calendar days in UTC, weekends included.</figcaption>
        </figure>
      ) : (
        <p className="mt-2 text-sm text-ink-soft">No open submissions.</p>
      )}
    </section>
  );
}
