/**
 * The demo seed adds accounts whose passwords are printed in the README. On a
 * database that already serves a real firm those accounts would be a way in,
 * so the seed refuses unless the operator asks for it by name.
 */
import { ne } from "drizzle-orm";
import type { Db } from "./client";
import { DEMO_ORG } from "./demo-scenario";
import { organisations } from "./schema";

export class SeedRefusedError extends Error {
  constructor(readonly reasons: string[]) {
    super(
      "The demo seed was not run: it would add demo accounts with published passwords.\n" +
        reasons.map((r) => `  - ${r}`).join("\n") +
        "\nSeed a fresh database (set DATABASE_PATH to a new file), or pass --force if this really is a demo database.",
    );
    this.name = "SeedRefusedError";
  }
}

/** Why this database is not a demo database; empty when the seed may run. */
export function realDataReasons(db: Db, environment: { NODE_ENV?: string } = process.env): string[] {
  const reasons: string[] = [];
  if (environment.NODE_ENV === "production") reasons.push("NODE_ENV is production.");
  const others = db.select({ name: organisations.name }).from(organisations).where(ne(organisations.slug, DEMO_ORG.slug)).all();
  if (others.length) {
    const names = others.slice(0, 3).map((o) => `"${o.name}"`).join(", ");
    reasons.push(`The database holds ${others.length} organisation${others.length === 1 ? "" : "s"} other than the demo firm (${names}${others.length > 3 ? ", …" : ""}).`);
  }
  return reasons;
}

export function assertDemoDatabase(db: Db, options: { force?: boolean; environment?: { NODE_ENV?: string } } = {}): void {
  if (options.force) return;
  const reasons = realDataReasons(db, options.environment);
  if (reasons.length) throw new SeedRefusedError(reasons);
}
