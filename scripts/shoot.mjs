// Screenshots for looking at pages while building: node scripts/shoot.mjs <email|-> <out-prefix> <path> [<path>...]
// Signs in (unless the e-mail is "-") and saves desktop and phone screenshots of each path.
import { chromium } from "playwright-core";
import fs from "node:fs";

const [email, prefix, ...paths] = process.argv.slice(2);
const base = process.env.BASE_URL || "http://localhost:3000";
const password = process.env.DEMO_PASSWORD || "lab-notebook-demo";
fs.mkdirSync("screenshots", { recursive: true });
const browser = await chromium.launch({
  executablePath: "/usr/bin/chromium",
  args: ["--headless", "--no-sandbox", "--disable-gpu", "--disable-quic", "--no-first-run", "--disable-background-networking", "--disable-component-update", "--disable-sync"],
});
for (const [w, h, tag] of [[1280, 860, "desktop"], [390, 844, "phone"]]) {
  const ctx = await browser.newContext({ viewport: { width: w, height: h } });
  const page = await ctx.newPage();
  page.on("pageerror", (e) => console.log("pageerror", String(e)));
  if (email !== "-") {
    await page.goto(base + "/sign-in");
    await page.getByLabel("E-mail").fill(email);
    await page.getByLabel("Password").fill(password);
    await page.getByRole("button", { name: "Sign in" }).click();
    await page.waitForURL((u) => !u.pathname.startsWith("/sign-in"), { timeout: 15000 });
  }
  for (const p of paths) {
    const res = await page.goto(base + p, { waitUntil: "networkidle" });
    const file = `screenshots/${prefix}-${p.replace(/[^a-z0-9]+/gi, "_").slice(0, 50)}-${tag}.png`;
    await page.screenshot({ path: file, fullPage: true });
    console.log(res?.status(), file);
  }
  await ctx.close();
}
await browser.close();
