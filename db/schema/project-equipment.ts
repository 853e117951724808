import { index, integer, sqliteTable, text, uniqueIndex } from "drizzle-orm/sqlite-core";
import { id } from "./columns";
import { equipmentLibrary } from "./equipment-library";
import { projects } from "./projects";

/**
 * An instance of equipment in a project (CC-1, INV-1 …). `data` is the whole
 * equipment object of the project record, ratings included, so a later edit
 * of the library item does not silently change a design already checked.
 */
export const projectEquipment = sqliteTable(
  "project_equipment",
  {
    id: id(),
    projectId: text("project_id")
      .notNull()
      .references(() => projects.id, { onDelete: "cascade" }),
    libraryItemId: text("library_item_id").references(() => equipmentLibrary.id),
    tag: text("tag").notNull(),
    kind: text("kind").notNull(),
    quantity: integer("quantity").notNull().default(1),
    position: integer("position").notNull().default(0),
    data: text("data", { mode: "json" }).$type<Record<string, unknown>>().notNull(),
  },
  (t) => [uniqueIndex("project_equipment_tag_idx").on(t.projectId, t.tag), index("project_equipment_project_idx").on(t.projectId)],
);
export type ProjectEquipmentRow = typeof projectEquipment.$inferSelect;
