import { execFile } from "node:child_process";
import { writeFileSync } from "node:fs";
import path from "node:path";
import { promisify } from "node:util";
import type { BrowserContext, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { encodeIso15434Format06 } from "../../src/domain/labels";
import { binaryParser } from "../api/receipts-fixtures";
import { http, signInAs, testDb } from "../support/api";
import { launchBrowser, PHONE, screenshot, signInThroughPage } from "../support/browser";
import { FRAME, launchWithFakeCamera, mediaDir, renderLabelPng } from "../support/camera";
import { fittedAt, spares } from "../support/swaps";

const run = promisify(execFile);
const DECODE_TIMEOUT = 30_000;
const media = mediaDir();
afterAll(() => media.remove());

async function cageOf(partNumber: string) {
  return (await testDb()("part_numbers").where({ part_number: partNumber }).first("cage")).cage as string;
}

/** A looping fake-camera video showing each label PNG for two seconds in turn. */
async function labelVideo(pngs: string[], out: string) {
  const pad = `pad=ceil(iw/2)*2:ceil(ih/2)*2:0:0:color=white,pad=${FRAME.width}:${FRAME.height}:(ow-iw)/2:(oh-ih)/2:color=white,format=yuv420p,fps=5`;
  const inputs = pngs.flatMap((png) => ["-loop", "1", "-t", "2", "-i", png]);
  const filters = pngs.map((_, i) => `[${i}]${pad}[v${i}]`).join(";");
  const concat = `${pngs.map((_, i) => `[v${i}]`).join("")}concat=n=${pngs.length}:v=1[v]`;
  await run("ffmpeg", ["-y", "-loglevel", "error", ...inputs, "-filter_complex", `${filters};${concat}`, "-map", "[v]", "-f", "yuv4mpegpipe", out]);
}

// The video cycles through its labels, so a step may first read one it does not want (and refuse it).
const MAX_READINGS = 40;

/** Reads labels until the expected serial shows, then accepts; returns the refusals met on the way. */
async function scanUntil(page: Page, serial: string): Promise<string[]> {
  const reading = page.getByTestId("scan-reading");
  const refusals: string[] = [];
  for (let attempt = 0; attempt < MAX_READINGS; attempt++) {
    await reading.waitFor({ timeout: DECODE_TIMEOUT });
    const field = reading.getByTestId("reading-serial-number");
    if ((await field.count()) > 0 && (await field.textContent()) === serial) {
      await page.getByRole("button", { name: "Use this label" }).click();
      return refusals;
    }
    if ((await reading.getByRole("alert").count()) > 0) refusals.push((await reading.getByRole("alert").textContent()) ?? "");
    await reading.getByRole("button", { name: "Scan again" }).click();
  }
  throw new Error(`the scanner never read ${serial}`);
}

/** Reads labels until the expected position label shows, then accepts; returns the refusals met on the way. */
async function scanPositionUntil(page: Page, positionCode: string, screenshotName: string): Promise<string[]> {
  const reading = page.getByTestId("scan-reading");
  const refusals: string[] = [];
  for (let attempt = 0; attempt < MAX_READINGS; attempt++) {
    await reading.waitFor({ timeout: DECODE_TIMEOUT });
    const field = reading.getByTestId("reading-position-code");
    if ((await field.count()) > 0 && (await field.textContent()) === positionCode) {
      await screenshot(page, screenshotName);
      await page.getByRole("button", { name: "Use this position" }).click();
      return refusals;
    }
    if ((await reading.getByRole("alert").count()) > 0) refusals.push((await reading.getByRole("alert").textContent()) ?? "");
    await reading.getByRole("button", { name: "Scan again" }).click();
  }
  throw new Error(`the scanner never read the position label of ${positionCode}`);
}

/** The position label PNG exactly as Threadline prints it (the label route). */
async function positionLabelPng(registration: string, positionCode: string): Promise<Buffer> {
  const response = await http()
    .get(`/api/aircraft/${registration}/positions/${positionCode}/label.png`)
    .query({ symbol: "datamatrix", scale: 3 })
    .set("cookie", await signInAs("technician"))
    .buffer(true)
    .parse(binaryParser);
  expect(response.status).toBe(200);
  return response.body as Buffer;
}

/** Opens the swap with no position chosen, on the position step. */
async function openSwapWithoutPosition(page: Page, registration: string) {
  await signInThroughPage(page, "technician", `/aircraft/${registration}/swap`);
  await page.getByRole("heading", { name: "Position" }).waitFor();
  await page.waitForLoadState("networkidle");
  const scan = page.getByRole("button", { name: "Scan the position label" });
  // A gloved thumb's target, reached without the keyboard.
  expect((await scan.boundingBox())!.height).toBeGreaterThanOrEqual(44);
  return scan;
}

async function walkToOffPart(page: Page, registration: string, positionCode: string) {
  await signInThroughPage(page, "technician", `/aircraft/${registration}?position=${positionCode}`);
  await page.getByRole("link", { name: "Record a swap here" }).click();
  await page.waitForURL(/\/swap\?position=/);
  await page.waitForLoadState("networkidle");
  expect(await page.getByText("Caution before work").isVisible()).toBe(true);
  await screenshot(page, "swap-1-position-cautions");
  await page.getByLabel(/made safe/).check();
  await page.getByRole("button", { name: "Next" }).click();
}

async function finishSwap(page: Page, onSerial: string, prefix: string) {
  await expect.poll(() => page.getByRole("list", { name: "Pre-install checks" }).textContent(), { timeout: 20_000 }).toMatch(/eligible/);
  await screenshot(page, `${prefix}-3-on-part-checks`);
  await page.getByRole("button", { name: "Next" }).click();

  await page.getByRole("button", { name: "Unscheduled" }).click();
  await page.getByRole("button", { name: "Fault message on the maintenance computer" }).click();
  await page.getByRole("button", { name: /Passed/ }).click();
  if (!(await page.getByLabel("Work order").inputValue())) await page.getByLabel("Work order").fill("WO-E2E-1");
  await screenshot(page, `${prefix}-4-details`);
  await page.getByRole("button", { name: "Next" }).click();

  await expect.poll(() => page.getByTestId("swap-review").textContent()).toContain(onSerial);
  await screenshot(page, `${prefix}-5-review`);
  await page.getByRole("button", { name: "Sign and record the swap" }).click();
  await page.getByRole("heading", { name: /Swap recorded/ }).waitFor({ timeout: 20_000 });
  await screenshot(page, `${prefix}-6-recorded`);
}

describe("the swap at the wheel, on a phone", () => {
  let browser: BrowserContext | undefined;
  afterAll(async () => browser?.close());

  it("scans the off part (Code 128) and the on part (Data Matrix) from the camera and records the swap", async () => {
    const off = await fittedAt("Q-FRBC", "B2-EBA1");
    const [on] = await spares(["QF-3242-50", "QF-3242-51"], 1);
    const offLabel = await renderLabelPng({ symbology: "code128", message: encodeIso15434Format06({ partNumber: off.partNumber, serialNumber: off.serialNumber, cage: off.cage }) });
    const onLabel = await renderLabelPng({ symbology: "datamatrix", message: encodeIso15434Format06({ partNumber: on.partNumber, serialNumber: on.serialNumber, cage: await cageOf(on.partNumber) }) });
    const offPng = path.join(media.dir, "off.png");
    const onPng = path.join(media.dir, "on.png");
    writeFileSync(offPng, offLabel.png);
    writeFileSync(onPng, onLabel.png);
    const video = path.join(media.dir, "swap.y4m");
    await labelVideo([offPng, onPng], video);

    browser = await launchWithFakeCamera(video, { viewport: PHONE, isMobile: true });
    const page = await browser.newPage();
    await walkToOffPart(page, "Q-FRBC", "B2-EBA1");

    await page.getByRole("button", { name: "Scan the off part's label" }).click();
    await scanUntil(page, off.serialNumber);
    await expect.poll(() => page.getByTestId("unit-reading").textContent()).toContain(off.serialNumber);
    await screenshot(page, "swap-2-off-part");
    await page.getByRole("button", { name: "Next" }).click();

    await page.getByRole("button", { name: "Scan the on part's label" }).click();
    await scanUntil(page, on.serialNumber);
    await finishSwap(page, on.serialNumber, "swap");

    expect((await fittedAt("Q-FRBC", "B2-EBA1")).serialNumber).toBe(on.serialNumber);
    // Every control a gloved hand needs is at least 44 px tall.
    await page.getByRole("link", { name: "Print the unserviceable tag" }).click();
    await page.getByRole("heading", { name: /UNSERVICEABLE/ }).waitFor();
    await screenshot(page, "swap-7-unserviceable-tag");
    expect(await page.getByText(off.serialNumber).first().isVisible()).toBe(true);
  });

  it("reads both labels from uploaded photos when there is no camera", async () => {
    const off = await fittedAt("Q-FRBD", "B1-EBA2");
    const [on] = await spares(["QF-3242-50", "QF-3242-51"], 1);
    const offPng = path.join(media.dir, "off-photo.png");
    const onPng = path.join(media.dir, "on-photo.png");
    writeFileSync(offPng, (await renderLabelPng({ symbology: "datamatrix", message: encodeIso15434Format06({ partNumber: off.partNumber, serialNumber: off.serialNumber, cage: off.cage }) })).png);
    writeFileSync(onPng, (await renderLabelPng({ symbology: "datamatrix", message: encodeIso15434Format06({ partNumber: on.partNumber, serialNumber: on.serialNumber, cage: await cageOf(on.partNumber) }) })).png);

    const noCamera = await launchBrowser({ viewport: PHONE, isMobile: true });
    try {
      const page = await noCamera.newPage();
      await walkToOffPart(page, "Q-FRBD", "B1-EBA2");
      await page.getByRole("button", { name: "Scan the off part's label" }).click();
      await page.getByTestId("label-photo-input").setInputFiles(offPng);
      await scanUntil(page, off.serialNumber);
      await page.getByRole("button", { name: "Next" }).click();
      await page.getByRole("button", { name: "Scan the on part's label" }).click();
      await page.getByTestId("label-photo-input").setInputFiles(onPng);
      await scanUntil(page, on.serialNumber);
      await finishSwap(page, on.serialNumber, "swap-photo");

      // Touch targets in the flow: every visible button is at least 44 px high.
      const heights = await page.locator("button:visible, a.btn:visible").evaluateAll((els) => els.map((el) => el.getBoundingClientRect().height));
      expect(Math.min(...heights)).toBeGreaterThanOrEqual(44);
    } finally {
      await noCamera.close();
    }
  });

  it("chooses the position by scanning its position label through the camera, then swaps the parts", async () => {
    const registration = "Q-FRBB";
    const positionCode = "B3-EBA2";
    const off = await fittedAt(registration, positionCode);
    const [on] = await spares(["QF-3242-50", "QF-3242-51"], 1);
    const positionPng = path.join(media.dir, "position.png");
    const offPng = path.join(media.dir, "label-off.png");
    const onPng = path.join(media.dir, "label-on.png");
    writeFileSync(positionPng, await positionLabelPng(registration, positionCode));
    writeFileSync(offPng, (await renderLabelPng({ symbology: "code128", message: encodeIso15434Format06({ partNumber: off.partNumber, serialNumber: off.serialNumber, cage: off.cage }) })).png);
    writeFileSync(onPng, (await renderLabelPng({ symbology: "datamatrix", message: encodeIso15434Format06({ partNumber: on.partNumber, serialNumber: on.serialNumber, cage: await cageOf(on.partNumber) }) })).png);
    const video = path.join(media.dir, "swap-by-position-label.y4m");
    await labelVideo([positionPng, offPng, onPng], video);

    const phone = await launchWithFakeCamera(video, { viewport: PHONE, isMobile: true });
    try {
      const page = await phone.newPage();
      const scan = await openSwapWithoutPosition(page, registration);
      await screenshot(page, "swap-label-1a-position-choice");
      await scan.click();
      await page.getByRole("heading", { name: "Scan the position label" }).waitFor();
      const positionRefusals = await scanPositionUntil(page, positionCode, "swap-label-1b-position-label-read");
      // Part labels the camera saw on the way were refused for what they are.
      for (const refusal of positionRefusals) expect(refusal).toMatch(/This is a part label \(P\/N .*\), not a position label/);

      await expect.poll(() => page.getByTestId("swap-where").textContent()).toContain(positionCode);
      expect(await page.getByTestId("position-chosen-by-label").textContent()).toContain(`${registration} ${positionCode}`);
      expect(await page.getByText("Caution before work").isVisible()).toBe(true);
      await screenshot(page, "swap-label-1c-position-cautions");
      await page.getByLabel(/made safe/).check();
      await page.getByRole("button", { name: "Next" }).click();

      await page.getByRole("button", { name: "Scan the off part's label" }).click();
      const offRefusals = await scanUntil(page, off.serialNumber);
      for (const refusal of offRefusals) expect(refusal).toMatch(/This is a position label \(aircraft Q-FRBB, position B3-EBA2\), not a part label/);
      await expect.poll(() => page.getByTestId("unit-reading").textContent()).toContain(off.serialNumber);
      await screenshot(page, "swap-label-2-off-part");
      await page.getByRole("button", { name: "Next" }).click();

      await page.getByRole("button", { name: "Scan the on part's label" }).click();
      await scanUntil(page, on.serialNumber);
      await finishSwap(page, on.serialNumber, "swap-label");
      expect((await fittedAt(registration, positionCode)).serialNumber).toBe(on.serialNumber);
    } finally {
      await phone.close();
    }
  });

  it("refuses, at the position step, a part label, another aircraft's position label and an unknown position, and a position label at the off-part step", async () => {
    const registration = "Q-FRBB";
    const positionCode = "B4-EBA1";
    const positionPng = path.join(media.dir, "position-photo.png");
    writeFileSync(positionPng, await positionLabelPng(registration, positionCode));

    const noCamera = await launchBrowser({ viewport: PHONE, isMobile: true });
    try {
      const page = await noCamera.newPage();
      const scan = await openSwapWithoutPosition(page, registration);
      await scan.click();
      await page.getByRole("heading", { name: "Scan the position label" }).waitFor();
      const reading = page.getByTestId("scan-reading");
      const typed = page.getByLabel("Type or wedge-scan the label");

      const refusedAs = async (text: string, message: RegExp, name?: string) => {
        await typed.fill(text);
        await page.getByRole("button", { name: "Read this text" }).click();
        await reading.getByRole("alert").waitFor();
        expect(await reading.getByRole("alert").textContent()).toMatch(message);
        expect(await reading.getByRole("button", { name: /Use this/ }).count()).toBe(0);
        if (name) await screenshot(page, name);
        await reading.getByRole("button", { name: "Change the text" }).click();
      };
      await refusedAs("P/N QF-3242-50 S/N EA01234", /This is a part label \(P\/N QF-3242-50, S\/N EA01234\), not a position label/, "swap-label-refused-part-label");
      await refusedAs(`TLPOS1 Q-FRBD ${positionCode}`, /This position label is for aircraft Q-FRBD \(position B4-EBA1\); this swap is on Q-FRBB/, "swap-label-refused-other-aircraft");
      await refusedAs("TLPOS1 Q-FRBB B9-EBA9", /Q-FRBB has no position B9-EBA9 in its layout/);
      await refusedAs("TLPOS1 Q-FRBB", /names registration Q-FRBB but no position code/);

      // A photo of the printed label, no keyboard: the position is chosen.
      await page.getByTestId("label-photo-input").setInputFiles(positionPng);
      await expect.poll(() => reading.getByTestId("reading-position-code").textContent(), { timeout: DECODE_TIMEOUT }).toBe(positionCode);
      expect(await reading.getByTestId("reading-position-name").textContent()).toBe("Brake 4 electric actuator 1");
      await page.getByRole("button", { name: "Use this position" }).click();
      await expect.poll(() => page.getByTestId("swap-where").textContent()).toContain(positionCode);
      await page.getByLabel(/made safe/).check();
      await page.getByRole("button", { name: "Next" }).click();

      // The position label where the off part's label is wanted.
      await page.getByRole("button", { name: "Scan the off part's label" }).click();
      await page.getByTestId("label-photo-input").setInputFiles(positionPng);
      await reading.getByRole("alert").waitFor({ timeout: DECODE_TIMEOUT });
      expect(await reading.getByRole("alert").textContent()).toMatch(
        /This is a position label \(aircraft Q-FRBB, position B4-EBA1\), not a part label\. Scan the label on the unit itself/,
      );
      expect(await reading.getByRole("button", { name: "Use this label" }).count()).toBe(0);
      await screenshot(page, "swap-label-refused-at-off-part");
    } finally {
      await noCamera.close();
    }
  });
});
