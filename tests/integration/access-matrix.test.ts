import fs from "node:fs";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";

/**
 * Every route handler and server action, called by each role of the firm that
 * owns the rows, by each role of another firm, and signed out. A refused call
 * answers the refusal's status and changes no row and no stored file; another
 * firm's answer never names the firm's rows. The expected roles are written
 * in the table (access/table.ts) from what each role does, not read from the
 * permissions module.
 */

const dirs = await vi.hoisted(async () => {
  const fsp = await import("node:fs");
  const os = await import("node:os");
  const p = await import("node:path");
  const { randomBytes } = await import("node:crypto");
  const root = fsp.mkdtempSync(p.join(os.tmpdir(), "sundocket-access-"));
  // Set before any module reads the environment, so nothing touches the developer's own database.
  process.env.DATABASE_PATH = p.join(root, "app.db");
  process.env.UPLOADS_DIR = p.join(root, "uploads");
  process.env.PACKETS_DIR = p.join(root, "packets");
  process.env.APP_URL = "http://localhost:3000";
  process.env.CERTIFICATE_KEY = randomBytes(32).toString("base64");
  return { root, uploads: p.join(root, "uploads"), packets: p.join(root, "packets"), database: p.join(root, "app.db") };
});

let session: unknown = null;
vi.mock("@/auth", () => ({
  auth: async () => session,
  signIn: async () => undefined,
  signOut: async () => undefined,
  handlers: { GET: async () => new Response(null), POST: async () => new Response(null) },
}));
vi.mock("next/cache", () => ({ revalidatePath: () => undefined, revalidateTag: () => undefined }));

const { migrateDatabase, openDatabase } = await import("../../db/client");
const { ENTRIES, OUTSIDE_THE_TABLE } = await import("./access/table");
const { buildWorld, sessionOf, stateDigest } = await import("./access/world");
type Actor = import("./access/world").Actor;
type Entry = import("./access/table").Entry;

const db = openDatabase(dirs.database);
migrateDatabase(db);
const world = await buildWorld(db, dirs.packets, dirs.uploads);

afterAll(() => {
  db.$client.close();
  fs.rmSync(dirs.root, { recursive: true, force: true });
});

type Expectation = { allowed: true } | { allowed: false; status: number; or?: number };

function expectation(entry: Entry, actor: Actor): Expectation {
  if (entry.allowed === "public") return { allowed: true };
  if (actor.kind === "signed-out") return { allowed: false, status: 401 };
  const roleMay = entry.allowed.includes(actor.role);
  // Another firm's row is refused whether its role or its firm is looked at first; neither answer shows the row exists.
  if (!roleMay) return actor.org === "foreign" ? { allowed: false, status: entry.refusedWith ?? 403, or: 404 } : { allowed: false, status: entry.refusedWith ?? 403 };
  if (actor.org === "foreign" && entry.scoped) return { allowed: false, status: 404 };
  return { allowed: true };
}

const describeActor = (a: Actor) => (a.kind === "signed-out" ? "signed out" : `${a.org === "own" ? "own firm's" : "another firm's"} ${a.role}`);

// Refusals first, so a permitted call that changes what it addresses comes after every refusal was proved against the same rows.
const cellOrder = (entry: Entry) => [...world.actors].sort((a, b) => Number(expectation(entry, a).allowed) - Number(expectation(entry, b).allowed));

const cellsRun = new Map<string, number>();

for (const entry of ENTRIES) {
  describe(entry.name, () => {
    let ids: Record<string, string> = {};
    beforeAll(async () => {
      session = null;
      ids = entry.setup ? await entry.setup(world) : {};
    });

    for (const actor of cellOrder(entry)) {
      const expected = expectation(entry, actor);
      it(`${describeActor(actor)}: ${expected.allowed ? "allowed" : `refused with ${expected.status}${expected.or ? ` or ${expected.or}` : ""}`}`, async () => {
        const before = stateDigest(world);
        session = sessionOf(db, actor);
        const outcome = await entry.call(world, ids);
        session = null;
        cellsRun.set(entry.name, (cellsRun.get(entry.name) ?? 0) + 1);
        if (expected.allowed) {
          expect([401, 403, 404], outcome.text).not.toContain(outcome.status);
          expect(outcome.status, outcome.text).toBeLessThan(500);
        } else {
          expect([expected.status, expected.or ?? expected.status], outcome.text).toContain(outcome.status);
          expect(stateDigest(world), "a refused call changed a row or a stored file").toBe(before);
        }
        if (actor.kind === "user" && actor.org === "foreign") {
          for (const id of world.ownIds()) expect(outcome.text, "another firm's answer names this firm's row").not.toContain(id);
        }
      });
    }
  });
}

/** Every route file's exported method, as "GET /api/…", and every exported server action. */
function everyHandler(): string[] {
  const names: string[] = [];
  const walk = (dir: string): string[] =>
    fs.readdirSync(dir, { withFileTypes: true }).flatMap((d) => (d.isDirectory() ? walk(path.join(dir, d.name)) : [path.join(dir, d.name)]));
  // Read from the source, not imported, so a handler that loads next-auth itself is still listed.
  for (const file of walk("app")) {
    const source = fs.readFileSync(file, "utf8");
    if (file.endsWith("route.ts")) {
      const url = "/" + path.dirname(file).split(path.sep).slice(1).join("/");
      const exported = new Set([...source.matchAll(/export (?:const|async function|function) (GET|POST|PUT|PATCH|DELETE)\b/g)].map((m) => m[1]!));
      for (const m of source.matchAll(/export const \{([^}]*)\}/g)) for (const name of m[1]!.split(",")) exported.add(name.trim());
      for (const method of ["GET", "POST", "PUT", "PATCH", "DELETE"]) if (exported.has(method)) names.push(`${method} ${url}`);
    } else if (/\.tsx?$/.test(file) && /^["']use server["'];?/m.test(source)) {
      for (const m of source.matchAll(/export (?:async function|const) (\w+)/g)) names.push(m[1]!);
    }
  }
  return names.sort();
}

describe("the table", () => {
  it("covers every route handler and server action of the app, or says why one is left out", () => {
    const covered = new Set([...ENTRIES.map((e) => e.name), ...Object.keys(OUTSIDE_THE_TABLE)]);
    const missing = everyHandler().filter((name) => !covered.has(name));
    expect(missing).toEqual([]);
  });

  it("ran every cell: each entry against the signed-out visitor and five roles of two firms", () => {
    expect(world.actors).toHaveLength(11);
    for (const entry of ENTRIES) expect(cellsRun.get(entry.name) ?? 0, entry.name).toBe(11);
  });
});
