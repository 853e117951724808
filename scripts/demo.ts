/**
 * `npm run demo`: migrates and seeds the demo database, builds the app if
 * needed, starts the local mail stand-in and serves Sundocket.
 */
import fs from "node:fs";
import path from "node:path";
import { migrateDatabase, openDatabase } from "../db/client";
import { DEMO_USERS } from "../db/demo-scenario";
import { seed } from "../db/seed";
import { SeedRefusedError } from "../db/seed-guard";
import { env, resolvePath } from "../lib/env";
import { startFakeSmtp } from "./fake-smtp";
import { ensureSecrets } from "./lib/ensure-secret";
import { run } from "./lib/run";

async function main() {
  ensureSecrets();
  const dbFile = resolvePath(env().DATABASE_PATH);
  const db = openDatabase(dbFile);
  migrateDatabase(db);
  try {
    await seed(db, { force: process.argv.includes("--force") });
  } finally {
    db.$client.close();
  }
  console.log(`Database ready: ${dbFile}`);

  const built = fs.existsSync(path.join(process.cwd(), ".next", "BUILD_ID")) && fs.existsSync(path.join(process.cwd(), "dist", "worker.cjs"));
  if (!built || process.argv.includes("--rebuild")) {
    console.log("Building Sundocket and its job worker (first run only; about a minute)…");
    const code = await run("npm", ["run", "build"]);
    if (code !== 0) process.exit(code);
  }

  try {
    await startFakeSmtp();
  } catch (error) {
    console.warn(`Mail stand-in not started (${(error as Error).message}); e-mails will stay queued in the outbox.`);
  }

  const port = process.env.PORT ?? "3000";
  console.log(`\nSundocket is starting at http://localhost:${port}\n`);
  console.log("Demo sign-ins:");
  for (const u of DEMO_USERS) console.log(`  ${u.roles.join(", ").padEnd(10)} ${u.email.padEnd(30)} password: ${u.password}`);
  console.log("\nPress Ctrl+C to stop.\n");
  const code = await run("npx", ["next", "start", "-H", "localhost", "-p", port]);
  process.exit(code);
}

main().catch((error) => {
  console.error(error instanceof SeedRefusedError ? error.message : error);
  process.exit(1);
});
