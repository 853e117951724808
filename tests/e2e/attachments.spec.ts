import { expect, test, type Page } from "@playwright/test";
import { makePdf, makePng } from "../unit/uploads/fixtures";
import { signInAs } from "./helpers";

const FARMHOUSE = "Ferncliff farmhouse — hybrid PV and storage";

async function projectId(page: Page, name: string): Promise<string> {
  const response = await page.request.get("/api/projects");
  const { projects } = (await response.json()) as { projects: { id: string; name: string }[] };
  const project = projects.find((p) => p.name === name);
  if (!project) throw new Error(`no seeded project named ${name}`);
  return project.id;
}

/** Uppy's own file input (not the folder picker beside it). */
const uppyFileInput = (page: Page) => page.locator("input.uppy-Dashboard-input[type=file]:not([webkitdirectory])").first();

test("a designer attaches a datasheet for an equipment tag through the uploader, sees it listed, and a PNG renamed .pdf is refused", async ({ page }) => {
  await signInAs(page, "designer");
  const id = await projectId(page, FARMHOUSE);
  await page.goto(`/projects/${id}`);
  await page.getByRole("navigation", { name: "Project" }).getByRole("link", { name: "Attachments" }).click();
  await expect(page).toHaveURL(new RegExp(`/projects/${id}/attachments$`));

  const checklist = page.getByRole("region", { name: /Documents .* asks for/ });
  const batteryItem = checklist.getByRole("listitem").filter({ hasText: "BAT-1" }).filter({ hasText: "Datasheet" });
  // The storage listing is asked for per battery.
  await expect(checklist.getByRole("listitem").filter({ hasText: "Storage listing" }).filter({ hasText: "BAT-1" })).toContainText("Missing");
  await expect(batteryItem).toContainText("Missing");

  await expect(page.getByLabel("Kind")).toHaveValue("datasheet");
  await page.getByLabel("Equipment (required)").selectOption("BAT-1");

  // Unique bytes per run, so a rerun against a shared server is not answered as a duplicate.
  const fileName = `ostin-cells-oc-48100r-${Date.now()}.pdf`;
  const pdf = Buffer.from(await makePdf(3, `Battery datasheet ${Date.now()}`));
  await uppyFileInput(page).setInputFiles({ name: fileName, mimeType: "application/pdf", buffer: pdf });

  await expect(page.getByRole("list", { name: "Upload results" })).toContainText(`Attached “${fileName}” (datasheet for BAT-1), 3 pages.`);
  const row = page.getByRole("table", { name: "Attachments" }).getByRole("row").filter({ hasText: fileName });
  await expect(row).toBeVisible();
  const downloadUrl = await row.getByRole("link", { name: fileName }).getAttribute("href");
  try {
    await expect(row.getByRole("cell").nth(1)).toHaveText("Datasheet");
    await expect(row.getByRole("combobox", { name: `Equipment for ${fileName}` })).toHaveValue("BAT-1");
    await expect(row.getByRole("cell").nth(3)).toHaveText("3");
    await expect(batteryItem).toContainText("Attached");
    // The equipment choice moves on to the next tag without a datasheet rather than keeping BAT-1.
    const equipmentField = page.getByLabel("Equipment (required)");
    await expect(equipmentField).not.toHaveValue("BAT-1");
    await expect(equipmentField).not.toHaveValue("");
    // A storage listing is linked to a battery: only batteries are offered, and the first is chosen.
    await page.getByLabel("Kind").selectOption("storage-listing");
    await expect(equipmentField).toHaveValue("BAT-1");
    expect((await equipmentField.locator("option").allTextContents()).every((o) => o.startsWith("BAT-"))).toBe(true);
    await page.getByLabel("Kind").selectOption("datasheet");

    const download = await page.request.get(downloadUrl!);
    expect(download.headers()["content-type"]).toBe("application/pdf");
    expect(Buffer.from(await download.body()).equals(pdf)).toBe(true);

    await page.getByRole("button", { name: "Add more files" }).click();
    await uppyFileInput(page).setInputFiles({ name: "bat-1-datasheet.pdf", mimeType: "application/pdf", buffer: Buffer.from(makePng(6, 4)) });
    await expect(page.getByRole("alert").filter({ hasText: "not attached" })).toContainText(
      "“bat-1-datasheet.pdf” is a PNG image, though it is named .pdf; a datasheet must be a PDF.",
    );
    await expect(page.getByRole("table", { name: "Attachments" }).getByRole("row").filter({ hasText: "bat-1-datasheet.pdf" })).toHaveCount(0);

    // Leaves the seeded project as it was, for the specs that follow.
    await row.getByRole("button", { name: `Delete ${fileName}` }).click();
    await row.getByRole("button", { name: `Confirm delete ${fileName}` }).click();
    await expect(page.getByRole("table", { name: "Attachments" }).getByRole("row").filter({ hasText: fileName })).toHaveCount(0);
    await expect(batteryItem).toContainText("Missing");
  } finally {
    // Also when an assertion above failed; a 404 means the UI delete already ran.
    await page.request.delete(downloadUrl!);
  }
});
