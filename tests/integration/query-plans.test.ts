import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Statement } from "better-sqlite3";
import { listJurisdictions } from "../../lib/services/jurisdictions/list";
import { listLibraryItems } from "../../lib/services/library/list";
import { listOutbox } from "../../lib/services/outbox/list";
import { listProjectAttachments } from "../../lib/services/attachments/list";
import { listProjects } from "../../lib/services/projects/list";
import { listProjectRevisions } from "../../lib/services/revisions/list";
import { listApprovedForInstall, listReviewQueue, listSubmissions } from "../../lib/services/revisions/queues";
import { listProjectReviews } from "../../lib/services/reviews/history";
import { listSubmissionQueue } from "../../lib/services/submissions";
import { listUsers } from "../../lib/services/users/list";
import type { ServiceContext } from "../../lib/services/context";
import { makeContext, makeJurisdiction, makeOrg, makeProject, tempDatabase } from "./factories";

/**
 * Tables that grow with a firm's work (projects, their rows, packets, submissions,
 * mail and audit): a list that reads one of them whole gets slower with every
 * project. Organisations, users and jurisdictions stay small.
 */
const LARGE_TABLES = [
  "projects",
  "circuits",
  "arrays",
  "loads",
  "project_equipment",
  "packet_revisions",
  "submissions",
  "submission_events",
  "attachments",
  "reviews",
  "outbox",
  "audit_log",
  "equipment_library",
  "jobs",
];

type Captured = { sql: string; params: unknown[] };

/** Records every statement the services run (with its parameters) so its plan can be asked for. */
function recordStatements(ctx: ServiceContext): { captured: Captured[]; stop: () => void } {
  const client = ctx.db.$client;
  const original = client.prepare.bind(client);
  const captured: Captured[] = [];
  client.prepare = ((sql: string) => {
    const statement = original(sql) as Statement;
    return new Proxy(statement, {
      get(target, prop, receiver) {
        const value = Reflect.get(target, prop, receiver);
        if (typeof value !== "function") return value;
        if (prop === "all" || prop === "get" || prop === "iterate" || prop === "run") {
          return (...params: unknown[]) => {
            captured.push({ sql, params });
            return value.apply(target, params);
          };
        }
        return (...args: unknown[]) => {
          const result = value.apply(target, args);
          return result === target ? receiver : result;
        };
      },
    });
  }) as typeof client.prepare;
  return { captured, stop: () => void (client.prepare = original as typeof client.prepare) };
}

/** The plan lines that read a large table whole: "SCAN t" (with or without an index walked end to end). */
export function fullScans(plan: { detail: string }[]): string[] {
  return plan
    .map((row) => row.detail)
    .filter((detail) => {
      const match = /^SCAN (\w+)/.exec(detail);
      return match !== null && LARGE_TABLES.includes(match[1]!);
    });
}

describe("list and queue queries use an index, never a full scan of a large table", () => {
  const { db, cleanup } = tempDatabase();
  let ctx: ServiceContext;
  let projectId: string;

  beforeAll(() => {
    const org = makeOrg(db);
    ctx = makeContext(db, org.id, ["designer", "reviewer", "office", "installer", "admin"]);
    const jurisdiction = makeJurisdiction(db, org.id);
    projectId = makeProject(db, org.id, jurisdiction.id).id;
  });
  afterAll(cleanup);

  const laterPage = Buffer.from(JSON.stringify(["2026-01-01T00:00:00.000Z", "z"])).toString("base64url");
  // Paged lists must also read in index order: sorting the organisation's rows for each page costs as much as a scan.
  const paged: [string, (ctx: ServiceContext) => unknown][] = [
    ["projects list (first page)", (c) => listProjects(c)],
    ["projects list (a later page)", (c) => listProjects(c, { cursor: laterPage })],
    ["projects list by name (first page)", (c) => listProjects(c, {}, { sort: "name" })],
    ["projects list by name (a later page)", (c) => listProjects(c, { cursor: Buffer.from(JSON.stringify(["M", "z"])).toString("base64url") }, { sort: "name" })],
    ["projects list, one status", (c) => listProjects(c, {}, { status: "design" })],
    ["archived projects", (c) => listProjects(c, {}, { archived: true })],
    ["submissions list (first page)", (c) => listSubmissions(c)],
    ["submissions list (a later page)", (c) => listSubmissions(c, { cursor: laterPage })],
  ];
  const lists: [string, (ctx: ServiceContext) => unknown][] = [
    ...paged,
    ["submissions queue", (c) => listSubmissionQueue(c)],
    ["review queue", (c) => listReviewQueue(c)],
    ["approved sets for installers", (c) => listApprovedForInstall(c)],
    ["outbox", (c) => listOutbox(c)],
    ["equipment library", (c) => listLibraryItems(c)],
    ["jurisdictions", (c) => listJurisdictions(c)],
    ["users", (c) => listUsers(c)],
    ["a project's revisions", (c) => listProjectRevisions(c, projectId)],
    ["a project's attachments", (c) => listProjectAttachments(c, projectId)],
    ["a project's reviews", (c) => listProjectReviews(c, projectId)],
  ];

  function plansOf(list: (ctx: ServiceContext) => unknown): { sql: string; plan: { detail: string }[] }[] {
    const recorder = recordStatements(ctx);
    try {
      list(ctx);
    } finally {
      recorder.stop();
    }
    const selects = recorder.captured.filter((c) => /^\s*select/i.test(c.sql));
    expect(selects.length).toBeGreaterThan(0);
    return selects.map(({ sql, params }) => ({ sql, plan: db.$client.prepare(`EXPLAIN QUERY PLAN ${sql}`).all(...params) as { detail: string }[] }));
  }

  it.each(lists)("%s", (_name, list) => {
    for (const { sql, plan } of plansOf(list)) expect({ sql, scans: fullScans(plan) }).toEqual({ sql, scans: [] });
  });

  it.each(paged)("%s reads its page in index order", (_name, list) => {
    const [{ sql, plan }] = plansOf(list) as [{ sql: string; plan: { detail: string }[] }];
    expect({ sql, sorts: plan.map((r) => r.detail).filter((d) => d.startsWith("USE TEMP B-TREE")) }).toEqual({ sql, sorts: [] });
  });

  it("the check itself catches a full scan (a query on an unindexed column)", () => {
    const plan = db.$client.prepare("EXPLAIN QUERY PLAN select id from projects where client = ?").all("x") as { detail: string }[];
    expect(fullScans(plan)).toEqual(["SCAN projects"]);
  });
});
