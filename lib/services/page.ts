import "server-only";
import { and, eq, gt, lt, or, type SQL } from "drizzle-orm";
import type { SQLiteColumn } from "drizzle-orm/sqlite-core";
import { z } from "zod";
import { ServiceError } from "./errors";

/**
 * Keyset pagination for lists ordered newest first by (timestamp, id): a page
 * costs the same at row 10 as at row 10,000, and rows written meanwhile do not
 * shift later pages as an offset would.
 */
export interface PageRequest {
  cursor?: string | null;
  limit?: number | null;
}

export interface Page<T> {
  rows: T[];
  /** Opaque; pass it back to get the next page. Null on the last page. */
  nextCursor: string | null;
}

export const DEFAULT_PAGE_SIZE = 50;
export const MAX_PAGE_SIZE = 200;

const cursorSchema = z.tuple([z.string(), z.string()]);

function invalidCursor(): ServiceError {
  return new ServiceError("invalid", "The list position is not valid; start from the first page.", [{ path: "cursor", message: "not a list position" }]);
}

export function pageSize(request: PageRequest): number {
  const limit = request.limit ?? DEFAULT_PAGE_SIZE;
  if (!Number.isInteger(limit) || limit < 1 || limit > MAX_PAGE_SIZE) {
    throw new ServiceError("invalid", `A page holds 1 to ${MAX_PAGE_SIZE} rows.`, [{ path: "limit", message: `1 to ${MAX_PAGE_SIZE}` }]);
  }
  return limit;
}

/** The condition "after the cursor" for a list ordered by (at desc, id desc); undefined on the first page. */
export function afterCursor(request: PageRequest, at: SQLiteColumn, id: SQLiteColumn): SQL | undefined {
  if (!request.cursor) return undefined;
  let parsed: [string, string];
  try {
    parsed = cursorSchema.parse(JSON.parse(Buffer.from(request.cursor, "base64url").toString("utf8")));
  } catch {
    throw invalidCursor();
  }
  const [atValue, idValue] = parsed;
  return or(lt(at, atValue), and(eq(at, atValue), lt(id, idValue)));
}

/** The condition "after the cursor" for a list ordered by (key asc, id asc), such as names A to Z. */
export function afterCursorAscending(request: PageRequest, key: SQLiteColumn, id: SQLiteColumn): SQL | undefined {
  if (!request.cursor) return undefined;
  let parsed: [string, string];
  try {
    parsed = cursorSchema.parse(JSON.parse(Buffer.from(request.cursor, "base64url").toString("utf8")));
  } catch {
    throw invalidCursor();
  }
  const [keyValue, idValue] = parsed;
  return or(gt(key, keyValue), and(eq(key, keyValue), gt(id, idValue)));
}

/** Cuts the one extra row fetched (limit + 1) into the next cursor. */
export function toPage<T>(rows: T[], limit: number, key: (row: T) => [string, string]): Page<T> {
  if (rows.length <= limit) return { rows, nextCursor: null };
  const kept = rows.slice(0, limit);
  const last = kept[kept.length - 1]!;
  return { rows: kept, nextCursor: Buffer.from(JSON.stringify(key(last)), "utf8").toString("base64url") };
}

/** Reads ?cursor= and ?limit= from a request URL. */
export function pageRequestFrom(url: string): PageRequest {
  const params = new URL(url).searchParams;
  const limit = params.get("limit");
  return { cursor: params.get("cursor"), limit: limit === null ? null : Number(limit) };
}
