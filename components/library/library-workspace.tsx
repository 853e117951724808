"use client";

import { useQuery, useQueryClient } from "@tanstack/react-query";
import { useCallback, useId, useMemo, useRef, useState } from "react";
import { fetchJson } from "@/lib/fetch-json";
import { EQUIPMENT_KINDS, KIND_LABELS, type EquipmentKind, type LibraryItemView } from "@/lib/schemas/library-item";
import { ImportPanel } from "./import-panel";
import { ItemForm } from "./item-form";
import { LibraryTable } from "./library-table";

type Panel = { mode: "add"; kind: EquipmentKind } | { mode: "edit"; item: LibraryItemView } | { mode: "import" } | null;

const QUERY_KEY = ["library", "all"];

/** The library page's working area: filters, the table, the add/edit form and the CSV import. */
export function LibraryWorkspace({ canEdit }: { canEdit: boolean }) {
  const uid = useId();
  const queryClient = useQueryClient();
  const query = useQuery({
    queryKey: QUERY_KEY,
    queryFn: () => fetchJson<{ items: LibraryItemView[] }>("/api/library?includeRetired=1"),
  });
  const [kind, setKind] = useState<EquipmentKind | "">("");
  const [search, setSearch] = useState("");
  const [showRetired, setShowRetired] = useState(false);
  const [panel, setPanel] = useState<Panel>(null);
  const [addKind, setAddKind] = useState<EquipmentKind>("pv-module");
  const [notice, setNotice] = useState<{ text: string; bad?: boolean } | null>(null);
  const [busyId, setBusyId] = useState<string | null>(null);
  // A remount after a conflict reload gives the form the fresh version and values.
  const [formKey, setFormKey] = useState(0);

  const dirtyRef = useRef(false);
  const onDirtyChange = useCallback((dirty: boolean) => {
    dirtyRef.current = dirty;
  }, []);
  /** Opens another panel, asking first when the open form holds unsaved changes. */
  const openPanel = useCallback((next: Panel) => {
    if (dirtyRef.current && !window.confirm("Discard the unsaved changes in the open form?")) return false;
    dirtyRef.current = false;
    setPanel(next);
    return true;
  }, []);

  const refresh = useCallback(() => queryClient.invalidateQueries({ queryKey: ["library"] }), [queryClient]);

  const setRetired = useCallback(
    async (item: LibraryItemView, retire: boolean) => {
      setBusyId(item.id);
      setNotice(null);
      try {
        await fetchJson(`/api/library/${item.id}/${retire ? "retire" : "restore"}`, {
          method: "POST",
          headers: { "content-type": "application/json" },
          body: JSON.stringify({ version: item.version }),
        });
        setNotice({
          text: retire
            ? `Retired ${item.manufacturer} ${item.model}: it leaves the project picker; projects that use it keep their ratings.`
            : `Restored ${item.manufacturer} ${item.model} to the project picker.`,
        });
        await refresh();
      } catch (e) {
        setNotice({ text: e instanceof Error ? e.message : "Not saved.", bad: true });
      } finally {
        setBusyId(null);
      }
    },
    [refresh],
  );
  const onRetire = useCallback((i: LibraryItemView) => void setRetired(i, true), [setRetired]);
  const onRestore = useCallback((i: LibraryItemView) => void setRetired(i, false), [setRetired]);
  const onEdit = useCallback(
    (item: LibraryItemView) => {
      if (openPanel({ mode: "edit", item })) setNotice(null);
    },
    [openPanel],
  );

  const reloadEdited = useCallback(async () => {
    if (panel?.mode !== "edit") return;
    const fresh = await fetchJson<{ item: LibraryItemView }>(`/api/library/${panel.item.id}`);
    dirtyRef.current = false;
    setPanel({ mode: "edit", item: fresh.item });
    setFormKey((k) => k + 1);
    await refresh();
  }, [panel, refresh]);

  const all = query.data?.items;
  const items = useMemo(() => (all ?? []).filter((i) => showRetired || !i.retiredAt), [all, showRetired]);
  const retiredCount = useMemo(() => (all ?? []).filter((i) => i.retiredAt).length, [all]);

  return (
    <div className="space-y-4">
      {canEdit ? (
        <div className="flex flex-wrap items-end gap-2">
          <div>
            <label htmlFor={`${uid}-add-kind`} className="field-label block">
              Kind to add
            </label>
            <select id={`${uid}-add-kind`} className="input mt-1 w-56" value={addKind} onChange={(e) => setAddKind(e.target.value as EquipmentKind)}>
              {EQUIPMENT_KINDS.map((k) => (
                <option key={k} value={k}>
                  {KIND_LABELS[k]}
                </option>
              ))}
            </select>
          </div>
          <button
            type="button"
            className="btn"
            onClick={() => {
              if (!openPanel({ mode: "add", kind: addKind })) return;
              setNotice(null);
              setFormKey((k) => k + 1);
            }}
          >
            Add item
          </button>
          <button type="button" className="btn-quiet" onClick={() => openPanel({ mode: "import" })}>
            Import CSV…
          </button>
          <a className="btn-quiet" href="/api/library/example-csv" download>
            Example CSV
          </a>
        </div>
      ) : (
        <p className="text-sm text-ink-soft">Read-only: designers add, edit and retire library items.</p>
      )}

      {notice ? (
        <p role={notice.bad ? "alert" : "status"} className={`text-sm ${notice.bad ? "text-signal" : "text-ok"}`}>
          <span aria-hidden="true">{notice.bad ? "■ " : "● "}</span>
          {notice.text}
        </p>
      ) : null}

      {panel?.mode === "add" || panel?.mode === "edit" ? (
        <ItemForm
          key={`${panel.mode}-${panel.mode === "edit" ? panel.item.id : panel.kind}-${formKey}`}
          kind={panel.mode === "edit" ? panel.item.kind : panel.kind}
          item={panel.mode === "edit" ? panel.item : undefined}
          onCancel={() => openPanel(null)}
          onReload={reloadEdited}
          onDirtyChange={onDirtyChange}
          onSaved={(saved) => {
            dirtyRef.current = false;
            setPanel(null);
            setNotice({ text: `${panel.mode === "edit" ? "Saved" : "Added"} ${saved.manufacturer} ${saved.model}.` });
            void refresh();
          }}
        />
      ) : null}
      {panel?.mode === "import" ? <ImportPanel onImported={refresh} onClose={() => setPanel(null)} /> : null}

      <div className="flex flex-wrap items-end gap-3">
        <div>
          <label htmlFor={`${uid}-kind`} className="field-label block">
            Kind
          </label>
          <select id={`${uid}-kind`} className="input mt-1 w-56" value={kind} onChange={(e) => setKind(e.target.value as EquipmentKind | "")}>
            <option value="">All kinds</option>
            {EQUIPMENT_KINDS.map((k) => (
              <option key={k} value={k}>
                {KIND_LABELS[k]}
              </option>
            ))}
          </select>
        </div>
        <div className="min-w-64 flex-1">
          <label htmlFor={`${uid}-search`} className="field-label block">
            Search
          </label>
          <input
            id={`${uid}-search`}
            type="search"
            className="input mt-1"
            placeholder="Maker, model, listing…"
            value={search}
            onChange={(e) => setSearch(e.target.value)}
          />
        </div>
        <label className="inline-flex items-center gap-2 pb-2 text-sm">
          <input type="checkbox" checked={showRetired} onChange={(e) => setShowRetired(e.target.checked)} />
          Show retired ({retiredCount})
        </label>
      </div>

      {query.isPending ? (
        <p role="status" className="sheet px-4 py-6 text-sm text-ink-soft">
          Loading the library…
        </p>
      ) : query.isError ? (
        <div role="alert" className="sheet border-l-4 border-l-signal px-4 py-4 text-sm">
          <p className="font-semibold">The library could not be loaded.</p>
          <p className="mt-1 text-ink-soft">{query.error.message}</p>
          <button type="button" className="btn-quiet mt-3" onClick={() => query.refetch()}>
            Try again
          </button>
        </div>
      ) : (
        <LibraryTable
          items={items}
          kind={kind}
          search={search}
          canEdit={canEdit}
          busyId={busyId}
          onEdit={onEdit}
          onRetire={onRetire}
          onRestore={onRestore}
        />
      )}
    </div>
  );
}
