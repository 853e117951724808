import fs from "node:fs";
import path from "node:path";
import Database from "better-sqlite3";
import { drizzle, type BetterSQLite3Database } from "drizzle-orm/better-sqlite3";
import { migrate } from "drizzle-orm/better-sqlite3/migrator";
import { env, resolvePath } from "../lib/env";
import * as schema from "./schema";

export type Db = BetterSQLite3Database<typeof schema> & { $client: Database.Database };

/** Opens a SQLite file with the settings every connection needs. */
export function openDatabase(filePath: string): Db {
  fs.mkdirSync(path.dirname(filePath), { recursive: true });
  const sqlite = new Database(filePath);
  sqlite.pragma("journal_mode = WAL");
  sqlite.pragma("foreign_keys = ON");
  // Generation and the web server share the file; wait for a writer rather than fail.
  sqlite.pragma("busy_timeout = 5000");
  sqlite.pragma("synchronous = NORMAL");
  return drizzle(sqlite, { schema }) as Db;
}

export const MIGRATIONS_DIR = path.resolve(process.cwd(), "drizzle");

export function migrateDatabase(db: Db): void {
  migrate(db, { migrationsFolder: MIGRATIONS_DIR });
}

const globalForDb = globalThis as unknown as { sundocketDb?: Db };

/** The process-wide connection, migrated on first use. */
export function getDb(): Db {
  if (!globalForDb.sundocketDb) {
    const db = openDatabase(resolvePath(env().DATABASE_PATH));
    migrateDatabase(db);
    globalForDb.sundocketDb = db;
  }
  return globalForDb.sundocketDb;
}

export { schema };
