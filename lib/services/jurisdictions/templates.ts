import "server-only";
import { and, asc, desc, eq, sql } from "drizzle-orm";
import { PDFDocument } from "pdf-lib";
import { jurisdictions, projects, type Jurisdiction } from "../../../db/schema";
import { runChecks } from "../../compliance";
import { requiredLabels } from "../../compliance/labels";
import { SHEET_PLAN } from "../../packet/model";
import { renderPacketPdf } from "../../packet/pdf";
import { loadTemplateSource, TemplateError, validateTemplate } from "../../packet/templates";
import { SHEET_TEMPLATE_NAMES, type SheetTemplateName } from "../../packet/types";
import type { ProjectRecord } from "../../schemas/project-record";
import { audit, requirePermission, type ServiceContext } from "../context";
import { conflict, invalid, notFound } from "../errors";
import { currentOrganisation } from "../organisations";
import { getProjectRecord } from "../projects/get-record";
import { findJurisdictionInOrg } from "./get";

export interface SheetTemplateView {
  name: SheetTemplateName;
  /** The packet sheets this template lays out ("E-004 Conductor and overcurrent schedule"). */
  sheets: { code: string; title: string }[];
  overridden: boolean;
  /** The jurisdiction's override when there is one, else the shipped template. */
  source: string;
  shippedSource: string;
}

/** Cover and general notes first: they are what jurisdictions most often word their own way. */
const ORDER: SheetTemplateName[] = ["cover", "general-notes", ...SHEET_TEMPLATE_NAMES.filter((n) => n !== "cover" && n !== "general-notes")];

export function isSheetTemplateName(name: string): name is SheetTemplateName {
  return (SHEET_TEMPLATE_NAMES as readonly string[]).includes(name);
}

function overridesOf(row: Jurisdiction): Partial<Record<SheetTemplateName, string>> {
  const out: Partial<Record<SheetTemplateName, string>> = {};
  for (const [name, source] of Object.entries(row.templateOverrides ?? {})) {
    if (isSheetTemplateName(name) && typeof source === "string" && source.trim()) out[name] = source;
  }
  return out;
}

export function listSheetTemplates(ctx: ServiceContext, jurisdictionId: string): SheetTemplateView[] {
  requirePermission(ctx, "jurisdiction:read", "read jurisdictions");
  const overrides = overridesOf(findJurisdictionInOrg(ctx, jurisdictionId));
  return ORDER.map((name) => {
    const shippedSource = loadTemplateSource(name);
    const override = overrides[name];
    return {
      name,
      sheets: SHEET_PLAN.filter((s) => s.template === name).map((s) => ({ code: s.code, title: s.title })),
      overridden: override !== undefined,
      source: override ?? shippedSource,
      shippedSource,
    };
  });
}

/** Refuses a template that does not parse or names a variable the packet does not supply, with its line and the name. */
function assertValid(name: SheetTemplateName, source: string): void {
  const check = validateTemplate(name, source);
  if (check.ok) return;
  const detail = check.message.replace(/^line \d+:\s*/i, "");
  throw invalid(`Line ${check.line}: ${detail}. The template was not saved.`, [
    { path: "line", message: String(check.line) },
    ...(check.name ? [{ path: "variable", message: check.name }] : []),
  ]);
}

/**
 * Sets or clears a jurisdiction's override of one sheet template. A blank
 * source, or one identical to the shipped template, clears it. Refused when a
 * packet could not be rendered from it, and when someone saved in between.
 */
export function saveSheetTemplate(
  ctx: ServiceContext,
  jurisdictionId: string,
  name: string,
  source: string,
  expectedVersion: number,
): { version: number; overridden: boolean } {
  requirePermission(ctx, "jurisdiction:edit", "edit jurisdiction templates");
  if (!isSheetTemplateName(name)) throw notFound(`The sheet template “${name}”`);
  const row = findJurisdictionInOrg(ctx, jurisdictionId);
  const normalised = source.replace(/\r\n/g, "\n");
  const clear = normalised.trim() === "" || normalised === loadTemplateSource(name);
  if (!clear) assertValid(name, normalised);
  const overrides: Record<string, string> = { ...(row.templateOverrides ?? {}) };
  if (clear) delete overrides[name];
  else overrides[name] = normalised;
  return ctx.db.transaction((tx) => {
    const updated = tx
      .update(jurisdictions)
      .set({ templateOverrides: overrides, version: sql`${jurisdictions.version} + 1`, updatedAt: new Date().toISOString() })
      .where(and(eq(jurisdictions.id, row.id), eq(jurisdictions.orgId, ctx.orgId), eq(jurisdictions.version, expectedVersion)))
      .run();
    if (updated.changes === 0) {
      throw conflict("Someone saved this jurisdiction after you opened it. Reload to see their changes; yours were not saved.");
    }
    audit(tx, ctx, clear ? "jurisdiction.template.clear" : "jurisdiction.template.save", "jurisdiction", row.id, { template: name });
    return { version: expectedVersion + 1, overridden: !clear };
  });
}

export type TemplatePreview =
  | { ok: true; pdfBase64: string; projectName: string; sheet: string; pageCount: number }
  | { ok: false; line: number; message: string; name?: string };

/**
 * Renders the sheet from an unsaved template with one of the organisation's
 * projects (one in this jurisdiction when there is one), under this
 * jurisdiction's rules, and answers the sheet's first page as a one-page PDF.
 */
export async function previewSheetTemplate(ctx: ServiceContext, jurisdictionId: string, name: string, source: string): Promise<TemplatePreview> {
  requirePermission(ctx, "jurisdiction:edit", "edit jurisdiction templates");
  if (!isSheetTemplateName(name)) throw notFound(`The sheet template “${name}”`);
  const row = findJurisdictionInOrg(ctx, jurisdictionId);
  const normalised = source.replace(/\r\n/g, "\n");
  const check = validateTemplate(name, normalised);
  if (!check.ok) return { ok: false, line: check.line, message: check.message.replace(/^line \d+:\s*/i, ""), ...(check.name ? { name: check.name } : {}) };

  const candidate =
    ctx.db.select({ id: projects.id }).from(projects).where(and(eq(projects.orgId, ctx.orgId), eq(projects.jurisdictionId, row.id))).orderBy(desc(projects.updatedAt)).get() ??
    ctx.db.select({ id: projects.id }).from(projects).where(eq(projects.orgId, ctx.orgId)).orderBy(asc(projects.createdAt)).get();
  if (!candidate) throw invalid("The organisation has no project to preview the sheet with yet; create one first.");
  const stored = getProjectRecord(ctx, candidate.id);
  const record: ProjectRecord = {
    ...stored.record,
    jurisdiction: {
      name: row.name,
      necEdition: row.necEdition,
      residentialCode: row.residentialCode,
      ...(row.voltageDropLimitPct != null ? { voltageDropLimitPct: row.voltageDropLimitPct } : {}),
      ...(row.storageAggregateLimitKWh != null ? { storageAggregateLimitKWh: row.storageAggregateLimitKWh } : {}),
      requiredDocuments: row.requiredDocuments as ProjectRecord["jurisdiction"]["requiredDocuments"],
    },
  };
  const run = runChecks(record);
  let pdf: Awaited<ReturnType<typeof renderPacketPdf>>;
  try {
    pdf = await renderPacketPdf({
      record,
      run,
      labels: requiredLabels(record, run.edition, { calculatedOn: new Date().toISOString().slice(0, 10) }),
      revision: { number: 0, createdAt: new Date().toISOString(), preparedBy: ctx.user.name, organisation: currentOrganisation(ctx)?.name ?? "" },
      datasheets: [],
      templateOverrides: { ...overridesOf(row), [name]: normalised },
    });
  } catch (error) {
    // Each sheet renders within TEMPLATE_LIMITS (loop count, output, time); a template past them is answered, not served.
    if (error instanceof TemplateError) return { ok: false, line: error.line, message: error.message.replace(/^template [^,]+, line \d+:\s*/, "") };
    throw error;
  }
  const codes = new Set(SHEET_PLAN.filter((s) => s.template === name).map((s) => s.code));
  const sheet = pdf.sheetPages.find((s) => codes.has(s.sheet));
  if (!sheet) throw new Error(`the packet has no sheet drawn from the ${name} template`);
  const whole = await PDFDocument.load(pdf.bytes);
  const one = await PDFDocument.create();
  const [page] = await one.copyPages(whole, [sheet.firstPage - 1]);
  one.addPage(page!);
  one.setTitle(`Preview: ${sheet.title}`);
  const bytes = await one.save();
  return { ok: true, pdfBase64: Buffer.from(bytes).toString("base64"), projectName: record.name, sheet: `${sheet.sheet} ${sheet.title}`, pageCount: sheet.pageCount };
}
