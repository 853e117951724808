import { expect, test, type Browser, type Page } from "@playwright/test";
import { PDFDocument, StandardFonts } from "pdf-lib";
import path from "node:path";
import { makeThrowawayCertificate, type ThrowawayCertificate } from "../unit/signing/throwaway-ca";
import { demoUser, signInAs } from "./helpers";

const ARTIFACTS = path.join(__dirname, "artifacts");
/** The seeded market stall is a complete design; the loop runs on a copy of it so the seeded rows stay as other specs expect. */
const SOURCE = "Saturday market stall";
const RUN = Date.now().toString(36);
const PROJECT = `Loop stall ${RUN}`;
const REFERENCE = `LOOP-${RUN.toUpperCase()}`;

/** The documents the jurisdiction requires, as small PDFs whose text names the run, so their hashes are new. */
const DOCUMENTS = [
  { kind: "datasheet", equipmentTag: "MOD-1" },
  { kind: "datasheet", equipmentTag: "CC-1" },
  { kind: "datasheet", equipmentTag: "BAT-1" },
  { kind: "datasheet", equipmentTag: "INV-1" },
  { kind: "storage-listing", equipmentTag: "BAT-1" },
  { kind: "site-plan", equipmentTag: "" },
];

async function pdf(text: string): Promise<Buffer> {
  const doc = await PDFDocument.create();
  const font = await doc.embedFont(StandardFonts.Helvetica);
  doc.addPage([612, 792]).drawText(text, { x: 72, y: 700, size: 12, font });
  return Buffer.from(await doc.save());
}

async function as(browser: Browser, role: Parameters<typeof signInAs>[1]): Promise<Page> {
  const context = await browser.newContext({ viewport: { width: 1440, height: 900 } });
  const page = await context.newPage();
  await signInAs(page, role);
  return page;
}

/** Generates a revision of the project and waits for its packet; the loop needs a finished, complete one. */
async function generate(page: Page, projectId: string): Promise<{ id: string; number: number }> {
  const started = await page.request.post(`/api/projects/${projectId}/revisions`);
  expect(started.status()).toBe(202);
  const body = (await started.json()) as { revisionId: string; number: number; isDraft: boolean };
  expect(body.isDraft).toBe(false);
  await expect
    .poll(async () => ((await (await page.request.get(`/api/revisions/${body.revisionId}`)).json()) as { state: string }).state, { timeout: 90_000, intervals: [1000] })
    .toBe("ready");
  return { id: body.revisionId, number: body.number };
}

async function sendForReview(page: Page, projectId: string, number: number) {
  await page.goto(`/projects/${projectId}/packet`);
  const row = page.getByRole("table", { name: "Revisions" }).getByRole("row").filter({ hasText: new RegExp(`^\\s*${number}\\b`) });
  await page.getByRole("button", { name: "Send for review" }).first().click();
  await page.getByRole("group", { name: `Send revision ${number} for review` }).getByRole("button", { name: /^Send/ }).click();
  await expect(page.getByRole("status").filter({ hasText: "sent for review" })).toBeVisible({ timeout: 30_000 });
  void row;
}

/**
 * The reviewer stamps with a signing certificate of their own, kept on the licence page first: whether one is already on
 * file depends on which other specs ran, so the loop brings its own and always signs.
 */
let certificate: ThrowawayCertificate | undefined;
async function keepCertificate(page: Page): Promise<ThrowawayCertificate> {
  certificate ??= makeThrowawayCertificate({ subjectName: demoUser("reviewer").name });
  await page.goto("/reviews/licence");
  const form = page.getByRole("form", { name: "Signing certificate" });
  await form.getByLabel(/Certificate file|Replace the certificate/).setInputFiles({ name: "loop-seal.p12", mimeType: "application/x-pkcs12", buffer: Buffer.from(certificate.p12) });
  await form.getByLabel("Certificate password").fill(certificate.password);
  await form.getByRole("button", { name: "Save certificate" }).click();
  await expect(form.getByRole("status")).toContainText("Signing certificate saved");
  return certificate;
}

async function approve(browser: Browser, revisionId: string, number: number) {
  const page = await as(browser, "reviewer");
  const seal = await keepCertificate(page);
  await page.goto("/reviews");
  await page.getByRole("table", { name: "Awaiting review" }).getByRole("link", { name: new RegExp(`^${PROJECT}`) }).click();
  await expect(page.getByRole("heading", { level: 1, name: new RegExp(`^${PROJECT}`) })).toBeVisible();
  // Every point to confirm on site gets the reviewer's disposition before the stamp.
  for (const fieldset of await page.getByRole("group", { name: /^Disposition of / }).all()) {
    await fieldset.getByLabel("Accept").check();
    await fieldset.getByRole("textbox").fill("Confirmed against the installer's nameplate photos.");
  }
  await page.getByRole("button", { name: "Approve and stamp", exact: true }).click();
  const dialog = page.getByRole("dialog");
  await dialog.getByRole("checkbox").check();
  await dialog.getByLabel(/signing certificate/i).fill(seal.password);
  await dialog.getByRole("button", { name: `Approve and stamp revision ${number}` }).click();
  await expect(page.getByRole("status").filter({ hasText: /approved|stamped/i })).toBeVisible({ timeout: 60_000 });
  // The stamped set is rendered again after approval; until it is ready it is not offered for submission.
  await expect
    .poll(async () => ((await (await page.request.get(`/api/revisions/${revisionId}`)).json()) as { state: string }).state, { timeout: 90_000, intervals: [1000] })
    .toBe("ready");
  await page.context().close();
}

async function recordEvent(page: Page, kind: string, fill?: (form: ReturnType<Page["getByRole"]>) => Promise<void>) {
  const form = page.getByRole("form", { name: "Record an event" });
  await form.getByLabel("Event").selectOption(kind);
  if (fill) await fill(form);
  await form.getByRole("button", { name: "Record event" }).click();
  return form;
}

/** Records an event and waits for the page to say so, so the next one starts from a settled form. */
async function recordEventOk(page: Page, kind: string, label: string, fill?: (form: ReturnType<Page["getByRole"]>) => Promise<void>) {
  const form = await recordEvent(page, kind, fill);
  await expect(form.getByRole("status")).toContainText(`${label} recorded`);
  await page.reload();
}

test.use({ viewport: { width: 1440, height: 900 } });

test("the whole loop: designer sends, reviewer approves, office submits, the AHJ's comments are answered, resubmitted, permitted and installed", async ({ browser }) => {
  test.setTimeout(600_000);

  // 1. The designer copies the stall, attaches the required documents, generates revision 1 and sends it.
  const designer = await as(browser, "designer");
  await designer.goto("/projects");
  await designer.getByRole("link", { name: new RegExp(`^${SOURCE}`) }).first().click();
  await expect(designer).toHaveURL(/\/projects\/[0-9a-f-]{36}$/);
  const sourceId = /\/projects\/([0-9a-f-]{36})/.exec(designer.url())![1]!;
  const file = (await (await designer.request.get(`/api/projects/${sourceId}/export`)).json()) as Record<string, unknown>;
  const imported = await designer.request.post("/api/projects/import", { data: { file: { ...file, name: PROJECT, attachments: [] } } });
  expect(imported.status()).toBe(201);
  const projectId = ((await imported.json()) as { id: string }).id;
  for (const d of DOCUMENTS) {
    const upload = await designer.request.post("/api/uploads", {
      multipart: {
        projectId,
        kind: d.kind,
        equipmentTag: d.equipmentTag,
        file: { name: `${d.kind}-${d.equipmentTag || "site"}-${RUN}.pdf`, mimeType: "application/pdf", buffer: await pdf(`${d.kind} ${d.equipmentTag} ${RUN}`) },
      },
      headers: { origin: new URL(designer.url()).origin },
    });
    expect(upload.status(), await upload.text()).toBeLessThan(300);
  }
  const rev1 = await generate(designer, projectId);
  await sendForReview(designer, projectId, rev1.number);

  // 2. The reviewer approves revision 1 in the browser.
  await approve(browser, rev1.id, rev1.number);

  // 3. The office submits it, and the AHJ's plan review comes back with three comments.
  const office = await as(browser, "office");
  // The office heard of the approval by mail.
  await office.goto("/outbox");
  await expect(office.locator("main")).toContainText(`Ready to submit: ${PROJECT} — revision ${rev1.number}`);
  await office.goto("/submissions/new");
  const submitForm = office.getByRole("form", { name: `Submit ${PROJECT}, revision ${rev1.number}` });
  await submitForm.getByLabel("Reference number").fill(REFERENCE);
  await submitForm.getByRole("button", { name: "Record submission" }).click();
  // Once recorded, the revision leaves the list of those waiting to be submitted.
  await expect(submitForm).toHaveCount(0);
  await office.goto("/submissions");
  await office.getByRole("table", { name: "Submissions" }).getByRole("row").filter({ has: office.getByRole("cell", { name: REFERENCE, exact: true }) }).getByRole("link").first().click();
  await expect(office).toHaveURL(/\/submissions\/[0-9a-f-]{36}$/);
  const submissionUrl = office.url();
  await recordEventOk(office, "in-plan-review", "In plan review");
  await expect(office.getByRole("list", { name: "Timeline" })).toContainText("In plan review");

  // A letter pasted whole: split into its numbered comments, sheet and citation read from each.
  const letter = [
    "Plan review comments",
    "1. Sheet E-002: show the rating of the battery disconnect. NEC 706.15(C)",
    "2. Provide the storage system's listing with the resubmittal.",
    "3. Label the rapid shutdown switch on sheet PV-3. 690.56(C)",
  ].join("\n");
  const form = office.getByRole("form", { name: "Record an event" });
  await form.getByLabel("Event").selectOption("corrections-requested");
  await form.getByLabel("The AHJ's comments").fill(letter);
  const preview = form.getByRole("table", { name: "Comments to record" });
  await expect(preview.getByRole("row")).toHaveCount(4);
  await expect(form.getByLabel("Sheet of comment 1")).toHaveValue("E-002");
  await expect(form.getByLabel("Citation of comment 3")).toHaveValue("690.56(C)");
  await form.getByRole("button", { name: "Record event" }).click();
  await expect(form.getByRole("status")).toContainText("Corrections requested recorded");
  const comments = office.getByRole("table", { name: "Comments" });
  await expect(comments.getByRole("row")).toHaveCount(4);
  await expect(office.getByRole("region", { name: "The AHJ's comments" })).toContainText("3 of 3 open");
  await office.screenshot({ path: path.join(ARTIFACTS, "submission-comments-1440.png"), fullPage: true });

  // 4. The designer answers them on the project; a resubmittal is refused while one is open.
  await designer.goto(`/projects/${projectId}`);
  await designer.getByRole("navigation", { name: "Project" }).getByRole("link", { name: "Corrections (3 open)" }).click();
  const card = (n: number) => designer.getByRole("article", { name: `Comment ${n}` });
  await expect(card(1)).toContainText("Sheet E-002");
  // Too short to be an answer: the button waits for one.
  await card(1).getByLabel("Response").fill("ok");
  await expect(card(1).getByRole("button", { name: "Mark resolved" })).toBeDisabled();
  await card(1).getByLabel("Response").fill("Disconnect rating 250 A shown on E-002, detail 3.");
  await card(1).getByRole("button", { name: "Mark resolved" }).click();
  await expect(card(1)).toContainText("Resolved");
  await card(2).getByLabel("Response").fill("Storage listing attached to the resubmittal.");
  await card(2).getByRole("button", { name: "Mark resolved" }).click();
  await expect(card(2)).toContainText("Resolved");
  await expect(designer.getByRole("navigation", { name: "Project" })).toContainText("Corrections (1 open)");
  await designer.screenshot({ path: path.join(ARTIFACTS, "project-corrections-1440.png"), fullPage: true });

  // Revision 2 answers the letter; it is reviewed and approved again.
  const rev2 = await generate(designer, projectId);
  await sendForReview(designer, projectId, rev2.number);
  await approve(browser, rev2.id, rev2.number);

  await office.goto(submissionUrl);
  await recordEvent(office, "resubmitted");
  await expect(office.getByRole("form", { name: "Record an event" }).getByRole("alert")).toContainText("comment 3 is still open");
  await office.reload();
  await expect(office.getByRole("list", { name: "Timeline" })).not.toContainText("Resubmitted");

  await designer.goto(`/projects/${projectId}/corrections`);
  await card(3).getByLabel("Response").fill("Label L-6 added at the rapid shutdown switch, sheet PV-3.");
  await card(3).getByRole("button", { name: "Mark resolved" }).click();
  await expect(designer.getByRole("status").filter({ hasText: "All 3 comments are resolved." })).toBeVisible();
  const sheet = await designer.request.get(await designer.getByRole("link", { name: "Response sheet (PDF)" }).getAttribute("href").then((h) => h!));
  expect(sheet.headers()["content-type"]).toBe("application/pdf");
  expect((await sheet.body()).subarray(0, 5).toString()).toBe("%PDF-");

  // 5. The office resubmits revision 2, records the permit; the installer confirms on site.
  await office.goto(submissionUrl);
  await recordEventOk(office, "resubmitted", "Resubmitted");
  await expect(office.getByRole("list", { name: "Timeline" })).toContainText("Resubmitted");
  await recordEventOk(office, "approved", "Approved by the AHJ");
  await recordEventOk(office, "permit-issued", "Permit issued", async (f) => {
    await f.getByLabel("Permit number").fill(`P-${RUN}`);
  });
  await expect(office.getByRole("list", { name: "Timeline" })).toContainText(`Permit P-${RUN}`);
  // Out of order: nothing after a permit goes back to plan review.
  const kinds = await office.getByRole("form", { name: "Record an event" }).getByLabel("Event").locator("option").evaluateAll((os) => os.map((o) => (o as HTMLOptionElement).value));
  expect(kinds).not.toContain("corrections-requested");

  const installer = await as(browser, "installer");
  await installer.goto("/install");
  await installer.getByRole("table", { name: "Approved sets" }).getByRole("row").filter({ hasText: PROJECT }).getByRole("link").first().click();
  const first = installer.getByRole("button", { name: /mark as done/ }).first();
  const itemName = (await first.getAttribute("aria-label"))!.replace(/: mark as done$/, "");
  await first.click();
  await expect(installer.getByRole("button", { name: `${itemName}: confirmed, click to undo` })).toBeVisible();

  // The project's history tells the loop in order.
  await designer.goto(`/projects/${projectId}/history`);
  const history = designer.getByRole("table", { name: "Project history" });
  for (const words of ["Project imported", "Sent for review", "Approved and stamped", "Submitted to the AHJ", "AHJ comment answered: comment 3", "Confirmed on site"]) {
    await expect(history).toContainText(words);
  }
});
