import "server-only";
import { and, eq } from "drizzle-orm";
import { jurisdictions } from "../../../db/schema";
import { formatIssues } from "../../schemas/fields";
import { jurisdictionEditSchema, type JurisdictionEdit } from "../../schemas/jurisdiction";
import { audit, requirePermission, type ServiceContext } from "../context";
import { conflict, invalid } from "../errors";
import { findJurisdictionInOrg } from "./get";
import { knockOnOf, type KnockOnProject } from "./knock-on";

export interface JurisdictionSaved {
  id: string;
  version: number;
  /** Record fields that changed, in words. */
  changed: string[];
  /** Open projects whose check results change with the new rules. */
  knockOn: KnockOnProject[];
  message: string;
}

const FIELD_WORDS: Record<string, string> = {
  name: "name",
  region: "region",
  necEdition: "NEC edition",
  residentialCode: "residential code",
  amendments: "local amendments",
  voltageDropLimitPct: "voltage-drop limit",
  storageAggregateLimitKWh: "storage limit",
  submissionMethod: "submission method",
  contact: "contact",
  typicalReviewDays: "typical review days",
  feeNotes: "fee notes",
  requiredDocuments: "required documents",
  labelRules: "label rules",
};

function parse(input: unknown): JurisdictionEdit {
  const parsed = jurisdictionEditSchema.safeParse(input);
  if (!parsed.success) throw invalid("The jurisdiction was not saved: some fields are not valid.", formatIssues(parsed.error));
  return parsed.data;
}

function rulesOf(v: JurisdictionEdit) {
  return {
    necEdition: v.necEdition,
    residentialCode: v.residentialCode,
    voltageDropLimitPct: v.voltageDropLimitPct ?? undefined,
    storageAggregateLimitKWh: v.storageAggregateLimitKWh ?? undefined,
    requiredDocuments: v.requiredDocuments,
  };
}

/** What saving would do to the jurisdiction's open projects, without saving. */
export function previewJurisdictionEdit(ctx: ServiceContext, id: string, input: unknown): KnockOnProject[] {
  requirePermission(ctx, "jurisdiction:edit", "edit jurisdictions");
  const row = findJurisdictionInOrg(ctx, id);
  return knockOnOf(ctx, row.id, rulesOf(parse(input)));
}

/**
 * Saves the office's edit of a jurisdiction record, if nobody saved since the
 * form was read, and reports the open projects whose checks change with it.
 */
export function updateJurisdiction(ctx: ServiceContext, id: string, input: unknown): JurisdictionSaved {
  requirePermission(ctx, "jurisdiction:edit", "edit jurisdictions");
  const row = findJurisdictionInOrg(ctx, id);
  const v = parse(input);
  if (v.version !== row.version) throw conflict("Someone saved this jurisdiction since you opened it; reload the page to see their changes.");
  const labelRules = {
    ...(v.labelRules.material ? { material: v.labelRules.material } : {}),
    ...(v.labelRules.reflective ? { reflective: true } : {}),
    ...(v.labelRules.minLetterHeightIn !== null ? { minLetterHeightIn: v.labelRules.minLetterHeightIn } : {}),
    ...(v.labelRules.colours ? { colours: v.labelRules.colours } : {}),
  };
  const contact = Object.fromEntries(Object.entries(v.contact).filter(([, value]) => value !== ""));
  const next = {
    name: v.name,
    region: v.region,
    necEdition: v.necEdition,
    residentialCode: v.residentialCode,
    amendments: v.amendments,
    voltageDropLimitPct: v.voltageDropLimitPct,
    storageAggregateLimitKWh: v.storageAggregateLimitKWh,
    submissionMethod: v.submissionMethod,
    contact,
    typicalReviewDays: v.typicalReviewDays,
    feeNotes: v.feeNotes,
    requiredDocuments: v.requiredDocuments,
    labelRules,
  };
  const changed = Object.keys(next).filter((k) => JSON.stringify(next[k as keyof typeof next] ?? null) !== JSON.stringify(row[k as keyof typeof row] ?? null));
  // Worked out before the save, against the record as it stands, so it names what the save changes.
  const knockOn = knockOnOf(ctx, row.id, rulesOf(v));
  const version = ctx.db.transaction((tx) => {
    const moved = tx
      .update(jurisdictions)
      .set({ ...next, version: row.version + 1, updatedAt: new Date().toISOString() })
      .where(and(eq(jurisdictions.id, row.id), eq(jurisdictions.orgId, ctx.orgId), eq(jurisdictions.version, row.version)))
      .run();
    if (moved.changes === 0) throw conflict("Someone saved this jurisdiction at the same time; reload the page to see their changes.");
    audit(tx, ctx, "jurisdiction.updated", "jurisdiction", row.id, { changed, from: Object.fromEntries(changed.map((k) => [k, row[k as keyof typeof row]])), knockOn: knockOn.map((p) => p.projectId) });
    return row.version + 1;
  });
  const words = changed.map((k) => FIELD_WORDS[k] ?? k);
  return {
    id: row.id,
    version,
    changed: words,
    knockOn,
    message: changed.length
      ? `Saved: ${words.join(", ")}. ${knockOn.length === 0 ? "No open project's checks change." : `${knockOn.length} open project${knockOn.length === 1 ? "'s checks change" : "s' checks change"}; see below.`}`
      : "Nothing changed.",
  };
}
