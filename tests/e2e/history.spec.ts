import path from "node:path";
import { expect, test } from "@playwright/test";
import { signInAs } from "./helpers";

const ARTIFACTS = path.join(__dirname, "artifacts");
/** The seeded hut was created, edited and given its datasheets by the designer, so its history has entries. */
const PROJECT = "Tamarack backcountry hut";

test.use({ viewport: { width: 1440, height: 900 } });

test("the project history tab lists who did what, newest first, and offers nothing to edit", async ({ page, browser }) => {
  await signInAs(page, "designer");
  await page.goto("/projects");
  await page.getByRole("link", { name: new RegExp(`^${PROJECT}`) }).first().click();
  await expect(page).toHaveURL(/\/projects\/[0-9a-f-]{36}$/);
  await page.getByRole("navigation", { name: "Project" }).getByRole("link", { name: "History" }).click();
  await expect(page).toHaveURL(/\/history$/);

  const table = page.getByRole("table", { name: "Project history" });
  await expect(table).toBeVisible();
  await expect(table).toContainText("Project created");
  await expect(table).toContainText("Attachment uploaded");
  await expect(table).toContainText("Dana Whitlock");
  // Newest first: the first row's time is not earlier than the last row's.
  const times = await table.locator("tbody tr td:first-child").allInnerTexts();
  expect(times.length).toBeGreaterThan(1);
  expect(times[0]! >= times[times.length - 1]!).toBe(true);
  // A log: nothing on the page accepts input.
  await expect(page.locator("main").locator("input, textarea, select")).toHaveCount(0);
  await page.screenshot({ path: path.join(ARTIFACTS, "project-history-1440.png"), fullPage: false });

  // The office reads it too; the installer's role does not open projects.
  const url = page.url();
  const office = await (await browser.newContext()).newPage();
  await signInAs(office, "office");
  await office.goto(url);
  await expect(office.getByRole("table", { name: "Project history" })).toContainText("Project created");
  const installer = await (await browser.newContext()).newPage();
  await signInAs(installer, "installer");
  await installer.goto(url);
  await expect(installer.getByText("Projects are open to designers, reviewers and the permit office.")).toBeVisible();
  await expect(installer.getByRole("table", { name: "Project history" })).toHaveCount(0);
});
