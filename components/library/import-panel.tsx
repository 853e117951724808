"use client";

import { useId, useRef, useState } from "react";
import { fetchJson, RequestError } from "@/lib/fetch-json";
import { EQUIPMENT_KINDS, KIND_LABELS, mpptInputFields, ratingFieldsForKind } from "@/lib/schemas/library-item";
import type { ImportReport } from "@/lib/services/library/import-csv";

type Outcome = { kind: "report"; fileName: string; report: ImportReport } | { kind: "refused"; fileName: string; message: string; issues: { path: string; message: string }[] };

/** Imports a CSV file and shows, row by row, what was taken and what was refused and why. */
export function ImportPanel({ onImported, onClose }: { onImported: () => void; onClose: () => void }) {
  const uid = useId();
  const fileRef = useRef<HTMLInputElement>(null);
  const [pending, setPending] = useState(false);
  const [outcome, setOutcome] = useState<Outcome | null>(null);
  const [error, setError] = useState<string | null>(null);

  async function submit(event: React.FormEvent) {
    event.preventDefault();
    const file = fileRef.current?.files?.[0];
    setError(null);
    if (!file) {
      setError("Choose a CSV file first.");
      fileRef.current?.focus();
      return;
    }
    setPending(true);
    const body = new FormData();
    body.set("file", file);
    try {
      const report = await fetchJson<ImportReport>("/api/library/import", { method: "POST", body });
      setOutcome({ kind: "report", fileName: file.name, report });
      if (report.taken.length) onImported();
    } catch (e) {
      if (e instanceof RequestError && e.status === 400) setOutcome({ kind: "refused", fileName: file.name, message: e.message, issues: e.issues });
      else setError(e instanceof Error ? e.message : "The file could not be sent.");
    } finally {
      setPending(false);
    }
  }

  return (
    <section className="sheet p-4" aria-labelledby={`${uid}-title`}>
      <div className="mb-3 flex flex-wrap items-baseline justify-between gap-2 border-b border-rule pb-2">
        <h2 id={`${uid}-title`} className="text-base font-semibold">
          Import from a CSV file
        </h2>
        <a className="text-sm underline decoration-rule underline-offset-2 hover:decoration-ink" href="/api/library/example-csv" download>
          Download the example file (equipment-library.csv)
        </a>
      </div>
      <div className="grid gap-4 lg:grid-cols-[minmax(0,1fr)_minmax(0,1fr)]">
        <div className="space-y-2 text-sm text-ink-soft">
          <p>
            One row per item. Columns <code className="figure">kind</code>, <code className="figure">manufacturer</code> and{" "}
            <code className="figure">model</code> are required; every other column is a rating named exactly as in the example file, with
            the unit in the name (<code className="figure">vocV</code>, <code className="figure">iscA</code>,{" "}
            <code className="figure">tempCoeffVocPctPerC</code>). Write numbers only — <code className="figure">49.5</code>, not{" "}
            <code className="figure">49.5 V</code>. Leave a cell empty where a rating does not apply or is not known.
          </p>
          <p>
            Good rows are added, bad rows are listed with the reason; fix them and import those rows again. Items already in the library are
            not added twice.
          </p>
          <form onSubmit={submit} className="flex flex-wrap items-end gap-3 pt-1">
            <div>
              <label htmlFor={`${uid}-file`} className="field-label block">
                CSV file
              </label>
              <input id={`${uid}-file`} ref={fileRef} type="file" accept=".csv,text/csv" className="mt-1 block text-sm" />
            </div>
            <button type="submit" className="btn" disabled={pending}>
              {pending ? "Importing…" : "Import"}
            </button>
            <button type="button" className="btn-quiet" onClick={onClose}>
              Close
            </button>
          </form>
          {error ? (
            <p role="alert" className="text-sm text-signal">
              <span aria-hidden="true">■ </span>
              {error}
            </p>
          ) : null}
        </div>
        <details className="text-xs">
          <summary className="cursor-pointer text-sm font-medium text-ink">Column names by kind</summary>
          <dl className="mt-2 max-h-72 space-y-2 overflow-y-auto pr-2">
            {EQUIPMENT_KINDS.map((k) => (
              <div key={k}>
                <dt className="font-semibold">
                  {KIND_LABELS[k]} <code className="figure font-normal text-ink-faint">kind = {k}</code>
                </dt>
                <dd className="figure text-ink-soft">
                  {ratingFieldsForKind(k)
                    .flatMap((f) =>
                      f.type === "mppt-inputs"
                        ? mpptInputFields().map((m) => `mpptInputs.1.${m.name}`)
                        : [`${f.name}${f.options ? ` (${f.options.join("|")})` : f.type === "boolean" ? " (yes|no)" : ""}`],
                    )
                    .join(", ")}
                </dd>
              </div>
            ))}
          </dl>
        </details>
      </div>
      {outcome ? <ImportOutcome outcome={outcome} /> : null}
    </section>
  );
}

function ImportOutcome({ outcome }: { outcome: Outcome }) {
  if (outcome.kind === "refused") {
    return (
      <div role="alert" className="mt-4 border-l-4 border-l-signal bg-signal-soft/40 px-3 py-3 text-sm">
        <p className="font-semibold">
          <span aria-hidden="true">■ </span>
          {outcome.fileName}: {outcome.message}
        </p>
        {outcome.issues.length ? (
          <ul className="mt-1 list-inside list-disc">
            {outcome.issues.map((i) => (
              <li key={i.path + i.message}>
                <code className="figure">{i.path}</code>: {i.message}
              </li>
            ))}
          </ul>
        ) : null}
      </div>
    );
  }
  const { report } = outcome;
  const rows = [
    ...report.taken.map((t) => ({ row: t.row, kind: t.kind as string, name: `${t.manufacturer} ${t.model}`, ok: true, reasons: [] as string[] })),
    ...report.refused.map((r) => ({ row: r.row, kind: r.kind, name: `${r.manufacturer} ${r.model}`.trim(), ok: false, reasons: r.problems.map((p) => p.text) })),
  ].sort((a, b) => Number(a.ok) - Number(b.ok) || a.row - b.row); // refused rows first: they are the ones to fix
  return (
    <div className="mt-4" role="status" aria-live="polite">
      <p className="mb-2 text-sm">
        <span className="font-semibold">{outcome.fileName}:</span> {report.rowsRead} row{report.rowsRead === 1 ? "" : "s"} read,{" "}
        <span className="text-ok">{report.taken.length} added</span>,{" "}
        <span className={report.refused.length ? "font-semibold text-signal" : ""}>{report.refused.length} refused</span>.
        {report.refused.length ? " The refused rows changed nothing; fix them and import them again." : ""}
      </p>
      <table className="data-table" aria-label="Import report">
        <thead>
          <tr>
            <th className="text-right">Row</th>
            <th>Kind</th>
            <th>Item</th>
            <th>Result</th>
            <th>Why</th>
          </tr>
        </thead>
        <tbody>
          {rows.map((r) => (
            <tr key={r.row}>
              <td className="figure text-right">{r.row}</td>
              <td className="figure text-xs">{r.kind}</td>
              <td>{r.name || "—"}</td>
              <td>
                {r.ok ? (
                  <span className="inline-flex items-center gap-1 whitespace-nowrap rounded-[2px] border border-ok bg-ok-soft px-1.5 py-0.5 text-xs font-semibold text-ok">
                    <span aria-hidden="true">●</span> Added
                  </span>
                ) : (
                  <span className="inline-flex items-center gap-1 whitespace-nowrap rounded-[2px] border border-signal bg-signal px-1.5 py-0.5 text-xs font-semibold text-white">
                    <span aria-hidden="true">■</span> Refused
                  </span>
                )}
              </td>
              <td className="text-xs">
                {r.reasons.length ? (
                  <ul>
                    {r.reasons.map((x) => (
                      <li key={x}>{x}</li>
                    ))}
                  </ul>
                ) : null}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
