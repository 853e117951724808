/**
 * Grows the demo organisation to the size of a busy firm, for the load and
 * query-plan benchmarks: 10,000 projects (a few circuits each), one project of
 * 200 circuits, and a review queue and submissions queue of a few thousand rows.
 * Run after the demo seed: `npm run db:seed -- --scale`. Idempotent: a second
 * run finds the scaled projects and adds nothing.
 */
import { and, eq, like } from "drizzle-orm";
import { generatedProject } from "../scripts/lib/generated-project";
import { contextForUser } from "../lib/services/context";
import { createProject } from "../lib/services/projects/create";
import { getProjectRecord } from "../lib/services/projects/get-record";
import { saveProjectRecord } from "../lib/services/projects/save-record";
import type { Db } from "./client";
import { DEMO_ORG, DEMO_USERS } from "./demo-scenario";
import { jurisdictions, organisations, projects, users } from "./schema";

export const SCALE_PROJECTS = 10_000;
export const SCALE_BIG_PROJECT = "Generated 200-circuit project";
const SCALED_PREFIX = "Scaled project ";
const STATUSES = ["design", "in-review", "returned", "approved", "submitted", "permitted", "installed", "closed"] as const;

/** Spreads timestamps over the past two years so ordering and pagination see realistic, distinct keys. */
function dayIso(i: number): string {
  return new Date(Date.UTC(2025, 0, 1) + i * 6_300_000).toISOString();
}

export function seedScale(db: Db, total = SCALE_PROJECTS): { projects: number; submissions: number } {
  const org = db.select().from(organisations).where(eq(organisations.slug, DEMO_ORG.slug)).get();
  if (!org) throw new Error("Run the demo seed first: the scaled rows join the demo organisation.");
  const orgId = org.id;
  const designer = db.select().from(users).where(eq(users.email, DEMO_USERS[0]!.email)).get()!;
  const orgJurisdictions = db.select().from(jurisdictions).where(eq(jurisdictions.orgId, orgId)).all();
  if (!orgJurisdictions.length) throw new Error("The demo organisation has no jurisdictions.");

  const existing = db
    .select({ id: projects.id })
    .from(projects)
    .where(and(eq(projects.orgId, orgId), like(projects.name, `${SCALED_PREFIX}%`)))
    .all().length;
  let submissionCount = 0;
  if (existing < total) {
    const sqlite = db.$client;
    const insertProject = sqlite.prepare(
      `insert into projects (id, org_id, jurisdiction_id, name, client, status, system_kind, address, created_by, created_at, updated_at)
       values (?, ?, ?, ?, ?, ?, 'stand-alone', ?, ?, ?, ?)`,
    );
    const insertCircuit = sqlite.prepare(`insert into circuits (id, project_id, tag, from_tag, to_tag, kind, position, data) values (?, ?, ?, ?, ?, ?, ?, ?)`);
    const insertRevision = sqlite.prepare(
      `insert into packet_revisions (id, org_id, project_id, number, state, progress_step, review_state, record_snapshot, results_snapshot, record_sha256, is_draft, created_by, created_at)
       values (?, ?, ?, 1, 'ready', 'done', ?, '{}', '[]', ?, 0, ?, ?)`,
    );
    const insertSubmission = sqlite.prepare(
      `insert into submissions (id, org_id, project_id, jurisdiction_id, revision_id, method, reference_number, status, created_by, created_at)
       values (?, ?, ?, ?, ?, 'portal', ?, 'submitted', ?, ?)`,
    );
    const insertEvent = sqlite.prepare(
      `insert into submission_events (id, org_id, submission_id, kind, occurred_on, user_id, created_at) values (?, ?, ?, 'submitted', ?, ?, ?)`,
    );
    sqlite.transaction(() => {
      for (let i = existing; i < total; i++) {
        const id = crypto.randomUUID();
        const at = dayIso(i);
        const status = STATUSES[i % STATUSES.length]!;
        const jurisdiction = orgJurisdictions[i % orgJurisdictions.length]!;
        insertProject.run(id, orgId, jurisdiction.id, `${SCALED_PREFIX}${String(i + 1).padStart(5, "0")}`, `Client ${i % 977}`, status, `${100 + (i % 900)} Orchard Row, Lindell`, designer.id, at, at);
        for (let c = 0; c < 3; c++) {
          insertCircuit.run(crypto.randomUUID(), id, `C-${c}`, "BB-1", `L-${c}`, "ac-branch", c, "{}");
        }
        // Every fourth project has a finished packet; of those, half went to the permit office.
        if (i % 4 === 0) {
          const revisionId = crypto.randomUUID();
          insertRevision.run(revisionId, orgId, id, i % 8 === 0 ? "approved" : "in-review", "0".repeat(64), designer.id, at);
          if (i % 8 === 0) {
            const submissionId = crypto.randomUUID();
            insertSubmission.run(submissionId, orgId, id, jurisdiction.id, revisionId, `PR-${i}`, designer.id, at);
            insertEvent.run(crypto.randomUUID(), orgId, submissionId, at.slice(0, 10), designer.id, at);
            submissionCount++;
          }
        }
      }
    })();
  }

  // One large plant, so the checks of a 200-circuit project can be measured through the web tier.
  const big = db.select({ id: projects.id }).from(projects).where(and(eq(projects.orgId, orgId), eq(projects.name, SCALE_BIG_PROJECT))).get();
  if (!big) {
    const ctx = contextForUser(db, designer.id);
    const jurisdiction = orgJurisdictions[0]!;
    const record = generatedProject(200);
    record.jurisdiction = { name: jurisdiction.name, necEdition: jurisdiction.necEdition };
    const { id } = createProject(ctx, { name: record.name, client: "Bench", systemKind: record.systemKind, jurisdictionId: jurisdiction.id, address: "1 Bench Road, Lindell" });
    saveProjectRecord(ctx, id, record, getProjectRecord(ctx, id).version);
  }
  const count = db.select({ id: projects.id }).from(projects).where(eq(projects.orgId, orgId)).all().length;
  return { projects: count, submissions: submissionCount };
}
