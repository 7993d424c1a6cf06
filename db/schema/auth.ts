import { sql } from "drizzle-orm";
import {
  bigint,
  boolean,
  doublePrecision,
  index,
  integer,
  pgEnum,
  pgTable,
  primaryKey,
  text,
  timestamp,
  uniqueIndex,
  uuid,
  varchar,
} from "drizzle-orm/pg-core";
import { createdAtColumn, idColumn, updatedAtColumn } from "./columns";

export const projectRole = pgEnum("project_role", ["superintendent", "inspector", "office", "owner"]);
export const unitSystem = pgEnum("unit_system", ["SI", "IP"]);
export const maturityMethod = pgEnum("maturity_method", ["nurse-saul", "equivalent-age"]);
export const coldWeatherDefinition = pgEnum("cold_weather_definition", [
  "aci306r-current",
  "aci306-1990",
]);

export const users = pgTable(
  "users",
  {
    id: idColumn(),
    email: varchar("email", { length: 320 }).notNull(),
    name: varchar("name", { length: 120 }).notNull(),
    /** argon2id hash; null until the invited user sets a password. */
    passwordHash: text("password_hash"),
    isAdmin: boolean("is_admin").notNull().default(false),
    disabledAt: timestamp("disabled_at", { withTimezone: true, mode: "date" }),
    /** Bumped to end every session at once (sign out everywhere, disable, password change). */
    sessionVersion: integer("session_version").notNull().default(0),
    createdAt: createdAtColumn(),
    updatedAt: updatedAtColumn(),
  },
  (t) => [uniqueIndex("users_email_lower_idx").on(sql`lower(${t.email})`)],
);

export const projects = pgTable("projects", {
  id: idColumn(),
  name: varchar("name", { length: 160 }).notNull(),
  code: varchar("code", { length: 32 }).notNull().unique(),
  siteAddress: text("site_address").notNull().default(""),
  timeZone: varchar("time_zone", { length: 64 }).notNull().default("UTC"),
  unitSystem: unitSystem("unit_system").notNull().default("SI"),
  /** Project specification overrides of the default limits (null = use the published default). */
  evaporationHighKgM2H: doublePrecision("evaporation_high_kg_m2_h"),
  maxConcreteTempC: doublePrecision("max_concrete_temp_c").notNull().default(35),
  dischargeLimitMinutes: integer("discharge_limit_minutes").notNull().default(90),
  revolutionLimit: integer("revolution_limit"),
  coldWeatherDefinition: coldWeatherDefinition("cold_weather_definition")
    .notNull()
    .default("aci306r-current"),
  /** Edition of the standards the project specification cites, e.g. "ACI 318-19". */
  specEditions: text("spec_editions").notNull().default(""),
  digestHour: integer("digest_hour").notNull().default(18),
  /** Maturity method settings (ASTM C1074 defaults: Nurse-Saul, T0 = 0 °C, E = 41.57 kJ/mol ↔ Q = 5000 K). */
  maturityMethod: maturityMethod("maturity_method").notNull().default("nurse-saul"),
  maturityDatumC: doublePrecision("maturity_datum_c").notNull().default(0),
  maturityActivationEnergyJPerMol: doublePrecision("maturity_activation_energy_j_per_mol").notNull().default(41_570),
  /** The strength the project asks for before stripping or stressing, when the specification sets one. */
  maturityTargetMPa: doublePrecision("maturity_target_mpa"),
  createdAt: createdAtColumn(),
  updatedAt: updatedAtColumn(),
});

export const memberships = pgTable(
  "memberships",
  {
    userId: uuid("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    projectId: uuid("project_id")
      .notNull()
      .references(() => projects.id, { onDelete: "cascade" }),
    role: projectRole("role").notNull(),
    createdAt: createdAtColumn(),
  },
  (t) => [primaryKey({ columns: [t.userId, t.projectId] }), index("memberships_project_idx").on(t.projectId)],
);

export const invitations = pgTable(
  "invitations",
  {
    id: idColumn(),
    email: varchar("email", { length: 320 }).notNull(),
    name: varchar("name", { length: 120 }).notNull(),
    /** SHA-256 of the token sent by e-mail; the token itself is never stored. */
    tokenHash: varchar("token_hash", { length: 64 }).notNull().unique(),
    projectId: uuid("project_id").references(() => projects.id, { onDelete: "cascade" }),
    role: projectRole("role"),
    invitedBy: uuid("invited_by").references(() => users.id),
    expiresAt: timestamp("expires_at", { withTimezone: true, mode: "date" }).notNull(),
    acceptedAt: timestamp("accepted_at", { withTimezone: true, mode: "date" }),
    createdAt: createdAtColumn(),
  },
  (t) => [index("invitations_email_idx").on(sql`lower(${t.email})`)],
);

/** One-time sign-in links: hashed at rest, single use, short-lived. */
export const signInTokens = pgTable("sign_in_tokens", {
  tokenHash: varchar("token_hash", { length: 64 }).primaryKey(),
  userId: uuid("user_id")
    .notNull()
    .references(() => users.id, { onDelete: "cascade" }),
  expiresAt: timestamp("expires_at", { withTimezone: true, mode: "date" }).notNull(),
  usedAt: timestamp("used_at", { withTimezone: true, mode: "date" }),
  createdAt: createdAtColumn(),
});

/** Storage of rate-limiter-flexible's RateLimiterPostgres (its own column layout). */
export const rateLimits = pgTable("rate_limits", {
  key: varchar("key", { length: 255 }).primaryKey(),
  points: integer("points").notNull().default(0),
  expire: bigint("expire", { mode: "number" }),
});
