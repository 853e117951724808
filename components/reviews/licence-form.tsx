"use client";

import { useRouter } from "next/navigation";
import { useActionState, useEffect, useRef, useState } from "react";
import { saveLicenceAction } from "@/app/(app)/reviews/actions";
import type { LicenceView } from "@/lib/services/reviews/licence";

interface LicenceFields {
  licenceNumber: string;
  region: string;
  discipline: string;
  expiresOn: string;
  version: number | null;
}

const FIELDS: { name: keyof Omit<LicenceFields, "version">; label: string; hint: string; type?: string; autoComplete?: string }[] = [
  { name: "licenceNumber", label: "Licence number", hint: "As printed on your licence, e.g. PE-E-048213.", autoComplete: "off" },
  { name: "region", label: "Issued by (state or province)", hint: "The board that issued the licence." },
  { name: "discipline", label: "Discipline", hint: "E.g. Electrical." },
  { name: "expiresOn", label: "Expires on", hint: "A licence that has expired cannot stamp a packet.", type: "date" },
];

/** The reviewer's own licence record; every refusal is shown beside the field it concerns. */
export function LicenceForm({ licence, today }: { licence: Pick<LicenceView, "licenceNumber" | "region" | "discipline" | "expiresOn" | "version"> | null; today: string }) {
  const router = useRouter();
  const [state, action, pending] = useActionState(saveLicenceAction, null);
  const [values, setValues] = useState<LicenceFields>({
    licenceNumber: licence?.licenceNumber ?? "",
    region: licence?.region ?? "",
    discipline: licence?.discipline ?? "Electrical",
    expiresOn: licence?.expiresOn ?? "",
    version: licence?.version ?? null,
  });
  const [clientIssue, setClientIssue] = useState<string | null>(null);
  const formRef = useRef<HTMLFormElement>(null);
  const version = state?.ok && state.data ? state.data.version : values.version;

  useEffect(() => {
    if (state?.ok) router.refresh();
  }, [state, router]);

  const issueFor = (name: string) => (state && !state.ok ? state.issues.find((i) => i.path === name)?.message : undefined) ?? (name === "expiresOn" ? clientIssue ?? undefined : undefined);

  return (
    <form
      ref={formRef}
      action={action}
      aria-label="Licence record"
      className="sheet grid gap-5 px-5 py-5 sm:grid-cols-2"
      onSubmit={(e) => {
        // The same rule the service applies, said before the round trip.
        if (values.expiresOn && values.expiresOn < today) {
          e.preventDefault();
          setClientIssue(`is in the past (today is ${today}); enter the expiry of your current licence`);
        } else setClientIssue(null);
      }}
    >
      <input type="hidden" name="version" value={version ?? ""} />
      {FIELDS.map((f) => {
        const issue = issueFor(f.name);
        const id = `licence-${f.name}`;
        return (
          <div key={f.name}>
            <label htmlFor={id} className="field-label block">
              {f.label}
            </label>
            <input
              id={id}
              name={f.name}
              type={f.type ?? "text"}
              className="input mt-1 w-full"
              value={values[f.name]}
              onChange={(e) => setValues((v) => ({ ...v, [f.name]: e.target.value }))}
              required
              min={f.type === "date" ? today : undefined}
              autoComplete={f.autoComplete}
              aria-invalid={issue ? true : undefined}
              aria-describedby={`${id}-hint`}
            />
            <p id={`${id}-hint`} className={`mt-1 text-xs ${issue ? "text-signal" : "text-ink-soft"}`}>
              {issue ? `${f.label} ${issue}.` : f.hint}
            </p>
          </div>
        );
      })}
      <div className="flex flex-wrap items-center gap-3 sm:col-span-2">
        <button type="submit" className="btn" disabled={pending}>
          {pending ? "Saving…" : licence ? "Save licence record" : "Record licence"}
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
