import { expect, test } from "@playwright/test";
import { DEMO, linkFrom, signIn, SignInPage, waitForMail } from "./support";

// What each demo user should see on Today (from the demo scenario's memberships).
const EXPECTED: Record<keyof typeof DEMO, string[]> = {
  sam: ["Larkspur Commons", "Millrace Pump House"],
  ines: ["Larkspur Commons", "Millrace Pump House"],
  olu: ["Larkspur Commons", "Millrace Pump House"],
  oona: ["Larkspur Commons"],
  ada: [],
};

test.describe("sign-in and roles", () => {
  for (const [who, email] of Object.entries(DEMO) as [keyof typeof DEMO, string][]) {
    test(`${who} signs in and sees only their projects`, async ({ page }) => {
      await signIn(page, email);
      await page.goto("/projects");
      if (EXPECTED[who].length === 0) {
        await expect(page.getByTestId("no-projects")).toBeVisible();
      } else {
        const names = await page.getByTestId("project-list").getByTestId("project-name").allTextContents();
        expect(names).toEqual(EXPECTED[who]);
      }
      const adminLink = page.getByRole("navigation", { name: "Main" }).first().getByRole("link", { name: "Admin" });
      if (who === "ada") await expect(adminLink).toBeVisible();
      else await expect(adminLink).toHaveCount(0);
    });
  }

  test("the owner sees no admin screens and no edit controls", async ({ page }) => {
    await signIn(page, DEMO.oona);
    await page.goto("/admin");
    await expect(page.getByTestId("admin-forbidden")).toBeVisible();
    // The page's own controls: the header's sync state ("All saved") is the device's, not an edit control.
    const content = page.getByRole("main");
    await expect(content.getByRole("button", { name: /invite|create|add|remove|save/i })).toHaveCount(0);
    await page.goto("/projects");
    await page.getByRole("link", { name: /Larkspur Commons/ }).click();
    await expect(page.getByRole("heading", { name: "Larkspur Commons" })).toBeVisible();
    await expect(content.getByRole("button", { name: /new|add|edit|save|delete|plan/i })).toHaveCount(0);
    await expect(content.getByRole("link", { name: /new|add|edit|plan/i })).toHaveCount(0);
  });

  test("a member of one project cannot open another", async ({ page }) => {
    await signIn(page, DEMO.oona);
    // Millrace Pump House: Oona is not a member.
    await page.goto("/projects/6f1c3e20-8d44-4b7e-b1a2-00000000000b");
    await expect(page.getByTestId("project-forbidden")).toBeVisible();
  });

  test("a wrong password shows a clear message", async ({ page }) => {
    const signin = new SignInPage(page);
    await signin.open();
    await signin.withPassword(DEMO.olu, "not-the-password");
    await expect(page.getByTestId("signin-error")).toContainText("That e-mail and password do not match");
    await expect(page).toHaveURL(/\/signin/);
    // And the right one still works (one failure does not lock the account).
    await signin.withPassword(DEMO.olu);
    await expect(page).toHaveURL(/\/today/);
  });

  test("an invalid e-mail is named before anything is sent", async ({ page }) => {
    const signin = new SignInPage(page);
    await signin.open();
    await signin.withPassword("not-an-address", "x");
    await expect(page.getByText("Enter a valid e-mail address")).toBeVisible();
  });

  test("the sign-in link arrives in the local mailbox and signs the user in", async ({ page }) => {
    const since = Date.now() - 1000;
    await page.goto("/signin");
    await page.getByRole("tab", { name: "E-mail me a link" }).click();
    await page.getByLabel("E-mail").fill(DEMO.ines);
    await page.getByRole("button", { name: "Send me a sign-in link" }).click();
    await expect(page.getByTestId("link-sent")).toBeVisible();
    const mail = await waitForMail(DEMO.ines, since);
    expect(mail.subject).toBe("Your Placewright sign-in link");
    await page.goto(linkFrom(mail.text));
    await expect(page).toHaveURL(/\/today/);
    await page.getByTestId("user-menu").click();
    await expect(page.getByTestId("signed-in-name")).toHaveText("Ines Marchetti");
    // The same link does not work twice.
    const second = await page.context().browser()!.newContext();
    const p2 = await second.newPage();
    await p2.goto(linkFrom(mail.text));
    await expect(p2.getByTestId("link-error")).toContainText("expired or was already used");
    await second.close();
  });

  test("an admin invites a person who sets a password and signs in", async ({ page, browser }) => {
    const email = `new.hire.${Date.now()}@example.test`;
    await signIn(page, DEMO.ada);
    await page.goto("/admin");
    await page.getByLabel("Name").fill("Nell Hartwick");
    await page.getByLabel("E-mail").fill(email);
    await page.getByLabel("Project (optional)").selectOption({ label: "Millrace Pump House" });
    await page.getByLabel("Role on that project").selectOption("inspector");
    const since = Date.now() - 1000;
    await page.getByRole("button", { name: "Send invitation" }).click();
    await expect(page.getByTestId("invite-result")).toContainText(`Invitation sent to ${email}`);
    await expect(page.getByTestId("people-table")).toContainText("Invited");

    const mail = await waitForMail(email, since);
    const invitee = await (await browser.newContext()).newPage();
    await invitee.goto(linkFrom(mail.text));
    await expect(invitee.getByRole("heading", { name: "Welcome, Nell Hartwick" })).toBeVisible();
    await invitee.getByLabel("New password").fill("short");
    await invitee.getByLabel("Repeat the password").fill("short");
    await invitee.getByRole("button", { name: "Save password and sign in" }).click();
    await expect(invitee.getByText("Use at least 10 characters")).toBeVisible();
    await invitee.getByLabel("New password").fill("nell-strong-password");
    await invitee.getByLabel("Repeat the password").fill("nell-strong-password");
    await invitee.getByRole("button", { name: "Save password and sign in" }).click();
    await expect(invitee).toHaveURL(/\/today/);
    await expect(invitee.getByTestId("today-projects")).toContainText("Millrace Pump House");
    await expect(invitee.getByTestId("today-projects")).toContainText("Inspector");
    await invitee.context().close();
  });

  test("signing out returns to the sign-in screen and pages need a session again", async ({ page }) => {
    await signIn(page, DEMO.sam);
    await page.getByTestId("user-menu").click();
    await page.getByRole("menuitem", { name: "Sign out", exact: true }).click();
    await expect(page).toHaveURL(/\/signin/);
    await page.goto("/today");
    await expect(page).toHaveURL(/\/signin/);
  });
});
