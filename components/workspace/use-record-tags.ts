"use client";

import { useMemo } from "react";
import { useWatch } from "react-hook-form";
import type { Option } from "./field-control";

export interface Row {
  tag?: string;
  kind?: string;
  feedsTag?: string;
  mpptInputs?: { id?: string }[];
}

export interface RecordTags {
  all: Set<string>;
  equipment: Row[];
  arrays: Row[];
  byKinds: (kinds: readonly string[]) => Option[];
  equipmentAndArrays: Option[];
  arrayOptions: Option[];
  mpptInputsOf: (tag: string | undefined) => Option[];
}

/** Live tag lists for the selects that point from one row to another. */
export function useRecordTags(): RecordTags {
  const equipment = (useWatch({ name: "equipment" }) ?? []) as Row[];
  const arrays = (useWatch({ name: "arrays" }) ?? []) as Row[];
  const circuits = (useWatch({ name: "circuits" }) ?? []) as Row[];
  return useMemo(() => tagLists(equipment, arrays, circuits), [equipment, arrays, circuits]);
}

export function tagLists(equipment: Row[], arrays: Row[], circuits: Row[]): RecordTags {
  const opt = (r: Row, note?: string): Option => ({ value: r.tag ?? "", label: note ? `${r.tag} · ${note}` : (r.tag ?? "") });
  const named = (rows: Row[]) => rows.filter((r) => r.tag);
  return {
    all: new Set([...equipment, ...arrays, ...circuits].map((r) => r.tag ?? "").filter(Boolean)),
    equipment,
    arrays,
    byKinds: (kinds) => named(equipment).filter((e) => kinds.includes(e.kind ?? "")).map((e) => opt(e, e.kind)),
    equipmentAndArrays: [...named(arrays).map((a) => opt(a, "array")), ...named(equipment).map((e) => opt(e, e.kind))],
    arrayOptions: named(arrays).map((a) => opt(a)),
    mpptInputsOf: (tag) =>
      (equipment.find((e) => e.tag === tag)?.mpptInputs ?? []).filter((m) => m.id).map((m) => ({ value: m.id ?? "", label: m.id ?? "" })),
  };
}
