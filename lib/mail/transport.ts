import nodemailer, { type Transporter } from "nodemailer";
import { config } from "@/lib/config";

// SMTP from the environment. Locally SMTP_URL points at the fake started by our scripts.
let transporter: Transporter | undefined;

export function getTransport(): Transporter {
  const { smtpUrl, ignoreTls } = config().mail;
  transporter ??= nodemailer.createTransport(smtpUrl, { ignoreTLS: ignoreTls });
  return transporter;
}

export const mailFrom = () => config().mail.from;

export function appOrigin(): string {
  return config().origin;
}

export async function sendMail(message: { to: string; subject: string; text: string; html: string }) {
  await getTransport().sendMail({ from: mailFrom(), ...message });
}
