export { createSubmission, type CreateOptions, type CreatedSubmission } from "./create";
export { recordSubmissionEvent, type RecordEventOptions, type RecordedEvent } from "./record-event";
export { getSubmission, listSubmittableRevisions, type SubmissionView, type SubmissionEventView, type SubmittableRevision } from "./get";
export { listSubmissionQueue, type SubmissionQueueEntry } from "./list";
export { voidSubmissionEvent, type VoidedEvent } from "./void-event";
