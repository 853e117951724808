"use server";

import { revalidatePath } from "next/cache";
import { z } from "zod";
import { defineAction, formText } from "@/lib/auth/action";
import { decisionEdgeSchema, formFieldsSchema, idSchema, signPacketEdgeSchema } from "@/lib/schemas/edges";
import type { ReviewDecisionInput } from "@/lib/schemas/review";
import { approveAndSign, decideReview, renderStampedPacketAgain, saveOwnLicence, signStampedPacket, uploadSigningCertificate } from "@/lib/services/reviews";

function refreshReview(revisionId: string) {
  revalidatePath(`/reviews/${revisionId}`);
  revalidatePath("/reviews");
}

/**
 * The decision with its notes, as the review page collects them; the service parses and authorises.
 * With the certificate's password, an approval also signs the stamped packet.
 */
export const decideReviewAction = defineAction({
  access: "user",
  permission: "review:decide",
  read: (input: ReviewDecisionInput & { certificatePassword?: string }) => input,
  schema: decisionEdgeSchema,
  run: (ctx, input) => {
    const { certificatePassword, ...decision } = input;
    return decision.decision === "approved" && certificatePassword
      ? approveAndSign(ctx, decision, { password: certificatePassword })
      : decideReview(ctx, decision);
  },
  after: (input) => refreshReview(input.revisionId),
});

/** A reviewer or a designer may render a failed stamped packet again; the service says which. */
export const renderStampedPacketAgainAction = defineAction({
  access: "user",
  read: (revisionId: string) => ({ revisionId }),
  schema: z.object({ revisionId: idSchema }),
  run: (ctx, input) => renderStampedPacketAgain(ctx, input.revisionId),
  message: (data) => data?.message,
  after: (input) => revalidatePath(`/reviews/${input.revisionId}`),
});

const LICENCE_FIELDS = ["licenceNumber", "region", "discipline", "expiresOn", "version"] as const;

export const saveLicenceAction = defineAction({
  access: "user",
  permission: "licence:edit-own",
  read: (_prev: unknown, formData: FormData) => {
    const text = formText(formData);
    return Object.fromEntries(LICENCE_FIELDS.map((n) => [n, text(n)]));
  },
  schema: formFieldsSchema(LICENCE_FIELDS, 200),
  run: (ctx, input) => saveOwnLicence(ctx, { ...input, version: input.version || undefined }),
  message: "Licence record saved.",
  after: () => {
    revalidatePath("/reviews/licence");
    revalidatePath("/reviews");
  },
});

/** Signs an approved revision's stamped packet with the reviewer's stored certificate; the password is used once and dropped. */
export const signPacketAction = defineAction({
  access: "user",
  permission: "review:decide",
  read: (revisionId: string, certificatePassword: string) => ({ revisionId, certificatePassword: certificatePassword ?? "" }),
  schema: signPacketEdgeSchema,
  run: (ctx, input) => signStampedPacket(ctx, input.revisionId, { password: input.certificatePassword }),
  message: (data) => data?.message,
  after: (input) => revalidatePath(`/reviews/${input.revisionId}`),
});

/** A PKCS#12 file is a few kilobytes; the framework's 1 MB action body bound holds it with room. */
const certificateSchema = z.object({
  file: z.instanceof(File, { message: "choose your .p12 or .pfx file" }),
  password: z.string().max(200),
});

export const uploadCertificateAction = defineAction({
  access: "user",
  permission: "licence:edit-own",
  read: (_prev: unknown, formData: FormData) => {
    const file = formData?.get?.("certificate");
    const password = formData?.get?.("certificatePassword");
    return { file: file instanceof File ? file : undefined, password: typeof password === "string" ? password : "" };
  },
  schema: certificateSchema,
  run: async (ctx, { file, password }) => uploadSigningCertificate(ctx, { fileName: file.name || "certificate.p12", bytes: new Uint8Array(await file.arrayBuffer()), password }),
  message: "Signing certificate saved. Its password is not kept: you type it each time you sign.",
  after: () => revalidatePath("/reviews/licence"),
});
