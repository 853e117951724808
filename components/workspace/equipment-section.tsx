"use client";

import { useQuery } from "@tanstack/react-query";
import { useEffect, useMemo, useRef, useState } from "react";
import { useFormContext, useWatch } from "react-hook-form";
import { EQUIPMENT_KINDS, type EquipmentKind } from "@/lib/schemas/project-record";
import { isInverterKind } from "@/lib/schemas/vocabulary";
import { FormField, type Option } from "./field-control";
import { EditableGrid, nextTag, type GridColumn } from "./editable-grid";
import { EQUIPMENT_COLUMNS, EQUIPMENT_KIND_LABELS, MPPT_INPUT_COLUMNS, RATING_FIELDS, TAG_PREFIX, changeKind } from "./equipment-fields";

export { EQUIPMENT_COLUMNS, MPPT_INPUT_COLUMNS };
import { OPEN_EQUIPMENT_EVENT } from "./focus-path";
import { useReferenceGuard } from "./reference-guard";
import { Section } from "./site-section";
import { useRecordTags } from "./use-record-tags";

const KIND_OPTIONS: Option[] = EQUIPMENT_KINDS.map((k) => ({ value: k, label: EQUIPMENT_KIND_LABELS[k] }));
const AUTO_TAG = new RegExp(`^(${[...new Set(Object.values(TAG_PREFIX))].join("|")})-\\d+$`);

interface LibraryItem {
  id: string;
  kind: EquipmentKind;
  manufacturer: string;
  model: string;
  ratings: Record<string, unknown>;
}

function LibraryPicker({ onPick }: { onPick: (item: LibraryItem) => void }) {
  const [kind, setKind] = useState<EquipmentKind>("pv-module");
  const [choice, setChoice] = useState("");
  const query = useQuery({
    queryKey: ["library", kind],
    queryFn: async () => {
      const response = await fetch(`/api/library?kind=${encodeURIComponent(kind)}`, { headers: { accept: "application/json" } });
      if (response.status === 404) return null;
      if (!response.ok) throw new Error(`The library answered ${response.status}.`);
      return ((await response.json()) as { items: LibraryItem[] }).items;
    },
    retry: false,
  });
  const items = query.data ?? [];
  return (
    <div className="mb-3 flex flex-wrap items-end gap-2 border border-dashed border-rule px-3 py-2">
      <div>
        <label htmlFor="library-kind" className="field-label mb-1 block">
          From the library: kind
        </label>
        <select id="library-kind" className="input w-48" value={kind} onChange={(e) => setKind(e.target.value as EquipmentKind)}>
          {KIND_OPTIONS.map((o) => (
            <option key={o.value} value={o.value}>
              {o.label}
            </option>
          ))}
        </select>
      </div>
      <div className="min-w-64 flex-1">
        <label htmlFor="library-item" className="field-label mb-1 block">
          Item
        </label>
        <select id="library-item" className="input" value={choice} onChange={(e) => setChoice(e.target.value)} disabled={!items.length}>
          <option value="">{query.isPending ? "loading…" : items.length ? "— choose —" : "none of this kind"}</option>
          {items.map((i) => (
            <option key={i.id} value={i.id}>
              {i.manufacturer} {i.model}
            </option>
          ))}
        </select>
      </div>
      <button
        type="button"
        className="btn-quiet"
        disabled={!choice}
        onClick={() => {
          const item = items.find((i) => i.id === choice);
          if (item) onPick(item);
          setChoice("");
        }}
      >
        Add to project
      </button>
      {query.data === null ? (
        <p className="w-full text-xs text-ink-faint">The organisation&apos;s library is not available here yet; add equipment by hand and enter its ratings.</p>
      ) : query.isError ? (
        <p className="w-full text-xs text-signal">{query.error.message}</p>
      ) : null}
    </div>
  );
}

function MpptInputs({ index }: { index: number }) {
  return (
    <div className="mt-4 sm:col-span-2">
      <p className="field-label mb-1">MPPT inputs</p>
      <EditableGrid
        name={`equipment.${index}.mpptInputs`}
        label={`MPPT inputs of equipment row ${index + 1}`}
        noun="MPPT input"
        columns={MPPT_INPUT_COLUMNS}
        newRow={(rows) => ({ id: String.fromCharCode(65 + rows.length) })}
        duplicateRow={(row, rows) => ({ ...row, id: String.fromCharCode(65 + rows.length) })}
      />
    </div>
  );
}

function RatingsPanel({ index, onClose }: { index: number; onClose: () => void }) {
  const kind = useWatch({ name: `equipment.${index}.kind` }) as EquipmentKind | undefined;
  const tag = useWatch({ name: `equipment.${index}.tag` }) as string | undefined;
  const fields = kind ? (RATING_FIELDS[kind] ?? []) : [];
  return (
    <div className="mt-3 border border-slate/40 bg-white px-4 py-3" role="group" aria-label={`Ratings of ${tag || `equipment row ${index + 1}`}`}>
      <div className="mb-3 flex items-baseline justify-between">
        <h3 className="text-sm font-semibold">
          Ratings · <span className="figure">{tag || `row ${index + 1}`}</span>{" "}
          <span className="font-normal text-ink-soft">{kind ? EQUIPMENT_KIND_LABELS[kind] : ""}</span>
        </h3>
        <button type="button" className="btn-quiet px-2 py-0.5 text-xs" onClick={onClose}>
          Close ratings
        </button>
      </div>
      <div className="grid gap-3 sm:grid-cols-3">
        {fields.map((f) => (
          <FormField key={`${kind}-${f.key}`} path={`equipment.${index}.${f.key}`} label={f.label} unit={f.unit} type={f.type} options={f.options} help={f.help} />
        ))}
        {kind && isInverterKind(kind) ? <MpptInputs index={index} /> : null}
      </div>
    </div>
  );
}

export function EquipmentSection() {
  const { getValues, setValue } = useFormContext();
  const tags = useRecordTags();
  const tagsRef = useRef(tags);
  const equipmentGuard = useReferenceGuard("equipment", "equipment");
  tagsRef.current = tags;
  const [open, setOpen] = useState<number | null>(null);
  const count = (useWatch({ name: "equipment" }) as unknown[] | undefined)?.length ?? 0;
  useEffect(() => {
    const onOpen = (e: Event) => setOpen((e as CustomEvent<number>).detail);
    window.addEventListener(OPEN_EQUIPMENT_EVENT, onOpen);
    return () => window.removeEventListener(OPEN_EQUIPMENT_EVENT, onOpen);
  }, []);
  useEffect(() => {
    if (open !== null && open >= count) setOpen(null);
  }, [open, count]);
  const columns = useMemo<GridColumn[]>(
    () =>
      EQUIPMENT_COLUMNS.map((col) =>
        col.key !== "kind"
          ? col
          : {
              ...col,
              onValueChange: (i: number, value: unknown) => {
                const row = getValues(`equipment.${i}`) as Record<string, unknown>;
                const next = changeKind(row, value as EquipmentKind);
                // A tag the product gave (MOD-2) follows the kind (CC-1); a tag the designer typed stays.
                if (typeof row.tag === "string" && AUTO_TAG.test(row.tag)) {
                  const others = [...tagsRef.current.all].filter((t) => t !== row.tag);
                  next.tag = nextTag(TAG_PREFIX[value as EquipmentKind], others);
                }
                setValue(`equipment.${i}`, next, { shouldDirty: true, shouldValidate: true });
              },
            },
      ),
    [getValues, setValue],
  );
  const all = () => [...tags.all];
  return (
    <Section id="equipment" title="Equipment" sheet="A · 3">
      <LibraryPicker
        onPick={(item) => {
          const rows = (getValues("equipment") ?? []) as unknown[];
          const row = {
            ...changeKind({ quantity: 1, listing: "" }, item.kind),
            ...item.ratings,
            kind: item.kind,
            manufacturer: item.manufacturer,
            model: item.model,
            libraryItemId: item.id,
            quantity: 1,
            tag: nextTag(TAG_PREFIX[item.kind], all()),
          };
          setValue("equipment", [...rows, row], { shouldDirty: true, shouldValidate: true });
          setOpen(rows.length);
        }}
      />
      {equipmentGuard.dialog}
      <EditableGrid
        name="equipment"
        onCommit={equipmentGuard.onCommit}
        onRequestRemove={equipmentGuard.onRequestRemove}
        label="Equipment"
        noun="equipment"
        columns={columns}
        selectedIndex={open ?? undefined}
        onRemoved={(i) => setOpen((o) => (o === null || o === i ? null : o > i ? o - 1 : o))}
        newRow={() => ({ ...changeKind({ quantity: 1, listing: "", manufacturer: "", model: "" }, "pv-module"), tag: nextTag("MOD", all()) })}
        duplicateRow={(row) => ({ ...row, tag: nextTag(TAG_PREFIX[row.kind as EquipmentKind] ?? "EQ", all()) })}
        rowActions={(i) => (
          <button
            type="button"
            className="btn-quiet px-2 py-0.5 text-xs"
            aria-expanded={open === i}
            aria-label={`Ratings of equipment row ${i + 1}`}
            onClick={() => setOpen(open === i ? null : i)}
          >
            Ratings
          </button>
        )}
      />
      {open !== null && open < count ? <RatingsPanel index={open} onClose={() => setOpen(null)} /> : null}
    </Section>
  );
}
