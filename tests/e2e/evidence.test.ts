import path from "node:path";
import Database from "better-sqlite3";
import exifr from "exifr";
import type { Browser, CDPSession, Locator, Page } from "playwright-core";
import sharp from "sharp";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { apparatusSvg, crossFlasksSvg, gasSyringeSvg, photograph } from "@/db/seed/evidence-images";
import { expectNoErrors, launchChromium, VIEWPORTS } from "./support/chromium";
import { DEMO } from "./support/demo";
import { signedInWindow } from "./support/session";

const MG = "Magnesium and acid: gas collected over time";
const CHIPS = "Marble chips and powder: mass lost over time";
const PEROXIDE = "Hydrogen peroxide with and without a catalyst";
/** How long to wait for something the server (or storage) has to answer first. */
const WAIT = { timeout: 30_000 };

let browser: Browser;
/** Photos as a phone would take them: the demo's own drawings, with a camera's EXIF and GPS tags added. */
let flask: Buffer;
let syringe: Buffer;
let apparatus: Buffer;
beforeAll(async () => {
  browser = await launchChromium();
  const asFromPhone = async (svg: string) =>
    sharp(await photograph(svg))
      .withExif({ IFD0: { Make: "Lab phone" }, IFD3: { GPSLatitudeRef: "N", GPSLatitude: "51/1 30/1 0/1", GPSLongitudeRef: "W", GPSLongitude: "0/1 7/1 0/1" } })
      .jpeg({ quality: 95 })
      .toBuffer();
  [flask, syringe, apparatus] = await Promise.all([asFromPhone(crossFlasksSvg({ left: "start", right: "after 52 s" })), asFromPhone(gasSyringeSvg(63)), asFromPhone(apparatusSvg())]);
});
afterAll(async () => {
  await browser?.close();
});

/** Ids in the test server's database (read-only): the demo's open lab session, Ellis's write-up, two practicals. */
function demoIds() {
  const db = new Database(inject("databasePath"), { readonly: true, fileMustExist: true });
  try {
    const session = db
      .prepare(`SELECT ls.id FROM lab_sessions ls JOIN classes c ON c.id = ls.class_id JOIN practical_versions pv ON pv.id = ls.practical_version_id WHERE c.name = '10C Chemistry' AND pv.title = ?`)
      .get(MG) as { id: string };
    const writeUp = db.prepare(`SELECT w.id FROM write_ups w JOIN users u ON u.id = w.student_id WHERE u.email = ? AND w.lab_session_id = ?`).get(DEMO.student.email, session.id) as { id: string };
    const chips = db.prepare(`SELECT pv.practical_id AS practicalId, pv.id AS versionId FROM practical_versions pv WHERE pv.title = ? AND pv.status = 'draft'`).get(CHIPS) as { practicalId: string; versionId: string };
    const mg = db.prepare(`SELECT practical_id AS practicalId FROM practical_versions WHERE title = ? AND status = 'published' LIMIT 1`).get(MG) as { practicalId: string };
    // The demo student's sister's returned write-up in 12A (a photo of hers is seeded on it).
    const returned = db
      .prepare(`SELECT w.id AS writeUpId, w.lab_session_id AS labSessionId FROM write_ups w JOIN users u ON u.id = w.student_id JOIN practical_versions pv ON pv.id = w.practical_version_id WHERE u.email = 'noor.marchetti@cobalt-lane.example' AND pv.title = ?`)
      .get(PEROXIDE) as { writeUpId: string; labSessionId: string };
    return { labSessionId: session.id, writeUpId: writeUp.id, chips, mgPracticalId: mg.practicalId, returned };
  } finally {
    db.close();
  }
}

/** Slows uploads to `bytesPerSecond` (-1: no limit) so the progress bar can be seen moving. */
async function throttleUploads(page: Page, bytesPerSecond: number): Promise<CDPSession> {
  const cdp = await page.context().newCDPSession(page);
  await cdp.send("Network.enable");
  await cdp.send("Network.emulateNetworkConditions", { offline: false, latency: 0, downloadThroughput: -1, uploadThroughput: bytesPerSecond });
  return cdp;
}

/**
 * A screenshot of one part of the page at the page's current width: tests/.tmp/screenshots/<name>-<width>.png.
 * A part taller than the window is shot in a window made tall enough: Chromium's capture beyond
 * the window drops the phone's touch emulation, so the picture would show the desktop wording.
 */
async function shootPart(part: Locator, name: string) {
  const page = part.page();
  const viewport = page.viewportSize()!;
  const tag = viewport.width === VIEWPORTS.phone.width ? "phone" : viewport.width === VIEWPORTS.desktop.width ? "desktop" : `${viewport.width}px`;
  const box = await part.boundingBox();
  const tall = !!box && box.height > viewport.height;
  if (tall) await page.setViewportSize({ width: viewport.width, height: Math.ceil(box!.height) + 40 });
  await part.scrollIntoViewIfNeeded();
  await part.screenshot({ path: path.join(inject("screenshotDir"), `${name}-${tag}.png`) });
  if (tall) await page.setViewportSize(viewport);
}

/** The photos of a write-up (or practical) as thumbnails, and whether each has loaded from storage (they load lazily, so the list is scrolled into view). */
async function thumbnails(list: Locator) {
  await list.waitFor(WAIT);
  await list.scrollIntoViewIfNeeded();
  return list.locator("img").evaluateAll((imgs) => imgs.map((i) => ({ loaded: (i as HTMLImageElement).complete && (i as HTMLImageElement).naturalWidth > 0, src: (i as HTMLImageElement).src })));
}

const captions = (list: Locator) => list.locator("figcaption").allInnerTexts();

describe("photo evidence in a student's write-up", () => {
  it("uploads with a progress bar, captions, a larger view, refusals with the reason, a retry after a dropped connection, and delete", async () => {
    const { labSessionId } = demoIds();
    const { context, page, errors } = await signedInWindow(browser, "student");
    await page.goto(`/lab-sessions/${labSessionId}/write-up`);
    const section = page.getByRole("region", { name: "Photos", exact: true });
    const gallery = section.getByRole("list", { name: "Photos", exact: true });

    // The demo's own photos (uploaded by the seed to the local S3 server) are there, loaded through short-lived links.
    await expect.poll(async () => (await thumbnails(gallery)).length, WAIT).toBeGreaterThanOrEqual(2);
    await expect.poll(async () => (await thumbnails(gallery)).every((t) => t.loaded), WAIT).toBe(true);
    const before = await thumbnails(gallery);
    expect(before.every((t) => /X-Amz-Expires=\d+/.test(t.src))).toBe(true);
    expect((await captions(gallery)).some((c) => /^The gas syringe at 30 s: the plunger is at \d+ cm³\.$/.test(c))).toBe(true);
    const count = before.length;

    // A photo uploads slowly enough to watch: a progress bar, a caption typed meanwhile, then the thumbnail.
    const cdp = await throttleUploads(page, 24 * 1024);
    await section.getByLabel("Choose photos to add").setInputFiles({ name: "flask-after.jpg", mimeType: "image/jpeg", buffer: flask });
    const queue = section.getByRole("list", { name: "Photos being added" });
    const row = queue.getByRole("listitem").filter({ hasText: "flask-after.jpg" });
    const bar = row.getByRole("progressbar", { name: "Uploading flask-after.jpg" });
    await bar.waitFor(WAIT);
    await expect.poll(async () => Number(await bar.getAttribute("aria-valuenow")), WAIT).toBeGreaterThan(0);
    expect(Number(await bar.getAttribute("aria-valuenow"))).toBeLessThan(100);
    expect(await row.getByText(/^Uploading: \d+% of \d+ KB$/).isVisible()).toBe(true);
    await row.getByLabel(/^Caption/).fill("Repeat at 20 °C: the cross had gone after 52 s.");
    await shootPart(section, "evidence-uploading");
    await cdp.send("Network.emulateNetworkConditions", { offline: false, latency: 0, downloadThroughput: -1, uploadThroughput: -1 });
    await expect.poll(async () => (await thumbnails(gallery)).length, WAIT).toBe(count + 1);
    await expect.poll(async () => (await thumbnails(gallery)).every((t) => t.loaded), WAIT).toBe(true);
    expect(await captions(gallery)).toContain("Repeat at 20 °C: the cross had gone after 52 s.");
    expect(await queue.count()).toBe(0);

    // The larger view, through its own short-lived link.
    await gallery.getByRole("button", { name: `Larger view of photo ${count + 1}: Repeat at 20 °C: the cross had gone after 52 s.` }).click();
    const viewer = page.getByRole("dialog", { name: `Photo ${count + 1} of ${count + 1}` });
    await viewer.waitFor(WAIT);
    const large = viewer.getByRole("img", { name: "Repeat at 20 °C: the cross had gone after 52 s." });
    await expect.poll(() => large.evaluate((i) => (i as HTMLImageElement).naturalWidth), WAIT).toBe(1200);
    expect(await viewer.getByText("1200 × 900 pixels", { exact: false }).isVisible()).toBe(true);
    // What is stored and served has none of the phone's tags: no GPS, no camera.
    expect((await exifr.gps(flask))?.latitude).toBeCloseTo(51.5, 3);
    const served = await page.request.get((await large.getAttribute("src"))!);
    expect(served.status()).toBe(200);
    expect(await exifr.parse(await served.body())).toBeUndefined();
    await shootPart(viewer, "evidence-viewer");
    await page.keyboard.press("ArrowLeft");
    await page.getByRole("dialog", { name: `Photo ${count} of ${count + 1}` }).waitFor(WAIT);
    await page.keyboard.press("Escape");
    await expect.poll(() => page.getByRole("dialog").count()).toBe(0);

    // Files that are not photos are refused, each with the server's reason: by declared type, and by content.
    const svg = Buffer.from('<svg xmlns="http://www.w3.org/2000/svg" width="10" height="10"><script>alert(1)</script><rect width="10" height="10"/></svg>');
    await section.getByLabel("Choose photos to add").setInputFiles([
      { name: "diagram.svg", mimeType: "image/svg+xml", buffer: svg },
      { name: "renamed.png", mimeType: "image/png", buffer: svg },
    ]);
    const refusedSvg = queue.getByRole("listitem").filter({ hasText: "diagram.svg" });
    const refusedRenamed = queue.getByRole("listitem").filter({ hasText: "renamed.png" });
    await refusedSvg.getByRole("alert").waitFor(WAIT);
    expect(await refusedSvg.getByRole("alert").innerText()).toBe("Not added. Only photos can be added: JPEG, PNG or WebP.");
    await refusedRenamed.getByRole("alert").waitFor(WAIT);
    expect(await refusedRenamed.getByRole("alert").innerText()).toBe("Not added. This file is not a photo Meniscus can read. Use a JPEG, PNG or WebP image.");
    expect((await thumbnails(gallery)).length).toBe(count + 1);
    await shootPart(section, "evidence-refused");
    await page.setViewportSize(VIEWPORTS.phone);
    await shootPart(section, "evidence-refused");
    await page.setViewportSize(VIEWPORTS.desktop);
    await refusedSvg.getByRole("button", { name: "Remove diagram.svg from the list" }).click();
    await refusedRenamed.getByRole("button", { name: "Remove renamed.png from the list" }).click();
    expect(await queue.count()).toBe(0);

    // The connection drops during the upload to storage: the photo waits on this device with the
    // reason, and goes again by itself when the browser is back online.
    let drop = true;
    await page.route(/\/uploads\//, async (route) => {
      if (route.request().method() === "PUT" && drop) {
        drop = false;
        await route.abort("connectionreset");
      } else await route.continue();
    });
    await section.getByLabel("Choose photos to add").setInputFiles({ name: "syringe-close-up.jpg", mimeType: "image/jpeg", buffer: syringe });
    const dropped = queue.getByRole("listitem").filter({ hasText: "syringe-close-up.jpg" });
    await dropped.getByText(/^Not uploaded yet\. The connection dropped while the photo was uploading\./).waitFor(WAIT);
    expect(await dropped.getByRole("button", { name: "Try again" }).isVisible()).toBe(true);
    await dropped.getByLabel(/^Caption/).fill("Close-up of the syringe scale");
    await shootPart(section, "evidence-connection-dropped");
    await context.setOffline(true);
    expect(await page.evaluate(() => navigator.onLine)).toBe(false);
    await context.setOffline(false);
    await expect.poll(async () => (await thumbnails(gallery)).length, WAIT).toBe(count + 2);
    expect(await captions(gallery)).toContain("Close-up of the syringe scale");
    await page.unroute(/\/uploads\//);

    // Deleting one's own photo while the write-up is a draft.
    const item = gallery.getByRole("listitem").filter({ hasText: "Close-up of the syringe scale" });
    await item.getByRole("button", { name: "Delete", exact: true }).click();
    await item.getByRole("button", { name: "Delete photo" }).click();
    await expect.poll(async () => (await thumbnails(gallery)).length, WAIT).toBe(count + 1);
    expect(await captions(gallery)).not.toContain("Close-up of the syringe scale");

    expectNoErrors(errors);
    await context.close();
  });

  it("on a phone: take a photo with the camera, and the photos fit the narrow screen", async () => {
    const { labSessionId } = demoIds();
    const { context, page, errors } = await signedInWindow(browser, "student", "phone");
    await page.goto(`/lab-sessions/${labSessionId}/write-up`);
    const section = page.getByRole("region", { name: "Photos", exact: true });
    const gallery = section.getByRole("list", { name: "Photos", exact: true });
    const count = (await thumbnails(gallery)).length;
    const camera = section.getByLabel("Take a photo with the camera");
    expect(await camera.getAttribute("capture")).toBe("environment");
    expect(await camera.getAttribute("accept")).toBe("image/*");
    expect(await section.getByRole("button", { name: "Take a photo" }).isVisible()).toBe(true);
    await camera.setInputFiles({ name: "IMG_2041.jpg", mimeType: "image/jpeg", buffer: apparatus });
    await expect.poll(async () => (await thumbnails(gallery)).length, WAIT).toBe(count + 1);
    await expect.poll(async () => (await thumbnails(gallery)).every((t) => t.loaded), WAIT).toBe(true);
    expect(await page.evaluate(() => document.documentElement.scrollWidth <= window.innerWidth)).toBe(true);
    await shootPart(section, "evidence-write-up");
    expectNoErrors(errors);
    await context.close();
  });

  it("the teacher sees the photos read-only, with the larger view", async () => {
    const { writeUpId } = demoIds();
    const { context, page, errors } = await signedInWindow(browser, "teacher");
    await page.goto(`/write-ups/${writeUpId}`);
    const section = page.getByRole("region", { name: "Photos", exact: true });
    const gallery = section.getByRole("list", { name: "The student's photos" });
    await expect.poll(async () => (await thumbnails(gallery)).length, WAIT).toBeGreaterThanOrEqual(3);
    await expect.poll(async () => (await thumbnails(gallery)).every((t) => t.loaded), WAIT).toBe(true);
    expect(await section.getByRole("button", { name: /^Delete/ }).count()).toBe(0);
    expect(await section.getByLabel("Choose photos to add").count()).toBe(0);
    await gallery.getByRole("button", { name: /^Larger view of photo 1/ }).click();
    await page.getByRole("dialog", { name: /^Photo 1 of \d+$/ }).waitFor(WAIT);
    await page.keyboard.press("Escape");
    await shootPart(section, "evidence-staff-view");
    await page.setViewportSize(VIEWPORTS.phone);
    await shootPart(section, "evidence-staff-view");
    await page.setViewportSize(VIEWPORTS.desktop);

    // On the marking desk, beside the rubric.
    const { returned } = demoIds();
    await page.goto(`/marking/${returned.labSessionId}/${returned.writeUpId}`);
    const part = page.getByRole("region", { name: "Photos", exact: true });
    const onDesk = part.getByRole("list", { name: "The student's photos" });
    await expect.poll(async () => (await thumbnails(onDesk)).length, WAIT).toBe(1);
    await expect.poll(async () => (await thumbnails(onDesk)).every((t) => t.loaded), WAIT).toBe(true);
    expect((await captions(onDesk))[0]).toMatch(/^With the catalyst: \d+ cm³ of oxygen after 60 s\.$/);
    await shootPart(part, "evidence-marking-desk");
    expectNoErrors(errors);
    await context.close();
  });
});

describe("reference photos on a practical", () => {
  it("the teacher adds one in the editor (Method), and it shows on the practical's page and to students", async () => {
    const { chips, mgPracticalId } = demoIds();
    const { context, page, errors } = await signedInWindow(browser, "teacher");
    await page.goto(`/practicals/${chips.practicalId}/versions/${chips.versionId}/edit#method`);
    const section = page.getByRole("region", { name: "Reference photos" });
    await section.waitFor(WAIT);
    const gallery = section.getByRole("list", { name: "Reference photos" });
    const count = await gallery.count().then(async (n) => (n ? (await thumbnails(gallery)).length : 0));
    const cdp = await throttleUploads(page, 24 * 1024);
    await section.getByLabel("Choose photos to add").setInputFiles({ name: "chips-set-up.jpg", mimeType: "image/jpeg", buffer: apparatus });
    const row = section.getByRole("list", { name: "Photos being added" }).getByRole("listitem").filter({ hasText: "chips-set-up.jpg" });
    await row.getByRole("progressbar", { name: "Uploading chips-set-up.jpg" }).waitFor(WAIT);
    await row.getByLabel(/^Caption/).fill("Flask on the balance with cotton wool in the neck");
    await cdp.send("Network.emulateNetworkConditions", { offline: false, latency: 0, downloadThroughput: -1, uploadThroughput: -1 });
    await expect.poll(async () => (await gallery.count()) && (await thumbnails(gallery)).length, WAIT).toBe(count + 1);
    await expect.poll(async () => captions(gallery), WAIT).toContain("Flask on the balance with cotton wool in the neck");
    await shootPart(section, "evidence-practical-editor");

    // The practical's page: read-only, with the seeded reference photo on the magnesium practical too.
    await page.goto(`/practicals/${chips.practicalId}`);
    const pageGallery = page.getByRole("list", { name: "Reference photos" });
    await expect.poll(async () => captions(pageGallery), WAIT).toContain("Flask on the balance with cotton wool in the neck");
    expect(await page.getByRole("button", { name: /^Delete/ }).count()).toBe(0);
    await page.goto(`/practicals/${mgPracticalId}`);
    const mgGallery = page.getByRole("list", { name: "Reference photos" });
    await expect.poll(async () => (await thumbnails(mgGallery)).length, WAIT).toBe(1);
    expect((await captions(mgGallery))[0]).toMatch(/^The set-up:/);
    await shootPart(page.getByRole("region", { name: "Reference photos" }), "evidence-practical-page");
    expectNoErrors(errors);
    await context.close();

    // The demo student sees the magnesium practical's reference photo beside the method.
    const { labSessionId } = demoIds();
    const student = await signedInWindow(browser, "student");
    await student.page.goto(`/lab-sessions/${labSessionId}/write-up`);
    await student.page.getByText("The practical's aim and method").click();
    const fromTeacher = student.page.getByRole("list", { name: "Photos from your teacher" });
    await expect.poll(async () => (await thumbnails(fromTeacher)).length, WAIT).toBe(1);
    expectNoErrors(student.errors);
    await student.context.close();
  });
});
