// Headless Debian Chromium driven by playwright-core, for the end-to-end suites.
import { mkdirSync, mkdtempSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { chromium, type BrowserContext, type Page } from "playwright-core";
import { DEMO_PASSWORD, demoEmail } from "../../seeds/lib/demo";
import type { Role } from "../../src/lib/roles";
import { appUrl } from "./api";

export const ARTIFACTS = path.resolve(import.meta.dirname, "..", "..", "test-artifacts");

export const PHONE = { width: 390, height: 844 };
export const DESKTOP = { width: 1440, height: 900 };

export async function launchBrowser(
  options: { viewport?: { width: number; height: number }; extraArgs?: string[]; isMobile?: boolean } = {},
): Promise<BrowserContext> {
  const profile = mkdtempSync(path.join(os.tmpdir(), "threadline-chromium-"));
  return chromium.launchPersistentContext(profile, {
    executablePath: "/usr/bin/chromium",
    headless: true,
    viewport: options.viewport ?? DESKTOP,
    isMobile: options.isMobile,
    hasTouch: options.isMobile,
    baseURL: appUrl(),
    args: [
      "--headless",
      "--no-sandbox",
      "--disable-gpu",
      "--disable-quic",
      "--no-first-run",
      "--disable-background-networking",
      "--disable-component-update",
      "--disable-sync",
      ...(options.extraArgs ?? []),
    ],
  });
}

export async function screenshot(page: Page, name: string): Promise<string> {
  mkdirSync(ARTIFACTS, { recursive: true });
  const file = path.join(ARTIFACTS, `${name}.png`);
  await page.screenshot({ path: file, fullPage: true });
  return file;
}

/** Signs in through the real sign-in page, as a person would. */
export async function signInThroughPage(page: Page, role: Role, next = "/"): Promise<void> {
  await page.goto(`/sign-in?next=${encodeURIComponent(next)}`);
  await page.getByLabel("E-mail address").fill(demoEmail(role));
  await page.getByLabel("Password").fill(DEMO_PASSWORD);
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.waitForURL((url) => !url.pathname.startsWith("/sign-in"));
}
