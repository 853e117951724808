import { EVENT_LABELS, INSPECTION_LABELS, type EventKind, type InspectionKind } from "@/lib/schemas/submission";
import type { SubmissionEventView } from "@/lib/services/submissions";
import { VoidEventForm } from "./void-event-form";

function dataLines(data: Record<string, unknown>): string[] {
  const lines: string[] = [];
  if (typeof data.permitNumber === "string") lines.push(`Permit ${data.permitNumber}`);
  if (typeof data.expiresOn === "string") lines.push(`valid until ${data.expiresOn}`);
  if (typeof data.amount === "number") lines.push(`Fee $${data.amount.toFixed(2)}`);
  if (typeof data.inspectionKind === "string") lines.push(`${INSPECTION_LABELS[data.inspectionKind as InspectionKind] ?? data.inspectionKind} inspection`);
  return lines;
}

function title(e: SubmissionEventView): string {
  if (e.kind === "voided") {
    const kind = EVENT_LABELS[e.data.voidsKind as EventKind] ?? "an entry";
    return `Voided: ${kind} of ${String(e.data.voidsOccurredOn ?? "")}`;
  }
  return EVENT_LABELS[e.kind];
}

/**
 * The submission's log, oldest first. Entries are never edited: a mistaken
 * one is voided by a later entry with its reason and shown struck through,
 * and the status is worked out without it.
 */
export function SubmissionTimeline({
  events,
  submissionId,
  version,
  mayVoid,
  revisionNumbers = {},
}: {
  events: SubmissionEventView[];
  submissionId?: string;
  version?: number;
  mayVoid?: boolean;
  revisionNumbers?: Record<string, number>;
}) {
  const firstStanding = events.find((e) => e.kind !== "voided" && !e.voided);
  return (
    <ol aria-label="Timeline" className="sheet divide-y divide-rule">
      {events.map((e) => {
        const lines = dataLines(e.data);
        if (e.kind === "resubmitted" && typeof e.data.revisionId === "string") lines.unshift(`Rev ${revisionNumbers[e.data.revisionId] ?? "?"}`);
        const voidable = mayVoid && submissionId && version !== undefined && e.kind !== "voided" && !e.voided && e.id !== firstStanding?.id;
        return (
          <li key={e.id} className={`grid gap-1 px-5 py-3 text-sm sm:grid-cols-[8rem_1fr] ${e.kind === "voided" ? "bg-sheet" : ""}`} data-voided={e.voided ? "true" : undefined}>
            <p className="figure text-ink-soft">
              <time dateTime={e.occurredOn}>{e.occurredOn}</time>
            </p>
            <div>
              <p className={`font-semibold ${e.voided ? "line-through decoration-signal" : ""}`}>{title(e)}</p>
              {e.voided ? (
                <p className="text-xs font-semibold text-signal">
                  Voided on {e.voided.on} by {e.voided.byName ?? "a former user"}: {e.voided.reason}
                </p>
              ) : null}
              {lines.length ? <p className={`figure ${e.voided ? "line-through" : ""}`}>{lines.join(" · ")}</p> : null}
              {e.note ? <p className="mt-0.5 max-w-prose whitespace-pre-line text-ink-soft">{e.kind === "voided" ? `Reason: ${e.note}` : e.note}</p> : null}
              <p className="mt-0.5 text-xs text-ink-faint">
                Recorded by {e.userName ?? "a former user"} · <span className="figure">{e.createdAt.slice(0, 16).replace("T", " ")} UTC</span>
              </p>
              {voidable ? <VoidEventForm submissionId={submissionId} eventId={e.id} version={version} label={`${EVENT_LABELS[e.kind as EventKind]} of ${e.occurredOn}`} /> : null}
            </div>
          </li>
        );
      })}
    </ol>
  );
}
