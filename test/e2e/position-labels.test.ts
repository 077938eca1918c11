// The position label print sheet in Chromium: reached from the Airframe page, drawn (Data Matrix from
// the server, Code 128 by jsbarcode in the browser), printable, and both symbols read back off the
// page as Threadline's own TLPOS1 text. Aircraft and positions are the invented demo fleet.
import type { BrowserContext } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { parsePositionLabel } from "../../src/domain/labels";
import { DESKTOP, launchBrowser, screenshot, signInThroughPage } from "../support/browser";
import { decodeSymbol } from "../domain/label-print-decoder";

let browser: BrowserContext;
beforeAll(async () => {
  browser = await launchBrowser({ viewport: DESKTOP });
});
afterAll(async () => browser?.close());

describe("position labels for one aircraft", () => {
  it("prints a zone's labels from the Airframe page, and one position's label from its detail", async () => {
    const page = await browser.newPage();
    await signInThroughPage(page, "technician", "/aircraft/Q-FRBB?position=B3-EBA2");
    await page.getByRole("link", { name: "Print position labels" }).click();
    await page.waitForURL(/\/aircraft\/Q-FRBB\/position-labels$/);
    await page.getByRole("heading", { name: "Position labels for Q-FRBB" }).waitFor();
    const every = await page.locator("article.position-label").count();
    expect(every).toBeGreaterThan(50);
    expect(await page.getByTestId("position-label-count").textContent()).toBe(`${every} labels, every position.`);

    await page.getByLabel("Positions").selectOption("MLG-R");
    await page.getByRole("button", { name: "Show" }).click();
    await page.waitForURL(/zone=MLG-R/);
    const zoneLabels = page.locator("article.position-label");
    const count = await zoneLabels.count();
    expect(count).toBeGreaterThan(0);
    expect(count).toBeLessThan(every);
    await page.locator("svg[data-symbol=code128] rect").first().waitFor();
    await screenshot(page, "position-labels-1-zone-sheet");
    await page.emulateMedia({ media: "print" });
    await screenshot(page, "position-labels-2-zone-print");
    await page.emulateMedia({ media: "screen" });

    // From the position's detail on the Airframe page: that one label.
    await page.goto("/aircraft/Q-FRBB?position=B3-EBA2");
    await page.getByRole("link", { name: "Print its position label" }).click();
    await page.waitForURL(/position-labels\?position=B3-EBA2/);
    expect(await page.locator("article.position-label").count()).toBe(1);
    await page.locator("svg[data-symbol=code128] rect").first().waitFor();
    expect(await page.locator("article.position-label").textContent()).toContain("TLPOS1 Q-FRBB B3-EBA2");
    await screenshot(page, "position-labels-3-one-label");

    // Both symbols read back off the page, enlarged so each module spans several pixels.
    await page.addStyleTag({ content: ".position-label { zoom: 4; }" });
    for (const symbology of ["code128", "datamatrix"] as const) {
      const png = await page.locator(`article.position-label [data-symbol=${symbology}]`).first().screenshot();
      const text = decodeSymbol(png, symbology);
      expect(text, symbology).toBe("TLPOS1 Q-FRBB B3-EBA2");
      expect(parsePositionLabel(text)).toMatchObject({ ok: true, registration: "Q-FRBB", positionCode: "B3-EBA2" });
    }
    await page.close();
  });
});
