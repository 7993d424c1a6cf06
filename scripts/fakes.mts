// Local stand-ins for hosted services, on loopback only:
//  - an SMTP server that keeps every message, with a mailbox page and a JSON API to read them;
//  - an S3-compatible server (s3rver) with the photo bucket and its CORS rule.
// Started by scripts/start.sh and scripts/test.sh; never part of a production deployment.
import { createServer } from "node:http";
import { mkdirSync, readdirSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import path from "node:path";
import { simpleParser } from "mailparser";
import S3rver from "s3rver";
import { SMTPServer } from "smtp-server";

const dir = process.env.FAKES_DIR ?? ".data/run";
const smtpPort = Number(process.env.SMTP_PORT ?? 2525);
const mailboxPort = Number(process.env.MAILBOX_PORT ?? 2580);
const s3Port = Number(process.env.S3_PORT ?? 4569);
const bucket = process.env.S3_BUCKET ?? "placewright-photos";
const allowedOrigin = process.env.APP_ORIGIN ?? "*";
const mailDir = path.join(dir, "mail");
mkdirSync(mailDir, { recursive: true });

type StoredMessage = {
  id: string;
  receivedAt: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
  html: string;
};

function listMessages(): StoredMessage[] {
  return readdirSync(mailDir)
    .filter((f) => f.endsWith(".json"))
    .sort()
    .map((f) => JSON.parse(readFileSync(path.join(mailDir, f), "utf8")) as StoredMessage);
}

let counter = 0;
const smtp = new SMTPServer({
  authOptional: true,
  disabledCommands: ["STARTTLS"],
  logger: false,
  onData(stream, session, callback) {
    const chunks: Buffer[] = [];
    stream.on("data", (c: Buffer) => chunks.push(c));
    stream.on("end", async () => {
      try {
        const raw = Buffer.concat(chunks);
        const parsed = await simpleParser(raw);
        const id = `${Date.now()}-${String(++counter).padStart(5, "0")}`;
        const message: StoredMessage = {
          id,
          receivedAt: new Date().toISOString(),
          from: parsed.from?.text ?? "",
          to: session.envelope.rcptTo.map((r) => r.address.toLowerCase()),
          subject: parsed.subject ?? "",
          text: parsed.text ?? "",
          html: typeof parsed.html === "string" ? parsed.html : "",
        };
        writeFileSync(path.join(mailDir, `${id}.eml`), raw);
        writeFileSync(path.join(mailDir, `${id}.json`), JSON.stringify(message));
        callback();
      } catch (error) {
        callback(error as Error);
      }
    });
  },
});

const escapeHtml = (s: string) =>
  s.replace(/[&<>"']/g, (c) => ({ "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" })[c]!);

const mailbox = createServer((req, res) => {
  const url = new URL(req.url ?? "/", `http://127.0.0.1:${mailboxPort}`);
  if (url.pathname === "/messages" && req.method === "DELETE") {
    rmSync(mailDir, { recursive: true, force: true });
    mkdirSync(mailDir, { recursive: true });
    res.writeHead(204).end();
    return;
  }
  if (url.pathname === "/messages") {
    const to = url.searchParams.get("to")?.toLowerCase();
    const messages = listMessages().filter((m) => !to || m.to.includes(to));
    res.writeHead(200, { "content-type": "application/json" }).end(JSON.stringify(messages));
    return;
  }
  const match = url.pathname.match(/^\/messages\/([\w-]+)$/);
  if (match) {
    const message = listMessages().find((m) => m.id === match[1]);
    if (!message) return void res.writeHead(404).end("No such message");
    const body = message.html || `<pre>${escapeHtml(message.text)}</pre>`;
    res.writeHead(200, { "content-type": "text/html; charset=utf-8" }).end(body);
    return;
  }
  if (url.pathname === "/") {
    const rows = listMessages()
      .reverse()
      .map(
        (m) =>
          `<tr><td>${escapeHtml(m.receivedAt)}</td><td>${escapeHtml(m.to.join(", "))}</td>` +
          `<td><a href="/messages/${m.id}">${escapeHtml(m.subject)}</a></td></tr>`,
      )
      .join("");
    res.writeHead(200, { "content-type": "text/html; charset=utf-8" }).end(
      `<!doctype html><meta charset="utf-8"><title>Local mailbox</title>` +
        `<style>body{font:15px system-ui;margin:2rem;color:#161d27}td,th{padding:.4rem .8rem;border-bottom:1px solid #cdd5de;text-align:left}</style>` +
        `<h1>Local mailbox</h1><p>Messages sent by Placewright on this machine. Development only.</p>` +
        `<table><tr><th>Received</th><th>To</th><th>Subject</th></tr>${rows || '<tr><td colspan="3">No messages yet.</td></tr>'}</table>`,
    );
    return;
  }
  res.writeHead(404).end("Not found");
});

const corsXml = `<CORSConfiguration><CORSRule>
<AllowedOrigin>${allowedOrigin}</AllowedOrigin>
<AllowedMethod>GET</AllowedMethod><AllowedMethod>PUT</AllowedMethod><AllowedMethod>HEAD</AllowedMethod>
<AllowedHeader>*</AllowedHeader><ExposeHeader>ETag</ExposeHeader><MaxAgeSeconds>3000</MaxAgeSeconds>
</CORSRule></CORSConfiguration>`;
const s3 = new S3rver({
  address: "127.0.0.1",
  port: s3Port,
  silent: true,
  directory: path.join(dir, "s3"),
  configureBuckets: [{ name: bucket, configs: [corsXml] }],
});

await new Promise<void>((resolve) => smtp.listen(smtpPort, "127.0.0.1", resolve));
await new Promise<void>((resolve) => mailbox.listen(mailboxPort, "127.0.0.1", resolve));
await s3.run();
console.log(`fakes ready: smtp ${smtpPort}, mailbox ${mailboxPort}, s3 ${s3Port}`);

const shutdown = async () => {
  smtp.close(() => undefined);
  mailbox.close();
  await s3.close().catch(() => undefined);
  process.exit(0);
};
process.on("SIGTERM", shutdown);
process.on("SIGINT", shutdown);
