import { readFile } from "node:fs/promises";
import Papa from "papaparse";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { BrowserContext, Page } from "playwright-core";
import { launchBrowser, PHONE, screenshot, signInThroughPage } from "../support/browser";

const HEADER =
  "registration,aircraft_type,position_code,ata_chapter,part_number,cage,serial_number,removed_at,removal_type,reason,work_order,aircraft_hours,aircraft_cycles,hours_on_wing,cycles_on_wing,part_tsn,part_csn,installed_part_number,installed_serial_number,recorded_by";

let browser: BrowserContext;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

async function downloadText(page: Page, click: () => Promise<void>): Promise<{ name: string; text: string }> {
  const [download] = await Promise.all([page.waitForEvent("download"), click()]);
  const file = await download.path();
  return { name: download.suggestedFilename(), text: await readFile(file, "utf8") };
}

describe("the Rates page", () => {
  it("shows the reliability engineer QF-3242-50's monthly rate against the alert level, the Weibull panel and the CSV", async () => {
    const page = await browser.newPage();
    await signInThroughPage(page, "reliability", "/rates");
    await page.waitForURL(/\/rates/);
    await page.getByLabel("Part number (with its alternates)").fill("QF-3242-50");
    await page.getByLabel("From").fill("2025-12-01");
    await page.getByLabel("To (inclusive)").fill("2026-11-30");
    await page.getByRole("button", { name: "Show rates" }).click();

    const banner = page.getByRole("alert").filter({ hasText: "Above the alert level in" });
    await banner.waitFor();
    expect(await banner.textContent()).toMatch(/2026-09, 2026-10/);
    const chart = page.getByRole("img", { name: /Unscheduled removals per 1,000 unit hours by month, QF-3242-50/ });
    await chart.waitFor();
    expect(await chart.locator("text", { hasText: "▲ Above" }).count()).toBeGreaterThanOrEqual(2);
    expect(await chart.locator("text", { hasText: "Alert level" }).count()).toBe(1);
    expect(page.url()).toContain("partNumber=QF-3242-50");
    await screenshot(page, "rates-chart");

    await page.getByText(/Monthly figures/).click();
    const october = page.locator('tr[data-month="2026-10"]');
    await october.waitFor();
    expect(await october.getAttribute("data-above-alert")).toBe("true");
    expect(await october.textContent()).toMatch(/Above alert/);
    expect(await page.locator('tr[data-month="2026-05"]').getAttribute("data-above-alert")).toBe("false");
    await october.scrollIntoViewIfNeeded();
    await screenshot(page, "rates-monthly-figures");

    const csv = await downloadText(page, () => page.getByRole("link", { name: /Removals CSV for QF-3242-50/ }).click());
    expect(csv.name).toBe("removals-2025-12-01-to-2026-11-30.csv");
    expect(csv.text.split("\r\n")[0]).toBe(HEADER);
    const rows = Papa.parse<Record<string, string>>(csv.text, { header: true, skipEmptyLines: true }).data;
    expect(rows.length).toBeGreaterThan(30);
    expect(rows.every((r) => r.part_number === "QF-3242-50" && r.removed_at >= "2025-12-01" && r.removed_at < "2026-12-01")).toBe(true);

    const weibull = page.getByRole("region", { name: "Weibull: time on wing" });
    await weibull.getByRole("img", { name: /Weibull probability plot/ }).waitFor();
    const failuresBefore = Number(await weibull.locator("dt:has-text('Failures') + dd").textContent());
    expect(failuresBefore).toBeGreaterThan(10);
    await weibull.getByLabel(/Only shop-confirmed failures/).check();
    await expect.poll(async () => Number(await weibull.locator("dt:has-text('Failures') + dd").textContent())).toBeLessThan(failuresBefore);
    expect(await weibull.getByTestId("weibull-beta").textContent()).toMatch(/^\d+\.\d{3}$/);
    await weibull.scrollIntoViewIfNeeded();
    await screenshot(page, "rates-weibull");
    await page.close();
  });

  it("filters the Removals page and downloads the CSV with the same filters", async () => {
    const page = await browser.newPage();
    await page.goto("/removals");
    await page.getByLabel("Part number").fill("QF-3242-50");
    await page.getByLabel("Home station").selectOption("QSH");
    await page.getByLabel("Removal type").selectOption("unscheduled");
    await page.getByLabel("From").fill("2026-09-01");
    await page.getByLabel("To (inclusive)").fill("2026-11-30");
    await page.getByRole("button", { name: "Apply filters" }).click();
    await expect.poll(() => page.url()).toContain("station=QSH");
    const counts = page.locator("p[aria-live=polite]");
    await expect.poll(async () => (await counts.textContent()) ?? "").toMatch(/of \d+ removals, \d+ unscheduled/);
    const total = Number((await counts.textContent())!.match(/of (\d+) removals/)![1]);
    expect(total).toBeGreaterThan(10);
    expect(await page.locator("tbody tr").count()).toBe(Math.min(total, 50));
    await screenshot(page, "rates-removals-page");

    const csv = await downloadText(page, () => page.getByRole("link", { name: "Download CSV" }).click());
    const rows = Papa.parse<Record<string, string>>(csv.text, { header: true, skipEmptyLines: true }).data;
    expect(csv.text.split("\r\n")[0]).toBe(HEADER);
    expect(rows).toHaveLength(total);
    await page.close();
  });

  it("reads on a phone", async () => {
    const phone = await launchBrowser({ viewport: PHONE, isMobile: true });
    try {
      const page = await phone.newPage();
      await signInThroughPage(page, "reliability", "/rates?partNumber=QF-3242-50&from=2025-12-01&to=2026-11-30");
      await page.getByRole("img", { name: /Unscheduled removals per 1,000 unit hours/ }).waitFor();
      await screenshot(page, "rates-phone");
    } finally {
      await phone.close();
    }
  });
});
