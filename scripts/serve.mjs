// Serves the built app (`next build` first): `node scripts/serve.mjs -H 127.0.0.1 -p 3000`.
// Next's request handler behind a plain Node server, so the process owns its shutdown: on SIGTERM it
// reports not-ready, stops accepting connections, lets the requests in flight finish (up to
// SHUTDOWN_TIMEOUT_MS), then runs the app's shutdown hooks (digest worker, then the database pool;
// lib/lifecycle.ts) and exits 0. Every request gets an id (the incoming X-Request-Id from a proxy,
// or a new one) that is echoed in the response and carried by every log line written for it.
import { randomUUID } from "node:crypto";
import { AsyncLocalStorage } from "node:async_hooks";
import http from "node:http";
import path from "node:path";
import next from "next";

function arg(flag, fallback) {
  const i = process.argv.indexOf(flag);
  return i > 0 && process.argv[i + 1] ? process.argv[i + 1] : fallback;
}
const hostname = arg("-H", process.env.HOST || "127.0.0.1");
const port = Number(arg("-p", process.env.PORT || "3000"));
const dir = path.resolve(import.meta.dirname, "..");

// Shared with the bundled app through globalThis (lib/log.ts, lib/lifecycle.ts).
const contextKey = Symbol.for("placewright.requestContext");
globalThis[contextKey] ??= new AsyncLocalStorage();
const context = globalThis[contextKey];
const lifecycleKey = Symbol.for("placewright.lifecycle");
globalThis[lifecycleKey] ??= { draining: false, hooks: [] };
const lifecycle = globalThis[lifecycleKey];

// The app's pino logger exists once instrumentation has run; before that, plain JSON lines.
const fallback = (level) => (fields, msg) => process.stdout.write(`${JSON.stringify({ level, time: new Date().toISOString(), pid: process.pid, ...fields, msg })}\n`);
const log = {
  info: (fields, msg) => (globalThis.placewrightLogger ? globalThis.placewrightLogger.info(fields, msg) : fallback("info")(fields, msg)),
  error: (fields, msg) => (globalThis.placewrightLogger ? globalThis.placewrightLogger.error(fields, msg) : fallback("error")(fields, msg)),
};

const app = next({ dev: false, dir, hostname, port });
await app.prepare();
const handle = app.getRequestHandler();
const instance = process.env.INSTANCE_NAME || `${hostname}:${port}`;
const validId = /^[A-Za-z0-9._-]{1,100}$/;
let inFlight = 0;

const server = http.createServer((req, res) => {
  const incoming = req.headers["x-request-id"];
  const requestId = typeof incoming === "string" && validId.test(incoming) ? incoming : randomUUID();
  req.headers["x-request-id"] = requestId;
  res.setHeader("x-request-id", requestId);
  res.setHeader("x-served-by", instance);
  if (lifecycle.draining) res.setHeader("connection", "close");
  const started = process.hrtime.bigint();
  inFlight += 1;
  let counted = true;
  const done = () => {
    if (!counted) return;
    counted = false;
    inFlight -= 1;
    // The path only: query strings can carry sign-in tokens.
    const pathOnly = (req.url ?? "/").split("?")[0];
    const ms = Number((process.hrtime.bigint() - started) / 1_000_000n);
    context.run({ requestId }, () => log.info({ method: req.method, path: pathOnly, status: res.statusCode, ms }, "request"));
  };
  res.on("finish", done);
  res.on("close", done);
  context.run({ requestId }, () => handle(req, res));
});
server.keepAliveTimeout = 65_000; // longer than a load balancer's idle timeout, so it closes first

server.listen(port, hostname, () => log.info({ hostname, port, instance }, "listening"));

let stopping = false;
async function shutdown(signal) {
  if (stopping) return;
  stopping = true;
  lifecycle.draining = true;
  const timeoutMs = lifecycle.shutdownTimeoutMs ?? 25_000;
  log.info({ signal, inFlight, timeoutMs }, "shutting down: no new connections, finishing requests in flight");
  server.close();
  server.closeIdleConnections();
  const deadline = Date.now() + timeoutMs;
  while (inFlight > 0 && Date.now() < deadline) await new Promise((r) => setTimeout(r, 50));
  if (inFlight > 0) log.error({ inFlight }, "shutdown timeout: closing the remaining connections");
  server.closeAllConnections();
  for (const hook of lifecycle.hooks) {
    try {
      await hook.run();
      log.info({ hook: hook.name }, "stopped");
    } catch (err) {
      log.error({ hook: hook.name, err: String(err) }, "shutdown hook failed");
    }
  }
  log.info({}, "shutdown complete");
  process.exit(0);
}
process.on("SIGTERM", () => void shutdown("SIGTERM"));
process.on("SIGINT", () => void shutdown("SIGINT"));
