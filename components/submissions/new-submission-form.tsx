"use client";

import { useRouter } from "next/navigation";
import { startTransition, useActionState, useEffect, useState } from "react";
import { createSubmissionAction } from "@/app/(app)/submissions/actions";
import { SUBMISSION_METHODS, type SubmissionMethod } from "@/lib/schemas/submission";
import { FormField } from "./field";

const METHOD_LABELS: Record<SubmissionMethod, string> = { portal: "Portal", email: "E-mail", counter: "Counter" };

/** Submits one approved revision; the jurisdiction's own method is the default. */
export function NewSubmissionForm({
  revisionId,
  label,
  defaultMethod,
  today,
}: {
  revisionId: string;
  label: string;
  defaultMethod: SubmissionMethod;
  today: string;
}) {
  const router = useRouter();
  const [state, action, pending] = useActionState(createSubmissionAction, null);
  // Controlled, so a refusal leaves what was typed in place (React resets an uncontrolled form after its action).
  const [values, setValues] = useState({ method: defaultMethod as string, referenceNumber: "", occurredOn: today, note: "" });
  const bind = (name: keyof typeof values) => ({
    name,
    value: values[name],
    onChange: (e: React.ChangeEvent<HTMLInputElement | HTMLSelectElement>) => setValues((v) => ({ ...v, [name]: e.target.value })),
  });
  useEffect(() => {
    if (state?.ok && state.data) router.push(`/submissions/${state.data.submissionId}`);
  }, [state, router]);
  const issueFor = (name: string) => (state && !state.ok ? state.issues.find((i) => i.path === name)?.message : undefined);
  const id = (name: string) => `submit-${revisionId}-${name}`;

  return (
    <form
      // Submitted by hand rather than through the action prop: React resets a form after its action, which would clear a controlled select on a refusal.
      onSubmit={(e) => {
        e.preventDefault();
        const data = new FormData(e.currentTarget);
        startTransition(() => action(data));
      }}
      aria-label={`Submit ${label}`}
      className="grid gap-4 sm:grid-cols-4"
    >
      <input type="hidden" name="revisionId" value={revisionId} />
      <FormField id={id("method")} label="Method" hint="The jurisdiction's usual method is chosen." issue={issueFor("method")}>
        {(d, bad) => (
          <select id={id("method")} {...bind("method")} className="input w-full" aria-describedby={d} aria-invalid={bad || undefined}>
            {SUBMISSION_METHODS.map((m) => (
              <option key={m} value={m}>
                {METHOD_LABELS[m]}
              </option>
            ))}
          </select>
        )}
      </FormField>
      <FormField id={id("reference")} label="Reference number" hint="The AHJ's number, if given yet." issue={issueFor("referenceNumber")}>
        {(d, bad) => <input id={id("reference")} {...bind("referenceNumber")} className="input w-full figure" autoComplete="off" aria-describedby={d} aria-invalid={bad || undefined} />}
      </FormField>
      <FormField id={id("date")} label="Submitted on" issue={issueFor("occurredOn")}>
        {(d, bad) => <input id={id("date")} {...bind("occurredOn")} type="date" className="input w-full" max={today} required aria-describedby={d} aria-invalid={bad || undefined} />}
      </FormField>
      <FormField id={id("note")} label="Note" hint="What was sent, and how." issue={issueFor("note")}>
        {(d, bad) => <input id={id("note")} {...bind("note")} className="input w-full" aria-describedby={d} aria-invalid={bad || undefined} />}
      </FormField>
      <div className="flex flex-wrap items-center gap-3 sm:col-span-4">
        <button type="submit" className="btn" disabled={pending}>
          {pending ? "Recording…" : "Record submission"}
        </button>
        {state?.ok ? (
          <p role="status" className="text-sm text-ok">
            {state.message}
          </p>
        ) : null}
        {state && !state.ok ? (
          <p role="alert" className="text-sm text-signal">
            {state.error}
            {issueFor("revisionId") ? ` (revision ${issueFor("revisionId")})` : ""}
          </p>
        ) : null}
      </div>
    </form>
  );
}
