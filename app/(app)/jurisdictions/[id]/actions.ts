"use server";

import { revalidatePath } from "next/cache";
import { z } from "zod";
import { runAction, type ActionResult } from "@/lib/auth/action";
import { previewJurisdictionEdit, updateJurisdiction, type JurisdictionSaved } from "@/lib/services/jurisdictions/update";
import type { KnockOnProject } from "@/lib/services/jurisdictions/knock-on";
import { addJurisdictionNote } from "@/lib/services/jurisdictions/notes";
import { previewSheetTemplate, saveSheetTemplate, type TemplatePreview } from "@/lib/services/jurisdictions/templates";

/** Sheet templates are short text; the bound keeps one save from filling the database. */
const MAX_TEMPLATE_CHARS = 100_000;

const saveInput = z.object({
  jurisdictionId: z.string().min(1).max(64),
  name: z.string().min(1).max(64),
  source: z.string().max(MAX_TEMPLATE_CHARS),
  version: z.number().int().min(1),
});

function refused(error: z.ZodError): ActionResult<never> {
  return { ok: false, error: "The template was not sent correctly.", issues: error.issues.map((i) => ({ path: i.path.join("."), message: i.message })), code: "invalid" };
}

export async function saveSheetTemplateAction(input: z.input<typeof saveInput>): Promise<ActionResult<{ version: number; overridden: boolean }>> {
  const parsed = saveInput.safeParse(input);
  if (!parsed.success) return refused(parsed.error);
  const { jurisdictionId, name, source, version } = parsed.data;
  const result = await runAction((ctx) => saveSheetTemplate(ctx, jurisdictionId, name, source, version));
  if (result.ok) {
    result.message = result.data?.overridden ? "Template saved; the next packet for this jurisdiction uses it." : "Override removed; the shipped template applies.";
    revalidatePath(`/jurisdictions/${jurisdictionId}`);
  }
  return result;
}

const previewInput = saveInput.omit({ version: true });

export async function previewSheetTemplateAction(input: z.input<typeof previewInput>): Promise<ActionResult<TemplatePreview>> {
  const parsed = previewInput.safeParse(input);
  if (!parsed.success) return refused(parsed.error);
  const { jurisdictionId, name, source } = parsed.data;
  return runAction((ctx) => previewSheetTemplate(ctx, jurisdictionId, name, source));
}

export async function saveJurisdictionAction(id: string, input: unknown): Promise<ActionResult<JurisdictionSaved>> {
  const result = await runAction((ctx) => updateJurisdiction(ctx, id, input));
  if (result.ok) {
    revalidatePath(`/jurisdictions/${id}`);
    revalidatePath("/jurisdictions");
  }
  return result;
}

export async function previewJurisdictionAction(id: string, input: unknown): Promise<ActionResult<KnockOnProject[]>> {
  return runAction((ctx) => previewJurisdictionEdit(ctx, id, input));
}

export async function addJurisdictionNoteAction(input: { jurisdictionId: string; text: string }): Promise<ActionResult<{ id: string; message: string }>> {
  const result = await runAction((ctx) => addJurisdictionNote(ctx, input));
  if (result.ok) revalidatePath(`/jurisdictions/${input.jurisdictionId}`);
  return result;
}
