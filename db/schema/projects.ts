import { index, integer, real, sqliteTable, text } from "drizzle-orm/sqlite-core";
import { createdAt, id, updatedAt, version } from "./columns";
import { jurisdictions } from "./jurisdictions";
import { organisations } from "./organisations";
import { users } from "./users";
import { PROJECT_STATUSES } from "../../lib/schemas/project-status";

export { PROJECT_STATUSES, type ProjectStatus } from "../../lib/schemas/project-status";

/** A project and its site. Site columns mirror `siteSchema` of the project record. */
export const projects = sqliteTable(
  "projects",
  {
    id: id(),
    orgId: text("org_id")
      .notNull()
      .references(() => organisations.id),
    jurisdictionId: text("jurisdiction_id").references(() => jurisdictions.id),
    name: text("name").notNull(),
    client: text("client").notNull().default(""),
    status: text("status", { enum: PROJECT_STATUSES }).notNull().default("design"),
    systemKind: text("system_kind", { enum: ["stand-alone", "stand-alone-generator", "hybrid"] }).notNull(),
    address: text("address").notNull().default(""),
    occupancy: text("occupancy", { enum: ["one-two-family-dwelling", "other-building"] })
      .notNull()
      .default("one-two-family-dwelling"),
    mounting: text("mounting", { enum: ["ground", "roof"] }).notNull().default("ground"),
    roofClearanceIn: real("roof_clearance_in"),
    designLowTempC: real("design_low_temp_c"),
    designLowTempSource: text("design_low_temp_source").notNull().default(""),
    designHighTempC: real("design_high_temp_c"),
    designHighTempSource: text("design_high_temp_source").notNull().default(""),
    sunHoursPerDay: real("sun_hours_per_day"),
    batteryLocation: text("battery_location"),
    batteryLocationNote: text("battery_location_note").notNull().default(""),
    batterySpacingIn: real("battery_spacing_in"),
    hasSmokeOrHeatDetection: integer("has_smoke_or_heat_detection", { mode: "boolean" }),
    hasVehicleImpactProtection: integer("has_vehicle_impact_protection", { mode: "boolean" }),
    daysOfAutonomy: real("days_of_autonomy"),
    rapidShutdownMethod: text("rapid_shutdown_method"),
    /** Record fields not held in columns (new engine fields), kept whole rather than dropped. */
    /** Set when the project is put away; archived projects leave the default list and can be brought back. */
    archivedAt: text("archived_at"),
    extra: text("extra", { mode: "json" }).$type<Record<string, unknown>>().notNull().default({}),
    createdBy: text("created_by").references(() => users.id),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
    version: version(),
  },
  (t) => [
    index("projects_org_idx").on(t.orgId, t.status),
    // The projects list pages by (updated_at, id) newest first; this index serves each page without sorting the organisation.
    index("projects_org_updated_idx").on(t.orgId, t.updatedAt, t.id),
    // Sorted by name, the list pages by (name, id) A to Z.
    index("projects_org_name_idx").on(t.orgId, t.name, t.id),
  ],
);
export type Project = typeof projects.$inferSelect;
export type NewProject = typeof projects.$inferInsert;
