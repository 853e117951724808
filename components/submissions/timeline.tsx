import { EVENT_LABELS, INSPECTION_LABELS, type InspectionKind } from "@/lib/schemas/submission";
import type { SubmissionEventView } from "@/lib/services/submissions";

function dataLines(data: Record<string, unknown>): string[] {
  const lines: string[] = [];
  if (typeof data.permitNumber === "string") lines.push(`Permit ${data.permitNumber}`);
  if (typeof data.expiresOn === "string") lines.push(`valid until ${data.expiresOn}`);
  if (typeof data.amount === "number") lines.push(`Fee $${data.amount.toFixed(2)}`);
  if (typeof data.inspectionKind === "string") lines.push(`${INSPECTION_LABELS[data.inspectionKind as InspectionKind] ?? data.inspectionKind} inspection`);
  return lines;
}

/** The submission's log, oldest first; entries are never edited, so a correction is a later entry. */
export function SubmissionTimeline({ events }: { events: SubmissionEventView[] }) {
  return (
    <ol aria-label="Timeline" className="sheet divide-y divide-rule">
      {events.map((e) => {
        const lines = dataLines(e.data);
        return (
          <li key={e.id} className="grid gap-1 px-5 py-3 text-sm sm:grid-cols-[8rem_1fr]">
            <p className="figure text-ink-soft">
              <time dateTime={e.occurredOn}>{e.occurredOn}</time>
            </p>
            <div>
              <p className="font-semibold">{EVENT_LABELS[e.kind]}</p>
              {lines.length ? <p className="figure">{lines.join(" · ")}</p> : null}
              {e.note ? <p className="mt-0.5 max-w-prose whitespace-pre-line text-ink-soft">{e.note}</p> : null}
              <p className="mt-0.5 text-xs text-ink-faint">
                Recorded by {e.userName ?? "a former user"} · <span className="figure">{e.createdAt.slice(0, 16).replace("T", " ")} UTC</span>
              </p>
            </div>
          </li>
        );
      })}
    </ol>
  );
}
