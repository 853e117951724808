"use client";

/**
 * One editable value of the project record, bound to the form by its record
 * path ("circuits.2.lengthFt"). The same control draws a grid cell and a
 * labelled form field, so parsing, error display and focus-by-path agree.
 */
import { useEffect, useId, useState, type KeyboardEvent } from "react";
import { useController, useFormContext } from "react-hook-form";
import { formatValue, parseInput, sameValue, type FieldType, type Option } from "./field-values";

export type { FieldType, Option } from "./field-values";

export interface FieldControlProps {
  path: string;
  type: FieldType;
  label: string;
  options?: Option[];
  required?: boolean;
  /** Shown as placeholder in a grid cell, e.g. the unit. */
  placeholder?: string;
  className?: string;
  describedBy?: string;
  /** Grid coordinates for keyboard movement between cells. */
  grid?: { name: string; row: number; col: number };
  /** Told after a change by the designer, with the value before it. */
  onValueChange?: (value: unknown, previous: unknown) => void;
  onKeyDown?: (e: KeyboardEvent<HTMLElement>) => void;
  hideLabel?: boolean;
}

export function useFieldError(path: string): string | undefined {
  const { getFieldState, formState } = useFormContext();
  return getFieldState(path, formState).error?.message;
}

export function FieldControl({
  path,
  type,
  label,
  options = [],
  required,
  placeholder,
  className = "",
  describedBy,
  grid,
  onValueChange,
  onKeyDown,
}: FieldControlProps) {
  const { field, fieldState } = useController({ name: path });
  const [draft, setDraft] = useState(() => formatValue(type, field.value));
  const value: unknown = field.value;
  // A change from outside (reset, duplicate, Escape, library pick) replaces what is shown.
  useEffect(() => {
    setDraft((d) => (sameValue(parseInput(type, d, required), value) ? d : formatValue(type, value)));
  }, [value, type, required]);
  const errorId = useId();
  const error = fieldState.error?.message;
  const common = {
    id: grid ? undefined : path,
    name: path,
    "aria-label": label,
    "aria-invalid": error ? true : undefined,
    "aria-describedby": [error ? errorId : "", describedBy ?? ""].filter(Boolean).join(" ") || undefined,
    "data-grid": grid?.name,
    "data-row": grid?.row,
    "data-col": grid?.col,
    onBlur: field.onBlur,
    onKeyDown,
    ref: field.ref,
  };
  const change = (raw: string | boolean) => {
    if (typeof raw === "string") setDraft(raw);
    const next = parseInput(type, raw, required);
    const previous: unknown = field.value;
    field.onChange(next);
    onValueChange?.(next, previous);
  };
  let control: React.ReactNode;
  if (type === "checkbox") {
    control = (
      <input
        {...common}
        type="checkbox"
        className={`h-4 w-4 accent-slate ${className}`}
        checked={Boolean(value)}
        onChange={(e) => change(e.target.checked)}
      />
    );
  } else if (type === "select" || type === "number-select" || type === "tri-state") {
    const opts: Option[] =
      type === "tri-state"
        ? [
            { value: "", label: "not stated" },
            { value: "yes", label: "yes" },
            { value: "no", label: "no" },
          ]
        : options;
    const known = opts.some((o) => o.value === draft);
    control = (
      <select {...common} className={`input ${className}`} value={draft} onChange={(e) => change(e.target.value)}>
        {type !== "tri-state" && !opts.some((o) => o.value === "") ? <option value="">{required ? "— choose —" : "—"}</option> : null}
        {!known && draft !== "" ? <option value={draft}>{draft} (not found)</option> : null}
        {opts.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
    );
  } else if (type === "multi") {
    const chosen = draft.split(/[,\s]+/).filter(Boolean);
    control = (
      <select
        {...common}
        multiple
        size={Math.min(Math.max(options.length, 2), 7)}
        className={`input ${className}`}
        value={chosen}
        onChange={(e) => change(Array.from(e.target.selectedOptions, (o) => o.value).join(", "))}
      >
        {options.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
    );
  } else if (type === "textarea") {
    control = (
      <textarea {...common} className={`input ${className}`} rows={2} value={draft} placeholder={placeholder} onChange={(e) => change(e.target.value)} />
    );
  } else if (type === "combo") {
    const listId = `${errorId}-list`;
    control = (
      <>
        <input
          {...common}
          type="text"
          list={listId}
          autoComplete="off"
          className={`input ${className}`}
          value={draft}
          placeholder={placeholder}
          onChange={(e) => change(e.target.value)}
        />
        <datalist id={listId}>
          {options.map((o) => (
            <option key={o.value} value={o.value}>
              {o.label}
            </option>
          ))}
        </datalist>
      </>
    );
  } else {
    const numeric = type === "number" || type === "integer";
    control = (
      <input
        {...common}
        type="text"
        inputMode={numeric ? (type === "integer" ? "numeric" : "decimal") : undefined}
        autoComplete="off"
        spellCheck={numeric ? false : undefined}
        className={`input ${numeric ? "figure text-right" : ""} ${className}`}
        value={draft}
        placeholder={placeholder}
        onChange={(e) => change(e.target.value)}
      />
    );
  }
  return (
    <>
      {control}
      {error ? (
        <span id={errorId} role="alert" className="mt-0.5 block text-xs font-medium leading-tight text-signal">
          {error}
        </span>
      ) : null}
    </>
  );
}

/** A labelled form field: label, control, the help that says where a value usually comes from. */
export function FormField({
  help,
  unit,
  wide,
  ...props
}: FieldControlProps & { help?: React.ReactNode; unit?: string; wide?: boolean }) {
  const helpId = useId();
  return (
    <div className={wide ? "sm:col-span-2" : ""}>
      <label htmlFor={props.path} className="field-label mb-1 block">
        {props.label}
        {unit ? <span className="ml-1 normal-case tracking-normal text-ink-faint">({unit})</span> : null}
      </label>
      <FieldControl {...props} label={unit ? `${props.label} (${unit})` : props.label} describedBy={help ? helpId : undefined} />
      {help ? (
        <p id={helpId} className="mt-1 text-xs leading-snug text-ink-faint">
          {help}
        </p>
      ) : null}
    </div>
  );
}
