import type { Browser, Locator, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { expectNoErrors, launchChromium, screenshot } from "./support/chromium";
import { signedInWindow } from "./support/session";

let browser: Browser;
beforeAll(async () => {
  browser = await launchChromium();
});
afterAll(async () => {
  await browser?.close();
});

/** How long to wait for something the server has to answer first. */
const WAIT = { timeout: 20_000 };

/** A short tag so that titles made by this run are easy to tell apart. */
const run = Date.now().toString(36).slice(-5);

/** The practical editor, /practicals/[id]/versions/[versionId]/edit. */
class PracticalEditorPage {
  readonly status: Locator;
  constructor(readonly page: Page) {
    this.status = page.getByRole("status").filter({ hasText: /saved|Saving|Unsaved|Not saved|No changes/ });
  }

  async open(section: string) {
    await this.page.getByRole("navigation", { name: "Sections of the practical" }).getByRole("link", { name: new RegExp(section) }).click();
    await expect.poll(() => this.page.getByRole("heading", { level: 2, name: section, exact: true }).isVisible(), WAIT).toBe(true);
  }

  async save() {
    await this.page.getByRole("button", { name: "Save", exact: true }).click();
  }

  async expectSaved() {
    await expect.poll(() => this.status.textContent(), WAIT).toMatch(/All changes saved at/);
  }

  /** Pastes text into an input the way a spreadsheet copy arrives (a paste event with plain text). */
  async paste(target: Locator, text: string) {
    await target.evaluate((el, t) => {
      const data = new DataTransfer();
      data.setData("text/plain", t);
      el.dispatchEvent(new ClipboardEvent("paste", { clipboardData: data, bubbles: true, cancelable: true }));
    }, text);
  }
}

/** A full-page screenshot from the top, so the sticky save bar sits where a person sees it. */
async function shot(page: Page, name: string) {
  await page.evaluate(() => window.scrollTo(0, 0));
  return screenshot(page, name);
}

async function createPractical(page: Page, title: string) {
  await page.goto("/practicals");
  await page.getByRole("button", { name: "New practical" }).click();
  const form = page.getByRole("region", { name: "New practical" });
  await form.getByLabel("Title").fill(title);
  await form.getByLabel("Topic").fill("Rates of reaction");
  await form.getByLabel("Year group").selectOption("10");
  await form.getByRole("button", { name: "Create and open the editor" }).click();
  await page.waitForURL(/\/practicals\/[^/]+\/versions\/[^/]+\/edit$/);
  const [, practicalId, versionId] = /\/practicals\/([^/]+)\/versions\/([^/]+)\/edit/.exec(new URL(page.url()).pathname)!;
  return { practicalId: practicalId!, versionId: versionId! };
}

describe("a teacher writes a practical in one sitting", () => {
  it("creates, fills every section, previews a check, publishes, and reads it back", async () => {
    const { context, page, errors } = await signedInWindow(browser, "teacher", "desktop");
    const title = `Zinc and sulfuric acid: hydrogen over time ${run}`;
    const { practicalId } = await createPractical(page, title);
    const editor = new PracticalEditorPage(page);
    expect(await page.getByRole("heading", { level: 2, name: "Details" }).isVisible()).toBe(true);
    expect(await page.getByLabel("Title", { exact: true }).inputValue()).toBe(title);

    await editor.open("Aim and introduction");
    await page.getByLabel("Aim", { exact: true }).fill("Find how the rate of hydrogen production changes as the reaction goes on.");

    await editor.open("Method");
    const method = page.getByRole("textbox", { name: "Method" });
    await method.click();
    await page.keyboard.type("Read the gas syringe every 10 s. The rate is ");
    await page.getByRole("toolbar", { name: "Method" }).getByRole("button", { name: "Formula", exact: true }).click();
    await page.getByLabel("Formula (LaTeX)").fill("\\text{rate} = \\frac{\\Delta V}{\\Delta t}");
    expect(await page.getByTestId("formula-preview").locator(".katex").count()).toBe(1);
    await page.getByRole("button", { name: "Insert formula" }).click();
    await expect.poll(() => method.locator(".katex").count(), WAIT).toBe(1);

    await editor.open("Safety");
    expect(await page.getByRole("complementary", { name: "Safety caution" }).textContent()).toContain("risk assessment");
    await page.getByRole("button", { name: "Add a hazard" }).click();
    const hazard = page.locator("#f-content-safety-hazards-0");
    await hazard.getByLabel("Substance or activity").fill("Dilute sulfuric acid, 0.5 mol/dm³");
    const irritant = hazard.getByRole("button", { name: "Harmful or irritant" });
    await irritant.click();
    expect(await irritant.getAttribute("aria-pressed")).toBe("true");
    await hazard.getByLabel("Warning — the less severe hazards").check();
    await hazard.getByLabel("Hazard statements").fill("Causes skin and eye irritation.");
    await hazard.getByLabel("Control measures").fill("Eye protection; small volumes; wipe up spills with plenty of water.");
    await page.getByLabel("Chemical splash goggles").check();
    await page.getByLabel("What to do", { exact: true }).fill("Splashes: rinse with running water for 10 minutes and tell the teacher.");
    await shot(page, "practical-editor-safety");

    await editor.open("Results tables");
    await page.getByRole("button", { name: "Add a results table" }).click();
    await page.getByLabel("Table title").fill("Volume of hydrogen against time");
    const time = page.locator("#f-content-tables-0-columns-0");
    await time.getByLabel("Quantity", { exact: true }).fill("time");
    await time.getByRole("button", { name: "s", exact: true }).click();
    await time.getByLabel("Instrument resolution").fill("1");
    const volume = page.locator("#f-content-tables-0-columns-1");
    await volume.getByLabel("Quantity", { exact: true }).fill("volume of gas");
    await volume.getByRole("button", { name: "cm³", exact: true }).click();
    await volume.getByLabel("Instrument resolution").fill("1");
    await page.getByLabel(/Planned values of time \/ s/).fill("0, 10, 20, 30, 40, 50, 60, 70");
    const header = page.getByRole("figure").filter({ hasText: "Preview of the header row" });
    expect(await header.getByRole("columnheader").allInnerTexts()).toEqual(["time / s", "volume of gas / cm³"]);

    await editor.open("Graphs");
    await page.getByRole("button", { name: "Add a graph" }).click();
    await page.getByLabel("Graph title").fill("Volume of hydrogen against time");
    expect(await page.getByLabel("x-axis (across)").locator("option:checked").textContent()).toBe("time / s");
    expect(await page.getByLabel("y-axis (up)").locator("option:checked").textContent()).toBe("volume of gas / cm³");
    await page.getByLabel("Students draw tangents").check();

    await editor.open("Calculation checks");
    await page.getByLabel("New check").selectOption({ label: "Mean rate over an interval" });
    await page.getByRole("button", { name: "Add this check" }).click();
    const check = page.locator("#f-content-checks-0");
    expect(await check.getByLabel("From x =").inputValue()).toBe("0");
    expect(await check.getByLabel("To x =").inputValue()).toBe("30");
    expect(await check.getByLabel("Expected unit").inputValue()).toBe("cm³/s");
    expect(await check.getByLabel("Tolerance").inputValue()).toBe("5");
    await check.getByText("Try this check with sample data").click();
    await editor.paste(check.getByLabel("Row 1, time / s"), "time / s\tvolume of gas / cm³\r\n0\t0\r\n10\t14\r\n20\t25\r\n30\t33\r\n");
    expect(await check.getByLabel("Row 4, volume of gas / cm³").inputValue()).toBe("33");
    await check.getByLabel("Value, as typed").fill("1.10");
    await check.getByRole("button", { name: "Check this answer" }).click();
    const studentSees = check.getByRole("region", { name: "What the student sees" });
    await expect.poll(() => studentSees.textContent(), WAIT).toContain("Agrees");
    expect(await check.getByRole("region", { name: "The full reason, for you" }).textContent()).toMatch(/1\.1/);
    await shot(page, "practical-editor-check-preview");

    await editor.open("Rubric");
    await page.getByRole("button", { name: "Write a marks rubric" }).click();
    const criterion = page.locator("#f-content-rubric-criteria-0");
    await criterion.getByLabel("Criterion", { exact: true }).fill("Processing data");
    await criterion.getByLabel("Mean rate over an interval").check();
    const secure = page.locator("#f-content-rubric-criteria-0-levels-2");
    await secure.getByLabel("Marks").fill("1");
    await editor.save();
    await expect.poll(() => secure.getByText("List levels from lowest to highest").isVisible(), WAIT).toBe(true);
    expect(await editor.status.textContent()).toMatch(/Not saved yet/);
    await secure.getByLabel("Marks").fill("3");
    await editor.save();
    await editor.expectSaved();
    await shot(page, "practical-editor-rubric");

    await page.getByRole("button", { name: "Publish", exact: true }).click();
    await page.waitForURL(new RegExp(`/practicals/${practicalId}$`));
    const versions = page.getByRole("table").filter({ hasText: "Version" }).first();
    expect(await versions.getByRole("row").nth(1).innerText()).toMatch(/v1\s+Published/);
    const view = page.getByRole("article", { name: `${title} (read-only)` });
    expect(await view.locator(".katex").count()).toBe(1);
    expect(await view.getByText("Harmful or irritant").isVisible()).toBe(true);
    expect(await view.getByRole("table", { name: "Volume of hydrogen against time" }).getByRole("columnheader").allInnerTexts()).toEqual(["time / s", "volume of gas / cm³"]);
    expect(await view.getByText(/from 0 s to 30 s/).isVisible()).toBe(true);
    expect(await view.getByRole("complementary", { name: "Safety caution" }).isVisible()).toBe(true);
    await shot(page, "practical-overview");
    expectNoErrors(errors);
    await context.close();

    const phone = await signedInWindow(browser, "teacher", "phone");
    await phone.page.goto(`/practicals/${practicalId}`);
    expect(await phone.page.getByRole("heading", { level: 1 }).textContent()).toBe(title);
    await shot(phone.page, "practical-overview");
    await phone.page.getByRole("button", { name: "Edit (start a new draft)" }).click();
    await phone.page.waitForURL(/\/edit$/);
    await new PracticalEditorPage(phone.page).open("Calculation checks");
    expect(await phone.page.locator("#f-content-checks-0").getByLabel("Name students see").inputValue()).toBe("Mean rate over an interval");
    await shot(phone.page, "practical-editor-checks");
    await phone.page.goto("/practicals");
    await shot(phone.page, "practicals-library");
    expectNoErrors(phone.errors);
    await phone.context.close();
  }, 300_000);
});

describe("publishing an unfinished practical", () => {
  it("lists what is missing, with links that take the teacher to the field", async () => {
    const { context, page, errors } = await signedInWindow(browser, "teacher", "desktop");
    await createPractical(page, `Unfinished practical ${run}`);
    await page.getByRole("button", { name: "Publish", exact: true }).click();
    const problems = page.getByRole("region", { name: "Before this practical can be published" });
    await expect.poll(() => problems.isVisible(), WAIT).toBe(true);
    const links = await problems.getByRole("link").allInnerTexts();
    expect(links).toEqual(expect.arrayContaining(["Aim and introduction › Aim", "Method", "Safety › Hazards", "Safety › Eye protection", "Results tables", "Rubric"]));
    expect(await page.getByRole("link", { name: /Safety\s*3 to fix/ }).isVisible()).toBe(true);
    await problems.getByRole("link", { name: "Safety › Eye protection" }).click();
    await expect.poll(() => page.evaluate(() => document.activeElement?.id), WAIT).toBe("f-content-safety-eyeProtection");
    expect(await page.locator("#f-content-safety-eyeProtection").getByText("Say what eye protection is needed.").isVisible()).toBe(true);
    await page.getByLabel("Safety spectacles").check();
    await expect.poll(() => problems.getByRole("link", { name: "Safety › Eye protection" }).count(), WAIT).toBe(0);
    await shot(page, "practical-editor-publish-problems");
    expectNoErrors(errors);
    await context.close();
  }, 120_000);
});

describe("two people editing the same draft", () => {
  it("shows both versions on a conflict and lets the teacher keep theirs", async () => {
    const first = await signedInWindow(browser, "teacher", "desktop");
    const { practicalId, versionId } = await createPractical(first.page, `Shared draft ${run}`);
    const second = await signedInWindow(browser, "teacher", "desktop");
    await second.page.goto(`/practicals/${practicalId}/versions/${versionId}/edit`);

    await first.page.getByLabel("Title", { exact: true }).fill(`Shared draft ${run}: first tab`);
    await new PracticalEditorPage(first.page).save();
    await new PracticalEditorPage(first.page).expectSaved();

    await second.page.getByLabel("Topic", { exact: true }).fill("Kinetics");
    await new PracticalEditorPage(second.page).save();
    const conflict = second.page.getByRole("region", { name: "Someone else saved this practical while you were editing" });
    await expect.poll(() => conflict.isVisible(), WAIT).toBe(true);
    expect(await conflict.getByText(`Shared draft ${run}: first tab`).isVisible()).toBe(true);
    expect(await conflict.getByRole("listitem").filter({ hasText: "Details" }).innerText()).toMatch(/differs/);
    expect(await conflict.getByRole("listitem").filter({ hasText: "Safety" }).innerText()).toMatch(/the same/);
    await shot(second.page, "practical-editor-conflict");
    await conflict.getByRole("button", { name: /Keep mine/ }).click();
    await new PracticalEditorPage(second.page).expectSaved();

    await first.page.reload();
    expect(await first.page.getByLabel("Topic", { exact: true }).inputValue()).toBe("Kinetics");
    expect(await first.page.getByLabel("Title", { exact: true }).inputValue()).toBe(`Shared draft ${run}`);
    expectNoErrors(first.errors);
    await first.context.close();
    await second.context.close();
  }, 120_000);
});

describe("a lost connection", () => {
  it("keeps what was typed in the browser and offers it back", async () => {
    const { context, page } = await signedInWindow(browser, "teacher", "desktop");
    // Leaving with unsaved changes asks "leave this page?"; the teacher says yes.
    page.on("dialog", (dialog) => void dialog.accept());
    const { versionId } = await createPractical(page, `Offline practical ${run}`);
    await page.route(`**/api/practical-versions/${versionId}`, (route) => (route.request().method() === "PUT" ? route.abort("internetdisconnected") : route.continue()));
    await page.getByLabel("Title", { exact: true }).fill(`Offline practical ${run}: typed on the train`);
    await new PracticalEditorPage(page).save();
    await expect.poll(() => new PracticalEditorPage(page).status.textContent(), WAIT).toMatch(/Not saved: Could not reach Meniscus/);
    await page.unroute(`**/api/practical-versions/${versionId}`);
    await page.reload();
    const offer = page.getByRole("status").filter({ hasText: "Unsaved changes were found in this browser" });
    await expect.poll(() => offer.isVisible(), WAIT).toBe(true);
    await offer.getByRole("button", { name: "Restore them" }).click();
    expect(await page.getByLabel("Title", { exact: true }).inputValue()).toBe(`Offline practical ${run}: typed on the train`);
    await new PracticalEditorPage(page).expectSaved();
    await context.close();
  }, 120_000);
});

describe("who may do what", () => {
  it("lets a moderator read the library without edit buttons, and shows students the 403 page", async () => {
    const moderator = await signedInWindow(browser, "moderator", "desktop");
    const res = await moderator.page.goto("/practicals");
    expect(res?.status()).toBe(200);
    expect(await moderator.page.getByRole("button", { name: "New practical" }).count()).toBe(0);
    expect(await moderator.page.getByRole("button", { name: /^Duplicate/ }).count()).toBe(0);
    const first = moderator.page.getByRole("main").getByRole("listitem").getByRole("link").first();
    await first.click();
    await moderator.page.waitForURL(/\/practicals\/[^/]+$/);
    expect(await moderator.page.getByRole("button", { name: /Edit/ }).count()).toBe(0);
    expect(await moderator.page.getByRole("complementary", { name: "Safety caution" }).count()).toBeGreaterThan(0);
    expectNoErrors(moderator.errors);
    await moderator.context.close();

    const student = await signedInWindow(browser, "student", "desktop");
    const refused = await student.page.goto("/practicals");
    expect(refused?.status()).toBe(403);
    await student.context.close();
  }, 120_000);
});
