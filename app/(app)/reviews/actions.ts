"use server";

import { revalidatePath } from "next/cache";
import { runAction, type ActionResult } from "@/lib/auth/action";
import type { ReviewDecisionInput } from "@/lib/schemas/review";
import {
  approveAndSign,
  decideReview,
  renderStampedPacketAgain,
  saveOwnLicence,
  signStampedPacket,
  uploadSigningCertificate,
  type CertificateView,
  type Decided,
  type LicenceView,
} from "@/lib/services/reviews";

/**
 * The decision with its notes, as the review page collects them; the service parses and authorises.
 * With the certificate's password, an approval also signs the stamped packet.
 */
export async function decideReviewAction(input: ReviewDecisionInput & { certificatePassword?: string }): Promise<ActionResult<Decided>> {
  const { certificatePassword, ...decision } = input ?? {};
  const result = await runAction((ctx) =>
    decision.decision === "approved" && typeof certificatePassword === "string" && certificatePassword
      ? approveAndSign(ctx, decision, { password: certificatePassword })
      : decideReview(ctx, decision),
  );
  if (result.ok && typeof input?.revisionId === "string") {
    revalidatePath(`/reviews/${input.revisionId}`);
    revalidatePath("/reviews");
  }
  return result;
}

/** An action's argument as the client sent it: anything serialisable, so a non-string reads as "" and is refused as not found. */
const textArgument = (value: unknown): string => (typeof value === "string" ? value : "");

export async function renderStampedPacketAgainAction(revisionId: string): Promise<ActionResult> {
  const result = await runAction((ctx) => renderStampedPacketAgain(ctx, textArgument(revisionId)));
  if (result.ok) revalidatePath(`/reviews/${revisionId}`);
  return result.ok ? { ok: true, message: result.data?.message } : result;
}

export async function saveLicenceAction(_prev: ActionResult<LicenceView> | null, formData: FormData): Promise<ActionResult<LicenceView>> {
  const text = (name: string) => {
    const v = formData.get(name);
    return typeof v === "string" ? v : undefined;
  };
  const result = await runAction(
    (ctx) =>
      saveOwnLicence(ctx, {
        licenceNumber: text("licenceNumber"),
        region: text("region"),
        discipline: text("discipline"),
        expiresOn: text("expiresOn"),
        version: text("version") || undefined,
      }),
    "Licence record saved.",
  );
  if (result.ok) {
    revalidatePath("/reviews/licence");
    revalidatePath("/reviews");
  }
  return result;
}

/** Signs an approved revision's stamped packet with the reviewer's stored certificate; the password is used once and dropped. */
export async function signPacketAction(revisionId: string, certificatePassword: string): Promise<ActionResult> {
  const result = await runAction((ctx) => signStampedPacket(ctx, textArgument(revisionId), { password: textArgument(certificatePassword) }));
  if (result.ok) revalidatePath(`/reviews/${revisionId}`);
  return result.ok ? { ok: true, message: result.data?.message } : result;
}

export async function uploadCertificateAction(_prev: ActionResult<CertificateView> | null, formData: FormData): Promise<ActionResult<CertificateView>> {
  const file = formData.get("certificate");
  const password = formData.get("certificatePassword");
  const result = await runAction(async (ctx) => {
    const bytes = file instanceof File ? new Uint8Array(await file.arrayBuffer()) : new Uint8Array();
    return uploadSigningCertificate(ctx, { fileName: file instanceof File ? file.name : "certificate.p12", bytes, password: typeof password === "string" ? password : "" });
  }, "Signing certificate saved. Its password is not kept: you type it each time you sign.");
  if (result.ok) revalidatePath("/reviews/licence");
  return result;
}
