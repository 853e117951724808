import { expect, type Page } from "@playwright/test";
import { DEMO_USERS } from "../../db/demo-scenario";
import type { Role } from "../../lib/auth/roles";

export function demoUser(role: Role) {
  const user = DEMO_USERS.find((u) => u.roles.includes(role));
  if (!user) throw new Error(`no demo user with role ${role}`);
  return user;
}

export async function signIn(page: Page, email: string, password: string) {
  await page.goto("/sign-in");
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password").fill(password);
  await page.getByRole("button", { name: "Sign in" }).click();
}

export async function signInAs(page: Page, role: Role) {
  const user = demoUser(role);
  await signIn(page, user.email, user.password);
  await expect(page.getByRole("button", { name: "Sign out" })).toBeVisible();
}

/** Our own alerts (the framework's route announcer also has role=alert, outside <main>). */
export function formAlert(page: Page) {
  return page.locator("main [role=alert]");
}
