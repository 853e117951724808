import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import bcrypt from "bcryptjs";
import { migrateDatabase, openDatabase, type Db } from "../../db/client";
import { jurisdictions, organisations, projects, userRoles, users } from "../../db/schema";
import type { Role } from "../../lib/auth/roles";
import { contextForUser, type ServiceContext } from "../../lib/services/context";
import { ServiceError } from "../../lib/services/errors";

/** The code of the ServiceError a call throws, or undefined when it does not throw. */
export function codeOf(fn: () => unknown): string | undefined {
  try {
    fn();
  } catch (error) {
    if (error instanceof ServiceError) return error.code;
    throw error;
  }
  return undefined;
}

/** A fresh SQLite file migrated from drizzle/, removed when the test file ends. */
export function tempDatabase(): { db: Db; file: string; cleanup: () => void } {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), "sundocket-test-"));
  const file = path.join(dir, "test.db");
  const db = openDatabase(file);
  migrateDatabase(db);
  return {
    db,
    file,
    cleanup: () => {
      db.$client.close();
      fs.rmSync(dir, { recursive: true, force: true });
    },
  };
}

let counter = 0;
const unique = (prefix: string) => `${prefix}-${++counter}-${Math.random().toString(36).slice(2, 8)}`;

// Cost 4 keeps the suite fast; production hashes use cost 10.
const FAST_HASH_COST = 4;

export function makeOrg(db: Db, name = unique("Org")) {
  return db.insert(organisations).values({ name, slug: unique("org") }).returning().get();
}

export function makeUser(db: Db, orgId: string, roles: Role[], opts: { password?: string; active?: boolean; email?: string } = {}) {
  const user = db
    .insert(users)
    .values({
      orgId,
      email: opts.email ?? `${unique("user")}@example.test`,
      name: unique("Person"),
      passwordHash: bcrypt.hashSync(opts.password ?? "correct horse battery", FAST_HASH_COST),
      active: opts.active ?? true,
    })
    .returning()
    .get();
  if (roles.length) db.insert(userRoles).values(roles.map((role) => ({ userId: user.id, role }))).run();
  return user;
}

export function makeContext(db: Db, orgId: string, roles: Role[]): ServiceContext {
  return contextForUser(db, makeUser(db, orgId, roles).id);
}

/** Jurisdictions are in Westmark unless told otherwise, the region the test reviewers' licences are issued in. */
export function makeJurisdiction(db: Db, orgId: string, necEdition: "2017" | "2020" | "2023" = "2023", opts: { region?: string } = {}) {
  return db
    .insert(jurisdictions)
    .values({ orgId, name: unique("Jurisdiction"), necEdition, region: opts.region ?? "Westmark" })
    .returning()
    .get();
}

export function makeProject(db: Db, orgId: string, jurisdictionId: string | null = null) {
  return db
    .insert(projects)
    .values({ orgId, jurisdictionId, name: unique("Project"), systemKind: "stand-alone", occupancy: "other-building", mounting: "ground" })
    .returning()
    .get();
}
