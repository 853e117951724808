/**
 * Loads the demo scenario (db/demo-scenario.ts and examples/*.json) into the
 * database at DATABASE_PATH. Idempotent: what exists already is left alone,
 * so running it twice gives the same database.
 */
import fs from "node:fs";
import path from "node:path";
import bcrypt from "bcryptjs";
import { and, eq } from "drizzle-orm";
import { env, resolvePath } from "../lib/env";
import { projectRecordSchema } from "../lib/schemas/project-record";
import { contextForUser } from "../lib/services/context";
import { createProject } from "../lib/services/projects/create";
import { getProjectRecord } from "../lib/services/projects/get-record";
import { saveProjectRecord } from "../lib/services/projects/save-record";
import { seedDemoRevisions } from "./seed-revisions";
import { seedScale } from "./seed-scale";
import { makeDemoDocument } from "./demo-documents";
import { demoStampPng } from "./demo-stamp";
import { uploadStampImage } from "../lib/services/reviews/stamp";
import { uploadAttachment } from "../lib/services/attachments/upload";
import { migrateDatabase, openDatabase, type Db } from "./client";
import { assertDemoDatabase, SeedRefusedError } from "./seed-guard";
import { DEMO_JURISDICTIONS, DEMO_LICENCE, DEMO_ORG, DEMO_PROJECT_FILES, DEMO_USERS } from "./demo-scenario";
import { equipmentLibrary, jurisdictions, organisations, projects, projectTemplates, reviewerLicences, userRoles, users } from "./schema";
import { importLibraryCsv } from "../lib/services/library/import-csv";
import { createTemplate } from "../lib/services/templates/save";
import { demoTemplates } from "./demo-templates";

/** Refuses (SeedRefusedError) a database that holds a real firm's data, unless `force`. */
export async function seed(db: Db, options: { force?: boolean; environment?: { NODE_ENV?: string } } = {}): Promise<void> {
  assertDemoDatabase(db, options);
  let org = db.select().from(organisations).where(eq(organisations.slug, DEMO_ORG.slug)).get();
  if (!org) org = db.insert(organisations).values(DEMO_ORG).returning().get();
  const orgId = org.id;

  for (const person of DEMO_USERS) {
    const existing = db.select().from(users).where(eq(users.email, person.email)).get();
    if (existing) continue;
    const user = db
      .insert(users)
      .values({ orgId, name: person.name, email: person.email, passwordHash: await bcrypt.hash(person.password, 10) })
      .returning()
      .get();
    db.insert(userRoles).values(person.roles.map((role) => ({ userId: user.id, role }))).run();
  }

  const reviewer = db.select().from(users).where(eq(users.email, DEMO_LICENCE.email)).get()!;
  if (!db.select().from(reviewerLicences).where(eq(reviewerLicences.userId, reviewer.id)).get()) {
    const { email: _email, ...licence } = DEMO_LICENCE;
    db.insert(reviewerLicences).values({ ...licence, orgId, userId: reviewer.id }).run();
  }

  const licence = db.select().from(reviewerLicences).where(eq(reviewerLicences.userId, reviewer.id)).get();
  if (licence && !licence.stampAttachmentId) {
    await uploadStampImage(contextForUser(db, reviewer.id), { fileName: "ines-marchetti-stamp.png", bytes: demoStampPng() });
  }

  for (const j of DEMO_JURISDICTIONS) {
    const exists = db
      .select({ id: jurisdictions.id })
      .from(jurisdictions)
      .where(and(eq(jurisdictions.orgId, orgId), eq(jurisdictions.name, j.name)))
      .get();
    if (!exists) db.insert(jurisdictions).values({ ...j, orgId }).run();
  }

  const designer = db.select().from(users).where(eq(users.email, DEMO_USERS[0]!.email)).get()!;
  const designerCtx = contextForUser(db, designer.id);
  for (const demo of DEMO_PROJECT_FILES) {
    const file = path.resolve(process.cwd(), demo.file);
    const record = projectRecordSchema.parse(JSON.parse(fs.readFileSync(file, "utf8")));
    const exists = db
      .select({ id: projects.id })
      .from(projects)
      .where(and(eq(projects.orgId, orgId), eq(projects.name, record.name)))
      .get();
    if (exists) continue;
    const jurisdiction = db
      .select()
      .from(jurisdictions)
      .where(and(eq(jurisdictions.orgId, orgId), eq(jurisdictions.name, record.jurisdiction.name)))
      .get();
    if (!jurisdiction) throw new Error(`${demo.file}: no demo jurisdiction named ${record.jurisdiction.name}`);
    const { id } = createProject(designerCtx, {
      name: record.name,
      client: record.client,
      systemKind: record.systemKind,
      jurisdictionId: jurisdiction.id,
      address: record.site.address,
    });
    saveProjectRecord(designerCtx, id, record, getProjectRecord(designerCtx, id).version);
    // The farmhouse is still in design: its documents are not uploaded yet, as the preflight will say.
    const documents = demo.status === "design" ? [] : record.attachments;
    for (const ref of documents) {
      await uploadAttachment(designerCtx, {
        projectId: id,
        kind: ref.kind,
        equipmentTag: ref.equipmentTag,
        fileName: ref.fileName || `${ref.kind}.pdf`,
        bytes: await makeDemoDocument(record, ref),
      });
    }
  }

  // The firm's equipment library, holding the same makes and models as the demo projects.
  const hasLibrary = db.select({ id: equipmentLibrary.id }).from(equipmentLibrary).where(eq(equipmentLibrary.orgId, orgId)).get();
  if (!hasLibrary) {
    const report = importLibraryCsv(designerCtx, fs.readFileSync(path.resolve(process.cwd(), "examples/equipment-library.csv"), "utf8"));
    if (report.refused.length) throw new Error(`examples/equipment-library.csv: ${report.refused.length} rows refused`);
  }

  // The firm's standard kits, so a new project starts from one.
  const hasTemplates = db.select({ id: projectTemplates.id }).from(projectTemplates).where(eq(projectTemplates.orgId, orgId)).get();
  if (!hasTemplates) for (const template of demoTemplates()) createTemplate(designerCtx, template);

  await seedDemoRevisions(db, orgId);
}

async function main() {
  const file = resolvePath(env().DATABASE_PATH);
  const db = openDatabase(file);
  migrateDatabase(db);
  try {
    await seed(db, { force: process.argv.includes("--force") });
  } catch (error) {
    db.$client.close();
    throw error;
  }
  // --scale: grow the demo organisation to 10,000 projects for the load and query-plan benchmarks.
  if (process.argv.includes("--scale")) {
    const scaled = seedScale(db);
    console.log(`Scaled the demo organisation to ${scaled.projects} projects`);
  }
  db.$client.close();
  console.log(`Seeded the demo into ${file}\n`);
  console.log("Demo sign-ins (organisation: " + DEMO_ORG.name + "):");
  for (const u of DEMO_USERS) console.log(`  ${u.roles.join(", ").padEnd(10)} ${u.email.padEnd(30)} ${u.password}`);
}

if (process.argv[1] && path.resolve(process.argv[1]).endsWith(path.join("db", "seed.ts"))) {
  main().catch((error) => {
    console.error(error instanceof SeedRefusedError ? error.message : error);
    process.exitCode = 1;
  });
}
