import fs from "node:fs";
import path from "node:path";
import exifr from "exifr";
import sharp from "sharp";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { evidence } from "@/db/schema";
import { scheduleLabSession } from "@/db/queries/lab-sessions";
import { confirmUpload, createUpload, deleteEvidence, listEvidence, sweepOrphanUploads } from "@/db/queries/evidence";
import { createPractical, publishVersion, saveDraft } from "@/db/queries/practicals";
import { openWriteUp } from "@/db/queries/write-ups";
import { startFakeS3 } from "@/lib/dev/fake-s3";
import type { Actor } from "@/lib/auth/actor";
import { AppError } from "@/lib/errors";
import { ensureBucket, headObject, storageSettings } from "@/lib/storage";
import { labSessionSchema } from "@/lib/validation/practicals";
import { freshDatabase, linkParentDirect, makeClass, makeSchool, makeUser, testDb } from "../helpers/db";
import { completePracticalContent } from "../helpers/practicals";

// Storage tests run against a real S3-speaking server (s3rver) over HTTP, never a mock of the SDK.
// s3rver does not verify signatures or expiry, so those are checked on the URL it is given.
let s3: { port: number; close: () => Promise<void> };
const dir = path.join("tests", ".tmp", `s3-${process.pid}-${Date.now()}`);
let student: Actor, classmate: Actor, teacher: Actor, parentOfOther: Actor, outsider: Actor;
let writeUpId: string;

async function caught(fn: () => Promise<unknown>): Promise<AppError> {
  try {
    await fn();
  } catch (e) {
    return e as AppError;
  }
  throw new Error("expected an error");
}

/** A photo as a phone would make it: 6 × 4 pixels with GPS tags in its EXIF. */
async function photoWithGps(): Promise<Buffer> {
  return sharp({ create: { width: 60, height: 40, channels: 3, background: "#5a8fbd" } })
    .jpeg()
    .withExif({ IFD0: { Make: "Test camera", Model: "Lab phone" }, IFD3: { GPSLatitudeRef: "N", GPSLatitude: "51/1 30/1 0/1", GPSLongitudeRef: "W", GPSLongitude: "0/1 7/1 0/1" } })
    .toBuffer();
}

async function upload(actor: Actor, bytes: Buffer, contentType: string, declaredSize = bytes.length) {
  const u = await createUpload({ actor, target: { writeUpId }, filename: "photo.jpg", contentType, size: declaredSize, caption: "Apparatus" });
  const put = await fetch(u.uploadUrl, { method: "PUT", headers: u.headers, body: new Uint8Array(bytes) });
  expect(put.status).toBe(200);
  return u.id;
}

beforeAll(async () => {
  s3 = await startFakeS3({ port: 0, directory: dir, bucket: storageSettings().bucket });
  await ensureBucket();
  freshDatabase();
  const schoolId = makeSchool();
  teacher = makeUser(schoolId, ["teacher"]);
  student = makeUser(schoolId, ["student"]);
  classmate = makeUser(schoolId, ["student"]);
  parentOfOther = makeUser(schoolId, ["parent"]);
  linkParentDirect(parentOfOther, classmate);
  outsider = makeUser(makeSchool(), ["student"]);
  const classId = makeClass(schoolId, { teachers: [teacher], students: [student, classmate] });
  const meta = { title: "Gas", topic: "Rates", yearGroup: 10, subject: "Chemistry" };
  const { versionId } = createPractical({ actor: teacher, input: meta });
  publishVersion({ actor: teacher, versionId, revision: saveDraft({ actor: teacher, versionId, input: { ...meta, content: completePracticalContent(), revision: 0 } }).revision });
  const now = new Date();
  const sessionId = scheduleLabSession({ actor: teacher, input: labSessionSchema.parse({ classId, practicalVersionId: versionId, opensAt: new Date(now.getTime() - 86400_000), dueAt: new Date(now.getTime() + 7 * 86400_000) }) });
  writeUpId = openWriteUp({ actor: student, labSessionId: sessionId }).writeUp.id;
}, 30_000);

afterAll(async () => {
  await s3.close();
  fs.rmSync(dir, { recursive: true, force: true });
});

describe("photo evidence on S3 storage", () => {
  it("uploads through a presigned PUT from fetch(), strips every tag (GPS above all) and serves it by a short-lived link", async () => {
    const original = await photoWithGps();
    expect((await exifr.gps(original))?.latitude).toBeCloseTo(51.5, 5); // the test file really carries GPS
    const id = await upload(student, original, "image/jpeg");
    const ready = await confirmUpload({ actor: student, evidenceId: id });
    expect(ready).toMatchObject({ status: "ready", width: 60, height: 40 });
    expect(ready.sha256).toMatch(/^[0-9a-f]{64}$/);
    const [photo] = await listEvidence({ actor: student, target: { writeUpId } });
    const url = new URL(photo!.imageUrl);
    expect(Number(url.searchParams.get("X-Amz-Expires"))).toBeLessThanOrEqual(300);
    const stored = Buffer.from(await (await fetch(photo!.imageUrl)).arrayBuffer());
    expect(stored.subarray(0, 3)).toEqual(Buffer.from([0xff, 0xd8, 0xff]));
    expect(await exifr.gps(stored)).toBeUndefined();
    expect(await exifr.parse(stored)).toBeUndefined();
    expect((await fetch(photo!.thumbUrl)).status).toBe(200);
    // The upload itself is gone once processed.
    const row = testDb().select().from(evidence).all().find((e) => e.id === id)!;
    expect(await headObject(row.uploadKey)).toBeNull();
  });

  it("applies the camera's orientation before dropping it", async () => {
    const rotated = await sharp({ create: { width: 40, height: 20, channels: 3, background: "#aa3322" } }).jpeg().withMetadata({ orientation: 6 }).toBuffer();
    const id = await upload(student, rotated, "image/jpeg");
    expect(await confirmUpload({ actor: student, evidenceId: id })).toMatchObject({ width: 20, height: 40 });
  });

  it("refuses other students, parents of other children and other schools", async () => {
    expect((await caught(() => listEvidence({ actor: classmate, target: { writeUpId } }))).code).toBe("not_found");
    expect((await caught(() => listEvidence({ actor: parentOfOther, target: { writeUpId } }))).code).toBe("not_found");
    expect((await caught(() => listEvidence({ actor: outsider, target: { writeUpId } }))).code).toBe("not_found");
    expect((await caught(() => createUpload({ actor: classmate, target: { writeUpId }, filename: "x.jpg", contentType: "image/jpeg", size: 10, caption: "" }))).code).toBe("not_found");
    expect((await listEvidence({ actor: teacher, target: { writeUpId } })).length).toBeGreaterThan(0);
  });

  it("refuses wrong types, oversized files, an SVG, a truncated JPEG and a zip named .jpg, each with a reason", async () => {
    expect((await caught(() => createUpload({ actor: student, target: { writeUpId }, filename: "a.zip", contentType: "application/zip", size: 100, caption: "" }))).status).toBe(415);
    expect((await caught(() => createUpload({ actor: student, target: { writeUpId }, filename: "big.jpg", contentType: "image/jpeg", size: 50 * 1024 * 1024, caption: "" }))).status).toBe(413);
    const svg = Buffer.from('<svg xmlns="http://www.w3.org/2000/svg"><script>alert(1)</script></svg>');
    const svgErr = await caught(async () => confirmUpload({ actor: student, evidenceId: await upload(student, svg, "image/png") }));
    expect(svgErr.status).toBe(415);
    expect(svgErr.message).toMatch(/JPEG, PNG or WebP/);
    const good = await photoWithGps();
    const truncErr = await caught(async () => confirmUpload({ actor: student, evidenceId: await upload(student, good.subarray(0, Math.floor(good.length / 2)), "image/jpeg") }));
    expect(truncErr.message).toMatch(/damaged or incomplete/);
    const zip = Buffer.concat([Buffer.from([0x50, 0x4b, 0x03, 0x04]), Buffer.alloc(200, 1)]);
    const zipErr = await caught(async () => confirmUpload({ actor: student, evidenceId: await upload(student, zip, "image/jpeg") }));
    expect(zipErr.status).toBe(415);
    const huge = Buffer.concat([good, Buffer.alloc(13 * 1024 * 1024)]);
    const hugeErr = await caught(async () => confirmUpload({ actor: student, evidenceId: await upload(student, huge, "image/jpeg", 1000) }));
    expect(hugeErr.status).toBe(413);
    // Refused uploads are deleted from storage.
    for (const e of testDb().select().from(evidence).all().filter((x) => x.status === "rejected")) expect(await headObject(e.uploadKey)).toBeNull();
  }, 30_000);

  it("deleting a photo removes its objects; the sweep removes uploads never confirmed", async () => {
    const id = await upload(student, await photoWithGps(), "image/jpeg");
    await confirmUpload({ actor: student, evidenceId: id });
    const row = testDb().select().from(evidence).all().find((e) => e.id === id)!;
    expect(await headObject(row.imageKey!)).not.toBeNull();
    await deleteEvidence({ actor: student, evidenceId: id });
    expect(await headObject(row.imageKey!)).toBeNull();
    expect(await headObject(row.thumbKey!)).toBeNull();
    const pending = await upload(student, await photoWithGps(), "image/jpeg");
    const pendingRow = testDb().select().from(evidence).all().find((e) => e.id === pending)!;
    expect(await sweepOrphanUploads({ olderThanMs: 60_000, now: new Date(Date.now() + 120_000) })).toBeGreaterThan(0);
    expect(await headObject(pendingRow.uploadKey)).toBeNull();
    expect(testDb().select().from(evidence).all().some((e) => e.id === pending)).toBe(false);
  });

  it("gives a clear retry, not a broken record, when storage goes away mid-upload", async () => {
    const u = await createUpload({ actor: student, target: { writeUpId }, filename: "x.jpg", contentType: "image/jpeg", size: 1000, caption: "" });
    const port = s3.port;
    await s3.close();
    await expect(fetch(u.uploadUrl, { method: "PUT", headers: u.headers, body: new Uint8Array(await photoWithGps()) })).rejects.toThrow();
    const err = await caught(() => confirmUpload({ actor: student, evidenceId: u.id }));
    expect(err.status).toBe(503);
    expect(err.message).toMatch(/try again/);
    expect(testDb().select().from(evidence).all().find((e) => e.id === u.id)!.status).toBe("pending");
    // Storage comes back: the same upload is retried and completes.
    s3 = await startFakeS3({ port, directory: dir, bucket: storageSettings().bucket });
    const put = await fetch(u.uploadUrl, { method: "PUT", headers: u.headers, body: new Uint8Array(await photoWithGps()) });
    expect(put.status).toBe(200);
    expect((await confirmUpload({ actor: student, evidenceId: u.id })).status).toBe("ready");
  });
});
