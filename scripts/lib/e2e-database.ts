/** The end-to-end suite's own database, seeded afresh under data/e2e/ where playwright.config.ts points the server. */
import fs from "node:fs";
import path from "node:path";
import { migrateDatabase, openDatabase } from "../../db/client";
import { seed } from "../../db/seed";

export async function prepareE2eDatabase(): Promise<void> {
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
