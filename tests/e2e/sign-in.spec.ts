import { expect, test } from "@playwright/test";
import { DEMO_JURISDICTIONS } from "../../db/demo-scenario";
import { demoUser, formAlert, signIn, signInAs } from "./helpers";

test.describe("each role lands on the page that serves it, with the seeded rows", () => {
  test("designer → projects, fetched from the projects route", async ({ page }) => {
    await signInAs(page, "designer");
    await expect(page).toHaveURL(/\/projects$/);
    const table = page.getByRole("table", { name: "Projects" });
    await expect(table).toBeVisible();
    // Specs that run earlier add projects of their own, so a jurisdiction may stand on several rows.
    for (const j of DEMO_JURISDICTIONS) await expect(table.getByRole("cell", { name: j.name, exact: true }).first()).toBeVisible();
    expect(await table.locator("tbody tr").count()).toBeGreaterThanOrEqual(3);
  });

  test("reviewer → review queue with the revision awaiting review", async ({ page }) => {
    await signInAs(page, "reviewer");
    await expect(page).toHaveURL(/\/reviews$/);
    // Other specs may already have decided the seeded revision, so look in both sections of the queue.
    const hut = page.getByRole("row").filter({ has: page.getByRole("cell", { name: "Alder Bay County", exact: true }) });
    await expect(hut.first()).toBeVisible();
    await expect(hut.first().getByRole("cell", { name: /^Rev \d+/ })).toBeVisible();
  });

  test("office → submissions with the permit tracked", async ({ page }) => {
    await signInAs(page, "office");
    await expect(page).toHaveURL(/\/submissions$/);
    const table = page.getByRole("table", { name: "Submissions" });
    await expect(table.getByRole("cell", { name: "KF-ELEC-2026-0417", exact: true })).toBeVisible();
    await expect(table.getByRole("cell", { name: "Permit issued", exact: true })).toBeVisible();
  });

  test("installer → approved sets only", async ({ page }) => {
    await signInAs(page, "installer");
    await expect(page).toHaveURL(/\/install$/);
    const table = page.getByRole("table", { name: "Approved sets" });
    await expect(table.getByRole("cell", { name: "City of Kestrel Falls", exact: true }).first()).toBeVisible();
    await expect(table.getByRole("cell", { name: "Alder Bay County", exact: true })).toHaveCount(0);
    await expect(page.getByRole("link", { name: "Projects" })).toHaveCount(0);
  });

  test("admin → users of the organisation", async ({ page }) => {
    await signInAs(page, "admin");
    await expect(page).toHaveURL(/\/admin\/users$/);
    await expect(page.getByRole("table", { name: "Users" }).getByText(demoUser("designer").name)).toBeVisible();
  });

  test("every signed-in page carries the caution that checks do not approve", async ({ page }) => {
    await signInAs(page, "designer");
    await expect(page.getByRole("note")).toContainText("do not approve anything");
  });
});

test.describe("refusals", () => {
  test("a signed-out visit redirects to sign-in", async ({ page }) => {
    await page.goto("/projects");
    await expect(page).toHaveURL(/\/sign-in/);
    await expect(page.getByRole("heading", { name: "Sign in" })).toBeVisible();
  });

  test("a signed-out request to a route handler gets 401 JSON, not a page", async ({ request }) => {
    const response = await request.get("/api/projects", { maxRedirects: 0 });
    expect(response.status()).toBe(401);
    expect(await response.json()).toMatchObject({ code: "unauthenticated" });
  });

  test("a wrong password shows a clear message and does not sign in", async ({ page }) => {
    await signIn(page, demoUser("designer").email, "not the password");
    await expect(formAlert(page)).toContainText("do not match an account");
    await expect(page).toHaveURL(/\/sign-in/);
  });

  test("an unknown e-mail gets the same message", async ({ page }) => {
    await signIn(page, "nobody@quillfeather.test", "whatever-it-is");
    await expect(formAlert(page)).toContainText("do not match an account");
  });

  test("a forged session cookie is treated as signed out", async ({ page, context, baseURL }) => {
    await context.addCookies([{ name: "authjs.session-token", value: "forged.token.value", url: baseURL! }]);
    await page.goto("/projects");
    await expect(page).toHaveURL(/\/sign-in/);
  });

  test("a designer opening the users page is refused without a stack trace", async ({ page }) => {
    await signInAs(page, "designer");
    await page.goto("/admin/users");
    await expect(formAlert(page)).toContainText("Only administrators");
    await expect(page.locator("body")).not.toContainText(/node_modules|\bat [\w.<>]+ \(|TypeError|ReferenceError/);
  });

  test("an unknown project id is a plain not-found", async ({ page }) => {
    await signInAs(page, "designer");
    const response = await page.request.get("/api/projects/00000000-0000-0000-0000-000000000000/checks");
    expect([404]).toContain(response.status());
  });
});

test("an admin adds a user, who is locked out after repeated wrong passwords and cannot sign in once deactivated", async ({ page, browser }) => {
  const stamp = Date.now().toString(36);
  const email = `pat-${stamp}@quillfeather.test`;
  const name = `Pat Lindqvist ${stamp}`;
  await signInAs(page, "admin");
  const form = page.getByRole("form", { name: "Add a user" });
  await form.getByLabel("Name").fill(name);
  await form.getByLabel("E-mail").fill(email);
  await form.getByLabel("First password (12+ characters)").fill("first-password-pat");
  await form.getByLabel("Installer").check();
  await form.getByRole("button", { name: "Add user" }).click();
  await expect(page.getByRole("table", { name: "Users" }).getByText(email)).toBeVisible();

  const other = await browser.newPage();
  for (let i = 0; i < 5; i++) await signIn(other, email, `wrong-${i}`);
  await expect(formAlert(other)).toContainText("locked");
  await signIn(other, email, "first-password-pat");
  await expect(formAlert(other)).toContainText("locked");

  await page.reload();
  await page.getByRole("form", { name: `Deactivate ${name}` }).getByRole("button").click();
  await expect(page.getByRole("form", { name: `Reactivate ${name}` })).toBeVisible();
  await signIn(other, email, "first-password-pat");
  await expect(formAlert(other)).toContainText(/deactivated|locked/);
  await other.close();
});

test("a role change by an admin ends the person's open session: their next page asks them to sign in again", async ({ page, browser }) => {
  const stamp = Date.now().toString(36);
  const email = `rue-${stamp}@quillfeather.test`;
  const name = `Rue Halvorsen ${stamp}`;
  await signInAs(page, "admin");
  const form = page.getByRole("form", { name: "Add a user" });
  await form.getByLabel("Name").fill(name);
  await form.getByLabel("E-mail").fill(email);
  await form.getByLabel("First password (12+ characters)").fill("first-password-rue");
  await form.getByLabel("Designer").check();
  await form.getByRole("button", { name: "Add user" }).click();
  await expect(page.getByRole("table", { name: "Users" }).getByText(email)).toBeVisible();

  const other = await browser.newPage();
  // A first password from an admin is replaced at the first sign-in, which ends that session.
  await signIn(other, email, "first-password-rue");
  await expect(other).toHaveURL(/\/account\/password$/);
  await other.getByLabel("Current password").fill("first-password-rue");
  await other.getByLabel("New password (12 to 72 characters)").fill("rue-chose-this-one");
  await other.getByRole("button", { name: "Change password" }).click();
  await expect(other.getByRole("status")).toContainText("Password changed");
  await signIn(other, email, "rue-chose-this-one");
  await expect(other.getByRole("button", { name: "Sign out" })).toBeVisible();
  await other.goto("/projects");
  await expect(other).toHaveURL(/\/projects$/);

  const roles = page.getByRole("form", { name: `Roles of ${name}` });
  await roles.getByLabel("Reviewer").check();
  await roles.getByRole("button", { name: "Save roles" }).click();
  await expect(roles.getByRole("status")).toBeVisible();

  await other.goto("/projects");
  await expect(other).toHaveURL(/\/sign-in/);
  await other.close();
});
