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
import { CHECKS } from "./registry";
import { makeResult } from "./result";
import { codeRef } from "./tables";
import { CHECK_STATUSES, type CheckResult, type CheckRun, type CheckRunOptions, type CheckStatus } from "./types";

export type { CheckInput, CheckResult, CheckRun, CheckRunOptions, CheckStatus, CheckValue, Remedy, RemedyChange } from "./types";
export { CHECK_STATUSES } from "./types";
export { loadDailyWh, loadEnergyFormula, loadSummary, type LoadSummary } from "./load-summary";
export { CHECKS } from "./registry";

export function runChecks(record: ProjectRecord, options: CheckRunOptions = {}): CheckRun {
  const edition: NecEdition = options.edition ?? record.jurisdiction.necEdition;
  const ctx = buildContext(record, edition);
  // Buckets per status, filled in catalogue order: a stable sort by severity then catalogue, in linear time.
  const buckets = Object.fromEntries(CHECK_STATUSES.map((st) => [st, [] as CheckResult[]])) as Record<CheckStatus, CheckResult[]>;
  for (const check of CHECKS) {
    const results = check.run(ctx);
    if (results.length === 0) {
      results.push(
        makeResult(check, {
          status: "not-applicable",
          message: "Nothing in the record that this check applies to.",
          reason: "the record holds no item of the kind this check covers",
          codeRefs: [codeRef(edition, check.scopeTopic)],
        }),
      );
    }
    for (const r of results) {
      if (r.formula === "") r.formula = check.formula;
      buckets[r.status].push(r);
    }
  }
  const counts = Object.fromEntries(CHECK_STATUSES.map((st) => [st, buckets[st].length])) as Record<CheckStatus, number>;
  return { edition, results: CHECK_STATUSES.flatMap((st) => buckets[st]), counts };
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
