import Database from "better-sqlite3";
import type { Browser, BrowserContext, Dialog, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { STANDING_CAUTION } from "@/lib/ghs";
import { expectNoErrors, launchChromium, newWindow, screenshot, VIEWPORTS, watchErrors, type ViewportName } from "./support/chromium";
import { DEMO, DEMO_PASSWORD } from "./support/demo";
import { SignInPage } from "./support/pages";
import { signedInWindow } from "./support/session";

const PRACTICAL = "Magnesium and acid: gas collected over time";
/** How long to wait for something the server has to answer first. */
const WAIT = { timeout: 20_000 };

let browser: Browser;
beforeAll(async () => {
  browser = await launchChromium();
});
afterAll(async () => {
  await browser?.close();
});

/** The test server's database, read-only: the demo's open lab session for 10C and a classmate who has not started it. */
function demoSession(): { labSessionId: string; freshStudentEmail: string } {
  const db = new Database(inject("databasePath"), { readonly: true, fileMustExist: true });
  try {
    const session = db
      .prepare(
        `SELECT ls.id, ls.class_id AS classId FROM lab_sessions ls
         JOIN classes c ON c.id = ls.class_id JOIN practical_versions pv ON pv.id = ls.practical_version_id
         WHERE c.name = '10C Chemistry' AND pv.title = ?`,
      )
      .get(PRACTICAL) as { id: string; classId: string } | undefined;
    if (!session) throw new Error(`No lab session "${PRACTICAL}" for 10C in the demo school.`);
    const student = db
      .prepare(
        `SELECT u.email FROM class_students cs JOIN users u ON u.id = cs.student_id
         WHERE cs.class_id = ? AND u.password_hash IS NOT NULL AND u.email <> ?
           AND u.id NOT IN (SELECT student_id FROM write_ups WHERE lab_session_id = ?)
         ORDER BY u.email LIMIT 1`,
      )
      .get(session.classId, DEMO.student.email, session.id) as { email: string } | undefined;
    if (!student) throw new Error("Every student in 10C has started this write-up; the demo needs one who has not.");
    return { labSessionId: session.id, freshStudentEmail: student.email };
  } finally {
    db.close();
  }
}

async function signInByEmail(email: string, viewport: ViewportName = "desktop") {
  const context = await newWindow(browser, viewport);
  const page = await context.newPage();
  const errors = watchErrors(page);
  await new SignInPage(page).open();
  await new SignInPage(page).signIn(email, DEMO_PASSWORD);
  return { context, page, errors };
}

/** Full-page screenshots of the page as it is now at both widths, then back to the width it had. */
async function shootBoth(page: Page, name: string) {
  const before = page.viewportSize();
  for (const v of ["desktop", "phone"] as const) {
    await page.setViewportSize(VIEWPORTS[v]);
    await page.waitForTimeout(300);
    await screenshot(page, name);
  }
  if (before) await page.setViewportSize(before);
}

const status = (page: Page) => page.locator("#wu-save-status");
const volumeCell = (page: Page, row: number) => page.getByLabel(`Row ${row}, volume of gas / cm³`, { exact: true });
const checkPanel = (page: Page, id: string) => page.locator(`[data-check-id="${id}"]`);

/** What the first test leaves for the teacher's: the write-up handed in. */
let handedIn: { writeUpId: string; studentEmail: string } | null = null;

describe("a student's write-up at the bench", () => {
  it("safety first, results by keyboard and paste, a tangent, checks, offline and back, then hand in", async () => {
    const { labSessionId, freshStudentEmail } = demoSession();
    const { context, page, errors } = await signInByEmail(freshStudentEmail);

    // From the lab session to the write-up.
    await page.goto(`/lab-sessions/${labSessionId}`);
    await page.getByRole("link", { name: "Start your write-up" }).click();
    await page.waitForURL(`**/lab-sessions/${labSessionId}/write-up`);
    expect(await page.getByRole("heading", { level: 1 }).textContent()).toBe(PRACTICAL);
    const view = await (await page.request.post(`/api/lab-sessions/${labSessionId}/write-up`)).json();
    const writeUpId: string = view.writeUp.id;

    // Safety first: hazards with pictogram names, controls, the standing caution; results locked until ticked.
    const safety = page.getByRole("region", { name: "Safety first" });
    expect(await safety.getByText(STANDING_CAUTION).isVisible()).toBe(true);
    expect(await safety.getByText("Flammable", { exact: true }).first().isVisible()).toBe(true);
    expect(await safety.getByText("Harmful or irritant", { exact: true }).isVisible()).toBe(true);
    expect(await safety.getByText("Chemical splash goggles").isVisible()).toBe(true);
    expect(await safety.getByText(/^How the risk is controlled:/).count()).toBeGreaterThan(0);
    expect(await page.getByText("Locked until you confirm the safety section").isVisible()).toBe(true);
    expect(await page.getByRole("grid").getAttribute("aria-readonly")).toBe("true");
    await screenshot(page, "write-up-safety-first");
    await page.getByLabel("I have read the hazards and control measures").check();
    await page.getByText(/^Confirmed at \d\d:\d\d\. Your results tables are unlocked\.$/).waitFor(WAIT);
    expect(await page.getByText("Locked until you confirm the safety section").count()).toBe(0);
    expect(await page.getByRole("grid").getAttribute("aria-readonly")).toBeNull();

    // Results: four readings typed (Enter moves down), then four pasted as a block from a spreadsheet.
    await volumeCell(page, 1).click();
    for (const v of ["0", "18", "31", "41"]) {
      await page.keyboard.type(v);
      await page.keyboard.press("Enter");
    }
    await volumeCell(page, 5).evaluate((el, text) => {
      (el as HTMLInputElement).focus();
      const data = new DataTransfer();
      data.setData("text/plain", text);
      el.dispatchEvent(new ClipboardEvent("paste", { clipboardData: data, bubbles: true, cancelable: true }));
    }, "48\n53\n56\n58");
    expect(await Promise.all([1, 2, 3, 4, 5, 6, 7, 8].map((r) => volumeCell(page, r).inputValue()))).toEqual(["0", "18", "31", "41", "48", "53", "56", "58"]);
    await page.getByText(/^Saved at \d\d:\d\d$/).waitFor(WAIT);

    // A tangent at 20 s, typed as two points.
    await page.getByLabel("Tangent at t / s").fill("20");
    await page.getByLabel("Point 1: time / s").fill("0");
    await page.getByLabel("Point 1: volume of gas / cm³").fill("8");
    await page.getByLabel("Point 2: time / s").fill("50");
    await page.getByLabel("Point 2: volume of gas / cm³").fill("65.5");
    await checkPanel(page, "rate20").getByText(/^Your tangent on “Volume of hydrogen against time” runs from \(0, 8\) to \(50, 65\.5\)\.$/).waitFor(WAIT);
    await screenshot(page, "write-up-results-and-graph");

    // Checks: the mean rate agrees (41 cm³ in 30 s, worked by hand: 1.37 cm³/s), with no expected value shown.
    const mean = checkPanel(page, "mean030");
    await mean.getByLabel("Your answer").fill("1.37");
    await mean.getByLabel("Unit").fill("cm³/s");
    await mean.getByRole("button", { name: "Check" }).click();
    await mean.getByTestId("check-mean030-verdict").waitFor(WAIT);
    expect(await mean.getByTestId("check-mean030-verdict").getByText("Agrees", { exact: true }).isVisible()).toBe(true);
    expect(await mean.getByText(/Expected from your data/).count()).toBe(0);
    // The verdict goes stale as the answer changes, and fresh again when it changes back.
    await mean.getByLabel("Your answer").fill("1.4");
    expect(await mean.getByTestId("check-mean030-stale").isVisible()).toBe(true);
    await mean.getByLabel("Your answer").fill("1.37");
    expect(await mean.getByTestId("check-mean030-stale").count()).toBe(0);
    // The tangent check sends the tangent drawn on the graph (gradient 57.5 / 50 = 1.15 cm³/s).
    const rate = checkPanel(page, "rate20");
    await rate.getByLabel("Your answer").fill("1.15");
    await rate.getByLabel("Unit").fill("cm³/s");
    await rate.getByRole("button", { name: "Check" }).click();
    await rate.getByTestId("check-rate20-verdict").waitFor(WAIT);
    expect(await rate.getByTestId("check-rate20-verdict").textContent()).toMatch(/Agrees|Close/);
    const stored = await (await page.request.get(`/api/write-ups/${writeUpId}`)).json();
    expect(stored.writeUp.content.answers.rate20.tangent).toEqual({ x1: 0, y1: 8, x2: 50, y2: 65.5 });
    expect(stored.checks.rate20.stale).toBe(false);
    await shootBoth(page, "write-up-checks");

    // Offline at the bench: typing goes on, the work is kept on this device.
    await context.setOffline(true);
    await page.locator("#wu-observations-editor").click();
    await page.keyboard.type("Fizzing at the ribbon; the flask felt warm.");
    await page.getByText("Offline — changes kept on this device").first().waitFor(WAIT);
    expect(await status(page).getAttribute("role")).toBe("status");
    await shootBoth(page, "write-up-offline");

    // Back online but the server still out of reach; then the page is reloaded before anything saved.
    await page.route("**/api/write-ups/*", (route) => (route.request().method() === "PUT" ? route.abort("internetdisconnected") : route.continue()));
    await context.setOffline(false);
    await page.waitForTimeout(1_000);
    expect(await status(page).textContent()).not.toMatch(/^Saved/);
    const dialogs: string[] = [];
    const acceptDialog = (d: Dialog) => {
      dialogs.push(d.type());
      void d.accept();
    };
    page.on("dialog", acceptDialog);
    await page.reload();
    expect(dialogs).toEqual(["beforeunload"]);
    page.off("dialog", acceptDialog);
    const offer = page.getByRole("region", { name: "We found changes on this device that were not saved" });
    await offer.waitFor(WAIT);
    expect(await offer.locator('[data-part="section:observations"] [data-side="mine"]').textContent()).toBe("8 words: “Fizzing at the ribbon; the flask felt warm.”");
    expect(await offer.locator('[data-part="section:observations"] [data-side="other"]').textContent()).toBe("Empty");
    await shootBoth(page, "write-up-recover-draft");

    // Online for real: keep this device's changes, and they save.
    await page.unroute("**/api/write-ups/*");
    await offer.getByRole("button", { name: "Keep the changes on this device" }).click();
    const savedObservations = async () => JSON.stringify((await (await page.request.get(`/api/write-ups/${writeUpId}`)).json()).writeUp.content.sections.observations);
    await expect.poll(savedObservations, WAIT).toContain("Fizzing at the ribbon; the flask felt warm.");
    await page.getByText(/^Saved at \d\d:\d\d$/).waitFor(WAIT);
    // Once the server has it, the copy on this device is cleared.
    await expect.poll(() => page.evaluate((id) => localStorage.getItem(`meniscus:write-up-draft:${id}:content`), writeUpId), WAIT).toBeNull();
    const saved = await (await page.request.get(`/api/write-ups/${writeUpId}`)).json();

    // Hand in, with the confirmation; then read-only, and saves are refused.
    const handIn = page.getByRole("region", { name: "Hand in" });
    await handIn.getByRole("button", { name: "Hand in", exact: true }).click();
    const confirm = page.getByRole("dialog", { name: "Hand in your write-up?" });
    await confirm.waitFor(WAIT);
    expect(await confirm.textContent()).toContain("you cannot change it, unless your teacher reopens it");
    await shootBoth(page, "write-up-hand-in-confirm");
    await confirm.getByRole("button", { name: "Hand it in" }).click();
    await page.getByText(/^Handed in at .+\.$/).waitFor(WAIT);
    expect(await page.getByText("It is locked now. If you need to change something, ask your teacher to reopen it.").isVisible()).toBe(true);
    expect(await page.getByRole("button", { name: "Hand in", exact: true }).count()).toBe(0);
    expect(await page.getByText("Fizzing at the ribbon; the flask felt warm.").isVisible()).toBe(true);
    const locked = await page.request.put(`/api/write-ups/${writeUpId}`, { data: { revision: saved.writeUp.revision + 1, content: saved.writeUp.content } });
    expect(locked.status()).toBe(409);
    expect((await locked.json()).error.reason).toBe("locked");
    await shootBoth(page, "write-up-handed-in");

    expectNoErrors(errors);
    handedIn = { writeUpId, studentEmail: freshStudentEmail };
    await context.close();
  });
});

describe("the class's teacher reads the handed-in write-up", () => {
  for (const viewport of ["desktop", "phone"] as const) {
    it(`${viewport}: every check's full outcome, and reopening with a confirmation`, async () => {
      expect(handedIn, "the student's test hands in a write-up first").not.toBeNull();
      const { context, page, errors } = await signedInWindow(browser, "teacher", viewport);
      await page.goto(`/write-ups/${handedIn!.writeUpId}`);
      expect(await page.getByRole("heading", { level: 1 }).textContent()).toMatch(/'s write-up$/);
      const mean = page.getByRole("region", { name: "Mean rate from 0 s to 30 s" });
      expect(await mean.getByText("Student's answer:").locator("..").textContent()).toBe("Student's answer: 1.37 cm³/s");
      expect(await mean.getByRole("term").allTextContents()).toEqual(expect.arrayContaining(["Expected", "Deviation", "Reason"]));
      expect(await mean.getByRole("definition").first().textContent()).toMatch(/^1\.367 cm³/);
      await screenshot(page, "write-up-staff-view");
      if (viewport === "phone") {
        await page.getByRole("button", { name: "Reopen for the student" }).click();
        const dialog = page.getByRole("dialog", { name: "Reopen this write-up?" });
        await dialog.waitFor(WAIT);
        await screenshot(page, "write-up-staff-reopen-confirm");
        await dialog.getByRole("button", { name: "Reopen it" }).click();
        await page.getByText(/^Reopened: .+ can change the write-up and hand it in again\.$/).waitFor(WAIT);
        await page.getByText("Not handed in yet").waitFor(WAIT);
        await screenshot(page, "write-up-staff-reopened");
      } else {
        expect(await page.getByText("Handed in", { exact: true }).first().isVisible()).toBe(true);
      }
      expectNoErrors(errors);
      await context.close();
    });
  }

  it("the student finds it open again, with their work", async () => {
    const { context, page, errors } = await signInByEmail(handedIn!.studentEmail, "phone");
    const { labSessionId } = demoSession();
    await page.goto(`/lab-sessions/${labSessionId}/write-up`);
    await page.getByRole("region", { name: "Hand in" }).waitFor(WAIT);
    await page.locator("#wu-observations-editor").waitFor(WAIT);
    expect(await page.locator("#wu-observations-editor").textContent()).toBe("Fizzing at the ribbon; the flask felt warm.");
    expect(await page.getByRole("button", { name: "Hand in", exact: true }).isEnabled()).toBe(true);
    expectNoErrors(errors);
    await context.close();
  });
});

describe("the demo student on a phone", () => {
  it("sticky save status and a jump menu to each part", async () => {
    const { context, page, errors } = await signedInWindow(browser, "student", "phone");
    const { labSessionId } = demoSession();
    await page.goto(`/lab-sessions/${labSessionId}/write-up`);
    await page.getByRole("heading", { name: "Calculations" }).waitFor(WAIT);
    // Let the lazily loaded editors, graphs and photos finish arriving first: a late one can
    // take the focus back while it mounts on a slow machine.
    await page.locator("#wu-evaluation-editor").waitFor(WAIT);
    await page.waitForLoadState("networkidle");
    let focused = false;
    for (let attempt = 0; attempt < 3 && !focused; attempt++) {
      await page.getByLabel("Jump to a part of your write-up").selectOption("calculations");
      focused = await page
        .waitForFunction(() => document.activeElement?.id === "wu-calculations-title", undefined, { timeout: 10_000 })
        .then(() => true)
        .catch(() => false);
    }
    expect(focused, "the jump menu moves the focus to the Calculations heading").toBe(true);
    const bar = await status(page).boundingBox();
    expect(bar && bar.y >= 0 && bar.y < 60, "the save status stays in view at the top").toBe(true);
    await screenshot(page, "write-up-demo-student");
    expectNoErrors(errors);
    await (context as BrowserContext).close();
  });
});
