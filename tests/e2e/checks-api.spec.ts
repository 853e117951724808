import { execFileSync } from "node:child_process";
import fs from "node:fs";
import { expect, test } from "@playwright/test";
import { signInAs } from "./helpers";

const EXAMPLES = ["examples/market-stall.json", "examples/tamarack-hut.json", "examples/ferncliff-farmhouse.json"];

/** What the command line prints with --json (exit 1 when something fails, so read stdout either way). */
function cliJson(file: string): unknown {
  try {
    return JSON.parse(execFileSync("npx", ["tsx", "scripts/check.ts", file, "--json"], { encoding: "utf8" }));
  } catch (error) {
    return JSON.parse((error as { stdout: string }).stdout);
  }
}

test("the checks route and the stored project's checks give the command line's results for the demo files", async ({ page }) => {
  test.setTimeout(120_000);
  await signInAs(page, "designer");
  const { projects } = (await (await page.request.get("/api/projects")).json()) as { projects: { id: string; name: string }[] };
  for (const file of EXAMPLES) {
    const body = JSON.parse(fs.readFileSync(file, "utf8"));
    const expected = cliJson(file) as { results: { id: string; status: string; values: unknown }[] };
    const posted = await page.request.post("/api/checks", { data: body });
    expect(posted.status()).toBe(200);
    expect(await posted.json()).toEqual(expected);

    // The seeded project holds the same design; its uploaded documents carry ids and hashes the file does not.
    const project = projects.find((p) => p.name === body.name)!;
    const stored = (await (await page.request.get(`/api/projects/${project.id}/checks`)).json()) as typeof expected;
    const designOnly = (r: { results: { id: string; status: string; values: unknown }[] }) =>
      r.results.filter((x) => !x.id.startsWith("submittal-completeness")).map((x) => ({ id: x.id, status: x.status, values: x.values }));
    expect(designOnly(stored)).toEqual(designOnly(expected));
  }
});

test("a bad project file gets 400 with the fields named, and bad JSON gets 400 too", async ({ page }) => {
  await signInAs(page, "designer");
  const body = JSON.parse(fs.readFileSync("examples/tamarack-hut.json", "utf8"));
  body.site.designLowTempC = -80;
  const invalid = await page.request.post("/api/checks", { data: body });
  expect(invalid.status()).toBe(400);
  expect((await invalid.json()).issues.map((i: { path: string }) => i.path)).toContain("site.designLowTempC");
  const garbled = await page.request.post("/api/checks", { data: "{not json", headers: { "content-type": "application/json" } });
  expect(garbled.status()).toBe(400);
  const edition = await page.request.post("/api/checks?edition=1999", { data: body });
  expect(edition.status()).toBe(400);
});
