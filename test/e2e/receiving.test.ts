import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { BrowserContext, Page } from "playwright-core";
import { parseLabel } from "../../src/domain/labels";
import { minimalPdf, uniqueSuffix } from "../api/receipts-fixtures";
import { testDb } from "../support/api";
import { launchBrowser, screenshot, signInThroughPage } from "../support/browser";
import { decodeSymbol } from "../domain/label-print-decoder";

let browser: BrowserContext;
beforeAll(async () => {
  browser = await launchBrowser({ viewport: { width: 1280, height: 900 } });
});
afterAll(async () => {
  await browser?.close();
  await testDb().destroy();
});

const daysAgo = (days: number) => new Date(Date.now() - days * 86_400_000).toISOString().slice(0, 10);

async function fillCertificate(page: Page, trackingNumber: string) {
  await page.getByLabel("Form type").selectOption("easa_form_1");
  await page.getByLabel("Condition: status/work (block 11)").selectOption("inspected_tested");
  await page.getByLabel("Tracking number (block 3)").fill(trackingNumber);
  await page.getByLabel("Certificate date").fill(daysAgo(3));
  await page.getByLabel("Issuing organisation (block 4)").fill("Quillfeather Component Shop");
  await page.getByLabel("Approval reference").fill("QA.145.0012");
  await page.getByLabel("Remarks (block 12)").fill("Inspected and bench tested per CMM.");
  await page.getByLabel("TSN (hours)").fill("3120:45");
  await page.getByLabel("CSN (cycles)").fill("2210");
  await page.getByLabel("Bin").fill("S3-D7");
}

describe("receiving a unit through the real form", () => {
  it("scans the unit label, uploads the certificate with progress, prints the label, and finds the unit serviceable in Stock and the part search", async () => {
    const page = await browser.newPage();
    await signInThroughPage(page, "stores", "/receiving");
    await page.waitForURL(/\/receiving$/);
    const serial = uniqueSuffix("E2E");

    // A keyboard-wedge scanner types the label text and ends with Enter.
    await page.getByLabel("Scan a label").click();
    await page.keyboard.type(`MFR Q4B22 / PNR QF-3242-50 / SER ${serial}`);
    await page.keyboard.press("Enter");
    await expect.poll(() => page.getByLabel("Part number (block 8)").inputValue()).toBe("QF-3242-50");
    expect(await page.getByLabel("Serial number (block 10)").inputValue()).toBe(serial);
    expect(await page.getByLabel("CAGE code").inputValue()).toBe("Q4B22");
    expect(await page.getByText(`Read P/N QF-3242-50, S/N ${serial}, CAGE Q4B22.`).isVisible()).toBe(true);

    const trackingNumber = `E2E-${serial}`;
    await fillCertificate(page, trackingNumber);
    await page.getByLabel("Yes, they match").check();
    await page.getByLabel("Certificate file").setInputFiles({ name: "form-1.pdf", mimeType: "application/pdf", buffer: minimalPdf(`EASA Form 1 ${trackingNumber}`) });
    await screenshot(page, "receiving-form-filled");

    // Targets big enough for gloves on a tablet.
    const small = await page.locator("form input:not([type=radio]):not([type=hidden]), form select, form button, form textarea").evaluateAll((elements) =>
      elements.filter((element) => element.getBoundingClientRect().height < 44).map((element) => element.outerHTML.slice(0, 80)),
    );
    expect(small).toEqual([]);

    await page.getByRole("button", { name: "Receive the unit" }).click();
    await page.getByRole("heading", { name: /^Received: P\/N QF-3242-50 S\/N/ }).waitFor();
    expect(await page.getByText("Serviceable", { exact: true }).isVisible()).toBe(true);
    await screenshot(page, "receiving-done");

    await page.getByRole("link", { name: "Print its label" }).click();
    await page.waitForURL(/\/parts\/\d+\/label$/);
    const partId = Number(/\/parts\/(\d+)\/label/.exec(page.url())![1]);
    await page.locator("svg[data-symbol=code128] rect").first().waitFor();
    await screenshot(page, "receiving-label-page");
    await page.emulateMedia({ media: "print" });
    await screenshot(page, "receiving-label-print");
    await page.emulateMedia({ media: "screen" });

    // Read both printed symbols back off the page, enlarged so each module spans several pixels.
    await page.addStyleTag({ content: ".part-label { zoom: 4; }" });
    for (const symbology of ["code128", "datamatrix"] as const) {
      const png = await page.locator(`[data-symbol=${symbology}]`).first().screenshot();
      const reading = parseLabel(decodeSymbol(png, symbology));
      expect(reading, symbology).toMatchObject({ ok: true, partNumber: "QF-3242-50", serialNumber: serial, cage: "Q4B22" });
    }

    await page.goto(`/stock?q=${encodeURIComponent(serial)}`);
    const row = page.getByRole("row", { name: new RegExp(serial) });
    await row.waitFor();
    expect(await row.getByText("Serviceable").isVisible()).toBe(true);
    expect(await row.getByText("S3-D7").isVisible()).toBe(true);
    await screenshot(page, "receiving-stock-row");

    const search = await page.request.get(`/api/parts?q=${encodeURIComponent(serial)}`);
    expect(search.status()).toBe(200);
    expect((await search.json()).parts).toEqual([expect.objectContaining({ id: partId, serialNumber: serial, status: "serviceable" })]);

    // A movement through the stock page's dialog: issue the unit to a work order.
    await row.getByRole("button", { name: `Record a movement for S/N ${serial}` }).click();
    const dialog = page.getByRole("dialog");
    await dialog.getByRole("button", { name: "Issue to a work order" }).click();
    await dialog.getByLabel("Work order").fill("WO-88410");
    await screenshot(page, "stock-issue-dialog");
    await dialog.getByRole("button", { name: "Record" }).click();
    await page.getByText(`Issue to a work order: recorded. S/N ${serial} is now serviceable.`).waitFor();
    await expect.poll(() => page.getByRole("row", { name: new RegExp(serial) }).getByText("Out on issue").isVisible()).toBe(true);
    await screenshot(page, "stock-after-issue");
    await page.close();
  });

  it("shows what is missing, and offers to ask an administrator for an unknown part number", async () => {
    const page = await browser.newPage();
    await page.setViewportSize({ width: 820, height: 1180 });
    await page.goto("/receiving"); // the context is still signed in as stores
    await page.getByRole("button", { name: "Receive the unit" }).click();
    const alert = page.getByRole("alert").filter({ hasText: "Some fields need attention" });
    await alert.waitFor();
    expect(await alert.getByRole("link", { name: "Serial number" }).isVisible()).toBe(true);
    expect(await page.getByLabel("Serial number (block 10)").getAttribute("aria-describedby")).toContain("receipt-serialNumber-error");
    await screenshot(page, "receiving-missing-fields-tablet");

    await page.getByLabel("Part number (block 8)").fill("QF-0000-01");
    await page.getByLabel("CAGE code").fill("Q4B22");
    await page.getByLabel("Serial number (block 10)").fill(uniqueSuffix("UNK"));
    await fillCertificate(page, uniqueSuffix("UNK-T"));
    await page.getByLabel("Yes, they match").check();
    await page.getByLabel("Certificate file").setInputFiles({ name: "c.pdf", mimeType: "application/pdf", buffer: minimalPdf("cert") });
    await page.getByRole("button", { name: "Receive the unit" }).click();
    const ask = page.getByRole("button", { name: "Ask an administrator to add QF-0000-01" });
    await ask.waitFor();
    await ask.click();
    await page.getByText(/administrator.* will be asked to add QF-0000-01/).waitFor();
    await screenshot(page, "receiving-unknown-part-number");
    expect(await testDb()("mail_outbox").where("subject", "like", "%QF-0000-01%").first()).toBeDefined();
    await page.close();
  });
});
