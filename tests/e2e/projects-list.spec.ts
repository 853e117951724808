import fs from "node:fs";
import path from "node:path";
import { expect, test } from "@playwright/test";
import { DEMO_JURISDICTIONS } from "../../db/demo-scenario";
import { signInAs } from "./helpers";

const ARTIFACTS = path.join(__dirname, "artifacts");
test.use({ viewport: { width: 1440, height: 900 } });

test("a designer finds a project by search and filters, archives it and brings it back; the filters survive a reload", async ({ page }) => {
  test.setTimeout(120_000);
  await signInAs(page, "designer");
  const table = page.getByRole("table", { name: "Projects" });
  await expect(table).toBeVisible();

  // Search by client and by an equipment tag, on the server.
  const search = page.getByRole("searchbox");
  await search.fill("Quarry Hollow");
  await page.getByRole("button", { name: "Search" }).click();
  await expect(page).toHaveURL(/q=Quarry\+Hollow/);
  await expect(table.getByRole("link", { name: /^Ferncliff/ })).toBeVisible();
  await expect(table.locator("tbody tr")).toHaveCount(await table.locator("tbody tr", { hasText: "Quarry Hollow" }).count());
  await page.reload();
  await expect(page.getByRole("searchbox")).toHaveValue("Quarry Hollow");
  await expect(table.getByRole("link", { name: /^Ferncliff/ })).toBeVisible();
  await page.getByRole("searchbox").fill("");

  // Filters: system kind and jurisdiction.
  await page.getByLabel("System").selectOption("hybrid");
  await expect(table.getByRole("link", { name: /^Market stall/ })).toHaveCount(0);
  await expect(table.getByRole("link", { name: /^Ferncliff/ }).first()).toBeVisible();
  await page.getByLabel("Jurisdiction").selectOption({ label: "Marrow Ridge Township" });
  await page.getByLabel("Sort").selectOption("name");
  await expect(page).toHaveURL(/sort=name/);
  await expect(table.getByRole("link", { name: /^Ferncliff/ }).first()).toBeVisible();
  await page.getByLabel("Jurisdiction").selectOption({ label: DEMO_JURISDICTIONS.find((j) => j.name !== "Marrow Ridge Township")!.name });
  await expect(page.getByText("No projects match. Clear a filter to see more.")).toBeVisible();
  await page.getByLabel("Jurisdiction").selectOption({ label: "Marrow Ridge Township" });
  fs.mkdirSync(ARTIFACTS, { recursive: true });
  await page.screenshot({ path: path.join(ARTIFACTS, "projects-list-filtered-1440.png") });
  await page.getByLabel("System").selectOption("");
  await page.getByLabel("Jurisdiction").selectOption("");

  // A project made for this run is archived from its page and leaves the list.
  await page.getByRole("link", { name: "New project" }).click();
  const name = `Archive me ${Date.now().toString(36)}`;
  await page.getByLabel("Project name").fill(name);
  await page.getByLabel("Jurisdiction").selectOption({ index: 1 });
  await page.getByRole("button", { name: "Create project" }).click();
  await expect(page.getByRole("heading", { level: 1, name })).toBeVisible();
  await page.getByRole("button", { name: "Archive project" }).click();
  await expect(page.getByText(/^Archived on \d{4}-\d{2}-\d{2}/)).toBeVisible();
  await page.goto("/projects");
  await page.getByRole("searchbox").fill(name);
  await page.getByRole("button", { name: "Search" }).click();
  await expect(page.getByText("No projects match. Clear a filter to see more.")).toBeVisible();
  await page.getByRole("checkbox", { name: "Archived projects" }).click();
  await expect(page.getByRole("checkbox", { name: "Archived projects" })).toBeChecked();
  const archived = page.getByRole("table", { name: "Archived projects" });
  await expect(archived.getByRole("link", { name })).toBeVisible();
  await archived.getByRole("button", { name: `Bring back ${name}` }).click();
  await expect(page.getByText("No archived projects match.")).toBeVisible();
  await page.getByRole("checkbox", { name: "Archived projects" }).click();
  await expect(page.getByRole("checkbox", { name: "Archived projects" })).not.toBeChecked();
  await expect(table.getByRole("link", { name })).toBeVisible();

  // A status that does not exist, typed into the address, is refused with a message and shows nothing.
  await page.goto("/projects?status=finished");
  await expect(page.locator("main [role=alert]")).toContainText("cannot be filtered that way");
});
