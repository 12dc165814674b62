// Demo photo evidence: a few invented pictures (drawn in evidence-images.ts) on demo write-ups
// and practicals, uploaded to object storage while the demo school is seeded. Storage that is not
// there never stops the seed: the school is created without photos and the reason is logged.
import { randomUUID } from "node:crypto";
import { and, asc, eq, inArray } from "drizzle-orm";
import { fakeS3Started } from "@/lib/dev/fake-s3-state";
import { processPhoto } from "@/lib/images/process-photo";
import { ensureBucket, evidenceKeys, putObject, storageSettings } from "@/lib/storage";
import type { WriteUpContent } from "@/lib/validation/write-ups";
import type { Db } from "../client";
import { evidence, practicalVersions, writeUps } from "../schema";
import { apparatusSvg, crossFlasksSvg, gasSyringeSvg, labBookSvg, photograph } from "./evidence-images";

type Target = { writeUpId: string } | { practicalId: string };

export type DemoPhoto = { target: Target; uploadedById: string | null; caption: string; originalName: string; at: Date; draw: () => string };

/** What the seed needs to find the demo's write-ups and practicals. */
export type EvidenceSeedInput = { schoolId: string; userIds: Map<string, string>; labSessionIds: Map<string, string>; practicalVersionIds: Map<string, string> };

type Logger = Pick<Console, "log" | "warn">;

const cell = (content: WriteUpContent, table: string, row: number, col: string): string => {
  const v = content.tables[table]?.rows[row]?.[col];
  return typeof v === "string" || typeof v === "number" ? String(v).trim() : "";
};

const minutesAfter = (d: Date, m: number) => new Date(d.getTime() + m * 60_000);

/** The photos to make, chosen from what the seed created (deterministic for a given seed). */
export function planDemoPhotos(db: Db, seed: EvidenceSeedInput): DemoPhoto[] {
  const plan: DemoPhoto[] = [];
  const user = (key: string) => seed.userIds.get(key);
  const practicalOf = (key: string) => {
    const versionId = seed.practicalVersionIds.get(key);
    return versionId ? db.select({ practicalId: practicalVersions.practicalId, createdById: practicalVersions.createdById, createdAt: practicalVersions.createdAt }).from(practicalVersions).where(eq(practicalVersions.id, versionId)).get() : undefined;
  };
  const writeUpsOf = (sessionKey: string, statuses: ("draft" | "submitted" | "marked" | "returned")[]) => {
    const sessionId = seed.labSessionIds.get(sessionKey);
    if (!sessionId) return [];
    return db
      .select({ id: writeUps.id, studentId: writeUps.studentId, content: writeUps.content, createdAt: writeUps.createdAt })
      .from(writeUps)
      .where(and(eq(writeUps.labSessionId, sessionId), inArray(writeUps.status, statuses)))
      .orderBy(asc(writeUps.createdAt), asc(writeUps.id))
      .all();
  };

  // The teacher's reference photos on two practicals.
  const mg = practicalOf("mg-acid");
  if (mg) {
    plan.push({
      target: { practicalId: mg.practicalId },
      uploadedById: user("teacher") ?? mg.createdById,
      caption: "The set-up: conical flask with a bung, delivery tube to the gas syringe, syringe clamped level. Check the plunger moves freely before adding the magnesium.",
      originalName: "set-up.jpg",
      at: minutesAfter(mg.createdAt, 30),
      draw: apparatusSvg,
    });
  }
  const thio = practicalOf("thiosulfate");
  if (thio) {
    plan.push({
      target: { practicalId: thio.practicalId },
      uploadedById: user("hod") ?? thio.createdById,
      caption: "What to look for: the cross is clear at the start (left); stop the clock when the cloudy sulfur hides it from above (right).",
      originalName: "cross-reference.jpg",
      at: minutesAfter(thio.createdAt, 45),
      draw: () => crossFlasksSvg({ left: "start", right: "cross gone" }),
    });
  }

  // The demo student's open write-up: the syringe at 30 s and the lab book page.
  const ellis = writeUpsOf("10C-mg", ["draft"]).find((w) => w.studentId === user("student"));
  if (ellis) {
    const at30 = Number(cell(ellis.content, "gas", 3, "v")) || 41;
    const rows = (ellis.content.tables.gas?.rows ?? [])
      .map((_, i) => [cell(ellis.content, "gas", i, "t"), cell(ellis.content, "gas", i, "v")] as [string, string])
      .filter(([t, v]) => t && v)
      .slice(0, 10);
    plan.push({ target: { writeUpId: ellis.id }, uploadedById: ellis.studentId, caption: `The gas syringe at 30 s: the plunger is at ${at30} cm³.`, originalName: "IMG_0412.jpg", at: minutesAfter(ellis.createdAt, 35), draw: () => gasSyringeSvg(at30) });
    plan.push({
      target: { writeUpId: ellis.id },
      uploadedById: ellis.studentId,
      caption: "My results in my lab book, before I typed them in.",
      originalName: "IMG_0415.jpg",
      at: minutesAfter(ellis.createdAt, 50),
      draw: () => labBookSvg({ title: "Mg + HCl: gas collected", columns: ["Time / s", "Volume / cm³"], rows: rows.length ? rows : [["0", "0"], ["10", "18"], ["20", "31"], ["30", "41"]], seed: 41 }),
    });
  }

  // Two handed-in write-ups in 10D (on the marking desk) with a syringe reading each.
  for (const w of writeUpsOf("10D-mg", ["submitted", "marked", "returned"]).slice(0, 2)) {
    const at30 = Number(cell(w.content, "gas", 3, "v"));
    if (!Number.isFinite(at30) || at30 <= 0) continue;
    plan.push({ target: { writeUpId: w.id }, uploadedById: w.studentId, caption: `Reading at 30 s: ${at30} cm³ of hydrogen.`, originalName: "photo.jpg", at: minutesAfter(w.createdAt, 40), draw: () => gasSyringeSvg(at30) });
  }

  // The demo student's sister in 12A: the cross at 40 °C (open write-up), and oxygen collected (returned, so her parent sees it too).
  const noorThio = writeUpsOf("12A-thio", ["draft"]).find((w) => w.studentId === user("sibling"));
  if (noorThio) {
    const t = Number(cell(noorThio.content, "times", 2, "t1"));
    const secs = Number.isFinite(t) && t > 0 ? Math.round(t) : 36;
    plan.push({
      target: { writeUpId: noorThio.id },
      uploadedById: noorThio.studentId,
      caption: `40 °C, first run: the cross had gone after ${secs} s. The flask on the left is a fresh one for comparison.`,
      originalName: "cross-40C.jpg",
      at: minutesAfter(noorThio.createdAt, 25),
      draw: () => crossFlasksSvg({ left: "start", right: `after ${secs} s` }),
    });
  }
  const noorPeroxide = writeUpsOf("12A-peroxide", ["returned", "marked", "submitted"]).find((w) => w.studentId === user("sibling"));
  if (noorPeroxide) {
    const v60 = Number(cell(noorPeroxide.content, "o2", 3, "vc"));
    if (Number.isFinite(v60) && v60 > 0) {
      plan.push({ target: { writeUpId: noorPeroxide.id }, uploadedById: noorPeroxide.studentId, caption: `With the catalyst: ${v60} cm³ of oxygen after 60 s.`, originalName: "syringe-catalyst.jpg", at: minutesAfter(noorPeroxide.createdAt, 30), draw: () => gasSyringeSvg(v60) });
    }
  }
  return plan;
}

function withTimeout<T>(promise: Promise<T>, ms: number, what: string): Promise<T> {
  let timer: NodeJS.Timeout | undefined;
  return Promise.race([
    promise,
    new Promise<never>((_, reject) => {
      timer = setTimeout(() => reject(new Error(`${what} took longer than ${ms / 1000} s`)), ms);
    }),
  ]).finally(() => clearTimeout(timer));
}

/**
 * Draws, checks (the same processing as a real upload: re-encoded, no metadata, a thumbnail)
 * and stores the demo photos. Returns how many were added; never throws.
 */
export async function seedDemoEvidence(db: Db, seed: EvidenceSeedInput, { log = console }: { log?: Logger } = {}): Promise<number> {
  const settings = storageSettings();
  if (settings.isFake && !fakeS3Started()) {
    log.log("[meniscus] demo photos skipped: the built-in S3 storage is not running in this process.");
    return 0;
  }
  try {
    await withTimeout(ensureBucket(), 10_000, "Reaching photo storage");
  } catch (e) {
    log.warn(`[meniscus] demo photos skipped: photo storage at ${settings.endpoint} is not reachable (${(e as Error).message}). The demo school is seeded without them.`);
    return 0;
  }
  let added = 0;
  let plan: DemoPhoto[];
  try {
    plan = planDemoPhotos(db, seed);
  } catch (e) {
    log.warn(`[meniscus] demo photos skipped: ${(e as Error).message}`);
    return 0;
  }
  // Drawing and re-encoding is the slow part (about half a second a photo): two at a time, stored in plan order.
  const rendered = new Map<DemoPhoto, Promise<{ original: Buffer; processed: Awaited<ReturnType<typeof processPhoto>> }>>();
  const render = (photo: DemoPhoto | undefined) => {
    if (photo && !rendered.has(photo)) {
      const job = Promise.resolve()
        .then(() => photograph(photo.draw()))
        .then(async (original) => ({ original, processed: await processPhoto(original) }));
      job.catch(() => {}); // awaited below; a failure there stops the loop
      rendered.set(photo, job);
    }
  };
  for (const [i, photo] of plan.entries()) {
    render(photo);
    render(plan[i + 1]);
    try {
      const { original, processed } = await rendered.get(photo)!;
      const id = randomUUID();
      const keys = evidenceKeys(seed.schoolId, photo.target, id);
      await withTimeout(
        (async () => {
          await putObject(keys.image, processed.image, "image/jpeg");
          await putObject(keys.thumb, processed.thumb, "image/jpeg");
        })(),
        20_000,
        "Storing a photo",
      );
      db.insert(evidence)
        .values({
          id,
          schoolId: seed.schoolId,
          writeUpId: "writeUpId" in photo.target ? photo.target.writeUpId : null,
          practicalId: "practicalId" in photo.target ? photo.target.practicalId : null,
          uploadedById: photo.uploadedById,
          caption: photo.caption,
          status: "ready",
          uploadKey: keys.upload,
          imageKey: keys.image,
          thumbKey: keys.thumb,
          declaredType: "image/jpeg",
          declaredSize: original.length,
          originalName: photo.originalName,
          size: processed.image.length,
          width: processed.width,
          height: processed.height,
          sha256: processed.sha256,
          confirmedAt: photo.at,
          createdAt: photo.at,
        })
        .run();
      added++;
    } catch (e) {
      log.warn(`[meniscus] demo photos: stopped after ${added} of ${plan.length} (${(e as Error).message}).`);
      break;
    }
  }
  return added;
}
