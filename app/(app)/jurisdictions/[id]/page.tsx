import type { Metadata } from "next";
import Link from "next/link";
import { JurisdictionForm } from "@/components/jurisdictions/jurisdiction-form";
import { NotesLog } from "@/components/jurisdictions/notes-log";
import { SummaryCard } from "@/components/jurisdictions/summary-card";
import { TemplateEditor } from "@/components/jurisdictions/template-editor";
import { PageHeader, Refusal } from "@/components/ui/page-header";
import { pageContext } from "@/lib/auth/page-context";
import { DEFAULT_VOLTAGE_DROP_LIMIT_PCT, REQUIRED_DOCUMENT_LABELS } from "@/lib/schemas/vocabulary";
import { can } from "@/lib/auth/permissions";
import { ServiceError } from "@/lib/services/errors";
import type { JurisdictionEditInput } from "@/lib/schemas/jurisdiction";
import { getJurisdiction } from "@/lib/services/jurisdictions/get";
import { listJurisdictionNotes } from "@/lib/services/jurisdictions/notes";
import { jurisdictionSummary } from "@/lib/services/jurisdictions/summary";
import { listSheetTemplates } from "@/lib/services/jurisdictions/templates";

export const metadata: Metadata = { title: "Jurisdiction" };

function Field({ label, children }: { label: string; children: React.ReactNode }) {
  return (
    <div className="border-b border-grid py-1.5">
      <dt className="field-label">{label}</dt>
      <dd className="text-sm">{children}</dd>
    </div>
  );
}

export default async function JurisdictionPage({ params }: { params: Promise<{ id: string }> }) {
  const { ctx, allowed } = await pageContext("jurisdiction:read");
  if (!allowed) return <Refusal message="Jurisdiction records are kept by the permit office." />;
  const { id } = await params;
  let j;
  try {
    j = getJurisdiction(ctx, id);
  } catch (error) {
    if (error instanceof ServiceError && error.code === "not-found") {
      return (
        <div role="alert" className="sheet border-l-4 border-l-signal px-4 py-4 text-sm">
          <p className="font-semibold">{error.message}</p>
          <Link href="/jurisdictions" className="mt-2 inline-block underline decoration-rule underline-offset-2">
            Back to the jurisdictions
          </Link>
        </div>
      );
    }
    throw error;
  }
  const templates = listSheetTemplates(ctx, id);
  const contact = j.contact ?? {};
  const labelRules = j.labelRules ?? {};
  const canEdit = can(ctx.roles, "jurisdiction:edit");
  const notes = listJurisdictionNotes(ctx, id);
  const summary = can(ctx.roles, "submission:read") ? jurisdictionSummary(ctx, id) : null;
  return (
    <>
      <PageHeader title={j.name} sheet={`Jurisdiction · ${j.region || "region not recorded"}`}>
        <Link href="/jurisdictions" className="btn-quiet">
          All jurisdictions
        </Link>
      </PageHeader>
      {canEdit ? (
        <div className="mb-4 grid items-start gap-4 lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
          <JurisdictionForm
            id={j.id}
            initial={{
              name: j.name,
              region: j.region,
              necEdition: j.necEdition,
              residentialCode: j.residentialCode,
              amendments: j.amendments,
              voltageDropLimitPct: j.voltageDropLimitPct?.toString() ?? "",
              storageAggregateLimitKWh: j.storageAggregateLimitKWh?.toString() ?? "",
              submissionMethod: j.submissionMethod,
              contact: { name: contact.name ?? "", email: contact.email ?? "", phone: contact.phone ?? "", portalUrl: contact.portalUrl ?? "", address: contact.address ?? "" },
              typicalReviewDays: j.typicalReviewDays?.toString() ?? "",
              feeNotes: j.feeNotes,
              requiredDocuments: j.requiredDocuments as JurisdictionEditInput["requiredDocuments"],
              labelRules: { material: labelRules.material ?? "", reflective: Boolean(labelRules.reflective), minLetterHeightIn: labelRules.minLetterHeightIn?.toString() ?? "", colours: labelRules.colours ?? "" },
              version: j.version,
            }}
          />
          <div className="space-y-4">
            {summary ? <SummaryCard summary={summary} /> : null}
            <NotesLog jurisdictionId={j.id} notes={notes} canWrite />
          </div>
        </div>
      ) : null}
      <div className={canEdit ? "" : "grid gap-4 lg:grid-cols-[20rem_1fr]"}>
        {canEdit ? null : (
        <div className="space-y-4">
        <section aria-label="Jurisdiction record" className="sheet px-4 py-3">
          <h2 className="mb-1 text-sm font-semibold">Record</h2>
          <dl>
            <Field label="NEC edition">
              <span className="figure">{j.necEdition}</span>
            </Field>
            <Field label="Residential code">{j.residentialCode === "none" ? "—" : j.residentialCode}</Field>
            <Field label="Voltage-drop limit">
              <span className="figure">{j.voltageDropLimitPct != null ? `${j.voltageDropLimitPct} %` : `${DEFAULT_VOLTAGE_DROP_LIMIT_PCT} % (default)`}</span>
            </Field>
            <Field label="Storage limit per location">
              <span className="figure">{j.storageAggregateLimitKWh != null ? `${j.storageAggregateLimitKWh} kWh` : "per the code table"}</span>
            </Field>
            <Field label="Required documents">
              {j.requiredDocuments.length ? j.requiredDocuments.map((d) => (REQUIRED_DOCUMENT_LABELS as Record<string, string | undefined>)[d] ?? d).join(", ") : "none recorded"}
            </Field>
            <Field label="Label rules">
              {[labelRules.material, labelRules.reflective ? "reflective" : null, labelRules.minLetterHeightIn ? `letters ≥ ${labelRules.minLetterHeightIn} in` : null, labelRules.colours]
                .filter(Boolean)
                .join("; ") || "—"}
            </Field>
            <Field label="Submission">{j.submissionMethod}</Field>
            <Field label="Contact">
              {[contact.name, contact.email, contact.phone, contact.portalUrl, contact.address].filter(Boolean).join(" · ") || "—"}
            </Field>
            <Field label="Typical review">
              <span className="figure">{j.typicalReviewDays != null ? `${j.typicalReviewDays} days` : "—"}</span>
            </Field>
            <Field label="Fees">{j.feeNotes || "—"}</Field>
            <Field label="Local amendments">{j.amendments || "—"}</Field>
            <Field label="Template overrides">
              {templates.filter((t) => t.overridden).map((t) => t.name).join(", ") || "none: the shipped templates apply"}
            </Field>
          </dl>
        </section>
        {summary ? <SummaryCard summary={summary} /> : null}
        <NotesLog jurisdictionId={j.id} notes={notes} canWrite={false} />
        </div>
        )}
        <TemplateEditor
          jurisdictionId={j.id}
          version={j.version}
          canEdit={can(ctx.roles, "jurisdiction:edit")}
          templates={templates}
        />
      </div>
    </>
  );
}
