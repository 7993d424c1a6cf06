// Creates and grants the app's database role named by APP_DATABASE_URL, on the owner's connection
// (DATABASE_URL), after the migrations. Also creates the job queue's schema and queues as the owner,
// so the app's role needs no DDL at run time. Idempotent; without APP_DATABASE_URL it says so and
// changes nothing (the app then connects as the owner: fine for a laptop, not for production).
import { closeDb, db } from "../db/index.ts";
import { getBoss, stopQueue } from "../lib/digest/queue.ts";
import { ensureAppRole } from "../lib/db-roles/app-role.ts";
import { ensureHousekeepingQueue } from "../lib/housekeeping/queue.ts";

const appUrl = process.env.APP_DATABASE_URL;
if (!appUrl) {
  console.log("APP_DATABASE_URL is not set: the app connects as the owner role (set it in production; see README).");
  process.exit(0);
}
await ensureHousekeepingQueue(await getBoss()); // getBoss creates the schema and the digest queue
await stopQueue();
const role = await ensureAppRole(db, appUrl);
await closeDb();
console.log(`app database role ${role} ready (rows only; owns nothing)`);
