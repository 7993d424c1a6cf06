import { sql } from "drizzle-orm";
import { date, doublePrecision, foreignKey, index, integer, pgTable, text, uniqueIndex, uuid, varchar } from "drizzle-orm/pg-core";
import { users } from "./auth";
import { instantColumn, syncedColumns } from "./columns";
import { syncedConstraints } from "./synced";

/** The superintendent's daily diary: one per project and calendar date (in the project's time zone). */
export const diaryEntries = pgTable(
  "diary_entries",
  {
    ...syncedColumns(),
    date: date("date", { mode: "string" }).notNull(),
    weatherSummary: text("weather_summary").notNull().default(""),
    workDone: text("work_done").notNull().default(""),
    safetyNotes: text("safety_notes").notNull().default(""),
    submittedAt: instantColumn("submitted_at"),
    submittedBy: uuid("submitted_by"),
  },
  (t) => [
    ...syncedConstraints("diary_entries", t),
    uniqueIndex("diary_entries_project_date_idx").on(t.projectId, t.date).where(sql`${t.deletedAt} is null`),
    foreignKey({ name: "diary_entries_submitted_by_fk", columns: [t.submittedBy], foreignColumns: [users.id] }),
  ],
);

const diaryEntryId = () =>
  uuid("diary_entry_id")
    .notNull()
    .references(() => diaryEntries.id);

export const diaryCrew = pgTable(
  "diary_crew",
  {
    ...syncedColumns(),
    diaryEntryId: diaryEntryId(),
    trade: varchar("trade", { length: 80 }).notNull(),
    count: integer("count").notNull(),
  },
  (t) => [...syncedConstraints("diary_crew", t), index("diary_crew_entry_idx").on(t.diaryEntryId)],
);

export const diaryEquipment = pgTable(
  "diary_equipment",
  {
    ...syncedColumns(),
    diaryEntryId: diaryEntryId(),
    name: varchar("name", { length: 80 }).notNull(),
    count: integer("count"),
    hours: doublePrecision("hours"),
  },
  (t) => [...syncedConstraints("diary_equipment", t), index("diary_equipment_entry_idx").on(t.diaryEntryId)],
);

export const diaryDelays = pgTable(
  "diary_delays",
  {
    ...syncedColumns(),
    diaryEntryId: diaryEntryId(),
    cause: varchar("cause", { length: 80 }).notNull(),
    minutes: integer("minutes").notNull(),
    description: text("description").notNull().default(""),
  },
  (t) => [...syncedConstraints("diary_delays", t), index("diary_delays_entry_idx").on(t.diaryEntryId)],
);

export const diaryVisitors = pgTable(
  "diary_visitors",
  {
    ...syncedColumns(),
    diaryEntryId: diaryEntryId(),
    name: varchar("name", { length: 120 }).notNull(),
    company: varchar("company", { length: 120 }).notNull().default(""),
    purpose: varchar("purpose", { length: 300 }).notNull().default(""),
  },
  (t) => [...syncedConstraints("diary_visitors", t), index("diary_visitors_entry_idx").on(t.diaryEntryId)],
);
