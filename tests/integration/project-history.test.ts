import { afterAll, describe, expect, it } from "vitest";
import { getProjectRecord } from "../../lib/services/projects/get-record";
import { projectHistory } from "../../lib/services/projects/history";
import { saveProjectRecord } from "../../lib/services/projects/save-record";
import { moveProjectStatus } from "../../lib/services/projects/status";
import { codeOf, makeContext, makeJurisdiction, makeOrg, makeProject, tempDatabase } from "./factories";

const env = tempDatabase();
const { db } = env;
afterAll(() => env.cleanup());

const org = makeOrg(db, "History Firm");
const other = makeOrg(db, "Other Firm");
const designer = makeContext(db, org.id, ["designer"]);
const office = makeContext(db, org.id, ["office"]);
const installer = makeContext(db, org.id, ["installer"]);
const outsider = makeContext(db, other.id, ["designer"]);
const jurisdiction = makeJurisdiction(db, org.id);

describe("project history", () => {
  it("lists who did what on the project, newest first, in words", () => {
    const project = makeProject(db, org.id, jurisdiction.id);
    const stored = getProjectRecord(designer, project.id);
    saveProjectRecord(designer, project.id, { ...stored.record, client: "Quillfeather Solar Co." }, stored.version);
    db.transaction((tx) => moveProjectStatus(tx, designer, project.id, "in-review", { reason: "review.sent" }));
    const history = projectHistory(office, project.id);
    expect(history.map((h) => h.summary)).toEqual(["Status changed: design → in-review", "Record edited"]);
    expect(history[0]!.who).toBe(designer.user.name);
    // Another project's history stays out.
    const second = makeProject(db, org.id, jurisdiction.id);
    expect(projectHistory(office, second.id)).toEqual([]);
  });

  it("is read by the project's roles only, and not across organisations", () => {
    const project = makeProject(db, org.id, jurisdiction.id);
    expect(codeOf(() => projectHistory(installer, project.id))).toBe("forbidden");
    expect(codeOf(() => projectHistory(outsider, project.id))).toBe("not-found");
  });
});
