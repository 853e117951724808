import type { Metadata } from "next";
import { EmptyState } from "@/components/ui/page-header";
import { orNotFound, pageContext } from "@/lib/auth/page-context";
import { projectHistory } from "@/lib/services/projects/history";

export const metadata: Metadata = { title: "Project history" };

/** The project's audit log, read-only: who edited, generated, sent, reviewed, submitted and installed, and when. */
export default async function ProjectHistoryPage({ params }: { params: Promise<{ id: string }> }) {
  const { ctx, allowed } = await pageContext("project:read");
  if (!allowed) return null;
  const { id } = await params;
  const entries = orNotFound(() => projectHistory(ctx, id));
  if (entries.length === 0) return <EmptyState>Nothing has been recorded on this project yet.</EmptyState>;
  return (
    <div className="sheet overflow-x-auto">
      <table className="data-table" aria-label="Project history">
        <thead>
          <tr>
            <th className="w-44">When (UTC)</th>
            <th className="w-56">Who</th>
            <th>What</th>
          </tr>
        </thead>
        <tbody>
          {entries.map((e) => (
            <tr key={e.id}>
              <td className="figure whitespace-nowrap text-xs">{e.at.slice(0, 16).replace("T", " ")}</td>
              <td>{e.who ?? "—"}</td>
              <td>{e.summary}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
