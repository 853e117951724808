"use server";

import { revalidatePath } from "next/cache";
import { runAction, type ActionResult } from "@/lib/auth/action";
import type { ReviewDecisionInput } from "@/lib/schemas/review";
import { decideReview, renderStampedPacketAgain, saveOwnLicence, type Decided, type LicenceView } from "@/lib/services/reviews";

/** The decision with its notes, as the review page collects them; the service parses and authorises. */
export async function decideReviewAction(input: ReviewDecisionInput): Promise<ActionResult<Decided>> {
  const result = await runAction((ctx) => decideReview(ctx, input));
  if (result.ok && typeof input?.revisionId === "string") {
    revalidatePath(`/reviews/${input.revisionId}`);
    revalidatePath("/reviews");
  }
  return result;
}

export async function renderStampedPacketAgainAction(revisionId: string): Promise<ActionResult> {
  const result = await runAction((ctx) => renderStampedPacketAgain(ctx, revisionId));
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
