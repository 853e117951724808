import { expect, test, type Page } from "@playwright/test";
import { signInAs } from "./helpers";

const JURISDICTION = "Alder Bay County";

async function openGeneralNotes(page: Page) {
  await page.goto("/jurisdictions");
  await page.getByRole("table", { name: "Jurisdictions" }).getByRole("link", { name: JURISDICTION, exact: true }).click();
  await expect(page.getByRole("heading", { level: 1, name: JURISDICTION })).toBeVisible();
  await page.getByRole("tab", { name: /^General notes/ }).click();
  const source = page.getByLabel("Template source: General notes");
  await expect(source).toBeVisible();
  return source;
}

test("the office edits a jurisdiction's general notes: an unknown variable is refused with its name and line, a good template saves and survives a reload", async ({ page }) => {
  test.setTimeout(120_000);
  await signInAs(page, "office");
  const source = await openGeneralNotes(page);
  const original = await source.inputValue();
  // Start from the shipped wording, so a rerun does not keep adding lines.
  const shipped = original.replace(/\nAlder Bay note [a-z0-9]+:[^\n]*\n?/g, "\n").replace(/\n+$/, "\n");

  const bad = `${shipped}Permit holder {{project.ownerName}} keeps this set on site.\n`;
  const badLine = bad.split("\n").findIndex((l) => l.includes("project.ownerName")) + 1;
  await source.fill(bad);
  await page.getByRole("button", { name: "Save template" }).click();
  const refusal = page.locator("#template-refusal");
  await expect(refusal).toContainText(`line ${badLine}`, { ignoreCase: true });
  await expect(refusal).toContainText("project.ownerName");
  await expect(source).toHaveAttribute("aria-invalid", "true");

  const stamp = Date.now().toString(36);
  const note = `Alder Bay note ${stamp}: the county inspector wants the battery disconnect tagged at eye level.`;
  await source.fill(`${shipped}${note}\n`);
  await page.getByRole("button", { name: "Preview sheet" }).click();
  await expect(page.locator('iframe[title^="Preview of G-002"]')).toBeVisible({ timeout: 60_000 });
  await page.getByRole("button", { name: "Save template" }).click();
  await expect(page.getByRole("status").filter({ hasText: "Template saved" })).toBeVisible();
  await expect(page.getByRole("tab", { name: /^General notes\W*local$/ })).toBeVisible();

  await page.reload();
  const reloaded = await openGeneralNotes(page);
  await expect(reloaded).toHaveValue(new RegExp(note.replace(/[.*+?^${}()|[\]\\]/g, "\\$&")));
  // The office edits the record itself on this page; the local copy shows on the template's own tab.
  await expect(page.getByRole("tab", { name: /^General notes\W*local$/ })).toBeVisible();
});

test("a designer reads the templates but cannot save them", async ({ page }) => {
  await signInAs(page, "designer");
  const source = await openGeneralNotes(page);
  await expect(source).toHaveAttribute("readonly", "");
  await expect(page.getByRole("button", { name: "Save template" })).toHaveCount(0);
});
