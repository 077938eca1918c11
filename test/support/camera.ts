// Fake-camera fixtures for the scanner's end-to-end tests: a label PNG rendered with bwip-js, turned into
// a one-frame .y4m that Chromium's fake capture device loops, and a Chromium launched on that file.
// Everything is generated into a temporary directory at test time; no media is committed.
import { execFile } from "node:child_process";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { promisify } from "node:util";
import bwipjs from "bwip-js/node";
import type { BrowserContext } from "playwright-core";
import { launchBrowser, PHONE } from "./browser";

const run = promisify(execFile);

/** The frame Chromium's fake camera delivers; the label is centred on white inside it. */
export const FRAME = { width: 1280, height: 720 };

export type LabelSymbology = "code128" | "datamatrix" | "qrcode";

export interface LabelImageOptions {
  symbology: LabelSymbology;
  /** The exact message, control characters (RS, GS, EOT) as real characters. */
  message: string;
  /**
   * Image pixels per module (narrow bar or matrix cell), at most; the largest that still fits the frame
   * is used. bwip-js takes whole scales only, so 2D symbols get even sizes. Defaults: 2 for Code 128 (a format 06 message is
   * about 480 modules wide, 3 px would not fit in 1280); 4 for Data Matrix and QR, because a Data Matrix
   * at 2 px per cell did not decode from the fake camera here while 4 and 6 did.
   */
  modulePixels?: number;
}

export interface LabelImage {
  png: Buffer;
  width: number;
  height: number;
  modulePixels: number;
}

// Ten modules of quiet zone all round: the Code 128 minimum, and ample for the 2D symbols.
const QUIET_ZONE_MODULES = 10;

function pngSize(png: Buffer): { width: number; height: number } {
  // IHDR is always the first chunk: width and height are big-endian at bytes 16 and 20.
  return { width: png.readUInt32BE(16), height: png.readUInt32BE(20) };
}

// bwip-js draws a linear module 1 px and a 2D module 2 px wide at scale 1.
const pixelsPerModuleAtScale1 = (symbology: LabelSymbology) => (symbology === "code128" ? 1 : 2);

async function renderAtScale(options: LabelImageOptions, scale: number): Promise<LabelImage> {
  const linear = options.symbology === "code128";
  const png = await bwipjs.toBuffer({
    bcid: options.symbology,
    // Literal RS/GS/EOT: bwip-js encodes them as Code 128 set A characters (a decoder returns them
    // unchanged) and compresses the 15434 wrapper into the Data Matrix Macro 06 codeword.
    text: options.message,
    scale,
    // Bar height in millimetres: tall bars survive a camera held at a slight tilt.
    ...(linear ? { height: 18 } : {}),
    padding: QUIET_ZONE_MODULES * pixelsPerModuleAtScale1(options.symbology),
    backgroundcolor: "FFFFFF",
    includetext: false,
  });
  return { png, ...pngSize(png), modulePixels: scale * pixelsPerModuleAtScale1(options.symbology) };
}

/** A label PNG that fits the fake camera frame, at the largest module size up to `modulePixels`. */
export async function renderLabelPng(options: LabelImageOptions): Promise<LabelImage> {
  const modulePixels = options.modulePixels ?? (options.symbology === "code128" ? 2 : 4);
  const maxScale = Math.max(1, Math.floor(modulePixels / pixelsPerModuleAtScale1(options.symbology)));
  for (let scale = maxScale; scale >= 1; scale--) {
    const image = await renderAtScale(options, scale);
    if (image.width <= FRAME.width && image.height <= FRAME.height) return image;
  }
  throw new Error(`The ${options.symbology} label for ${JSON.stringify(options.message)} does not fit a ${FRAME.width}x${FRAME.height} frame even at scale 1.`);
}

/**
 * Converts a label PNG (at most the frame size) into a one-frame .y4m, centred on white.
 * An odd width or height is first padded by one white pixel: yuv420p needs even sizes, and padding
 * keeps every bar sharp where scaling would blur them.
 */
export async function pngToY4m(pngFile: string, y4mFile: string): Promise<void> {
  const filter = [
    "pad=ceil(iw/2)*2:ceil(ih/2)*2:0:0:color=white",
    `pad=${FRAME.width}:${FRAME.height}:(ow-iw)/2:(oh-ih)/2:color=white`,
    "format=yuv420p",
  ].join(",");
  await run("ffmpeg", ["-y", "-loglevel", "error", "-i", pngFile, "-vf", filter, "-frames:v", "1", "-f", "yuv4mpegpipe", y4mFile]);
}

export interface CameraLabel extends LabelImage {
  pngFile: string;
  y4mFile: string;
}

/** Renders the label into `dir` as `<name>.png` and `<name>.y4m`. */
export async function makeCameraLabel(dir: string, name: string, options: LabelImageOptions): Promise<CameraLabel> {
  const image = await renderLabelPng(options);
  const pngFile = path.join(dir, `${name}.png`);
  const y4mFile = path.join(dir, `${name}.y4m`);
  writeFileSync(pngFile, image.png);
  await pngToY4m(pngFile, y4mFile);
  return { ...image, pngFile, y4mFile };
}

/** A fresh temporary directory for generated media, and a function that removes it. */
export function mediaDir(): { dir: string; remove: () => void } {
  const dir = mkdtempSync(path.join(os.tmpdir(), "threadline-camera-"));
  return { dir, remove: () => rmSync(dir, { recursive: true, force: true }) };
}

/**
 * A phone-sized Chromium whose camera shows `y4mFile` (an absolute path). The file is fixed for the
 * life of the browser, so each label needs its own launch.
 */
export async function launchWithFakeCamera(
  y4mFile: string,
  options: { viewport?: { width: number; height: number }; isMobile?: boolean } = {},
): Promise<BrowserContext> {
  if (!path.isAbsolute(y4mFile)) throw new Error(`The fake camera needs an absolute path, not ${y4mFile}.`);
  return launchBrowser({
    viewport: options.viewport ?? PHONE,
    isMobile: options.isMobile ?? true,
    extraArgs: [
      "--use-fake-ui-for-media-stream",
      "--use-fake-device-for-media-stream",
      `--use-file-for-fake-video-capture=${y4mFile}`,
    ],
  });
}
