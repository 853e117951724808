import { expect, test } from "@playwright/test";
import { demoUser, signInAs } from "./helpers";

/** The seeded hut revision waits for review; this spec returns it and the designer sends it back, so it ends where it began. */
const PROJECT = "Tamarack backcountry hut";

test("the reviewer returns the seeded revision with a note on a check; the designer reads it and sends the revision again", async ({ browser }) => {
  test.setTimeout(120_000);
  const noteText = `Show the 75 °C terminal limit for this circuit on E-004 (${Date.now().toString(36)}).`;

  const reviewerContext = await browser.newContext();
  const page = await reviewerContext.newPage();
  await signInAs(page, "reviewer");
  await page.goto("/reviews");
  await page.getByRole("table", { name: "Awaiting review" }).getByRole("link", { name: new RegExp(`^${PROJECT}`) }).click();
  await expect(page).toHaveURL(/\/reviews\/[0-9a-f-]{36}$/);
  const revisionUrl = page.url();
  await expect(page.getByRole("heading", { level: 1, name: new RegExp(`^${PROJECT}`) })).toBeVisible();
  await expect(page.getByRole("region", { name: "Revision and project", exact: true })).toContainText("Alder Bay County");

  // The hut carries a design mistake, so its snapshot has failing checks to read first.
  const failing = page.getByRole("region", { name: "Fail checks", exact: true });
  await expect(failing.getByRole("article").first()).toBeVisible();
  const firstCheck = failing.getByRole("article").first();
  const checkTitle = (await firstCheck.getByRole("heading").innerText()).trim();
  await firstCheck.getByRole("button", { name: /^Add a note on/ }).click();
  await firstCheck.getByRole("textbox", { name: /^Note on/ }).fill(noteText);

  await page.getByRole("button", { name: "Return with notes" }).click();
  const dialog = page.getByRole("dialog", { name: /Return revision \d+\?/ });
  await expect(dialog).toContainText(`go to ${demoUser("designer").name}`);
  await dialog.getByRole("button", { name: /^Return revision \d+$/ }).click();
  await expect(page.getByRole("status").filter({ hasText: /returned to/ })).toContainText("with 1 note");

  const decisions = page.getByRole("list", { name: "Review decisions" });
  await expect(decisions).toContainText("Returned with notes");
  await expect(decisions).toContainText(noteText);
  await expect(decisions).toContainText(checkTitle);
  await expect(page.getByRole("button", { name: "Return with notes" })).toHaveCount(0);
  await reviewerContext.close();

  const designerContext = await browser.newContext();
  const designer = await designerContext.newPage();
  await signInAs(designer, "designer");
  await designer.goto(revisionUrl);
  await expect(designer.getByRole("list", { name: "Review decisions" })).toContainText(noteText);
  // The packet tab reads the same notes from the reviews route.
  const projectHref = await designer.getByRole("region", { name: "Revision and project", exact: true }).getByRole("link", { name: new RegExp(`^${PROJECT}`) }).getAttribute("href");
  const projectId = /\/projects\/([^/]+)\/packet$/.exec(projectHref ?? "")?.[1];
  expect(projectId).toBeTruthy();
  const history = await designer.request.get(`/api/reviews?projectId=${projectId}`);
  expect(history.status()).toBe(200);
  expect(JSON.stringify(await history.json())).toContain(noteText);
  // The designer reads the review; deciding is not theirs.
  await expect(designer.getByRole("button", { name: "Approve and stamp" })).toHaveCount(0);
  await designer.getByRole("button", { name: /^Send again unchanged/ }).click();
  // The hut's checks fail, so sending needs a message saying why it goes as it is.
  await expect(designer.getByRole("button", { name: "Send it again" })).toBeDisabled();
  await designer.getByLabel("Message to the reviewer").fill("The terminal limit is already shown on E-004, row C-2; no change to the design.");
  await designer.getByRole("button", { name: "Send it again" }).click();
  await expect(designer.getByRole("status").filter({ hasText: "sent for review" })).toBeVisible({ timeout: 30_000 });
  await expect(designer.getByText("Awaiting review", { exact: true })).toBeVisible({ timeout: 30_000 });
  await designerContext.close();
});

test("a reviewer's licence page refuses an expiry in the past", async ({ page }) => {
  await signInAs(page, "reviewer");
  await page.goto("/reviews/licence");
  const form = page.getByRole("form", { name: "Licence record" });
  await expect(form.getByLabel("Licence number")).toHaveValue(/^PE-/);
  const expiry = form.getByLabel("Expires on");
  const kept = await expiry.inputValue();
  // Typed past the date picker's minimum: the form says why before anything is sent.
  await expiry.evaluate((el: HTMLInputElement) => el.removeAttribute("min"));
  await expiry.fill("2020-01-31");
  await form.getByRole("button", { name: /Save licence record|Record licence/ }).click();
  await expect(form.getByText(/Expires on is in the past/)).toBeVisible();
  await expect(expiry).toHaveAttribute("aria-invalid", "true");
  await page.reload();
  await expect(page.getByRole("form", { name: "Licence record" }).getByLabel("Expires on")).toHaveValue(kept);
});
