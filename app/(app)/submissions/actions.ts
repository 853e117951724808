"use server";

import { revalidatePath } from "next/cache";
import { runAction, type ActionResult } from "@/lib/auth/action";
import { sendOverdueDigest, type DigestSent } from "@/lib/services/submissions/digest";
import { createSubmission, recordSubmissionEvent, voidSubmissionEvent, type CreatedSubmission, type RecordedEvent, type VoidedEvent } from "@/lib/services/submissions";

function reader(formData: FormData) {
  return (name: string) => {
    const v = formData.get(name);
    return typeof v === "string" ? v : undefined;
  };
}

/** A new submission of an approved revision, as the office's form sends it; the service parses and authorises. */
export async function createSubmissionAction(_prev: ActionResult<CreatedSubmission> | null, formData: FormData): Promise<ActionResult<CreatedSubmission>> {
  const text = reader(formData);
  const result = await runAction((ctx) =>
    createSubmission(ctx, {
      revisionId: text("revisionId"),
      method: text("method"),
      referenceNumber: text("referenceNumber"),
      occurredOn: text("occurredOn"),
      note: text("note"),
    }),
  );
  if (result.ok) {
    revalidatePath("/submissions");
    revalidatePath("/submissions/new");
  }
  return result.ok ? { ...result, message: result.data?.message } : result;
}

export async function recordEventAction(_prev: ActionResult<RecordedEvent> | null, formData: FormData): Promise<ActionResult<RecordedEvent>> {
  const text = reader(formData);
  const submissionId = text("submissionId");
  const result = await runAction((ctx) =>
    recordSubmissionEvent(ctx, {
      submissionId,
      kind: text("kind"),
      occurredOn: text("occurredOn"),
      note: text("note"),
      permitNumber: text("permitNumber"),
      expiresOn: text("expiresOn"),
      amountUsd: text("amountUsd"),
      inspectionKind: text("inspectionKind"),
      revisionId: text("revisionId"),
      corrections: text("corrections"),
      assigneeId: text("assigneeId"),
      version: text("version") || undefined,
    }),
  );
  if (result.ok && submissionId) {
    revalidatePath(`/submissions/${submissionId}`);
    revalidatePath("/submissions");
  }
  return result.ok ? { ...result, message: result.data?.message } : result;
}

export async function voidEventAction(_prev: ActionResult<VoidedEvent> | null, formData: FormData): Promise<ActionResult<VoidedEvent>> {
  const text = reader(formData);
  const submissionId = text("submissionId");
  const result = await runAction((ctx) =>
    voidSubmissionEvent(ctx, { submissionId, eventId: text("eventId"), reason: text("reason"), version: text("version") || undefined }),
  );
  if (result.ok && submissionId) {
    revalidatePath(`/submissions/${submissionId}`);
    revalidatePath("/submissions");
  }
  return result.ok ? { ...result, message: result.data?.message } : result;
}

/** The permit office's digest of overdue submissions and expiring permits, sent now rather than at the scheduled hour. */
export async function sendDigestAction(): Promise<ActionResult<DigestSent>> {
  const result = await runAction((ctx) => sendOverdueDigest(ctx));
  return result.ok ? { ...result, message: result.data?.message } : result;
}
