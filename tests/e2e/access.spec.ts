import { expect, test } from "@playwright/test";
import type { Role } from "../../lib/auth/roles";
import { signInAs } from "./helpers";

/**
 * Each page of the app opened by each demo role and signed out: a page a role
 * does not work on says so and shows none of its content; signed out, every
 * page leads to the sign-in. Who works where is written here from the roles'
 * jobs, not read from the permissions module.
 */

const READERS: Role[] = ["designer", "reviewer", "office", "admin"];
const PAGES: { path: string; heading: RegExp; allowed: Role[] }[] = [
  { path: "/projects", heading: /Projects/, allowed: READERS },
  { path: "/projects/new", heading: /New project/, allowed: ["designer"] },
  { path: "/projects/templates", heading: /templates/i, allowed: READERS },
  { path: "/library", heading: /library/i, allowed: READERS },
  { path: "/jurisdictions", heading: /Jurisdictions/, allowed: READERS },
  { path: "/reviews", heading: /Review/, allowed: READERS },
  { path: "/reviews/licence", heading: /licence/i, allowed: ["reviewer"] },
  { path: "/submissions", heading: /Submissions|Permit/, allowed: ["designer", "office", "admin"] },
  { path: "/submissions/new", heading: /Submit|submission/i, allowed: ["office"] },
  { path: "/install", heading: /Approved sets|Install/i, allowed: ["installer", "office", "admin"] },
  { path: "/outbox", heading: /Outbox|e-mail/i, allowed: ["office", "admin"] },
  { path: "/admin/users", heading: /Users/, allowed: ["admin"] },
  { path: "/account/password", heading: /password/i, allowed: ["designer", "reviewer", "office", "installer", "admin"] },
];
const ROLES: Role[] = ["designer", "reviewer", "office", "installer", "admin"];
const REFUSED = "Not available to your role";

test.describe("signed out", () => {
  for (const page of PAGES) {
    test(`${page.path} leads to the sign-in`, async ({ page: browser }) => {
      await browser.goto(page.path);
      await expect(browser).toHaveURL(/\/sign-in/);
      await expect(browser.getByLabel("E-mail")).toBeVisible();
    });
  }
});

for (const role of ROLES) {
  test(`${role}: every page is open or refused as the role's work says`, async ({ page: browser }) => {
    await signInAs(browser, role);
    const seen: string[] = [];
    for (const page of PAGES) {
      const response = await browser.goto(page.path);
      expect(response?.status(), page.path).toBeLessThan(500);
      const main = browser.locator("main");
      if (page.allowed.includes(role)) {
        await expect(main.getByRole("heading", { level: 1 }), `${role} on ${page.path}`).toHaveText(page.heading);
        await expect(main.getByText(REFUSED), `${role} on ${page.path}`).toHaveCount(0);
        seen.push(`${page.path} open`);
      } else {
        await expect(main.getByText(REFUSED), `${role} on ${page.path}`).toBeVisible();
        // The refusal stands alone: no table, form or list of the page's content behind it.
        await expect(main.locator("table, form, ul li a"), `${role} on ${page.path}`).toHaveCount(0);
        seen.push(`${page.path} refused`);
      }
    }
    expect(seen).toHaveLength(PAGES.length);
  });
}
