"use server";

import { revalidatePath } from "next/cache";
import type { z } from "zod";
import { defineAction } from "@/lib/auth/action";
import { templatePreviewSchema, templateSaveSchema } from "@/lib/schemas/edges";
import { previewSheetTemplate, saveSheetTemplate } from "@/lib/services/jurisdictions/templates";

export const saveSheetTemplateAction = defineAction({
  access: "user",
  permission: "jurisdiction:edit",
  read: (input: z.input<typeof templateSaveSchema>) => input,
  schema: templateSaveSchema,
  invalidMessage: "The template was not sent correctly.",
  run: (ctx, { jurisdictionId, name, source, version }) => saveSheetTemplate(ctx, jurisdictionId, name, source, version),
  message: (data) => (data.overridden ? "Template saved; the next packet for this jurisdiction uses it." : "Override removed; the shipped template applies."),
  after: (input) => revalidatePath(`/jurisdictions/${input.jurisdictionId}`),
});

export const previewSheetTemplateAction = defineAction({
  access: "user",
  read: (input: z.input<typeof templatePreviewSchema>) => input,
  schema: templatePreviewSchema,
  invalidMessage: "The template was not sent correctly.",
  run: (ctx, { jurisdictionId, name, source }) => previewSheetTemplate(ctx, jurisdictionId, name, source),
});
