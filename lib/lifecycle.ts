// Process lifecycle shared by the server entry (scripts/serve.mjs) and the bundled app: the
// "draining" flag readiness reports once SIGTERM arrives, and the hooks run after the last request
// in flight has finished (stop the digest worker, then close the pool). Kept on globalThis because
// the entry script and the app bundle are separate module graphs.
export type ShutdownHook = { name: string; order: number; run: () => Promise<void> };
type Lifecycle = { draining: boolean; hooks: ShutdownHook[]; shutdownTimeoutMs?: number };

const KEY = Symbol.for("placewright.lifecycle");
const globalForLifecycle = globalThis as typeof globalThis & { [KEY]?: Lifecycle };

function state(): Lifecycle {
  return (globalForLifecycle[KEY] ??= { draining: false, hooks: [] });
}

export const isDraining = () => state().draining;

/** How long the server entry waits for requests in flight (SHUTDOWN_TIMEOUT_MS, from lib/config). */
export function setShutdownTimeout(ms: number): void {
  state().shutdownTimeoutMs = ms;
}

/** Lower order runs first: the worker (order 10) stops before the pool (order 100) closes. */
export function onShutdown(name: string, order: number, run: () => Promise<void>): void {
  const hooks = state().hooks.filter((h) => h.name !== name);
  state().hooks = [...hooks, { name, order, run }].sort((a, b) => a.order - b.order);
}
