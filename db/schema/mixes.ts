import { sql } from "drizzle-orm";
import { boolean, doublePrecision, integer, pgEnum, pgTable, text, uniqueIndex, varchar } from "drizzle-orm/pg-core";
import { syncedColumns } from "./columns";
import { syncedConstraints } from "./synced";
import { SLUMP_TYPES } from "./enums";

/** ASTM C94: a slump is ordered either as a target (± tolerance) or as a "not to exceed" maximum. */
export const slumpType = pgEnum("slump_type", SLUMP_TYPES);

export const mixDesigns = pgTable(
  "mix_designs",
  {
    ...syncedColumns(),
    code: varchar("code", { length: 32 }).notNull(),
    supplier: varchar("supplier", { length: 120 }).notNull().default(""),
    fcMPa: doublePrecision("fc_mpa").notNull(),
    fcAgeDays: integer("fc_age_days").notNull().default(28),
    maxWcm: doublePrecision("max_wcm"),
    slumpTargetMm: doublePrecision("slump_target_mm"),
    slumpType: slumpType("slump_type").notNull().default("target"),
    /** Null: the ASTM C94 default tolerance for the target applies. */
    slumpToleranceMm: doublePrecision("slump_tolerance_mm"),
    airTargetPct: doublePrecision("air_target_pct"),
    /** Null: the ASTM C94 default (±1.5 percentage points) applies. */
    airTolerancePct: doublePrecision("air_tolerance_pct"),
    maxConcreteTempC: doublePrecision("max_concrete_temp_c"),
    cementType: varchar("cement_type", { length: 60 }).notNull().default(""),
    scms: text("scms").notNull().default(""),
    siteWaterAllowedLPerM3: doublePrecision("site_water_allowed_l_per_m3").notNull().default(0),
    /** Silica fume or low w/cm: plastic-shrinkage risk starts at about half the evaporation rate. */
    lowBleed: boolean("low_bleed").notNull().default(false),
  },
  (t) => [
    ...syncedConstraints("mix_designs", t),
    uniqueIndex("mix_designs_project_code_idx").on(t.projectId, t.code).where(sql`${t.deletedAt} is null`),
  ],
);
