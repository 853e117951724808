"use client";

/**
 * A keyboard-first grid over one array of the record (circuits, loads,
 * equipment …). Every cell is a live control bound to its record path;
 * TanStack Table supplies the columns and sorting. Sorting reorders the
 * view only — the record keeps its order — and is taken when a header is
 * chosen, so rows do not jump while someone types.
 *
 * Keys: ↑/↓ move to the same column in the row above/below; ←/→ move across
 * at the edge of the text; Enter moves down; Escape puts back the value the
 * cell had when it was entered.
 */
import {
  flexRender,
  getCoreRowModel,
  getSortedRowModel,
  useReactTable,
  type ColumnDef,
  type SortingState,
} from "@tanstack/react-table";
import { Fragment, useEffect, useMemo, useRef, useState, type KeyboardEvent, type ReactNode } from "react";
import { useFieldArray, useFormContext } from "react-hook-form";
import { pluralNoun } from "@/lib/schemas/vocabulary";
import { FieldControl, type FieldType, type Option } from "./field-control";
import { sameValue } from "./field-values";
import { OPEN_ROW_EVENT } from "./focus-path";

export interface GridColumn {
  key: string;
  header: string;
  unit?: string;
  type: FieldType;
  options?: Option[] | ((rowIndex: number) => Option[]);
  required?: boolean;
  /** Tailwind width class for the cell's control. */
  width?: string;
  /** What an empty cell means ("100" for a duty left empty); the unit when not given. */
  placeholder?: string;
  /** Told after the designer changes the cell, with the value it held before. */
  onValueChange?: (rowIndex: number, value: unknown, previous: unknown) => void;
}

interface RowRef {
  key: string;
  index: number;
  values: Record<string, unknown>;
}

export interface EditableGridProps {
  name: string;
  label: string;
  /** Singular noun for buttons: "circuit", "load". */
  noun: string;
  columns: GridColumn[];
  newRow: (rows: Record<string, unknown>[]) => Record<string, unknown>;
  duplicateRow?: (row: Record<string, unknown>, rows: Record<string, unknown>[]) => Record<string, unknown>;
  rowActions?: (index: number) => ReactNode;
  selectedIndex?: number;
  empty?: ReactNode;
  /** Told after a row is deleted, so a caller that points at rows by index can follow. */
  onRemoved?: (index: number) => void;
  /** Asked before a row is deleted; call `remove` to go ahead (a caller may first ask about references to it). */
  onRequestRemove?: (index: number, remove: () => void) => void;
  /** Told when the designer leaves a cell whose value changed (a renamed tag, say). */
  onCommit?: (index: number, key: string, before: unknown, after: unknown) => void;
  /** Fields that open below a row rather than standing in a column. */
  detailColumns?: GridColumn[];
  /** Drawn under a cell's control: a derived-value note or a suggestion to accept. */
  cellExtra?: (key: string, index: number) => ReactNode;
  /** A read-only column after the editable ones (a result, say). */
  trailing?: { header: string; cell: (index: number) => ReactNode };
}

export { OPEN_ROW_EVENT };

const KEY_COLUMN = "__row";

export function EditableGrid({
  name,
  label,
  noun,
  columns,
  newRow,
  duplicateRow,
  rowActions,
  selectedIndex,
  empty,
  onRemoved,
  onRequestRemove,
  onCommit,
  detailColumns,
  cellExtra,
  trailing,
}: EditableGridProps) {
  const { control, getValues, setValue } = useFormContext();
  const { fields, append, insert, remove } = useFieldArray({ control, name });
  const [open, setOpen] = useState<Set<string>>(() => new Set());
  const fieldsRef = useRef(fields);
  fieldsRef.current = fields;
  useEffect(() => {
    const onOpen = (e: Event) => {
      const { grid, index } = (e as CustomEvent<{ grid: string; index: number }>).detail;
      const key = fieldsRef.current[index]?.id;
      if (grid === name && key) setOpen((o) => new Set(o).add(key));
    };
    window.addEventListener(OPEN_ROW_EVENT, onOpen);
    return () => window.removeEventListener(OPEN_ROW_EVENT, onOpen);
  }, [name]);
  const toggle = (key: string) =>
    setOpen((o) => {
      const next = new Set(o);
      if (next.has(key)) next.delete(key);
      else next.add(key);
      return next;
    });
  const hasDetail = Boolean(detailColumns?.length);
  const span = columns.length + 2 + (trailing ? 1 : 0);
  const [sorting, setSorting] = useState<SortingState>([]);
  const tableRef = useRef<HTMLTableElement>(null);
  const entered = useRef(new Map<string, unknown>());

  // Values are read when the row set or the sort changes, not on every keystroke.
  const data = useMemo<RowRef[]>(
    () =>
      fields.map((f, index) => ({
        key: f.id,
        index,
        values: (getValues(`${name}.${index}`) ?? {}) as Record<string, unknown>,
      })),
    [fields, sorting, name],
  );

  const columnDefs = useMemo<ColumnDef<RowRef>[]>(
    () => [
      {
        id: KEY_COLUMN,
        header: "#",
        enableSorting: false,
        cell: (c) => <span className="figure text-xs text-ink-faint">{c.row.original.index + 1}</span>,
      },
      ...columns.map<ColumnDef<RowRef>>((col) => ({
        id: col.key,
        header: col.unit ? `${col.header} (${col.unit})` : col.header,
        accessorFn: (r) => {
          const v = r.values[col.key];
          return Array.isArray(v) ? v.join(",") : (v as string | number | boolean | undefined);
        },
        sortUndefined: "last",
        enableSorting: col.type !== "checkbox",
      })),
    ],
    [columns],
  );

  const table = useReactTable({
    data,
    columns: columnDefs,
    state: { sorting },
    onSortingChange: setSorting,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getRowId: (r) => r.key,
  });

  const focusCell = (row: number, col: number) => {
    const el = tableRef.current?.querySelector<HTMLElement>(`[data-grid="${name}"][data-row="${row}"][data-col="${col}"]`);
    if (el) {
      el.focus();
      if (el instanceof HTMLInputElement && el.type === "text") el.select();
      return true;
    }
    return false;
  };

  const onCellKeyDown = (e: KeyboardEvent<HTMLElement>, path: string) => {
    const el = e.currentTarget as HTMLInputElement;
    const row = Number(el.dataset.row);
    const col = Number(el.dataset.col);
    if (e.altKey || e.ctrlKey || e.metaKey || e.shiftKey) return;
    const isText = el instanceof HTMLInputElement && el.type === "text";
    const atStart = !isText || (el.selectionStart === 0 && el.selectionEnd === 0);
    const atEnd = !isText || (el.selectionStart === el.value.length && el.selectionEnd === el.value.length);
    switch (e.key) {
      case "ArrowUp":
        if (focusCell(row - 1, col)) e.preventDefault();
        else if (el instanceof HTMLSelectElement) e.preventDefault();
        break;
      case "ArrowDown":
        if (focusCell(row + 1, col)) e.preventDefault();
        else if (el instanceof HTMLSelectElement) e.preventDefault();
        break;
      case "ArrowLeft":
        if (atStart && focusCell(row, col - 1)) e.preventDefault();
        break;
      case "ArrowRight":
        if (atEnd && focusCell(row, col + 1)) e.preventDefault();
        break;
      case "Enter":
        if (el instanceof HTMLTextAreaElement) break;
        e.preventDefault();
        focusCell(row + 1, col);
        break;
      case "Escape": {
        if (!entered.current.has(path)) break;
        e.preventDefault();
        const before = entered.current.get(path);
        setValue(path, before, { shouldDirty: true, shouldValidate: true });
        break;
      }
    }
  };

  const commit = (index: number, key: string, path: string) => {
    if (!onCommit || !entered.current.has(path)) return;
    const before = entered.current.get(path);
    const after = getValues(path);
    if (!sameValue(before, after)) onCommit(index, key, before, after);
    entered.current.set(path, after);
  };

  const rows = table.getRowModel().rows;
  const headers = table.getHeaderGroups()[0]?.headers ?? [];
  const all = () => (getValues(name) ?? []) as Record<string, unknown>[];

  return (
    <div>
      <div className="overflow-x-auto border border-rule bg-sheet">
        <table ref={tableRef} className="data-table workspace-grid" aria-label={label}>
          <thead>
            <tr>
              {headers.map((h) => {
                const sorted = h.column.getIsSorted();
                if (h.column.id === KEY_COLUMN) {
                  return (
                    <Fragment key={h.id}>
                      <th scope="col" className={hasDetail ? "w-6" : undefined}>#</th>
                      <th scope="col">
                        <span className="sr-only">Row actions</span>
                      </th>
                    </Fragment>
                  );
                }
                return (
                  <th key={h.id} scope="col" aria-sort={sorted === "asc" ? "ascending" : sorted === "desc" ? "descending" : undefined}>
                    {h.column.getCanSort() ? (
                      <button type="button" className="inline-flex items-center gap-1 uppercase" onClick={h.column.getToggleSortingHandler()}>
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
              {trailing ? <th scope="col">{trailing.header}</th> : null}
            </tr>
          </thead>
          <tbody>
            {rows.length === 0 ? (
              <tr>
                <td colSpan={span} className="py-4 text-left text-sm text-ink-soft">
                  {empty ?? `No ${pluralNoun(noun)} yet.`}
                </td>
              </tr>
            ) : null}
            {rows.map((row, visual) => {
              const index = row.original.index;
              const main = (
                <tr key={row.id} data-selected={selectedIndex === index ? "true" : undefined} className={selectedIndex === index ? "bg-slate-soft/60" : ""}>
                  {row.getVisibleCells().map((cell) => {
                    if (cell.column.id === KEY_COLUMN) {
                      return (
                        <Fragment key={cell.id}>
                          <th scope="row" className={`border-b border-grid text-left font-normal ${hasDetail ? "w-6 px-1" : "w-8 px-2"}`}>
                            {flexRender(cell.column.columnDef.cell, cell.getContext())}
                          </th>
                          <td className="whitespace-nowrap px-1 py-1">
                            <div className="flex gap-1">
                              {hasDetail ? (
                                <button
                                  type="button"
                                  className="btn-quiet px-1 py-0.5 text-xs"
                                  aria-expanded={open.has(row.id)}
                                  aria-label={`Details of ${noun} row ${index + 1}`}
                                  title="Conductor, raceway and current fields"
                                  onClick={() => toggle(row.id)}
                                >
                                  {open.has(row.id) ? "▾" : "▸"}
                                </button>
                              ) : null}
                              {rowActions?.(index)}
                              <button
                                type="button"
                                className={`btn-quiet py-0.5 text-xs ${hasDetail ? "px-1" : "px-2"}`}
                                title="Copy this row"
                                aria-label={`Duplicate ${noun} row ${index + 1}`}
                                onClick={() => {
                                  const rowsNow = all();
                                  const source = (getValues(`${name}.${index}`) ?? {}) as Record<string, unknown>;
                                  insert(index + 1, duplicateRow ? duplicateRow(structuredClone(source), rowsNow) : structuredClone(source));
                                }}
                              >
                                {hasDetail ? "+" : "Copy"}
                              </button>
                              <button
                                type="button"
                                className={`btn-quiet py-0.5 text-xs ${hasDetail ? "px-1" : "px-2"}`}
                                title="Delete this row"
                                aria-label={`Delete ${noun} row ${index + 1}`}
                                onClick={() => {
                                  const go = () => {
                                    remove(index);
                                    onRemoved?.(index);
                                  };
                                  if (onRequestRemove) onRequestRemove(index, go);
                                  else go();
                                }}
                              >
                                {hasDetail ? "✕" : "Delete"}
                              </button>
                            </div>
                          </td>
                        </Fragment>
                      );
                    }
                    const colIndex = columns.findIndex((c) => c.key === cell.column.id);
                    const col = columns[colIndex]!;
                    const path = `${name}.${index}.${col.key}`;
                    const options = typeof col.options === "function" ? col.options(index) : col.options;
                    return (
                      <td key={cell.id} className="px-1 py-1">
                        <div
                          className={col.width ?? "w-24"}
                          onFocusCapture={() => {
                            entered.current.set(path, getValues(path));
                          }}
                          onBlurCapture={() => commit(index, col.key, path)}
                        >
                          <FieldControl
                            path={path}
                            type={col.type}
                            label={`${col.header}${col.unit ? ` (${col.unit})` : ""}, ${noun} row ${index + 1}`}
                            options={options}
                            required={col.required}
                            placeholder={col.placeholder ?? col.unit}
                            className="px-1.5 py-1 text-sm"
                            grid={{ name, row: visual, col: colIndex }}
                            onValueChange={col.onValueChange ? (v, previous) => col.onValueChange?.(index, v, previous) : undefined}
                            onKeyDown={(e) => onCellKeyDown(e, path)}
                          />
                          {cellExtra?.(col.key, index)}
                        </div>
                      </td>
                    );
                  })}
                  {trailing ? <td className="whitespace-nowrap py-1 pl-1 pr-0.5">{trailing.cell(index)}</td> : null}
                </tr>
              );
              if (!hasDetail || !open.has(row.id)) return main;
              return (
                <Fragment key={row.id}>
                  {main}
                  <tr className="bg-paper/60">
                    <td colSpan={span} className="border-b border-grid px-3 py-2">
                      <div role="group" aria-label={`Details of ${noun} row ${index + 1}`} className="grid grid-cols-[repeat(auto-fill,minmax(9rem,1fr))] gap-x-3 gap-y-2">
                        {detailColumns!.map((col) => {
                          const path = `${name}.${index}.${col.key}`;
                          const options = typeof col.options === "function" ? col.options(index) : col.options;
                          const unit = col.unit ? ` (${col.unit})` : "";
                          return (
                            <div
                              key={col.key}
                              className={col.type === "checkbox" ? "flex flex-col" : ""}
                              onFocusCapture={() => {
                                entered.current.set(path, getValues(path));
                              }}
                              onBlurCapture={() => commit(index, col.key, path)}
                            >
                              <span className="field-label mb-0.5 block" aria-hidden="true">
                                {col.header}
                                {unit}
                              </span>
                              <FieldControl
                                path={path}
                                type={col.type}
                                label={`${col.header}${unit}, ${noun} row ${index + 1}`}
                                options={options}
                                required={col.required}
                                placeholder={col.placeholder ?? col.unit}
                                className="px-1.5 py-1 text-sm"
                                onValueChange={col.onValueChange ? (v, previous) => col.onValueChange?.(index, v, previous) : undefined}
                              />
                              {cellExtra?.(col.key, index)}
                            </div>
                          );
                        })}
                      </div>
                    </td>
                  </tr>
                </Fragment>
              );
            })}
          </tbody>
        </table>
      </div>
      <div className="mt-2 flex items-center gap-3">
        <button
          type="button"
          className="btn-quiet"
          onClick={() => {
            append(newRow(all()));
            // Focus the first cell of the new row once it is drawn.
            requestAnimationFrame(() => focusCell(fields.length, 0));
          }}
        >
          + Add {noun}
        </button>
        {sorting.length ? (
          <button type="button" className="btn-quiet text-xs" onClick={() => setSorting([])}>
            Record order
          </button>
        ) : null}
        <span className="text-xs text-ink-faint">↑ ↓ move between rows · Enter moves down · Esc undoes the cell</span>
      </div>
    </div>
  );
}

/** The next free tag with a prefix: C-1, C-2 … skipping any in use anywhere in the record. */
export function nextTag(prefix: string, used: Iterable<string>): string {
  const taken = new Set(used);
  for (let n = 1; ; n++) {
    const tag = `${prefix}-${n}`;
    if (!taken.has(tag)) return tag;
  }
}
