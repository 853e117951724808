/**
 * `npm run db:backup -- [folder]`: a consistent copy of the database at
 * DATABASE_PATH (taken while the app serves) and of every file it names.
 * Without a folder it writes backups/sundocket-<time>/.
 */
import path from "node:path";
import { createBackup } from "../db/backup";
import { openDatabase } from "../db/client";
import { env, resolvePath } from "../lib/env";
import { packetsRoot } from "../lib/services/revisions/packet-files";
import { fileStore } from "../lib/storage";

async function main() {
  const folderArg = process.argv.slice(2).find((a) => !a.startsWith("--"));
  const dir = path.resolve(folderArg ?? path.join("backups", `sundocket-${new Date().toISOString().replace(/[:.]/g, "-")}`));
  const db = openDatabase(resolvePath(env().DATABASE_PATH));
  try {
    const manifest = await createBackup(db, { uploads: fileStore(), packetsRoot: packetsRoot() }, dir);
    const bytes = manifest.files.reduce((sum, f) => sum + f.sizeBytes, 0);
    console.log(`Backed up ${resolvePath(env().DATABASE_PATH)} to ${dir}`);
    console.log(`  database: ${manifest.database.sizeBytes} bytes, integrity ${manifest.database.integrity}`);
    console.log(`  files: ${manifest.files.length} (${bytes} bytes), each checked against its SHA-256`);
    if (manifest.database.integrity !== "ok" || manifest.missing.length) {
      for (const f of manifest.missing) console.error(`  MISSING or altered in the store: ${f.area}/${f.key}`);
      if (manifest.database.integrity !== "ok") console.error("  The database copy failed its integrity check.");
      process.exitCode = 1;
    }
  } finally {
    db.$client.close();
  }
}

main().catch((error) => {
  console.error(error instanceof Error ? error.message : error);
  process.exitCode = 1;
});
