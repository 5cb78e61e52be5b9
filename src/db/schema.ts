import { pgTable, text, timestamp, uuid } from "drizzle-orm/pg-core";

// Tables ----------------------------------------------------------------------------------------------------

/** A team. Every row of every later table hangs off a workspace. */
export const workspaces = pgTable("workspaces", {
  id: uuid().primaryKey().defaultRandom(),
  name: text().notNull(),
  slug: text().notNull().unique(),
  createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
});

// Types -----------------------------------------------------------------------------------------------------

export type Workspace = typeof workspaces.$inferSelect;
export type NewWorkspace = typeof workspaces.$inferInsert;
