import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { PREP_CHECK_LINE } from "@/lib/ghs";
import { completePracticalContent } from "../helpers/practicals";
import { expectNoErrors, launchChromium, screenshot } from "./support/chromium";
import { DEMO } from "./support/demo";
import { signedInWindow } from "./support/session";
import { classIdByName } from "./support/test-database";

let browser: Browser;
beforeAll(async () => {
  browser = await launchChromium();
});
afterAll(async () => {
  await browser?.close();
});

/** How long to wait for something the server has to answer first. */
const WAIT = { timeout: 20_000 };

/** A date in the school's time zone (the browser windows use Europe/London), as a date input wants it. */
function schoolDate(daysFromToday: number): string {
  const at = new Date(Date.now() + daysFromToday * 86_400_000);
  return new Intl.DateTimeFormat("en-CA", { timeZone: "Europe/London", year: "numeric", month: "2-digit", day: "2-digit" }).format(at);
}

/**
 * A published practical from the library: one of the demo school's, or, when the library has
 * none, one made and published here through the API.
 */
async function publishedPractical(page: Page): Promise<{ practicalId: string; title: string }> {
  const res = await page.request.get("/api/practicals");
  expect(res.status()).toBe(200);
  const { practicals } = (await res.json()) as { practicals: { id: string; title: string; publishedVersion: number | null }[] };
  const found = practicals.find((p) => p.publishedVersion !== null);
  if (found) return { practicalId: found.id, title: found.title };
  const meta = { title: "Gas from acid and metal, for scheduling", topic: "Rates of reaction", yearGroup: 10, subject: "Chemistry" };
  const created = await page.request.post("/api/practicals", { data: meta });
  expect(created.status()).toBe(201);
  const { practicalId, versionId } = (await created.json()) as { practicalId: string; versionId: string };
  const saved = await page.request.put(`/api/practical-versions/${versionId}`, { data: { ...meta, content: completePracticalContent(), revision: 0 } });
  expect(saved.status()).toBe(200);
  const published = await page.request.post(`/api/practical-versions/${versionId}/publish`, { data: { revision: ((await saved.json()) as { revision: number }).revision } });
  expect(published.status()).toBe(200);
  return { practicalId, title: meta.title };
}

/** What the teacher's run leaves for the student's: the lab session and its practical. */
let scheduled: { id: string; title: string } | null = null;

describe("a teacher prepares and schedules a lab session; the student sees it", () => {
  it("teacher: prep list, dilution calculator, then a lab session for 10C Chemistry with groups", async () => {
    const { context, page, errors } = await signedInWindow(browser, "teacher", "desktop");
    const { practicalId, title } = await publishedPractical(page);
    const classId = classIdByName("10C Chemistry");

    // The prep list, for 10C (24 students: 8 groups) and a date.
    await page.goto(`/practicals/${practicalId}/prep?class=${classId}&date=${schoolDate(3)}`);
    expect(await page.getByRole("heading", { level: 1 }).textContent()).toBe(title);
    expect(await page.getByLabel("Number of groups").inputValue()).toBe("8");
    expect(await page.getByText(PREP_CHECK_LINE).isVisible()).toBe(true);
    expect(await page.getByRole("table").count()).toBeGreaterThan(0);
    expect(await page.getByRole("heading", { name: "Hazards and protection" }).isVisible()).toBe(true);
    await page.getByLabel("Number of groups").fill("0");
    expect(await page.getByText("Enter a whole number of groups, 1 or more.").isVisible()).toBe(true);
    await page.getByLabel("Number of groups").fill("8");
    await screenshot(page, "scheduling-prep-list");
    await page.emulateMedia({ media: "print" });
    expect(await page.getByRole("region", { name: "Scale the list" }).isVisible()).toBe(false);
    expect(await page.getByRole("navigation", { name: "Main", exact: true }).isVisible()).toBe(false);
    expect(await page.getByText(PREP_CHECK_LINE).isVisible()).toBe(true);
    await screenshot(page, "scheduling-prep-list-print");
    await page.emulateMedia({ media: "screen" });

    // The dilution calculator: an impossible request is refused at the field, then solved.
    await page.goto("/tools");
    await page.getByLabel("Stock concentration, c1 (mol/dm³)").fill("2.0");
    await page.getByLabel("Concentration wanted, c2 (mol/dm³)").fill("3");
    await page.getByLabel("Final volume, V2 (cm³)").fill("100");
    await page.getByRole("button", { name: "Work it out" }).click();
    expect(await page.getByLabel("Concentration wanted, c2 (mol/dm³)").getAttribute("aria-invalid")).toBe("true");
    expect(await page.getByText(/cannot make a solution stronger than the stock/).isVisible()).toBe(true);
    await page.getByLabel("Concentration wanted, c2 (mol/dm³)").fill("0.50");
    await expect.poll(() => page.getByText("V1 = 25 cm³").isVisible(), WAIT).toBe(true);
    expect(await page.getByText(PREP_CHECK_LINE).isVisible()).toBe(true);
    await screenshot(page, "scheduling-tools");

    // Schedule it: first with the due date before the opening, then put right.
    await page.goto("/lab-sessions/new");
    await page.getByLabel("Class", { exact: true }).selectOption({ label: "10C Chemistry (24 students)" });
    const option = page.getByLabel("Practical", { exact: true }).locator("option", { hasText: title }).first();
    await page.getByLabel("Practical", { exact: true }).selectOption((await option.getAttribute("value"))!);
    await page.getByLabel("Opening date", { exact: true }).fill(schoolDate(-1));
    await page.getByLabel("Opening time", { exact: true }).fill("08:00");
    await page.getByLabel("Due date", { exact: true }).fill(schoolDate(-2));
    await page.getByLabel("Groups share one set of data").check();
    await page.getByRole("button", { name: "Auto-make groups of 3" }).click();
    const groups = page.getByRole("list", { name: "Groups" });
    expect(await groups.locator(":scope > li").count()).toBe(8);
    await page.getByRole("combobox", { name: DEMO.student.name, exact: true }).selectOption({ label: "Group 2" });
    await page.getByLabel("Notes (optional)").fill("Meet in lab 2 and bring your lab book.");
    await page.getByRole("button", { name: "Schedule lab session" }).click();
    const summary = page.getByRole("main").getByRole("alert").first();
    await expect.poll(() => summary.textContent(), WAIT).toContain("The due date must be after the opening date.");
    expect(await page.getByLabel("Due date", { exact: true }).getAttribute("aria-invalid")).toBe("true");
    await screenshot(page, "scheduling-form-errors");
    expect(await page.getByLabel("Notes (optional)").inputValue()).toBe("Meet in lab 2 and bring your lab book.");

    await page.getByLabel("Due date", { exact: true }).fill(schoolDate(6));
    await page.getByLabel("Due time", { exact: true }).fill("16:00");
    await page.getByRole("button", { name: "Schedule lab session" }).click();
    await page.waitForURL(/\/lab-sessions\/[^/?]+\?scheduled=1$/, WAIT);
    const id = /\/lab-sessions\/([^/?]+)/.exec(page.url())![1]!;
    expect(await page.getByText("Lab session scheduled").isVisible()).toBe(true);
    expect(await page.getByRole("heading", { name: "Groups sharing data (8)" }).isVisible()).toBe(true);
    expect(await page.getByText("Open now", { exact: true }).first().isVisible()).toBe(true);
    await screenshot(page, "scheduling-lab-session-teacher");

    // The lab session links to its prep list for the class's 8 groups.
    const prepLink = page.getByRole("link", { name: "Prep list for this lab session" });
    expect(await prepLink.getAttribute("href")).toContain("groups=8");
    await prepLink.click();
    await page.waitForURL(/\/prep\?/, WAIT);
    expect(await page.getByLabel("Number of groups").inputValue()).toBe("8");
    expect(await page.getByRole("heading", { level: 1 }).textContent()).toBe(title);

    scheduled = { id, title };
    expectNoErrors(errors);
    await context.close();
  });

  it("teacher, on a phone: the prep list, calculators, schedule form and lab session page fit", async () => {
    expect(scheduled).not.toBeNull();
    const { context, page, errors } = await signedInWindow(browser, "teacher", "phone");
    const { practicalId } = await publishedPractical(page);
    await page.goto(`/practicals/${practicalId}/prep?class=${classIdByName("10C Chemistry")}`);
    await screenshot(page, "scheduling-prep-list");
    await page.goto("/tools");
    await screenshot(page, "scheduling-tools");
    await page.goto("/lab-sessions/new");
    await page.getByLabel("Class", { exact: true }).selectOption({ label: "10C Chemistry (24 students)" });
    await page.getByLabel("Groups share one set of data").check();
    await page.getByRole("button", { name: "Auto-make groups of 3" }).click();
    await screenshot(page, "scheduling-form");
    await page.goto(`/lab-sessions/${scheduled!.id}`);
    expect(await page.getByRole("button", { name: "Change dates, groups or rules" }).isVisible()).toBe(true);
    await screenshot(page, "scheduling-lab-session-teacher");
    for (const wide of await page.locator("main").evaluateAll((els) => els.map((m) => m.scrollWidth))) expect(wide).toBeLessThanOrEqual(390);
    expectNoErrors(errors);
    await context.close();
  });

  for (const viewport of ["desktop", "phone"] as const) {
    it(`student (${viewport}): the new lab session is open on the home page, with their group`, async () => {
      expect(scheduled).not.toBeNull();
      const { context, page, errors, home } = await signedInWindow(browser, "student", viewport);
      const open = home.section("Open now");
      const link = open.locator(`a[href="/lab-sessions/${scheduled!.id}"]`);
      expect(await link.count()).toBe(1);
      expect(await link.innerText()).toContain(scheduled!.title);
      expect(await link.innerText()).toMatch(/Due .*16:00/);
      await screenshot(page, "scheduling-home-student");
      await link.click();
      await page.waitForURL(new RegExp(`/lab-sessions/${scheduled!.id}$`), WAIT);
      expect(await page.getByRole("heading", { level: 1 }).textContent()).toBe(scheduled!.title);
      expect(await page.getByRole("link", { name: "Start your write-up" }).getAttribute("href")).toBe(`/lab-sessions/${scheduled!.id}/write-up`);
      expect(await page.getByText(/You are in/).textContent()).toContain("Group 2");
      expect(await page.getByText("Meet in lab 2 and bring your lab book.").isVisible()).toBe(true);
      expect(await page.getByRole("button", { name: "Cancel this lab session" }).count()).toBe(0);
      await screenshot(page, "scheduling-lab-session-student");
      expectNoErrors(errors);
      await context.close();
    });
  }
});
