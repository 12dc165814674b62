import type { Browser } from "playwright-core";
import { expect } from "vitest";
import { newWindow, watchErrors, type ViewportName } from "./chromium";
import { DEMO, DEMO_PASSWORD, type DemoKey } from "./demo";
import { AppShell, HomePage, SignInPage } from "./pages";

/** A fresh window signed in through the sign-in page as a demo person, left on their home page. */
export async function signedInWindow(browser: Browser, who: DemoKey, viewport: ViewportName = "desktop", password = DEMO_PASSWORD) {
  const context = await newWindow(browser, viewport);
  const page = await context.newPage();
  const errors = watchErrors(page);
  const signIn = new SignInPage(page);
  await signIn.open();
  await signIn.signIn(DEMO[who].email, password);
  expect(new URL(page.url()).pathname).toBe("/");
  return { context, page, errors, home: new HomePage(page), shell: new AppShell(page) };
}
