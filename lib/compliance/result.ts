/** Builds results so every check reports the same fields in the same way. */
import type { CodeTopic } from "./tables";
import type { CheckInput, CheckResult, CheckStatus, CheckValue, Remedy } from "./types";

/** One entry of the catalogue: everything the product shows about a check lives here, with no fallbacks elsewhere. */
export interface CheckDefinition {
  /** Stable catalogue id, e.g. "max-pv-voltage"; result ids start with it. */
  id: string;
  title: string;
  /** What the check cites when the record holds nothing it applies to (it then reports "not applicable", never nothing). */
  scopeTopic: CodeTopic;
  /** The rule in words, shown where a result has no figures of its own (needs input, not applicable, presence checks). */
  formula: string;
  run(ctx: import("./context").CheckContext): CheckResult[];
}

/**
 * A remedy, or a function that computes it: searches (conductor sizes, string lengths) run only when the result
 * fails or warns. The function may find nothing to offer for a warning; every fail gets one (a test walks them).
 */
export type RemedySource = Remedy | (() => Remedy | undefined);

interface CommonParts {
  subject?: string;
  message: string;
  reason?: string;
  values?: CheckValue[];
  formula?: string;
  inputs?: CheckInput[];
  missing?: string[];
  codeRefs: string[];
}

/**
 * A fail must say how to make it pass, so the type asks for a remedy whenever the status may be "fail"; warnings
 * may offer one too (a larger conductor for voltage drop). Other statuses drop it.
 */
export type ResultParts = CommonParts &
  ({ status: "fail"; remedy: RemedySource } | { status: Exclude<CheckStatus, "fail">; remedy?: RemedySource });

function unique(list: string[]): string[] {
  const out: string[] = [];
  for (const x of list) if (!out.includes(x)) out.push(x);
  return out;
}

export function makeResult(def: Pick<CheckDefinition, "id" | "title">, parts: ResultParts): CheckResult {
  const subject = parts.subject;
  const r: CheckResult = {
    id: subject !== undefined ? `${def.id}:${subject}` : def.id,
    checkId: def.id,
    title: subject !== undefined ? `${def.title}: ${subject}` : def.title,
    status: parts.status,
    message: parts.message,
    values: parts.values ?? [],
    formula: parts.formula ?? "",
    inputs: parts.inputs ?? [],
    missing: parts.missing && parts.missing.length ? unique(parts.missing) : [],
    codeRefs: unique(parts.codeRefs),
  };
  if (subject !== undefined) r.subject = subject;
  if (parts.reason !== undefined) r.reason = parts.reason;
  if (parts.remedy !== undefined && (parts.status === "fail" || parts.status === "warning")) {
    const found = typeof parts.remedy === "function" ? parts.remedy() : parts.remedy;
    if (found !== undefined) r.remedy = found;
  }
  return r;
}

/** A needs-input result that names every missing field. */
export function needsInput(
  def: Pick<CheckDefinition, "id" | "title">,
  parts: Omit<CommonParts, "message"> & { message?: string; missing: string[] },
): CheckResult {
  const list = unique(parts.missing);
  return makeResult(def, {
    ...parts,
    status: "needs-input",
    message: parts.message ?? `Needs input: ${list.join(", ")}.`,
    reason: parts.reason ?? `missing ${list.join(", ")}`,
  });
}

export { worst } from "../schemas/vocabulary";
