"use client";

import { useEffect, useId, useRef, useState } from "react";
import { NOTE_MAX_CHARS, type AttestDisposition } from "@/lib/schemas/review";

export type DispositionDraft = { disposition: "" | AttestDisposition; note: string };

export function NoteBox({ label, value, onChange, disabled, compact }: { label: string; value: string; onChange: (v: string) => void; disabled?: boolean; compact?: boolean }) {
  const id = useId();
  const [open, setOpen] = useState(value.length > 0);
  const ref = useRef<HTMLTextAreaElement>(null);
  useEffect(() => {
    if (value) setOpen(true);
  }, [value]);
  if (!open) {
    return (
      <button
        type="button"
        className={`btn-quiet text-sm ${compact ? "" : "mt-3"}`}
        disabled={disabled}
        onClick={() => {
          setOpen(true);
          requestAnimationFrame(() => ref.current?.focus());
        }}
        aria-label={`Add a note on ${label}`}
      >
        Add note
      </button>
    );
  }
  return (
    <div className={compact ? "mt-2 basis-full" : "mt-3"}>
      <label htmlFor={id} className="field-label mb-1 block">
        Note on {label}
      </label>
      <textarea
        id={id}
        ref={ref}
        className="input min-h-20 w-full text-sm leading-relaxed"
        value={value}
        maxLength={NOTE_MAX_CHARS}
        disabled={disabled}
        onChange={(e) => onChange(e.target.value)}
        onBlur={() => {
          if (!value.trim()) setOpen(false);
        }}
      />
    </div>
  );
}

/** The reviewer's disposition of one attest item: accepted on a stated basis, or returned to the designer. */
export function DispositionControl({ label, value, onChange, disabled }: { label: string; value: DispositionDraft; onChange: (v: DispositionDraft) => void; disabled?: boolean }) {
  const id = useId();
  const needsNote = value.disposition === "accepted" && !value.note.trim();
  return (
    <fieldset className="mt-3 border-l-4 border-l-brass pl-3" aria-label={`Disposition of ${label}`}>
      <legend className="field-label mb-1">Your disposition</legend>
      <div className="flex flex-wrap gap-4 text-sm">
        {(["accepted", "returned"] as const).map((d) => (
          <label key={d} className="flex items-center gap-1.5">
            <input type="radio" name={`${id}-disposition`} value={d} checked={value.disposition === d} disabled={disabled} onChange={() => onChange({ ...value, disposition: d })} />
            {d === "accepted" ? "Accept" : "Return"}
          </label>
        ))}
      </div>
      {value.disposition ? (
        <div className="mt-2">
          <label htmlFor={`${id}-note`} className="field-label mb-1 block">
            {value.disposition === "accepted" ? "On what basis you accept it" : "Why it goes back (optional)"}
          </label>
          <textarea
            id={`${id}-note`}
            className="input min-h-16 w-full text-sm"
            value={value.note}
            maxLength={NOTE_MAX_CHARS}
            disabled={disabled}
            aria-invalid={needsNote || undefined}
            onChange={(e) => onChange({ ...value, note: e.target.value })}
          />
          {needsNote ? <p className="mt-1 text-xs text-signal">An accepted item needs a note saying on what basis.</p> : null}
        </div>
      ) : null}
    </fieldset>
  );
}
