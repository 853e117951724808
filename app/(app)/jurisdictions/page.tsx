import type { Metadata } from "next";
import Link from "next/link";
import { EmptyState, PageHeader, Refusal } from "@/components/ui/page-header";
import { pageContext } from "@/lib/auth/page-context";
import { DEFAULT_VOLTAGE_DROP_LIMIT_PCT } from "@/lib/schemas/vocabulary";
import { listJurisdictions } from "@/lib/services/jurisdictions/list";

export const metadata: Metadata = { title: "Jurisdictions" };

export default async function JurisdictionsPage() {
  const { ctx, allowed } = await pageContext("jurisdiction:read");
  if (!allowed) return <Refusal message="Jurisdiction records are kept by the permit office." />;
  const rows = listJurisdictions(ctx);
  return (
    <>
      <PageHeader title="Jurisdictions" sheet="Authorities having jurisdiction and their rules" />
      {rows.length === 0 ? (
        <EmptyState>No jurisdictions recorded yet.</EmptyState>
      ) : (
        <div className="sheet overflow-x-auto">
          <table className="data-table" aria-label="Jurisdictions">
            <thead>
              <tr>
                <th>Jurisdiction</th>
                <th>Region</th>
                <th>NEC</th>
                <th>Residential code</th>
                <th>Voltage-drop limit</th>
                <th>Submission</th>
                <th className="text-right">Typical review</th>
                <th>Local notes</th>
              </tr>
            </thead>
            <tbody>
              {rows.map((j) => (
                <tr key={j.id}>
                  <td className="font-medium">
                    <Link href={`/jurisdictions/${j.id}`} className="underline decoration-rule underline-offset-2 hover:decoration-ink">
                      {j.name}
                    </Link>
                  </td>
                  <td>{j.region}</td>
                  <td className="figure">{j.necEdition}</td>
                  <td className="figure">{j.residentialCode === "none" ? "—" : j.residentialCode}</td>
                  <td className="figure">{j.voltageDropLimitPct != null ? `${j.voltageDropLimitPct} %` : `${DEFAULT_VOLTAGE_DROP_LIMIT_PCT} % (default)`}</td>
                  <td>{j.submissionMethod}</td>
                  <td className="figure text-right">{j.typicalReviewDays != null ? `${j.typicalReviewDays} d` : "—"}</td>
                  <td className="max-w-sm text-xs text-ink-soft">{j.amendments}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </>
  );
}
