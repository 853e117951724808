import { sqliteTable, text } from "drizzle-orm/sqlite-core";
import { createdAt, id } from "./columns";

export const organisations = sqliteTable("organisations", {
  id: id(),
  name: text("name").notNull(),
  slug: text("slug").notNull().unique(),
  createdAt: createdAt(),
});
export type Organisation = typeof organisations.$inferSelect;
