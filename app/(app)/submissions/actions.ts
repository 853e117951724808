"use server";

import { revalidatePath } from "next/cache";
import { defineAction, formText } from "@/lib/auth/action";
import { z } from "zod";
import { formFieldsSchema } from "@/lib/schemas/edges";
import { sendOverdueDigest } from "@/lib/services/submissions/digest";
import { createSubmission, recordSubmissionEvent, voidSubmissionEvent } from "@/lib/services/submissions";

/**
 * The one write path for submissions and their events: the office's forms.
 * (The route handlers under /api/submissions only read.)
 */
const CREATE_FIELDS = ["revisionId", "method", "referenceNumber", "occurredOn", "note"] as const;
const EVENT_FIELDS = ["submissionId", "kind", "occurredOn", "note", "permitNumber", "expiresOn", "amountUsd", "inspectionKind", "revisionId", "corrections", "assigneeId", "version"] as const;
const VOID_FIELDS = ["submissionId", "eventId", "reason", "version"] as const;

function fields<K extends string>(names: readonly K[], formData: FormData): Partial<Record<K, string>> {
  const text = formText(formData);
  return Object.fromEntries(names.map((n) => [n, text(n)])) as Partial<Record<K, string>>;
}

function refreshSubmission(submissionId: string | undefined) {
  if (submissionId) revalidatePath(`/submissions/${submissionId}`);
  revalidatePath("/submissions");
}

/** A new submission of an approved revision, as the office's form sends it; the service parses and authorises. */
export const createSubmissionAction = defineAction({
  access: "user",
  permission: "submission:create",
  read: (_prev: unknown, formData: FormData) => fields(CREATE_FIELDS, formData),
  schema: formFieldsSchema(CREATE_FIELDS),
  run: (ctx, input) => createSubmission(ctx, input),
  message: (data) => data.message,
  after: () => {
    revalidatePath("/submissions");
    revalidatePath("/submissions/new");
  },
});

export const recordEventAction = defineAction({
  access: "user",
  permission: "submission:record-event",
  read: (_prev: unknown, formData: FormData) => fields(EVENT_FIELDS, formData),
  schema: formFieldsSchema(EVENT_FIELDS),
  run: (ctx, input) => recordSubmissionEvent(ctx, { ...input, version: input.version || undefined }),
  message: (data) => data.message,
  after: (input) => refreshSubmission(input.submissionId),
});

export const voidEventAction = defineAction({
  access: "user",
  permission: "submission:record-event",
  read: (_prev: unknown, formData: FormData) => fields(VOID_FIELDS, formData),
  schema: formFieldsSchema(VOID_FIELDS),
  run: (ctx, input) => voidSubmissionEvent(ctx, { ...input, version: input.version || undefined }),
  message: (data) => data.message,
  after: (input) => refreshSubmission(input.submissionId),
});

/** The permit office's digest of overdue submissions and expiring permits, sent now rather than at the scheduled hour. */
export const sendDigestAction = defineAction({
  access: "user",
  read: () => ({}),
  schema: z.object({}),
  run: (ctx) => sendOverdueDigest(ctx),
  message: (data) => data.message,
});
