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
  /** Share of its hours a cycling load draws its power, %; null is 100 %. */
  dutyPct: real("duty_pct"),
  /** Days a week it runs; null is every day. */
  daysPerWeek: integer("days_per_week"),
  surgeW: real("surge_w"),
  voltageV: integer("voltage_v").notNull().default(120),
  simultaneous: integer("simultaneous", { mode: "boolean" }).notNull().default(true),
  position: integer("position").notNull().default(0),
});
export type LoadRow = typeof loads.$inferSelect;
