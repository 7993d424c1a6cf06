// Refuses (exit 1) when enabled demo accounts, whose password is published in the README, exist in
// DATABASE_URL and the app is about to be served on an address other machines can reach.
// Used by scripts/start-production.sh; HOST is the address the server will bind to.
import { sql } from "drizzle-orm";
import { closeDb, db } from "../db/index.ts";
import { DEMO_USERS } from "./seed/ids.ts";

const host = process.env.HOST ?? "127.0.0.1";
const loopback = /^(127\.|::1$|localhost$)/.test(host);
const emails = DEMO_USERS.map((u) => u.email.toLowerCase());
const result = await db.execute(sql`
  select email from users where disabled_at is null and lower(email) in (${sql.join(emails.map((e) => sql`${e}`), sql`, `)})`);
const rows = result.rows as { email: string }[];
await closeDb();
if (rows.length && !loopback) {
  console.error(
    `Refusing to serve on ${host}: ${rows.length} demo account(s) with the published password are enabled ` +
      `(${rows.map((r) => r.email).join(", ")}). Use a database without the demo scenario, or disable them.`,
  );
  process.exit(1);
}
console.log(rows.length ? `demo accounts present (${rows.length}); loopback only` : "no demo accounts");
