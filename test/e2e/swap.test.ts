import { execFile } from "node:child_process";
import { writeFileSync } from "node:fs";
import path from "node:path";
import { promisify } from "node:util";
import type { BrowserContext, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { encodeIso15434Format06 } from "../../src/domain/labels";
import { testDb } from "../support/api";
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

/** A looping fake-camera video: the off label (Code 128) for two seconds, then the on label (Data Matrix). */
async function twoLabelVideo(offPng: string, onPng: string, out: string) {
  const pad = `pad=ceil(iw/2)*2:ceil(ih/2)*2:0:0:color=white,pad=${FRAME.width}:${FRAME.height}:(ow-iw)/2:(oh-ih)/2:color=white,format=yuv420p,fps=5`;
  await run("ffmpeg", [
    "-y", "-loglevel", "error",
    "-loop", "1", "-t", "2", "-i", offPng,
    "-loop", "1", "-t", "2", "-i", onPng,
    "-filter_complex", `[0]${pad}[a];[1]${pad}[b];[a][b]concat=n=2:v=1[v]`,
    "-map", "[v]", "-f", "yuv4mpegpipe", out,
  ]);
}

/** Reads labels until the expected serial shows (the video alternates between two labels), then accepts. */
async function scanUntil(page: Page, serial: string) {
  const reading = page.getByTestId("scan-reading");
  for (let attempt = 0; attempt < 6; attempt++) {
    await reading.waitFor({ timeout: DECODE_TIMEOUT });
    if ((await reading.getByTestId("reading-serial-number").textContent()) === serial) {
      await page.getByRole("button", { name: "Use this label" }).click();
      return;
    }
    await reading.getByRole("button", { name: "Scan again" }).click();
  }
  throw new Error(`the scanner never read ${serial}`);
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
    await twoLabelVideo(offPng, onPng, video);

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
});
