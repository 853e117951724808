/**
 * Sundocket's check engine: a project record in, traceable results out.
 * Pure and deterministic — no framework, database, file system, clock or
 * randomness — so the live panel, the packet, the command line and the route
 * handlers all get the same answer. The results are an aid for the designer
 * and the licensed reviewer; the AHJ and licensed practice decide.
 */
import { formatIssues } from "../schemas/fields";
import { projectRecordSchema, type NecEdition, type ProjectRecord } from "../schemas/project-record";
import { buildContext } from "./context";
import { CHECK_FORMULAS, CHECKS, SCOPE_TOPIC } from "./registry";
import { makeResult } from "./result";
import { codeRef } from "./tables";
import { CHECK_STATUSES, type CheckResult, type CheckRun, type CheckRunOptions, type CheckStatus } from "./types";

export type { CheckInput, CheckResult, CheckRun, CheckRunOptions, CheckStatus, CheckValue } from "./types";
export { CHECK_STATUSES } from "./types";
export { loadSummary, type LoadSummary } from "./load-summary";
export { CHECKS } from "./registry";

const SEVERITY: Record<CheckStatus, number> = Object.fromEntries(CHECK_STATUSES.map((s, i) => [s, i])) as Record<CheckStatus, number>;

export function runChecks(record: ProjectRecord, options: CheckRunOptions = {}): CheckRun {
  const edition: NecEdition = options.edition ?? record.jurisdiction.necEdition;
  const ctx = buildContext(record, edition);
  const tagged: { r: CheckResult; order: number; seq: number }[] = [];
  let seq = 0;
  CHECKS.forEach((check, order) => {
    const results = check.run(ctx);
    if (results.length === 0) {
      results.push(
        makeResult(check, {
          status: "not-applicable",
          message: "Nothing in the record that this check applies to.",
          reason: "the record holds no item of the kind this check covers",
          codeRefs: [codeRef(edition, SCOPE_TOPIC[check.id] ?? "listing-use")],
        }),
      );
    }
    for (const r of results) {
      if (r.formula === "") r.formula = CHECK_FORMULAS[check.id] ?? "";
      tagged.push({ r, order, seq: seq++ });
    }
  });
  tagged.sort((a, b) => SEVERITY[a.r.status] - SEVERITY[b.r.status] || a.order - b.order || a.seq - b.seq);
  const counts = Object.fromEntries(CHECK_STATUSES.map((s) => [s, 0])) as Record<CheckStatus, number>;
  for (const { r } of tagged) counts[r.status] += 1;
  return { edition, results: tagged.map((x) => x.r), counts };
}

export type ParseResult =
  | { ok: true; record: ProjectRecord }
  | { ok: false; issues: { path: string; message: string }[] };

/** Validates a parsed project file; every refusal names its field path. */
export function parseProjectFile(json: unknown): ParseResult {
  const parsed = projectRecordSchema.safeParse(json);
  if (parsed.success) return { ok: true, record: parsed.data };
  return { ok: false, issues: formatIssues(parsed.error) };
}
export { requiredLabels, type LabelRequirement, type SignalWord } from "./labels";
