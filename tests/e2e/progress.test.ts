import fs from "node:fs";
import Database from "better-sqlite3";
import { PDFParse } from "pdf-parse";
import type { Browser, Download, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { expectNoErrors, launchChromium, screenshot } from "./support/chromium";
import { DEMO } from "./support/demo";
import { signedInWindow } from "./support/session";
import { classIdByName } from "./support/test-database";

const WAIT = { timeout: 20_000 };

let browser: Browser;
beforeAll(async () => {
  browser = await launchChromium();
});
afterAll(async () => {
  await browser?.close();
});

function withDb<T>(fn: (db: Database.Database) => T): T {
  const db = new Database(inject("databasePath"), { readonly: true, fileMustExist: true });
  try {
    return fn(db);
  } finally {
    db.close();
  }
}

type Returned = { title: string; total: number; maxTotal: number; feedback: string };

/** A demo student's id, and their returned work with the marks as stored (the adjusted total where moderation changed it). */
function studentWork(email: string): { id: string; name: string; returned: Returned[] } {
  return withDb((db) => {
    const student = db.prepare("SELECT id, name FROM users WHERE email = ?").get(email) as { id: string; name: string };
    const returned = db
      .prepare(
        `SELECT pv.title, coalesce(m.adjusted_total, m.total) AS total, m.max_total AS maxTotal, m.feedback FROM write_ups w
         JOIN marks m ON m.write_up_id = w.id JOIN practical_versions pv ON pv.id = w.practical_version_id
         WHERE w.student_id = ? AND w.status = 'returned'`,
      )
      .all(student.id) as Returned[];
    return { ...student, returned };
  });
}

/** "n out of m marks (p%)": the wording of components/progress/words.ts, with the figures from the stored marks. */
const marksWords = (r: Returned) => new RegExp(`^${r.total} out of ${r.maxTotal} marks \\(`);

async function expectNoSidewaysScroll(page: Page) {
  const { scroll, client } = await page.evaluate(() => ({ scroll: document.documentElement.scrollWidth, client: document.documentElement.clientWidth }));
  expect(scroll, "the page scrolls sideways").toBeLessThanOrEqual(client);
}

async function downloaded(download: Download): Promise<Buffer> {
  const file = await download.path();
  return fs.readFileSync(file);
}

describe("a parent's view of their children", () => {
  for (const viewport of ["desktop", "phone"] as const) {
    it(`${viewport}: one card per linked child with returned marks and feedback, the full report, and the PDF`, async () => {
      const ellis = studentWork(DEMO.student.email);
      const noor = studentWork("noor.marchetti@cobalt-lane.example");
      expect(ellis.returned.length, "the demo has returned work for Ellis").toBeGreaterThan(0);
      const { context, page, errors } = await signedInWindow(browser, "parent", viewport);

      // The home page: exactly the two linked children.
      const family = page.getByRole("region", { name: "Your children" });
      await family.waitFor(WAIT);
      const cards = family.getByRole("article");
      expect(await cards.count()).toBe(2);
      for (const child of [ellis, noor]) {
        const card = cards.filter({ has: page.getByRole("heading", { name: child.name, exact: true }) });
        for (const r of child.returned) {
          const item = card.getByRole("listitem").filter({ hasText: r.title });
          expect(await item.getByText(marksWords(r)).isVisible(), `${child.name}: ${r.title}`).toBe(true);
          if (r.feedback.trim()) expect(await item.getByText(r.feedback.trim()).isVisible()).toBe(true);
        }
      }
      await expectNoSidewaysScroll(page);
      await screenshot(page, "progress-parent-home");

      // Ellis's full report: marks per skill, the chart, the glossary, and no calculation checks (those are for the student and staff).
      await cards.filter({ has: page.getByRole("heading", { name: ellis.name, exact: true }) }).getByRole("link", { name: "Ellis's full progress report" }).click();
      await page.waitForURL(`**/children/${ellis.id}`);
      expect(await page.getByRole("heading", { level: 1 }).textContent()).toBe(`${ellis.name}: practical science`);
      for (const r of ellis.returned) {
        const card = page.getByRole("article").filter({ has: page.getByRole("heading", { name: r.title }) });
        expect(await card.getByText(marksWords(r)).isVisible()).toBe(true);
      }
      await page.getByRole("region", { name: "Skills over the year" }).locator("canvas").waitFor(WAIT);
      expect(await page.getByRole("heading", { name: "Calculation checks" }).count()).toBe(0);
      expect(await page.locator("#glossary").isVisible()).toBe(true);
      await expectNoSidewaysScroll(page);
      await screenshot(page, "progress-parent-report");

      // The term report downloads as a PDF with the child's name in its text.
      const [download] = await Promise.all([page.waitForEvent("download"), page.getByRole("link", { name: "Download the term report (PDF)" }).click()]);
      expect(download.suggestedFilename()).toMatch(/\.pdf$/);
      const pdf = await downloaded(download);
      expect(pdf.subarray(0, 5).toString("latin1")).toBe("%PDF-");
      const parser = new PDFParse({ data: new Uint8Array(pdf) });
      const { text } = await parser.getText();
      await parser.destroy();
      expect(text).toContain(ellis.name);

      // Someone else's child is not found.
      const other = withDb((db) => db.prepare("SELECT u.id FROM users u JOIN class_students cs ON cs.student_id = u.id JOIN classes c ON c.id = cs.class_id WHERE c.name = '10D Chemistry' LIMIT 1").get() as { id: string });
      const res = await page.goto(`/children/${other.id}`);
      expect(res?.status()).toBe(404);
      expectNoErrors(errors);
      await context.close();
    });
  }
});

describe("a student's own progress", () => {
  for (const viewport of ["desktop", "phone"] as const) {
    it(`${viewport}: returned marks, skills and their calculation history`, async () => {
      const ellis = studentWork(DEMO.student.email);
      const { context, page, errors } = await signedInWindow(browser, "student", viewport);
      await page.goto("/progress");
      expect(await page.getByRole("heading", { level: 1 }).textContent()).toBe("Your progress in practical science");
      for (const r of ellis.returned) {
        const card = page.getByRole("article").filter({ has: page.getByRole("heading", { name: r.title }) });
        expect(await card.getByText(marksWords(r)).isVisible()).toBe(true);
      }
      const checks = page.getByRole("region", { name: "Your calculations" });
      await checks.waitFor(WAIT);
      await page.getByRole("region", { name: "Skills over the year" }).locator("canvas").waitFor(WAIT);
      await expectNoSidewaysScroll(page);
      await screenshot(page, "progress-student");
      expectNoErrors(errors);
      await context.close();
    });
  }
});

describe("a class's progress for its teacher", () => {
  it("every student of 10C, filters, and the CSV export with a row per student", async () => {
    const classId = classIdByName("10C Chemistry");
    const roster = withDb((db) => db.prepare("SELECT u.name FROM class_students cs JOIN users u ON u.id = cs.student_id WHERE cs.class_id = ?").all(classId) as { name: string }[]).map((r) => r.name);
    const { context, page, errors } = await signedInWindow(browser, "teacher");
    await page.goto("/progress/classes");
    await page.getByRole("link", { name: /^10C Chemistry/ }).click();
    await page.waitForURL(`**/progress/classes/${classId}`);
    expect(await page.getByRole("heading", { level: 1 }).textContent()).toBe("10C Chemistry");
    const table = page.getByRole("table", { name: "Progress of each student in 10C Chemistry" });
    await table.waitFor(WAIT);
    expect(await table.locator("tbody tr").count()).toBe(roster.length);
    expect(await page.getByText(`Showing ${roster.length} of ${roster.length} students.`).isVisible()).toBe(true);
    // Typed again until the page has come alive: a search typed before then would be lost.
    const matching = roster.filter((n) => n.toLowerCase().includes("marchetti"));
    await expect
      .poll(async () => {
        await page.getByLabel("Find a student").fill("marchetti");
        return page.getByText(`Showing ${matching.length} of ${roster.length} students.`).count();
      }, WAIT)
      .toBe(1);
    expect(await table.locator("tbody tr").getByRole("link").allTextContents()).toEqual([...matching].sort((a, b) => a.localeCompare(b)));
    await page.getByLabel("Find a student").fill("");
    await screenshot(page, "progress-class");

    const [download] = await Promise.all([page.waitForEvent("download"), page.getByRole("link", { name: "Export CSV" }).click()]);
    expect(download.suggestedFilename()).toBe("progress-10C-Chemistry.csv");
    const lines = (await downloaded(download)).toString("utf8").replace(/^\uFEFF/, "").trim().split(/\r?\n/);
    expect(lines).toHaveLength(roster.length + 1);
    for (const name of roster) expect(lines.some((l) => l.startsWith(name) || l.startsWith(`"${name}"`)), name).toBe(true);

    await page.setViewportSize({ width: 390, height: 844 });
    await page.waitForTimeout(300);
    await expectNoSidewaysScroll(page);
    await screenshot(page, "progress-class");
    expectNoErrors(errors);
    await context.close();
  });
});
