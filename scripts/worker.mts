// Runs the digest worker on its own (`npm run worker`), e.g. when the app runs with DIGEST_WORKER=off.
import { closeDb } from "../db/index.ts";
import { stopQueue } from "../lib/digest/queue.ts";
import { startDigestWorker } from "../lib/digest/worker.ts";
import { startHousekeepingWorker } from "../lib/housekeeping/queue.ts";

const worker = await startDigestWorker();
const housekeeping = await startHousekeepingWorker();
console.log("worker running (queues project-digest, housekeeping); Ctrl-C to stop");

let stopping = false;
async function shutdown() {
  if (stopping) return;
  stopping = true;
  await worker.stop();
  await housekeeping.stop();
  await stopQueue();
  await closeDb();
  process.exit(0);
}
process.on("SIGINT", shutdown);
process.on("SIGTERM", shutdown);
