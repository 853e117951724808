/**
 * `npm run db:restore -- <backup folder> [--force]`: checks every digest in
 * the backup, then restores the database to DATABASE_PATH and the files to
 * UPLOADS_DIR (or the S3 bucket) and PACKETS_DIR, and reads every file back.
 * An existing database is replaced only with --force; stop the app first.
 */
import { restoreBackup } from "../db/backup";
import { env, resolvePath } from "../lib/env";
import { packetsRoot } from "../lib/services/revisions/packet-files";
import { fileStore } from "../lib/storage";

async function main() {
  const dir = process.argv.slice(2).find((a) => !a.startsWith("--"));
  if (!dir) throw new Error("Usage: npm run db:restore -- <backup folder> [--force]");
  const report = await restoreBackup(dir, resolvePath(env().DATABASE_PATH), { uploads: fileStore(), packetsRoot: packetsRoot() }, { force: process.argv.includes("--force") });
  console.log(`Restored ${dir} to ${report.databasePath}`);
  console.log(`  integrity: ${report.integrity}; files: ${report.files}, every one read back with its SHA-256`);
  if (report.integrity !== "ok" || report.unreadable.length) {
    for (const f of report.unreadable) console.error(`  cannot be read back: ${f.area}/${f.key}`);
    process.exitCode = 1;
  }
}

main().catch((error) => {
  console.error(error instanceof Error ? error.message : error);
  process.exitCode = 1;
});
