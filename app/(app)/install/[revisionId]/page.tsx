import type { Metadata } from "next";
import { ConfirmToggle } from "@/components/install/confirm-toggle";
import { LabelPreview } from "@/components/install/label-preview";
import { SitePhoto } from "@/components/install/site-photo";
import { PageHeader, Refusal } from "@/components/ui/page-header";
import { orNotFound, pageContext } from "@/lib/auth/page-context";
import { can } from "@/lib/auth/permissions";
import { LABEL_STOCKS } from "@/lib/labels";
import { getApprovedSet } from "@/lib/services/install/approved-set";

export const metadata: Metadata = { title: "Approved set" };

const CLEARANCES = [
  "Working space in front of the battery, inverter and panels (110.26)",
  "Storage spacing and location as on the energy storage sheet",
  "Generator exhaust clear of openings, per the manufacturer",
];

export default async function ApprovedSetPage({ params }: { params: Promise<{ revisionId: string }> }) {
  const { ctx, allowed } = await pageContext("install:read");
  if (!allowed) return <Refusal message="Approved sets are for installers and the permit office." />;
  const { revisionId } = await params;
  const set = orNotFound(() => getApprovedSet(ctx, revisionId));
  const mayConfirm = can(ctx.roles, "install:confirm");
  const done = (kind: string, id: string) => set.confirmations.some((c) => c.itemKind === kind && c.itemId === id);
  const photoOf = (kind: string, id: string) => set.confirmations.find((c) => c.itemKind === kind && c.itemId === id)?.photoAttachmentId ?? null;
  const labelsDone = set.labels.filter((l) => done("label", l.id)).length;
  const equipmentDone = set.record.equipment.filter((e) => done("equipment", e.tag)).length;
  const clearancesDone = CLEARANCES.filter((c) => done("clearance", c)).length;
  const total = set.labels.length + set.record.equipment.length + CLEARANCES.length;
  const complete = labelsDone + equipmentDone + clearancesDone;
  return (
    <>
      <PageHeader title={set.projectName} sheet={`Approved set · Rev ${set.revisionNumber}`}>
        {set.hasPdf ? (
          <a className="btn-quiet" href={`/api/revisions/${set.revisionId}/pdf`}>
            Approved packet (PDF)
          </a>
        ) : null}
      </PageHeader>
      <section className="sheet mb-6 grid gap-3 p-4 text-sm sm:grid-cols-4">
        <div>
          <p className="field-label">Site</p>
          <p>{set.address}</p>
        </div>
        <div>
          <p className="field-label">Stamped by</p>
          <p>{set.approvedBy ?? "—"}</p>
          <p className="figure text-xs text-ink-soft">{set.licenceNumber ? `Licence ${set.licenceNumber}` : ""}</p>
        </div>
        <div>
          <p className="field-label">Approved</p>
          <p className="figure">{set.approvedAt?.slice(0, 10) ?? "—"}</p>
        </div>
        <div>
          <p className="field-label">Pre-inspection checklist</p>
          <p className="figure" aria-live="polite">
            {complete} of {total} done
          </p>
        </div>
      </section>
      <p className="mb-6 max-w-prose text-sm text-ink-soft">
        Build from this stamped set only. If an item on site differs from it, stop and ask the designer for a new revision: a
        substitution the reviewer has not seen is the commonest reason an inspection fails.
      </p>

      <section aria-labelledby="labels-heading" className="mb-8">
        <div className="mb-2 flex flex-wrap items-center justify-between gap-2">
          <h2 id="labels-heading" className="field-label">
            Labels ({labelsDone} of {set.labels.length} placed)
          </h2>
          <div className="flex flex-wrap gap-2 text-sm">
            {Object.entries(LABEL_STOCKS).map(([name, stock]) => (
              <a key={name} className="btn-quiet" href={`/api/install/${set.revisionId}/labels?stock=${name}`}>
                Print: {stock.description}
              </a>
            ))}
          </div>
        </div>
        <ul className="grid gap-4 lg:grid-cols-2">
          {set.labels.map((label) => (
            <li key={label.id} className="sheet flex flex-col gap-3 p-4 sm:flex-row">
              <LabelPreview label={label} />
              <div className="flex min-w-0 flex-1 flex-col gap-2 text-sm">
                <p>
                  <span className="field-label block">Where it goes</span>
                  {label.location}
                </p>
                <p className="figure text-xs text-ink-soft">{label.codeRef}</p>
                <div className="mt-auto flex flex-wrap items-center gap-2">
                  <a className="btn-quiet" href={`/api/install/${set.revisionId}/labels?stock=single-4x2&only=${encodeURIComponent(label.id)}`}>
                    Print this one
                  </a>
                  <ConfirmToggle revisionId={set.revisionId} itemKind="label" itemId={label.id} confirmed={done("label", label.id)} label={label.title} disabled={!mayConfirm} />
                </div>
                <SitePhoto projectId={set.projectId} revisionId={set.revisionId} itemKind="label" itemId={label.id} photoAttachmentId={photoOf("label", label.id)} label={`label ${label.title}`} disabled={!mayConfirm} />
              </div>
            </li>
          ))}
        </ul>
      </section>

      <section aria-labelledby="equipment-heading" className="mb-8">
        <h2 id="equipment-heading" className="field-label mb-2">
          Equipment matches the approved set ({equipmentDone} of {set.record.equipment.length})
        </h2>
        <div className="sheet overflow-x-auto">
          <table className="data-table" aria-label="Equipment to confirm">
            <thead>
              <tr>
                <th>Tag</th>
                <th>Kind</th>
                <th>Make and model on the nameplate</th>
                <th className="text-right">Qty</th>
                <th>Nameplate photo</th>
                <th />
              </tr>
            </thead>
            <tbody>
              {set.record.equipment.map((e) => (
                <tr key={e.tag}>
                  <td className="figure font-semibold">{e.tag}</td>
                  <td>{e.kind}</td>
                  <td>
                    {e.manufacturer} {e.model}
                  </td>
                  <td className="figure text-right">{e.quantity}</td>
                  <td>
                    <SitePhoto projectId={set.projectId} revisionId={set.revisionId} itemKind="equipment" itemId={e.tag} photoAttachmentId={photoOf("equipment", e.tag)} label={`nameplate of ${e.tag}`} disabled={!mayConfirm} />
                  </td>
                  <td>
                    <ConfirmToggle revisionId={set.revisionId} itemKind="equipment" itemId={e.tag} confirmed={done("equipment", e.tag)} label={e.tag} disabled={!mayConfirm} />
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      </section>

      <section aria-labelledby="clearance-heading">
        <h2 id="clearance-heading" className="field-label mb-2">
          Clearances ({clearancesDone} of {CLEARANCES.length})
        </h2>
        <ul className="sheet divide-y divide-grid">
          {CLEARANCES.map((c) => (
            <li key={c} className="flex items-center justify-between gap-3 px-4 py-2 text-sm">
              <span>{c}</span>
              <ConfirmToggle revisionId={set.revisionId} itemKind="clearance" itemId={c} confirmed={done("clearance", c)} label={c} disabled={!mayConfirm} />
            </li>
          ))}
        </ul>
      </section>
    </>
  );
}
