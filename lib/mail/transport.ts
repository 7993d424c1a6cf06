import nodemailer, { type Transporter } from "nodemailer";
import { config } from "@/lib/config";

// SMTP from the environment. Locally SMTP_URL points at the fake started by our scripts.
let transporter: Transporter | undefined;

const LOOPBACK = new Set(["127.0.0.1", "localhost", "[::1]", "::1"]);

/**
 * TLS is required (STARTTLS, or smtps://) for every server but one on this machine, which is the
 * local fake of the start and test commands: the mail carries sign-in links and invitations.
 */
export function transportOptions(smtpUrl: string) {
  const url = new URL(smtpUrl);
  const local = LOOPBACK.has(url.hostname);
  const secure = url.protocol === "smtps:";
  return {
    host: url.hostname.replace(/^\[|\]$/g, ""),
    port: Number(url.port || (secure ? 465 : 587)),
    secure,
    ...(url.username ? { auth: { user: decodeURIComponent(url.username), pass: decodeURIComponent(url.password) } } : {}),
    requireTLS: !local,
    ignoreTLS: local,
  };
}

export function getTransport(): Transporter {
  // Parsed here rather than passed as a URL: nodemailer's URL options override requireTLS.
  transporter ??= nodemailer.createTransport(transportOptions(config().mail.smtpUrl));
  return transporter;
}

export const mailFrom = () => config().mail.from;

export function appOrigin(): string {
  return config().origin;
}

export async function sendMail(message: { to: string; subject: string; text: string; html: string }) {
  await getTransport().sendMail({ from: mailFrom(), ...message });
}
