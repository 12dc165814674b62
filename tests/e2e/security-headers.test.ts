import Database from "better-sqlite3";
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { baseURL, launchChromium } from "./support/chromium";
import { DEMO } from "./support/demo";
import { signedInWindow } from "./support/session";

/**
 * The Content-Security-Policy and the other security headers, in a real browser against the
 * production build: the pages with the most moving parts (the write-up with its results graph,
 * the practical editor with TipTap and a KaTeX formula, the marking desk, the progress chart)
 * must run with no policy violation at all.
 */

const WAIT = { timeout: 20_000 };
let browser: Browser;
beforeAll(async () => {
  browser = await launchChromium();
});
afterAll(async () => {
  await browser?.close();
});

/** Records every CSP violation the page reports (the event, and the console line Chromium prints). */
async function watchPolicy(page: Page): Promise<() => Promise<string[]>> {
  const lines: string[] = [];
  page.on("console", (m) => {
    if (/Content Security Policy|Refused to (load|execute|apply|connect|frame)/i.test(m.text())) lines.push(`console: ${m.text()}`);
  });
  await page.addInitScript(() => {
    const w = window as unknown as { __cspViolations: string[] };
    w.__cspViolations = [];
    document.addEventListener("securitypolicyviolation", (e) => w.__cspViolations.push(`${e.violatedDirective} blocked ${e.blockedURI || "inline"} (${e.sourceFile}:${e.lineNumber})`));
  });
  return async () => [...lines, ...((await page.evaluate(() => (window as unknown as { __cspViolations?: string[] }).__cspViolations ?? [])) as string[])];
}

/** Rows from the test server's database (read-only). */
function query<T>(sql: string, ...args: unknown[]): T {
  const db = new Database(inject("databasePath"), { readonly: true, fileMustExist: true });
  try {
    return db.prepare(sql).get(...args) as T;
  } finally {
    db.close();
  }
}

describe("security headers in a real browser", () => {
  it("every page carries a nonce policy and the other headers; route handlers a policy that runs nothing", async () => {
    const page = await fetch(`${baseURL()}/sign-in`);
    const csp = page.headers.get("content-security-policy") ?? "";
    expect(csp).toMatch(/script-src 'self' 'nonce-[A-Za-z0-9+/=]+' 'strict-dynamic'/);
    expect(csp).not.toContain("unsafe-eval");
    expect(csp).toContain("frame-ancestors 'none'");
    // The local S3 server: asked for on "any free port", scripts/serve.mjs chose one for every
    // worker, so the policy names exactly that port.
    expect(csp).toMatch(/connect-src 'self' http:\/\/127\.0\.0\.1:\d+;/);
    expect(page.headers.get("x-content-type-options")).toBe("nosniff");
    expect(page.headers.get("referrer-policy")).toBe("same-origin");
    expect(page.headers.get("x-frame-options")).toBe("DENY");
    expect(page.headers.get("permissions-policy")).toMatch(/camera=\(self\)/);
    // The nonce in the header is the one on the page's scripts, and changes on every response.
    const html = await page.text();
    const nonce = /'nonce-([^']+)'/.exec(csp)![1]!;
    expect(html).toContain(`nonce="${nonce}"`);
    const again = await fetch(`${baseURL()}/sign-in`);
    expect(again.headers.get("content-security-policy")).not.toContain(nonce);
    const api = await fetch(`${baseURL()}/api/me`);
    expect(api.status).toBe(401);
    expect(api.headers.get("content-security-policy")).toMatch(/^default-src 'none'/);
    expect(api.headers.get("x-content-type-options")).toBe("nosniff");
  });

  it("the student's write-up with its results graph and the progress chart run with no violation", async () => {
    const row = query<{ labSessionId: string } | undefined>(
      `SELECT w.lab_session_id AS labSessionId FROM write_ups w JOIN users u ON u.id = w.student_id
       WHERE u.email = ? AND w.status = 'returned' ORDER BY w.updated_at DESC LIMIT 1`,
      DEMO.student.email,
    );
    expect(row, "the demo student has returned work").toBeTruthy();
    const { context, page } = await signedInWindow(browser, "student");
    const violations = await watchPolicy(page);
    await page.goto(`/lab-sessions/${row!.labSessionId}/write-up`);
    await page.locator("canvas").first().waitFor(WAIT);
    await page.waitForLoadState("networkidle");
    await page.goto("/progress");
    await page.locator("canvas").first().waitFor(WAIT);
    await page.waitForLoadState("networkidle");
    expect(await violations()).toEqual([]);
    await context.close();
  });

  it("the practical editor (TipTap) with a KaTeX formula runs with no violation", async () => {
    const { context, page } = await signedInWindow(browser, "teacher");
    const violations = await watchPolicy(page);
    const created = await page.request.post("/api/practicals", { data: { title: "CSP check: density", topic: "Density", yearGroup: 9, subject: "Physics" } });
    expect(created.status()).toBe(201);
    const { practicalId, versionId } = (await created.json()) as { practicalId: string; versionId: string };
    await page.goto(`/practicals/${practicalId}/versions/${versionId}/edit`);
    await page.getByRole("navigation", { name: "Sections of the practical" }).getByRole("link", { name: /Method/ }).click();
    const editor = page.getByRole("textbox", { name: "Method" });
    await editor.waitFor(WAIT);
    await editor.click();
    await page.keyboard.type("Density is mass over volume: ");
    await page.getByRole("toolbar", { name: "Method" }).getByRole("button", { name: "Formula", exact: true }).click();
    await page.getByLabel("Formula (LaTeX)").fill("\\rho = \\frac{m}{V}");
    await page.getByTestId("formula-preview").locator(".katex").waitFor(WAIT);
    await page.getByRole("button", { name: "Insert formula" }).click();
    await editor.locator(".katex").first().waitFor(WAIT);
    // KaTeX's fonts come from this origin: the formula is drawn with them, not a fallback.
    await page.waitForLoadState("networkidle");
    expect(await page.evaluate(() => document.fonts.check("16px KaTeX_Main"))).toBe(true);
    expect(await violations()).toEqual([]);
    await context.close();
  });

  it("the marking desk runs with no violation", async () => {
    const row = query<{ labSessionId: string; writeUpId: string } | undefined>(
      `SELECT w.lab_session_id AS labSessionId, w.id AS writeUpId FROM write_ups w
       JOIN lab_sessions ls ON ls.id = w.lab_session_id JOIN class_teachers ct ON ct.class_id = ls.class_id
       JOIN users t ON t.id = ct.teacher_id
       WHERE t.email = ? AND w.status <> 'draft' ORDER BY w.status = 'returned', w.submitted_at DESC LIMIT 1`,
      DEMO.teacher.email,
    );
    expect(row, "the demo teacher has work to mark").toBeTruthy();
    const { context, page } = await signedInWindow(browser, "teacher");
    const violations = await watchPolicy(page);
    await page.goto(`/marking/${row!.labSessionId}/${row!.writeUpId}`);
    await page.getByRole("heading", { level: 1 }).waitFor(WAIT);
    await page.waitForLoadState("networkidle");
    expect(await violations()).toEqual([]);
    await context.close();
  });
});
