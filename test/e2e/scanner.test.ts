// The label scanner on a phone-sized Chromium: a fake camera showing our own Code 128 and Data Matrix
// labels, the photo fallback when there is no camera, and typed entry. Labels and their fake-camera
// files are generated per run (test/support/camera.ts). Part numbers, serials and CAGE codes are invented.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { BrowserContext, Page } from "playwright-core";
import { encodeIso15434Format06, encodeIso15434Format06ForCode128, type PartLabelFields } from "../../src/domain/labels";
import { launchBrowser, PHONE, screenshot, signInThroughPage } from "../support/browser";
import { launchWithFakeCamera, makeCameraLabel, mediaDir } from "../support/camera";

const CAMERA_LABEL: PartLabelFields = { cage: "1QTL5", partNumber: "QX-4471-02", serialNumber: "TL58213" };
const MATRIX_LABEL: PartLabelFields = { cage: "2QTL7", partNumber: "QM-2208-11", serialNumber: "TLD90417" };
const PHOTO_LABEL: PartLabelFields = { cage: "3QTL9", partNumber: "QP-6610-04", serialNumber: "TLP33019" };

// Camera start-up is most of the ~1.5 s to a first decode; a loaded shared machine can take far longer.
const DECODE_TIMEOUT = 30_000;
// A string only html5-qrcode's bundle carries: tells its chunk apart from the page's own JavaScript.
const SCANNER_BUNDLE_MARK = "HTML Element with id=";

const media = mediaDir();
afterAll(() => media.remove());

let browser: BrowserContext | null = null;
afterAll(async () => {
  await browser?.close();
});
async function freshBrowser(launch: () => Promise<BrowserContext>): Promise<BrowserContext> {
  await browser?.close();
  browser = await launch();
  return browser;
}

type CameraSpy = { __cameraTracks: MediaStreamTrack[] };

/** Keeps every camera track the page opens, so a test can see that each one was stopped. */
async function spyOnCamera(page: Page): Promise<void> {
  await page.addInitScript(() => {
    const spy = window as unknown as CameraSpy;
    spy.__cameraTracks = [];
    const getUserMedia = navigator.mediaDevices.getUserMedia.bind(navigator.mediaDevices);
    navigator.mediaDevices.getUserMedia = async (constraints) => {
      const stream = await getUserMedia(constraints);
      spy.__cameraTracks.push(...stream.getVideoTracks());
      return stream;
    };
  });
}

/** Script bodies the page has loaded so far. */
function recordScripts(page: Page): Promise<string>[] {
  const bodies: Promise<string>[] = [];
  page.on("response", (response) => {
    if (response.request().resourceType() === "script") bodies.push(response.text().catch(() => ""));
  });
  return bodies;
}

/** Signs in onto Label check and waits until its JavaScript has loaded, so the first click is handled. */
async function gotoLabelCheck(page: Page): Promise<void> {
  await signInThroughPage(page, "technician", "/scan-check");
  await expect.poll(() => page.getByRole("heading", { level: 1 }).textContent()).toBe("Label check");
  await page.waitForLoadState("networkidle");
}

async function openLabelCheck(page: Page): Promise<void> {
  await gotoLabelCheck(page);
  await page.getByRole("button", { name: "Open the scanner" }).click();
  await page.getByRole("heading", { name: "Scan a part label" }).waitFor();
}

async function expectReading(page: Page, fields: PartLabelFields): Promise<void> {
  const reading = page.getByTestId("scan-reading");
  await reading.waitFor({ timeout: DECODE_TIMEOUT });
  expect(await reading.getByTestId("reading-part-number").textContent()).toBe(fields.partNumber);
  expect(await reading.getByTestId("reading-serial-number").textContent()).toBe(fields.serialNumber);
  expect(await reading.getByTestId("reading-cage").textContent()).toBe(fields.cage);
}

async function acceptReading(page: Page): Promise<Record<string, any>> {
  await page.getByRole("button", { name: "Use this label" }).click();
  const result = page.getByTestId("scan-result");
  await result.waitFor();
  return JSON.parse((await result.textContent()) ?? "null");
}

describe("the label scanner on a phone", () => {
  beforeAll(() => {
    // The camera labels must not depend on separators surviving the decoder (see stack.md).
    expect(encodeIso15434Format06ForCode128(CAMERA_LABEL).readableWithoutSeparators).toBe(true);
  });

  it("reads a Code 128 label from the rear camera at decoder width, loaded only when opened", async () => {
    const label = await makeCameraLabel(media.dir, "code128", {
      symbology: "code128",
      message: encodeIso15434Format06ForCode128(CAMERA_LABEL).data,
    });
    const phone = await freshBrowser(() => launchWithFakeCamera(label.y4mFile));
    const page = await phone.newPage();
    await spyOnCamera(page);
    const scripts = recordScripts(page);

    await gotoLabelCheck(page);
    const beforeOpening = scripts.length;
    const initialBodies = await Promise.all(scripts.slice(0, beforeOpening));
    expect(initialBodies.some((body) => body.includes(SCANNER_BUNDLE_MARK))).toBe(false);
    await screenshot(page, "scanner-1-label-check-closed");

    await page.getByRole("button", { name: "Open the scanner" }).click();
    await expectReading(page, CAMERA_LABEL);
    expect(await page.getByTestId("reading-syntax").textContent()).toBe("ISO/IEC 15434 message, format 06");
    expect((await Promise.all(scripts.slice(beforeOpening))).some((body) => body.includes(SCANNER_BUNDLE_MARK))).toBe(true);

    // The decoder's canvas is as wide as the element's layout width; on screen it is shrunk to fit.
    const surface = await page.getByTestId("camera-surface").evaluate((element) => ({
      layoutWidth: element.clientWidth,
      screenWidth: element.getBoundingClientRect().width,
      canvasWidth: element.querySelector("canvas")?.width ?? 0,
    }));
    expect(surface.layoutWidth).toBe(1280);
    expect(surface.canvasWidth).toBe(1280);
    expect(surface.screenWidth).toBeLessThanOrEqual(PHONE.width);
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(PHONE.width);
    await screenshot(page, "scanner-2-code128-reading");

    const result = await acceptReading(page);
    expect(result).toMatchObject({
      source: "camera",
      symbology: "CODE_128",
      parsed: { ok: true, syntax: "iso15434", partNumber: CAMERA_LABEL.partNumber, serialNumber: CAMERA_LABEL.serialNumber, cage: CAMERA_LABEL.cage },
    });
    // Accepting stops the camera: every track the page opened has ended.
    await expect.poll(() => page.evaluate(() => (window as unknown as CameraSpy).__cameraTracks.map((t) => t.readyState))).toEqual(["ended"]);
    await screenshot(page, "scanner-3-code128-accepted");
  });

  it("reads a Data Matrix label carrying the ISO/IEC 15434 message byte for byte", async () => {
    const message = encodeIso15434Format06(MATRIX_LABEL);
    const label = await makeCameraLabel(media.dir, "datamatrix", { symbology: "datamatrix", message });
    const phone = await freshBrowser(() => launchWithFakeCamera(label.y4mFile));
    const page = await phone.newPage();

    await openLabelCheck(page);
    await expectReading(page, MATRIX_LABEL);
    await screenshot(page, "scanner-4-datamatrix-reading");

    const result = await acceptReading(page);
    expect(result).toMatchObject({
      raw: message,
      source: "camera",
      symbology: "DATA_MATRIX",
      parsed: { ok: true, syntax: "iso15434", format: "06", partNumber: MATRIX_LABEL.partNumber, serialNumber: MATRIX_LABEL.serialNumber },
    });
    await screenshot(page, "scanner-5-datamatrix-accepted");
  });

  it("falls back to a photo when there is no camera, and reads the photo", async () => {
    const label = await makeCameraLabel(media.dir, "photo", {
      symbology: "code128",
      message: encodeIso15434Format06ForCode128(PHOTO_LABEL).data,
    });
    // No fake device: getUserMedia finds no camera, as on a desktop without one.
    const phone = await freshBrowser(() => launchBrowser({ viewport: PHONE, isMobile: true }));
    const page = await phone.newPage();

    await openLabelCheck(page);
    const problem = page.getByRole("alert").filter({ hasText: /camera/i });
    await problem.waitFor({ timeout: DECODE_TIMEOUT });
    expect(await problem.textContent()).toMatch(/take a photo of the label/i);
    await screenshot(page, "scanner-6-no-camera");

    const chooser = page.waitForEvent("filechooser");
    await page.getByRole("button", { name: "Take a photo of the label" }).click();
    await (await chooser).setFiles(label.pngFile);
    await expectReading(page, PHOTO_LABEL);
    await screenshot(page, "scanner-7-photo-reading");

    const result = await acceptReading(page);
    expect(result).toMatchObject({
      source: "photo",
      symbology: "CODE_128",
      parsed: { ok: true, partNumber: PHOTO_LABEL.partNumber, serialNumber: PHOTO_LABEL.serialNumber, cage: PHOTO_LABEL.cage },
    });
  });

  it("reads typed text, and says what is missing when the serial is left out", async () => {
    const phone = await freshBrowser(() => launchBrowser({ viewport: PHONE, isMobile: true }));
    const page = await phone.newPage();
    await openLabelCheck(page);
    const field = page.getByLabel("Type or wedge-scan the label");

    await field.fill("P/N QF-0000-01");
    await page.getByRole("button", { name: "Read this text" }).click();
    const refusal = page.getByTestId("scan-reading").getByRole("alert");
    await refusal.waitFor();
    expect(await refusal.textContent()).toMatch(/no serial number/);
    expect(await page.getByRole("button", { name: "Use this label" }).count()).toBe(0);
    await screenshot(page, "scanner-8-typed-refusal");

    await page.getByRole("button", { name: "Change the text" }).click();
    await field.fill("P/N QF-0000-01 S/N ZZ12345");
    await field.press("Enter");
    await page.getByTestId("scan-reading").waitFor();
    expect(await page.getByTestId("reading-part-number").textContent()).toBe("QF-0000-01");
    expect(await page.getByTestId("reading-serial-number").textContent()).toBe("ZZ12345");
    await screenshot(page, "scanner-9-typed-reading");

    const result = await acceptReading(page);
    expect(result).toMatchObject({
      raw: "P/N QF-0000-01 S/N ZZ12345",
      source: "typed",
      symbology: null,
      parsed: { ok: true, syntax: "plain", partNumber: "QF-0000-01", serialNumber: "ZZ12345", cage: null },
    });
    await screenshot(page, "scanner-10-typed-accepted");
  });
});
