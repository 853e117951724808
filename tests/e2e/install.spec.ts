import { expect, test } from "@playwright/test";
import { makePng } from "../unit/uploads/fixtures";
import { signInAs } from "./helpers";

test("the installer opens the approved set, prints the labels and marks one placed; it survives a reload", async ({ page }) => {
  await signInAs(page, "installer");
  await page.getByRole("table", { name: "Approved sets" }).getByRole("link").first().click();
  await expect(page).toHaveURL(/\/install\/[0-9a-f-]+$/);
  const labels = page.getByRole("figure");
  expect(await labels.count()).toBeGreaterThan(2);
  await expect(page.getByRole("figure", { name: /PV SYSTEM DISCONNECT/ }).first()).toBeVisible();

  const sheetHref = await page.getByRole("link", { name: /Print: US letter, 10 labels/ }).getAttribute("href");
  const sheet = await page.request.get(sheetHref!);
  expect(sheet.status()).toBe(200);
  expect(sheet.headers()["content-type"]).toBe("application/pdf");
  expect((await sheet.body()).subarray(0, 5).toString()).toBe("%PDF-");

  const first = page.getByRole("button", { name: /mark as done/ }).first();
  const name = await first.getAttribute("aria-label");
  await first.click();
  const itemName = name!.replace(/: mark as done$/, "");
  await expect(page.getByRole("button", { name: `${itemName}: confirmed, click to undo` })).toBeVisible();
  await page.reload();
  await expect(page.getByRole("button", { name: `${itemName}: confirmed, click to undo` })).toBeVisible();
  await expect(page.getByText(/1 of \d+ done/)).toBeVisible();
});

test("a stock that does not exist is refused with the allowed stocks named", async ({ page }) => {
  await signInAs(page, "installer");
  await page.getByRole("table", { name: "Approved sets" }).getByRole("link").first().click();
  const url = new URL(page.url());
  const revisionId = url.pathname.split("/").pop();
  const response = await page.request.get(`/api/install/${revisionId}/labels?stock=napkin`);
  expect(response.status()).toBe(400);
  expect((await response.json()).error).toContain("sheet-letter");
});

test("a revision that is not approved is not an approved set", async ({ page }) => {
  await signInAs(page, "installer");
  const response = await page.request.get("/api/install/00000000-0000-0000-0000-000000000000/labels");
  expect(response.status()).toBe(404);
});

test("the installer adds a nameplate photo, which confirms the item and stays on file", async ({ page }) => {
  await signInAs(page, "installer");
  await page.getByRole("table", { name: "Approved sets" }).getByRole("link").first().click();
  const row = page.getByRole("table", { name: "Equipment to confirm" }).getByRole("row").filter({ hasText: "MOD-1" });
  await row.getByLabel("Photo for nameplate of MOD-1").setInputFiles({ name: "mod-1-nameplate.png", mimeType: "image/png", buffer: Buffer.from(makePng(32, 24)) });
  await expect(row.getByRole("link", { name: "Photo on file" })).toBeVisible();
  await expect(row.getByRole("button", { name: "MOD-1: confirmed, click to undo" })).toBeVisible();
  await page.reload();
  const photo = page.getByRole("table", { name: "Equipment to confirm" }).getByRole("row").filter({ hasText: "MOD-1" }).getByRole("link", { name: "Photo on file" });
  const response = await page.request.get((await photo.getAttribute("href"))!);
  expect(response.headers()["content-type"]).toBe("image/png");

  // A PDF is not a photo: refused by content, and nothing recorded.
  const cb = page.getByRole("table", { name: "Equipment to confirm" }).getByRole("row").filter({ hasText: "CB-1" });
  await cb.getByLabel("Photo for nameplate of CB-1").setInputFiles({ name: "cb-1.png", mimeType: "image/png", buffer: Buffer.from("%PDF-1.7 not an image") });
  await expect(cb.getByRole("alert")).toBeVisible();
  await expect(cb.getByRole("link", { name: "Photo on file" })).toHaveCount(0);
});
