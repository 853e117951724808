"use client";

import { useQuery } from "@tanstack/react-query";
import Link from "next/link";
import { useMemo, useState } from "react";
import { StateTag } from "@/components/ui/status-badge";
import { fetchJson } from "@/lib/fetch-json";
import { SYSTEM_KIND_LABELS } from "@/lib/schemas/project-record";
import type { ProjectListRow } from "@/lib/services/projects/list";

type SortKey = "updated" | "name" | "client" | "jurisdiction";

const SORTS: { value: SortKey; label: string }[] = [
  { value: "updated", label: "Last updated" },
  { value: "name", label: "Name" },
  { value: "client", label: "Client" },
  { value: "jurisdiction", label: "Jurisdiction" },
];

function distinct(values: (string | null)[]): string[] {
  return [...new Set(values.filter((v): v is string => Boolean(v)))].sort((a, b) => a.localeCompare(b));
}

/** The organisation's projects, found again by a word of the name, client or address and narrowed by status, jurisdiction and system kind. */
export function ProjectsTable() {
  const query = useQuery({
    queryKey: ["projects"],
    queryFn: () => fetchJson<{ projects: ProjectListRow[] }>("/api/projects"),
  });
  const [search, setSearch] = useState("");
  const [status, setStatus] = useState("");
  const [jurisdiction, setJurisdiction] = useState("");
  const [kind, setKind] = useState("");
  const [sort, setSort] = useState<SortKey>("updated");
  const all = query.data?.projects;
  const shown = useMemo(() => {
    const words = search.toLowerCase().split(/\s+/).filter(Boolean);
    const list = (all ?? []).filter((p) => {
      const hay = [p.name, p.client, p.address, p.jurisdictionName ?? ""].join(" ").toLowerCase();
      return (
        words.every((w) => hay.includes(w)) &&
        (!status || p.status === status) &&
        (!jurisdiction || p.jurisdictionName === jurisdiction) &&
        (!kind || p.systemKind === kind)
      );
    });
    const by: Record<SortKey, (p: ProjectListRow) => string> = {
      updated: (p) => p.updatedAt,
      name: (p) => p.name.toLowerCase(),
      client: (p) => p.client.toLowerCase(),
      jurisdiction: (p) => (p.jurisdictionName ?? "").toLowerCase(),
    };
    const key = by[sort];
    return [...list].sort((a, b) => (sort === "updated" ? key(b).localeCompare(key(a)) : key(a).localeCompare(key(b))));
  }, [all, search, status, jurisdiction, kind, sort]);
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
  const rows = query.data.projects;
  if (rows.length === 0) {
    return <p className="sheet px-4 py-8 text-center text-sm text-ink-soft">No projects yet. Create the first one to start a design.</p>;
  }
  const filtered = Boolean(search || status || jurisdiction || kind);
  return (
    <div className="sheet overflow-x-auto">
      <div role="search" className="flex flex-wrap items-end gap-3 border-b border-rule px-3 py-2 text-sm">
        <label className="flex min-w-56 flex-1 flex-col">
          <span className="field-label mb-0.5">Search</span>
          <input className="input" type="search" value={search} placeholder="Name, client or address" onChange={(e) => setSearch(e.target.value)} />
        </label>
        <label className="flex flex-col">
          <span className="field-label mb-0.5">Status</span>
          <select className="input" value={status} onChange={(e) => setStatus(e.target.value)}>
            <option value="">Any</option>
            {distinct(rows.map((p) => p.status)).map((v) => (
              <option key={v} value={v}>
                {v}
              </option>
            ))}
          </select>
        </label>
        <label className="flex flex-col">
          <span className="field-label mb-0.5">Jurisdiction</span>
          <select className="input" value={jurisdiction} onChange={(e) => setJurisdiction(e.target.value)}>
            <option value="">Any</option>
            {distinct(rows.map((p) => p.jurisdictionName)).map((v) => (
              <option key={v} value={v}>
                {v}
              </option>
            ))}
          </select>
        </label>
        <label className="flex flex-col">
          <span className="field-label mb-0.5">System</span>
          <select className="input" value={kind} onChange={(e) => setKind(e.target.value)}>
            <option value="">Any</option>
            {distinct(rows.map((p) => p.systemKind)).map((v) => (
              <option key={v} value={v}>
                {SYSTEM_KIND_LABELS[v as keyof typeof SYSTEM_KIND_LABELS] ?? v}
              </option>
            ))}
          </select>
        </label>
        <label className="flex flex-col">
          <span className="field-label mb-0.5">Sort by</span>
          <select className="input" value={sort} onChange={(e) => setSort(e.target.value as SortKey)}>
            {SORTS.map((o) => (
              <option key={o.value} value={o.value}>
                {o.label}
              </option>
            ))}
          </select>
        </label>
        <span aria-live="polite" className="pb-1 text-xs text-ink-soft">
          {filtered ? `${shown.length} of ${rows.length}` : `${rows.length}`} {rows.length === 1 ? "project" : "projects"}
        </span>
      </div>
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
          {shown.length === 0 ? (
            <tr>
              <td colSpan={8} className="py-4 text-sm text-ink-soft">
                No project matches.
              </td>
            </tr>
          ) : null}
          {shown.map((p) => (
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
    </div>
  );
}
