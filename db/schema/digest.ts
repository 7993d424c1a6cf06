import { sql } from "drizzle-orm";
import { boolean, check, date, integer, pgEnum, pgTable, text, uniqueIndex, uuid, varchar } from "drizzle-orm/pg-core";
import { projects, users } from "./auth";
import { createdAtColumn, idColumn, instantColumn, updatedAtColumn } from "./columns";

/** "member": an owner of the project (follows the membership); "added": an address the office added. */
export const digestRecipientSource = pgEnum("digest_recipient_source", ["member", "added"]);
/** "sending" is a claim taken before the SMTP call; it becomes "sent" once the server accepted the message. */
export const sentDigestStatus = pgEnum("sent_digest_status", ["sending", "sent"]);

/** Who receives a project's daily digest, with their own preferences. */
export const digestRecipients = pgTable(
  "digest_recipients",
  {
    id: idColumn(),
    projectId: uuid("project_id")
      .notNull()
      .references(() => projects.id, { onDelete: "cascade" }),
    /** Stored lower-case, so the unique key and the sent-digest key compare addresses exactly. */
    email: varchar("email", { length: 320 }).notNull(),
    userId: uuid("user_id").references(() => users.id, { onDelete: "cascade" }),
    source: digestRecipientSource("source").notNull(),
    /** Local hour (project time zone) for this recipient; null: the project's digest hour. */
    hourOverride: integer("hour_override"),
    /** On a day with no activity: true sends the one-line "No placements today", false sends nothing. */
    sendEmptyDays: boolean("send_empty_days").notNull().default(true),
    unsubscribedAt: instantColumn("unsubscribed_at"),
    /** Signed into each unsubscribe link; a new link replaces it, so older links stop working. */
    unsubscribeNonce: uuid("unsubscribe_nonce").notNull().defaultRandom(),
    addedBy: uuid("added_by").references(() => users.id, { onDelete: "set null" }),
    createdAt: createdAtColumn(),
    updatedAt: updatedAtColumn(),
  },
  (t) => [
    uniqueIndex("digest_recipients_project_email_idx").on(t.projectId, t.email),
    check("digest_recipients_email_lower", sql`${t.email} = lower(${t.email})`),
    check("digest_recipients_hour_range", sql`${t.hourOverride} between 0 and 23`),
  ],
);

/**
 * One row per digest e-mail: the unique key (project, local date, recipient) is what makes a rerun,
 * a retry or a second worker instance a no-op. The row is inserted before the SMTP call.
 */
export const sentDigests = pgTable(
  "sent_digests",
  {
    id: idColumn(),
    projectId: uuid("project_id")
      .notNull()
      .references(() => projects.id, { onDelete: "cascade" }),
    /** The project-local calendar date the digest summarises (YYYY-MM-DD). */
    date: date("date", { mode: "string" }).notNull(),
    recipientEmail: varchar("recipient_email", { length: 320 }).notNull(),
    status: sentDigestStatus("status").notNull().default("sending"),
    /** When the claim was taken; a "sending" claim much older than a send takes is taken over. */
    claimedAt: instantColumn("claimed_at").notNull().defaultNow(),
    sentAt: instantColumn("sent_at"),
    messageId: text("message_id"),
    /** The office user who pressed "Send now"; null for the scheduled job. */
    sentBy: uuid("sent_by").references(() => users.id, { onDelete: "set null" }),
    createdAt: createdAtColumn(),
  },
  (t) => [uniqueIndex("sent_digests_project_date_recipient_idx").on(t.projectId, t.date, t.recipientEmail)],
);
