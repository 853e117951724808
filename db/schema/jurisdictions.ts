import { index, integer, real, sqliteTable, text } from "drizzle-orm/sqlite-core";
import { SUBMISSION_METHODS } from "../../lib/schemas/submission";
import { createdAt, id, updatedAt, version } from "./columns";
import { organisations } from "./organisations";

export interface LabelRules {
  material?: string;
  reflective?: boolean;
  minLetterHeightIn?: number;
  colours?: string;
}

export interface JurisdictionContact {
  name?: string;
  email?: string;
  phone?: string;
  portalUrl?: string;
  address?: string;
}

export const jurisdictions = sqliteTable(
  "jurisdictions",
  {
    id: id(),
    orgId: text("org_id")
      .notNull()
      .references(() => organisations.id),
    name: text("name").notNull(),
    region: text("region").notNull().default(""),
    necEdition: text("nec_edition", { enum: ["2017", "2020", "2023"] }).notNull(),
    residentialCode: text("residential_code", { enum: ["IRC-2018", "IRC-2021", "IRC-2024", "none"] })
      .notNull()
      .default("none"),
    amendments: text("amendments").notNull().default(""),
    voltageDropLimitPct: real("voltage_drop_limit_pct"),
    storageAggregateLimitKWh: real("storage_aggregate_limit_kwh"),
    labelRules: text("label_rules", { mode: "json" }).$type<LabelRules>().notNull().default({}),
    submissionMethod: text("submission_method", { enum: SUBMISSION_METHODS })
      .notNull()
      .default("portal"),
    contact: text("contact", { mode: "json" }).$type<JurisdictionContact>().notNull().default({}),
    typicalReviewDays: integer("typical_review_days"),
    feeNotes: text("fee_notes").notNull().default(""),
    requiredDocuments: text("required_documents", { mode: "json" })
      .$type<string[]>()
      .notNull()
      .default(["equipment-datasheets", "storage-listing", "site-plan"]),
    /** Sheet name → Handlebars source replacing the default template for this jurisdiction. */
    templateOverrides: text("template_overrides", { mode: "json" })
      .$type<Record<string, string>>()
      .notNull()
      .default({}),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
    version: version(),
  },
  (t) => [index("jurisdictions_org_idx").on(t.orgId)],
);
export type Jurisdiction = typeof jurisdictions.$inferSelect;
export type NewJurisdiction = typeof jurisdictions.$inferInsert;
