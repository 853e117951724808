/**
 * `npm test`: every test the project has, in the order that fails fastest —
 * types, lint, unit and integration tests, then the production build and the
 * end-to-end suite in Debian's Chromium against a freshly seeded database.
 */
import fs from "node:fs";
import path from "node:path";
import { migrateDatabase, openDatabase } from "../db/client";
import { seed } from "../db/seed";
import { ensureAuthSecret } from "./lib/ensure-secret";
import { commandExists, run } from "./lib/run";

const CHROMIUM = process.env.CHROMIUM_PATH ?? "/usr/bin/chromium";
const RESULTS_DIR = path.resolve("data/test-results");

/** One closing line over both runners, so a reader (or CI) sees the whole count. */
function printTotals(): void {
  let passed = 0;
  let failed = 0;
  let skipped = 0;
  try {
    const unit = JSON.parse(fs.readFileSync(path.join(RESULTS_DIR, "vitest.json"), "utf8"));
    passed += unit.numPassedTests ?? 0;
    failed += unit.numFailedTests ?? 0;
    skipped += (unit.numPendingTests ?? 0) + (unit.numTodoTests ?? 0);
  } catch {
    console.warn("(no unit test report found)");
  }
  try {
    const e2e = JSON.parse(fs.readFileSync(path.join(RESULTS_DIR, "e2e.json"), "utf8"));
    passed += (e2e.stats?.expected ?? 0) + (e2e.stats?.flaky ?? 0);
    failed += e2e.stats?.unexpected ?? 0;
    skipped += e2e.stats?.skipped ?? 0;
  } catch {
    console.warn("(no end-to-end report found)");
  }
  console.log(`\n${passed} passed, ${failed} failed, ${skipped} skipped`);
}

async function ensureChromium(): Promise<void> {
  if (fs.existsSync(CHROMIUM)) return;
  const isRoot = typeof process.getuid === "function" && process.getuid() === 0;
  if (isRoot && commandExists("apt-get")) {
    console.log("Chromium is missing; installing Debian's chromium package for the browser tests…");
    const update = await run("apt-get", ["update", "-qq"]);
    const install = update === 0 ? await run("apt-get", ["install", "-y", "-qq", "chromium"]) : update;
    if (install === 0 && fs.existsSync(CHROMIUM)) return;
  }
  console.error(
    `The browser tests need Chromium at ${CHROMIUM}.\n` +
      "Install it with `sudo apt-get install -y chromium` (Debian/Ubuntu), or set CHROMIUM_PATH to a Chromium binary.",
  );
  process.exit(1);
}

async function step(name: string, command: string, args: string[], env: NodeJS.ProcessEnv = process.env) {
  console.log(`\n── ${name} ──`);
  const started = Date.now();
  const code = await run(command, args, env);
  console.log(`── ${name}: ${code === 0 ? "ok" : `failed (exit ${code})`} in ${((Date.now() - started) / 1000).toFixed(1)} s`);
  if (code !== 0) process.exit(code);
}

async function prepareE2eDatabase(): Promise<void> {
  const dir = path.resolve("data/e2e");
  // The seed writes packet files; put them where the e2e server (playwright.config.ts) reads them.
  process.env.PACKETS_DIR = path.join(dir, "packets");
  process.env.UPLOADS_DIR = path.join(dir, "uploads");
  fs.rmSync(dir, { recursive: true, force: true });
  fs.mkdirSync(dir, { recursive: true });
  const db = openDatabase(path.join(dir, "sundocket.db"));
  migrateDatabase(db);
  await seed(db);
  db.$client.close();
}

async function main() {
  ensureAuthSecret();
  await ensureChromium();
  await step("Type check", "npx", ["tsc", "--noEmit"]);
  await step("Lint", "npx", ["eslint", "--max-warnings", "0", "."]);
  fs.mkdirSync(RESULTS_DIR, { recursive: true });
  await step("Unit and integration tests", "npx", [
    "vitest",
    "run",
    "--reporter=default",
    "--reporter=json",
    `--outputFile.json=${path.join(RESULTS_DIR, "vitest.json")}`,
  ]);
  await step("Production build", "npx", ["next", "build"]);
  console.log("\n── Seeding the end-to-end database ──");
  await prepareE2eDatabase();
  await step("End-to-end tests (Chromium)", "npx", ["playwright", "test"], {
    ...process.env,
    PLAYWRIGHT_JSON_OUTPUT_NAME: path.join(RESULTS_DIR, "e2e.json"),
  });
  printTotals();
}

main().catch((error) => {
  console.error(error);
  process.exit(1);
});
