import { doublePrecision, index, integer, pgEnum, pgTable, text, uuid, varchar } from "drizzle-orm/pg-core";
import { instantColumn, syncedColumns } from "./columns";
import { placements } from "./placements";
import { syncedConstraints } from "./synced";
import { DELIVERY_STATUSES } from "./enums";

export const deliveryStatus = pgEnum("delivery_status", DELIVERY_STATUSES);

/** A truck ticket, with what happened to the load at the site (ASTM C94 times and water). */
export const deliveries = pgTable(
  "deliveries",
  {
    ...syncedColumns(),
    placementId: uuid("placement_id")
      .notNull()
      .references(() => placements.id),
    ticketNumber: varchar("ticket_number", { length: 40 }).notNull(),
    truck: varchar("truck", { length: 40 }).notNull().default(""),
    volumeM3: doublePrecision("volume_m3").notNull(),
    /** The mix code printed on the ticket, checked against the placement's mix (lib/checks). */
    mixCode: varchar("mix_code", { length: 40 }),
    batchedAt: instantColumn("batched_at").notNull(),
    arrivedAt: instantColumn("arrived_at").notNull(),
    dischargeStartedAt: instantColumn("discharge_started_at"),
    dischargeFinishedAt: instantColumn("discharge_finished_at"),
    revolutions: integer("revolutions"),
    waterAddedL: doublePrecision("water_added_l"),
    waterFirstAt: instantColumn("water_first_at"),
    waterLastAt: instantColumn("water_last_at"),
    waterAddedBy: varchar("water_added_by", { length: 120 }),
    waterAuthorisedBy: varchar("water_authorised_by", { length: 120 }),
    admixtureNote: text("admixture_note"),
    status: deliveryStatus("status").notNull().default("accepted"),
    rejectReason: text("reject_reason"),
    /** Why a truck went onto a placement that was not cleared or being placed (kept with the record and its audit entry). */
    notClearedReason: text("not_cleared_reason"),
  },
  (t) => [...syncedConstraints("deliveries", t), index("deliveries_placement_idx").on(t.placementId)],
);
