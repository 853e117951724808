import { expect, test } from "@playwright/test";
import { signInAs } from "./helpers";

/** What a browser is told about our pages, and what another site can make it do with a user's session. */

function nonceOf(csp: string | undefined): string | undefined {
  return /'nonce-([^']+)'/.exec(csp ?? "")?.[1];
}

test("pages carry a nonce CSP that their own scripts satisfy, a fresh nonce each time", async ({ page }) => {
  const violations: string[] = [];
  page.on("console", (message) => {
    if (/Content Security Policy|Refused to (execute|load)/i.test(message.text())) violations.push(message.text());
  });
  const first = await page.request.get("/sign-in");
  const headers = first.headers();
  const csp = headers["content-security-policy"];
  expect(csp).toMatch(/script-src 'self' 'nonce-[A-Za-z0-9+/=]+' 'strict-dynamic'/);
  expect(csp).toContain("frame-ancestors 'none'");
  expect(csp).toContain("object-src 'none'");
  expect(headers["x-content-type-options"]).toBe("nosniff");
  expect(headers["referrer-policy"]).toBe("strict-origin-when-cross-origin");
  // Served over http here, so no HSTS (it would pin a browser to https the server does not speak).
  expect(headers["strict-transport-security"]).toBeUndefined();

  const nonce = nonceOf(csp);
  const html = await first.text();
  const scripts = [...html.matchAll(/<script\b[^>]*>/g)].map((m) => m[0]);
  expect(scripts.length).toBeGreaterThan(0);
  for (const tag of scripts) expect(tag).toContain(`nonce="${nonce}"`);

  const second = await page.request.get("/sign-in");
  expect(nonceOf(second.headers()["content-security-policy"])).not.toBe(nonce);

  // The page works under its policy: signing in runs React, and nothing was refused.
  await signInAs(page, "designer");
  await expect(page).toHaveURL(/\/projects$/);
  expect(violations).toEqual([]);
});

test("route handlers answer with a policy that lets nothing run", async ({ page }) => {
  const health = await page.request.get("/api/health");
  expect(health.headers()["content-security-policy"]).toBe("default-src 'none'; frame-ancestors 'none'");
  expect(health.headers()["x-content-type-options"]).toBe("nosniff");
});

test("another site cannot change data with the user's session", async ({ page }) => {
  await signInAs(page, "designer");
  const before = ((await (await page.request.get("/api/projects")).json()) as { projects: unknown[] }).projects.length;
  const body = JSON.stringify({ name: "Forged", client: "x", systemKind: "stand-alone", jurisdictionId: "x", address: "x" });

  const crossSite = await page.request.post("/api/projects", { data: body, headers: { "content-type": "application/json", origin: "https://evil.example" } });
  expect(crossSite.status()).toBe(403);
  // What an HTML form on another site can send without asking: text/plain.
  const formPost = await page.request.post("/api/projects", { data: body, headers: { "content-type": "text/plain" } });
  expect(formPost.status()).toBe(415);

  const after = ((await (await page.request.get("/api/projects")).json()) as { projects: unknown[] }).projects.length;
  expect(after).toBe(before);
});
