import path from "node:path";
import Database from "better-sqlite3";
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { expectNoErrors, launchChromium, newWindow, screenshot, VIEWPORTS, watchErrors } from "./support/chromium";
import { DEMO_PASSWORD } from "./support/demo";
import { SignInPage } from "./support/pages";
import { signedInWindow } from "./support/session";
import { lastMailRowid, latestMailTo } from "./support/test-database";

const PRACTICAL = "Magnesium and acid: gas collected over time";
const WAIT = { timeout: 20_000 };

let browser: Browser;
beforeAll(async () => {
  browser = await launchChromium();
});
afterAll(async () => {
  await browser?.close();
});

type Level = { id: string; label: string; marks: number };
type Criterion = { id: string; title: string; checkIds: string[]; levels: Level[] };

/**
 * From the test server's database (read-only): 10C's magnesium lab session, its rubric as the
 * published practical stores it, and a 10C student with a draft write-up (not the README's demo
 * student, whom other tests use; the write-up tests take students who have not started).
 */
function demoDraft() {
  const db = new Database(inject("databasePath"), { readonly: true, fileMustExist: true });
  try {
    const session = db
      .prepare(
        `SELECT ls.id, pv.content FROM lab_sessions ls
         JOIN classes c ON c.id = ls.class_id JOIN practical_versions pv ON pv.id = ls.practical_version_id
         WHERE c.name = '10C Chemistry' AND pv.title = ?`,
      )
      .get(PRACTICAL) as { id: string; content: string } | undefined;
    if (!session) throw new Error(`No lab session "${PRACTICAL}" for 10C in the demo school.`);
    const draft = db
      .prepare(
        `SELECT w.id AS writeUpId, u.email, u.name FROM write_ups w JOIN users u ON u.id = w.student_id
         WHERE w.lab_session_id = ? AND w.status = 'draft' AND w.safety_acknowledged_at IS NOT NULL
           AND u.password_hash IS NOT NULL AND u.email <> 'student@cobalt-lane.example'
         ORDER BY u.email DESC LIMIT 1`,
      )
      .get(session.id) as { writeUpId: string; email: string; name: string } | undefined;
    if (!draft) throw new Error("The demo needs a 10C student with a draft of the magnesium write-up.");
    const rubric = (JSON.parse(session.content) as { rubric: { criteria: Criterion[] } }).rubric;
    return { labSessionId: session.id, rubric, ...draft };
  } finally {
    db.close();
  }
}

/** The teacher's saved mark for a write-up, as stored. */
function storedMark(writeUpId: string) {
  const db = new Database(inject("databasePath"), { readonly: true, fileMustExist: true });
  try {
    return db.prepare("SELECT total, max_total AS maxTotal, returned_at AS returnedAt, feedback, comments FROM marks WHERE write_up_id = ?").get(writeUpId) as
      | { total: number; maxTotal: number; returnedAt: number | null; feedback: string; comments: string }
      | undefined;
  } finally {
    db.close();
  }
}

async function shootBoth(page: Page, name: string) {
  const before = page.viewportSize();
  for (const v of ["desktop", "phone"] as const) {
    await page.setViewportSize(VIEWPORTS[v]);
    await page.waitForTimeout(300);
    await screenshot(page, name);
  }
  if (before) await page.setViewportSize(before);
}

/** No sideways scrolling at the page's current width. */
async function expectNoSidewaysScroll(page: Page) {
  const { scroll, client } = await page.evaluate(() => ({ scroll: document.documentElement.scrollWidth, client: document.documentElement.clientWidth }));
  expect(scroll, "the page scrolls sideways").toBeLessThanOrEqual(client);
}

describe("the marking bench", () => {
  it("a handed-in write-up is found on the bench, marked with one override, saved and returned; the student is told and sees the marks", async () => {
    const draft = demoDraft();

    // The student hands in their draft (through the same route the Hand in button uses).
    const student = await newWindow(browser, "phone");
    const studentPage = await student.newPage();
    const studentErrors = watchErrors(studentPage);
    await new SignInPage(studentPage).open();
    await new SignInPage(studentPage).signIn(draft.email, DEMO_PASSWORD);
    const current = await (await studentPage.request.get(`/api/write-ups/${draft.writeUpId}`)).json();
    const handIn = await studentPage.request.post(`/api/write-ups/${draft.writeUpId}/submit`, { data: { revision: current.writeUp.revision } });
    expect(handIn.status()).toBe(200);

    // The teacher's list of lab sessions: 10C's magnesium session is waiting to be marked.
    const { context, page, errors } = await signedInWindow(browser, "teacher");
    await page.goto("/marking");
    const waiting = page.getByRole("region", { name: "Waiting to be marked" });
    const card = waiting.getByRole("listitem").filter({ has: page.getByRole("heading", { name: PRACTICAL }) }).filter({ hasText: "10C Chemistry" });
    await card.waitFor(WAIT);
    await shootBoth(page, "marking-sessions");
    await card.getByRole("link", { name: /^Mark \d+ write-ups?$/ }).click();
    await page.waitForURL(`**/marking/${draft.labSessionId}`);

    // The bench: find the student by name, and open their write-up from the keyboard.
    expect(await page.getByRole("heading", { level: 1 }).textContent()).toBe(PRACTICAL);
    await page.getByLabel("Status").selectOption("to-mark");
    const row = page.locator("tbody tr").filter({ hasText: draft.name });
    await row.waitFor(WAIT);
    expect(await row.getByText("Handed in", { exact: true }).isVisible()).toBe(true);
    await shootBoth(page, "marking-bench");
    await page.getByLabel("Search by name").fill(draft.name.split(" ")[0]!);
    await page.getByText(/^Showing \d+ of \d+ students\./).waitFor(WAIT);
    await row.click();
    await row.press("Enter");
    await page.waitForURL(`**/marking/${draft.labSessionId}/${draft.writeUpId}`);
    expect(await page.getByRole("heading", { level: 1 }).textContent()).toBe(draft.name);

    // Levels: the processing criterion comes pre-filled from the calculation checks; the others are chosen.
    const rubric = page.getByRole("complementary", { name: "Rubric and marks" });
    const linked = draft.rubric.criteria.find((c) => c.checkIds.length > 0)!;
    const fieldset = (c: Criterion) => rubric.locator(`fieldset[data-criterion="${c.id}"]`);
    const suggestedLevel = (await fieldset(linked).locator("input[type=radio]:checked").getAttribute("value")) ?? "";
    expect(await fieldset(linked).getByText("suggested", { exact: true }).isVisible()).toBe(true);
    expect(await fieldset(linked).getByText(/^The calculation checks suggest “.+”\.$/).isVisible()).toBe(true);

    // Choose a level for each criterion: the top level by its number key, the middle one by clicking;
    // and for the linked criterion a level other than the suggestion, which asks why.
    const chosen: Record<string, Level> = {};
    for (const [i, c] of draft.rubric.criteria.entries()) {
      if (c.id === linked.id) {
        const other = c.levels.find((l) => l.id !== suggestedLevel)!;
        await fieldset(c).getByLabel(new RegExp(`^${other.label}`)).check();
        await fieldset(c).getByLabel(/^Why “.+” rather than the suggested “.+”\?$/).fill("The tangent is drawn at the wrong time, although the figure happens to agree.");
        chosen[c.id] = other;
      } else if (i % 2 === 0) {
        await fieldset(c).locator("input[type=radio]").first().focus();
        await page.keyboard.press(String(c.levels.length));
        chosen[c.id] = c.levels[c.levels.length - 1]!;
      } else {
        const middle = c.levels[1]!;
        await fieldset(c).getByLabel(new RegExp(`^${middle.label}`)).check();
        chosen[c.id] = middle;
      }
      expect(await fieldset(c).locator("input[type=radio]:checked").getAttribute("value")).toBe(chosen[c.id]!.id);
    }
    // The expected total: the marks of the chosen levels, as the practical's rubric gives them.
    const expectedTotal = Object.values(chosen).reduce((s, l) => s + l.marks, 0);
    const maxTotal = draft.rubric.criteria.reduce((s, c) => s + Math.max(...c.levels.map((l) => l.marks)), 0);
    expect(await rubric.getByText(/^Total: \d+$/).textContent()).toBe(`Total: ${expectedTotal}`);

    // A comment on the observations, and overall feedback.
    await page.getByRole("button", { name: "Comment on the observations" }).click();
    await page.getByLabel("Your comment on the observations").fill("Say what you saw at the surface of the ribbon, not only that it fizzed.");
    await rubric.getByLabel(`Feedback for ${draft.name}`).fill("Careful readings. Next time draw the tangent exactly at 20 s.");
    expect(await rubric.getByRole("button", { name: "Return to the student" }).isDisabled(), "nothing unsaved is returned").toBe(true);
    await shootBoth(page, "marking-desk-before-save");

    await rubric.getByRole("button", { name: "Save marks" }).click();
    await rubric.getByText(new RegExp(`^Saved at \\d\\d:\\d\\d: ${expectedTotal} out of ${maxTotal}\\. Every criterion is marked, so you can return it\\.$`)).waitFor(WAIT);
    const saved = storedMark(draft.writeUpId)!;
    expect(saved.total).toBe(expectedTotal);
    expect(saved.returnedAt).toBeNull();
    expect(JSON.parse(saved.comments)).toEqual({ observations: "Say what you saw at the surface of the ribbon, not only that it fizzed." });

    // Return it: the student is e-mailed a link to their write-up.
    const mailsBefore = lastMailRowid();
    await rubric.getByRole("button", { name: "Return to the student" }).click();
    await rubric.getByText(new RegExp(`^Returned to ${draft.name}\\. \\d+ e-mails? (was|were) sent to the student and the parents who get them\\.$`)).waitFor(WAIT);
    await page.getByText("Returned", { exact: true }).first().waitFor(WAIT);
    expect(storedMark(draft.writeUpId)!.returnedAt).not.toBeNull();
    const mail = await latestMailTo(draft.email, { after: mailsBefore });
    expect(mail.subject).toBe(`Your write-up has been marked: ${PRACTICAL}`);
    expect(mail.text).toContain(`/lab-sessions/${draft.labSessionId}/write-up`);
    await shootBoth(page, "marking-desk-returned");

    // Back on the bench the row is returned, with its total.
    await page.getByRole("link", { name: /^← Marking bench: 10C Chemistry$/ }).click();
    await page.waitForURL(`**/marking/${draft.labSessionId}`);
    const benchRow = page.locator("tbody tr").filter({ hasText: draft.name });
    await benchRow.getByText("Returned", { exact: true }).waitFor(WAIT);
    expect(await benchRow.getByText(String(expectedTotal), { exact: true }).count()).toBeGreaterThan(0);
    expectNoErrors(errors);
    await context.close();

    // The student follows the e-mail's link, then finds the marks and feedback on their progress page.
    await studentPage.goto(new URL(mail.text.match(/https?:\/\/\S+/)![0]).pathname);
    const yourMarks = studentPage.getByRole("region", { name: "Your marks" });
    await yourMarks.waitFor(WAIT);
    expect(await yourMarks.getByText(`${expectedTotal}`, { exact: true }).first().isVisible()).toBe(true);
    expect((await yourMarks.locator("p").first().textContent())?.trim()).toBe(`${expectedTotal} out of ${maxTotal}`);
    for (const c of draft.rubric.criteria) {
      const row = yourMarks.getByRole("row", { name: new RegExp(`^${c.title}`) });
      expect(await row.getByText(chosen[c.id]!.label, { exact: true }).isVisible(), c.title).toBe(true);
    }
    expect(await yourMarks.getByText("Say what you saw at the surface of the ribbon, not only that it fizzed.").isVisible()).toBe(true);
    expect(await yourMarks.getByText("Careful readings. Next time draw the tangent exactly at 20 s.").isVisible()).toBe(true);
    await expectNoSidewaysScroll(studentPage);
    await screenshot(studentPage, "marking-student-returned-write-up");
    await studentPage.goto("/progress");
    const returnedCard = studentPage.getByRole("article").filter({ has: studentPage.getByRole("heading", { name: PRACTICAL }) });
    await returnedCard.waitFor(WAIT);
    // "n out of m marks (p %)" as components/progress/words.ts words it, from the stored mark.
    expect(await returnedCard.getByText(new RegExp(`^${expectedTotal} out of ${maxTotal} marks \\(`)).isVisible()).toBe(true);
    expect(await returnedCard.getByText("Careful readings. Next time draw the tangent exactly at 20 s.").isVisible()).toBe(true);
    await expectNoSidewaysScroll(studentPage);
    await screenshot(studentPage, "marking-student-progress");
    expectNoErrors(studentErrors);
    await student.close();
  });

  it("J and K move to the next and previous write-up, and the printed copy is the marked write-up without the controls", async () => {
    const draft = demoDraft();
    const { context, page, errors } = await signedInWindow(browser, "teacher", "desktop");
    // A handed-in write-up: the desk moves among those (drafts are not in its order).
    const db = new Database(inject("databasePath"), { readonly: true, fileMustExist: true });
    const handedIn = db.prepare("SELECT id FROM write_ups WHERE lab_session_id = ? AND status != 'draft' ORDER BY id").pluck().all(draft.labSessionId) as string[];
    db.close();
    expect(handedIn.length).toBeGreaterThan(1);
    await page.goto(`/marking/${draft.labSessionId}/${handedIn[0]}`, { waitUntil: "networkidle" });
    const heading = page.getByRole("heading", { level: 1 });
    await heading.waitFor(WAIT);
    const first = { url: page.url(), name: await heading.textContent() };
    const nav = page.getByRole("navigation", { name: "Write-ups in this lab session" });
    // The first write-up on the bench may be the last of the session's order: go whichever way there is to go, then back.
    const [away, back] = (await nav.getByRole("button", { name: "Next →" }).isEnabled()) ? ["j", "k"] : ["k", "j"];
    // Levels the checks suggest are pre-filled and not yet saved, so the desk may first ask
    // before leaving; then the teacher chooses to leave.
    const move = async (key: string, from: string) => {
      await page.keyboard.press(key);
      const leave = page.getByRole("alertdialog", { name: /are not saved\. Leave this write-up anyway\?/ });
      await expect.poll(async () => page.url() !== from || (await leave.isVisible()), WAIT).toBe(true);
      if (page.url() === from) await leave.getByRole("button", { name: "Leave without saving" }).click();
      await expect.poll(() => page.url(), WAIT).not.toBe(from);
      await page.waitForLoadState("networkidle");
    };
    await move(away, first.url);
    await expect.poll(() => heading.textContent(), WAIT).not.toBe(first.name);
    await move(back, page.url());
    await expect.poll(() => page.url(), WAIT).toBe(first.url);
    await expect.poll(() => heading.textContent(), WAIT).toBe(first.name);

    // Printed: the student's work, the rubric and the marks; no buttons, key hints or bench links.
    await page.emulateMedia({ media: "print" });
    expect(await nav.isVisible()).toBe(false);
    expect(await page.getByText("Keys: J next, K previous").isVisible()).toBe(false);
    for (const control of ["Download as CSV", "Reset zoom"]) expect(await page.getByRole("button", { name: control }).first().isVisible()).toBe(false);
    expect(await heading.isVisible()).toBe(true);
    expect(await page.locator("#rubric-body").isVisible()).toBe(true);
    await page.screenshot({ path: path.join(inject("screenshotDir"), "marking-desk-print.png"), fullPage: true });
    await page.emulateMedia({ media: "screen" });
    expect(await nav.isVisible()).toBe(true);
    expectNoErrors(errors);
    await context.close();
  });

  it("on a phone, the rubric is a drawer under the write-up and the bench scrolls inside its own box", async () => {
    const draft = demoDraft();
    const { context, page, errors } = await signedInWindow(browser, "teacher", "phone");
    await page.goto(`/marking/${draft.labSessionId}`);
    await page.getByRole("table").waitFor(WAIT);
    await expectNoSidewaysScroll(page);
    await screenshot(page, "marking-bench-phone");
    // Any write-up in the class: open the first one that has been started.
    await page.locator("tbody tr a").first().click();
    await page.waitForURL(new RegExp(`/marking/${draft.labSessionId}/[^/]+$`));
    const drawer = page.getByRole("complementary", { name: "Rubric and marks" });
    await drawer.getByRole("button", { name: "Show rubric" }).click();
    expect(await drawer.locator("#rubric-body").isVisible()).toBe(true);
    await expectNoSidewaysScroll(page);
    // The drawer is fixed to the foot of the screen: a picture of the screen as the teacher sees it.
    await page.screenshot({ path: path.join(inject("screenshotDir"), "marking-desk-drawer-phone.png") });
    expectNoErrors(errors);
    await context.close();
  });
});
