"use client";

import JsBarcode from "jsbarcode";
import { useEffect, useRef } from "react";

/**
 * Code 128 drawn by jsbarcode into an SVG, so it prints as sharp vectors. RS, GS and EOT in `data`
 * are encoded as literal code set A characters (never FNC1), which decoders pass through.
 */
export function Code128Barcode({ data, label, className }: { data: string; label: string; className?: string }) {
  const svg = useRef<SVGSVGElement>(null);
  useEffect(() => {
    if (!svg.current) return;
    JsBarcode(svg.current, data, { format: "CODE128", displayValue: false, margin: 10, width: 2, height: 60, background: "#ffffff", lineColor: "#000000" });
    // Fill the box the label gives it; the quiet zones scale with the bars.
    svg.current.removeAttribute("width");
    svg.current.removeAttribute("height");
    svg.current.setAttribute("preserveAspectRatio", "none");
  }, [data]);
  return <svg ref={svg} role="img" aria-label={label} className={className} data-symbol="code128" />;
}
