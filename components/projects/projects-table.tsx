"use client";

import { keepPreviousData, useInfiniteQuery, useQueryClient } from "@tanstack/react-query";
import Link from "next/link";
import { usePathname, useRouter, useSearchParams } from "next/navigation";
import { useState } from "react";
import { StateTag } from "@/components/ui/status-badge";
import { fetchJson } from "@/lib/fetch-json";
import { PROJECT_SORT_LABELS, PROJECT_SORTS } from "@/lib/schemas/project-list";
import { SYSTEM_KIND_LABELS, SYSTEM_KINDS } from "@/lib/schemas/project-record";
import { PROJECT_STATUS_LABELS, PROJECT_STATUSES } from "@/lib/schemas/project-status";
import type { ProjectListRow } from "@/lib/services/projects/list";

/** The list's filters live in the address, so a reload, a bookmark or the back button keeps them. */
const FILTER_KEYS = ["q", "status", "jurisdiction", "kind", "sort", "archived"] as const;

export function ProjectsTable({ jurisdictions, canEdit }: { jurisdictions: { id: string; name: string }[]; canEdit: boolean }) {
  const router = useRouter();
  const pathname = usePathname();
  const searchParams = useSearchParams();
  const queryClient = useQueryClient();
  // The filters are held here and written to the address, so quick changes build on each other, not on a stale address.
  const [filterString, setFilterString] = useState(() => {
    const initial = new URLSearchParams();
    for (const key of FILTER_KEYS) {
      const value = searchParams.get(key);
      if (value) initial.set(key, value);
    }
    return initial.toString();
  });
  const filters = new URLSearchParams(filterString);
  const archived = filters.get("archived") === "1";
  const [search, setSearch] = useState(filters.get("q") ?? "");
  const [restoreError, setRestoreError] = useState<string | null>(null);

  const setFilter = (key: (typeof FILTER_KEYS)[number], value: string) => {
    setFilterString((current) => {
      const next = new URLSearchParams(current);
      if (value) next.set(key, value);
      else next.delete(key);
      router.replace(next.size ? `${pathname}?${next}` : pathname, { scroll: false });
      return next.toString();
    });
  };

  // A firm may hold thousands of projects: pages of 50, filtered and sorted by the server.
  const query = useInfiniteQuery({
    queryKey: ["projects", filterString],
    initialPageParam: null as string | null,
    queryFn: ({ pageParam }) => {
      const params = new URLSearchParams(filterString);
      if (pageParam) params.set("cursor", pageParam);
      return fetchJson<{ projects: ProjectListRow[]; nextCursor: string | null }>(`/api/projects${params.size ? `?${params}` : ""}`);
    },
    getNextPageParam: (last) => last.nextCursor,
    // The rows on screen stay while the next filter's rows load, rather than blinking to "Loading".
    placeholderData: keepPreviousData,
  });

  const restore = async (id: string) => {
    setRestoreError(null);
    try {
      await fetchJson(`/api/projects/${id}/archive`, { method: "DELETE" });
      await queryClient.invalidateQueries({ queryKey: ["projects"] });
    } catch (error) {
      setRestoreError(error instanceof Error ? error.message : "The project was not brought back.");
    }
  };

  const filterBar = (
    <form
      role="search"
      aria-label="Find projects"
      className="sheet mb-3 flex flex-wrap items-end gap-3 px-4 py-3"
      onSubmit={(event) => {
        event.preventDefault();
        setFilter("q", search.trim());
      }}
    >
      <label className="min-w-80 flex-1">
        <span className="field-label mb-1 block">Search</span>
        <span className="flex gap-2">
          <input
            type="search"
            className="input min-w-0 flex-1"
            value={search}
            maxLength={100}
            placeholder="Name, client, address or tag"
            onChange={(e) => {
              setSearch(e.target.value);
              if (e.target.value === "") setFilter("q", "");
            }}
          />
          <button type="submit" className="btn-quiet">
            Search
          </button>
        </span>
      </label>
      <label>
        <span className="field-label mb-1 block">Status</span>
        <select className="input" value={filters.get("status") ?? ""} onChange={(e) => setFilter("status", e.target.value)}>
          <option value="">any</option>
          {PROJECT_STATUSES.map((s) => (
            <option key={s} value={s}>
              {PROJECT_STATUS_LABELS[s]}
            </option>
          ))}
        </select>
      </label>
      <label>
        <span className="field-label mb-1 block">Jurisdiction</span>
        <select className="input" value={filters.get("jurisdiction") ?? ""} onChange={(e) => setFilter("jurisdiction", e.target.value)}>
          <option value="">any</option>
          {jurisdictions.map((j) => (
            <option key={j.id} value={j.id}>
              {j.name}
            </option>
          ))}
        </select>
      </label>
      <label>
        <span className="field-label mb-1 block">System</span>
        <select className="input" value={filters.get("kind") ?? ""} onChange={(e) => setFilter("kind", e.target.value)}>
          <option value="">any</option>
          {SYSTEM_KINDS.map((k) => (
            <option key={k} value={k}>
              {SYSTEM_KIND_LABELS[k]}
            </option>
          ))}
        </select>
      </label>
      <label>
        <span className="field-label mb-1 block">Sort</span>
        <select className="input" value={filters.get("sort") ?? "updated"} onChange={(e) => setFilter("sort", e.target.value === "updated" ? "" : e.target.value)}>
          {PROJECT_SORTS.map((s) => (
            <option key={s} value={s}>
              {PROJECT_SORT_LABELS[s]}
            </option>
          ))}
        </select>
      </label>
      <label className="flex items-center gap-2 pb-2 text-sm">
        <input type="checkbox" className="accent-slate" checked={archived} onChange={(e) => setFilter("archived", e.target.checked ? "1" : "")} />
        Archived projects
      </label>
    </form>
  );

  let body: React.ReactNode;
  if (query.isPending) {
    body = (
      <p role="status" className="sheet px-4 py-6 text-sm text-ink-soft">
        Loading projects…
      </p>
    );
  } else if (query.isError) {
    body = (
      <div role="alert" className="sheet border-l-4 border-l-signal px-4 py-4 text-sm">
        <p className="font-semibold">The projects could not be loaded.</p>
        <p className="mt-1 text-ink-soft">{query.error.message}</p>
        <button type="button" className="btn-quiet mt-3" onClick={() => query.refetch()}>
          Try again
        </button>
      </div>
    );
  } else {
    const rows = query.data.pages.flatMap((p) => p.projects);
    const filtered = Array.from(filters.keys()).some((k) => k !== "sort");
    body =
      rows.length === 0 ? (
        <p className="sheet px-4 py-8 text-center text-sm text-ink-soft">
          {archived ? "No archived projects match." : filtered ? "No projects match. Clear a filter to see more." : "No projects yet. Create the first one to start a design."}
        </p>
      ) : (
        <div className="sheet overflow-x-auto">
          {restoreError ? (
            <p role="alert" className="border-l-4 border-l-signal px-4 py-2 text-sm">
              {restoreError}
            </p>
          ) : null}
          <table className="data-table" aria-label={archived ? "Archived projects" : "Projects"}>
            <thead>
              <tr>
                <th>Project</th>
                <th>Client</th>
                <th>System</th>
                <th>Jurisdiction</th>
                <th>NEC</th>
                <th className="text-right">Circuits</th>
                <th>Status</th>
                <th>{archived ? "Archived" : "Updated"}</th>
                {archived && canEdit ? <th className="sr-only">Actions</th> : null}
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
                    <StateTag>{PROJECT_STATUS_LABELS[p.status as keyof typeof PROJECT_STATUS_LABELS] ?? p.status}</StateTag>
                  </td>
                  <td className="figure whitespace-nowrap text-xs text-ink-soft">{(archived ? (p.archivedAt ?? p.updatedAt) : p.updatedAt).slice(0, 10)}</td>
                  {archived && canEdit ? (
                    <td className="text-right">
                      <button type="button" className="btn-quiet" aria-label={`Bring back ${p.name}`} onClick={() => void restore(p.id)}>
                        Bring back
                      </button>
                    </td>
                  ) : null}
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
  return (
    <>
      {filterBar}
      {body}
    </>
  );
}
