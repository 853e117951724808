import { eq } from "drizzle-orm";
import { afterAll, describe, expect, it } from "vitest";
import { auditLog, jurisdictions } from "../../db/schema";
import { ServiceError } from "../../lib/services/errors";
import { getJurisdiction } from "../../lib/services/jurisdictions/get";
import { addJurisdictionNote, listJurisdictionNotes } from "../../lib/services/jurisdictions/notes";
import { previewJurisdictionEdit, updateJurisdiction } from "../../lib/services/jurisdictions/update";
import { codeOf, makeContext, makeJurisdiction, makeOrg, makeProject, tempDatabase } from "./factories";

const env = tempDatabase();
const { db } = env;
afterAll(() => env.cleanup());

const org = makeOrg(db, "Jurisdiction Keeper Firm");
const other = makeOrg(db, "Other Keeper Firm");
const office = makeContext(db, org.id, ["office"]);
const designer = makeContext(db, org.id, ["designer"]);
const outsider = makeContext(db, other.id, ["office"]);

function form(j: ReturnType<typeof getJurisdiction>, patch: Record<string, unknown> = {}) {
  return {
    name: j.name,
    region: j.region,
    necEdition: j.necEdition,
    residentialCode: j.residentialCode,
    amendments: j.amendments,
    voltageDropLimitPct: j.voltageDropLimitPct ?? "",
    storageAggregateLimitKWh: j.storageAggregateLimitKWh ?? "",
    submissionMethod: j.submissionMethod,
    contact: { name: "", email: "", phone: "", portalUrl: "", address: "" },
    typicalReviewDays: j.typicalReviewDays ?? "",
    feeNotes: j.feeNotes,
    requiredDocuments: j.requiredDocuments,
    labelRules: { material: "", reflective: false, minLetterHeightIn: "", colours: "" },
    version: j.version,
    ...patch,
  };
}

function refusal(fn: () => unknown): ServiceError {
  try {
    fn();
  } catch (error) {
    if (error instanceof ServiceError) return error;
    throw error;
  }
  throw new Error("expected a refusal");
}

describe("jurisdictions the office keeps", () => {
  it("saves an edit, names what changed, and lists the open projects whose checks change with it", () => {
    const j = makeJurisdiction(db, org.id, "2020");
    const project = makeProject(db, org.id, j.id);
    // The jurisdiction asked for no documents, so the project's submittal check passed without any.
    db.update(jurisdictions).set({ requiredDocuments: [] }).where(eq(jurisdictions.id, j.id)).run();
    const before = getJurisdiction(office, j.id);
    // A site plan becomes required: the project has none, so its submittal check now fails.
    const patch = { requiredDocuments: ["site-plan"], typicalReviewDays: "15", contact: { name: "Permit desk", email: "permits@example.test", phone: "", portalUrl: "", address: "" } };
    const preview = previewJurisdictionEdit(office, j.id, form(before, patch));
    const saved = updateJurisdiction(office, j.id, form(before, patch));
    expect(saved.changed).toEqual(expect.arrayContaining(["required documents", "typical review days", "contact"]));
    expect(saved.version).toBe(before.version + 1);
    expect(saved.knockOn).toEqual(preview);
    expect(saved.knockOn.map((p) => p.projectId)).toEqual([project.id]);
    expect(saved.knockOn[0]!.changes).toContainEqual(expect.objectContaining({ from: "pass", to: "fail" }));
    const after = getJurisdiction(office, j.id);
    expect(after.typicalReviewDays).toBe(15);
    expect(after.contact).toEqual({ name: "Permit desk", email: "permits@example.test" });
    expect(after.requiredDocuments).toEqual(["site-plan"]);
    const logged = db.select().from(auditLog).where(eq(auditLog.entityId, j.id)).all();
    expect(logged.map((l) => l.action)).toContain("jurisdiction.updated");
  });

  it("shows the knock-on of an edition change on the jurisdiction's open projects", () => {
    const j = makeJurisdiction(db, org.id, "2017");
    const project = makeProject(db, org.id, j.id);
    const before = getJurisdiction(office, j.id);
    const knockOn = previewJurisdictionEdit(office, j.id, form(before, { necEdition: "2023" }));
    // Whether a given check moves depends on the record; the list never names a project elsewhere.
    expect(knockOn.every((p) => p.projectId === project.id)).toBe(true);
    expect(getJurisdiction(office, j.id).necEdition).toBe("2017");
  });

  it("refuses bad input field by field, a stale form, and other roles, changing nothing", () => {
    const j = makeJurisdiction(db, org.id, "2023");
    const before = getJurisdiction(office, j.id);
    const bad = refusal(() =>
      updateJurisdiction(office, j.id, form(before, { name: " ", voltageDropLimitPct: "25", typicalReviewDays: "2.5", contact: { name: "", email: "not-an-address", phone: "", portalUrl: "ftp://x", address: "" } })),
    );
    expect(bad.code).toBe("invalid");
    expect(bad.issues.map((i) => i.path).sort()).toEqual(["contact.email", "contact.portalUrl", "name", "typicalReviewDays", "voltageDropLimitPct"]);
    expect(bad.issues.find((i) => i.path === "voltageDropLimitPct")!.message).toBe("must be between 0.5 and 10 %");
    expect(refusal(() => updateJurisdiction(office, j.id, form(before, { version: before.version + 5 }))).code).toBe("conflict");
    expect(codeOf(() => updateJurisdiction(designer, j.id, form(before)))).toBe("forbidden");
    expect(codeOf(() => updateJurisdiction(outsider, j.id, form(before)))).toBe("not-found");
    expect(db.select().from(jurisdictions).where(eq(jurisdictions.id, j.id)).get()).toEqual(before);
  });

  it("keeps a dated notes log with who wrote each note", () => {
    const j = makeJurisdiction(db, org.id, "2023");
    addJurisdictionNote(office, { jurisdictionId: j.id, text: "The counter wants the site plan on its own sheet, not in the packet." });
    expect(refusal(() => addJurisdictionNote(office, { jurisdictionId: j.id, text: "ok" })).issues[0]!.path).toBe("text");
    expect(codeOf(() => addJurisdictionNote(designer, { jurisdictionId: j.id, text: "Designers read the log; the office writes it." }))).toBe("forbidden");
    const log = listJurisdictionNotes(designer, j.id);
    expect(log).toHaveLength(1);
    expect(log[0]!.who).toBe(office.user.name);
    expect(log[0]!.at).toMatch(/^\d{4}-\d{2}-\d{2}T/);
  });
});
