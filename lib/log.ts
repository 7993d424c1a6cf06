// The server's one logger: JSON lines (pino) on stdout, each carrying the id of the request it was
// written for. The request context is set by the server entry (scripts/serve.mjs) around every
// request; it lives on globalThis because that script and the bundled app are separate module graphs.
import { AsyncLocalStorage } from "node:async_hooks";
import { format } from "node:util";
import pino from "pino";

export type RequestContext = { requestId: string };

const CONTEXT_KEY = Symbol.for("placewright.requestContext");
const globalForLog = globalThis as typeof globalThis & { [CONTEXT_KEY]?: AsyncLocalStorage<RequestContext>; placewrightLogger?: pino.Logger };

export function requestContext(): AsyncLocalStorage<RequestContext> {
  return (globalForLog[CONTEXT_KEY] ??= new AsyncLocalStorage<RequestContext>());
}

/** Anything that could carry a secret is replaced before a line is written. */
export const REDACT_PATHS = [
  "password",
  "*.password",
  "secret",
  "*.secret",
  "token",
  "*.token",
  "headers.cookie",
  "*.headers.cookie",
  "headers.authorization",
  "*.headers.authorization",
  "connectionString",
  "*.connectionString",
];

function level(): string {
  // Read directly (not through lib/config) so a configuration error can itself be logged.
  const wanted = process.env.LOG_LEVEL;
  return wanted && ["fatal", "error", "warn", "info", "debug", "trace", "silent"].includes(wanted) ? wanted : "info";
}

export function createLogger(destination?: pino.DestinationStream): pino.Logger {
  return pino(
    {
      level: level(),
      base: { pid: process.pid, instance: process.env.INSTANCE_NAME || undefined },
      messageKey: "msg",
      timestamp: pino.stdTimeFunctions.isoTime,
      redact: { paths: REDACT_PATHS, censor: "[redacted]" },
      mixin: () => {
        const ctx = requestContext().getStore();
        return ctx ? { requestId: ctx.requestId } : {};
      },
    },
    destination,
  );
}

export const logger: pino.Logger = (globalForLog.placewrightLogger ??= createLogger());

/**
 * Sends console.* (Next's own error reports, libraries) through the logger, so every line on
 * stdout is JSON with its request id. Called once by the server (instrumentation.ts).
 */
export function routeConsoleToLogger(log: pino.Logger = logger): void {
  const write = (level: "error" | "warn" | "info" | "debug") => (...args: unknown[]) => {
    const err = args.find((a): a is Error => a instanceof Error);
    const msg = format(...args.filter((a) => a !== err));
    if (err) log[level]({ err }, msg || err.message);
    else log[level](msg);
  };
  console.error = write("error");
  console.warn = write("warn");
  console.info = write("info");
  console.log = write("info");
  console.debug = write("debug");
}
