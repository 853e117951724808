import { expect, test } from "@playwright/test";
import { signInAs } from "./helpers";

/** The seeded market-stall submission (permit issued); this spec appends a scheduled final inspection to it. */
const REFERENCE = "KF-ELEC-2026-0417";

test("the office opens the seeded submission, schedules the final inspection and finds it in the timeline after a reload", async ({ page }) => {
  await signInAs(page, "office");
  await page.goto("/submissions");
  await expect(page.getByRole("link", { name: "New submission" })).toBeVisible();
  const row = page.getByRole("table", { name: "Submissions" }).getByRole("row").filter({ has: page.getByRole("cell", { name: REFERENCE, exact: true }) });
  await row.getByRole("link").first().click();
  await expect(page).toHaveURL(/\/submissions\/[0-9a-f-]{36}$/);

  const timeline = page.getByRole("list", { name: "Timeline" });
  await expect(timeline).toContainText("Permit E26-01893");
  await expect(page.getByRole("region", { name: "Submission", exact: true })).toContainText(REFERENCE);

  const form = page.getByRole("form", { name: "Record an event" });
  await form.getByLabel("Event").selectOption("inspection-scheduled");
  // The inspection field appears only for inspection events; without it the event is refused at the field.
  const inspection = form.getByLabel("Inspection", { exact: true });
  await expect(inspection).toBeVisible();
  const day = new Date(Date.now() + 14 * 86_400_000).toISOString().slice(0, 10);
  await form.getByLabel("Inspection on").fill(day);
  await inspection.selectOption("final");
  const note = `Final inspection booked through the portal (${Date.now().toString(36)}).`;
  await form.getByLabel("Note").fill(note);
  await form.getByRole("button", { name: "Record event" }).click();
  await expect(form.getByRole("status")).toContainText("Inspection scheduled recorded");

  await page.reload();
  const entry = page.getByRole("list", { name: "Timeline" }).getByRole("listitem").filter({ hasText: note });
  await expect(entry).toContainText("Inspection scheduled");
  await expect(entry).toContainText("Final inspection");
  await expect(entry).toContainText(day);
  await expect(entry).toContainText("Recorded by Theo Brannigan");
  // The earlier entries stand as they were.
  await expect(page.getByRole("list", { name: "Timeline" })).toContainText("Permit E26-01893");

  // The form offers only what may follow a permit: no second "Submitted", no plan-review steps.
  const kinds = await page.getByRole("form", { name: "Record an event" }).getByLabel("Event").locator("option").evaluateAll((os) => os.map((o) => (o as HTMLOptionElement).value));
  expect(kinds).toContain("inspection-passed");
  expect(kinds).not.toContain("submitted");
  expect(kinds).not.toContain("corrections-requested");

  // An entry recorded in error is voided with a reason: it stays in the log, struck, and a void entry follows.
  await entry.getByRole("button", { name: /^Void / }).click();
  const voidForm = entry.getByRole("form", { name: /^Void / });
  await voidForm.getByLabel("Why is this entry wrong?").fill("Booked on the wrong permit; the portal cancelled it.");
  await voidForm.getByRole("button", { name: "Void entry" }).click();
  await expect(entry).toContainText("Booked on the wrong permit");
  await expect(entry).toHaveAttribute("data-voided", "true");
  await expect(page.getByRole("list", { name: "Timeline" })).toContainText("Voided: Inspection scheduled");
});

test("a designer reads the seeded submission but may not record an event on it", async ({ page }) => {
  await signInAs(page, "designer");
  const list = await page.request.get("/api/submissions");
  expect(list.status()).toBe(200);
  const { submissions } = (await list.json()) as { submissions: { submissionId: string; referenceNumber: string }[] };
  const seeded = submissions.find((s) => s.referenceNumber === REFERENCE);
  expect(seeded).toBeDefined();
  const before = ((await (await page.request.get(`/api/submissions/${seeded!.submissionId}`)).json()) as { submission: { events: unknown[] } }).submission.events.length;

  // Events are written only by the office's form; no route handler takes them, so a script cannot go around it.
  const refused = await page.request.post(`/api/submissions/${seeded!.submissionId}/events`, { data: { kind: "on-hold", occurredOn: "2026-11-20" } });
  expect([404, 405]).toContain(refused.status());
  const after = ((await (await page.request.get(`/api/submissions/${seeded!.submissionId}`)).json()) as { submission: { events: unknown[] } }).submission.events.length;
  expect(after).toBe(before);

  await page.goto(`/submissions/${seeded!.submissionId}`);
  await expect(page.getByRole("list", { name: "Timeline" })).toContainText("Permit E26-01893");
  await expect(page.getByRole("form", { name: "Record an event" })).toHaveCount(0);
});
