import type { Metadata, Viewport } from "next";
import type { ReactNode } from "react";
import { monoFont, textFont } from "./fonts";
import "./globals.css";
import { Providers } from "./providers";

export const metadata: Metadata = {
  title: { default: "Threadline", template: "%s · Threadline" },
  description: "Component removals, installations and serial traceability for line maintenance.",
};

export const viewport: Viewport = {
  width: "device-width",
  initialScale: 1,
  themeColor: [
    { media: "(prefers-color-scheme: light)", color: "#12475b" },
    { media: "(prefers-color-scheme: dark)", color: "#08222d" },
  ],
};

// Sets the theme class before the first paint, from the user's choice or the system preference.
const themeScript = `try{var t=localStorage.getItem("threadline-theme");if(t==="dark"||(!t&&matchMedia("(prefers-color-scheme: dark)").matches))document.documentElement.classList.add("dark")}catch(e){}`;

export default function RootLayout({ children }: { children: ReactNode }) {
  return (
    <html lang="en" className={`${textFont.variable} ${monoFont.variable}`} suppressHydrationWarning>
      <head>
        <script dangerouslySetInnerHTML={{ __html: themeScript }} />
      </head>
      <body className="font-sans antialiased">
        <Providers>{children}</Providers>
      </body>
    </html>
  );
}
