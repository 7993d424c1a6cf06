// Finding 14 (first part): mail carrying sign-in links must not go out in clear. Attack: a network
// path that strips the STARTTLS offer (downgrade). With requireTLS, nodemailer refuses to send
// rather than continue in clear; only the local fake on this machine is spoken to without TLS.
// [RFC 3207 §4 and §6: a client that requires TLS must not continue when STARTTLS is unavailable;
// nodemailer SMTP transport docs: requireTLS / ignoreTLS]
import net from "node:net";
import nodemailer from "nodemailer";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { transportOptions } from "@/lib/mail/transport";

describe("SMTP TLS", () => {
  // A server that answers like SMTP but never offers STARTTLS, and records whether DATA arrived.
  let server: net.Server;
  let port = 0;
  const received: string[] = [];
  beforeAll(async () => {
    server = net.createServer((socket) => {
      socket.write("220 strip.example.test ESMTP\r\n");
      socket.on("data", (chunk) => {
        for (const line of chunk.toString().split("\r\n").filter(Boolean)) {
          received.push(line);
          if (/^EHLO/i.test(line)) socket.write("250-strip.example.test\r\n250 SIZE 1000000\r\n");
          else if (/^STARTTLS/i.test(line)) socket.write("454 TLS not available\r\n");
          else if (/^DATA/i.test(line)) socket.write("354 go on\r\n");
          else if (/^QUIT/i.test(line)) socket.end("221 bye\r\n");
          else socket.write("250 ok\r\n");
        }
      });
    });
    await new Promise<void>((resolve) => server.listen(0, "127.0.0.2", resolve));
    port = (server.address() as net.AddressInfo).port;
  });
  afterAll(() => server.close());

  it("a server that is not the local fake gets TLS required, and a stripped STARTTLS stops the mail", async () => {
    expect(transportOptions("smtp://mail.example.test:587")).toMatchObject({ host: "mail.example.test", port: 587, requireTLS: true, ignoreTLS: false });
    const url = `smtp://127.0.0.2:${port}`;
    expect(transportOptions(url).requireTLS).toBe(true);
    const transport = nodemailer.createTransport(transportOptions(url));
    await expect(transport.sendMail({ from: "a@example.test", to: "b@example.test", subject: "Your sign-in link", text: "token=secret" })).rejects.toThrow();
    expect(received.some((l) => /^DATA/i.test(l))).toBe(false);
  });

  it("the local fake on this machine is used without TLS", () => {
    expect(transportOptions("smtp://127.0.0.1:2526")).toMatchObject({ host: "127.0.0.1", port: 2526, requireTLS: false, ignoreTLS: true });
    expect(transportOptions("smtp://localhost:2525").requireTLS).toBe(false);
  });
});
