/**
 * `npm test`: every test the project has, in the order that fails fastest —
 * types, lint, unit and integration tests, then the production build and the
 * end-to-end suite in Debian's Chromium against a freshly seeded database.
 */
import fs from "node:fs";
import path from "node:path";
import { prepareE2eDatabase } from "./lib/e2e-database";
import { ensureSecrets } from "./lib/ensure-secret";
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

/**
 * Debian packages the suite runs against: Chromium for the browser tests, redis-server for the job queue's scale-out
 * backend, poppler-utils (pdftoppm) for reading packets back as pictures. Installed when missing and we are root.
 */
const DEBIAN_NEEDS: { pkg: string; binary: string; why: string }[] = [
  { pkg: "chromium", binary: CHROMIUM, why: "the browser tests" },
  { pkg: "redis-server", binary: process.env.REDIS_SERVER_PATH ?? "/usr/bin/redis-server", why: "the job queue tests on Redis" },
  { pkg: "poppler-utils", binary: "/usr/bin/pdftoppm", why: "rendering packet pages in tests" },
];

async function ensureDebianPackages(): Promise<void> {
  const missing = DEBIAN_NEEDS.filter((n) => !fs.existsSync(n.binary));
  if (missing.length === 0) return;
  const isRoot = typeof process.getuid === "function" && process.getuid() === 0;
  if (isRoot && commandExists("apt-get")) {
    console.log(`Installing Debian's ${missing.map((n) => n.pkg).join(", ")} for ${missing.map((n) => n.why).join(", ")}…`);
    const update = await run("apt-get", ["update", "-qq"]);
    const install = update === 0 ? await run("apt-get", ["install", "-y", "-qq", ...missing.map((n) => n.pkg)]) : update;
    if (install === 0 && missing.every((n) => fs.existsSync(n.binary))) return;
  }
  for (const n of missing.filter((m) => !fs.existsSync(m.binary))) {
    console.error(`${n.why} need ${n.binary}: install it with \`sudo apt-get install -y ${n.pkg}\` (Debian/Ubuntu).`);
  }
  if (!fs.existsSync(CHROMIUM)) console.error("Or set CHROMIUM_PATH to a Chromium binary.");
  process.exit(1);
}

async function step(name: string, command: string, args: string[], env: NodeJS.ProcessEnv = process.env) {
  console.log(`\n── ${name} ──`);
  const started = Date.now();
  const code = await run(command, args, env);
  console.log(`── ${name}: ${code === 0 ? "ok" : `failed (exit ${code})`} in ${((Date.now() - started) / 1000).toFixed(1)} s`);
  if (code !== 0) process.exit(code);
}

async function main() {
  ensureSecrets();
  await ensureDebianPackages();
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
  // The web app and the job worker it starts beside itself (dist/worker.cjs).
  await step("Production build", "npm", ["run", "build"]);
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
