"use server";

import { revalidatePath } from "next/cache";
import type { z } from "zod";
import { defineAction } from "@/lib/auth/action";
import { attachPhotoSchema, confirmItemSchema } from "@/lib/schemas/edges";
import { confirmOnSite, unconfirmOnSite } from "@/lib/services/install/approved-set";

export const toggleConfirmationAction = defineAction({
  access: "user",
  permission: "install:confirm",
  read: (_prev: unknown, formData: FormData) => Object.fromEntries(formData ?? []),
  schema: confirmItemSchema,
  invalidMessage: "That item could not be marked.",
  run: (ctx, { confirmed, ...item }) => (confirmed === "true" ? confirmOnSite(ctx, item) : unconfirmOnSite(ctx, item)),
  message: "Saved.",
  after: (input) => revalidatePath(`/install/${input.revisionId}`),
});

/** Records the photo just uploaded for an item, confirming the item with it. */
export const attachPhotoAction = defineAction({
  access: "user",
  permission: "install:confirm",
  read: (input: z.input<typeof attachPhotoSchema>) => input,
  schema: attachPhotoSchema,
  invalidMessage: "That photo could not be recorded.",
  run: (ctx, input) => confirmOnSite(ctx, input),
  message: "Photo recorded.",
  after: (input) => revalidatePath(`/install/${input.revisionId}`),
});
