// One autocannon run of bench:load (scripts/bench-load.mts): requests/s over the measured run time,
// mean and percentile latencies from each response's own time, and why requests failed.
import autocannon from "autocannon";

export type Figures = { reasons: Map<string, number>; route: string; requests: number; seconds: number; meanMs: number; perSecond: number; errors: number; p50: number; p95: number; p99: number; cannonP50: number; cannonP99: number };
const percentile = (sorted: number[], p: number) => Math.round(sorted[Math.min(sorted.length - 1, Math.floor((p / 100) * sorted.length))] ?? NaN);

/** A device as the load sees it: a pull's answer moves its cursor. */
export type LoadDevice = { cursor: Record<string, number> | null };
export type LoadRequest<D extends LoadDevice> = { method: "GET" | "POST"; path: string; headers?: Record<string, string>; body?: string; device?: D };

/**
 * One autocannon run against `base` with `connections` connections; `next` gives each request
 * (round-robin over devices). A push whose answer refuses a change counts as an error; a pull moves
 * its device's cursor, as a device does.
 */
export function runLoad<D extends LoadDevice>(base: string, connections: number, route: string, duration: number, next: () => LoadRequest<D>) {
  return new Promise<Figures>((resolve, reject) => {
    const times: number[] = [];
    let errors = 0;
    const started = performance.now();
    // Why requests failed: a status, a refused change's reason and message, a timeout.
    const reasons = new Map<string, number>();
    const tally = (why: string) => reasons.set(why, (reasons.get(why) ?? 0) + 1);
    const instance = autocannon(
      {
        url: base,
        connections,
        duration,
        timeout: 10,
        requests: [
          {
            setupRequest: (req, context) => {
              const { device, ...request } = next();
              (context as { device?: D }).device = device;
              return { ...req, ...request };
            },
            onResponse: (status, body, context) => {
              const device = (context as { device?: D }).device;
              if (status !== 200 || !device) return;
              const answer = JSON.parse(body) as { cursor?: Record<string, number>; results?: { result: string; reason?: string; message?: string }[] };
              if (answer.cursor) device.cursor = answer.cursor;
              const refused = answer.results?.filter((r) => r.result !== "applied") ?? [];
              for (const r of refused) tally(`change ${r.result} (${r.reason}): ${r.message}`);
              errors += refused.length ? 1 : 0;
            },
          },
        ],
      },
      (error, result) => {
        if (error) return reject(error);
        const sorted = times.sort((a, b) => a - b);
        // The rate over the run's measured wall-clock time, not the asked duration.
        const elapsedSeconds = (performance.now() - started) / 1000;
        if (result.timeouts) reasons.set(`timed out after 10 s`, result.timeouts);
        resolve({
          reasons,
          route,
          requests: sorted.length,
          seconds: elapsedSeconds,
          meanMs: sorted.reduce((a, b) => a + b, 0) / Math.max(1, sorted.length),
          perSecond: sorted.length / elapsedSeconds,
          errors: errors + result.errors + result.timeouts,
          p50: percentile(sorted, 50),
          p95: percentile(sorted, 95),
          p99: percentile(sorted, 99),
          // autocannon's own histogram, as a cross-check of the per-response times.
          cannonP50: result.latency.p50,
          cannonP99: result.latency.p99,
        });
      },
    );
    instance.on("response", (_client, statusCode, _bytes, responseTime) => {
      times.push(responseTime);
      if (statusCode < 200 || statusCode >= 300) {
        errors += 1;
        tally(`HTTP ${statusCode}`);
      }
    });
  });
}

