import { index, pgEnum, pgTable, text, uuid, varchar } from "drizzle-orm/pg-core";
import { syncedColumns } from "./columns";
import { placements } from "./placements";
import { syncedConstraints } from "./synced";
import { CHECKLIST_ANSWERS, CHECKLIST_KINDS } from "./enums";

export const checklistKind = pgEnum("checklist_kind", CHECKLIST_KINDS);
export const checklistAnswer = pgEnum("checklist_answer", CHECKLIST_ANSWERS);

export const checklists = pgTable(
  "checklists",
  {
    ...syncedColumns(),
    placementId: uuid("placement_id")
      .notNull()
      .references(() => placements.id),
    kind: checklistKind("kind").notNull(),
  },
  (t) => [...syncedConstraints("checklists", t), index("checklists_placement_idx").on(t.placementId)],
);

/** One answer per row, so two people ticking different items never conflict. */
export const checklistItems = pgTable(
  "checklist_items",
  {
    ...syncedColumns(),
    checklistId: uuid("checklist_id")
      .notNull()
      .references(() => checklists.id),
    itemKey: varchar("item_key", { length: 60 }).notNull(),
    label: varchar("label", { length: 200 }).notNull(),
    answer: checklistAnswer("answer"),
    note: text("note"),
  },
  (t) => [...syncedConstraints("checklist_items", t), index("checklist_items_checklist_idx").on(t.checklistId)],
);
