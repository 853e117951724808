import { sqliteTable, text } from "drizzle-orm/sqlite-core";
import { createdAt, id } from "./columns";

export const organisations = sqliteTable("organisations", {
  id: id(),
  name: text("name").notNull(),
  slug: text("slug").notNull().unique(),
  /** The contractor's licence and contact, printed in every sheet's title block. */
  licenceNumber: text("licence_number"),
  licenceClassification: text("licence_classification"),
  licenceState: text("licence_state"),
  phone: text("phone"),
  email: text("email"),
  address: text("address"),
  createdAt: createdAt(),
});
export type Organisation = typeof organisations.$inferSelect;
