import type { CheckResult } from "../compliance/types";
import type { ProjectRecord } from "../schemas/project-record";
// The editor's own field labels, so a sheet names a missing value with the words the designer sees on the form
// ("Grounding electrodes", "C-2 · overcurrent device"), never as a record path.
import { describePath, humaniseText } from "../../components/workspace/record-labels";

/** A record field in the designer's words. */
export function fieldName(record: ProjectRecord, path: string): string {
  return describePath(record, path);
}

/** "NOT GIVEN: Grounding electrodes (Grounding section)": what a sheet prints where a value is missing. */
export function notGiven(record: ProjectRecord, path: string): string {
  const section = path.split(".")[0] ?? "";
  const where = SECTION_NAME[section];
  return `NOT GIVEN: ${fieldName(record, path)}${where ? ` (${where})` : ""}`;
}

const SECTION_NAME: Record<string, string> = {
  grounding: "Grounding section of the design",
  site: "Site section of the design",
};

/** A check result with every record path in its text replaced by the field's name. */
export function readableResult(record: ProjectRecord, r: CheckResult): CheckResult {
  const out: CheckResult = { ...r, message: humaniseText(record, r.message), missing: r.missing.map((p) => fieldName(record, p)) };
  if (r.reason !== undefined) out.reason = humaniseText(record, r.reason);
  return out;
}
