"use client";

import { useRouter } from "next/navigation";
import { startTransition, useActionState, useEffect, useState } from "react";
import { recordEventAction } from "@/app/(app)/submissions/actions";
import { EVENT_LABELS, INSPECTION_EVENT_KINDS, INSPECTION_KINDS, INSPECTION_LABELS, type EventKind } from "@/lib/schemas/submission";
import { CorrectionsFields } from "./corrections-fields";
import { FormField } from "./field";

/** The usual next step after each state, offered first when the event rules allow it. */
const USUAL_NEXT: Record<EventKind, EventKind> = {
  submitted: "in-plan-review",
  "in-plan-review": "corrections-requested",
  "on-hold": "in-plan-review",
  "corrections-requested": "resubmitted",
  resubmitted: "in-plan-review",
  approved: "permit-issued",
  "permit-issued": "inspection-scheduled",
  "fee-paid": "permit-issued",
  "inspection-scheduled": "inspection-passed",
  "inspection-passed": "inspection-scheduled",
  "inspection-failed": "inspection-scheduled",
  finaled: "finaled",
  expired: "expired",
  cancelled: "cancelled",
};

function firstChoice(status: EventKind, allowed: readonly EventKind[]): EventKind {
  return allowed.includes(USUAL_NEXT[status]) ? USUAL_NEXT[status] : (allowed[0] ?? USUAL_NEXT[status]);
}

interface Values {
  kind: EventKind;
  occurredOn: string;
  note: string;
  permitNumber: string;
  expiresOn: string;
  amountUsd: string;
  inspectionKind: string;
  revisionId: string;
}

/**
 * Records the next event of a submission. It offers only the kinds the event
 * rules allow after where the application stands; the fields each kind needs
 * appear with it, and refusals show beside them.
 */
export function EventForm({
  submissionId,
  version,
  status,
  today,
  allowedNext,
  resubmittable,
  assignable = [],
  defaultAssigneeId = "",
}: {
  submissionId: string;
  version: number;
  status: EventKind;
  today: string;
  allowedNext: EventKind[];
  resubmittable: { id: string; number: number }[];
  /** Designers and reviewers who can take the AHJ's comments. */
  assignable?: { id: string; name: string; roles: string[] }[];
  defaultAssigneeId?: string;
}) {
  const router = useRouter();
  const [state, action, pending] = useActionState(recordEventAction, null);
  const blank = (kind: EventKind): Values => ({ kind, occurredOn: today, note: "", permitNumber: "", expiresOn: "", amountUsd: "", inspectionKind: "", revisionId: resubmittable[0]?.id ?? "" });
  const [values, setValues] = useState<Values>(blank(firstChoice(status, allowedNext)));

  useEffect(() => {
    if (state?.ok) {
      setValues(blank(USUAL_NEXT[state.data?.status ?? status]));
      // The page reloads with the kinds now allowed; until then the usual next one is shown.
      router.refresh();
    }
    // Only a new result resets the form.
  }, [state]);

  const issueFor = (name: string) => (state && !state.ok ? state.issues.find((i) => i.path === name || i.path.startsWith(`${name}.`))?.message : undefined);
  const bind = (name: keyof Values) => ({
    name,
    value: values[name],
    onChange: (e: React.ChangeEvent<HTMLInputElement | HTMLSelectElement | HTMLTextAreaElement>) => setValues((v) => ({ ...v, [name]: e.target.value })),
  });
  const kind = values.kind;
  const inspection = INSPECTION_EVENT_KINDS.includes(kind);

  return (
    <form
      // Submitted by hand rather than through the action prop: React resets a form after its action, which would clear a controlled select on a refusal.
      onSubmit={(e) => {
        e.preventDefault();
        const data = new FormData(e.currentTarget);
        startTransition(() => action(data));
      }}
      aria-label="Record an event"
      className="sheet grid gap-4 px-5 py-5 sm:grid-cols-3"
    >
      <input type="hidden" name="submissionId" value={submissionId} />
      <input type="hidden" name="version" value={state?.ok && state.data ? state.data.version : version} />
      <FormField id="event-kind" label="Event" issue={issueFor("kind")}>
        {(d, bad) => (
          <select id="event-kind" {...bind("kind")} className="input w-full" aria-describedby={d} aria-invalid={bad || undefined}>
            {(allowedNext.includes(kind) ? allowedNext : [kind, ...allowedNext]).map((k) => (
              <option key={k} value={k}>
                {EVENT_LABELS[k]}
              </option>
            ))}
          </select>
        )}
      </FormField>
      <FormField
        id="event-date"
        label={kind === "inspection-scheduled" ? "Inspection on" : "Date"}
        hint={kind === "inspection-scheduled" ? "Up to a year ahead." : "The day it happened; not in the future."}
        issue={issueFor("occurredOn")}
      >
        {(d, bad) => <input id="event-date" type="date" {...bind("occurredOn")} className="input w-full" required aria-describedby={d} aria-invalid={bad || undefined} />}
      </FormField>
      {inspection ? (
        <FormField id="event-inspection" label="Inspection" hint="Fire final where the storage calls for it." issue={issueFor("inspectionKind")}>
          {(d, bad) => (
            <select id="event-inspection" {...bind("inspectionKind")} className="input w-full" required aria-describedby={d} aria-invalid={bad || undefined}>
              <option value="">Choose…</option>
              {INSPECTION_KINDS.map((k) => (
                <option key={k} value={k}>
                  {INSPECTION_LABELS[k]}
                </option>
              ))}
            </select>
          )}
        </FormField>
      ) : null}
      {kind === "permit-issued" ? (
        <>
          <FormField id="event-permit" label="Permit number" hint="As printed on the permit card." issue={issueFor("permitNumber")}>
            {(d, bad) => <input id="event-permit" {...bind("permitNumber")} className="input w-full figure" required autoComplete="off" aria-describedby={d} aria-invalid={bad || undefined} />}
          </FormField>
          <FormField id="event-expiry" label="Permit expires on" hint="If the permit states it." issue={issueFor("expiresOn")}>
            {(d, bad) => <input id="event-expiry" type="date" {...bind("expiresOn")} className="input w-full" aria-describedby={d} aria-invalid={bad || undefined} />}
          </FormField>
        </>
      ) : null}
      {kind === "resubmitted" ? (
        <FormField id="event-revision" label="Revision sent" hint="The approved revision that answers the corrections." issue={issueFor("revisionId")}>
          {(d, bad) => (
            <select id="event-revision" {...bind("revisionId")} className="input w-full" required aria-describedby={d} aria-invalid={bad || undefined}>
              {resubmittable.length === 0 ? <option value="">No approved revision waits to be sent</option> : null}
              {resubmittable.map((r) => (
                <option key={r.id} value={r.id}>
                  Rev {r.number}
                </option>
              ))}
            </select>
          )}
        </FormField>
      ) : null}
      {kind === "corrections-requested" ? <CorrectionsFields key={state?.ok ? `${state.data?.eventId}` : "new"} assignable={assignable} defaultAssigneeId={defaultAssigneeId || assignable[0]?.id || ""} issueFor={issueFor} /> : null}
      {kind === "fee-paid" ? (
        <FormField id="event-amount" label="Amount (USD)" hint="As on the receipt." issue={issueFor("amountUsd")}>
          {(d, bad) => (
            <input id="event-amount" type="number" min="0.01" step="0.01" inputMode="decimal" {...bind("amountUsd")} className="input w-full figure" required aria-describedby={d} aria-invalid={bad || undefined} />
          )}
        </FormField>
      ) : null}
      <FormField
        id="event-note"
        label="Note"
        hint={kind === "corrections-requested" ? "Anything beside the comments; the designer receives both by e-mail." : "Who said what, and what comes next."}
        issue={issueFor("note")}
        className="sm:col-span-3"
      >
        {(d, bad) => <textarea id="event-note" rows={3} {...bind("note")} className="input w-full" aria-describedby={d} aria-invalid={bad || undefined} />}
      </FormField>
      <div className="flex flex-wrap items-center gap-3 sm:col-span-3">
        <button type="submit" className="btn" disabled={pending}>
          {pending ? "Recording…" : "Record event"}
        </button>
        {state?.ok ? (
          <p role="status" className="text-sm text-ok">
            {state.message}
          </p>
        ) : null}
        {state && !state.ok ? (
          <p role="alert" className="text-sm text-signal">
            {state.error}
          </p>
        ) : null}
      </div>
    </form>
  );
}
