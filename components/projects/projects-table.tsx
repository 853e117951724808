"use client";

import { useInfiniteQuery } from "@tanstack/react-query";
import Link from "next/link";
import { StateTag } from "@/components/ui/status-badge";
import { fetchJson } from "@/lib/fetch-json";
import { SYSTEM_KIND_LABELS } from "@/lib/schemas/project-record";
import type { ProjectListRow } from "@/lib/services/projects/list";

export function ProjectsTable() {
  // A firm may hold thousands of projects: pages of 50, most recently updated first.
  const query = useInfiniteQuery({
    queryKey: ["projects"],
    initialPageParam: null as string | null,
    queryFn: ({ pageParam }) =>
      fetchJson<{ projects: ProjectListRow[]; nextCursor: string | null }>(
        pageParam ? `/api/projects?cursor=${encodeURIComponent(pageParam)}` : "/api/projects",
      ),
    getNextPageParam: (last) => last.nextCursor,
  });
  if (query.isPending) {
    return (
      <p role="status" className="sheet px-4 py-6 text-sm text-ink-soft">
        Loading projects…
      </p>
    );
  }
  if (query.isError) {
    return (
      <div role="alert" className="sheet border-l-4 border-l-signal px-4 py-4 text-sm">
        <p className="font-semibold">The projects could not be loaded.</p>
        <p className="mt-1 text-ink-soft">{query.error.message}</p>
        <button type="button" className="btn-quiet mt-3" onClick={() => query.refetch()}>
          Try again
        </button>
      </div>
    );
  }
  const rows = query.data.pages.flatMap((p) => p.projects);
  if (rows.length === 0) {
    return <p className="sheet px-4 py-8 text-center text-sm text-ink-soft">No projects yet. Create the first one to start a design.</p>;
  }
  return (
    <div className="sheet overflow-x-auto">
      <table className="data-table" aria-label="Projects">
        <thead>
          <tr>
            <th>Project</th>
            <th>Client</th>
            <th>System</th>
            <th>Jurisdiction</th>
            <th>NEC</th>
            <th className="text-right">Circuits</th>
            <th>Status</th>
            <th>Updated</th>
          </tr>
        </thead>
        <tbody>
          {rows.map((p) => (
            <tr key={p.id}>
              <td>
                <Link href={`/projects/${p.id}`} className="font-medium text-ink underline decoration-rule underline-offset-2 hover:decoration-ink">
                  {p.name}
                </Link>
                <span className="block text-xs text-ink-soft">{p.address}</span>
              </td>
              <td>{p.client}</td>
              <td>{SYSTEM_KIND_LABELS[p.systemKind as keyof typeof SYSTEM_KIND_LABELS] ?? p.systemKind}</td>
              <td>{p.jurisdictionName ?? "—"}</td>
              <td className="figure">{p.necEdition ?? "—"}</td>
              <td className="figure text-right">{p.circuitCount}</td>
              <td>
                <StateTag>{p.status}</StateTag>
              </td>
              <td className="figure whitespace-nowrap text-xs text-ink-soft">{p.updatedAt.slice(0, 10)}</td>
            </tr>
          ))}
        </tbody>
      </table>
      {query.hasNextPage ? (
        <div className="border-t border-rule px-4 py-3">
          <button type="button" className="btn-quiet" onClick={() => query.fetchNextPage()} disabled={query.isFetchingNextPage}>
            {query.isFetchingNextPage ? "Loading…" : "Show more projects"}
          </button>
        </div>
      ) : null}
    </div>
  );
}
