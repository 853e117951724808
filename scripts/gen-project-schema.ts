/**
 * npx tsx scripts/gen-project-schema.ts
 *
 * Writes schema/project-file.schema.json, the JSON Schema of Sundocket's
 * project file, from the zod schema that validates it (the shape a user writes:
 * defaults may be left out). A unit test keeps the committed file current.
 * Cross-references between tags are checked by Sundocket on import and are
 * not expressible in the JSON Schema.
 */
import { writeFileSync } from "node:fs";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { z } from "zod";
import { PROJECT_FILE_FORMAT, PROJECT_FILE_VERSION, projectRecordSchema } from "../lib/schemas/project-record";

export const SCHEMA_PATH = "schema/project-file.schema.json";

export function projectFileJsonSchema(): Record<string, unknown> {
  const generated = z.toJSONSchema(projectRecordSchema, { io: "input", target: "draft-2020-12" }) as Record<string, unknown>;
  return {
    $schema: generated.$schema,
    $id: `https://sundocket.example/schema/project-file-v${PROJECT_FILE_VERSION}.json`,
    title: "Sundocket project file",
    description: `A solar + battery design record (format "${PROJECT_FILE_FORMAT}", version ${PROJECT_FILE_VERSION}). Units are in the field names. Tag references (circuit ends, array feeds, overcurrent devices) are checked on import.`,
    ...Object.fromEntries(Object.entries(generated).filter(([k]) => k !== "$schema")),
  };
}

export function projectFileJsonSchemaText(): string {
  return JSON.stringify(projectFileJsonSchema(), null, 2) + "\n";
}

const invokedDirectly = process.argv[1] !== undefined && path.resolve(process.argv[1]) === fileURLToPath(import.meta.url);
if (invokedDirectly) {
  writeFileSync(SCHEMA_PATH, projectFileJsonSchemaText());
  process.stdout.write(`wrote ${SCHEMA_PATH}\n`);
}
