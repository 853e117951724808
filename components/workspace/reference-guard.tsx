"use client";

/**
 * Keeps references whole while a designer renames or deletes a tagged row:
 * a renamed tag is renamed wherever it is used, and deleting an item others
 * point at first names them and offers to remove or re-point the references.
 */
import { useState } from "react";
import { useFormContext } from "react-hook-form";
import { plural } from "@/lib/schemas/vocabulary";
import { referrersOf, repointReferences, type Referrer } from "./record-refs";

const REFERRING = ["arrays", "circuits", "attachments", "grounding"] as const;

interface Pending {
  tag: string;
  referrers: Referrer[];
  remove: () => void;
}

export function useReferenceGuard(name: string, noun: string) {
  const { getValues, setValue } = useFormContext();
  const [pending, setPending] = useState<Pending | null>(null);
  const [target, setTarget] = useState("");
  const [notice, setNotice] = useState("");

  const apply = (from: string, to: string | undefined) => {
    const values = getValues() as Record<string, unknown>;
    const next = repointReferences(values, from, to);
    for (const key of REFERRING) {
      if (next[key] !== values[key]) setValue(key, next[key], { shouldDirty: true, shouldValidate: true });
    }
  };

  const onCommit = (index: number, key: string, before: unknown, after: unknown) => {
    if (key !== "tag" || typeof before !== "string" || typeof after !== "string" || !before || !after) return;
    const rows = (getValues(name) ?? []) as { tag?: string }[];
    // Another row still carrying the old tag keeps its references.
    if (rows.some((r, i) => i !== index && r.tag === before)) return;
    const referrers = referrersOf(getValues() as Record<string, unknown>, before);
    if (!referrers.length) return;
    apply(before, after);
    setNotice(`Renamed ${before} to ${after} in ${plural(referrers.length, "place")}: ${referrers.map((r) => r.label).join(", ")}.`);
  };

  const onRequestRemove = (index: number, remove: () => void) => {
    const tag = String(getValues(`${name}.${index}.tag`) ?? "");
    const referrers = referrersOf(getValues() as Record<string, unknown>, tag).filter((r) => !r.path.startsWith(`${name}.${index}.`));
    if (!tag || !referrers.length) {
      remove();
      return;
    }
    setTarget("");
    setPending({ tag, referrers, remove });
  };

  const others = (): string[] => {
    const values = getValues() as Record<string, { tag?: string }[] | undefined>;
    return [...(values.equipment ?? []), ...(values.arrays ?? [])].map((r) => r.tag ?? "").filter((t) => t && t !== pending?.tag);
  };

  const dialog = pending ? (
    <div role="alertdialog" aria-labelledby={`${name}-delete-title`} className="mb-3 border-l-4 border-l-caution bg-caution-soft/40 px-3 py-2 text-sm">
      <p id={`${name}-delete-title`} className="font-semibold">
        {pending.tag} is used in {plural(pending.referrers.length, "place")}: {pending.referrers.map((r) => r.label).join(", ")}.
      </p>
      <div className="mt-2 flex flex-wrap items-center gap-2">
        <button
          type="button"
          className="btn-quiet"
          onClick={() => {
            apply(pending.tag, undefined);
            pending.remove();
            setPending(null);
          }}
        >
          Delete the {noun} and remove the references
        </button>
        <label className="inline-flex items-center gap-1">
          <span>or point them to</span>
          <select className="input w-32" aria-label="Point the references to" value={target} onChange={(e) => setTarget(e.target.value)}>
            <option value="">— choose —</option>
            {others().map((t) => (
              <option key={t} value={t}>
                {t}
              </option>
            ))}
          </select>
        </label>
        <button
          type="button"
          className="btn-quiet"
          disabled={!target}
          onClick={() => {
            apply(pending.tag, target);
            pending.remove();
            setPending(null);
          }}
        >
          Re-point and delete
        </button>
        <button type="button" className="btn-quiet" onClick={() => setPending(null)}>
          Keep the {noun}
        </button>
      </div>
    </div>
  ) : notice ? (
    <p role="status" className="mb-2 text-xs text-ink-soft">
      {notice}{" "}
      <button type="button" className="underline" onClick={() => setNotice("")}>
        Dismiss
      </button>
    </p>
  ) : null;

  return { onCommit, onRequestRemove, dialog };
}
