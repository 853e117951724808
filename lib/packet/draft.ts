/**
 * Whether a packet generated from this record is a draft, and why: the
 * preflight shows the designer these lines before generating, and the cover
 * prints the same lines, so what the designer is told and what the sheet says
 * cannot drift apart. The rule and its words are the vocabulary's.
 */
import type { CheckRun, LabelRequirement } from "../compliance";
import type { ProjectRecord } from "../schemas/project-record";
import { draftReasons, labelGap } from "../schemas/vocabulary";
import { fieldName } from "./record-words";
import { racewayFillRows } from "./sheets/raceway-fill";

export function packetDraftReasons(
  record: ProjectRecord,
  run: Pick<CheckRun, "counts">,
  labels: readonly LabelRequirement[],
  missingDocuments: readonly string[],
): string[] {
  const overfilled = racewayFillRows(record).filter((r) => r.status === "fail").map((r) => r.circuit);
  return draftReasons({
    counts: run.counts,
    // A label's missing values are named by the form's field labels, as everywhere else a designer reads them.
    labelGaps: labels
      .map((l) => labelGap(l.missing ? { ...l, missing: l.missing.map((p) => fieldName(record, p)) } : l))
      .filter((g): g is string => g !== undefined),
    sheetGaps: overfilled.length ? [`raceway fill over the Chapter 9 limit: ${overfilled.join(", ")}`] : [],
    missingDocuments,
  });
}
