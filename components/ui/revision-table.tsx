import Link from "next/link";
import type { RevisionQueueRow } from "@/lib/services/revisions/queues";
import { StateTag } from "./status-badge";

const REVIEW_STATE_LABELS: Record<string, string> = {
  draft: "Draft",
  "in-review": "Awaiting review",
  returned: "Returned with notes",
  approved: "Approved & stamped",
};

export function RevisionTable({ rows, label, hrefFor }: { rows: RevisionQueueRow[]; label: string; hrefFor: (row: RevisionQueueRow) => string }) {
  return (
    <div className="sheet overflow-x-auto">
      <table className="data-table" aria-label={label}>
        <thead>
          <tr>
            <th>Project</th>
            <th>Revision</th>
            <th>Jurisdiction</th>
            <th>State</th>
            <th>Generated</th>
          </tr>
        </thead>
        <tbody>
          {rows.map((r) => (
            <tr key={r.revisionId}>
              <td>
                <Link href={hrefFor(r)} className="font-medium underline decoration-rule underline-offset-2 hover:decoration-ink">
                  {r.projectName}
                </Link>
                <span className="block text-xs text-ink-soft">{r.address}</span>
              </td>
              <td className="figure">
                Rev {r.number}
                {r.isDraft ? <span className="ml-1 text-xs text-signal">(draft)</span> : null}
              </td>
              <td>{r.jurisdictionName ?? "—"}</td>
              <td>
                <StateTag>{REVIEW_STATE_LABELS[r.reviewState] ?? r.reviewState}</StateTag>
              </td>
              <td className="figure text-xs text-ink-soft">{r.createdAt.slice(0, 16).replace("T", " ")}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
