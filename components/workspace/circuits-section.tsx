"use client";

/**
 * The circuits grid: the columns a designer reads across a row on one screen
 * (tag, from, to, kind, size, length, OCPD, result), the rest of the row's
 * conductor and raceway fields in its detail. What the record implies is
 * shown beside the cell it concerns: a kind that follows from the two ends
 * and an insulation rating that follows from the type are marked as derived;
 * a conductor size, an overcurrent device and an EGC worked out by the engine
 * are offered as suggestions the designer accepts with one click.
 */
import { useQuery } from "@tanstack/react-query";
import { useMemo, useRef } from "react";
import { useFormContext, useWatch } from "react-hook-form";
import { StatusBadge } from "@/components/ui/status-badge";
import { circuitKindFromEnds, insulationRatingFor, suggestCircuit, type CircuitSuggestion } from "@/lib/compliance/derive/suggest";
import type { CheckStatus } from "@/lib/compliance";
import type { EquipmentKind } from "@/lib/schemas/project-record";
import { conductorSizeText, worst } from "@/lib/schemas/vocabulary";
import { EditableGrid, nextTag, type GridColumn } from "./editable-grid";
import { TAG_PREFIX, changeKind } from "./equipment-fields";
import { CIRCUIT_PRIMARY_KEYS, circuitColumns } from "./grid-columns";
import { useLive } from "./live-checks";
import { Section } from "./site-section";
import { useRecordTags, type RecordTags } from "./use-record-tags";

type Row = Record<string, unknown>;

interface LibraryDevice {
  id: string;
  kind: EquipmentKind;
  manufacturer: string;
  model: string;
  ratings: Record<string, unknown>;
}


function endKind(tags: RecordTags, tag: unknown): EquipmentKind | "array" | undefined {
  if (typeof tag !== "string" || !tag) return undefined;
  if (tags.arrays.some((a) => a.tag === tag)) return "array";
  return tags.equipment.find((e) => e.tag === tag)?.kind as EquipmentKind | undefined;
}

function Hint({ children }: { children: React.ReactNode }) {
  return <span className="mt-0.5 block max-w-full truncate whitespace-nowrap text-[11px] leading-tight text-ink-faint">{children}</span>;
}

function Accept({ label, title, onClick }: { label: string; title: string; onClick: () => void }) {
  return (
    <button
      type="button"
      title={title}
      className="mt-0.5 block max-w-full truncate whitespace-nowrap rounded-[2px] border border-dashed border-query px-1 text-left text-[11px] leading-tight text-query hover:bg-query-soft"
      onClick={onClick}
    >
      {label}
    </button>
  );
}

export function CircuitsSection() {
  const tags = useRecordTags();
  const tagsRef = useRef(tags);
  tagsRef.current = tags;
  const { getValues, setValue } = useFormContext();
  const live = useLive();
  const circuits = (useWatch({ name: "circuits" }) ?? []) as Row[];
  const equipment = (useWatch({ name: "equipment" }) ?? []) as Row[];

  // Fuses and breakers of the organisation's library, so an accepted device carries its real ratings.
  const library = useQuery({
    queryKey: ["library", "protective-devices"],
    queryFn: async () => {
      const lists = await Promise.all(
        (["fuse", "breaker"] as const).map(async (kind) => {
          const response = await fetch(`/api/library?kind=${kind}`, { headers: { accept: "application/json" } });
          if (!response.ok) return [] as LibraryDevice[];
          return ((await response.json()) as { items: LibraryDevice[] }).items;
        }),
      );
      return lists.flat();
    },
    retry: false,
    staleTime: 60_000,
  });

  // Suggestions come from the record the engine last ran on; rows are matched by tag, as a half-entered row may be left out of it.
  const suggestions = useMemo(() => {
    const out = new Map<string, CircuitSuggestion>();
    const record = live.record;
    if (!record) return out;
    record.circuits.forEach((c, i) => out.set(c.tag, suggestCircuit(record, i)));
    return out;
  }, [live.record]);

  const results = useMemo(() => {
    const out = new Map<string, CheckStatus[]>();
    for (const r of live.run?.results ?? []) {
      if (!r.subject || r.status === "not-applicable") continue;
      out.set(r.subject, [...(out.get(r.subject) ?? []), r.status]);
    }
    return out;
  }, [live.run]);

  const columns = useMemo<GridColumn[]>(() => {
    const set = (path: string, value: unknown) => setValue(path, value, { shouldDirty: true, shouldValidate: true });
    /** Re-derives the kind and the array when an end changes, unless the designer chose something else. */
    const followEnds = (i: number, end: "fromTag" | "toTag", previous: unknown) => {
      const t = tagsRef.current;
      const row = (getValues(`circuits.${i}`) ?? {}) as Row;
      const before = { fromTag: row.fromTag, toTag: row.toTag, [end]: previous };
      const oldKind = circuitKindFromEnds(endKind(t, before.fromTag), endKind(t, before.toTag));
      const newKind = circuitKindFromEnds(endKind(t, row.fromTag), endKind(t, row.toTag));
      const oldComplete = endKind(t, before.fromTag) !== undefined && endKind(t, before.toTag) !== undefined;
      if (newKind && (!oldComplete || row.kind === oldKind || row.kind === undefined)) set(`circuits.${i}.kind`, newKind);
      const arrayEnd = (r: Row) => [r.fromTag, r.toTag].find((tag) => endKind(t, tag) === "array") as string | undefined;
      const oldArray = arrayEnd(before);
      const newArray = arrayEnd(row);
      if (newArray && (row.arrayTag === undefined || row.arrayTag === "" || row.arrayTag === oldArray)) set(`circuits.${i}.arrayTag`, newArray);
      else if (!newArray && oldArray && row.arrayTag === oldArray) set(`circuits.${i}.arrayTag`, undefined);
    };
    const followInsulation = (i: number, value: unknown, previous: unknown) => {
      const rating = insulationRatingFor(typeof value === "string" ? value : undefined);
      const current = getValues(`circuits.${i}.insulationTempRatingC`) as unknown;
      const before = insulationRatingFor(typeof previous === "string" ? previous : undefined);
      if (rating !== undefined && (current === undefined || current === before)) set(`circuits.${i}.insulationTempRatingC`, rating);
    };
    return circuitColumns(tags).map((c) => {
      if (c.key === "fromTag" || c.key === "toTag") {
        const end = c.key;
        return { ...c, width: "w-24", onValueChange: (i: number, _v: unknown, previous: unknown) => followEnds(i, end, previous) };
      }
      if (c.key === "insulation") return { ...c, onValueChange: (i: number, v: unknown, previous: unknown) => followInsulation(i, v, previous) };
      return c;
    });
  }, [tags, getValues, setValue]);

  const primary = CIRCUIT_PRIMARY_KEYS.map((k) => columns.find((c) => c.key === k)!);
  const detail = columns.filter((c) => !(CIRCUIT_PRIMARY_KEYS as readonly string[]).includes(c.key));

  /** The library's smallest fuse or breaker of the right current type between the minimum and what the conductor allows. */
  const libraryDevice = (s: CircuitSuggestion, side: "dc" | "ac"): LibraryDevice | undefined =>
    (library.data ?? [])
      .filter((d) => {
        const a = d.ratings.ratingA;
        return typeof a === "number" && a >= (s.ocpdA ?? Infinity) && a <= (s.maxOcpdA ?? s.ocpdA ?? 0) && (d.ratings.currentType === side || d.ratings.currentType === "ac-dc");
      })
      .sort((a, b) => Number(a.ratings.ratingA) - Number(b.ratings.ratingA))[0];

  const addDevice = (i: number, s: CircuitSuggestion, side: "dc" | "ac") => {
    const rows = (getValues("equipment") ?? []) as Row[];
    const all = [...tagsRef.current.all];
    const kind: EquipmentKind = side === "dc" ? "fuse" : "breaker";
    const ampere = s.ocpdA!;
    const fromLibrary = libraryDevice(s, side);
    const deviceKind = fromLibrary?.kind ?? kind;
    const tag = nextTag(TAG_PREFIX[deviceKind], all);
    const device: Row = fromLibrary
      ? {
          ...changeKind({ quantity: 1, listing: "" }, deviceKind),
          ...fromLibrary.ratings,
          kind: deviceKind,
          manufacturer: fromLibrary.manufacturer,
          model: fromLibrary.model,
          libraryItemId: fromLibrary.id,
          quantity: 1,
          tag,
        }
      : { ...changeKind({ quantity: 1, listing: "", manufacturer: "", model: "" }, deviceKind), tag, ratingA: ampere, currentType: side };
    setValue("equipment", [...rows, device], { shouldDirty: true, shouldValidate: true });
    setValue(`circuits.${i}.ocpdTag`, tag, { shouldDirty: true, shouldValidate: true });
  };

  const cellExtra = (key: string, i: number) => {
    const row = circuits[i] ?? {};
    const tag = typeof row.tag === "string" ? row.tag : "";
    const s = suggestions.get(tag);
    const set = (path: string, value: unknown) => setValue(path, value, { shouldDirty: true, shouldValidate: true });
    switch (key) {
      case "kind": {
        const derived = circuitKindFromEnds(endKind(tags, row.fromTag), endKind(tags, row.toTag));
        return derived && derived === row.kind ? <Hint>derived from the ends</Hint> : null;
      }
      case "arrayTag":
        return row.arrayTag && (row.arrayTag === row.fromTag || row.arrayTag === row.toTag) ? <Hint>derived from the ends</Hint> : null;
      case "insulationTempRatingC": {
        const r = insulationRatingFor(typeof row.insulation === "string" ? row.insulation : undefined);
        return r !== undefined && r === row.insulationTempRatingC ? <Hint>derived from {String(row.insulation)}</Hint> : null;
      }
      case "size":
        if (!s?.size || s.size === row.size) return s?.size ? <Hint>as suggested</Hint> : null;
        return <Accept label={`suggested ${conductorSizeText(s.size)}`} title={s.basis} onClick={() => set(`circuits.${i}.size`, s.size)} />;
      case "egcSize":
        if (!s?.egcSize || s.egcSize === row.egcSize) return s?.egcSize ? <Hint>as suggested (Table 250.122)</Hint> : null;
        return <Accept label={`suggested ${conductorSizeText(s.egcSize)}`} title={`Table 250.122 for a ${s.ocpdA} A device`} onClick={() => set(`circuits.${i}.egcSize`, s.egcSize)} />;
      case "ocpdTag": {
        if (!s?.ocpdA) return null;
        if (s.ocpdRequired === false && !row.ocpdTag) return <Hint>none needed (690.9(A))</Hint>;
        const fits = (a: unknown) => typeof a === "number" && a >= s.ocpdA! && a <= (s.maxOcpdA ?? s.ocpdA!);
        const current = equipment.find((e) => e.tag === row.ocpdTag);
        if (current && fits(current.ratingA)) return <Hint>as suggested</Hint>;
        const side = s.side ?? "ac";
        const free = equipment.find(
          (e) =>
            (e.kind === "fuse" || e.kind === "breaker") &&
            fits(e.ratingA) &&
            (e.currentType === undefined || e.currentType === side || e.currentType === "ac-dc") &&
            !circuits.some((c) => c.ocpdTag === e.tag),
        );
        if (free) {
          return <Accept label={`use ${String(free.tag)} · ${String(free.ratingA)} A`} title={s.basis} onClick={() => set(`circuits.${i}.ocpdTag`, free.tag)} />;
        }
        const item = libraryDevice(s, side);
        const rating = item ? Number(item.ratings.ratingA) : s.ocpdA;
        return (
          <Accept
            label={`add ${rating} A ${item ? item.kind : side === "dc" ? "fuse" : "breaker"}`}
            title={item ? `${item.manufacturer} ${item.model} from the library; ${s.basis}` : s.basis}
            onClick={() => addDevice(i, s, side)}
          />
        );
      }
      default:
        return null;
    }
  };

  return (
    <Section id="circuits" title="Circuits" sheet="A · 5">
      <p className="mb-2 text-xs text-ink-faint">
        One row per circuit, one-way length. The kind follows from the two ends; suggested sizes come from the checks&apos; own figures. Open a row
        (▸) for its conductor, raceway and current fields.
      </p>
      <EditableGrid
        name="circuits"
        label="Circuits"
        noun="circuit"
        columns={primary}
        detailColumns={detail}
        cellExtra={cellExtra}
        trailing={{
          header: "Result",
          cell: (i) => {
            const tag = circuits[i]?.tag;
            const statuses = typeof tag === "string" ? results.get(tag) : undefined;
            return statuses?.length ? <StatusBadge compact status={worst(...statuses)} /> : <span className="text-xs text-ink-faint">—</span>;
          },
        }}
        newRow={() => ({
          tag: nextTag("C", tags.all),
          fromTag: "",
          toTag: "",
          kind: "pv-source",
          material: "cu",
          parallelSets: 1,
          insulation: "",
          racewayType: "",
          racewaySize: "",
          onRooftop: false,
          disconnectTags: [],
          egcMaterial: "cu",
        })}
        duplicateRow={(row) => ({ ...row, tag: nextTag("C", tags.all) })}
      />
    </Section>
  );
}
