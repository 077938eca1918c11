import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { BrowserContext } from "playwright-core";
import { DEMO_PASSWORD, demoEmail } from "../../seeds/lib/demo";
import { launchBrowser, PHONE, screenshot, signInThroughPage } from "../support/browser";

let browser: BrowserContext;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

describe("signing in through the real page", () => {
  it("shows a clear error for a wrong password, then signs in and lands on the role's home page", async () => {
    const page = await browser.newPage();
    await page.goto("/");
    await page.waitForURL(/\/sign-in/);
    await screenshot(page, "sign-in-page");

    await page.getByLabel("E-mail address").fill(demoEmail("technician"));
    await page.getByLabel("Password").fill("wrong-password-here");
    await page.getByRole("button", { name: "Sign in" }).click();
    await expect.poll(() => page.locator("form [role=alert]").textContent()).toMatch(/not right/);
    await screenshot(page, "sign-in-wrong-password");

    await page.getByLabel("Password").fill(DEMO_PASSWORD);
    await page.getByRole("button", { name: "Sign in" }).click();
    await page.waitForURL((url) => url.pathname === "/");
    await expect.poll(() => page.getByRole("heading", { level: 1 }).textContent()).toMatch(/Good to see you/);
    expect(await page.getByText("What you can do next").isVisible()).toBe(true);
    await screenshot(page, "home-technician");
    await page.close();
  });

  it("gives the admin a navigation that works on a phone", async () => {
    const phone = await launchBrowser({ viewport: PHONE, isMobile: true });
    try {
      const page = await phone.newPage();
      await signInThroughPage(page, "admin");
      await page.getByRole("button", { name: /Menu/ }).click();
      expect(await page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "People" }).isVisible()).toBe(true);
      await screenshot(page, "home-admin-phone-menu");
    } finally {
      await phone.close();
    }
  });
});
