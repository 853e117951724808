import { and, eq } from "drizzle-orm";
import { afterAll, describe, expect, it } from "vitest";
import { outbox, packetRevisions, reviewNotes, reviews } from "../../db/schema";
import { describeChange } from "../../lib/record-diff";
import { ServiceError } from "../../lib/services/errors";
import { getProjectRecord } from "../../lib/services/projects/get-record";
import { getReviewWorkspace, sendForReview } from "../../lib/services/reviews";
import { makeContext, makeJurisdiction, makeOrg, makeProject, tempDatabase } from "./factories";

const env = tempDatabase();
const { db } = env;
afterAll(() => env.cleanup());

const org = makeOrg(db, "Delta Firm");
const designer = makeContext(db, org.id, ["designer"]);
const reviewer = makeContext(db, org.id, ["reviewer"]);
const jurisdiction = makeJurisdiction(db, org.id);
const noDelivery = async () => undefined;

function run(status: "fail" | "pass", allowedA: number) {
  return {
    edition: "2020",
    counts: { fail: status === "fail" ? 1 : 0, pass: status === "pass" ? 1 : 0, warning: 0, "needs-input": 0, attest: 0, "not-applicable": 0 },
    results: [
      {
        id: "ampacity:C-2",
        checkId: "ampacity",
        title: "Conductor ampacity",
        subject: "C-2",
        status,
        message: "",
        values: [{ key: "allowed", label: "Allowed ampacity", value: allowedA, unit: "A" }],
        inputs: [],
        formula: "",
        codeRefs: ["NEC 2020 310.16"],
        missing: [],
      },
    ],
  };
}

function revision(projectId: string, number: number, snapshot: Record<string, unknown>, results: unknown, reviewState: "draft" | "in-review" | "returned" = "in-review") {
  return db
    .insert(packetRevisions)
    .values({ orgId: org.id, projectId, number, state: "ready", reviewState, recordSnapshot: snapshot, resultsSnapshot: results, recordSha256: "0".repeat(64), isDraft: false, createdBy: designer.user.id })
    .returning()
    .get();
}

describe("review by delta", () => {
  it("a revision after a returned one opens on what changed: fields old → new, moved results, the earlier notes beside them", () => {
    const project = makeProject(db, org.id, jurisdiction.id);
    const base = getProjectRecord(designer, project.id).record as unknown as Record<string, unknown>;
    const site = { ...(base.site as Record<string, unknown>), designLowTempC: -10 };
    const s1 = { ...base, site };
    const first = revision(project.id, 1, s1, run("fail", 30), "returned");
    const review = db.insert(reviews).values({ orgId: org.id, revisionId: first.id, reviewerId: reviewer.user.id, decision: "returned", generalNotes: "See the ampacity note." }).returning().get();
    db.insert(reviewNotes).values({ reviewId: review.id, targetKind: "check", targetId: "ampacity:C-2", text: "C-2 is too small for its breaker." }).run();
    const s2 = { ...s1, site: { ...site, designLowTempC: -21 }, attachments: [{ kind: "site-plan", fileName: "site-plan-rev2.pdf" }] };
    const second = revision(project.id, 2, s2, run("pass", 40));

    const ws = getReviewWorkspace(reviewer, second.id);
    const delta = ws.delta!;
    expect(delta.since).toEqual({ revisionId: first.id, number: 1, decision: "returned" });
    expect(delta.record.flatMap((g) => g.changes.map(describeChange))).toEqual(["Site designLowTempC: -10 → -21"]);
    expect(delta.attachments).toEqual({ added: ["site-plan-rev2.pdf"], removed: [] });
    expect(delta.results).toEqual([
      expect.objectContaining({ id: "ampacity:C-2", statusBefore: "fail", statusAfter: "pass", values: [{ label: "Allowed ampacity", before: "30 A", after: "40 A" }] }),
    ]);
    expect(delta.earlier[0]!.notes.map((n) => n.text)).toEqual(["C-2 is too small for its breaker."]);
    expect(delta.earlier[0]!.generalNotes).toBe("See the ampacity note.");
    // The first revision has nothing before it.
    expect(getReviewWorkspace(reviewer, first.id).delta).toBeNull();
  });
});

describe("sending with a message", () => {
  it("requires a message when checks fail, keeps it and shows it to the reviewer", async () => {
    const project = makeProject(db, org.id, jurisdiction.id);
    const snapshot = getProjectRecord(designer, project.id).record as unknown as Record<string, unknown>;
    const rev = revision(project.id, 1, snapshot, run("fail", 30), "draft");
    const refused = await sendForReview(designer, rev.id, { deliver: noDelivery }).catch((e: unknown) => e as ServiceError);
    expect(refused).toBeInstanceOf(ServiceError);
    expect((refused as ServiceError).issues).toEqual([{ path: "message", message: "is required when checks fail" }]);
    await sendForReview(designer, rev.id, { deliver: noDelivery, message: "The breaker is being changed on site; please review the rest." });
    const ws = getReviewWorkspace(reviewer, rev.id);
    expect(ws.sendMessage?.text).toBe("The breaker is being changed on site; please review the rest.");
    const mail = db.select().from(outbox).where(and(eq(outbox.orgId, org.id), eq(outbox.template, "sent-for-review"))).all();
    expect(mail[0]!.bodyText).toContain("Their message: The breaker is being changed on site");
  });

  it("a revision whose checks pass may go without a message", async () => {
    const project = makeProject(db, org.id, jurisdiction.id);
    const snapshot = getProjectRecord(designer, project.id).record as unknown as Record<string, unknown>;
    const rev = revision(project.id, 1, snapshot, run("pass", 40), "draft");
    const sent = await sendForReview(designer, rev.id, { deliver: noDelivery });
    expect(sent.reviewState).toBe("in-review");
    expect(getReviewWorkspace(reviewer, rev.id).sendMessage).toBeNull();
  });
});
