// Reads a printed label symbol back from its PNG in Node: a small PNG reader (node:zlib, 8-bit
// non-interlaced images, which is what bwip-js and Chromium screenshots write) feeding the ZXing
// decoder that html5-qrcode ships (its third_party UMD bundle of @zxing/library), so the test reads
// labels with the same decoder the camera scanner uses in the browser.
import { createRequire } from "node:module";
import zlib from "node:zlib";

const require = createRequire(import.meta.url);
// eslint-disable-next-line @typescript-eslint/no-require-imports
const ZXing = require("html5-qrcode/third_party/zxing-js.umd.js");

export interface GreyImage {
  width: number;
  height: number;
  luminance: Uint8ClampedArray;
}

const CHANNELS: Record<number, number> = { 0: 1, 2: 3, 4: 2, 6: 4 };

export function readPng(png: Buffer): GreyImage {
  if (png.subarray(0, 8).toString("hex") !== "89504e470d0a1a0a") throw new Error("not a PNG");
  let offset = 8;
  let width = 0;
  let height = 0;
  let channels = 0;
  const idat: Buffer[] = [];
  while (offset < png.length) {
    const length = png.readUInt32BE(offset);
    const type = png.toString("ascii", offset + 4, offset + 8);
    const data = png.subarray(offset + 8, offset + 8 + length);
    if (type === "IHDR") {
      width = data.readUInt32BE(0);
      height = data.readUInt32BE(4);
      if (data[8] !== 8 || data[12] !== 0) throw new Error("only 8-bit, non-interlaced PNGs are read here");
      channels = CHANNELS[data[9]];
      if (!channels) throw new Error(`PNG colour type ${data[9]} is not read here`);
    }
    if (type === "IDAT") idat.push(data);
    offset += 12 + length;
  }
  const raw = zlib.inflateSync(Buffer.concat(idat));
  const stride = width * channels;
  const pixels = Buffer.alloc(stride * height);
  for (let y = 0; y < height; y++) {
    const filter = raw[y * (stride + 1)];
    const line = raw.subarray(y * (stride + 1) + 1, (y + 1) * (stride + 1));
    for (let x = 0; x < stride; x++) {
      const left = x >= channels ? pixels[y * stride + x - channels] : 0;
      const up = y > 0 ? pixels[(y - 1) * stride + x] : 0;
      const upLeft = x >= channels && y > 0 ? pixels[(y - 1) * stride + x - channels] : 0;
      let value = line[x];
      if (filter === 1) value += left;
      else if (filter === 2) value += up;
      else if (filter === 3) value += (left + up) >> 1;
      else if (filter === 4) {
        const p = left + up - upLeft;
        const pa = Math.abs(p - left);
        const pb = Math.abs(p - up);
        const pc = Math.abs(p - upLeft);
        value += pa <= pb && pa <= pc ? left : pb <= pc ? up : upLeft;
      }
      pixels[y * stride + x] = value & 0xff;
    }
  }
  const luminance = new Uint8ClampedArray(width * height);
  for (let i = 0; i < width * height; i++) {
    const p = i * channels;
    const grey = channels >= 3 ? (pixels[p] * 299 + pixels[p + 1] * 587 + pixels[p + 2] * 114) / 1000 : pixels[p];
    const alpha = channels === 4 ? pixels[p + 3] / 255 : channels === 2 ? pixels[p + 1] / 255 : 1;
    // Transparent pixels count as white paper.
    luminance[i] = Math.round(grey * alpha + 255 * (1 - alpha));
  }
  return { width, height, luminance };
}

export type Symbology = "datamatrix" | "code128";

/** The text a symbol in the PNG carries, exactly as the decoder returns it (control characters included). */
export function decodeSymbol(png: Buffer, symbology: Symbology): string {
  const { width, height, luminance } = readPng(png);
  const source = new ZXing.RGBLuminanceSource(luminance, width, height);
  const bitmap = new ZXing.BinaryBitmap(new ZXing.HybridBinarizer(source));
  const hints = new Map();
  hints.set(ZXing.DecodeHintType.TRY_HARDER, true);
  hints.set(ZXing.DecodeHintType.POSSIBLE_FORMATS, [symbology === "datamatrix" ? ZXing.BarcodeFormat.DATA_MATRIX : ZXing.BarcodeFormat.CODE_128]);
  const reader = new ZXing.MultiFormatReader();
  reader.setHints(hints);
  return reader.decode(bitmap).getText();
}
