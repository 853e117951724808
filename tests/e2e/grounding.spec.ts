import { expect, test, type Page } from "@playwright/test";
import { signInAs } from "./helpers";

const PROJECT = "Tamarack backcountry hut";

// Wide enough for the checks panel to stand beside the editor, as designers work.
test.use({ viewport: { width: 1600, height: 1000 } });

const checksGroup = (page: Page, status: string) => page.locator(`[data-status-group="${status}"]`);

test("a designer names where the neutral is bonded, sees a second bond fail and applies the fix", async ({ page }) => {
  await signInAs(page, "designer");
  await page.goto("/projects");
  await page.getByRole("link", { name: new RegExp(`^${PROJECT}`) }).first().click();
  await expect(page.getByTestId("check-state")).toHaveText("up to date");

  // The seeded hut bonds neutral to ground in P-1 only, on a 6 AWG GEC to a rod (250.166(C)).
  const section = page.locator("#grounding");
  await section.scrollIntoViewIfNeeded();
  await expect(section.getByLabel("Grounding electrode conductor")).toHaveValue("6");
  await expect(section.getByLabel("Neutral-to-ground bond at")).toHaveValue("P-1");
  await expect(checksGroup(page, "pass").locator('[data-check-id="grounding-electrode:neutral-bond"]')).toBeVisible();

  // Naming the inverter as the bond leaves P-1's main bonding jumper as a second bond (250.6).
  await section.getByLabel("Neutral-to-ground bond at").selectOption("INV-1");
  const fail = checksGroup(page, "fail");
  const result = fail.locator('[data-check-id="grounding-electrode:neutral-bond"]');
  await expect(result).toBeVisible();
  const remedy = result.getByTestId("remedy");
  await expect(remedy).toContainText("Remove the neutral-to-ground bonding jumper");
  await remedy.getByRole("button", { name: "Apply" }).click();
  await expect(checksGroup(page, "pass").locator('[data-check-id="grounding-electrode:neutral-bond"]')).toBeVisible();

  // A GEC below the 250.166 size once a water pipe joins the rod fails and offers 3/0 (the largest DC conductor).
  await section.getByLabel("Grounding electrodes").selectOption(["ground-rod", "metal-water-pipe"]);
  const gec = fail.locator('[data-check-id="grounding-electrode:electrode-system"]');
  await expect(gec.getByTestId("remedy")).toContainText("3/0 AWG Cu");
  await gec.getByTestId("remedy").getByRole("button", { name: "Apply" }).click();
  await expect(section.getByLabel("Grounding electrode conductor")).toHaveValue("3/0");
  await expect(checksGroup(page, "pass").locator('[data-check-id="grounding-electrode:electrode-system"]')).toBeVisible();
});
