import fs from "node:fs";
import net from "node:net";
import path from "node:path";
import exifr from "exifr";
import sharp from "sharp";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { listEvidence } from "@/db/queries/evidence";
import { loadActor } from "@/db/queries/users";
import { evidence, practicalVersions } from "@/db/schema";
import { planDemoPhotos } from "@/db/seed/evidence";
import { apparatusSvg, crossFlasksSvg, gasSyringeSvg, labBookSvg, photograph, PHOTO_HEIGHT, PHOTO_WIDTH } from "@/db/seed/evidence-images";
import { seedDemoSchool, type SeedResult } from "@/db/seed/index";
import { startFakeS3 } from "@/lib/dev/fake-s3";
import { getObjectBytes, headObject, storageSettings } from "@/lib/storage";
import { freshDatabase } from "../helpers/db";

// The demo photos go to a real S3-speaking server (s3rver over HTTP) while the demo school is
// seeded; when storage is not there the seed still succeeds, without photos.
const dir = path.join("tests", ".tmp", `s3-seed-${process.pid}-${Date.now()}`);
const now = new Date("2026-12-01T10:00:00Z");
let s3: { port: number; close: () => Promise<void> };

beforeAll(async () => {
  s3 = await startFakeS3({ port: 0, directory: dir, bucket: storageSettings().bucket });
}, 30_000);

afterAll(async () => {
  await s3.close();
  fs.rmSync(dir, { recursive: true, force: true });
});

describe("demo photos", () => {
  it("are drawn at a phone photo's size, as real JPEGs", async () => {
    for (const svg of [gasSyringeSvg(41), crossFlasksSvg({ left: "start", right: "after 36 s" }), labBookSvg({ title: "t", columns: ["a", "b"], rows: [["0", "0"]], seed: 1 }), apparatusSvg()]) {
      const jpeg = await photograph(svg);
      const meta = await sharp(jpeg).metadata();
      expect(meta).toMatchObject({ format: "jpeg", width: PHOTO_WIDTH, height: PHOTO_HEIGHT });
    }
  }, 30_000);

  it("are stored during the seed, processed like any upload, and shown to the people allowed to see them", async () => {
    const { db } = freshDatabase();
    const res: SeedResult = await seedDemoSchool(db, { now });
    const rows = db.select().from(evidence).all();
    expect(res.photos).toBe(rows.length);
    // Two practicals' reference photos, the demo student's two, two in 10D and two of the sister's.
    expect(rows.length).toBe(8);
    expect(rows.filter((r) => r.practicalId).length).toBe(2);
    for (const r of rows) {
      expect(r).toMatchObject({ status: "ready", width: PHOTO_WIDTH, height: PHOTO_HEIGHT });
      expect(r.caption.length).toBeGreaterThan(10);
      expect(r.sha256).toMatch(/^[0-9a-f]{64}$/);
      expect((await headObject(r.imageKey!))?.size).toBe(r.size);
      expect(await headObject(r.thumbKey!)).not.toBeNull();
      expect(r.imageKey!.startsWith(`schools/${res.schoolId}/`)).toBe(true);
    }
    // Re-encoded like an upload: no metadata at all in what is stored.
    expect(await exifr.parse(await getObjectBytes(rows[0]!.imageKey!))).toBeUndefined();

    const student = loadActor(res.userIds.get("student")!)!;
    const teacher = loadActor(res.userIds.get("teacher")!)!;
    const own = rows.filter((r) => r.uploadedById === student.userId);
    expect(own.length).toBe(2);
    const listed = await listEvidence({ actor: student, target: { writeUpId: own[0]!.writeUpId! } });
    expect(listed.map((p) => p.caption).sort()).toEqual(own.map((r) => r.caption).sort());
    expect(listed.every((p) => p.canDelete)).toBe(true);
    // The caption quotes the syringe reading from the student's own results table.
    expect(listed.some((p) => /^The gas syringe at 30 s: the plunger is at \d+ cm³\.$/.test(p.caption))).toBe(true);
    expect((await listEvidence({ actor: teacher, target: { writeUpId: own[0]!.writeUpId! } })).length).toBe(2);
    const mgPractical = db.select({ practicalId: practicalVersions.practicalId }).from(practicalVersions).all().find((v) => rows.some((r) => r.practicalId === v.practicalId));
    expect((await listEvidence({ actor: student, target: { practicalId: mgPractical!.practicalId } })).length).toBe(1);
  }, 60_000);

  it("chooses the same photos for the same seed", async () => {
    const { db } = freshDatabase();
    const res = await seedDemoSchool(db, { now, photos: false });
    expect(res.photos).toBe(0);
    const a = planDemoPhotos(db, res).map((p) => [p.caption, p.originalName]);
    const b = planDemoPhotos(db, res).map((p) => [p.caption, p.originalName]);
    expect(a).toEqual(b);
    expect(a.length).toBe(8);
  });

  it("leave the seed alone when storage is down: the school is seeded without them and the reason is logged", async () => {
    // A port that was free a moment ago: nothing answers there.
    const port = await new Promise<number>((resolve) => {
      const srv = net.createServer().listen(0, "127.0.0.1", () => {
        const p = (srv.address() as net.AddressInfo).port;
        srv.close(() => resolve(p));
      });
    });
    vi.stubEnv("S3_ENDPOINT", `http://127.0.0.1:${port}`);
    vi.stubEnv("S3_ACCESS_KEY_ID", "nobody");
    vi.stubEnv("S3_SECRET_ACCESS_KEY", "nothing");
    const warn = vi.spyOn(console, "warn").mockImplementation(() => {});
    try {
      const { db } = freshDatabase();
      const res = await seedDemoSchool(db, { now });
      expect(res.photos).toBe(0);
      expect(res.userIds.size).toBeGreaterThan(50);
      expect(db.select().from(evidence).all()).toEqual([]);
      expect(warn.mock.calls.flat().join(" ")).toMatch(/demo photos skipped: photo storage at http:\/\/127\.0\.0\.1:\d+ is not reachable/);
    } finally {
      warn.mockRestore();
      vi.unstubAllEnvs();
    }
  }, 60_000);
});
