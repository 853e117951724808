"use client";

import Link from "next/link";
import { useState } from "react";
import { CHECK_STATUSES, type CheckResult, type CheckStatus, type RemedyChange } from "@/lib/compliance";
import { StatusBadge, statusWord } from "@/components/ui/status-badge";
import { useFormContext } from "react-hook-form";
import { plural } from "@/lib/schemas/vocabulary";
import { focusRecordPaths } from "./focus-path";
import { useLive } from "./live-checks";
import { describePath, groupIssues, humaniseText } from "./record-labels";

function formatFigure(v: number | string | boolean): string {
  if (typeof v === "number") return Number.isInteger(v) ? String(v) : v.toFixed(Math.abs(v) < 10 ? 2 : 1);
  if (typeof v === "boolean") return v ? "yes" : "no";
  return v;
}

function ResultItem({
  result,
  record,
  open,
  onToggle,
  projectId,
  onApply,
}: {
  result: CheckResult;
  record: unknown;
  open: boolean;
  onToggle: () => void;
  projectId: string;
  /** Carries out a remedy's field changes; absent while rows are left out of the checks (their paths would not match the form). */
  onApply?: (changes: RemedyChange[]) => void;
}) {
  const used = [...result.missing, ...result.inputs.map((i) => i.path)];
  // Documents are edited on the attachments tab, not in this form.
  const aboutDocuments = used.some((p) => p === "attachments" || p.startsWith("attachments.") || p.startsWith("jurisdiction.requiredDocuments"));
  return (
    <li className="border-b border-grid last:border-b-0" data-check-id={result.id}>
      <button
        type="button"
        aria-expanded={open}
        className="flex w-full items-start gap-2 px-3 py-2 text-left hover:bg-slate-soft/50"
        onClick={() => {
          onToggle();
          if (!open) focusRecordPaths(used);
        }}
      >
        <span className="mt-0.5 shrink-0">
          <StatusBadge status={result.status} />
        </span>
        <span className="min-w-0">
          <span className="block text-sm font-medium leading-snug">
            {result.title}
            {result.subject && !result.title.includes(result.subject) ? <span className="figure ml-1 text-ink-soft">· {result.subject}</span> : null}
          </span>
          <span className="block text-xs leading-snug text-ink-soft">{humaniseText(record, result.message)}</span>
        </span>
      </button>
      {/* The fix stands under the result, open or not: it is what a designer looks for first. */}
      {result.remedy ? (
        <div className="mx-3 mb-2 border-l-2 border-query pl-2 text-xs" data-testid="remedy">
          <p>
            <span className="field-label">Fix </span>
            {humaniseText(record, result.remedy.text)}
          </p>
          {result.remedy.changes.length && onApply ? (
            <button type="button" className="btn-quiet mt-1 px-2 py-0.5 text-xs" onClick={() => onApply(result.remedy!.changes)}>
              Apply: {result.remedy.changes.map((c) => `${describePath(record, c.path)} → ${String(c.value)}`).join("; ")}
            </button>
          ) : null}
        </div>
      ) : null}
      {open ? (
        <div className="space-y-2 px-3 pb-3 text-xs">
          {result.reason ? <p className="text-ink-soft">{humaniseText(record, result.reason)}</p> : null}
          {result.values.length ? (
            <table className="w-full" aria-label={`Values of ${result.title}`}>
              <tbody>
                {result.values.map((v) => (
                  <tr key={v.key} className="border-b border-grid">
                    <th scope="row" className="py-0.5 pr-2 text-left font-normal text-ink-soft">
                      {v.label}
                    </th>
                    <td className="figure whitespace-nowrap py-0.5 text-right">
                      {formatFigure(v.value)}
                      {v.unit ? ` ${v.unit}` : ""}
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          ) : null}
          {result.formula ? (
            <p>
              <span className="field-label">Formula </span>
              {result.formula}
            </p>
          ) : null}
          {result.missing.length ? (
            <div>
              <p className="field-label">Missing</p>
              <ul className="flex flex-wrap gap-1">
                {result.missing.map((p) => (
                  <li key={p}>
                    <button type="button" className="underline decoration-query underline-offset-2" onClick={() => focusRecordPaths([p])}>
                      {describePath(record, p)}
                    </button>
                  </li>
                ))}
              </ul>
            </div>
          ) : null}
          {result.inputs.length ? (
            <div>
              <p className="field-label">Inputs</p>
              <ul>
                {result.inputs.map((i) => (
                  <li key={i.path} className="flex justify-between gap-2 [overflow-wrap:anywhere]">
                    <button type="button" className="text-left underline decoration-rule underline-offset-2 hover:decoration-ink" onClick={() => focusRecordPaths([i.path])}>
                      {i.label}
                    </button>
                    <span className="figure text-right">
                      {i.value === null ? "—" : formatFigure(i.value)}
                      {i.unit && i.value !== null ? ` ${i.unit}` : ""}
                    </span>
                  </li>
                ))}
              </ul>
            </div>
          ) : null}
          {aboutDocuments ? (
            <p>
              <Link href={`/projects/${projectId}/attachments`} className="underline decoration-query underline-offset-2">
                Open the attachments
              </Link>
            </p>
          ) : null}
          <p className="figure text-ink-soft">{result.codeRefs.join(" · ")}</p>
        </div>
      ) : null}
    </li>
  );
}

export function ChecksPanel({ projectId, canEdit }: { projectId: string; canEdit: boolean }) {
  const live = useLive();
  const [openId, setOpenId] = useState<string | null>(null);
  const groups = new Map<CheckStatus, CheckResult[]>();
  for (const r of live.run?.results ?? []) groups.set(r.status, [...(groups.get(r.status) ?? []), r]);
  const stale = live.record === null && live.issues.length > 0;
  const { getValues, setValue } = useFormContext();
  const apply =
    canEdit && live.omitted.length === 0
      ? (changes: RemedyChange[]) => {
          for (const c of changes) setValue(c.path, c.value, { shouldDirty: true, shouldValidate: true });
          focusRecordPaths(changes.map((c) => c.path));
        }
      : undefined;
  // Field errors name rows of the form as it stands; engine results name rows of the record the engine ran on.
  const values = getValues();
  const issueGroups = groupIssues(values, live.issues);
  return (
    <section aria-labelledby="checks-heading" className="sheet flex max-h-[calc(100vh-6rem)] flex-col">
      <header className="border-b-2 border-ink px-3 py-2">
        <div className="flex items-baseline justify-between gap-2">
          <h2 id="checks-heading" className="text-base font-semibold">
            Checks
          </h2>
          <span className="figure text-xs text-ink-faint" aria-live="polite" data-testid="check-state">
            {live.pending ? "checking…" : stale ? "not rerun" : "up to date"}
          </span>
        </div>
        <p className="figure mt-0.5 text-xs text-ink-soft">
          NEC {live.run?.edition ?? "—"}
          {CHECK_STATUSES.filter((s) => live.run?.counts[s]).map((s) => (
            <span key={s} className="ml-2">
              {live.run?.counts[s]} {statusWord(s).toLowerCase()}
            </span>
          ))}
        </p>
        {/* Engine timing is for the benchmark, not the designer: kept as data for the end-to-end measurement only. */}
        <span
          hidden
          data-testid="engine-time"
          data-engine-ms={live.engineMs ?? ""}
          data-mean-engine-ms={live.meanEngineMs ?? ""}
          data-runs={live.runs}
        />
      </header>
      <div className="min-h-0 flex-1 overflow-y-auto">
        {issueGroups.length ? (
          <div role="status" className="border-b border-grid bg-signal-soft/50 px-3 py-2 text-xs">
            <p className="font-semibold text-signal">
              {plural(issueGroups.length, "entry", "entries")} to fix
              {stale
                ? " — the checks show the last record that could be read"
                : live.omitted.length
                  ? ` — left out of the checks: ${live.omitted.map((p) => describePath(values, p)).join(", ")}`
                  : ""}
            </p>
            <ul className="mt-1 space-y-0.5">
              {issueGroups.slice(0, 12).map((g) => (
                <li key={g.path}>
                  <button type="button" className="text-left font-medium underline decoration-signal underline-offset-2" onClick={() => focusRecordPaths(g.paths)}>
                    {g.title}
                  </button>{" "}
                  {g.problems.join("; ")}
                </li>
              ))}
            </ul>
          </div>
        ) : null}
        {CHECK_STATUSES.map((status) => {
          const results = groups.get(status);
          if (!results?.length) return null;
          return (
            <section key={status} aria-label={`${statusWord(status)} (${results.length})`} data-status-group={status}>
              <h3 className="sticky top-0 z-10 border-b border-rule bg-paper px-3 py-1 text-xs font-semibold uppercase tracking-wide text-ink-soft">
                {statusWord(status)} · {results.length}
              </h3>
              <ul>
                {results.map((r) => (
                  <ResultItem key={r.id} projectId={projectId} record={live.record} onApply={apply} result={r} open={openId === r.id} onToggle={() => setOpenId(openId === r.id ? null : r.id)} />
                ))}
              </ul>
            </section>
          );
        })}
        {live.run && live.run.results.length === 0 ? <p className="px-3 py-4 text-sm text-ink-soft">No checks apply yet.</p> : null}
      </div>
      <footer className="border-t border-rule px-3 py-2 text-[11px] leading-snug text-ink-soft">
        The checks are an aid for the designer and the licensed reviewer. They approve nothing; the adopted code, the
        manufacturer&apos;s instructions and the AHJ govern.
      </footer>
    </section>
  );
}
