import type { Locator, Page } from "playwright-core";
import { DEMO_PASSWORD } from "./demo";

/** /sign-in */
export class SignInPage {
  readonly email: Locator;
  readonly password: Locator;
  readonly submit: Locator;
  readonly error: Locator;
  readonly notice: Locator;

  constructor(readonly page: Page) {
    this.email = page.getByLabel("E-mail", { exact: true });
    this.password = page.getByLabel("Password", { exact: true });
    this.submit = page.getByRole("button", { name: "Sign in", exact: true });
    // Inside <main>: Next's route announcer is another, empty, role="alert" element.
    this.error = page.getByRole("main").getByRole("alert");
    this.notice = page.getByRole("main").getByRole("status");
  }

  async open(query = "") {
    return this.page.goto(`/sign-in${query}`);
  }

  /** Fills the form and submits it; does not wait for where it leads. */
  async submitWith(email: string, password: string) {
    await this.email.fill(email);
    await this.password.fill(password);
    await this.submit.click();
  }

  /** Signs in and waits until the browser has left the sign-in page. */
  async signIn(email: string, password = DEMO_PASSWORD) {
    await this.submitWith(email, password);
    await this.page.waitForURL((url) => url.pathname !== "/sign-in");
  }
}

/** The header every signed-in page has. */
export class AppShell {
  constructor(readonly page: Page) {}

  /** The main menu: the header links on a wide screen, the "Menu" panel on a phone. */
  async menuLinks(): Promise<string[]> {
    if (await this.isPhone()) {
      await this.page.getByText("Menu", { exact: true }).click();
      const names = await this.page.getByRole("navigation", { name: "Main (phone)" }).getByRole("link").allInnerTexts();
      await this.page.getByText("Menu", { exact: true }).click();
      return names.map((n) => n.trim());
    }
    return (await this.page.getByRole("navigation", { name: "Main", exact: true }).getByRole("link").allInnerTexts()).map((n) => n.trim());
  }

  async signOut() {
    if (await this.isPhone()) await this.page.getByText("Menu", { exact: true }).click();
    await this.page.getByRole("button", { name: "Sign out" }).click();
    await this.page.waitForURL((url) => url.pathname === "/sign-in");
  }

  private async isPhone() {
    return (this.page.viewportSize()?.width ?? 1280) < 768;
  }
}

/** The signed-in home page, "/". */
export class HomePage {
  readonly heading: Locator;

  constructor(readonly page: Page) {
    this.heading = page.getByRole("heading", { level: 1 });
  }

  /** A titled section of the page (a region named by its heading). */
  section(name: string): Locator {
    return this.page.getByRole("region", { name, exact: true });
  }

  /** Names of the class cards in a section. */
  async classNames(sectionName: string): Promise<string[]> {
    const cards = this.section(sectionName).getByRole("link");
    const texts = await cards.evaluateAll((links) => links.map((a) => a.querySelector("span")?.textContent ?? ""));
    return texts.sort();
  }
}

/** /invitation and /reset-password: choose a password from an e-mailed link. */
export class ChoosePasswordPage {
  readonly heading: Locator;
  readonly password: Locator;
  readonly confirm: Locator;
  readonly error: Locator;

  constructor(readonly page: Page) {
    this.heading = page.getByRole("heading", { level: 1 });
    this.password = page.getByLabel("New password");
    this.confirm = page.getByLabel("Type it again");
    this.error = page.getByRole("main").getByRole("alert");
  }

  async choose(password: string, confirm = password, button = /Set up my account|Save my new password/) {
    await this.password.fill(password);
    await this.confirm.fill(confirm);
    await this.page.getByRole("button", { name: button }).click();
  }
}
