import { randomBytes } from "node:crypto";
import { mkdtempSync, writeFileSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import type { BrowserContext, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { http, signInAs, testDb } from "../support/api";
import { launchBrowser, screenshot, signInThroughPage } from "../support/browser";

// Invented part numbers and an invented aircraft type unique to this run, so seeded data stays as it is.
const run = randomBytes(3).toString("hex").toUpperCase();
const pn = (name: string) => `QT-${run}-${name}`;
const TYPE = `QT-E${run}`;

let browser: BrowserContext;
let page: Page;

beforeAll(async () => {
  const admin = await signInAs("admin");
  expect((await http().post("/api/layouts").set("cookie", admin).send({ code: TYPE, name: `Browser test type ${run}` })).status).toBe(201);
  for (const position of [
    { code: "NLG-STRUT", label: "Nose gear shock strut", ataChapter: "32-21", x: 170, y: 300, zone: "NLG" },
    { code: "NW1", label: "Nose wheel 1", parentCode: "NLG-STRUT", ataChapter: "32-41", x: 140, y: 285, zone: "NLG", eligible: ["QF-3241-20"] },
  ]) {
    expect((await http().post(`/api/layouts/${TYPE}/positions`).set("cookie", admin).send(position)).status).toBe(201);
  }
  browser = await launchBrowser();
  page = await browser.newPage();
  await signInThroughPage(page, "admin", "/catalog/import");
});
afterAll(async () => {
  await browser?.close();
  await testDb().destroy();
});

function writeCsv(): string {
  const lines = [
    "part_number,cage,description,ata_chapter,serialised,life_limit_hours,life_limit_cycles,life_limit_days,overhaul_hours,overhaul_cycles,alternates",
    `${pn("VALVE")},QT002,Test shutoff valve,29-11,yes,20000:00,,,8000,,${pn("VALVE2")}:two-way`,
    `${pn("VALVE2")},QT002,"Test shutoff valve, revised",29-11,yes,20000:00,,,8000.5,,`,
    `${pn("BADATA")},QT002,Test valve with a bad chapter,2911,yes,,,,,,`,
    `${pn("ORPHAN")},QT002,Test valve naming an unknown alternate,29-11,yes,,,,,,${pn("NOWHERE")}:one-way`,
    "QF-3242-50,Q4B22,Already in the catalog,32-42,yes,,,,,,",
    "",
    `${pn("LAMP")},QT002,Test cabin lamp,33-21,no,,,,,,`,
  ];
  const dir = mkdtempSync(path.join(os.tmpdir(), "threadline-csv-"));
  const file = path.join(dir, "catalog-import.csv");
  writeFileSync(file, lines.join("\r\n") + "\r\n");
  return file;
}

describe("the admin keeps the catalog and a layout through the real pages", () => {
  it("imports a CSV: checks it in the browser, shows the progress and a per-row report", async () => {
    await page.getByRole("heading", { name: "Import part numbers from CSV" }).waitFor();
    await page.getByLabel("CSV file").setInputFiles(writeCsv());
    await page.getByText("rows read").waitFor();
    expect(await page.getByText("rows read").textContent()).toMatch(/6 rows read: 5 ready to import, 1 with problems/);
    await screenshot(page, "catalog-import-checked");

    await page.getByRole("button", { name: "Import 5 rows" }).click();
    await page.getByText(/Imported 3 of 6 rows/).waitFor();
    const progress = page.locator("progress#import-progress");
    expect(await progress.getAttribute("value")).toBe(await progress.getAttribute("max"));
    expect(await page.getByText("Sent 5 of 5 rows.").isVisible()).toBe(true);

    const report = page.getByRole("table", { name: /Rows not imported/ });
    const rows = await report.locator("tbody tr").allTextContents();
    expect(rows).toHaveLength(3);
    expect(rows[0]).toMatch(/^4ata_chapter/);
    expect(rows[1]).toMatch(/^5alternates.*not in the catalog/);
    expect(rows[2]).toMatch(/^6part_number.*already in the catalog/);
    await screenshot(page, "catalog-import-report");

    const written = await testDb()("part_numbers").where("part_number", "like", `QT-${run}-%`).pluck("part_number");
    expect(written.sort()).toEqual([pn("LAMP"), pn("VALVE"), pn("VALVE2")]);
  });

  it("edits a part number: a refused field is marked and linked, a good change is saved", async () => {
    await page.goto(`/catalog?q=${encodeURIComponent(pn("VALVE"))}`);
    await page.getByRole("link", { name: pn("VALVE"), exact: true }).click();
    await page.getByRole("heading", { name: new RegExp(pn("VALVE")) }).waitFor();
    expect(await page.getByRole("table").first().textContent()).toContain(pn("VALVE2"));

    const ata = page.getByLabel("ATA chapter");
    await ata.fill("29");
    await page.getByRole("button", { name: "Save changes" }).click();
    await page.locator("#ataChapter-error").waitFor();
    expect(await ata.getAttribute("aria-invalid")).toBe("true");
    expect(await ata.getAttribute("aria-describedby")).toContain("ataChapter-error");
    expect(await page.locator("#ataChapter-error").textContent()).toMatch(/chapter-section/);
    await screenshot(page, "catalog-edit-refused");

    await ata.fill("29-12");
    await page.getByLabel("Description").fill("Test shutoff valve, edited in the browser");
    await page.getByLabel("Flight hours", { exact: true }).fill("1500.5");
    await page.getByRole("button", { name: "Save changes" }).click();
    await page.getByText("Saved.").waitFor();
    await expect.poll(() => page.getByLabel("Flight hours", { exact: true }).inputValue()).toBe("1500:30");
    const row = await testDb()("part_numbers").where({ part_number: pn("VALVE") }).first();
    expect(row).toMatchObject({ ata_chapter: "29-12", description: "Test shutoff valve, edited in the browser", life_limit_minutes: 90_030 });

    // Alternates: find one through the catalog search and link it one-way.
    await page.getByLabel("Find the alternate part number").fill(pn("LAMP"));
    await page.getByRole("button", { name: new RegExp(`${pn("LAMP")}.*pick`) }).click();
    await page.getByLabel(/may replace the alternate \(one-way\)/).check();
    await page.getByRole("button", { name: "Save alternate" }).click();
    await page.getByText(`Alternate ${pn("LAMP")} saved.`).waitFor();
    await expect.poll(() => page.getByRole("table").first().textContent()).toContain(`${pn("VALVE")} may replace ${pn("LAMP")}, not the reverse`);
    await screenshot(page, "catalog-edit-saved");
  });

  it("edits a position on a layout, with the preview following the coordinates", async () => {
    await page.goto(`/layouts/${TYPE}`);
    await page.getByText("Showing 2 of 2 positions.").waitFor();
    await page.getByRole("link", { name: "NW1", exact: true }).click();
    await page.getByRole("heading", { name: /NW1/ }).waitFor();

    const dot = page.locator("figure svg circle[r='10']");
    expect(await dot.getAttribute("cx")).toBe("140");
    await page.getByLabel("Map x").fill("1200");
    await page.getByText("The coordinates are outside the map").waitFor();
    await page.getByLabel("Map x").fill("155.5");
    await expect.poll(() => dot.getAttribute("cx")).toBe("155.5");
    await page.getByLabel("Map y").fill("280");
    await page.getByLabel("Label", { exact: true }).fill("Nose wheel 1 (left)");
    await page.getByLabel("Cautions shown before work").fill("Install the nose gear ground-lock pin.\nChock the main wheels.");
    await page.getByLabel(/independent inspection is required/).check();
    await page.getByRole("button", { name: "Save position" }).click();
    await page.getByText("Position NW1 saved.").waitFor();
    await page.getByRole("complementary", { name: "Safety cautions" }).getByText("Chock the main wheels.").waitFor();
    await screenshot(page, "layout-position-saved");
    // The form is reset after the action: the parent must still read as saved, or the next save would drop it.
    expect(await page.getByLabel("Parent position").inputValue()).toBe("NLG-STRUT");
    expect(await page.getByLabel("Map x").inputValue()).toBe("155.5");

    const type = await testDb()("aircraft_types").where({ code: TYPE }).first();
    const stored = await testDb()("positions").where({ aircraft_type_id: type.id, code: "NW1" }).first();
    expect(stored).toMatchObject({ label: "Nose wheel 1 (left)", parent_code: "NLG-STRUT", requires_independent_inspection: 1 });
    expect(Number(stored.map_x)).toBe(155.5);
    expect(Number(stored.map_y)).toBe(280);
    expect(stored.cautions).toBe("Install the nose gear ground-lock pin.\nChock the main wheels.");

    await page.goto(`/layouts/${TYPE}?zone=NLG`);
    await page.getByText("Showing 2 of 2 positions.").waitFor();
    await screenshot(page, "layout-positions");
  });
});
