import { integer, sqliteTable, text, uniqueIndex } from "drizzle-orm/sqlite-core";
import { id } from "./columns";
import { projects } from "./projects";

/**
 * A circuit of a project. Identity, ends and kind are columns (for schedules
 * and queries); the conductor and conditions of use are the circuit object of
 * the project record in `data`, validated by its schema on every write.
 */
export const circuits = sqliteTable(
  "circuits",
  {
    id: id(),
    projectId: text("project_id")
      .notNull()
      .references(() => projects.id, { onDelete: "cascade" }),
    tag: text("tag").notNull(),
    fromTag: text("from_tag").notNull(),
    toTag: text("to_tag").notNull(),
    kind: text("kind").notNull(),
    position: integer("position").notNull().default(0),
    data: text("data", { mode: "json" }).$type<Record<string, unknown>>().notNull(),
  },
  (t) => [uniqueIndex("circuits_tag_idx").on(t.projectId, t.tag)],
);
export type CircuitRow = typeof circuits.$inferSelect;
