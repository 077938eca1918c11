import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { BrowserContext } from "playwright-core";
import { DESKTOP, launchBrowser, PHONE, screenshot, signInThroughPage } from "../support/browser";

describe("the position map", () => {
  let phone: BrowserContext;
  let desktop: BrowserContext;
  beforeAll(async () => {
    phone = await launchBrowser({ viewport: PHONE, isMobile: true });
    desktop = await launchBrowser({ viewport: DESKTOP });
  });
  afterAll(async () => {
    await phone?.close();
    await desktop?.close();
  });

  it("on a phone: opens an aircraft, zooms to the main gear, opens a brake actuator and follows to its part page", async () => {
    const page = await phone.newPage();
    await signInThroughPage(page, "technician", "/fleet");
    await page.getByRole("link", { name: "Q-FRAA" }).click();
    await page.waitForURL(/\/aircraft\/Q-FRAA/);
    await screenshot(page, "airframe-phone-whole");

    await page.getByRole("group", { name: "Map zone" }).getByRole("button", { name: /^MLG-L( \(|$)/ }).click();
    await page.getByRole("list", { name: "Positions in MLG-L" }).getByRole("button", { name: /B1-EBA2/ }).click();
    const detail = page.getByTestId("position-detail");
    await expect.poll(() => detail.textContent()).toMatch(/Brake 1 electric actuator 2/);
    expect(await detail.getByText("Caution before work").isVisible()).toBe(true);
    await screenshot(page, "airframe-phone-brake-actuator");

    const serial = await detail.locator("dd.num").nth(1).textContent();
    await detail.getByRole("link", { name: "Open part page" }).click();
    await page.waitForURL(/\/parts\/\d+/);
    await expect.poll(() => page.getByRole("heading", { level: 1 }).textContent()).toContain(serial!.trim());
    await screenshot(page, "part-page-phone");
  });

  it("on a desktop: selects a position on the map with the keyboard and sorts the table", async () => {
    const page = await desktop.newPage();
    await signInThroughPage(page, "inspector", "/aircraft/Q-FRBA");
    await page.getByRole("group", { name: "Map zone" }).getByRole("button", { name: /^MLG-R( \(|$)/ }).click();
    const marker = page.locator('svg [data-position="B3-EBA1"]');
    await marker.focus();
    await page.keyboard.press("Enter");
    await expect.poll(() => page.getByTestId("position-detail").textContent()).toMatch(/Brake 3 electric actuator 1/);
    await page.getByRole("button", { name: /^TSN/ }).click();
    await screenshot(page, "airframe-desktop");
    expect(page.url()).toContain("position=B3-EBA1");
  });
});
