import path from "node:path";
import { expect, test } from "@playwright/test";
import { signInAs } from "./helpers";

const ARTIFACTS = path.join(__dirname, "artifacts");
/** The seeded township has the farmhouse (in design) among its projects; this spec edits the township and puts it back. */
const JURISDICTION = "Marrow Ridge Township";

test.use({ viewport: { width: 1440, height: 900 } });

test("the office edits a jurisdiction, sees the knock-on on open projects, keeps a notes log, and bad input changes nothing", async ({ page, browser }) => {
  test.setTimeout(120_000);
  await signInAs(page, "office");
  await page.goto("/jurisdictions");
  await page.getByRole("link", { name: JURISDICTION }).click();
  const form = page.getByRole("form", { name: "Jurisdiction record" });
  await expect(form.getByLabel("Name", { exact: true })).toHaveValue(JURISDICTION);
  const days = form.getByLabel("Typical review (days)");
  const keptDays = await days.inputValue();

  // Refused field by field; nothing saved.
  await form.getByLabel("Voltage-drop limit (%)").fill("25");
  await form.getByLabel("Contact e-mail").fill("not an address");
  await form.getByRole("button", { name: "Save jurisdiction" }).click();
  const alert = form.getByRole("alert");
  await expect(alert).toContainText("The jurisdiction was not saved");
  await expect(alert).toContainText("must be between 0.5 and 10 %");
  await expect(alert).toContainText("must be an e-mail address");
  await page.reload();
  await expect(page.getByRole("form", { name: "Jurisdiction record" }).getByLabel("Voltage-drop limit (%)")).not.toHaveValue("25");

  // The effect of an edition change is shown before saving; then the edit is saved and survives a reload.
  const edit = page.getByRole("form", { name: "Jurisdiction record" });
  const edition = edit.getByLabel("NEC edition");
  const keptEdition = await edition.inputValue();
  const other = keptEdition === "2017" ? "2023" : "2017";
  await edition.selectOption(other);
  await edit.getByRole("button", { name: "Show the effect on open projects" }).click();
  await expect(edit.getByRole("status")).toContainText("If saved as typed:");
  await edit.getByLabel("Typical review (days)").fill("12");
  await edit.getByRole("button", { name: "Save jurisdiction" }).click();
  await expect(edit.getByRole("status")).toContainText("Saved: NEC edition, typical review days");
  await page.screenshot({ path: path.join(ARTIFACTS, "jurisdiction-edit-1440.png"), fullPage: true });
  await page.reload();
  await expect(page.getByRole("form", { name: "Jurisdiction record" }).getByLabel("NEC edition")).toHaveValue(other);
  await expect(page.getByRole("form", { name: "Jurisdiction record" }).getByLabel("Typical review (days)")).toHaveValue("12");

  // The notes log: dated, with who wrote it.
  const note = `Counter wants two printed sets, stapled (${Date.now().toString(36)}).`;
  await page.getByLabel("What this AHJ expects that no code says").fill(note);
  await page.getByRole("button", { name: "Add to the log" }).click();
  await expect(page.getByRole("list", { name: "Notes" })).toContainText(note);
  await page.reload();
  await expect(page.getByRole("list", { name: "Notes" }).getByRole("listitem").filter({ hasText: note })).toContainText("Theo Brannigan");

  // Put the record back as the seed had it, for the other specs.
  const back = page.getByRole("form", { name: "Jurisdiction record" });
  await back.getByLabel("NEC edition").selectOption(keptEdition);
  await back.getByLabel("Typical review (days)").fill(keptDays);
  await back.getByRole("button", { name: "Save jurisdiction" }).click();
  await expect(back.getByRole("status")).toContainText("Saved");

  // A designer reads the record and the log, with nothing to type into.
  const designer = await (await browser.newContext()).newPage();
  await signInAs(designer, "designer");
  await designer.goto("/jurisdictions");
  await designer.getByRole("link", { name: JURISDICTION }).click();
  await expect(designer.getByRole("form", { name: "Jurisdiction record" })).toHaveCount(0);
  await expect(designer.getByRole("region", { name: "Jurisdiction record" })).toContainText(`${keptEdition}`);
  await expect(designer.getByRole("list", { name: "Notes" })).toContainText(note);
  await expect(designer.getByLabel("What this AHJ expects that no code says")).toHaveCount(0);
});

test("the office reads a jurisdiction's figures and mails the overdue digest", async ({ page }) => {
  await signInAs(page, "office");
  await page.goto("/jurisdictions");
  await page.getByRole("link", { name: "City of Kestrel Falls" }).click();
  const figures = page.getByRole("region", { name: /Submissions here/ });
  // The seeded stall was permitted (11 calendar days, 2026-11-02 → 11-13); other specs may add applications, so the form is checked here
  // and the arithmetic in tests/unit/workflow/jurisdiction-summary.test.ts.
  await expect(figures.getByRole("definition").first()).toHaveText(/^\d+(\.\d)? d$/);
  await expect(figures).toContainText(/\d+ %/);
  await expect(figures.getByRole("figure", { name: "Open submissions by status" })).toBeVisible();
  await page.screenshot({ path: path.join(ARTIFACTS, "jurisdiction-summary-1440.png"), fullPage: true });

  await page.goto("/submissions");
  await page.getByRole("button", { name: "Mail the overdue digest" }).click();
  await expect(page.getByRole("status").filter({ hasText: /^Digest for \d{4}-\d{2}-\d{2} sent to \d+ (person|people)/ })).toBeVisible();
  await page.goto("/outbox");
  await expect(page.locator("main")).toContainText("Permit office digest for");
});
