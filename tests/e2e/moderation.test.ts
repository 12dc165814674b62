import Database from "better-sqlite3";
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { expectNoErrors, launchChromium, newWindow, screenshot, VIEWPORTS, watchErrors } from "./support/chromium";
import { DEMO, DEMO_PASSWORD } from "./support/demo";
import { SignInPage } from "./support/pages";
import { signedInWindow } from "./support/session";

const WAIT = { timeout: 20_000 };
const MAGNESIUM = "Magnesium and acid: gas collected over time";
const PEROXIDE = "Hydrogen peroxide with and without a catalyst";
/** The demo's head of department: teacher of 10D and 12A, and a moderator. */
const HOD_EMAIL = "head.science@cobalt-lane.example";

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

function labSessionOf(className: string, title: string): string {
  return withDb((db) => {
    const row = db
      .prepare(
        `SELECT ls.id FROM lab_sessions ls JOIN classes c ON c.id = ls.class_id JOIN practical_versions pv ON pv.id = ls.practical_version_id
         WHERE c.name = ? AND pv.title = ?`,
      )
      .get(className, title) as { id: string } | undefined;
    if (!row) throw new Error(`No lab session "${title}" for ${className}.`);
    return row.id;
  });
}

type StoredCriteria = Record<string, { levelId: string; marks: number }>;

/** Marked work in a lab session as stored: the cohort a sample is drawn from. */
function cohort(labSessionId: string) {
  return withDb(
    (db) =>
      db
        .prepare(
          `SELECT w.id, m.total, m.marker_id AS markerId, m.criteria, m.feedback, m.adjusted_total AS adjustedTotal FROM write_ups w JOIN marks m ON m.write_up_id = w.id
           WHERE w.lab_session_id = ? AND w.status IN ('marked', 'returned')`,
        )
        .all(labSessionId) as { id: string; total: number; markerId: string; criteria: string; feedback: string; adjustedTotal: number | null }[],
  );
}

function userId(email: string): string {
  return withDb((db) => (db.prepare("SELECT id FROM users WHERE email = ?").get(email) as { id: string }).id);
}

function rubricOf(labSessionId: string): { id: string; title: string; levels: { id: string; label: string; marks: number }[] }[] {
  return withDb((db) => {
    const row = db.prepare("SELECT pv.content FROM lab_sessions ls JOIN practical_versions pv ON pv.id = ls.practical_version_id WHERE ls.id = ?").get(labSessionId) as { content: string };
    return JSON.parse(row.content).rubric.criteria;
  });
}

async function signInByEmail(email: string, viewport: "desktop" | "phone" = "desktop") {
  const context = await newWindow(browser, viewport);
  const page = await context.newPage();
  const errors = watchErrors(page);
  await new SignInPage(page).open();
  await new SignInPage(page).signIn(email, DEMO_PASSWORD);
  return { context, page, errors };
}

async function shootBoth(page: Page, name: string) {
  const before = page.viewportSize();
  for (const v of ["desktop", "phone"] as const) {
    await page.setViewportSize(VIEWPORTS[v]);
    await page.waitForTimeout(300);
    await screenshot(page, name);
    if (v === "phone") {
      const { scroll, client } = await page.evaluate(() => ({ scroll: document.documentElement.scrollWidth, client: document.documentElement.clientWidth }));
      expect(scroll, `${name}: the page scrolls sideways on a phone`).toBeLessThanOrEqual(client);
    }
  }
  if (before) await page.setViewportSize(before);
}

describe("drawing a moderation sample", () => {
  it("an admin draws a blind sample of 12A's peroxide work for a moderator by the school's rule, with its seed recorded", async () => {
    const labSessionId = labSessionOf("12A Chemistry", PEROXIDE);
    const moderatorId = userId(DEMO.moderator.email);
    const marked = cohort(labSessionId).filter((c) => c.markerId !== moderatorId);
    // The default rule (DOMAIN.md, common practice): at least five pieces or 10 % of the cohort, whichever is larger.
    const expectedSize = Math.min(marked.length, Math.max(5, Math.ceil(0.1 * marked.length)));

    const { context, page, errors } = await signedInWindow(browser, "admin");
    await page.goto("/moderation");
    await page.getByRole("button", { name: "Draw a sample" }).click();
    const form = page.locator("#draw-sample");
    await form.getByLabel("Lab session", { exact: true }).waitFor(WAIT);
    expect(await form.getByText(/At least 5 pieces of work or 10 % of the cohort, whichever is larger/).isVisible()).toBe(true);
    const option = (await form.getByLabel("Lab session", { exact: true }).locator("option").allTextContents()).find((t) => t.startsWith(`${PEROXIDE} — 12A Chemistry`));
    expect(option, "12A's peroxide session is offered").toBeDefined();
    expect(option).toContain(`(${marked.length} marked)`);
    await form.getByLabel("Lab session", { exact: true }).selectOption({ label: option! });
    await form.getByLabel("Moderator", { exact: true }).selectOption({ label: DEMO.moderator.name });
    expect(await form.getByLabel("Blind second marking").isChecked()).toBe(true);
    await shootBoth(page, "moderation-draw-form");
    await form.getByRole("button", { name: "Draw the sample" }).click();

    await page.getByText(/^\d+ pieces? of work from a cohort of \d+\. Recorded seed: \d+/).waitFor(WAIT);
    const sentence = (await page.getByText(/^\d+ pieces? of work from a cohort of \d+\./).textContent())!;
    const [, size, cohortSize, seed] = sentence.match(/^(\d+) pieces? of work from a cohort of (\d+)\. Recorded seed: (\d+)/)!;
    expect(Number(size)).toBe(expectedSize);
    expect(Number(cohortSize)).toBe(marked.length);
    await shootBoth(page, "moderation-drawn");

    // The sample: the highest and lowest marked work are in it, each with why it was chosen.
    await page.getByRole("link", { name: "Open the sample" }).click();
    await page.waitForURL(/\/moderation\/[^/]+$/);
    expect(await page.getByRole("heading", { level: 1 }).textContent()).toBe(`${PEROXIDE} — 12A Chemistry`);
    expect(await page.getByText(seed!, { exact: true }).isVisible()).toBe(true);
    const sampleId = new URL(page.url()).pathname.split("/").pop()!;
    const inSample = withDb((db) => db.prepare("SELECT write_up_id AS id FROM moderation_items WHERE sample_id = ? AND removed_at IS NULL").all(sampleId) as { id: string }[]).map((r) => r.id);
    expect(inSample).toHaveLength(expectedSize);
    const totals = marked.map((m) => m.total);
    const totalsInSample = inSample.map((id) => marked.find((m) => m.id === id)!.total);
    expect(Math.max(...totalsInSample)).toBe(Math.max(...totals));
    expect(Math.min(...totalsInSample)).toBe(Math.min(...totals));
    const rows = page.locator("tbody tr[data-item]");
    expect(await rows.count()).toBe(expectedSize);
    expect(await page.getByText("Yes: the moderator sees the teacher's marks only after finishing each piece.").isVisible()).toBe(true);
    await shootBoth(page, "moderation-sample-admin");
    expectNoErrors(errors);
    await context.close();
  });
});

describe("second marking and the adjustment (the demo's 10D sample)", () => {
  const labSessionId = () => labSessionOf("10D Chemistry", MAGNESIUM);
  const sampleId = () => withDb((db) => (db.prepare("SELECT id FROM moderation_samples WHERE lab_session_id = ?").get(labSessionId()) as { id: string }).id);

  it("blind: the teacher's marks stay hidden until the moderator finishes a piece, then show beside theirs", async () => {
    const { context, page, errors } = await signedInWindow(browser, "moderator");
    await page.goto("/moderation");
    await page.getByRole("link", { name: `${MAGNESIUM} — 10D Chemistry` }).click();
    await page.waitForURL(`**/moderation/${sampleId()}`);
    const hidden = page.locator("tbody").getByText("Hidden until you finish second-marking this piece");
    const hiddenBefore = await hidden.count();
    expect(hiddenBefore).toBeGreaterThan(0);
    await shootBoth(page, "moderation-sample-moderator");

    // A piece not started yet.
    const row = page.locator("tbody tr[data-item]").filter({ hasText: "Not started" }).first();
    const writeUpId = (await row.getAttribute("data-item"))!;
    const studentName = (await row.getByRole("link").textContent())!;
    await row.getByRole("link").click();
    await page.waitForURL(`**/moderation/${sampleId()}/${writeUpId}`);
    expect(await page.getByRole("heading", { level: 1 }).textContent()).toBe(studentName);
    expect(await page.getByText("Blind second marking.").isVisible()).toBe(true);
    const teacher = cohort(labSessionId()).find((c) => c.id === writeUpId)!;
    expect(teacher.feedback.trim().length).toBeGreaterThan(0);
    expect(await page.getByText(teacher.feedback.trim()).count(), "the teacher's feedback is hidden").toBe(0);
    expect(await page.getByRole("region", { name: "Your marks beside the teacher's" }).count()).toBe(0);
    await shootBoth(page, "moderation-second-marking-blind");

    // Finishing with a criterion unmarked is refused, beside the criterion.
    const panel = page.getByRole("complementary", { name: "Second marking" });
    await panel.getByRole("button", { name: "Finish second marking" }).click();
    await panel.getByText(/^Not finished: choose a level for every criterion first \(\d+ to go\)\.$/).waitFor(WAIT);

    // Second-mark as the demo's moderator does: processing and analysis one level below the teacher's, the rest the same.
    const criteria = rubricOf(labSessionId());
    const teacherCriteria = JSON.parse(teacher.criteria) as StoredCriteria;
    let expectedTotal = 0;
    for (const c of criteria) {
      const t = c.levels.findIndex((l) => l.id === teacherCriteria[c.id]!.levelId);
      const level = c.levels[c.id === "process" || c.id === "analyse" ? Math.max(0, t - 1) : t]!;
      await panel.locator(`fieldset[data-criterion="${c.id}"]`).getByLabel(new RegExp(`^${level.label}`)).check();
      expectedTotal += level.marks;
    }
    const maxTotal = criteria.reduce((s, c) => s + Math.max(...c.levels.map((l) => l.marks)), 0);
    await panel.getByLabel(/^Your note on the marking/).fill("Processing is a level lower: the rate has no unit.");
    await panel.getByRole("button", { name: "Finish second marking" }).click();
    await panel.getByText(`Second marking finished: ${expectedTotal} out of ${maxTotal}. The teacher's marks are shown now, beside yours.`).waitFor(WAIT);

    // Now the teacher's marks show, beside the moderator's.
    const comparison = page.getByRole("region", { name: "Your marks beside the teacher's" });
    await comparison.waitFor(WAIT);
    const totalRow = comparison.getByRole("row", { name: /^Total/ });
    const diff = expectedTotal - teacher.total;
    const diffWords = diff === 0 ? "same" : `${diff > 0 ? "+" : "−"}${Math.abs(diff)}`;
    expect((await totalRow.getByRole("cell").allTextContents()).map((t) => t.trim())).toEqual([String(teacher.total), String(expectedTotal), diffWords]);
    expect(await page.getByText(teacher.feedback.trim()).count()).toBeGreaterThan(0);
    expect(await page.getByText("Blind second marking.").count()).toBe(0);
    await shootBoth(page, "moderation-second-marking-finished");

    // Back in the sample, the piece shows both totals and the difference.
    await page.getByRole("link", { name: "← Moderation sample" }).click();
    const done = page.locator(`tbody tr[data-item="${writeUpId}"]`);
    await done.getByText("Finished", { exact: true }).waitFor(WAIT);
    expect((await done.getByRole("cell").allTextContents()).slice(-3).map((t) => t.trim())).toEqual([String(teacher.total), String(expectedTotal), diff === 0 ? "0" : diffWords]);
    expect(await hidden.count()).toBe(hiddenBefore - 1);
    expectNoErrors(errors);
    await context.close();
  });

  it("the moderator accepts the suggested adjustment with a reason; the teacher's own marks are kept beside the adjusted totals", async () => {
    const { context, page, errors } = await signedInWindow(browser, "moderator");
    await page.goto(`/moderation/${sampleId()}`);
    const agreement = page.getByRole("region", { name: "Agreement" });
    await agreement.waitFor(WAIT);
    expect(await agreement.getByText("Review needed", { exact: true }).isVisible()).toBe(true);
    const adjust = page.getByRole("region", { name: "Suggested adjustment for the whole cohort" });
    await adjust.waitFor(WAIT);
    await adjust.locator("canvas").waitFor(WAIT);
    const marked = cohort(labSessionId());
    expect(await adjust.getByText(`Before and after, for everyone (${marked.length})`).isVisible()).toBe(true);
    await shootBoth(page, "moderation-adjustment");

    // A reason is needed.
    await adjust.getByLabel(/^Accept: apply the adjusted totals/).check();
    await adjust.getByRole("button", { name: "Record the decision" }).click();
    await adjust.getByText("Give a reason for the decision.").waitFor(WAIT);
    await adjust.getByLabel("Reason").fill("Processing was marked a level high across the sample, by every piece I second-marked.");
    await adjust.getByRole("button", { name: "Record the decision" }).click();
    await adjust.getByText(/^Accepted: \d+ marks now show the adjusted total; the teacher's own marks are kept beside them\.$/).waitFor(WAIT);
    await adjust.getByText(/^Accepted .*Reason: Processing was marked a level high/).waitFor(WAIT);
    expect(await adjust.getByRole("button", { name: "Record the decision" }).count()).toBe(0);
    await shootBoth(page, "moderation-adjustment-accepted");

    // Stored: every marked piece has an adjusted total, and its own total unchanged.
    const after = cohort(labSessionId());
    expect(after.every((m) => m.adjustedTotal !== null)).toBe(true);
    expect(after.map((m) => m.total)).toEqual(marked.map((m) => m.total));
    // A second decision is refused.
    const again = await page.request.post(`/api/moderation/samples/${sampleId()}/adjustment`, { data: { decision: "accept", reason: "Once more." } });
    expect(again.status()).toBe(409);
    expectNoErrors(errors);
    await context.close();

    // The class's teacher sees the adjusted totals on the bench.
    const hod = await signInByEmail(HOD_EMAIL);
    await hod.page.goto(`/marking/${labSessionId()}`);
    await hod.page.getByRole("table").waitFor(WAIT);
    const changed = after.filter((m) => m.adjustedTotal !== m.total).length;
    expect(await hod.page.locator("tbody").getByText("adjusted", { exact: true }).count()).toBe(after.length);
    expect(changed).toBeGreaterThan(0);
    await screenshot(hod.page, "moderation-adjusted-bench");
    expectNoErrors(hod.errors);
    await hod.context.close();
  });
});
