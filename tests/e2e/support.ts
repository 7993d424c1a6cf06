import { expect, type Page } from "@playwright/test";

export const DEMO_PASSWORD = "placewright-demo";
export const MAILBOX = process.env.MAILBOX_URL ?? "http://127.0.0.1:2581";

export const DEMO = {
  sam: "sam.super@example.test",
  ines: "ines.inspect@example.test",
  olu: "olu.office@example.test",
  oona: "oona.owner@example.test",
  ada: "ada.admin@example.test",
} as const;

/** Page object for the sign-in screen. */
export class SignInPage {
  constructor(readonly page: Page) {}

  async open() {
    await this.page.goto("/signin");
    await expect(this.page.getByRole("heading", { name: "Sign in" })).toBeVisible();
  }

  async withPassword(email: string, password = DEMO_PASSWORD) {
    await this.page.getByLabel("E-mail").fill(email);
    await this.page.getByLabel("Password").fill(password);
    await this.page.getByRole("button", { name: "Sign in" }).click();
  }
}

export async function signIn(page: Page, email: string, password = DEMO_PASSWORD) {
  const signin = new SignInPage(page);
  await signin.open();
  await signin.withPassword(email, password);
  await expect(page).toHaveURL(/\/today/);
}

/** The newest message the local SMTP fake received for an address (waits for it). */
export async function waitForMail(to: string, since = 0): Promise<{ subject: string; text: string; receivedAt: string }> {
  for (let i = 0; i < 100; i++) {
    const res = await fetch(`${MAILBOX}/messages?to=${encodeURIComponent(to)}`);
    const list = (await res.json()) as { subject: string; text: string; receivedAt: string }[];
    const fresh = list.filter((m) => Date.parse(m.receivedAt) >= since);
    if (fresh.length) return fresh[fresh.length - 1];
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error(`No e-mail for ${to} arrived in the local mailbox`);
}

export function linkFrom(text: string): string {
  const match = text.match(/https?:\/\/\S+/);
  if (!match) throw new Error("no link in the e-mail");
  return match[0];
}
