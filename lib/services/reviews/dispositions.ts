import "server-only";
import type { AttestDispositionRecord } from "../../../db/schema";
import type { CheckRun } from "../../compliance/types";
import type { DispositionInput, ReviewDecision } from "../../schemas/review";
import { invalid, type FieldIssue } from "../errors";
import { resultLabel } from "./shared";

/**
 * What a stamp may carry. An approval is refused while the frozen record
 * still has results that need input (each names the field that clears it),
 * and until every attest item has the reviewer's disposition: accepted with
 * a note, or returned (a returned item means the revision goes back).
 * Returns the dispositions as the review keeps and the packet prints them.
 */
export function checkStampable(run: CheckRun | null, decision: ReviewDecision, dispositions: DispositionInput[]): AttestDispositionRecord[] {
  const results = run?.results ?? [];
  const attest = new Map(results.filter((r) => r.status === "attest").map((r) => [r.id, r]));
  const issues: FieldIssue[] = [];
  dispositions.forEach((d, i) => {
    if (!attest.has(d.resultId)) issues.push({ path: `dispositions.${i}.resultId`, message: `names no attest item of this revision (${d.resultId})` });
  });
  if (issues.length) throw invalid("Some dispositions point at no attest item of this revision.", issues);
  const byId = new Map(dispositions.map((d) => [d.resultId, d]));

  if (decision === "approved") {
    const needing = results.filter((r) => r.status === "needs-input");
    if (needing.length) {
      const fields = [...new Set(needing.flatMap((r) => r.missing ?? []))];
      throw invalid(
        `${needing.length} result${needing.length === 1 ? " still needs" : "s still need"} input, so the record is not complete enough to stamp; return the revision so the designer can fill ${fields.length ? fields.join(", ") : "the fields named"}.`,
        needing.map((r) => ({ path: `results.${r.id}`, message: `needs input: ${(r.missing ?? []).join(", ") || resultLabel(r)}` })),
      );
    }
    const undecided = [...attest.values()].filter((r) => !byId.has(r.id));
    if (undecided.length) {
      throw invalid(
        `Give each attest item a disposition before approving: ${undecided.length} ${undecided.length === 1 ? "has" : "have"} none.`,
        undecided.map((r) => ({ path: `dispositions.${r.id}`, message: `${resultLabel(r)}: accept it with a note, or return it` })),
      );
    }
    const returned = dispositions.filter((d) => d.disposition === "returned");
    if (returned.length) {
      throw invalid(
        "An attest item is returned, so the revision cannot be approved; return the revision instead.",
        returned.map((d) => ({ path: `dispositions.${d.resultId}`, message: "is returned" })),
      );
    }
  }
  return dispositions.map((d) => {
    const r = attest.get(d.resultId)!;
    return { resultId: d.resultId, title: r.title, subject: r.subject ?? null, disposition: d.disposition, note: d.note };
  });
}
