"use client";

import { useRouter } from "next/navigation";
import { useState, useTransition } from "react";
import { previewJurisdictionAction, saveJurisdictionAction } from "@/app/(app)/jurisdictions/[id]/actions";
import { FormField } from "@/components/submissions/field";
import { NEC_EDITIONS, RESIDENTIAL_CODES } from "@/lib/schemas/project-record";
import { REQUIRED_DOCUMENT_IDS, type JurisdictionEditInput } from "@/lib/schemas/jurisdiction";
import { SUBMISSION_METHODS } from "@/lib/schemas/submission";
import type { KnockOnProject } from "@/lib/services/jurisdictions/knock-on";

const DOCUMENT_LABELS: Record<(typeof REQUIRED_DOCUMENT_IDS)[number], string> = {
  "equipment-datasheets": "Equipment datasheets",
  "storage-listing": "Storage listing",
  "site-plan": "Site plan",
  "structural-letter": "Structural letter",
};
const METHOD_LABELS = { portal: "Portal", email: "E-mail", counter: "Counter" } as const;
const STATUS_WORDS: Record<string, string> = { pass: "pass", fail: "fail", warning: "warning", "needs-input": "needs input", attest: "attest", "not-applicable": "not applicable", absent: "not run" };

type Values = Omit<JurisdictionEditInput, "voltageDropLimitPct" | "storageAggregateLimitKWh" | "typicalReviewDays" | "labelRules"> & {
  voltageDropLimitPct: string;
  storageAggregateLimitKWh: string;
  typicalReviewDays: string;
  labelRules: { material: string; reflective: boolean; minLetterHeightIn: string; colours: string };
};

export function KnockOnList({ projects }: { projects: KnockOnProject[] }) {
  if (projects.length === 0) return <p className="text-sm">No open project&apos;s check results change.</p>;
  return (
    <ul className="space-y-2" aria-label="Projects whose checks change">
      {projects.map((p) => (
        <li key={p.projectId} className="text-sm">
          <a href={`/projects/${p.projectId}`} className="font-medium underline decoration-rule underline-offset-2 hover:decoration-ink">
            {p.name}
          </a>
          {p.unreadable ? <span className="text-signal"> — its record could not be read: {p.unreadable}</span> : null}
          <ul className="ml-4 list-disc text-xs">
            {p.changes.map((c, i) => (
              <li key={i}>
                {c.title}
                {c.subject ? ` (${c.subject})` : ""}: {STATUS_WORDS[c.from] ?? c.from} → <span className={c.to === "fail" ? "font-semibold text-signal" : ""}>{STATUS_WORDS[c.to] ?? c.to}</span>
              </li>
            ))}
          </ul>
        </li>
      ))}
    </ul>
  );
}

/**
 * The office's edit of a jurisdiction record. "Show the effect" re-runs the
 * checks of the jurisdiction's open projects with the rules as typed, before
 * anything is saved; saving reports the same list.
 */
export function JurisdictionForm({ id, initial }: { id: string; initial: Values }) {
  const router = useRouter();
  const [values, setValues] = useState<Values>(initial);
  const [pending, startTransition] = useTransition();
  const [outcome, setOutcome] = useState<{ ok: boolean; text: string; issues: { path: string; message: string }[]; knockOn?: KnockOnProject[] } | null>(null);
  const set = <K extends keyof Values>(key: K, value: Values[K]) => setValues((v) => ({ ...v, [key]: value }));
  const issueFor = (path: string) => (outcome && !outcome.ok ? outcome.issues.find((i) => i.path === path)?.message : undefined);
  const input = () => ({
    ...values,
    labelRules: { ...values.labelRules },
  });

  const run = (preview: boolean) =>
    startTransition(async () => {
      if (preview) {
        const result = await previewJurisdictionAction(id, input());
        setOutcome(result.ok ? { ok: true, text: "If saved as typed:", issues: [], knockOn: result.data } : { ok: false, text: result.error, issues: result.issues });
        return;
      }
      const result = await saveJurisdictionAction(id, input());
      if (result.ok && result.data) {
        setValues((v) => ({ ...v, version: result.data!.version }));
        setOutcome({ ok: true, text: result.data.message, issues: [], knockOn: result.data.knockOn });
        router.refresh();
      } else if (!result.ok) setOutcome({ ok: false, text: result.error, issues: result.issues });
    });

  const textField = (key: "name" | "region" | "feeNotes", label: string, hint?: string) => (
    <FormField id={`j-${key}`} label={label} hint={hint} issue={issueFor(key)}>
      {(d, bad) => <input id={`j-${key}`} className="input w-full" value={values[key] ?? ""} onChange={(e) => set(key, e.target.value)} aria-describedby={d} aria-invalid={bad || undefined} />}
    </FormField>
  );
  const numberField = (key: "voltageDropLimitPct" | "storageAggregateLimitKWh" | "typicalReviewDays", label: string, hint: string) => (
    <FormField id={`j-${key}`} label={label} hint={hint} issue={issueFor(key)}>
      {(d, bad) => <input id={`j-${key}`} inputMode="decimal" className="input figure w-full" value={values[key]} onChange={(e) => set(key, e.target.value)} aria-describedby={d} aria-invalid={bad || undefined} />}
    </FormField>
  );
  const contactField = (key: keyof Values["contact"], label: string) => (
    <FormField id={`j-contact-${key}`} label={label} issue={issueFor(`contact.${key}`)}>
      {(d, bad) => (
        <input
          id={`j-contact-${key}`}
          className="input w-full"
          value={values.contact[key] ?? ""}
          onChange={(e) => set("contact", { ...values.contact, [key]: e.target.value })}
          aria-describedby={d}
          aria-invalid={bad || undefined}
        />
      )}
    </FormField>
  );

  return (
    <form
      aria-label="Jurisdiction record"
      className="sheet space-y-4 px-5 py-4"
      onSubmit={(e) => {
        e.preventDefault();
        run(false);
      }}
    >
      <div className="grid gap-3 sm:grid-cols-2">
        {textField("name", "Name")}
        {textField("region", "Region", "Where a reviewer's licence must be issued.")}
        <FormField id="j-edition" label="NEC edition" hint="Changing it re-runs the checks of open projects here." issue={issueFor("necEdition")}>
          {(d) => (
            <select id="j-edition" className="input w-full" value={values.necEdition} onChange={(e) => set("necEdition", e.target.value as Values["necEdition"])} aria-describedby={d}>
              {NEC_EDITIONS.map((e) => (
                <option key={e} value={e}>
                  NEC {e}
                </option>
              ))}
            </select>
          )}
        </FormField>
        <FormField id="j-residential" label="Residential code" issue={issueFor("residentialCode")}>
          {(d) => (
            <select id="j-residential" className="input w-full" value={values.residentialCode} onChange={(e) => set("residentialCode", e.target.value as Values["residentialCode"])} aria-describedby={d}>
              {RESIDENTIAL_CODES.map((c) => (
                <option key={c} value={c}>
                  {c === "none" ? "None adopted" : c}
                </option>
              ))}
            </select>
          )}
        </FormField>
        {numberField("voltageDropLimitPct", "Voltage-drop limit (%)", "Empty: 3 %, common practice.")}
        {numberField("storageAggregateLimitKWh", "Storage limit per location (kWh)", "Empty: the code table applies.")}
        {numberField("typicalReviewDays", "Typical review (days)", "Calendar days; the queue flags longer waits.")}
        <FormField id="j-method" label="Submission method" issue={issueFor("submissionMethod")}>
          {(d) => (
            <select id="j-method" className="input w-full" value={values.submissionMethod} onChange={(e) => set("submissionMethod", e.target.value as Values["submissionMethod"])} aria-describedby={d}>
              {SUBMISSION_METHODS.map((m) => (
                <option key={m} value={m}>
                  {METHOD_LABELS[m]}
                </option>
              ))}
            </select>
          )}
        </FormField>
      </div>
      <fieldset>
        <legend className="field-label mb-1">Required documents</legend>
        <div className="flex flex-wrap gap-4 text-sm">
          {REQUIRED_DOCUMENT_IDS.map((doc) => (
            <label key={doc} className="flex items-center gap-1.5">
              <input
                type="checkbox"
                checked={values.requiredDocuments.includes(doc)}
                onChange={(e) => set("requiredDocuments", e.target.checked ? [...values.requiredDocuments, doc] : values.requiredDocuments.filter((d) => d !== doc))}
              />
              {DOCUMENT_LABELS[doc]}
            </label>
          ))}
        </div>
      </fieldset>
      <fieldset className="grid gap-3 sm:grid-cols-2">
        <legend className="field-label mb-1">Contact</legend>
        {contactField("name", "Contact name")}
        {contactField("email", "Contact e-mail")}
        {contactField("phone", "Contact phone")}
        {contactField("portalUrl", "Portal address")}
        {contactField("address", "Counter address")}
      </fieldset>
      <fieldset className="grid gap-3 sm:grid-cols-2">
        <legend className="field-label mb-1">Label rules</legend>
        <FormField id="j-label-material" label="Label material" issue={issueFor("labelRules.material")}>
          {(d) => <input id="j-label-material" className="input w-full" value={values.labelRules.material} onChange={(e) => set("labelRules", { ...values.labelRules, material: e.target.value })} aria-describedby={d} />}
        </FormField>
        <FormField id="j-label-height" label="Minimum letter height (in)" issue={issueFor("labelRules.minLetterHeightIn")}>
          {(d, bad) => (
            <input
              id="j-label-height"
              inputMode="decimal"
              className="input figure w-full"
              value={values.labelRules.minLetterHeightIn}
              onChange={(e) => set("labelRules", { ...values.labelRules, minLetterHeightIn: e.target.value })}
              aria-describedby={d}
              aria-invalid={bad || undefined}
            />
          )}
        </FormField>
        <FormField id="j-label-colours" label="Colours" issue={issueFor("labelRules.colours")}>
          {(d) => <input id="j-label-colours" className="input w-full" value={values.labelRules.colours} onChange={(e) => set("labelRules", { ...values.labelRules, colours: e.target.value })} aria-describedby={d} />}
        </FormField>
        <label className="flex items-center gap-1.5 self-end pb-5 text-sm">
          <input type="checkbox" checked={values.labelRules.reflective} onChange={(e) => set("labelRules", { ...values.labelRules, reflective: e.target.checked })} />
          Reflective
        </label>
      </fieldset>
      {textField("feeNotes", "Fee notes")}
      <FormField id="j-amendments" label="Local amendments" issue={issueFor("amendments")}>
        {(d) => <textarea id="j-amendments" rows={3} className="input w-full" value={values.amendments} onChange={(e) => set("amendments", e.target.value)} aria-describedby={d} />}
      </FormField>
      <div className="flex flex-wrap items-center gap-3">
        <button type="button" className="btn-quiet" disabled={pending} onClick={() => run(true)}>
          Show the effect on open projects
        </button>
        <button type="submit" className="btn" disabled={pending}>
          {pending ? "Saving…" : "Save jurisdiction"}
        </button>
      </div>
      {outcome ? (
        <div role={outcome.ok ? "status" : "alert"} className={`border-l-4 px-3 py-2 text-sm ${outcome.ok ? "border-l-ok" : "border-l-signal"}`}>
          <p className="font-semibold">{outcome.text}</p>
          {!outcome.ok && outcome.issues.length ? (
            <ul className="mt-1 list-disc pl-5 text-ink-soft">
              {outcome.issues.map((i) => (
                <li key={i.path}>
                  {i.path}: {i.message}
                </li>
              ))}
            </ul>
          ) : null}
          {outcome.ok && outcome.knockOn ? (
            <div className="mt-2">
              <KnockOnList projects={outcome.knockOn} />
            </div>
          ) : null}
        </div>
      ) : null}
    </form>
  );
}
