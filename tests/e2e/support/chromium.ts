import path from "node:path";
import { chromium, type Browser, type BrowserContext, type Page } from "playwright-core";
import { expect, inject } from "vitest";

/** Debian's Chromium; playwright's own browser downloads are not used. */
export const CHROMIUM_PATH = "/usr/bin/chromium";

const ARGS = ["--headless", "--no-sandbox", "--disable-gpu", "--disable-quic", "--no-first-run", "--disable-background-networking", "--disable-component-update", "--disable-sync"];

export const VIEWPORTS = {
  desktop: { width: 1280, height: 860 },
  phone: { width: 390, height: 844 },
} as const;
export type ViewportName = keyof typeof VIEWPORTS;

/** A fresh browser with its own temporary profile (under TMPDIR, which points into tests/.tmp). */
export function launchChromium(): Promise<Browser> {
  return chromium.launch({ executablePath: CHROMIUM_PATH, args: ARGS });
}

export const baseURL = () => inject("baseURL");

/** A new signed-out browser window at the given width, pointed at the test server. */
export function newWindow(browser: Browser, viewport: ViewportName = "desktop"): Promise<BrowserContext> {
  return browser.newContext({
    baseURL: baseURL(),
    viewport: VIEWPORTS[viewport],
    deviceScaleFactor: 1,
    isMobile: viewport === "phone",
    hasTouch: viewport === "phone",
    locale: "en-GB",
    timezoneId: "Europe/London",
  });
}

/**
 * Collects uncaught script errors and console errors of a page, so that a test can assert the
 * page ran cleanly. The browser's own "Failed to load resource" lines for expected 4xx answers
 * are left out.
 */
export function watchErrors(page: Page): string[] {
  const errors: string[] = [];
  page.on("pageerror", (e) => errors.push(`pageerror: ${e.message}`));
  page.on("console", (m) => {
    if (m.type() === "error" && !m.text().startsWith("Failed to load resource")) errors.push(`console: ${m.text()}`);
  });
  return errors;
}

/** Saves a full-page PNG as tests/.tmp/screenshots/<name>-<viewport>.png. */
export async function screenshot(page: Page, name: string): Promise<string> {
  const width = page.viewportSize()?.width;
  const tag = (Object.keys(VIEWPORTS) as ViewportName[]).find((k) => VIEWPORTS[k].width === width) ?? `${width}px`;
  const file = path.join(inject("screenshotDir"), `${name}-${tag}.png`);
  await page.screenshot({ path: file, fullPage: true });
  return file;
}

/** Fails the test with the collected errors, if any. */
export function expectNoErrors(errors: string[]) {
  expect(errors, "script or console errors on the page").toEqual([]);
}
