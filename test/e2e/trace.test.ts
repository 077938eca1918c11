import { randomUUID } from "node:crypto";
import { afterEach, beforeAll, beforeEach, describe, expect, it } from "vitest";
import type { BrowserContext } from "playwright-core";
import { DEMO_FINDING_PART_NUMBER } from "../../seeds/04_demo-findings";
import { http, signInAs, testDb } from "../support/api";
import { launchBrowser, screenshot, signInThroughPage } from "../support/browser";
import { receiveUnitForTest } from "../support/ledger-append";

// A fresh browser per test: each signs in as its own role.
let browser: BrowserContext | null = null;
let auditorCookie: string;
beforeAll(async () => {
  auditorCookie = await signInAs("auditor");
});
beforeEach(async () => {
  browser = await launchBrowser();
});
afterEach(async () => {
  await browser?.close();
  browser = null;
});

/** A demo serial that crossed at least three airframes and a shop visit, and whose thread is clean. */
async function cleanMultiAirframeSerial() {
  const [rows] = await testDb().raw(`
    SELECT pt.id, pt.serial_number,
           COUNT(DISTINCT CASE WHEN e.kind = 'installed' THEN e.aircraft_id END) AS airframes,
           SUM(e.kind = 'sent_for_repair') AS shop_visits
      FROM parts pt JOIN ledger_entries e ON e.part_id = pt.id
     WHERE pt.serial_number NOT LIKE 'TT-%'
     GROUP BY pt.id HAVING airframes >= 3 AND shop_visits >= 1 ORDER BY airframes DESC, pt.id LIMIT 60`);
  for (const row of rows as Array<{ id: number; serial_number: string; airframes: number }>) {
    const trace = await http().get(`/api/parts/${row.id}/trace`).set("cookie", auditorCookie);
    if (trace.body.findings.length === 0) return { id: row.id, serial: row.serial_number, airframes: Number(row.airframes) };
  }
  throw new Error("no clean demo serial crossed three airframes and a shop visit");
}

describe("the auditor's trace", () => {
  it("traces a demo serial across three or more airframes and a shop visit: thread, no findings", async () => {
    const unit = await cleanMultiAirframeSerial();
    const page = await browser!.newPage();
    await signInThroughPage(page, "auditor", "/trace");
    await page.getByRole("link", { name: "Trace", exact: true }).click();
    await page.waitForURL(/\/trace$/);
    await page.getByLabel("Serial number").fill(unit.serial.toLowerCase());
    await screenshot(page, "trace-search");
    await page.getByRole("button", { name: "Trace", exact: true }).click();
    await page.waitForURL(new RegExp(`/trace/${unit.id}$`));

    await expect.poll(() => page.getByRole("heading", { level: 1 }).textContent()).toContain(unit.serial);
    expect(await page.getByText("No findings: the thread is continuous").isVisible()).toBe(true);
    const airframeGroups = page.locator("section.thread-group h3", { hasText: /^✈/ });
    const registrations = new Set((await airframeGroups.allTextContents()).map((text) => text.match(/On (Q-[A-Z]+)/)?.[1]));
    expect(registrations.size).toBeGreaterThanOrEqual(3);
    expect(await page.locator("section.thread-group h3", { hasText: "Shop visit" }).count()).toBeGreaterThanOrEqual(1);
    // Every entry is an anchor, starting from the first receipt.
    const firstRow = page.locator("tr.thread-entry").first();
    expect(await firstRow.textContent()).toContain("Received");
    expect(await page.locator('a[href^="/api/documents/"]').count()).toBeGreaterThan(0);
    await screenshot(page, "trace-thread");
    await page.close();
  });

  it("shows the demo finding above the thread, links it to its entry, and prints a grey-scale report with the ledger head", async () => {
    const demo = await testDb()("parts as pt")
      .join("part_numbers as pn", "pn.id", "pt.part_number_id")
      .join("ledger_entries as e", "e.part_id", "pt.id")
      .where({ "pn.part_number": DEMO_FINDING_PART_NUMBER, "e.reason": "Received back from a pool exchange" })
      .first("pt.id", "pt.serial_number", "e.seq", "e.hash");
    const page = await browser!.newPage();
    await signInThroughPage(page, "auditor", `/trace?serial=${demo.serial_number}&partNumber=${DEMO_FINDING_PART_NUMBER}`);
    await page.waitForURL(new RegExp(`/trace/${demo.id}$`));
    const findings = page.locator("section.findings");
    await expect.poll(() => findings.textContent()).toContain("Time regression");
    await findings.getByRole("link", { name: `seq ${demo.seq}` }).first().click();
    await page.waitForURL(new RegExp(`#seq-${demo.seq}$`));
    expect(await page.locator(`#seq-${demo.seq}`).textContent()).toContain("Finding: Time regression");
    await page.evaluate(() => window.scrollTo(0, 0));
    await screenshot(page, "trace-findings");

    await page.getByRole("link", { name: "Trace report (printable)" }).click();
    await page.waitForURL(new RegExp(`/trace/${demo.id}/report$`));
    const head = await testDb()("ledger_head").where({ id: 1 }).first("last_seq", "last_hash");
    const report = page.locator("article.trace-report");
    await expect.poll(() => report.textContent()).toContain(`Ledger head at printing: seq ${head.last_seq}`);
    expect(await report.textContent()).toContain(head.last_hash);
    // The demo unit was fitted after the receipt, so the thread's last entry is its installation.
    const last = await testDb()("ledger_entries").where({ part_id: demo.id }).orderBy("seq", "desc").first("seq", "hash");
    expect(await report.getByText(`verifies that entry seq ${last.seq}`).count()).toBeGreaterThanOrEqual(1);
    expect(await report.textContent()).toContain(last.hash);
    expect(await report.textContent()).toContain(demo.hash);
    await screenshot(page, "trace-report");
    await page.emulateMedia({ media: "print" });
    // In print, the app's header and the buttons are gone and the ink is black.
    expect(await page.getByRole("button", { name: "Print" }).isVisible()).toBe(false);
    expect(await page.locator("h1").evaluate((el) => getComputedStyle(el).color)).toBe("rgb(0, 0, 0)");
    await screenshot(page, "trace-report-print");
    await page.emulateMedia({ media: "screen" });

    // The paper copy checked against the ledger: the entry still has its printed hash.
    await page.goto("/ledger");
    await expect.poll(() => page.getByTestId("ledger-result").textContent(), { timeout: 30_000 }).toContain("Chain intact");
    await page.getByLabel("Seq").fill(String(demo.seq));
    await page.getByLabel("Hash (SHA-256)").fill(demo.hash);
    await page.getByRole("button", { name: "Compare" }).click();
    await expect.poll(() => page.getByText("still has this hash").count()).toBe(1);
    await screenshot(page, "trace-ledger-check");

    // The part page shows the same finding.
    await page.goto(`/parts/${demo.id}`);
    await expect.poll(() => page.locator("section.findings").textContent()).toContain("Time regression");
    await screenshot(page, "trace-part-findings");
    await page.close();
  });

  it("lists several units with the same serial and lets the auditor choose", async () => {
    const serial = `TT-${randomUUID().slice(0, 8).toUpperCase()}`;
    await receiveUnitForTest({ partNumber: "QF-3242-50", serialNumber: serial, tsnMinutes: 6_000, csn: 400 });
    await receiveUnitForTest({ partNumber: "QF-3412-10", serialNumber: serial, tsnMinutes: 9_000, csn: 700 });
    const page = await browser!.newPage();
    await signInThroughPage(page, "reliability", `/trace?serial=${serial}`);
    await expect.poll(() => page.getByRole("heading", { level: 2 }).first().textContent()).toMatch(/2\s*units carry serial/);
    const list = page.getByRole("list", { name: "Units with this serial" });
    expect(await list.getByRole("link").count()).toBe(2);
    await screenshot(page, "trace-matches");
    await list.getByRole("link", { name: /QF-3412-10/ }).click();
    await page.waitForURL(/\/trace\/\d+$/);
    await expect.poll(() => page.getByRole("heading", { level: 1 }).textContent()).toContain("QF-3412-10");
    await page.close();
  });

  it("shows a correction beside the entry it corrects, each linking to the other", async () => {
    const serial = `TT-${randomUUID().slice(0, 8).toUpperCase()}`;
    const unit = await receiveUnitForTest({ partNumber: "QF-3242-50", serialNumber: serial, tsnMinutes: 6_000, csn: 400 });
    const correction = await http()
      .post("/api/ledger/corrections")
      .set("cookie", await signInAs("inspector"))
      .send({ correctsSeq: unit.seq, reason: "The certificate's block 12 gives CSN 410", csn: 410 });
    expect(correction.status, correction.text).toBe(201);
    const page = await browser!.newPage();
    await signInThroughPage(page, "auditor", `/trace/${unit.partId}`);
    const original = page.locator(`#seq-${unit.seq}`);
    await expect.poll(() => original.textContent()).toContain(`Corrected by seq ${correction.body.entry.seq}`);
    const restated = page.locator(`#seq-${correction.body.entry.seq}`);
    expect(await restated.textContent()).toContain(`Corrects seq ${unit.seq}`);
    expect(await restated.textContent()).toContain("CSN: 400 → 410");
    await restated.getByRole("link", { name: `seq ${unit.seq}` }).click();
    await page.waitForURL(new RegExp(`#seq-${unit.seq}$`));
    await screenshot(page, "trace-correction");
    await page.close();
  });

  it("marks a position on the map whose fitted unit has a finding", async () => {
    const fleet = await http().get("/api/aircraft").set("cookie", auditorCookie);
    let flagged: { registration: string; code: string; findings: number } | null = null;
    for (const { registration } of fleet.body.aircraft as Array<{ registration: string }>) {
      const detail = await http().get(`/api/aircraft/${registration}`).set("cookie", auditorCookie);
      const position = (detail.body.positions as Array<{ code: string; state: string; findings: number }>).find((p) => p.state === "finding");
      if (position) {
        flagged = { registration, code: position.code, findings: position.findings };
        break;
      }
    }
    expect(flagged, "some fitted demo unit should carry a finding").not.toBeNull();
    const page = await browser!.newPage();
    await signInThroughPage(page, "auditor", `/aircraft/${flagged!.registration}?position=${encodeURIComponent(flagged!.code)}`);
    await expect.poll(() => page.getByTestId("position-detail").textContent()).toContain("Has a finding");
    await screenshot(page, "trace-position-map");
    await page.close();
  });

  it("refuses the trace to a technician with the 403 page", async () => {
    const page = await browser!.newPage();
    await signInThroughPage(page, "technician", "/");
    const response = await page.goto("/trace");
    expect(response?.status()).toBe(403);
    await page.close();
  });
});
