/**
 * The engine's output contract. Every consumer (live panel, packet, labels,
 * command line, route handlers) reads these types and nothing else.
 */
import type { NecEdition } from "../schemas/project-record";
import type { CheckStatus } from "../schemas/vocabulary";

// The statuses and their order are the product's vocabulary, shared with the packet and the pages.
export { CHECK_STATUSES, type CheckStatus } from "../schemas/vocabulary";

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
  /** The value the computation used because none was given (a default, never a pass for a required field). */
  defaultValue?: number | string | boolean;
  /** The field may be left empty; an empty one is not missing. */
  optional?: boolean;
}

/** One record field to set, as the remedy's one-click form applies it. */
export interface RemedyChange {
  /** Record path, e.g. "circuits.2.size". */
  path: string;
  value: number | string | boolean;
}

/**
 * The smallest change the engine found that makes a failing result pass (the
 * next conductor size, the next standard OCPD, the longest string that fits,
 * the missing device), with the figure that proves it.
 */
export interface Remedy {
  /** One or two lines a designer can act on, with the figure that makes it pass. */
  text: string;
  /** Field changes that carry the remedy out, when it is a change of record fields; empty when a person must act (add a device, choose a product). */
  changes: RemedyChange[];
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
  /** On every fail (and on some warnings): the change that makes it pass. */
  remedy?: Remedy;
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
