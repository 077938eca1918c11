"use client";

import JsBarcode from "jsbarcode";
import { useEffect, useRef } from "react";

/** A Code 128 symbol drawn into an SVG in the browser (jsbarcode); the text stays out of the symbol. */
export function Code128Barcode({ value, label }: { value: string; label: string }) {
  const ref = useRef<SVGSVGElement>(null);
  useEffect(() => {
    if (ref.current) JsBarcode(ref.current, value, { format: "CODE128", displayValue: false, margin: 8, height: 60, width: 2 });
  }, [value]);
  return <svg ref={ref} role="img" aria-label={label} className="max-w-full" />;
}
