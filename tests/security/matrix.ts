import { NextRequest } from "next/server";
import type { Actor } from "@/lib/auth/actor";
import { signInRequest } from "./next-auth-flow";
import { DAY, INVITATION_TOKEN, RESET_TOKEN, WORLD_PASSWORD, type World } from "./world";

/**
 * Who may call each route handler, and a request that succeeds for them, aimed at the home
 * school's records of tests/security/world.ts. Used by the authorisation matrix and the
 * hostile-input suite.
 */

export const CALLERS = ["signed-out", "admin", "teacher", "teacher2", "moderator", "student", "student2", "parent", "parent2", "x-admin", "x-teacher", "x-moderator", "x-student", "x-parent"] as const;
export type Caller = (typeof CALLERS)[number];
export const CALLER_NOTES: Record<Caller, string> = {
  "signed-out": "no session",
  admin: "admin of the home school",
  teacher: "teaches the class the records belong to",
  teacher2: "teacher of another class in the same school",
  moderator: "moderator the sample was drawn for",
  student: "the student whose work it is",
  student2: "another student in the same school",
  parent: "parent linked to the student",
  parent2: "parent of another child in the same school",
  "x-admin": "admin of another school",
  "x-teacher": "teacher of another school",
  "x-moderator": "moderator of another school",
  "x-student": "student of another school",
  "x-parent": "parent of another school",
};

const SIGNED_IN = CALLERS.filter((c) => c !== "signed-out");
const EVERYONE = [...CALLERS];
const HOME_STAFF: Caller[] = ["admin", "teacher", "teacher2"];
export const ELSEWHERE: Caller[] = ["x-admin", "x-teacher", "x-moderator", "x-student", "x-parent"];

export type Spec = { params?: Record<string, string>; query?: string; body?: unknown };
export type Entry = {
  /** Who succeeds (2xx). */
  allow: readonly Caller[];
  /** The request, aimed at the home school's records. */
  req: (w: World, caller: Caller) => Spec | Promise<NextRequest>;
  /**
   * The body names people or records by id; one of another school is answered like an id that
   * does not exist: 400 with the field named (never a hint that it exists elsewhere).
   */
  idsInBody?: true;
};

const doc = (text: string) => ({ type: "doc", content: [{ type: "paragraph", content: [{ type: "text", text }] }] });
const empty = { type: "doc", content: [] };
const labSessionBody = (w: World) => ({ classId: w.classId, practicalVersionId: w.versionId, opensAt: new Date(Date.now() - DAY).toISOString(), dueAt: new Date(Date.now() + 9 * DAY).toISOString() });
const meta = { title: "Density of a rock", topic: "Density", yearGroup: 9, subject: "Physics" };
const rubric = { title: "Method and accuracy", style: "marks", criteria: [{ id: "c1", title: "Method", levels: [{ id: "l0", label: "Not yet", marks: 0 }, { id: "l1", label: "Secure", marks: 2 }] }] };
let uniqueEmail = 0;

/**
 * Route × who may call it. Keys are "METHOD /api/path" as the files name them. Lists and
 * creations act in the caller's own school, so another school's people with the right role may
 * call them too; their answers are checked to carry nothing of the home school.
 */
export const MATRIX: Record<string, Entry> = {
  // --- Admin: people, classes, families, outbox, audit
  "GET /api/audit": { allow: ["admin", "x-admin"], req: (w) => ({ query: `entityId=${w.people.student.userId}` }) },
  "GET /api/users": { allow: ["admin", "x-admin"], req: () => ({}) },
  "POST /api/users": { allow: ["admin", "x-admin"], req: () => ({ body: { name: "New Person", email: `new.person${++uniqueEmail}@test.example`, roles: ["teacher"], sendInvitation: false } }) },
  "GET /api/users/[id]": { allow: ["admin"], req: (w) => ({ params: { id: w.people.student.userId } }) },
  "PATCH /api/users/[id]": { allow: ["admin"], req: (w) => ({ params: { id: w.people.student.userId }, body: { name: "Sasha Renamed" } }) },
  "POST /api/users/[id]/invitation": { allow: ["admin"], req: (w) => ({ params: { id: w.people.pending.userId } }) },
  "DELETE /api/users/[id]/personal-data": { allow: ["admin"], req: (w) => ({ params: { id: w.people.student2.userId }, body: { confirmName: "Soren Student" } }) },
  "GET /api/people-picker": { allow: ["admin", "x-admin"], req: () => ({ query: "role=student" }) },
  "GET /api/classes": { allow: SIGNED_IN, req: () => ({}) },
  "POST /api/classes": { allow: ["admin", "x-admin"], req: () => ({ body: { name: "9Z Biology", subject: "Biology", yearGroup: 9, academicYear: "2026-27" } }) },
  "GET /api/classes/[id]": { allow: ["admin", "teacher", "student"], req: (w) => ({ params: { id: w.classId } }) },
  "PATCH /api/classes/[id]": { allow: ["admin"], req: (w) => ({ params: { id: w.classId }, body: { subject: "Science" } }) },
  "POST /api/classes/[id]/students": { allow: ["admin"], req: (w) => ({ params: { id: w.classId }, body: { studentIds: [w.people.student2.userId] } }) },
  "DELETE /api/classes/[id]/students/[studentId]": { allow: ["admin"], req: (w) => ({ params: { id: w.classId, studentId: w.people.student.userId } }) },
  "POST /api/classes/[id]/roster": { allow: ["admin"], req: (w) => ({ params: { id: w.classId }, body: { csv: "name,email\nKit Ashdown,kit@test.example", commit: false } }) },
  "POST /api/family-links": { allow: ["admin"], idsInBody: true, req: (w) => ({ body: { parentId: w.people.parent2.userId, studentId: w.people.student.userId, relationship: "Aunt" } }) },
  "DELETE /api/family-links": { allow: ["admin"], req: (w) => ({ body: { parentId: w.people.parent.userId, studentId: w.people.student.userId } }) },
  "GET /api/outbox": { allow: ["admin", "x-admin"], req: () => ({}) },
  "GET /api/outbox/[id]": { allow: ["admin"], req: (w) => ({ params: { id: w.mailId } }) },

  // --- Own account
  "GET /api/me": { allow: SIGNED_IN, req: () => ({}) },
  "PATCH /api/me": { allow: SIGNED_IN, req: () => ({ body: { emailNotifications: false } }) },
  "POST /api/me/password": { allow: SIGNED_IN, req: () => ({ body: { current: WORLD_PASSWORD, password: "a-new-long-passphrase-42", confirm: "a-new-long-passphrase-42" } }) },
  "GET /api/me/children": { allow: ["parent", "parent2", "x-parent"], req: () => ({}) },
  "GET /api/me/export": { allow: SIGNED_IN, req: () => ({}) },

  // --- Public: the single-use token or the password is the proof
  "GET /api/auth/[...nextauth]": { allow: EVERYONE, req: () => ({ params: { nextauth: "providers" } }) },
  "POST /api/auth/[...nextauth]": { allow: EVERYONE, req: (w) => signInRequest(w.people.student.email, WORLD_PASSWORD) },
  "POST /api/invitations/accept": { allow: EVERYONE, req: () => ({ body: { token: INVITATION_TOKEN, password: "first-passphrase-for-nia", confirm: "first-passphrase-for-nia" } }) },
  "POST /api/password-reset/request": { allow: EVERYONE, req: () => ({ body: { email: `nobody${++uniqueEmail}@test.example` } }) },
  "POST /api/password-reset/confirm": { allow: EVERYONE, req: () => ({ body: { token: RESET_TOKEN, password: "reset-passphrase-for-tamsin", confirm: "reset-passphrase-for-tamsin" } }) },

  // --- Practicals library and rubrics (staff; any teacher of the department may edit)
  "GET /api/practicals": { allow: ["admin", "teacher", "teacher2", "moderator", "x-admin", "x-teacher", "x-moderator"], req: () => ({}) },
  "POST /api/practicals": { allow: ["admin", "teacher", "teacher2", "x-admin", "x-teacher"], req: () => ({ body: meta }) },
  "GET /api/practicals/[id]": { allow: ["admin", "teacher", "teacher2", "moderator"], req: (w) => ({ params: { id: w.practicalId } }) },
  "PATCH /api/practicals/[id]": { allow: HOME_STAFF, req: (w) => ({ params: { id: w.practicalId }, body: { archived: true } }) },
  "POST /api/practicals/[id]/drafts": { allow: HOME_STAFF, req: (w) => ({ params: { id: w.practicalId } }) },
  "POST /api/practicals/[id]/duplicate": { allow: HOME_STAFF, req: (w) => ({ params: { id: w.practicalId } }) },
  "GET /api/practical-versions/[id]": { allow: ["admin", "teacher", "teacher2", "moderator"], req: (w) => ({ params: { id: w.versionId } }) },
  "PUT /api/practical-versions/[id]": { allow: HOME_STAFF, req: (w) => ({ params: { id: w.draftVersionId }, body: { ...meta, content: { aim: "Find the density.", introduction: empty, method: empty }, revision: w.draftRevision } }) },
  "POST /api/practical-versions/[id]/publish": { allow: HOME_STAFF, req: (w) => ({ params: { id: w.draftVersionId }, body: { revision: w.draftRevision } }) },
  "POST /api/checks/preview": {
    allow: ["admin", "teacher", "teacher2", "x-admin", "x-teacher"],
    req: () => ({
      body: {
        check: { id: "k1", label: "Mean rate", kind: "mean-rate", tableId: "t1", x: "time", y: "vol", from: 0, to: 30, tolerancePercent: 5, expectedUnit: "cm³/s" },
        table: { id: "t1", title: "Gas", rowCount: 4, columns: [{ id: "time", quantity: "time", symbol: "t", unit: "s", role: "independent", resolution: 1, decimalPlaces: 0 }, { id: "vol", quantity: "volume", symbol: "V", unit: "cm³", role: "dependent", resolution: 1, decimalPlaces: 0 }] },
        rows: [{ time: "0", vol: "0" }, { time: "10", vol: "18" }, { time: "20", vol: "31" }, { time: "30", vol: "41" }],
        answer: { value: "1.37", unit: "cm³/s" },
      },
    }),
  },
  "GET /api/rubrics": { allow: ["admin", "teacher", "teacher2", "moderator", "x-admin", "x-teacher", "x-moderator"], req: () => ({}) },
  "POST /api/rubrics": { allow: ["admin", "teacher", "teacher2", "x-admin", "x-teacher"], req: () => ({ body: rubric }) },
  "GET /api/rubrics/[id]": { allow: ["admin", "teacher", "teacher2", "moderator"], req: (w) => ({ params: { id: w.rubricId } }) },
  "PATCH /api/rubrics/[id]": { allow: HOME_STAFF, req: (w) => ({ params: { id: w.rubricId }, body: { revision: 0, body: rubric } }) },

  // --- Lab sessions (the class's teachers and admins schedule; its students and their parents see)
  "GET /api/lab-sessions": { allow: SIGNED_IN, req: () => ({}) },
  "POST /api/lab-sessions": { allow: ["admin", "teacher"], req: (w) => ({ body: labSessionBody(w) }) },
  "GET /api/lab-sessions/[id]": { allow: ["admin", "teacher", "student"], req: (w) => ({ params: { id: w.openSessionId } }) },
  "PUT /api/lab-sessions/[id]": { allow: ["admin", "teacher"], req: (w) => ({ params: { id: w.submittedSessionId }, body: labSessionBody(w) }) },
  "DELETE /api/lab-sessions/[id]": { allow: ["admin", "teacher"], req: (w) => ({ params: { id: w.submittedSessionId } }) },
  "POST /api/lab-sessions/[id]/write-up": { allow: ["student"], req: (w) => ({ params: { id: w.openSessionId } }) },
  "GET /api/lab-sessions/[id]/write-ups": { allow: ["admin", "teacher"], req: (w) => ({ params: { id: w.openSessionId } }) },
  "GET /api/lab-sessions/[id]/bench": { allow: ["admin", "teacher"], req: (w) => ({ params: { id: w.markedSessionId } }) },
  "GET /api/lab-sessions/[id]/marks-csv": { allow: ["admin", "teacher"], req: (w) => ({ params: { id: w.markedSessionId } }) },

  // --- Write-ups (the student writes; the class's teachers and admins read and mark)
  "GET /api/write-ups/[id]": { allow: ["admin", "teacher", "student"], req: (w) => ({ params: { id: w.draftWriteUpId } }) },
  "PUT /api/write-ups/[id]": { allow: ["student"], req: (w) => ({ params: { id: w.draftWriteUpId }, body: { revision: 0, content: { sections: { plan: doc("Measure every 10 s."), observations: empty, conclusion: empty, evaluation: empty } } } }) },
  "PUT /api/write-ups/[id]/group-tables": { allow: ["student"], req: (w) => ({ params: { id: w.draftWriteUpId }, body: { revision: 0, tables: { t1: { rows: [{ time: "0", vol: "0" }], decisions: {} } } } }) },
  "POST /api/write-ups/[id]/safety": { allow: ["student"], req: (w) => ({ params: { id: w.draftWriteUpId } }) },
  "POST /api/write-ups/[id]/checks/[checkId]": { allow: ["student"], req: (w) => ({ params: { id: w.draftWriteUpId, checkId: "k1" }, body: { answer: { value: "1.4", unit: "cm³/s" } } }) },
  "POST /api/write-ups/[id]/submit": { allow: ["student"], req: (w) => ({ params: { id: w.draftWriteUpId }, body: { revision: 0 } }) },
  "POST /api/write-ups/[id]/reopen": { allow: ["admin", "teacher"], req: (w) => ({ params: { id: w.submittedWriteUpId } }) },
  "GET /api/write-ups/[id]/marking": { allow: ["admin", "teacher"], req: (w) => ({ params: { id: w.submittedWriteUpId } }) },
  "PUT /api/write-ups/[id]/mark": { allow: ["teacher"], req: (w) => ({ params: { id: w.submittedWriteUpId }, body: { revision: 0, criteria: { c1: { levelId: "l1" } }, comments: {}, feedback: "Good start." } }) },
  "POST /api/write-ups/[id]/return": { allow: ["teacher"], req: (w) => ({ params: { id: w.markedWriteUpId } }) },

  // --- Photo evidence (the student on their own open write-up)
  "GET /api/evidence": { allow: ["admin", "teacher", "student"], req: (w) => ({ query: `writeUpId=${w.draftWriteUpId}` }) },
  "POST /api/evidence": { allow: ["student"], req: (w) => ({ body: { writeUpId: w.draftWriteUpId, filename: "bench.jpg", contentType: "image/jpeg", size: 2048, caption: "Set-up" } }) },
  "POST /api/evidence/[id]/confirm": { allow: ["student"], req: (w) => ({ params: { id: w.pendingEvidenceId } }) },
  "PATCH /api/evidence/[id]": { allow: ["student"], req: (w) => ({ params: { id: w.readyEvidenceId }, body: { caption: "Before heating" } }) },
  "DELETE /api/evidence/[id]": { allow: ["student"], req: (w) => ({ params: { id: w.readyEvidenceId } }) },

  // --- Progress (the student, their parents, their teachers, admins)
  "GET /api/students/[id]/progress": { allow: ["admin", "teacher", "student", "parent"], req: (w) => ({ params: { id: w.people.student.userId } }) },
  "GET /api/students/[id]/report-pdf": { allow: ["admin", "teacher", "student", "parent"], req: (w) => ({ params: { id: w.people.student.userId } }) },
  "GET /api/class-progress/[id]": { allow: ["admin", "teacher"], req: (w) => ({ params: { id: w.classId } }) },
  "POST /api/class-progress/[id]/send-reports": { allow: ["admin", "teacher"], req: (w) => ({ params: { id: w.classId } }) },

  // --- Moderation (moderators for their own samples; admins)
  "GET /api/moderation/rule": { allow: ["admin", "moderator", "x-admin", "x-moderator"], req: () => ({}) },
  "PUT /api/moderation/rule": { allow: ["admin", "x-admin"], req: () => ({ body: { minCount: 4, percent: 15, includeExtremes: true, everyMarker: true } }) },
  "GET /api/moderation/scopes": { allow: ["admin", "moderator", "x-admin", "x-moderator"], req: () => ({}) },
  "GET /api/moderation/samples": { allow: ["admin", "moderator", "x-admin", "x-moderator"], req: () => ({}) },
  "POST /api/moderation/samples": { allow: ["admin", "moderator"], idsInBody: true, req: (w) => ({ body: { labSessionId: w.markedSessionId, moderatorId: w.people.moderator.userId, seed: 7 } }) },
  "GET /api/moderation/samples/[id]": { allow: ["admin", "moderator"], req: (w) => ({ params: { id: w.sampleId } }) },
  "PATCH /api/moderation/samples/[id]": { allow: ["admin", "moderator"], req: (w) => ({ params: { id: w.sampleId }, body: { status: "completed" } }) },
  "POST /api/moderation/samples/[id]/changes": { allow: ["admin", "moderator"], req: (w) => ({ params: { id: w.sampleId }, body: { action: "add", writeUpId: w.notInSampleWriteUpId, reason: "Check the top of the range." } }) },
  "POST /api/moderation/samples/[id]/adjustment": { allow: ["admin", "moderator"], req: (w) => ({ params: { id: w.sampleId }, body: { decision: "accept", reason: "Consistently generous on processing." } }) },
  "GET /api/moderation/samples/[id]/items/[writeUpId]": { allow: ["admin", "moderator"], req: (w) => ({ params: { id: w.sampleId, writeUpId: w.sampledWriteUpId } }) },
  "PUT /api/moderation/samples/[id]/items/[writeUpId]": { allow: ["moderator"], req: (w) => ({ params: { id: w.sampleId, writeUpId: w.sampledWriteUpId }, body: { revision: 1, criteria: { c1: { levelId: "l1" }, c2: { levelId: "l1" } }, comment: "Recounted.", complete: true } }) },
};

// ---- The route list, from the files ------------------------------------------------------------

export const METHODS = ["GET", "HEAD", "POST", "PUT", "PATCH", "DELETE", "OPTIONS"] as const;
export type Handler = (req: NextRequest, ctx: { params: Promise<Record<string, string | string[]>> }) => Promise<Response>;
const routeFiles = import.meta.glob<Record<string, unknown>>("../../app/api/**/route.ts");

/** "/api/write-ups/[id]/submit" from "../../app/api/write-ups/[id]/submit/route.ts". */
const routePath = (file: string) => file.replace(/^.*\/app(\/api\/.*)\/route\.ts$/, "$1");

export async function loadRoutes(): Promise<Map<string, Handler>> {
  const out = new Map<string, Handler>();
  for (const [file, load] of Object.entries(routeFiles)) {
    const mod = await load();
    for (const m of METHODS) if (typeof mod[m] === "function") out.set(`${m} ${routePath(file)}`, mod[m] as Handler);
  }
  return out;
}

export function buildRequest(key: string, spec: Spec): { req: NextRequest; params: Record<string, string | string[]> } {
  const [method, template] = key.split(" ") as [string, string];
  const params: Record<string, string | string[]> = {};
  const url = template.replace(/\[(\.\.\.)?(\w+)\]/g, (_, rest: string | undefined, name: string) => {
    const v = spec.params?.[name] ?? "";
    params[name] = rest ? v.split("/") : v;
    return v;
  });
  const headers: Record<string, string> = { host: "localhost:3000", origin: "http://localhost:3000" };
  if (spec.body !== undefined) headers["content-type"] = "application/json";
  const req = new NextRequest(`http://localhost:3000${url}${spec.query ? `?${spec.query}` : ""}`, {
    method,
    headers,
    body: spec.body !== undefined ? JSON.stringify(spec.body) : undefined,
  });
  return { req, params };
}

export function actorFor(w: World, c: Caller): Actor | null {
  if (c === "signed-out") return null;
  if (c.startsWith("x-")) return w.elsewhere[c.slice(2) as keyof World["elsewhere"]];
  return w.people[c as Exclude<Caller, "signed-out" | `x-${string}`>] as Actor;
}
