/** Generation steps in order; a revision's `progressStep` holds one. Import-free, so client components can show them. */
export const PROGRESS_STEPS = ["queued", "snapshot", "checks", "sheets", "datasheets", "docx", "done"] as const;
export type ProgressStep = (typeof PROGRESS_STEPS)[number];

export const PROGRESS_STEP_LABELS: Record<ProgressStep, string> = {
  queued: "Waiting to start",
  snapshot: "Record snapshot",
  checks: "Checks and labels",
  sheets: "Sheets",
  datasheets: "PDF with datasheets",
  docx: "DOCX",
  done: "Done",
};

export const REVIEW_STATE_LABELS: Record<string, string> = {
  draft: "Not sent for review",
  "in-review": "Awaiting review",
  returned: "Returned with notes",
  approved: "Approved & stamped",
};
