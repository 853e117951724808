import { afterAll, describe, expect, it } from "vitest";
import { DEMO_ORG, DEMO_USERS } from "../../db/demo-scenario";
import { organisations, users } from "../../db/schema";
import { seed } from "../../db/seed";
import { assertDemoDatabase, realDataReasons, SeedRefusedError } from "../../db/seed-guard";
import { makeOrg, makeUser, tempDatabase } from "./factories";

/** Demo accounts have published passwords: they must never be added to a database that serves a real firm. */

const databases: ReturnType<typeof tempDatabase>[] = [];
const fresh = () => {
  const t = tempDatabase();
  databases.push(t);
  return t;
};
afterAll(() => databases.forEach((t) => t.cleanup()));

const demoEmails = new Set(DEMO_USERS.map((u) => u.email));
const demoAccounts = (t: ReturnType<typeof tempDatabase>) => t.db.select().from(users).all().filter((u) => demoEmails.has(u.email)).length;

describe("the demo seed's guard", () => {
  it("refuses a database holding another firm, adding no demo account", async () => {
    const t = fresh();
    const firm = makeOrg(t.db, "Harrow Electric Ltd");
    makeUser(t.db, firm.id, ["admin"]);
    await expect(seed(t.db, { environment: {} })).rejects.toBeInstanceOf(SeedRefusedError);
    expect(demoAccounts(t)).toBe(0);
    expect(t.db.select().from(organisations).all().map((o) => o.name)).toEqual(["Harrow Electric Ltd"]);
  });

  it("says why, naming the firm, and how to go on", () => {
    const t = fresh();
    makeOrg(t.db, "Harrow Electric Ltd");
    const error = (() => {
      try {
        assertDemoDatabase(t.db, { environment: {} });
      } catch (e) {
        return e as Error;
      }
    })();
    expect(error?.message).toContain('"Harrow Electric Ltd"');
    expect(error?.message).toContain("--force");
  });

  it("refuses when the environment says production, even on an empty file", () => {
    const t = fresh();
    expect(realDataReasons(t.db, { NODE_ENV: "production" })).toEqual(["NODE_ENV is production."]);
    expect(() => assertDemoDatabase(t.db, { environment: { NODE_ENV: "production" } })).toThrow(SeedRefusedError);
  });

  it("lets an empty database, or one holding only the demo firm and people added to it, be seeded", () => {
    const t = fresh();
    expect(realDataReasons(t.db, {})).toEqual([]);
    const demo = t.db.insert(organisations).values(DEMO_ORG).returning().get();
    makeUser(t.db, demo.id, ["designer"]);
    expect(() => assertDemoDatabase(t.db, { environment: {} })).not.toThrow();
  });

  it("goes on when forced", () => {
    const t = fresh();
    makeOrg(t.db, "Harrow Electric Ltd");
    expect(() => assertDemoDatabase(t.db, { force: true, environment: { NODE_ENV: "production" } })).not.toThrow();
  });
});
