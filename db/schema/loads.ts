import { integer, real, sqliteTable, text } from "drizzle-orm/sqlite-core";
import { id } from "./columns";
import { projects } from "./projects";

export const loads = sqliteTable("loads", {
  id: id(),
  projectId: text("project_id")
    .notNull()
    .references(() => projects.id, { onDelete: "cascade" }),
  name: text("name").notNull(),
  watts: real("watts").notNull(),
  quantity: integer("quantity").notNull().default(1),
  hoursPerDay: real("hours_per_day").notNull(),
  surgeW: real("surge_w"),
  voltageV: integer("voltage_v").notNull().default(120),
  simultaneous: integer("simultaneous", { mode: "boolean" }).notNull().default(true),
  position: integer("position").notNull().default(0),
});
export type LoadRow = typeof loads.$inferSelect;
