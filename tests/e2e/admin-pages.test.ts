import type { Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { launchChromium, screenshot } from "./support/chromium";
import { DEMO } from "./support/demo";
import { signedInWindow } from "./support/session";

let browser: Browser;
beforeAll(async () => {
  browser = await launchChromium();
});
afterAll(async () => {
  await browser?.close();
});

describe("admin pages", () => {
  for (const [who, viewport] of [["student", "desktop"], ["student", "phone"], ["teacher", "desktop"], ["parent", "desktop"]] as const) {
    it(`show a ${who} the 403 page, with status 403 (${viewport})`, async () => {
      const { context, page } = await signedInWindow(browser, who, viewport);
      const res = await page.goto("/admin/people");
      expect(res?.status()).toBe(403);
      expect(await page.getByRole("heading", { level: 1 }).textContent()).toBe("This page is not for your role");
      if (who === "student") await screenshot(page, "forbidden-student-admin-people");
      await context.close();
    });
  }

  it("open for an admin", async () => {
    const { context, page } = await signedInWindow(browser, "admin");
    const res = await page.goto("/admin/people");
    expect(res?.status()).toBe(200);
    // The list loads after the page: wait for the admin's own row, which links to their page.
    await page.getByRole("main").getByRole("link", { name: DEMO.admin.name, exact: true }).waitFor();
    await screenshot(page, "admin-people");
    await context.close();
  });
});
