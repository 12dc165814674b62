import exifr from "exifr";
import { strFromU8, unzipSync } from "fflate";
import { afterAll, beforeAll, beforeEach, describe, expect, it, vi } from "vitest";
import * as exportRoute from "@/app/api/me/export/route";
import * as eraseRoute from "@/app/api/users/[id]/personal-data/route";
import { getHandle } from "@/db/client";
import { headObject } from "@/lib/storage";
import { signInAs } from "../helpers/session";
import { apiRequest, call } from "../api/helpers";
import { startServers } from "./servers";
import { buildWorld, restore, snapshot, type World } from "./world";

vi.mock("@/lib/auth/session", async () => (await import("../helpers/session")).mockSession());

let world: World;
let image: Buffer;
let servers: Awaited<ReturnType<typeof startServers>>;

beforeAll(async () => {
  servers = await startServers("privacy");
  world = await buildWorld();
  image = snapshot();
}, 120_000);
afterAll(() => servers?.close());
beforeEach(() => restore(image));

const sql = <T>(query: string, ...args: unknown[]) => getHandle().sqlite.prepare(query).all(...args) as T[];
const one = <T>(query: string, ...args: unknown[]) => getHandle().sqlite.prepare(query).get(...args) as T;

async function download(query = "") {
  const res = await exportRoute.GET(apiRequest(`/api/me/export${query}`), { params: Promise.resolve({}) });
  if (res.status !== 200) return { status: res.status, body: await res.json(), files: {} as Record<string, Uint8Array>, data: null as never };
  const files = unzipSync(new Uint8Array(await res.arrayBuffer()));
  const data = JSON.parse(strFromU8(files["personal-data.json"]!));
  return { status: res.status, headers: res.headers, files, data, text: strFromU8(files["personal-data.json"]!) };
}

describe("download everything held about me", () => {
  it("gives a student a zip of their account, classes, write-ups with returned marks and feedback, progress, history, e-mails and their photos", async () => {
    const { student, student2, parent2, classmates } = world.people;
    signInAs(student);
    const got = await download();
    expect(got.status).toBe(200);
    expect(got.headers!.get("content-type")).toBe("application/zip");
    expect(got.headers!.get("content-disposition")).toMatch(/^attachment; filename="meniscus-data-sasha-student-\d{4}-\d{2}-\d{2}\.zip"$/);
    expect(got.headers!.get("cache-control")).toMatch(/no-store/);
    expect(Object.keys(got.files).sort()).toEqual(["README.txt", "personal-data.json", `photos/${world.readyEvidenceId}.jpg`]);

    const d = got.data;
    expect(d.format).toBe("meniscus-personal-data/1");
    expect(d.account).toMatchObject({ id: student.userId, name: "Sasha Student", email: student.email, roles: ["student"], school: "Larchfield Academy" });
    expect(d.account).not.toHaveProperty("passwordHash");
    expect(d.classes.studies.map((c: { name: string }) => c.name)).toEqual(["10C Chemistry"]);
    expect(d.family.guardians.map((g: { name: string }) => g.name)).toEqual(["Pippa Parent"]);
    // Three write-ups: returned (with marks and feedback), open draft, handed in (marks not yet shown).
    const byId = Object.fromEntries(d.writeUps.map((w: { id: string }) => [w.id, w]));
    expect(Object.keys(byId).sort()).toEqual([world.returnedWriteUpId, world.draftWriteUpId, world.submittedWriteUpId].sort());
    expect(byId[world.returnedWriteUpId].mark).toMatchObject({ feedback: "Careful readings.", total: 5, maxTotal: 5 });
    expect(byId[world.submittedWriteUpId].mark).toBeNull();
    expect(byId[world.submittedWriteUpId].markNote).toMatch(/once the work is returned/);
    expect(d.progress.returned.map((r: { writeUpId: string }) => r.writeUpId)).toEqual([world.returnedWriteUpId]);
    expect(d.auditEntries.some((e: { action: string; entityId: string; by: string }) => e.action === "write-up.submit" && e.entityId === world.submittedWriteUpId && e.by === "you")).toBe(true);
    expect(d.photos).toEqual([expect.objectContaining({ id: world.readyEvidenceId, file: `photos/${world.readyEvidenceId}.jpg`, caption: "Apparatus" })]);

    // The photo is the stored, re-encoded image: a JPEG with no camera or location tags.
    const photo = Buffer.from(got.files[`photos/${world.readyEvidenceId}.jpg`]!);
    expect(photo.subarray(0, 3).toString("hex")).toBe("ffd8ff");
    expect(await exifr.parse(photo).catch(() => undefined)).toBeFalsy();

    // Nobody else's personal details.
    for (const other of [student2, parent2, ...classmates]) {
      expect(got.text).not.toContain(other.email);
      expect(got.text).not.toContain(other.name);
    }
    expect(got.text).not.toMatch(/passwordHash|password_hash|tokenHash|\$argon2/);
  });

  it("gives a parent their account, their children and the children's returned work, and the e-mails sent to them", async () => {
    signInAs(world.people.parent);
    const { data: d, text } = await download();
    expect(d.account).toMatchObject({ name: "Pippa Parent", roles: ["parent"] });
    expect(d.family.children).toEqual([expect.objectContaining({ id: world.people.student.userId, name: "Sasha Student" })]);
    expect(d.childrenProgress).toHaveLength(1);
    expect(d.writeUps).toEqual([]);
    expect(d.emails.map((m: { subject: string }) => m.subject)).toContain("Work returned");
    expect(text).not.toContain(world.people.student2.name);
    expect(text).not.toContain(world.people.parent2.email);
  });

  it("only ever exports the signed-in person: an id in the address is ignored, and signed out is 401", async () => {
    signInAs(world.people.student2);
    const got = await download(`?userId=${world.people.student.userId}&studentId=${world.people.student.userId}`);
    expect(got.data.account.id).toBe(world.people.student2.userId);
    expect(got.text).not.toContain(world.people.student.email);
    expect(got.text).not.toContain(world.draftWriteUpId);
    expect(Object.keys(got.files).filter((f) => f.startsWith("photos/"))).toEqual([]);
    signInAs(world.elsewhere.admin);
    expect((await download()).text).not.toContain(world.schoolId);
    signInAs(null);
    expect((await download()).status).toBe(401);
  });
});

describe("an admin deletes a leaver's data", () => {
  const erase = (id: string, confirmName: string) => call(eraseRoute.DELETE, apiRequest(`/api/users/${id}/personal-data`, "DELETE", { confirmName }), { id });

  it("removes the student's write-ups, marks, photos (stored objects too), links and account, and records who did it with the id only", async () => {
    const { admin, student, parent } = world.people;
    const photo = one<{ image_key: string; thumb_key: string }>("SELECT image_key, thumb_key FROM evidence WHERE id = ?", world.readyEvidenceId);
    expect(await headObject(photo.image_key)).not.toBeNull();
    const classmatesWork = one<{ n: number }>("SELECT count(*) AS n FROM write_ups WHERE student_id <> ?", student.userId).n;

    signInAs(admin);
    const res = await erase(student.userId, "  sasha student ");
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ erased: true, id: student.userId, writeUps: 3, photos: 2, classPlaces: 1, familyLinks: 1 });

    expect(sql("SELECT id FROM users WHERE id = ?", student.userId)).toEqual([]);
    expect(sql("SELECT id FROM write_ups WHERE student_id = ?", student.userId)).toEqual([]);
    expect(sql("SELECT id FROM marks WHERE write_up_id IN (?, ?, ?)", world.returnedWriteUpId, world.draftWriteUpId, world.submittedWriteUpId)).toEqual([]);
    expect(sql("SELECT id FROM evidence WHERE write_up_id = ?", world.draftWriteUpId)).toEqual([]);
    expect(sql("SELECT * FROM parent_links WHERE student_id = ?", student.userId)).toEqual([]);
    expect(sql("SELECT * FROM check_attempts WHERE student_id = ?", student.userId)).toEqual([]);
    expect(await headObject(photo.image_key)).toBeNull();
    expect(await headObject(photo.thumb_key)).toBeNull();
    const groups = one<{ groups: string }>("SELECT groups FROM lab_sessions WHERE id = ?", world.openSessionId).groups;
    expect(groups).not.toContain(student.userId);

    // Everyone else's work and the parent's account stay.
    expect(one<{ n: number }>("SELECT count(*) AS n FROM write_ups").n).toBe(classmatesWork);
    expect(sql("SELECT id FROM users WHERE id = ?", parent.userId)).toHaveLength(1);

    // The audit entry: who and when, the id, counts; nothing personal. Earlier entries about them lose their details.
    const entry = one<{ actor_id: string; entity_id: string; after: string; at: number }>("SELECT * FROM audit_log WHERE action = 'user.erase'");
    expect(entry).toMatchObject({ actor_id: admin.userId, entity_id: student.userId });
    expect(entry.at).toBeGreaterThan(Date.now() - 60_000);
    expect(JSON.parse(entry.after)).toEqual({ writeUps: 3, photos: 2, classPlaces: 1, familyLinks: 1, emails: 1 });
    const allAudit = JSON.stringify(sql("SELECT before, after FROM audit_log"));
    expect(allAudit).not.toContain(student.email);
    expect(allAudit).not.toContain("Sasha Student");
  });

  it("erases a parent: links, the e-mails kept for them and the account; the child is untouched", async () => {
    const { admin, parent, student } = world.people;
    signInAs(admin);
    const res = await erase(parent.userId, "Pippa Parent");
    expect(res.status).toBe(200);
    // The "work returned" e-mail and the outbox copy made for the tests.
    expect(res.body).toMatchObject({ writeUps: 0, familyLinks: 1, emails: 2 });
    expect(sql("SELECT id FROM users WHERE id = ?", parent.userId)).toEqual([]);
    expect(sql("SELECT id FROM mail_messages WHERE to_address = ?", parent.email)).toEqual([]);
    expect(sql("SELECT id FROM write_ups WHERE student_id = ?", student.userId)).toHaveLength(3);
  });

  it("refuses, changing nothing: a wrong name, a member of staff, the admin themself, another school's person, anyone but an admin", async () => {
    const { admin, teacher, student, student2 } = world.people;
    const counts = () => JSON.stringify(sql("SELECT (SELECT count(*) FROM users) u, (SELECT count(*) FROM write_ups) w, (SELECT count(*) FROM evidence) e, (SELECT count(*) FROM audit_log) a"));
    const before = counts();
    signInAs(admin);
    const wrongName = await erase(student.userId, "Soren Student");
    expect(wrongName.status).toBe(400);
    expect(wrongName.body.error.fieldErrors.confirmName[0]).toMatch(/exactly/);
    expect((await erase(teacher.userId, teacher.name)).body.error.message).toMatch(/Deactivate a member of staff/);
    expect((await erase(admin.userId, admin.name)).status).toBe(400);
    expect((await erase(world.elsewhere.student.userId, world.elsewhere.student.name)).status).toBe(404);
    signInAs(teacher);
    expect((await erase(student.userId, student.name)).status).toBe(403);
    signInAs(student2);
    expect((await erase(student.userId, student.name)).status).toBe(403);
    expect(counts()).toBe(before);
  });

  it("a leaver whose data was erased can no longer sign in or download anything", async () => {
    signInAs(world.people.admin);
    expect((await erase(world.people.student.userId, "Sasha Student")).status).toBe(200);
    signInAs(world.people.student);
    expect((await download()).status).toBe(401);
  });
});
