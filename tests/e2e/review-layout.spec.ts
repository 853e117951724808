import path from "node:path";
import { expect, test } from "@playwright/test";
import { signInAs } from "./helpers";

const ARTIFACTS = path.join(__dirname, "artifacts");
const PROJECT = "Tamarack backcountry hut";

test.use({ viewport: { width: 1440, height: 900 } });

test("on the review page, each figure's name and value stand apart: a label's wording wraps beside its title instead of over it", async ({ page }) => {
  await signInAs(page, "reviewer");
  await page.goto("/reviews");
  await page.getByRole("table", { name: "Awaiting review" }).getByRole("link", { name: new RegExp(`^${PROJECT}`) }).click();
  const card = page.getByRole("article").filter({ has: page.getByRole("heading", { name: /^Labels required/ }) }).first();
  await card.scrollIntoViewIfNeeded();
  const rows = await card.locator("dl > div").evaluateAll((divs) =>
    divs.map((d) => {
      const dt = d.querySelector("dt")!.getBoundingClientRect();
      const dd = d.querySelector("dd")!.getBoundingClientRect();
      return { name: d.querySelector("dt")!.textContent, dtRight: dt.right, ddLeft: dd.left, dtWidth: dt.width, ddWidth: dd.width };
    }),
  );
  expect(rows.length).toBeGreaterThan(0);
  for (const r of rows) {
    // The name keeps room to be read, and its box ends before the value's begins.
    expect(r.dtWidth, `${r.name}`).toBeGreaterThan(100);
    expect(r.ddWidth, `${r.name}`).toBeGreaterThan(150);
    expect(r.dtRight, `${r.name}`).toBeLessThanOrEqual(r.ddLeft);
  }
  await card.screenshot({ path: path.join(ARTIFACTS, "review-labels-card-1440.png") });
});
