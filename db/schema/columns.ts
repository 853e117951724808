import { sql } from "drizzle-orm";
import { integer, text } from "drizzle-orm/sqlite-core";

/** Text ids (UUID v4) so ids carry no count of another organisation's rows. */
export const id = () =>
  text("id")
    .primaryKey()
    .$defaultFn(() => crypto.randomUUID());

/** ISO-8601 UTC timestamps, readable in the SQLite shell and sortable as text. */
export const createdAt = () =>
  text("created_at")
    .notNull()
    .default(sql`(strftime('%Y-%m-%dT%H:%M:%fZ','now'))`);
export const updatedAt = () =>
  text("updated_at")
    .notNull()
    .default(sql`(strftime('%Y-%m-%dT%H:%M:%fZ','now'))`);

/** Optimistic concurrency: every edit names the version it read; a stale one is refused. */
export const version = () => integer("version").notNull().default(1);
