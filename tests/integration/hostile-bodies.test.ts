import fs from "node:fs";
import fc from "fast-check";
import { afterAll, describe, expect, it, vi } from "vitest";

/**
 * Thousands of generated bodies against every route that reads a body and
 * every server action, sent as the role that may use it (so the body, not the
 * role, is what gets refused): no answer is a 5xx, a refused body changes no
 * row and no stored file, and the refusal says in words what was wrong.
 */

const dirs = await vi.hoisted(async () => {
  const fsp = await import("node:fs");
  const os = await import("node:os");
  const p = await import("node:path");
  const { randomBytes } = await import("node:crypto");
  const root = fsp.mkdtempSync(p.join(os.tmpdir(), "sundocket-hostile-"));
  // Set before any module reads the environment, so nothing touches the developer's own database.
  process.env.DATABASE_PATH = p.join(root, "app.db");
  process.env.UPLOADS_DIR = p.join(root, "uploads");
  process.env.PACKETS_DIR = p.join(root, "packets");
  process.env.APP_URL = "http://localhost:3000";
  process.env.CERTIFICATE_KEY = randomBytes(32).toString("base64");
  return { root, uploads: p.join(root, "uploads"), packets: p.join(root, "packets"), database: p.join(root, "app.db") };
});

let session: unknown = null;
vi.mock("@/auth", () => ({ auth: async () => session, signIn: async () => undefined, signOut: async () => undefined, handlers: {} }));
vi.mock("next/cache", () => ({ revalidatePath: () => undefined, revalidateTag: () => undefined }));
// Server actions may read the request's Origin and Host; these calls stand for the app's own pages.
vi.mock("next/headers", () => ({ headers: async () => new Headers({ origin: "http://localhost:3000", host: "localhost:3000", "sec-fetch-site": "same-origin" }) }));

const { getDb } = await import("../../db/client");
const { buildWorld, sessionOf } = await import("./access/world");
const { hostileFileBytes, hostileFormFields, hostileJsonText, hostileValue, claimedMime } = await import("./access/hostile");
const { action, form, http } = await import("./access/requests");
type Outcome = import("./access/requests").Outcome;
type Role = import("../../lib/auth/roles").Role;

/** A route module, or null once the route is gone (the access table's own test says which handlers exist). */
const optional = <T,>(load: Promise<T>): Promise<T | null> => load.catch(() => null);

const routes = {
  projects: await import("../../app/api/projects/route"),
  project: await import("../../app/api/projects/[id]/route"),
  projectImport: await import("../../app/api/projects/import/route"),
  checks: await import("../../app/api/checks/route"),
  attachment: await import("../../app/api/attachments/[id]/route"),
  library: await import("../../app/api/library/route"),
  libraryItem: await import("../../app/api/library/[id]/route"),
  libraryRetire: await import("../../app/api/library/[id]/retire/route"),
  libraryRestore: await import("../../app/api/library/[id]/restore/route"),
  libraryImport: await import("../../app/api/library/import/route"),
  send: await optional(import("../../app/api/revisions/[id]/send/route")),
  submissions: await optional(import("../../app/api/submissions/route")),
  uploads: await import("../../app/api/uploads/route"),
  stamp: await import("../../app/api/reviews/licence/stamp/route"),
  verify: await import("../../app/api/verify/route"),
  templates: await optional(import("../../app/api/templates/route")),
  template: await optional(import("../../app/api/templates/[id]/route")),
  correction: await optional(import("../../app/api/corrections/[itemId]/route")),
  reviewNote: await optional(import("../../app/api/review-notes/[noteId]/route")),
};
const reviewsRoute = await import("../../app/api/reviews/route");
const labelsRoute = await import("../../app/api/install/[revisionId]/labels/route");
const actions = {
  admin: await import("../../app/(app)/admin/users/actions"),
  submissions: await import("../../app/(app)/submissions/actions"),
  templates: await import("../../app/(app)/jurisdictions/[id]/actions"),
  reviews: await import("../../app/(app)/reviews/actions"),
  password: await import("../../app/(app)/account/password/actions"),
  install: await import("../../app/(app)/install/[revisionId]/actions"),
};

const db = getDb();
const world = await buildWorld(db, dirs.packets, dirs.uploads);
const draftRevisionId = await world.fresh.draftRevision();
const retiredItemId = world.fresh.libraryItem(true);
const { saveTemplateFromProject } = await import("../../lib/services/templates/save");
const templateId = saveTemplateFromProject(world.ctx.designer, world.projectId, { name: "Hut kit" }).id;
const { freshCorrection, freshReviewNote } = await import("./access/table");
const { itemId: correctionId } = await freshCorrection(world);
const { noteId } = await freshReviewNote(world);
afterAll(() => fs.rmSync(dirs.root, { recursive: true, force: true }));

const actorFor = (role: Role) => world.actors.find((a) => a.kind === "user" && a.org === "own" && a.role === role)!;

/** Rows written by the app's own connection, and files in the stores: both stay put when a body is refused. */
function writes(): string {
  const changes = (db.$client.prepare("select total_changes() as n").get() as { n: number }).n;
  const files = [dirs.uploads, dirs.packets].map((d) => (fs.existsSync(d) ? fs.readdirSync(d, { recursive: true }).length : 0));
  return `${changes} rows, ${files.join("+")} files`;
}

/** Words a person can act on, not a stack trace or a serialised object. */
function expectClearRefusal(outcome: Outcome) {
  const body = JSON.parse(outcome.text) as { error?: unknown };
  expect(typeof body.error, outcome.text).toBe("string");
  const message = body.error as string;
  expect(message.length, outcome.text).toBeGreaterThanOrEqual(12);
  // A value the sender typed comes back between curly quotes; only the words around it must be free of leaks.
  const ownWords = message.replace(/“[^”]*”/g, "“…”");
  expect(ownWords, message).not.toMatch(/\n\s+at |\[object Object\]|TypeError|SyntaxError|ReferenceError|Cannot read propert|is not a function|undefined/);
}

const tally = new Map<string, Map<number, number>>();
const HOSTILE_RUNS = Number(process.env.HOSTILE_RUNS ?? 100);

async function hostile(name: string, role: Role | null, outcomeOf: () => Promise<Outcome>) {
  const before = writes();
  session = role ? sessionOf(db, actorFor(role)) : null;
  const outcome = await outcomeOf().finally(() => (session = null));
  const counts = tally.get(name) ?? new Map<number, number>();
  counts.set(outcome.status, (counts.get(outcome.status) ?? 0) + 1);
  tally.set(name, counts);
  expect(outcome.status, outcome.text.slice(0, 400)).toBeLessThan(500);
  if (outcome.status >= 400) {
    expect(writes(), `${name} changed something while refusing: ${outcome.text.slice(0, 300)}`).toBe(before);
    expectClearRefusal(outcome);
  }
}

interface JsonTarget {
  name: string;
  role: Role | null;
  keys: readonly string[];
  send: ((text: string) => Promise<Outcome>) | null;
}

const json = (handler: unknown, method: string, url: string, params: Record<string, string> = {}) =>
  handler ? (text: string) => http(handler, method, url, { text: { body: text, type: "application/json" }, params }) : null;

const JSON_TARGETS: JsonTarget[] = [
  { name: "POST /api/projects", role: "designer", keys: ["name", "client", "systemKind", "jurisdictionId", "address"], send: json(routes.projects.POST, "POST", "/api/projects") },
  {
    name: "PUT /api/projects/[id]",
    role: "designer",
    keys: ["version", "record", "equipment", "circuits", "site", "name"],
    send: json(routes.project.PUT, "PUT", `/api/projects/${world.projectId}`, { id: world.projectId }),
  },
  { name: "POST /api/projects/import", role: "designer", keys: ["file", "jurisdictionId", "equipment", "schemaVersion"], send: json(routes.projectImport.POST, "POST", "/api/projects/import") },
  { name: "POST /api/checks", role: "designer", keys: ["name", "equipment", "circuits", "site", "systemKind", "loads"], send: json(routes.checks.POST, "POST", "/api/checks") },
  { name: "PATCH /api/attachments/[id]", role: "designer", keys: ["equipmentTag"], send: json(routes.attachment.PATCH, "PATCH", `/api/attachments/${world.datasheetId}`, { id: world.datasheetId }) },
  { name: "POST /api/library", role: "designer", keys: ["kind", "manufacturer", "model", "vocV", "iscA", "listing"], send: json(routes.library.POST, "POST", "/api/library") },
  {
    name: "PATCH /api/library/[id]",
    role: "designer",
    keys: ["version", "item", "kind", "model"],
    send: json(routes.libraryItem.PATCH, "PATCH", `/api/library/${world.libraryItemId}`, { id: world.libraryItemId }),
  },
  { name: "POST /api/library/[id]/retire", role: "designer", keys: ["version"], send: json(routes.libraryRetire.POST, "POST", `/api/library/${world.libraryItemId}/retire`, { id: world.libraryItemId }) },
  { name: "POST /api/library/[id]/restore", role: "designer", keys: ["version"], send: json(routes.libraryRestore.POST, "POST", `/api/library/${retiredItemId}/restore`, { id: retiredItemId }) },
  { name: "POST /api/templates", role: "designer", keys: ["projectId", "name", "description", "replaceTemplateId", "expectedVersion"], send: json(routes.templates?.POST, "POST", "/api/templates") },
  { name: "PATCH /api/templates/[id]", role: "designer", keys: ["version", "name", "description"], send: json(routes.template?.PATCH, "PATCH", `/api/templates/${templateId}`, { id: templateId }) },
  {
    name: "POST /api/corrections/[itemId]",
    role: "designer",
    keys: ["action", "response", "assigneeId", "version", "text"],
    send: json(routes.correction?.POST, "POST", `/api/corrections/${correctionId}`, { itemId: correctionId! }),
  },
  { name: "POST /api/review-notes/[noteId]", role: "designer", keys: ["action", "body", "seen"], send: json(routes.reviewNote?.POST, "POST", `/api/review-notes/${noteId}`, { noteId: noteId! }) },
  { name: "POST /api/revisions/[id]/send", role: "designer", keys: ["message"], send: json(routes.send?.POST, "POST", `/api/revisions/${draftRevisionId}/send`, { id: draftRevisionId }) },
  { name: "POST /api/verify", role: null, keys: ["sha256"], send: (text) => http(routes.verify.POST, "POST", "/api/verify", { text: { body: text, type: "application/json" }, headers: { "x-forwarded-for": `192.0.2.${Math.floor(Math.random() * 250)}` } }) },
];

describe("hostile JSON bodies", () => {
  for (const { send, ...target } of JSON_TARGETS) {
    if (!send) continue;
    it(`${target.name}: ${HOSTILE_RUNS} generated bodies, none a 5xx, none refused with a change`, async () => {
      await fc.assert(
        fc.asyncProperty(hostileJsonText(target.keys), async (text) => hostile(target.name, target.role, () => send(text))),
        { numRuns: HOSTILE_RUNS },
      );
    }, 180_000);

    it(`${target.name}: a 3 MB body is refused with 413 before it is parsed`, async () => {
      const big = JSON.stringify({ [target.keys[0]!]: "x".repeat(3 * 1024 * 1024) });
      await hostile(target.name, target.role, async () => {
        const outcome = await send(big);
        expect(outcome.status, outcome.text).toBe(413);
        return outcome;
      });
    }, 60_000);
  }
});

interface ActionTarget {
  name: string;
  role: Role;
  keys: readonly string[];
  call: (input: unknown) => Promise<Outcome>;
}

const OBJECT_ACTIONS: ActionTarget[] = [
  { name: "decideReviewAction", role: "reviewer", keys: ["revisionId", "decision", "generalNotes", "notes", "dispositions", "confirmStamp", "certificatePassword"], call: (i) => action(actions.reviews.decideReviewAction(i as never)) },
  { name: "saveSheetTemplateAction", role: "office", keys: ["jurisdictionId", "name", "source", "version"], call: (i) => action(actions.templates.saveSheetTemplateAction(i as never)) },
  { name: "previewSheetTemplateAction", role: "office", keys: ["jurisdictionId", "name", "source"], call: (i) => action(actions.templates.previewSheetTemplateAction(i as never)) },
  { name: "attachPhotoAction", role: "installer", keys: ["revisionId", "itemKind", "itemId", "photoAttachmentId"], call: (i) => action(actions.install.attachPhotoAction(i as never)) },
  { name: "saveJurisdictionAction", role: "office", keys: ["version", "name", "necEdition", "typicalReviewDays", "amendments", "contact", "region"], call: (i) => action(actions.templates.saveJurisdictionAction(world.jurisdictionId, i)) },
  { name: "previewJurisdictionAction", role: "office", keys: ["version", "necEdition", "voltageDropLimitPct"], call: (i) => action(actions.templates.previewJurisdictionAction(world.jurisdictionId, i)) },
  { name: "addJurisdictionNoteAction", role: "office", keys: ["jurisdictionId", "text"], call: (i) => action(actions.templates.addJurisdictionNoteAction(i as never)) },
  { name: "renderStampedPacketAgainAction", role: "reviewer", keys: [], call: (i) => action(actions.reviews.renderStampedPacketAgainAction(i as never)) },
  { name: "signPacketAction", role: "reviewer", keys: [], call: (i) => action(actions.reviews.signPacketAction(i as never, i as never)) },
];

describe("hostile arguments to server actions (a client can send any serialisable value)", () => {
  for (const target of OBJECT_ACTIONS) {
    it(`${target.name}: ${HOSTILE_RUNS} generated arguments`, async () => {
      const known = target.keys.length ? target.keys : ["revisionId"];
      const input = fc.oneof(fc.dictionary(fc.constantFrom(...known), hostileValue(known), { maxKeys: 8 }), hostileValue(known));
      await fc.assert(fc.asyncProperty(input, async (value) => hostile(target.name, target.role, () => target.call(value))), { numRuns: HOSTILE_RUNS });
    }, 180_000);
  }
});

interface FormTarget {
  name: string;
  role: Role;
  keys: readonly string[];
  call: (data: FormData) => Promise<Outcome>;
}

const FORM_ACTIONS: FormTarget[] = [
  { name: "addUserAction", role: "admin", keys: ["name", "email", "password", "role-designer", "role-admin"], call: (f) => action(actions.admin.addUserAction(null, f)) },
  { name: "setRolesAction", role: "admin", keys: ["userId", "version", "role-designer", "role-admin"], call: (f) => action(actions.admin.setRolesAction(null, f)) },
  { name: "setActiveAction", role: "admin", keys: ["userId", "version", "active"], call: (f) => action(actions.admin.setActiveAction(null, f)) },
  { name: "createSubmissionAction", role: "office", keys: ["revisionId", "method", "referenceNumber", "occurredOn", "note"], call: (f) => action(actions.submissions.createSubmissionAction(null, f)) },
  {
    name: "recordEventAction",
    role: "office",
    keys: ["submissionId", "kind", "occurredOn", "note", "permitNumber", "expiresOn", "amountUsd", "inspectionKind", "revisionId", "version"],
    call: (f) => action(actions.submissions.recordEventAction(null, f)),
  },
  { name: "voidEventAction", role: "office", keys: ["submissionId", "eventId", "reason", "version"], call: (f) => action(actions.submissions.voidEventAction(null, f)) },
  { name: "saveLicenceAction", role: "reviewer", keys: ["licenceNumber", "region", "discipline", "expiresOn", "version"], call: (f) => action(actions.reviews.saveLicenceAction(null, f)) },
  { name: "toggleConfirmationAction", role: "installer", keys: ["revisionId", "itemKind", "itemId", "confirmed"], call: (f) => action(actions.install.toggleConfirmationAction(null, f)) },
];

describe("hostile form posts to server actions", () => {
  for (const target of FORM_ACTIONS) {
    it(`${target.name}: ${HOSTILE_RUNS} generated forms`, async () => {
      await fc.assert(fc.asyncProperty(hostileFormFields(target.keys), async (fields) => hostile(target.name, target.role, () => target.call(form(fields)))), { numRuns: HOSTILE_RUNS });
    }, 180_000);
  }
});

const hostileFile = fc.record({ bytes: hostileFileBytes, type: claimedMime, name: fc.oneof(fc.string({ maxLength: 300 }), fc.constantFrom("a.pdf", "../../x.png", "con.jpg", "\u202egpj.exe")) });
const fileOf = (f: { bytes: Uint8Array; type: string; name: string }) => new File([f.bytes as Uint8Array<ArrayBuffer>], f.name || "unnamed", { type: f.type });

describe("hostile uploads", () => {
  const UPLOAD_RUNS = Math.max(20, Math.round(HOSTILE_RUNS / 2));

  it(`POST /api/uploads: ${UPLOAD_RUNS} generated files and fields`, async () => {
    await fc.assert(
      fc.asyncProperty(hostileFile, hostileFormFields(["projectId", "kind", "equipmentTag"]), fc.boolean(), async (file, fields, ownProject) => {
        const data = form(ownProject ? { ...fields, projectId: world.projectId } : fields, { file: fileOf(file) });
        await hostile("POST /api/uploads", "designer", () => http(routes.uploads.POST, "POST", "/api/uploads", { form: data }));
      }),
      { numRuns: UPLOAD_RUNS },
    );
  }, 180_000);

  it(`POST /api/reviews/licence/stamp: ${UPLOAD_RUNS} generated images`, async () => {
    await fc.assert(
      fc.asyncProperty(hostileFile, async (file) => hostile("POST /api/reviews/licence/stamp", "reviewer", () => http(routes.stamp.POST, "POST", "/api/reviews/licence/stamp", { form: form({}, { file: fileOf(file) }) }))),
      { numRuns: UPLOAD_RUNS },
    );
  }, 180_000);

  it(`POST /api/library/import: ${UPLOAD_RUNS} generated files`, async () => {
    await fc.assert(
      fc.asyncProperty(hostileFile, async (file) => hostile("POST /api/library/import", "designer", () => http(routes.libraryImport.POST, "POST", "/api/library/import", { form: form({}, { file: fileOf(file) }) }))),
      { numRuns: UPLOAD_RUNS },
    );
  }, 180_000);

  it(`uploadCertificateAction: ${UPLOAD_RUNS} generated certificate files`, async () => {
    await fc.assert(
      fc.asyncProperty(hostileFile, fc.string({ maxLength: 80 }), async (file, password) =>
        hostile("uploadCertificateAction", "reviewer", () => action(actions.reviews.uploadCertificateAction(null, form({ certificatePassword: password }, { certificate: fileOf(file) })))),
      ),
      { numRuns: UPLOAD_RUNS },
    );
  }, 180_000);

  it(`POST /api/verify: ${UPLOAD_RUNS} generated files, raw and in a form`, async () => {
    await fc.assert(
      fc.asyncProperty(hostileFile, fc.boolean(), async (file, raw) =>
        hostile("POST /api/verify (file)", null, () =>
          raw
            ? http(routes.verify.POST, "POST", "/api/verify", { text: { body: new TextDecoder().decode(file.bytes), type: file.type || "application/pdf" }, headers: { "x-forwarded-for": `192.0.2.${Math.floor(Math.random() * 250)}` } })
            : http(routes.verify.POST, "POST", "/api/verify", { form: form({}, { file: fileOf(file) }), headers: { "x-forwarded-for": `192.0.2.${Math.floor(Math.random() * 250)}` } }),
        ),
      ),
      { numRuns: UPLOAD_RUNS },
    );
  }, 180_000);

  it("malformed multipart bodies (a boundary that never comes, a cut-off part) are refused in words", async () => {
    await fc.assert(
      fc.asyncProperty(fc.string({ unit: "binary", maxLength: 400 }), fc.constantFrom("uploads", "stamp", "libraryImport"), async (text, which) => {
        const role: Role = which === "stamp" ? "reviewer" : "designer";
        const handler = routes[which as "uploads" | "stamp" | "libraryImport"].POST;
        await hostile(`malformed multipart to ${which}`, role, () =>
          http(handler, "POST", "/api/x", { text: { body: `--b\r\nContent-Disposition: form-data; name="file"; filename="a.pdf"\r\n\r\n${text}`, type: "multipart/form-data; boundary=b" } }),
        );
      }),
      { numRuns: HOSTILE_RUNS },
    );
  }, 180_000);
});

describe("hostile query strings on the routes that read them", () => {
  const TARGETS: { name: string; role: Role | null; url: (q: string) => string; handler: unknown; params?: Record<string, string> }[] = [
    { name: "GET /api/projects?cursor&limit", role: "designer", handler: routes.projects.GET, url: (q) => `/api/projects?cursor=${q}&limit=${q}` },
    { name: "GET /api/submissions?cursor&limit", role: "office", handler: routes.submissions?.GET, url: (q) => `/api/submissions?cursor=${q}&limit=${q}` },
    { name: "GET /api/library?kind", role: "designer", handler: routes.library.GET, url: (q) => `/api/library?kind=${q}&includeRetired=${q}` },
    { name: "GET /api/reviews?projectId&revisionId", role: "reviewer", handler: reviewsRoute.GET, url: (q) => `/api/reviews?projectId=${q}&revisionId=${q}` },
    { name: "GET /api/install/[revisionId]/labels?stock&only", role: "installer", handler: labelsRoute.GET, url: (q) => `/api/install/${world.approvedRevisionId}/labels?stock=${q}&only=${q}`, params: { revisionId: world.approvedRevisionId } },
    { name: "GET /api/verify?sha256", role: null, handler: routes.verify.GET, url: (q) => `/api/verify?sha256=${q}` },
    { name: "POST /api/checks?edition", role: "designer", handler: routes.checks.POST, url: (q) => `/api/checks?edition=${q}` },
  ];
  for (const target of TARGETS) {
    if (!target.handler) continue;
    it(`${target.name}: ${HOSTILE_RUNS} generated values`, async () => {
      const value = fc.oneof(fc.string({ unit: "grapheme", maxLength: 80 }), fc.string({ unit: "binary", maxLength: 80 }), fc.constantFrom("-1", "0", "1e9", "NaN", "__proto__", "constructor", "%", "%00", "..%2F..%2F"));
      await fc.assert(
        fc.asyncProperty(value, async (q) => {
          const url = target.url(encodeURIComponent(q));
          const headers = { "x-forwarded-for": `198.18.0.${Math.floor(Math.random() * 250)}` };
          const send = target.handler === routes.checks.POST ? () => http(target.handler, "POST", url, { json: world.record, headers }) : () => http(target.handler, "GET", url, { params: target.params ?? {}, headers });
          await hostile(target.name, target.role, send);
        }),
        { numRuns: HOSTILE_RUNS },
      );
    }, 180_000);
  }
});

describe("the run", () => {
  it("prints what every target answered", () => {
    let total = 0;
    for (const [name, counts] of tally) {
      const line = [...counts].sort((a, b) => a[0] - b[0]).map(([status, n]) => `${status}×${n}`).join(" ");
      total += [...counts.values()].reduce((a, b) => a + b, 0);
      console.log(`${name.padEnd(52)} ${line}`);
    }
    console.log(`${total} hostile requests, ${[...tally.values()].reduce((n, c) => n + [...c].filter(([s]) => s >= 500).reduce((a, [, k]) => a + k, 0), 0)} answered 5xx`);
    expect(total).toBeGreaterThan(HOSTILE_RUNS * 20);
  });
});
