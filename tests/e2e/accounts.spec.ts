import fs from "node:fs";
import path from "node:path";
import { expect, test, type Browser, type Page } from "@playwright/test";
import { formAlert, signIn, signInAs } from "./helpers";

/** Where the local mail stand-in keeps each message it received (playwright.config.ts MAIL_DIR). */
const MAIL_DIR = path.resolve("data/e2e/mail");

/** Quoted-printable (RFC 2045 §6.7): soft line breaks and =XX escapes. */
function decodeQuotedPrintable(text: string): string {
  return text.replace(/=\r?\n/g, "").replace(/=([0-9A-F]{2})/g, (_, hex: string) => String.fromCharCode(parseInt(hex, 16)));
}

/** The one-time link in the newest message to `to` whose subject matches, waiting for the worker to deliver it. */
async function linkFromMail(to: string, subject: RegExp, after: number): Promise<string> {
  let found: string | undefined;
  await expect
    .poll(
      () => {
        if (!fs.existsSync(MAIL_DIR)) return undefined;
        const files = fs
          .readdirSync(MAIL_DIR)
          .map((name) => path.join(MAIL_DIR, name))
          .filter((file) => fs.statSync(file).mtimeMs >= after)
          .sort((a, b) => fs.statSync(b).mtimeMs - fs.statSync(a).mtimeMs);
        for (const file of files) {
          const message = decodeQuotedPrintable(fs.readFileSync(file, "utf8"));
          if (!message.toLowerCase().includes(`to: ${to}`) || !subject.test(message)) continue;
          found = /https?:\/\/\S+\/set-password\?token=[A-Za-z0-9_-]{43}/.exec(message)?.[0];
          if (found) return found;
        }
        return undefined;
      },
      { timeout: 30_000, message: `an e-mail to ${to}` },
    )
    .toBeTruthy();
  return new URL(found!).pathname + new URL(found!).search;
}

async function choosePassword(page: Page, link: string, password: string, confirm = password) {
  await page.goto(link);
  const form = page.getByRole("form", { name: "Choose a password" });
  await form.getByLabel("New password (12 to 72 characters)").fill(password);
  await form.getByLabel("The same password again").fill(confirm);
  await form.getByRole("button", { name: "Set password" }).click();
}

async function freshPage(browser: Browser) {
  const context = await browser.newContext();
  return context.newPage();
}

test("an admin invites a designer by e-mail; the link sets their password once, and bad input leaves it working", async ({ page, browser }) => {
  const stamp = Date.now().toString(36);
  const email = `ines-${stamp}@quillfeather.test`;
  const before = Date.now() - 1000;
  await signInAs(page, "admin");
  const form = page.getByRole("form", { name: "Invite a user" });
  await form.getByLabel("Name").fill(`Ines Marlowe ${stamp}`);
  await form.getByLabel("E-mail").fill(email);
  await form.getByLabel("Designer").check();
  await form.getByRole("button", { name: "Send invitation" }).click();
  await expect(form.getByRole("status")).toContainText("Invitation sent");
  await expect(page.getByRole("table", { name: "Users" }).getByText(email)).toBeVisible();

  const link = await linkFromMail(email, /Subject: You are invited/, before);
  const invitee = await freshPage(browser);
  // A mismatch and a short password are refused by name; the link still works afterwards.
  await choosePassword(invitee, link, "ines password one", "ines password two");
  await expect(formAlert(invitee)).toContainText("not valid");
  await expect(invitee.getByText("does not match the new password")).toBeVisible();
  await choosePassword(invitee, link, "short");
  await expect(invitee.getByText("must be at least 12 characters")).toBeVisible();

  await choosePassword(invitee, link, "ines chose this password");
  await expect(invitee.getByRole("status")).toContainText("Password set");
  await invitee.goto(link);
  await expect(invitee.getByRole("heading", { name: "This link no longer works" })).toBeVisible();

  await signIn(invitee, email, "ines chose this password");
  await expect(invitee).toHaveURL(/\/projects$/);
  await expect(invitee.getByRole("button", { name: "Sign out" })).toBeVisible();
  await invitee.context().close();
});

test("a person who forgot their password resets it by e-mail; the old password stops working", async ({ page, browser }) => {
  const stamp = Date.now().toString(36);
  const email = `oskar-${stamp}@quillfeather.test`;
  await signInAs(page, "admin");
  const add = page.getByRole("form", { name: "Invite a user" });
  await add.getByLabel("Name").fill(`Oskar Penhale ${stamp}`);
  await add.getByLabel("E-mail").fill(email);
  await add.getByLabel("Office").check();
  const invited = Date.now() - 1000;
  await add.getByRole("button", { name: "Send invitation" }).click();
  await expect(add.getByRole("status")).toBeVisible();
  const person = await freshPage(browser);
  await choosePassword(person, await linkFromMail(email, /Subject: You are invited/, invited), "oskar first password");
  await expect(person.getByRole("status")).toContainText("Password set");

  await person.goto("/sign-in");
  await person.getByRole("link", { name: "Forgot your password?" }).click();
  await expect(person).toHaveURL(/\/forgot-password$/);
  const asked = Date.now() - 1000;
  await person.getByLabel("E-mail").fill(email);
  await person.getByRole("button", { name: "Send me a link" }).click();
  await expect(person.getByRole("status")).toContainText("If that e-mail belongs to an active account");

  const link = await linkFromMail(email, /Subject: Choose a new Sundocket password/, asked);
  await choosePassword(person, link, "oskar second password");
  await expect(person.getByRole("status")).toContainText("Password set");

  await signIn(person, email, "oskar first password");
  await expect(formAlert(person)).toContainText("do not match");
  await signIn(person, email, "oskar second password");
  await expect(person).toHaveURL(/\/submissions$/);
  await person.context().close();
});

test("an unknown e-mail gets the same reset answer", async ({ page }) => {
  await page.goto("/forgot-password");
  await page.getByLabel("E-mail").fill(`nobody-${Date.now().toString(36)}@quillfeather.test`);
  await page.getByRole("button", { name: "Send me a link" }).click();
  await expect(page.getByRole("status")).toContainText("If that e-mail belongs to an active account");
});

test("after an admin sets a password, the person must choose their own before anything else", async ({ page, browser }) => {
  const stamp = Date.now().toString(36);
  const email = `mira-${stamp}@quillfeather.test`;
  const name = `Mira Osei ${stamp}`;
  await signInAs(page, "admin");
  const add = page.getByRole("form", { name: "Invite a user" });
  await add.getByLabel("Name").fill(name);
  await add.getByLabel("E-mail").fill(email);
  await add.getByLabel("Designer").check();
  const invited = Date.now() - 1000;
  await add.getByRole("button", { name: "Send invitation" }).click();
  await expect(add.getByRole("status")).toBeVisible();
  const person = await freshPage(browser);
  await choosePassword(person, await linkFromMail(email, /Subject: You are invited/, invited), "mira forgot this one");

  await page.reload();
  const row = page.getByRole("row").filter({ hasText: email });
  await row.getByText("Set a password").click();
  const setForm = page.getByRole("form", { name: `Set a password for ${name}` });
  await setForm.getByLabel(`New password for ${name} (12+ characters)`).fill("admin gave mira this");
  await setForm.getByRole("button", { name: "Set password" }).click();
  await expect(setForm.getByRole("status")).toContainText("next sign-in");

  await signIn(person, email, "admin gave mira this");
  await expect(person).toHaveURL(/\/account\/password$/);
  await expect(person.getByText("An administrator set the password you signed in with")).toBeVisible();
  await person.goto("/projects");
  await expect(person).toHaveURL(/\/account\/password$/);
  // Route handlers refuse too, not only pages.
  expect((await person.request.get("/api/projects")).status()).toBe(403);

  await person.getByLabel("Current password").fill("admin gave mira this");
  await person.getByLabel("New password (12 to 72 characters)").fill("mira chose her own");
  await person.getByRole("button", { name: "Change password" }).click();
  await expect(person.getByRole("status")).toContainText("Password changed");

  await signIn(person, email, "mira chose her own");
  await expect(person).toHaveURL(/\/projects$/);
  await person.context().close();
});
