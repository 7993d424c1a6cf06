// Runs the digest worker on its own (`npm run worker`), e.g. when the app runs with DIGEST_WORKER=off.
// Any number may run at once: pg-boss hands each job to one of them, and the sent_digests claim
// keeps each digest to one send. The configuration is checked before anything else is loaded.
import { configOrExit } from "../lib/config.ts";

const settings = configOrExit();
const { closeDb } = await import("../db/index.ts");
const { stopQueue } = await import("../lib/digest/queue.ts");
const { startDigestWorker } = await import("../lib/digest/worker.ts");
const { startHousekeepingWorker } = await import("../lib/housekeeping/queue.ts");
const { logger } = await import("../lib/log.ts");

const worker = await startDigestWorker({ pollingIntervalSeconds: settings.digest.pollSeconds });
const housekeeping = await startHousekeepingWorker();
logger.info({ queues: ["project-digest", "housekeeping"] }, "digest worker running, with housekeeping; Ctrl-C to stop");

let stopping = false;
async function shutdown(signal: string) {
  if (stopping) return;
  stopping = true;
  logger.info({ signal }, "digest worker stopping");
  await worker.stop();
  await housekeeping.stop();
  await stopQueue();
  await closeDb();
  logger.info({}, "digest worker stopped");
  process.exit(0);
}
process.on("SIGINT", () => void shutdown("SIGINT"));
process.on("SIGTERM", () => void shutdown("SIGTERM"));
