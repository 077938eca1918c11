"use client";

// The scanner, loaded only when a technician opens it. html5-qrcode and its bundled decoder are a few
// hundred KB of JavaScript; importing them statically would put them in the initial JavaScript of every
// page that can scan (the swap page must stay under 200 KB gzip before the scanner opens). `ssr: false`
// because the camera and the decoder exist only in the browser.
import dynamic from "next/dynamic";
import type { LabelScannerProps } from "./label-scanner";

export const LazyLabelScanner = dynamic<LabelScannerProps>(() => import("./label-scanner").then((module) => module.LabelScanner), {
  ssr: false,
  loading: () => (
    <p role="status" className="panel p-4 text-lg font-semibold">
      Loading the scanner…
    </p>
  ),
});

export type { LabelScannerProps, LabelScan, ScanTarget } from "./label-scanner";
