/**
 * The engine's output contract. Every consumer (live panel, packet, labels,
 * command line, route handlers) reads these types and nothing else.
 */
import type { NecEdition } from "../schemas/project-record";

export const CHECK_STATUSES = ["fail", "needs-input", "warning", "attest", "pass", "not-applicable"] as const;
export type CheckStatus = (typeof CHECK_STATUSES)[number];

/** A figure the check computed, with its unit ("" for a pure number or ratio). */
export interface CheckValue {
  key: string;
  label: string;
  value: number | string | boolean;
  unit: string;
}

/** A value the check read from the record; `path` points into the record ("circuits.2.lengthFt") so a UI can focus the field. */
export interface CheckInput {
  path: string;
  label: string;
  value: number | string | boolean | null;
  unit: string;
}

export interface CheckResult {
  /** Stable across runs of the same record: `${checkId}:${subject}` or `${checkId}`. */
  id: string;
  /** Catalogue id, e.g. "max-pv-voltage", "conductor-ampacity". */
  checkId: string;
  title: string;
  /** Tag of the circuit, array or equipment checked, when the check runs per item. */
  subject?: string;
  status: CheckStatus;
  /** One sentence a designer can act on. */
  message: string;
  /** Why not applicable / what is missing / why it fails, when status is not pass. */
  reason?: string;
  values: CheckValue[];
  /** The formula in words, with the numbers substituted where that helps. */
  formula: string;
  inputs: CheckInput[];
  /** Record paths of inputs that are missing, for needs-input. */
  missing: string[];
  /** Code references in the jurisdiction's edition, e.g. "NEC 2023 690.7(A)". At least one. */
  codeRefs: string[];
}

export interface CheckRunOptions {
  /** Overrides the jurisdiction's adopted edition. */
  edition?: NecEdition;
}

export interface CheckRun {
  edition: NecEdition;
  results: CheckResult[];
  counts: Record<CheckStatus, number>;
}
