"use server";

import { revalidatePath } from "next/cache";
import { z } from "zod";
import { defineAction } from "@/lib/auth/action";
import { idSchema, jsonObjectSchema, templatePreviewSchema, templateSaveSchema } from "@/lib/schemas/edges";
import { addJurisdictionNote } from "@/lib/services/jurisdictions/notes";
import { previewSheetTemplate, saveSheetTemplate } from "@/lib/services/jurisdictions/templates";
import { previewJurisdictionEdit, updateJurisdiction } from "@/lib/services/jurisdictions/update";

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

/** The jurisdiction form's fields as one object; the service parses them. */
const jurisdictionEdit = z.object({ id: idSchema, input: jsonObjectSchema });

export const saveJurisdictionAction = defineAction({
  access: "user",
  permission: "jurisdiction:edit",
  read: (id: string, input: unknown) => ({ id, input }),
  schema: jurisdictionEdit,
  run: (ctx, { id, input }) => updateJurisdiction(ctx, id, input),
  after: ({ id }) => {
    revalidatePath(`/jurisdictions/${id}`);
    revalidatePath("/jurisdictions");
  },
});

export const previewJurisdictionAction = defineAction({
  access: "user",
  read: (id: string, input: unknown) => ({ id, input }),
  schema: jurisdictionEdit,
  run: (ctx, { id, input }) => previewJurisdictionEdit(ctx, id, input),
});

export const addJurisdictionNoteAction = defineAction({
  access: "user",
  read: (input: { jurisdictionId: string; text: string }) => input,
  schema: z.object({ jurisdictionId: idSchema, text: z.string().max(8000, { message: "must be at most 8000 characters" }) }),
  run: (ctx, input) => addJurisdictionNote(ctx, input),
  message: (data) => data.message,
  after: (input) => revalidatePath(`/jurisdictions/${input.jurisdictionId}`),
});
