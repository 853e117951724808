"use client";

import {
  flexRender,
  getCoreRowModel,
  getFilteredRowModel,
  getSortedRowModel,
  useReactTable,
  type ColumnDef,
  type ColumnFiltersState,
  type SortingState,
} from "@tanstack/react-table";
import Link from "next/link";
import { useMemo, useState } from "react";
import { csvLine } from "@/lib/schemas/queue";
import { EVENT_LABELS } from "@/lib/schemas/submission";
import type { SubmissionQueueEntry } from "@/lib/services/submissions";

const waitingText = (r: SubmissionQueueEntry) =>
  r.daysWaiting === null ? "—" : `${r.daysWaiting} d${r.jurisdictionTypicalReviewDays !== null ? ` of ${r.jurisdictionTypicalReviewDays}` : ""}${r.overdue ? " · overdue" : ""}`;

const columns: ColumnDef<SubmissionQueueEntry>[] = [
  {
    id: "project",
    header: "Project",
    accessorKey: "projectName",
    cell: ({ row }) => (
      <Link href={`/submissions/${row.original.submissionId}`} className="font-medium underline decoration-rule underline-offset-2 hover:decoration-ink">
        {row.original.projectName}
      </Link>
    ),
  },
  { id: "jurisdiction", header: "Jurisdiction", accessorKey: "jurisdictionName", filterFn: "equalsString" },
  { id: "revision", header: "Revision", accessorKey: "revisionNumber", cell: ({ getValue }) => <span className="figure">Rev {getValue<number>()}</span> },
  { id: "reference", header: "Reference", accessorKey: "referenceNumber", cell: ({ getValue }) => <span className="figure">{getValue<string>() || "—"}</span> },
  { id: "status", header: "Status", accessorKey: "status", filterFn: "equalsString", cell: ({ getValue }) => EVENT_LABELS[getValue<SubmissionQueueEntry["status"]>()] },
  {
    id: "sinceLast",
    header: "Days since last event",
    accessorKey: "daysSinceLastEvent",
    sortUndefined: "last",
    cell: ({ getValue }) => <span className="figure">{getValue<number | null>() ?? "—"}</span>,
  },
  {
    id: "waiting",
    header: "Waiting on the AHJ",
    accessorFn: (r) => r.daysWaiting ?? -1,
    filterFn: (row, _id, value) => !value || row.original.overdue,
    cell: ({ row }) => <span className={`figure ${row.original.overdue ? "font-semibold text-signal" : ""}`}>{row.original.overdue ? "■ " : ""}{waitingText(row.original)}</span>,
  },
  {
    id: "expiry",
    header: "Permit expires",
    accessorFn: (r) => r.permitExpiresOn ?? "",
    filterFn: (row, _id, value) => !value || row.original.expiringSoon,
    cell: ({ row }) => (
      <span className={`figure ${row.original.expiringSoon ? "font-semibold text-caution" : ""}`}>
        {row.original.expiringSoon ? "▲ " : ""}
        {row.original.permitExpiresOn ?? "—"}
        {row.original.permitNumber ? <span className="block text-xs text-ink-soft">{row.original.permitNumber}</span> : null}
      </span>
    ),
  },
  {
    id: "next",
    header: "Next action",
    accessorFn: (r) => `${r.nextAction} (${r.holder})`,
    cell: ({ row }) => (
      <span>
        {row.original.nextAction}
        {row.original.holder !== "—" ? <span className="block text-xs text-ink-soft">{row.original.holder}</span> : null}
      </span>
    ),
  },
];

/** The CSV the office takes away: the rows as filtered and sorted on screen, each cell escaped. */
export function queueCsv(rows: readonly SubmissionQueueEntry[], asOf: string): string {
  const head = ["Project", "Jurisdiction", "Revision", "Reference", "Status", "Days since last event", "Days waiting on the AHJ", "Typical review days", "Overdue", "Permit", "Permit expires", "Expiring soon", "Next action", "Held by", `As of ${asOf}`];
  const lines = rows.map((r) =>
    csvLine([
      r.projectName,
      r.jurisdictionName,
      r.revisionNumber,
      r.referenceNumber,
      EVENT_LABELS[r.status],
      r.daysSinceLastEvent,
      r.daysWaiting,
      r.jurisdictionTypicalReviewDays,
      r.overdue ? "yes" : "no",
      r.permitNumber,
      r.permitExpiresOn,
      r.expiringSoon ? "yes" : "no",
      r.nextAction,
      r.holder,
      "",
    ]),
  );
  return [csvLine(head), ...lines].join("\r\n") + "\r\n";
}

/** The office queue: every submission with the days that say what is late; filter, sort, export. */
export function QueueTable({ rows, today }: { rows: SubmissionQueueEntry[]; today: string }) {
  const [sorting, setSorting] = useState<SortingState>([{ id: "sinceLast", desc: true }]);
  const [filters, setFilters] = useState<ColumnFiltersState>([]);
  const table = useReactTable({
    data: rows,
    columns,
    state: { sorting, columnFilters: filters },
    onSortingChange: setSorting,
    onColumnFiltersChange: setFilters,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getFilteredRowModel: getFilteredRowModel(),
  });
  const jurisdictions = useMemo(() => [...new Set(rows.map((r) => r.jurisdictionName))].sort(), [rows]);
  const statuses = useMemo(() => [...new Set(rows.map((r) => r.status))], [rows]);
  const filterValue = (id: string) => filters.find((f) => f.id === id)?.value;
  const setFilter = (id: string, value: unknown) => setFilters((prev) => [...prev.filter((f) => f.id !== id), ...(value ? [{ id, value }] : [])]);
  const visible = table.getRowModel().rows.map((r) => r.original);

  function exportCsv() {
    const blob = new Blob([queueCsv(visible, today)], { type: "text/csv;charset=utf-8" });
    const url = URL.createObjectURL(blob);
    const a = document.createElement("a");
    a.href = url;
    a.download = `submission-queue-${today}.csv`;
    a.click();
    URL.revokeObjectURL(url);
  }

  return (
    <div>
      <div className="no-print mb-3 flex flex-wrap items-end gap-4 text-sm" role="group" aria-label="Filter the queue">
        <label className="grid gap-1">
          <span className="field-label">Jurisdiction</span>
          <select className="input" value={String(filterValue("jurisdiction") ?? "")} onChange={(e) => setFilter("jurisdiction", e.target.value)}>
            <option value="">All</option>
            {jurisdictions.map((j) => (
              <option key={j} value={j}>
                {j}
              </option>
            ))}
          </select>
        </label>
        <label className="grid gap-1">
          <span className="field-label">Status</span>
          <select className="input" value={String(filterValue("status") ?? "")} onChange={(e) => setFilter("status", e.target.value)}>
            <option value="">All</option>
            {statuses.map((s) => (
              <option key={s} value={s}>
                {EVENT_LABELS[s]}
              </option>
            ))}
          </select>
        </label>
        <label className="flex items-center gap-1.5">
          <input type="checkbox" checked={Boolean(filterValue("waiting"))} onChange={(e) => setFilter("waiting", e.target.checked)} />
          Overdue only
        </label>
        <label className="flex items-center gap-1.5">
          <input type="checkbox" checked={Boolean(filterValue("expiry"))} onChange={(e) => setFilter("expiry", e.target.checked)} />
          Permit expiring
        </label>
        <button type="button" className="btn-quiet" onClick={exportCsv}>
          Export CSV
        </button>
        <span className="text-xs text-ink-soft">
          {visible.length} of {rows.length} · days are calendar days in UTC, weekends included
        </span>
      </div>
      <div className="sheet overflow-x-auto">
        <table className="data-table" aria-label="Submissions">
          <caption className="hidden text-left text-xs print:table-caption">Submission queue as of {today}</caption>
          <thead>
            {table.getHeaderGroups().map((hg) => (
              <tr key={hg.id}>
                {hg.headers.map((h) => {
                  const sorted = h.column.getIsSorted();
                  return (
                    <th key={h.id} aria-sort={sorted === "asc" ? "ascending" : sorted === "desc" ? "descending" : "none"}>
                      <button type="button" className="inline-flex items-center gap-1 font-semibold" onClick={h.column.getToggleSortingHandler()}>
                        {flexRender(h.column.columnDef.header, h.getContext())}
                        <span aria-hidden="true">{sorted === "asc" ? "▲" : sorted === "desc" ? "▼" : ""}</span>
                      </button>
                    </th>
                  );
                })}
              </tr>
            ))}
          </thead>
          <tbody>
            {table.getRowModel().rows.map((row) => (
              <tr key={row.id} data-overdue={row.original.overdue || undefined}>
                {row.getVisibleCells().map((cell) => (
                  <td key={cell.id}>{flexRender(cell.column.columnDef.cell, cell.getContext())}</td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
        {visible.length === 0 ? <p className="px-4 py-6 text-sm text-ink-soft">No submission matches these filters.</p> : null}
      </div>
    </div>
  );
}
