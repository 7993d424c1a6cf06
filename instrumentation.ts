// Next.js calls register() once when a server starts. The digest worker runs inside the app's Node
// server unless DIGEST_WORKER=off (then run it alone with `npm run worker`).
export async function register() {
  if (process.env.NEXT_RUNTIME === "nodejs") {
    if (process.env.DIGEST_WORKER === "off" || process.env.NEXT_PHASE === "phase-production-build") return;
    const { startDigestWorker } = await import("./lib/digest/worker");
    const { startHousekeepingWorker } = await import("./lib/housekeeping/queue");
    try {
      await startDigestWorker();
      await startHousekeepingWorker();
    } catch (error) {
      // The app still serves pages without the queue; the log says why digests are not going out.
      console.error("[digest worker] not started:", error);
    }
  }
}
