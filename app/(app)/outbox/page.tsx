import type { Metadata } from "next";
import { EmptyState, PageHeader, Refusal } from "@/components/ui/page-header";
import { StateTag } from "@/components/ui/status-badge";
import { pageContext } from "@/lib/auth/page-context";
import { listOutbox } from "@/lib/services/outbox/list";

export const metadata: Metadata = { title: "Outbox" };

export default async function OutboxPage() {
  const { ctx, allowed } = await pageContext("outbox:read");
  if (!allowed) return <Refusal message="The outbox is open to the permit office and administrators." />;
  const rows = listOutbox(ctx);
  return (
    <>
      <PageHeader title="Outbox" sheet="Every e-mail Sundocket has sent for this organisation" />
      {rows.length === 0 ? (
        <EmptyState>No e-mail has been sent yet.</EmptyState>
      ) : (
        <div className="sheet overflow-x-auto">
          <table className="data-table" aria-label="Outbox">
            <thead>
              <tr>
                <th>Queued</th>
                <th>To</th>
                <th>Subject</th>
                <th>Kind</th>
                <th>State</th>
              </tr>
            </thead>
            <tbody>
              {rows.map((m) => (
                <tr key={m.id}>
                  <td className="figure text-xs">{m.createdAt.slice(0, 16).replace("T", " ")}</td>
                  <td>{m.toAddress}</td>
                  <td>
                    <details>
                      <summary className="cursor-pointer">{m.subject}</summary>
                      <pre className="mt-2 whitespace-pre-wrap text-xs text-ink-soft">{m.bodyText}</pre>
                    </details>
                  </td>
                  <td>{m.template}</td>
                  <td>
                    <StateTag>{m.status}</StateTag>
                    {m.error ? <span className="block text-xs text-signal">{m.error}</span> : null}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </>
  );
}
