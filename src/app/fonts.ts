import localFont from "next/font/local";

// Shipped in fonts/ so nothing is fetched at build or run time.
export const textFont = localFont({
  src: "../../fonts/inter-latin-wght-normal.woff2",
  variable: "--font-text",
  display: "swap",
  weight: "100 900",
});

export const monoFont = localFont({
  src: "../../fonts/jetbrains-mono-latin-wght-normal.woff2",
  variable: "--font-mono",
  display: "swap",
  weight: "100 800",
});
