import { index, sqliteTable, text } from "drizzle-orm/sqlite-core";
import type { TemplateDesign } from "../../lib/schemas/project-template";
import { createdAt, id, updatedAt, version } from "./columns";
import { organisations } from "./organisations";
import { users } from "./users";

/**
 * A starting design the firm reuses: equipment, arrays, circuits and loads
 * with their topology, without a site. A new project from it needs only the
 * site and what differs.
 */
export const projectTemplates = sqliteTable(
  "project_templates",
  {
    id: id(),
    orgId: text("org_id")
      .notNull()
      .references(() => organisations.id),
    name: text("name").notNull(),
    description: text("description").notNull().default(""),
    systemKind: text("system_kind", { enum: ["stand-alone", "stand-alone-generator", "hybrid"] }).notNull(),
    design: text("design", { mode: "json" }).$type<TemplateDesign>().notNull(),
    createdBy: text("created_by").references(() => users.id),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
    version: version(),
  },
  (t) => [index("project_templates_org_idx").on(t.orgId, t.name)],
);
export type ProjectTemplate = typeof projectTemplates.$inferSelect;
