import "server-only";
import { and, eq, notInArray } from "drizzle-orm";
import { projects } from "../../../db/schema";
import { runChecks } from "../../compliance";
import type { CheckStatus } from "../../compliance/types";
import type { JurisdictionRules, ProjectRecord } from "../../schemas/project-record";
import type { ServiceContext } from "../context";
import { ServiceError } from "../errors";
import { getProjectRecord } from "../projects/get-record";

/** Projects past these no longer change with the jurisdiction's record. */
const SETTLED = ["installed", "inspected", "closed", "cancelled", "expired"] as const;

export interface KnockOnChange {
  title: string;
  subject: string | null;
  from: CheckStatus | "absent";
  to: CheckStatus | "absent";
}

export interface KnockOnProject {
  projectId: string;
  name: string;
  status: string;
  changes: KnockOnChange[];
  /** The project's record could not be read, so its checks were not re-run. */
  unreadable?: string;
}

/**
 * Re-runs the checks of the jurisdiction's open projects with the rules as
 * they would be, and lists those whose results change: a check whose status
 * moves, or one that appears or goes. Nothing is written; the office sees the
 * effect before and after saving.
 */
export function knockOnOf(ctx: ServiceContext, jurisdictionId: string, rules: Omit<JurisdictionRules, "name">): KnockOnProject[] {
  const rows = ctx.db
    .select({ id: projects.id, name: projects.name, status: projects.status })
    .from(projects)
    .where(and(eq(projects.orgId, ctx.orgId), eq(projects.jurisdictionId, jurisdictionId), notInArray(projects.status, [...SETTLED])))
    .all();
  const out: KnockOnProject[] = [];
  for (const p of rows) {
    let record: ProjectRecord;
    try {
      record = getProjectRecord(ctx, p.id).record;
    } catch (error) {
      if (!(error instanceof ServiceError)) throw error;
      out.push({ projectId: p.id, name: p.name, status: p.status, changes: [], unreadable: error.message });
      continue;
    }
    const before = runChecks(record).results;
    const after = runChecks({ ...record, jurisdiction: { ...record.jurisdiction, ...rules } }).results;
    const was = new Map(before.map((r) => [r.id, r]));
    const now = new Map(after.map((r) => [r.id, r]));
    const changes: KnockOnChange[] = [];
    for (const r of after) {
      const old = was.get(r.id);
      if (!old) changes.push({ title: r.title, subject: r.subject ?? null, from: "absent", to: r.status });
      else if (old.status !== r.status) changes.push({ title: r.title, subject: r.subject ?? null, from: old.status, to: r.status });
    }
    for (const r of before) if (!now.has(r.id)) changes.push({ title: r.title, subject: r.subject ?? null, from: r.status, to: "absent" });
    if (changes.length) out.push({ projectId: p.id, name: p.name, status: p.status, changes });
  }
  return out;
}
