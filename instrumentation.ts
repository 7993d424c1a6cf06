// Next.js calls register() once when a server starts: the configuration is checked here (a bad one
// stops the process with one line), then the digest worker starts inside the app's Node server
// unless DIGEST_WORKER=off (then run it alone with `npm run worker`). Every instance may run it:
// pg-boss hands each job to one worker, and sent_digests keeps each digest to one send.
export async function register() {
  if (process.env.NEXT_RUNTIME !== "nodejs" || process.env.NEXT_PHASE === "phase-production-build") return;
  const { configOrExit } = await import("./lib/config");
  const settings = configOrExit();
  const { logger, routeConsoleToLogger } = await import("./lib/log");
  routeConsoleToLogger();
  const { onShutdown, setShutdownTimeout } = await import("./lib/lifecycle");
  const { closeDb } = await import("./db");
  setShutdownTimeout(settings.shutdownTimeoutMs);
  onShutdown("database pool", 100, closeDb);
  logger.info({ digestWorker: settings.digest.worker, poolMax: settings.database.poolMax }, "configuration valid");
  if (!settings.digest.worker) return;
  const { startDigestWorker } = await import("./lib/digest/worker");
  const { startHousekeepingWorker } = await import("./lib/housekeeping/queue");
  const { stopQueue } = await import("./lib/digest/queue");
  try {
    const worker = await startDigestWorker({ pollingIntervalSeconds: settings.digest.pollSeconds });
    const housekeeping = await startHousekeepingWorker();
    onShutdown("digest worker", 10, async () => {
      await worker.stop();
      await housekeeping.stop();
      await stopQueue();
    });
  } catch (err) {
    // The app still serves pages without the queue; the log says why digests are not going out.
    logger.error({ err }, "digest worker not started");
  }
}
