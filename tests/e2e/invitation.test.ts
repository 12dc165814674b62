import type { Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { baseURL, expectNoErrors, launchChromium, newWindow, screenshot, watchErrors } from "./support/chromium";
import { DEMO, DEMO_PASSWORD } from "./support/demo";
import { AppShell, ChoosePasswordPage, HomePage, SignInPage } from "./support/pages";
import { lastMailRowid, latestMailTo, linkIn } from "./support/test-database";

let browser: Browser;
beforeAll(async () => {
  browser = await launchChromium();
});
afterAll(async () => {
  await browser?.close();
});

describe("accepting an invitation from the mail catcher", () => {
  it("admin sends it, the newcomer chooses a password from the e-mailed link and signs in with it", async () => {
    const newcomer = DEMO.pendingTeacher;
    const context = await newWindow(browser);
    const page = await context.newPage();
    const errors = watchErrors(page);

    // The admin finds the pending account and sends the invitation through the API.
    await new SignInPage(page).open();
    await new SignInPage(page).signIn(DEMO.admin.email);
    const found = await page.request.get(`/api/users?q=${encodeURIComponent(newcomer.email)}`);
    expect(found.status()).toBe(200);
    const people = ((await found.json()) as { people: { id: string; email: string; status: string }[] }).people;
    expect(people.map((p) => [p.email, p.status])).toEqual([[newcomer.email, "invited"]]);
    const since = lastMailRowid();
    const sent = await page.request.post(`/api/users/${people[0]!.id}/invitation`);
    expect(sent.status()).toBe(200);
    const sentBody = (await sent.json()) as Record<string, unknown>;
    expect(sentBody.sent).toBe(true);
    expect(JSON.stringify(sentBody)).not.toMatch(/token/);
    await new AppShell(page).signOut();

    // The message as the mail catcher stored it.
    const mail = await latestMailTo(newcomer.email, { after: since });
    expect(mail.subject).toBe("Your Meniscus account at Cobalt Lane School");
    expect(mail.text).toContain(`${DEMO.admin.name} has set up a Meniscus account for you`);
    const link = linkIn(mail.text);
    expect(link.origin).toBe(baseURL());
    expect(link.pathname).toBe("/invitation");

    // The same link on a phone shows the welcome (looking does not use it up).
    const phone = await newWindow(browser, "phone");
    const phonePage = await phone.newPage();
    await phonePage.goto(link.toString());
    expect(await new ChoosePasswordPage(phonePage).heading.textContent()).toBe(`Welcome, ${newcomer.firstName}`);
    await screenshot(phonePage, "invitation");
    await phone.close();

    const choose = new ChoosePasswordPage(page);
    await page.goto(link.toString());
    expect(await choose.heading.textContent()).toBe(`Welcome, ${newcomer.firstName}`);
    expect(await page.getByText(newcomer.email).isVisible()).toBe(true);
    await screenshot(page, "invitation");

    // A mismatch is caught and shown against the field; then the real choice.
    await choose.choose("a beaker of tea, please", "a beaker of coffee, please");
    await expect.poll(() => page.getByText("The two passwords do not match.").isVisible()).toBe(true);
    expect(await choose.confirm.getAttribute("aria-invalid")).toBe("true");
    await choose.choose("a beaker of tea, please");
    await page.waitForURL((url) => url.pathname === "/sign-in");

    const signIn = new SignInPage(page);
    await expect.poll(() => signIn.notice.textContent()).toBe("Your password is set. Sign in with it now.");
    expect(await signIn.email.inputValue()).toBe(newcomer.email);
    await screenshot(page, "sign-in-after-invitation");
    await signIn.password.fill("a beaker of tea, please");
    await signIn.submit.click();
    await page.waitForURL((url) => url.pathname === "/");
    const home = new HomePage(page);
    expect(await home.heading.textContent()).toBe(`Hello, ${newcomer.firstName}`);
    expect(await home.section("Your classes").innerText()).toContain("You are not teaching any classes yet.");
    await new AppShell(page).signOut();

    // The link works once.
    await page.goto(link.toString());
    expect(await choose.heading.textContent()).toBe("This invitation does not work");
    expect(await choose.error.textContent()).toMatch(/already been used/);
    await screenshot(page, "invitation-used");
    expectNoErrors(errors);
    await context.close();
  });
});

describe("forgotten password", () => {
  it("sends a reset link that replaces the old password", async () => {
    const person = DEMO.physics;
    const context = await newWindow(browser);
    const page = await context.newPage();
    const errors = watchErrors(page);

    await new SignInPage(page).open();
    await page.getByRole("link", { name: "Forgot your password?" }).click();
    await page.waitForURL((url) => url.pathname === "/forgot-password");
    const since = lastMailRowid();
    await page.getByLabel("E-mail", { exact: true }).fill(person.email);
    await page.getByRole("button", { name: "Send me a link" }).click();
    await expect.poll(() => page.getByRole("main").getByRole("status").textContent()).toMatch(/If that address has a Meniscus account, a link to choose a new password is on its way/);

    const mail = await latestMailTo(person.email, { after: since });
    expect(mail.subject).toBe("Reset your Meniscus password");
    const link = linkIn(mail.text);
    expect(link.pathname).toBe("/reset-password");

    const choose = new ChoosePasswordPage(page);
    await page.goto(link.toString());
    expect(await choose.heading.textContent()).toBe("Choose a new password");
    await screenshot(page, "reset-password");
    await choose.choose("short", "short");
    await expect.poll(() => page.getByText("Use at least 10 characters for your password.").isVisible()).toBe(true);
    await choose.choose("ticker timer tape 50 Hz");
    await page.waitForURL((url) => url.pathname === "/sign-in");

    const signIn = new SignInPage(page);
    await signIn.submitWith(person.email, DEMO_PASSWORD);
    await expect.poll(() => signIn.error.textContent()).toMatch(/do not match an account/);
    await signIn.signIn(person.email, "ticker timer tape 50 Hz");
    expect(await new HomePage(page).heading.textContent()).toBe(`Hello, ${person.firstName}`);
    expectNoErrors(errors);
    await context.close();
  });

  it("answers the same for an address with no account, and sends nothing", async () => {
    const context = await newWindow(browser, "phone");
    const page = await context.newPage();
    await page.goto("/forgot-password");
    const since = lastMailRowid();
    await page.getByLabel("E-mail", { exact: true }).fill("nobody.here@cobalt-lane.example");
    await page.getByRole("button", { name: "Send me a link" }).click();
    await expect.poll(() => page.getByRole("main").getByRole("status").textContent()).toMatch(/If that address has a Meniscus account/);
    await screenshot(page, "forgot-password-sent");
    expect(lastMailRowid()).toBe(since);
    await context.close();
  });
});
