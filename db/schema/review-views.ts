import { jsonb, pgEnum, pgTable, primaryKey, uuid } from "drizzle-orm/pg-core";
import { users } from "./auth";
import { updatedAtColumn } from "./columns";

export const reviewList = pgEnum("review_list", ["placements", "diaries"]);

/** A user's saved default view of an office review table (columns, sort, filters, page size). */
export const reviewViews = pgTable(
  "review_views",
  {
    userId: uuid("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    list: reviewList("list").notNull(),
    /** Validated by lib/review/views.ts (reviewViewSchema) on the way in and out. */
    settings: jsonb("settings").notNull(),
    updatedAt: updatedAtColumn(),
  },
  (t) => [primaryKey({ columns: [t.userId, t.list] })],
);
