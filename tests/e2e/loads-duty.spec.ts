import { expect, test } from "@playwright/test";
import { DEMO_JURISDICTIONS } from "../../db/demo-scenario";
import { signInAs } from "./helpers";

test.use({ viewport: { width: 1440, height: 900 } });

test("a designer enters a refrigerator by its duty cycle and a pump by its days a week; a duty of 0 is refused; both survive a reload", async ({ page }) => {
  test.setTimeout(120_000);
  await signInAs(page, "designer");
  await page.getByRole("link", { name: "New project" }).click();
  const name = `Duty cycle ${Date.now().toString(36)}`;
  await page.getByLabel("Project name").fill(name);
  const jurisdiction = DEMO_JURISDICTIONS[0]!;
  await page.getByLabel("Jurisdiction").selectOption({ label: `${jurisdiction.name} (NEC ${jurisdiction.necEdition})` });
  await page.getByRole("button", { name: "Create project" }).click();
  await expect(page.getByRole("heading", { level: 1, name })).toBeVisible();

  await page.getByRole("button", { name: "+ Add load" }).click();
  await page.getByLabel("Load, load row 1").fill("Refrigerator");
  await page.getByLabel("Power (W), load row 1").fill("150");
  await page.getByLabel("Hours a day (h), load row 1").fill("24");
  const duty = page.getByLabel("Duty (%), load row 1");
  await duty.fill("0");
  await duty.press("Tab");
  await expect(page.getByText("must be between 1 and 100 %").first()).toBeVisible();
  await duty.fill("35");
  await page.getByRole("button", { name: "+ Add load" }).click();
  await page.getByLabel("Load, load row 2").fill("Well pump");
  await page.getByLabel("Power (W), load row 2").fill("700");
  await page.getByLabel("Hours a day (h), load row 2").fill("2");
  await page.getByLabel("Days a week, load row 2").fill("3");

  // 150 W × 24 h × 35 % = 1,260 Wh and 700 W × 2 h × 3/7 = 600 Wh (worked by hand), shown with the figure in words.
  const figures = page.getByRole("table", { name: /daily energy/i });
  await expect(figures.getByRole("row", { name: /Refrigerator/ })).toContainText("150 W × 24 h × 35 % duty");
  await expect(figures.getByRole("row", { name: /Refrigerator/ })).toContainText("1,260");
  await expect(figures.getByRole("row", { name: /Well pump/ })).toContainText("700 W × 2 h × 3/7 days");
  await expect(figures.getByRole("row", { name: /Well pump/ })).toContainText("600");

  await page.getByRole("button", { name: "Save", exact: true }).click();
  await expect(page.getByTestId("save-state")).toHaveText("Saved");
  await page.reload();
  await expect(page.getByLabel("Duty (%), load row 1")).toHaveValue("35");
  await expect(page.getByLabel("Days a week, load row 2")).toHaveValue("3");
  await page.getByRole("heading", { name: /Loads/ }).first().scrollIntoViewIfNeeded();
  await page.screenshot({ path: "tests/e2e/artifacts/loads-duty-1440.png" });
});
