"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useEffect, useId, useMemo, useRef, useState } from "react";
import { useFieldArray, useForm, type FieldErrors, type Resolver } from "react-hook-form";
import { readNumberCell } from "@/lib/equipment-csv/cells";
import { fetchJson, RequestError } from "@/lib/fetch-json";
import {
  KIND_LABELS,
  librarySchemaForKind,
  mpptInputFields,
  ratingFieldsForKind,
  type EquipmentKind,
  type LibraryItemView,
  type RatingField,
} from "@/lib/schemas/library-item";

type MpptRow = Record<string, string>;
/** What the inputs hold: text as typed (numbers are read on validation, so "49.5 V" is refused in words), booleans, MPPT rows. */
type FormValues = Record<string, string | boolean | MpptRow[]>;

function blankValues(fields: RatingField[]): FormValues {
  const v: FormValues = { manufacturer: "", model: "" };
  for (const f of fields) v[f.name] = f.type === "boolean" ? false : f.type === "mppt-inputs" ? [] : "";
  return v;
}

function valuesFromItem(item: LibraryItemView, fields: RatingField[]): FormValues {
  const v = blankValues(fields);
  v.manufacturer = item.manufacturer;
  v.model = item.model;
  for (const f of fields) {
    const r = item.ratings[f.name];
    if (r === undefined || r === null) continue;
    if (f.type === "boolean") v[f.name] = r === true;
    else if (f.type === "number-list") v[f.name] = Array.isArray(r) ? r.join("; ") : "";
    else if (f.type === "mppt-inputs")
      v[f.name] = Array.isArray(r)
        ? r.map((m: Record<string, unknown>) => Object.fromEntries(Object.entries(m).map(([k, x]) => [k, x === undefined ? "" : String(x)])))
        : [];
    else v[f.name] = String(r);
  }
  return v;
}

/** Typed candidate for the schema, and the refusals of text that is not a plain number. */
function toCandidate(kind: EquipmentKind, values: FormValues, fields: RatingField[]) {
  const candidate: Record<string, unknown> = { kind, manufacturer: values.manufacturer, model: values.model };
  const errors: Record<string, string> = {};
  const mpptFields = mpptInputFields();
  for (const f of fields) {
    const raw = values[f.name];
    if (f.type === "boolean") candidate[f.name] = raw === true;
    else if (f.type === "mppt-inputs") {
      candidate[f.name] = ((raw as MpptRow[] | undefined) ?? []).map((row, i) => {
        const out: Record<string, unknown> = {};
        for (const m of mpptFields) {
          const text = (row[m.name] ?? "").trim();
          if (text === "") continue;
          if (m.type === "text") out[m.name] = text;
          else {
            const n = readNumberCell(text, m.unitWords);
            if (n.ok) out[m.name] = n.value;
            else errors[`${f.name}.${i}.${m.name}`] = n.message;
          }
        }
        return out;
      });
    } else {
      const text = typeof raw === "string" ? raw.trim() : "";
      if (text === "") continue;
      if (f.type === "number" || f.type === "integer") {
        const n = readNumberCell(text, f.unitWords);
        if (n.ok) candidate[f.name] = n.value;
        else errors[f.name] = n.message;
      } else if (f.type === "number-list") {
        const parts = text.split(/[;,/\s]+/).filter(Boolean).map((p) => readNumberCell(p, f.unitWords));
        if (parts.every((p) => p.ok)) candidate[f.name] = parts.map((p) => (p.ok ? p.value : 0));
        else errors[f.name] = `write the numbers only, separated by semicolons, in ${f.unitWords} (e.g. 12; 24; 48)`;
      } else candidate[f.name] = text;
    }
  }
  return { candidate, errors };
}

function setPath(target: Record<string, unknown>, path: string, message: string) {
  const keys = path.split(".");
  let node = target;
  keys.forEach((k, i) => {
    if (i === keys.length - 1) node[k] = { type: "validate", message };
    else {
      node[k] = (node[k] as Record<string, unknown> | undefined) ?? (/^\d+$/.test(keys[i + 1] ?? "") ? [] : {});
      node = node[k] as Record<string, unknown>;
    }
  });
}

function firstMessage(error: unknown, depth = 0): string | undefined {
  // Field errors carry `ref` (the DOM input); never walk into it, and stop at the depth of an MPPT row's field.
  if (!error || typeof error !== "object" || depth > 3) return undefined;
  const e = error as { message?: unknown };
  if (typeof e.message === "string" && e.message) return e.message;
  for (const [k, v] of Object.entries(error)) {
    if (k === "ref") continue;
    const m = firstMessage(v, depth + 1);
    if (m) return m;
  }
  return undefined;
}

function errorAt(errors: FieldErrors<FormValues>, path: string): string | undefined {
  let node: unknown = errors;
  for (const k of path.split(".")) node = (node as Record<string, unknown> | undefined)?.[k];
  return firstMessage(node);
}

/** "a PV module", "an inverter", "an AC panel": the label keeps its capitals after the first word. */
function withArticle(label: string): string {
  const [first = "", ...rest] = label.split(" ");
  const word = /^[A-Z]{2,}/.test(first) ? first : first.toLowerCase();
  const article = /^[aeio]/i.test(word) || /^(AC|RS)/.test(word) ? "an" : "a";
  return [article, word, ...rest].join(" ");
}

export interface ItemFormProps {
  kind: EquipmentKind;
  /** Present when editing; absent when adding. */
  item?: LibraryItemView;
  onSaved: (item: LibraryItemView) => void;
  onCancel: () => void;
  onReload?: () => void;
  /** Told when the form gains or loses unsaved changes, so the page can ask before discarding them. */
  onDirtyChange?: (dirty: boolean) => void;
}

/** Adds or edits one library item; every rating shows its unit, its allowed range and where the value usually comes from. */
export function ItemForm({ kind, item, onSaved, onCancel, onReload, onDirtyChange }: ItemFormProps) {
  const uid = useId();
  const fields = useMemo(() => ratingFieldsForKind(kind), [kind]);
  const [serverError, setServerError] = useState<{ message: string; conflict: boolean } | null>(null);
  const headingRef = useRef<HTMLHeadingElement>(null);

  const resolver = useMemo<Resolver<FormValues, unknown, Record<string, unknown>>>(() => {
    const schemaResolver = zodResolver(librarySchemaForKind(kind)) as unknown as Resolver<Record<string, unknown>, unknown, Record<string, unknown>>;
    return async (values, context, options) => {
      const { candidate, errors } = toCandidate(kind, values, fields);
      const result = await schemaResolver(candidate, context, options as never);
      const merged: Record<string, unknown> = { ...(result.errors as Record<string, unknown>) };
      for (const [path, message] of Object.entries(errors)) setPath(merged, path, message);
      if (Object.keys(merged).length) return { values: {}, errors: merged as FieldErrors<FormValues> };
      return { values: result.values as Record<string, unknown>, errors: {} };
    };
  }, [kind, fields]);

  const form = useForm<FormValues, unknown, Record<string, unknown>>({
    resolver,
    defaultValues: item ? valuesFromItem(item, fields) : blankValues(fields),
    mode: "onBlur",
    reValidateMode: "onChange",
  });
  const { register, handleSubmit, formState, setError } = form;
  const mppt = useFieldArray({ control: form.control, name: "mpptInputs" as never });

  useEffect(() => {
    headingRef.current?.focus();
  }, []);

  const dirty = formState.isDirty;
  useEffect(() => {
    onDirtyChange?.(dirty);
    if (!dirty) return;
    const warn = (event: BeforeUnloadEvent) => event.preventDefault();
    window.addEventListener("beforeunload", warn);
    return () => window.removeEventListener("beforeunload", warn);
  }, [dirty, onDirtyChange]);
  useEffect(() => () => onDirtyChange?.(false), [onDirtyChange]);

  const onSubmit = handleSubmit(async (data) => {
    setServerError(null);
    try {
      const saved = item
        ? await fetchJson<{ item: LibraryItemView }>(`/api/library/${item.id}`, {
            method: "PATCH",
            headers: { "content-type": "application/json" },
            body: JSON.stringify({ version: item.version, item: data }),
          })
        : await fetchJson<{ item: LibraryItemView }>("/api/library", {
            method: "POST",
            headers: { "content-type": "application/json" },
            body: JSON.stringify(data),
          });
      onSaved(saved.item);
    } catch (error) {
      if (error instanceof RequestError) {
        for (const issue of error.issues) setError(issue.path as never, { type: "server", message: issue.message });
        setServerError({ message: error.message, conflict: error.status === 409 });
      } else {
        setServerError({ message: "The item could not be saved. Check the connection and try again.", conflict: false });
      }
    }
  });

  const fieldId = (name: string) => `${uid}-${name}`;
  const errorCount = Object.keys(formState.errors).length;

  function renderField(f: RatingField) {
    const id = fieldId(f.name);
    const error = errorAt(formState.errors, f.name);
    const helpId = `${id}-help`;
    const errId = `${id}-err`;
    const describedBy = [helpId, error ? errId : ""].filter(Boolean).join(" ");
    const label = (
      <label htmlFor={id} className="field-label">
        {f.label}
        {f.unit ? " " : null}
        {f.unit ? <span className="figure normal-case tracking-normal text-ink-faint">({f.unit})</span> : null}
      </label>
    );
    const help = (
      <p id={helpId} className="mt-0.5 text-xs text-ink-faint">
        {f.help}
        {f.range ? ` Allowed ${f.range.replace(/^between (\S+) and /, "$1 to ")}.` : ""}
        <span className="figure ml-1 text-[0.7rem] text-ink-faint/80">{f.name}</span>
      </p>
    );
    const err = error ? (
      <p id={errId} className="mt-0.5 text-xs font-medium text-signal">
        <span aria-hidden="true">■ </span>
        {error}
      </p>
    ) : null;
    if (f.type === "boolean") {
      return (
        <div key={f.name} className="flex flex-col justify-end">
          <label htmlFor={id} className="inline-flex items-center gap-2 text-sm">
            <input id={id} type="checkbox" aria-describedby={describedBy} {...register(f.name)} />
            {f.label}
          </label>
          {help}
          {err}
        </div>
      );
    }
    if (f.type === "enum") {
      return (
        <div key={f.name}>
          {label}
          <select id={id} className="input mt-1" aria-invalid={error ? true : undefined} aria-describedby={describedBy} {...register(f.name)}>
            <option value="">— not recorded —</option>
            {f.options?.map((o) => (
              <option key={o} value={o}>
                {o}
              </option>
            ))}
          </select>
          {help}
          {err}
        </div>
      );
    }
    const numeric = f.type === "number" || f.type === "integer";
    return (
      <div key={f.name} className={f.name === "listing" || f.name === "controls" ? "sm:col-span-2" : undefined}>
        {label}
        <div className="mt-1 flex items-stretch">
          <input
            id={id}
            type="text"
            inputMode={numeric ? "decimal" : undefined}
            autoComplete="off"
            className={`input ${numeric ? "figure text-right" : ""} ${f.unit ? "rounded-r-none" : ""}`}
            aria-invalid={error ? true : undefined}
            aria-describedby={describedBy}
            {...register(f.name)}
          />
          {f.unit ? (
            <span aria-hidden="true" className="figure flex min-w-[3.2rem] items-center justify-center border border-l-0 border-rule bg-paper px-2 text-xs text-ink-soft">
              {f.unit}
            </span>
          ) : null}
        </div>
        {help}
        {err}
      </div>
    );
  }

  const mpptField = fields.find((f) => f.type === "mppt-inputs");
  const plainFields = fields.filter((f) => f.type !== "mppt-inputs" && f.name !== "listing");
  const listingField = fields.find((f) => f.name === "listing");

  return (
    <form onSubmit={onSubmit} noValidate className="sheet p-4" aria-labelledby={`${uid}-title`}>
      <div className="mb-3 flex flex-wrap items-baseline justify-between gap-2 border-b border-rule pb-2">
        <h2 id={`${uid}-title`} ref={headingRef} tabIndex={-1} className="text-base font-semibold">
          {item ? `Edit ${item.manufacturer} ${item.model}` : `Add ${withArticle(KIND_LABELS[kind])}`}
        </h2>
        <p className="text-xs text-ink-faint">Numbers only in the boxes; the unit is beside each. Empty means not recorded.</p>
      </div>
      <div className="grid gap-x-4 gap-y-3 sm:grid-cols-2 lg:grid-cols-4">
        {(["manufacturer", "model"] as const).map((name) => {
          const id = fieldId(name);
          const error = errorAt(formState.errors, name);
          return (
            <div key={name}>
              <label htmlFor={id} className="field-label">
                {name === "manufacturer" ? "Manufacturer" : "Model"} <span className="text-signal" aria-hidden="true">*</span>
              </label>
              <input
                id={id}
                className="input mt-1"
                autoComplete="off"
                aria-required="true"
                aria-invalid={error ? true : undefined}
                aria-describedby={error ? `${id}-err` : undefined}
                {...register(name)}
              />
              {error ? (
                <p id={`${id}-err`} className="mt-0.5 text-xs font-medium text-signal">
                  <span aria-hidden="true">■ </span>
                  {error}
                </p>
              ) : null}
            </div>
          );
        })}
        {listingField ? renderField(listingField) : null}
      </div>
      <h3 className="field-label mt-5 mb-2 border-b border-grid pb-1">Ratings</h3>
      <div className="grid gap-x-4 gap-y-3 sm:grid-cols-2 lg:grid-cols-4">{plainFields.map(renderField)}</div>

      {mpptField ? (
        <fieldset className="mt-5">
          <legend className="field-label mb-1">{mpptField.label}</legend>
          <p className="mb-2 text-xs text-ink-faint">{mpptField.help} Leave none for an inverter without PV inputs.</p>
          {mppt.fields.length ? (
            <table className="data-table" aria-label="MPPT inputs">
              <thead>
                <tr>
                  {mpptInputFields().map((m) => (
                    <th key={m.name}>
                      {m.label}
                      {m.unit ? ` (${m.unit})` : ""}
                    </th>
                  ))}
                  <th />
                </tr>
              </thead>
              <tbody>
                {mppt.fields.map((row, i) => (
                  <tr key={row.id}>
                    {mpptInputFields().map((m) => {
                      const path = `mpptInputs.${i}.${m.name}`;
                      const error = errorAt(formState.errors, path);
                      const id = fieldId(path);
                      return (
                        <td key={m.name}>
                          <label htmlFor={id} className="sr-only">
                            Input {i + 1} {m.label}
                          </label>
                          <input
                            id={id}
                            className={`input ${m.type === "text" ? "" : "figure text-right"}`}
                            inputMode={m.type === "text" ? undefined : "decimal"}
                            autoComplete="off"
                            aria-invalid={error ? true : undefined}
                            aria-describedby={error ? `${id}-err` : undefined}
                            {...register(path as never)}
                          />
                          {error ? (
                            <p id={`${id}-err`} className="mt-0.5 text-xs text-signal">
                              {error}
                            </p>
                          ) : null}
                        </td>
                      );
                    })}
                    <td>
                      <button type="button" className="btn-quiet" onClick={() => mppt.remove(i)}>
                        Remove
                      </button>
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          ) : null}
          <button
            type="button"
            className="btn-quiet mt-2"
            onClick={() => mppt.append({ id: String.fromCharCode(65 + mppt.fields.length) } as never)}
          >
            Add an MPPT input
          </button>
        </fieldset>
      ) : null}

      <div className="mt-5 flex flex-wrap items-center gap-3 border-t border-rule pt-3">
        <button type="submit" className="btn" disabled={formState.isSubmitting}>
          {formState.isSubmitting ? "Saving…" : item ? "Save changes" : "Add to library"}
        </button>
        <button type="button" className="btn-quiet" onClick={onCancel}>
          Cancel
        </button>
        {errorCount > 0 && formState.submitCount > 0 && !serverError ? (
          <p role="alert" className="text-sm text-signal">
            <span aria-hidden="true">■ </span>
            {errorCount === 1 ? "One field needs attention" : `${errorCount} fields need attention`}; nothing was saved.
          </p>
        ) : null}
        {serverError ? (
          <div role="alert" className="text-sm text-signal">
            <span aria-hidden="true">■ </span>
            {serverError.message}
            {serverError.conflict && onReload ? (
              <button type="button" className="btn-quiet ml-2" onClick={onReload}>
                Reload the item
              </button>
            ) : null}
          </div>
        ) : null}
      </div>
    </form>
  );
}
