// Two app instances behind a round-robin proxy, to prove that nothing assumes one process:
// `node scripts/serve-pair.mjs -H 127.0.0.1 -p 3000 --ports 3001,3002` (after `next build`).
// Both instances serve the same build against the same PostgreSQL, bucket and SMTP relay (from the
// environment); both run the digest worker unless DIGEST_WORKER=off. Every request goes to the next
// instance in turn. A request refused at connect (an instance stopping or not up) is sent to the
// other one: the body is buffered first, so nothing of it was delivered. SIGTERM is passed on to
// both instances, which finish their requests in flight before exiting.
import { spawn } from "node:child_process";
import { randomUUID } from "node:crypto";
import http from "node:http";
import path from "node:path";
import { PassThrough } from "node:stream";
import httpProxy from "http-proxy";

function arg(flag, fallback) {
  const i = process.argv.indexOf(flag);
  return i > 0 && process.argv[i + 1] ? process.argv[i + 1] : fallback;
}
const hostname = arg("-H", "127.0.0.1");
const port = Number(arg("-p", process.env.PORT || "3000"));
const ports = arg("--ports", `${port + 1},${port + 2}`).split(",").map(Number);
const serve = path.join(import.meta.dirname, "serve.mjs");
const MAX_BODY_BYTES = 20 * 1024 * 1024; // photos go straight to the bucket; API bodies are small

const line = (fields, msg) => process.stdout.write(`${JSON.stringify({ level: 30, time: new Date().toISOString(), pid: process.pid, name: "proxy", ...fields, msg })}\n`);

const children = ports.map((p, i) => {
  const child = spawn(process.execPath, [serve, "-H", "127.0.0.1", "-p", String(p)], {
    env: { ...process.env, INSTANCE_NAME: `instance-${String.fromCharCode(97 + i)}:${p}` },
    stdio: ["ignore", "inherit", "inherit"],
  });
  child.on("exit", (code, signal) => line({ instance: p, code, signal }, "instance exited"));
  return child;
});

const targets = ports.map((p) => `http://127.0.0.1:${p}`);
let next = 0;
// Without an agent http-proxy asks each instance to close the connection after every answer, and
// passes that "connection: close" on to the client: a new TCP connection per request on both sides.
const upstreamAgent = new http.Agent({ keepAlive: true, maxSockets: 256 });
const proxy = httpProxy.createProxyServer({ xfwd: true, proxyTimeout: 120_000, agent: upstreamAgent });

function readBody(req) {
  return new Promise((resolve, reject) => {
    const chunks = [];
    let size = 0;
    req.on("data", (c) => {
      size += c.length;
      if (size > MAX_BODY_BYTES) reject(new Error("body too large"));
      else chunks.push(c);
    });
    req.on("end", () => resolve(Buffer.concat(chunks)));
    req.on("error", reject);
  });
}

function forward(req, res, body, attempt) {
  const target = targets[next];
  next = (next + 1) % targets.length;
  proxy.web(req, res, { target, buffer: bufferStream(body) }, (err) => {
    // Refused at connect: nothing reached the instance, so the other one may take the request.
    if (err?.code === "ECONNREFUSED" && !res.headersSent && attempt < targets.length) return forward(req, res, body, attempt + 1);
    line({ target, code: err?.code, path: (req.url ?? "/").split("?")[0] }, "upstream failed");
    if (!res.headersSent) {
      res.writeHead(502, { "content-type": "application/json" });
      res.end(JSON.stringify({ error: { code: "unavailable", message: "The server is restarting. Your changes are kept on this device; try again in a moment." } }));
    } else res.destroy();
  });
}

function bufferStream(body) {
  const pass = new PassThrough();
  pass.end(body);
  return pass;
}

const server = http.createServer(async (req, res) => {
  if (typeof req.headers["x-request-id"] !== "string") req.headers["x-request-id"] = randomUUID();
  let body;
  try {
    body = await readBody(req);
  } catch {
    res.writeHead(413, { "content-type": "application/json" });
    res.end(JSON.stringify({ error: { code: "invalid_input", message: "The request is too large." } }));
    return;
  }
  forward(req, res, body, 1);
});

async function waitReady() {
  for (let i = 0; i < 600; i++) {
    const ok = await Promise.all(
      targets.map((t) =>
        fetch(`${t}/api/health/live`)
          .then((r) => r.ok)
          .catch(() => false),
      ),
    );
    if (ok.every(Boolean)) return;
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error("the instances did not start");
}

await waitReady();
server.listen(port, hostname, () => line({ hostname, port, targets }, "round-robin proxy listening"));

let stopping = false;
function shutdown(signal) {
  if (stopping) return;
  stopping = true;
  line({ signal }, "stopping the proxy and both instances");
  server.close();
  let left = children.filter((c) => c.exitCode === null && c.signalCode === null).length;
  if (left === 0) process.exit(0);
  for (const child of children) {
    child.once("exit", () => {
      left -= 1;
      if (left === 0) process.exit(0);
    });
    child.kill("SIGTERM");
  }
}
process.on("SIGTERM", () => shutdown("SIGTERM"));
process.on("SIGINT", () => shutdown("SIGINT"));
