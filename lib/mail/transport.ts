import nodemailer, { type Transporter } from "nodemailer";

// SMTP from the environment. Locally SMTP_URL points at the fake started by our scripts.
let transporter: Transporter | undefined;

export function getTransport(): Transporter {
  transporter ??= nodemailer.createTransport(process.env.SMTP_URL ?? "smtp://127.0.0.1:2525", {
    ignoreTLS: process.env.SMTP_IGNORE_TLS !== "false",
  });
  return transporter;
}

export const MAIL_FROM = process.env.MAIL_FROM ?? "Placewright <no-reply@placewright.example.test>";

export function appOrigin(): string {
  return (process.env.APP_ORIGIN ?? process.env.NEXTAUTH_URL ?? "http://localhost:3000").replace(/\/$/, "");
}

export async function sendMail(message: { to: string; subject: string; text: string; html: string }) {
  await getTransport().sendMail({ from: MAIL_FROM, ...message });
}
