import { index, sqliteTable, text } from "drizzle-orm/sqlite-core";
import { createdAt, id, updatedAt, version } from "./columns";
import { organisations } from "./organisations";

/**
 * The organisation's reusable equipment. `ratings` holds the kind-specific
 * electrical ratings exactly as the project record's equipment schema has
 * them (validated with that schema), so a library item drops into a project.
 */
export const equipmentLibrary = sqliteTable(
  "equipment_library",
  {
    id: id(),
    orgId: text("org_id")
      .notNull()
      .references(() => organisations.id),
    kind: text("kind").notNull(),
    manufacturer: text("manufacturer").notNull().default(""),
    model: text("model").notNull().default(""),
    ratings: text("ratings", { mode: "json" }).$type<Record<string, unknown>>().notNull().default({}),
    datasheetAttachmentId: text("datasheet_attachment_id"),
    retiredAt: text("retired_at"),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
    version: version(),
  },
  (t) => [index("equipment_library_org_idx").on(t.orgId, t.kind)],
);
export type EquipmentLibraryItem = typeof equipmentLibrary.$inferSelect;
export type NewEquipmentLibraryItem = typeof equipmentLibrary.$inferInsert;
