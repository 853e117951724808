"use server";

import { revalidatePath } from "next/cache";
import { z } from "zod";
import { runAction, type ActionResult } from "@/lib/auth/action";
import { confirmOnSite, unconfirmOnSite } from "@/lib/services/install/approved-set";

const confirmSchema = z.object({
  revisionId: z.string().min(1),
  itemKind: z.enum(["label", "equipment", "clearance"]),
  itemId: z.string().min(1).max(120),
  confirmed: z.enum(["true", "false"]),
});

export async function toggleConfirmationAction(_prev: ActionResult | null, formData: FormData): Promise<ActionResult> {
  const parsed = confirmSchema.safeParse(Object.fromEntries(formData));
  if (!parsed.success) return { ok: false, error: "That item could not be marked.", issues: [], code: "invalid" };
  const { confirmed, ...item } = parsed.data;
  const result = await runAction((ctx) => (confirmed === "true" ? confirmOnSite(ctx, item) : unconfirmOnSite(ctx, item)), "Saved.");
  if (result.ok) revalidatePath(`/install/${item.revisionId}`);
  return result as ActionResult;
}

const photoSchema = z.object({
  revisionId: z.string().min(1),
  itemKind: z.enum(["label", "equipment", "clearance"]),
  itemId: z.string().min(1).max(120),
  photoAttachmentId: z.string().min(1),
});

/** Records the photo just uploaded for an item, confirming the item with it. */
export async function attachPhotoAction(input: z.input<typeof photoSchema>): Promise<ActionResult> {
  const parsed = photoSchema.safeParse(input);
  if (!parsed.success) return { ok: false, error: "That photo could not be recorded.", issues: [], code: "invalid" };
  const result = await runAction((ctx) => confirmOnSite(ctx, parsed.data), "Photo recorded.");
  if (result.ok) revalidatePath(`/install/${parsed.data.revisionId}`);
  return result as ActionResult;
}
