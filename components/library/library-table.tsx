"use client";

import {
  flexRender,
  getCoreRowModel,
  getFilteredRowModel,
  getSortedRowModel,
  useReactTable,
  type ColumnDef,
  type FilterFn,
  type SortingState,
} from "@tanstack/react-table";
import { useMemo, useState } from "react";
import { KIND_LABELS, ratingFieldsForKind, type EquipmentKind, type LibraryItemView } from "@/lib/schemas/library-item";

/** The ratings a designer looks for first, per kind, for the table's summary column. */
const KEY_RATINGS: Record<string, string[]> = {
  "pv-module": ["pmaxW", "vocV", "iscA", "tempCoeffVocPctPerC"],
  "charge-controller": ["controllerType", "maxPvInputVoltageV", "maxPvInputCurrentA", "ratedOutputCurrentA"],
  inverter: ["continuousW", "surgeW", "nominalBatteryVoltageV", "idleW"],
  "inverter-charger": ["continuousW", "surgeW", "nominalBatteryVoltageV", "idleW"],
  "hybrid-inverter": ["continuousW", "nominalBatteryVoltageV", "idleW", "mpptInputs"],
  battery: ["chemistry", "nominalVoltageV", "capacityKWh", "usableDodPct"],
  generator: ["ratedKW", "voltageV", "fuel"],
  disconnect: ["ratingA", "voltageRatingV", "currentType"],
  fuse: ["ratingA", "voltageRatingV", "currentType", "interruptingRatingA"],
  breaker: ["ratingA", "voltageRatingV", "currentType", "interruptingRatingA"],
  "rapid-shutdown": ["method"],
  "ac-panel": ["busRatingA", "mainBreakerA", "voltage"],
  busbar: ["busRatingA", "voltage"],
};

const SHORT_LABEL: Record<string, string> = {
  pmaxW: "Pmax",
  vocV: "Voc",
  iscA: "Isc",
  tempCoeffVocPctPerC: "β Voc",
  maxPvInputVoltageV: "PV max",
  maxPvInputCurrentA: "PV in",
  ratedOutputCurrentA: "out",
  continuousW: "cont.",
  surgeW: "surge",
  nominalBatteryVoltageV: "batt.",
  idleW: "idle",
  nominalVoltageV: "",
  capacityKWh: "",
  usableDodPct: "DoD",
  ratedKW: "",
  voltageV: "",
  ratingA: "",
  voltageRatingV: "",
  interruptingRatingA: "AIC",
  busRatingA: "bus",
  mainBreakerA: "main",
};

export function keyRatings(item: LibraryItemView): string {
  const fields = new Map(ratingFieldsForKind(item.kind).map((f) => [f.name, f]));
  const parts: string[] = [];
  for (const name of KEY_RATINGS[item.kind] ?? []) {
    const v = item.ratings[name];
    if (v === undefined || v === null || v === "") continue;
    if (name === "mpptInputs") {
      if (Array.isArray(v) && v.length) parts.push(`${v.length} MPPT`);
      continue;
    }
    const unit = fields.get(name)?.unit ?? "";
    const label = SHORT_LABEL[name];
    const value = typeof v === "number" ? `${v.toLocaleString("en-US")}${unit ? ` ${unit}` : ""}` : String(v);
    parts.push(label ? `${label} ${value}` : value);
  }
  return parts.join(" · ");
}

export interface LibraryTableProps {
  items: LibraryItemView[];
  kind: EquipmentKind | "";
  search: string;
  canEdit: boolean;
  busyId: string | null;
  onEdit: (item: LibraryItemView) => void;
  onRetire: (item: LibraryItemView) => void;
  onRestore: (item: LibraryItemView) => void;
}

const matchesSearch: FilterFn<LibraryItemView> = (row, _columnId, value: string) => {
  const needle = value.trim().toLowerCase();
  if (!needle) return true;
  const i = row.original;
  const hay = [i.manufacturer, i.model, KIND_LABELS[i.kind], i.kind, String(i.ratings.listing ?? ""), keyRatings(i)].join(" ").toLowerCase();
  return needle.split(/\s+/).every((w) => hay.includes(w));
};

/** Dense, sortable table of the library; kind and search filter it. */
export function LibraryTable({ items, kind, search, canEdit, busyId, onEdit, onRetire, onRestore }: LibraryTableProps) {
  // The server orders by kind, maker and model; sorting is stable, so that order holds within a kind.
  const [sorting, setSorting] = useState<SortingState>([{ id: "kind", desc: false }]);
  const columns = useMemo<ColumnDef<LibraryItemView>[]>(
    () => [
      {
        id: "kind",
        accessorFn: (i) => KIND_LABELS[i.kind],
        header: "Kind",
        filterFn: (row, _id, value: string) => !value || row.original.kind === value,
      },
      { id: "manufacturer", accessorKey: "manufacturer", header: "Manufacturer" },
      { id: "model", accessorKey: "model", header: "Model" },
      { id: "ratings", accessorFn: keyRatings, header: "Key ratings", enableSorting: false, cell: (c) => <span className="figure text-xs">{c.getValue<string>()}</span> },
      { id: "listing", accessorFn: (i) => String(i.ratings.listing ?? ""), header: "Listing", cell: (c) => <span className="text-xs">{c.getValue<string>()}</span> },
      {
        id: "state",
        accessorFn: (i) => (i.retiredAt ? "retired" : "active"),
        header: "State",
        cell: (c) =>
          c.row.original.retiredAt ? (
            <span className="inline-flex items-center gap-1 whitespace-nowrap rounded-[2px] border border-rule px-1.5 py-0.5 text-xs text-ink-faint">
              <span aria-hidden="true">–</span> Retired {c.row.original.retiredAt.slice(0, 10)}
            </span>
          ) : (
            <span className="inline-flex items-center gap-1 whitespace-nowrap rounded-[2px] border border-ok px-1.5 py-0.5 text-xs text-ok">
              <span aria-hidden="true">●</span> In picker
            </span>
          ),
      },
      ...(canEdit
        ? [
            {
              id: "actions",
              header: () => <span className="sr-only">Actions</span>,
              enableSorting: false,
              cell: ({ row }) => {
                const i = row.original;
                const name = `${i.manufacturer} ${i.model}`;
                return (
                  <span className="flex justify-end gap-1 whitespace-nowrap">
                    <button type="button" className="btn-quiet px-2 py-0.5 text-xs" onClick={() => onEdit(i)} aria-label={`Edit ${name}`}>
                      Edit
                    </button>
                    {i.retiredAt ? (
                      <button type="button" className="btn-quiet px-2 py-0.5 text-xs" disabled={busyId === i.id} onClick={() => onRestore(i)} aria-label={`Restore ${name}`}>
                        Restore
                      </button>
                    ) : (
                      <button type="button" className="btn-quiet px-2 py-0.5 text-xs" disabled={busyId === i.id} onClick={() => onRetire(i)} aria-label={`Retire ${name}`}>
                        Retire
                      </button>
                    )}
                  </span>
                );
              },
            } satisfies ColumnDef<LibraryItemView>,
          ]
        : []),
    ],
    [canEdit, busyId, onEdit, onRetire, onRestore],
  );

  // Stable state objects: a fresh array each render would make the row models recompute and re-render without end.
  const columnFilters = useMemo(() => [{ id: "kind", value: kind }], [kind]);
  const table = useReactTable({
    data: items,
    columns,
    state: { sorting, globalFilter: search, columnFilters },
    // No pagination here, so nothing to reset when the rows change.
    autoResetPageIndex: false,
    onSortingChange: setSorting,
    globalFilterFn: matchesSearch,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getFilteredRowModel: getFilteredRowModel(),
    enableSortingRemoval: false,
  });
  const rows = table.getRowModel().rows;

  return (
    <div className="sheet overflow-x-auto">
      <table className="data-table" aria-label="Equipment library">
        <thead>
          {table.getHeaderGroups().map((g) => (
            <tr key={g.id}>
              {g.headers.map((h) => {
                const sorted = h.column.getIsSorted();
                return (
                  <th key={h.id} aria-sort={sorted === "asc" ? "ascending" : sorted === "desc" ? "descending" : undefined}>
                    {h.column.getCanSort() ? (
                      <button type="button" className="inline-flex items-center gap-1 uppercase tracking-[0.05em]" onClick={h.column.getToggleSortingHandler()}>
                        {flexRender(h.column.columnDef.header, h.getContext())}
                        <span aria-hidden="true" className="text-ink-faint">
                          {sorted === "asc" ? "▲" : sorted === "desc" ? "▼" : "↕"}
                        </span>
                      </button>
                    ) : (
                      flexRender(h.column.columnDef.header, h.getContext())
                    )}
                  </th>
                );
              })}
            </tr>
          ))}
        </thead>
        <tbody>
          {rows.map((r) => (
            <tr key={r.id} className={r.original.retiredAt ? "text-ink-faint" : undefined}>
              {r.getVisibleCells().map((c) => (
                <td key={c.id}>{flexRender(c.column.columnDef.cell, c.getContext())}</td>
              ))}
            </tr>
          ))}
          {rows.length === 0 ? (
            <tr>
              <td colSpan={columns.length} className="py-6 text-center text-sm text-ink-soft">
                {items.length === 0 ? "The library is empty. Add an item or import a CSV file." : "No item matches the kind and search."}
              </td>
            </tr>
          ) : null}
        </tbody>
      </table>
      <p className="border-t border-grid px-3 py-1.5 text-xs text-ink-faint" aria-live="polite">
        {rows.length} of {items.length} item{items.length === 1 ? "" : "s"} shown
      </p>
    </div>
  );
}
