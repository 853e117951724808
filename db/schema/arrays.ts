import { integer, sqliteTable, text, uniqueIndex } from "drizzle-orm/sqlite-core";
import { id } from "./columns";
import { projects } from "./projects";

export const pvArrays = sqliteTable(
  "pv_arrays",
  {
    id: id(),
    projectId: text("project_id")
      .notNull()
      .references(() => projects.id, { onDelete: "cascade" }),
    tag: text("tag").notNull(),
    moduleTag: text("module_tag").notNull(),
    modulesInSeries: integer("modules_in_series").notNull(),
    stringsInParallel: integer("strings_in_parallel").notNull(),
    feedsTag: text("feeds_tag").notNull(),
    mpptInputId: text("mppt_input_id"),
    position: integer("position").notNull().default(0),
  },
  (t) => [uniqueIndex("pv_arrays_tag_idx").on(t.projectId, t.tag)],
);
export type PvArrayRow = typeof pvArrays.$inferSelect;
