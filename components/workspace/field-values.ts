/** How a typed value becomes a record value and back; pure, shared by every control. */

export type FieldType =
  | "text"
  /** Free text with a pick-list of the usual values (insulation, raceway). */
  | "combo"
  | "textarea"
  | "number"
  | "integer"
  | "select"
  | "number-select"
  | "checkbox"
  | "tri-state"
  | "tags"
  /** Several values from a fixed list (the electrodes of a grounding system). */
  | "multi"
  | "numbers";

export interface Option {
  value: string;
  label: string;
}

/** Turns what the user typed into the record's value; zod then says what is wrong with it. */
export function parseInput(type: FieldType, raw: string | boolean, required = false): unknown {
  if (type === "checkbox") return Boolean(raw);
  const s = String(raw);
  switch (type) {
    case "number":
    case "integer":
    case "number-select": {
      const t = s.trim();
      if (t === "") return undefined;
      // NaN is kept so the schema refuses it with its range message.
      return Number(t);
    }
    case "select":
      return s === "" && !required ? undefined : s;
    case "tri-state":
      return s === "yes" ? true : s === "no" ? false : undefined;
    case "tags":
    case "multi":
      return s.split(/[,\s]+/).map((x) => x.trim()).filter(Boolean);
    case "numbers":
      return s
        .split(/[,\s]+/)
        .map((x) => x.trim())
        .filter(Boolean)
        .map(Number);
    default:
      return s;
  }
}

export function formatValue(type: FieldType, value: unknown): string {
  if (value === undefined || value === null) return "";
  if (type === "tri-state") return value === true ? "yes" : value === false ? "no" : "";
  if (type === "tags" || type === "multi" || type === "numbers") return Array.isArray(value) ? value.join(", ") : "";
  if (typeof value === "number" && Number.isNaN(value)) return "";
  return String(value);
}

export function sameValue(a: unknown, b: unknown): boolean {
  if (Object.is(a, b)) return true;
  if (typeof a === "object" || typeof b === "object") return JSON.stringify(a) === JSON.stringify(b);
  return false;
}

