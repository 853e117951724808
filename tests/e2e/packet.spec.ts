import fs from "node:fs";
import { expect, test, type Page } from "@playwright/test";
import { signInAs } from "./helpers";

/** The seeded farmhouse is still in design and has no attachments, so its packet lacks every document. */
const PROJECT = "Ferncliff farmhouse";

async function openPacketTab(page: Page) {
  await signInAs(page, "designer");
  await page.getByRole("table", { name: "Projects" }).getByRole("link", { name: new RegExp(`^${PROJECT}`) }).click();
  await page.getByRole("navigation", { name: "Project" }).getByRole("link", { name: "Packet" }).click();
  await expect(page).toHaveURL(/\/projects\/[^/]+\/packet$/);
}

test("the designer sees what is missing, generates a draft packet and downloads its PDF and DOCX", async ({ page }) => {
  test.setTimeout(180_000);
  await openPacketTab(page);

  const missing = page.getByRole("list", { name: "Missing documents" });
  await expect(missing.getByText("no datasheet for INV-1", { exact: true })).toBeVisible();
  await expect(missing.getByText("no site plan", { exact: true })).toBeVisible();
  await expect(missing.getByText("no storage listing for BAT-1", { exact: true })).toBeVisible();
  await expect(page.getByRole("link", { name: "Open the design tab" })).toHaveAttribute("href", /\/projects\/[^/]+$/);

  const revisions = page.getByRole("table", { name: "Revisions" });
  const before = (await revisions.isVisible()) ? await revisions.locator("tbody tr").count() : 0;

  const button = page.getByRole("button", { name: "Generate packet as draft" });
  await expect(button).toBeEnabled();
  const answer = page.waitForResponse((r) => r.request().method() === "POST" && /\/revisions$/.test(r.url()));
  await button.click();
  const started = await (await answer).json();
  expect((await answer).status()).toBe(202);
  const number: number = started.number;

  const row = revisions.locator("tbody tr").filter({ has: page.getByRole("cell", { name: `Rev ${number}`, exact: true }) });
  await expect(row).toBeVisible();
  await expect(revisions.locator("tbody tr")).toHaveCount(before + 1);
  await expect(row.getByText("Ready")).toBeVisible({ timeout: 150_000 });
  await expect(row.getByText("Draft", { exact: true })).toBeVisible();

  const pdfDownload = page.waitForEvent("download");
  await row.getByRole("link", { name: `PDF of revision ${number}` }).click();
  const pdf = await pdfDownload;
  expect(pdf.suggestedFilename()).toMatch(new RegExp(`-rev${number}\\.pdf$`));
  expect(fs.readFileSync(await pdf.path()).subarray(0, 5).toString("latin1")).toBe("%PDF-");

  const docxDownload = page.waitForEvent("download");
  await row.getByRole("link", { name: `DOCX of revision ${number}` }).click();
  const docx = await docxDownload;
  expect(docx.suggestedFilename()).toMatch(new RegExp(`-rev${number}\\.docx$`));
  expect(fs.readFileSync(await docx.path()).subarray(0, 2).toString("latin1")).toBe("PK");
});

test("a reviewer reads the packet tab without a generate button, and cannot start one through the route", async ({ page }) => {
  await signInAs(page, "reviewer");
  await page.goto("/projects");
  await page.getByRole("table", { name: "Projects" }).getByRole("link", { name: new RegExp(`^${PROJECT}`) }).click();
  await page.getByRole("navigation", { name: "Project" }).getByRole("link", { name: "Packet" }).click();
  await expect(page.getByRole("region", { name: "Preflight" })).toBeVisible();
  await expect(page.getByRole("button", { name: /Generate packet/ })).toHaveCount(0);
  const id = /\/projects\/([^/]+)\/packet/.exec(page.url())![1];
  const response = await page.request.post(`/api/projects/${id}/revisions`);
  expect(response.status()).toBe(403);
});
