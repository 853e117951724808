"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { fetchJson, RequestError } from "@/lib/fetch-json";
import { CORRECTION_RESPONSE_MIN_CHARS, type CorrectionView } from "@/lib/schemas/corrections";

type CorrectionRow = CorrectionView;

interface Props {
  items: CorrectionRow[];
  assignable: { id: string; name: string; roles: string[] }[];
  canResolve: boolean;
  canAssign: boolean;
  /** The office writes a comment into the jurisdiction's notes so the next project there gets it right. */
  canPromote?: boolean;
}

/** "2 December 2026, 14:20 UTC": stored times are UTC, and the page says so rather than guess the reader's zone. */
function when(iso: string): string {
  const d = new Date(iso);
  return `${d.toLocaleDateString("en-GB", { day: "numeric", month: "long", year: "numeric", timeZone: "UTC" })}, ${d.toISOString().slice(11, 16)} UTC`;
}

function CorrectionCard({ item, assignable, canResolve, canAssign, canPromote = false }: { item: CorrectionRow } & Omit<Props, "items">) {
  const router = useRouter();
  const [response, setResponse] = useState(item.response);
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const [promoted, setPromoted] = useState<string | null>(null);
  const title = `Comment ${item.number}`;

  async function send(body: Record<string, unknown>) {
    setBusy(true);
    setError(null);
    try {
      const answer = await fetchJson<{ message?: string }>(`/api/corrections/${item.id}`, { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify({ ...body, version: item.version }) });
      if (body.action === "promote") setPromoted(answer.message ?? "Added to the jurisdiction's notes.");
      router.refresh();
    } catch (e) {
      setError(e instanceof RequestError ? [e.message, ...e.issues.map((i) => `${i.path === "response" ? "Response" : i.path} ${i.message}.`)].join(" ") : "The change was not saved.");
    } finally {
      setBusy(false);
    }
  }

  return (
    <article aria-label={title} data-open={item.open} className={`sheet px-4 py-3 ${item.open ? "border-l-4 border-l-signal" : ""}`}>
      <header className="flex flex-wrap items-baseline gap-x-3 gap-y-1">
        <h3 className="text-sm font-semibold">{title}</h3>
        {item.sheet ? <span className="figure text-xs">Sheet {item.sheet}</span> : null}
        {item.citation ? <span className="figure text-xs">{item.citation}</span> : null}
        <span className="text-xs text-ink-soft">letter of {item.letterOn}</span>
        <span className={`ml-auto text-xs font-semibold ${item.open ? "text-signal" : "text-ok"}`}>{item.open ? "Open" : "Resolved"}</span>
      </header>
      <p className="mt-2 text-sm">{item.comment}</p>
      <div className="mt-2 flex flex-wrap items-center gap-2 text-xs text-ink-soft">
        {canAssign && item.open ? (
          <label className="flex items-center gap-2 whitespace-nowrap">
            Assigned to
            <select
              className="input py-0.5 text-xs"
              value={item.assigneeId ?? ""}
              disabled={busy}
              onChange={(e) => e.target.value && void send({ action: "assign", assigneeId: e.target.value })}
            >
              {item.assigneeId ? null : <option value="">Nobody yet</option>}
              {assignable.map((a) => (
                <option key={a.id} value={a.id}>
                  {a.name} ({a.roles.join(", ")})
                </option>
              ))}
            </select>
          </label>
        ) : (
          <span>Assigned to {item.assigneeName ?? "nobody yet"}</span>
        )}
        {canPromote ? (
          promoted ? (
            <span role="status" className="text-ok">
              {promoted}
            </span>
          ) : (
            <button type="button" className="btn-quiet ml-auto text-xs" disabled={busy} onClick={() => void send({ action: "promote" })}>
              Add to the jurisdiction&apos;s notes
            </button>
          )
        ) : null}
      </div>
      {item.open ? (
        canResolve ? (
          <form
            className="mt-3 space-y-2"
            aria-label={`Answer ${title}`}
            onSubmit={(e) => {
              e.preventDefault();
              void send({ action: "resolve", response });
            }}
          >
            <label htmlFor={`response-${item.id}`} className="field-label block">
              Response
            </label>
            <textarea
              id={`response-${item.id}`}
              rows={2}
              className="input w-full"
              value={response}
              onChange={(e) => setResponse(e.target.value)}
              aria-invalid={error ? true : undefined}
              placeholder="What changed, and on which sheet: “Label L-4 added at the battery disconnect, sheet E-004.”"
            />
            <button type="submit" className="btn" disabled={busy || response.trim().length < CORRECTION_RESPONSE_MIN_CHARS}>
              {busy ? "Saving…" : "Mark resolved"}
            </button>
          </form>
        ) : null
      ) : (
        <div className="mt-3 border-l-2 border-rule pl-3 text-sm">
          <p className="field-label">Response</p>
          <p>{item.response}</p>
          <p className="mt-1 text-xs text-ink-soft">
            {item.resolvedByName ?? "—"}, {item.resolvedAt ? when(item.resolvedAt) : ""}
          </p>
          {canResolve ? (
            <button type="button" className="btn-quiet mt-2 text-xs" disabled={busy} onClick={() => void send({ action: "reopen" })}>
              Reopen
            </button>
          ) : null}
        </div>
      )}
      {error ? (
        <p role="alert" className="mt-2 text-sm text-signal">
          {error}
        </p>
      ) : null}
    </article>
  );
}

/** The AHJ's comments as work: each assigned, answered with a response, and reopened when the answer falls short. */
export function CorrectionList({ items, ...rest }: Props) {
  return (
    <div className="space-y-3">
      {items.map((item) => (
        <CorrectionCard key={`${item.id}-${item.version}`} item={item} {...rest} />
      ))}
    </div>
  );
}
