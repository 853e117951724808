import type { CheckValue, CheckInput } from "../compliance/types";
import { CHECK_STATUSES, STATUS_WORDS, type CheckStatus } from "../schemas/vocabulary";

/**
 * Each status is a word and a shape as well as a colour, so it survives grey-scale printing. The sheets set
 * the words in capitals, and "not applicable" as N/A to fit the narrow status column.
 */
export const STATUS_WORD = Object.fromEntries(
  CHECK_STATUSES.map((s) => [s, s === "not-applicable" ? "N/A" : STATUS_WORDS[s].toUpperCase()]),
) as Record<CheckStatus, string>;

export const STATUS_SHAPE: Record<CheckStatus, string> = {
  fail: "■",
  "needs-input": "○",
  warning: "▲",
  attest: "◆",
  pass: "✓",
  "not-applicable": "–",
};

export function statusLabel(status: CheckStatus): string {
  return `${STATUS_SHAPE[status]} ${STATUS_WORD[status]}`;
}

/** Figures as the engine gave them, trimmed to three decimals (the engine rounds its own results). */
export function formatNumber(value: number): string {
  if (!Number.isFinite(value)) return String(value);
  const rounded = Math.round(value * 1000) / 1000;
  return Object.is(rounded, -0) ? "0" : String(rounded);
}

export function formatValue(value: number | string | boolean | null, unit: string): string {
  if (value === null) return "— (missing)";
  const text = typeof value === "number" ? formatNumber(value) : typeof value === "boolean" ? (value ? "yes" : "no") : value;
  return unit ? `${text} ${unit}` : text;
}

/**
 * A value as the packet prints it. An input the engine filled with a default
 * says so ("default: 30 °C (no value given)"); an optional field left empty
 * reads "not given"; only a required field without a value reads "missing".
 */
export function formatCheckValue(v: CheckValue | CheckInput): string {
  if (v.value === null && "defaultValue" in v && v.defaultValue !== undefined) return `default: ${formatValue(v.defaultValue, v.unit)} (no value given)`;
  if (v.value === null && "optional" in v && v.optional) return "not given";
  return formatValue(v.value, v.unit);
}

export function isoDate(iso: string): string {
  return iso.slice(0, 10);
}

const MONTHS = ["January", "February", "March", "April", "May", "June", "July", "August", "September", "October", "November", "December"];

/**
 * A timestamp as a reader of the printed set reads it: "2 December 2026,
 * 14:20 UTC". The packet is rendered without a clock or a locale, so the zone
 * is stated rather than guessed.
 */
export function datedTime(iso: string): string {
  const d = new Date(iso);
  if (Number.isNaN(d.getTime())) return iso;
  const hh = String(d.getUTCHours()).padStart(2, "0");
  const mm = String(d.getUTCMinutes()).padStart(2, "0");
  return `${d.getUTCDate()} ${MONTHS[d.getUTCMonth()]} ${d.getUTCFullYear()}, ${hh}:${mm} UTC`;
}

export function dash(v: string | number | undefined | null, unit = ""): string {
  if (v === undefined || v === null || v === "") return "—";
  const text = typeof v === "number" ? formatNumber(v) : v;
  return unit ? `${text} ${unit}` : text;
}
