import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { BrowserContext } from "playwright-core";
import { launchBrowser, PHONE, screenshot, signInThroughPage } from "../support/browser";
import { linkIn, waitForMails } from "../support/mail-inbox";
import { uniqueEmail } from "../support/people";

let adminBrowser: BrowserContext;
let inviteeBrowser: BrowserContext;
beforeAll(async () => {
  adminBrowser = await launchBrowser();
  inviteeBrowser = await launchBrowser({ viewport: PHONE, isMobile: true });
});
afterAll(async () => {
  await adminBrowser?.close();
  await inviteeBrowser?.close();
});

describe("inviting a technician through the People page", () => {
  it("admin invites, the technician opens the mailed link, sets a password and signs in", async () => {
    const email = uniqueEmail("e2e-technician");
    const password = "Marram-grass-sextant-61";

    const admin = await adminBrowser.newPage();
    await signInThroughPage(admin, "admin", "/people");
    await admin.waitForURL(/\/people$/);
    await expect.poll(() => admin.getByRole("heading", { level: 1 }).textContent()).toBe("People");
    await screenshot(admin, "people-01-list");

    await admin.getByRole("link", { name: "Invite a person" }).click();
    await admin.waitForURL(/\/people\/invite$/);
    await admin.getByLabel("Full name").fill("Seraphine Quellwood");
    await admin.getByLabel("E-mail address").fill(email);
    await admin.getByLabel("Role").selectOption("technician");
    await admin.getByLabel("Licence or authorisation number").fill("QL-B1-70412");
    await admin.getByLabel("Valid until").fill("2028-09-30");
    await admin.getByLabel("Station").selectOption("QSH");
    await screenshot(admin, "people-02-invite-form");
    await admin.getByRole("button", { name: "Send invitation" }).click();
    await expect.poll(() => admin.getByRole("status").first().textContent()).toContain(`Invitation sent to ${email}`);
    await screenshot(admin, "people-03-invitation-sent");

    const [mail] = await waitForMails(email);
    const { url } = linkIn(mail, "/invitation");

    const invitee = await inviteeBrowser.newPage();
    await invitee.goto(url);
    await expect.poll(() => invitee.getByRole("heading", { level: 1 }).textContent()).toBe("Choose your password");
    await screenshot(invitee, "people-04-invitation-page");

    await invitee.getByLabel("New password", { exact: true }).fill("too-short");
    await invitee.getByLabel("Repeat the new password").fill("too-short");
    await invitee.getByRole("button", { name: "Set password and sign in" }).click();
    await expect.poll(() => invitee.locator("#password-error").textContent()).toMatch(/at least 12 characters/);
    expect(await invitee.getByLabel("New password", { exact: true }).getAttribute("aria-describedby")).toContain("password-error");
    await screenshot(invitee, "people-05-password-too-short");

    await invitee.getByLabel("New password", { exact: true }).fill(password);
    await invitee.getByLabel("Repeat the new password").fill(password);
    await invitee.getByRole("button", { name: "Set password and sign in" }).click();
    await invitee.waitForURL((target) => target.pathname === "/");
    await expect.poll(() => invitee.getByRole("heading", { level: 1 }).textContent()).toMatch(/Good to see you, Seraphine/);
    await screenshot(invitee, "people-06-signed-in");

    // The same link does not work twice.
    await invitee.goto(url);
    await expect.poll(() => invitee.getByRole("heading", { level: 1 }).textContent()).toBe("This link has already been used");
    await screenshot(invitee, "people-07-link-used");

    // Signing out and in again with the chosen password.
    await invitee.goto("/");
    await invitee.getByRole("button", { name: "Sign out" }).click();
    await invitee.waitForURL(/\/sign-in/);
    await invitee.getByLabel("E-mail address").fill(email);
    await invitee.getByLabel("Password").fill(password);
    await invitee.getByRole("button", { name: "Sign in" }).click();
    await invitee.waitForURL((target) => target.pathname === "/");
    await screenshot(invitee, "people-08-signed-in-again");

    // The admin sees the person as active, and the audit trail shows what happened.
    await admin.goto(`/people?q=${encodeURIComponent("Seraphine")}`);
    const row = admin.getByRole("row", { name: /Seraphine Quellwood/ });
    await expect.poll(() => row.textContent()).toMatch(/Active/);
    await screenshot(admin, "people-09-list-active");

    // On the person's page the admin records a licence renewal date that falls within 30 days.
    await row.getByRole("link", { name: "Seraphine Quellwood" }).click();
    await admin.waitForURL(/\/people\/usr-/);
    const soon = new Date(Date.now() + 10 * 86_400_000).toISOString().slice(0, 10);
    await admin.getByLabel("Valid until").fill(soon);
    await admin.getByRole("button", { name: "Save details" }).click();
    await expect.poll(() => admin.getByText("Details saved.").isVisible()).toBe(true);
    await expect.poll(() => admin.locator("dl").textContent()).toMatch(/Expires in (9|10) days/);
    await screenshot(admin, "people-10-person-licence-expiring");

    await admin.goto("/people/audit");
    await expect.poll(() => admin.locator("tbody").textContent()).toMatch(/Invitation accepted/);
    await screenshot(admin, "people-11-audit");
    await admin.close();
    await invitee.close();
  });

  it("offers 'Forgot password?' on the sign-in page and answers without telling whether the address exists", async () => {
    // A browser of its own: the invitee's is signed in, and /sign-in would send it home.
    const visitor = await launchBrowser({ viewport: PHONE, isMobile: true });
    const page = await visitor.newPage();
    await page.goto("/sign-in");
    await page.getByRole("link", { name: "Forgot password?" }).click();
    await page.waitForURL(/\/reset-password$/);
    await page.getByLabel("E-mail address").fill(uniqueEmail("nobody-here"));
    await page.getByRole("button", { name: "Send me a link" }).click();
    await expect.poll(() => page.getByRole("status").textContent()).toMatch(/If an account uses that address/);
    await screenshot(page, "people-12-forgot-password-sent");
    await visitor.close();
  });
});
