import "server-only";
import Papa from "papaparse";
import { and, eq, inArray } from "drizzle-orm";
import type { Actor } from "@/lib/auth/actor";
import { hasRole } from "@/lib/auth/actor";
import { AppError, forbidden, notFound } from "@/lib/errors";
import { rosterRowSchema, type RosterRow } from "@/lib/validation/classes";
import { getDb } from "../client";
import { classes, classStudents, parentLinks, userRoles, users, type Role } from "../schema";
import { recordAudit } from "./audit";
import { enrolStudents } from "./classes";
import { linkParent } from "./family";
import { createUser } from "./users";

export const ROSTER_MAX_ROWS = 500;

/** Header spellings we accept, matched after lower-casing and removing everything but letters. */
const HEADER_ALIASES: Record<string, keyof RosterRow> = {
  name: "name",
  fullname: "name",
  studentname: "name",
  pupilname: "name",
  email: "email",
  emailaddress: "email",
  studentemail: "email",
  year: "yearGroup",
  yeargroup: "yearGroup",
  parentname: "parentName",
  guardianname: "parentName",
  parentguardianname: "parentName",
  parentemail: "parentEmail",
  guardianemail: "parentEmail",
  parentguardianemail: "parentEmail",
  relationship: "relationship",
};

export type RosterPreviewRow = {
  line: number;
  name: string;
  email: string;
  yearGroup: number | null;
  parentName: string | null;
  parentEmail: string | null;
  relationship: string | null;
  student: "new" | "existing" | "already-in-class" | null;
  parent: "new" | "existing" | "already-linked" | null;
  errors: string[];
};

export type RosterPreview = {
  rows: RosterPreviewRow[];
  fileErrors: string[];
  ignoredColumns: string[];
  summary: { rows: number; withErrors: number; newStudents: number; existingStudents: number; newParents: number };
};

type Existing = { id: string; schoolId: string; roles: Role[] };

function lookupByEmail(emails: string[]): Map<string, Existing> {
  const db = getDb();
  const map = new Map<string, Existing>();
  if (!emails.length) return map;
  const found = db.select({ id: users.id, email: users.email, schoolId: users.schoolId }).from(users).where(inArray(users.email, emails)).all();
  const roles = found.length ? db.select().from(userRoles).where(inArray(userRoles.userId, found.map((f) => f.id))).all() : [];
  for (const f of found) map.set(f.email, { id: f.id, schoolId: f.schoolId, roles: roles.filter((r) => r.userId === f.id).map((r) => r.role) });
  return map;
}

/**
 * Reads a roster CSV and says, row by row, what an import would do and what is wrong. Nothing is
 * written. Columns: name, email, and optionally year group, parent name, parent email, relationship.
 */
export function previewRoster({ actor, classId, csv }: { actor: Actor; classId: string; csv: string }): RosterPreview {
  if (!hasRole(actor, "admin")) throw forbidden("Only an admin can import a roster.");
  const db = getDb();
  const cls = db.select({ id: classes.id, yearGroup: classes.yearGroup }).from(classes).where(and(eq(classes.id, classId), eq(classes.schoolId, actor.schoolId))).get();
  if (!cls) throw notFound("That class");

  const fileErrors: string[] = [];
  const ignoredColumns: string[] = [];
  const text = csv.replace(/^\uFEFF/, "");
  // Blank lines are kept while parsing so every row keeps its line number in the file, then dropped.
  const parsed = Papa.parse<Record<string, string>>(text, {
    header: true,
    skipEmptyLines: false,
    transformHeader: (h) => {
      const key = HEADER_ALIASES[h.toLowerCase().replace(/[^a-z]/g, "")];
      if (!key && h.trim()) ignoredColumns.push(h.trim());
      return key ?? `__ignored:${h}`;
    },
  });
  const isBlank = (r: Record<string, unknown>) => Object.values(r).every((v) => v == null || (typeof v === "string" ? v.trim() === "" : Array.isArray(v) && v.every((x) => !String(x).trim())));
  const numbered = parsed.data.map((row, i) => ({ row, line: i + 2 })).filter(({ row }) => !isBlank(row));
  const blankRows = new Set(parsed.data.map((row, i) => (isBlank(row) ? i : -1)).filter((i) => i >= 0));
  parsed.errors = parsed.errors.filter((e) => !(e.code === "TooFewFields" && e.row != null && blankRows.has(e.row)));
  const headers = new Set(parsed.meta.fields ?? []);
  for (const required of ["name", "email"] as const) {
    if (!headers.has(required)) fileErrors.push(`The file has no “${required === "name" ? "name" : "email"}” column. The first line must name the columns, for example: name,email,year group,parent name,parent email.`);
  }
  for (const e of parsed.errors) {
    if (e.code === "UndetectableDelimiter") continue;
    // papaparse counts the header as row 0 for an unclosed quote, but not for other errors.
    const line = (e.row ?? 0) + (e.code === "MissingQuotes" ? 1 : 2);
    fileErrors.push(`Line ${line}: ${e.message}.`);
  }
  if (numbered.length === 0 && !fileErrors.length) fileErrors.push("The file has a header line but no students.");
  if (numbered.length > ROSTER_MAX_ROWS) fileErrors.push(`The file has ${numbered.length} rows; import at most ${ROSTER_MAX_ROWS} at a time.`);
  if (fileErrors.length) {
    return { rows: [], fileErrors, ignoredColumns, summary: { rows: numbered.length, withErrors: 0, newStudents: 0, existingStudents: 0, newParents: 0 } };
  }

  const rows: RosterPreviewRow[] = [];
  const valid: { row: RosterPreviewRow; data: RosterRow }[] = [];
  numbered.forEach(({ row: raw, line }) => {
    const result = rosterRowSchema.safeParse(raw);
    const base: RosterPreviewRow = {
      line,
      name: String(raw.name ?? "").trim(),
      email: String(raw.email ?? "").trim().toLowerCase(),
      yearGroup: null,
      parentName: raw.parentName?.trim() || null,
      parentEmail: raw.parentEmail?.trim().toLowerCase() || null,
      relationship: raw.relationship?.trim() || null,
      student: null,
      parent: null,
      errors: [],
    };
    if (!result.success) {
      base.errors = result.error.issues.map((iss) => {
        const field = String(iss.path[0] ?? "");
        const label = { name: "Name", email: "E-mail", yearGroup: "Year group", parentName: "Parent name", parentEmail: "Parent e-mail", relationship: "Relationship" }[field] ?? field;
        return `${label}: ${iss.message}`;
      });
      rows.push(base);
      return;
    }
    const data = result.data;
    Object.assign(base, { name: data.name, email: data.email, yearGroup: data.yearGroup ?? null, parentName: data.parentName ?? null, parentEmail: data.parentEmail ?? null, relationship: data.relationship ?? null });
    if (data.parentEmail && !data.parentName) base.errors.push("Parent name: give the parent's name as well as their e-mail.");
    if (data.parentName && !data.parentEmail) base.errors.push("Parent e-mail: give the parent's e-mail as well as their name.");
    if (data.parentEmail && data.parentEmail === data.email) base.errors.push("Parent e-mail: it is the same as the student's e-mail.");
    rows.push(base);
    valid.push({ row: base, data });
  });

  // Duplicates inside the file.
  const seen = new Map<string, number>();
  for (const { row } of valid) {
    const first = seen.get(row.email);
    if (first !== undefined) row.errors.push(`E-mail: ${row.email} is also on line ${first} of this file.`);
    else seen.set(row.email, row.line);
  }

  const existing = lookupByEmail([...new Set(valid.flatMap(({ data }) => [data.email, ...(data.parentEmail ? [data.parentEmail] : [])]))]);
  const studentIds = valid.map(({ data }) => existing.get(data.email)?.id).filter((x): x is string => !!x);
  const inClass = new Set(
    studentIds.length
      ? db.select({ id: classStudents.studentId }).from(classStudents).where(and(eq(classStudents.classId, classId), inArray(classStudents.studentId, studentIds))).all().map((r) => r.id)
      : [],
  );
  const parentIds = valid.map(({ data }) => (data.parentEmail ? existing.get(data.parentEmail)?.id : undefined)).filter((x): x is string => !!x);
  const links = new Set(
    parentIds.length ? db.select({ p: parentLinks.parentId, s: parentLinks.studentId }).from(parentLinks).where(inArray(parentLinks.parentId, parentIds)).all().map((l) => `${l.p}:${l.s}`) : [],
  );
  const parentNames = new Map<string, string>();
  for (const { row, data } of valid) {
    const s = existing.get(data.email);
    if (!s) row.student = "new";
    else if (s.schoolId !== actor.schoolId) row.errors.push("E-mail: this address already belongs to another account. Use a different address.");
    else if (!s.roles.includes("student")) row.errors.push("E-mail: this address belongs to a staff or parent account, not a student.");
    else row.student = inClass.has(s.id) ? "already-in-class" : "existing";
    if (data.parentEmail) {
      const p = existing.get(data.parentEmail);
      const earlier = parentNames.get(data.parentEmail);
      if (earlier !== undefined && earlier !== data.parentName) row.errors.push(`Parent name: ${data.parentEmail} is given as “${earlier}” on an earlier line.`);
      parentNames.set(data.parentEmail, data.parentName ?? "");
      if (!p) row.parent = "new";
      else if (p.schoolId !== actor.schoolId) row.errors.push("Parent e-mail: this address already belongs to another account.");
      else if (!p.roles.includes("parent")) row.errors.push("Parent e-mail: this address belongs to an account that is not a parent. Link it from the person's page instead.");
      else row.parent = s && links.has(`${p.id}:${s.id}`) ? "already-linked" : "existing";
    }
  }
  // An address cannot be a student on one line and a parent on another.
  const studentEmails = new Map(valid.map(({ row }) => [row.email, row.line]));
  const parentEmails = new Map(valid.filter(({ data }) => data.parentEmail).map(({ row, data }) => [data.parentEmail!, row.line]));
  for (const { row, data } of valid) {
    const asParent = parentEmails.get(row.email);
    if (asParent !== undefined && asParent !== row.line) row.errors.push(`E-mail: ${row.email} is also given as a parent's e-mail on line ${asParent}.`);
    const asStudent = data.parentEmail ? studentEmails.get(data.parentEmail) : undefined;
    if (asStudent !== undefined && asStudent !== row.line) row.errors.push(`Parent e-mail: ${data.parentEmail} is also a student's e-mail on line ${asStudent}.`);
  }
  const newParentEmails = new Set(valid.filter(({ row }) => row.parent === "new").map(({ data }) => data.parentEmail));
  return {
    rows,
    fileErrors,
    ignoredColumns,
    summary: {
      rows: rows.length,
      withErrors: rows.filter((r) => r.errors.length).length,
      newStudents: rows.filter((r) => r.student === "new" && !r.errors.length).length,
      existingStudents: rows.filter((r) => (r.student === "existing" || r.student === "already-in-class") && !r.errors.length).length,
      newParents: newParentEmails.size,
    },
  };
}

/**
 * Imports a roster: all rows or none. Any row error refuses the whole file with the preview, so
 * nothing is ever half-imported. Returns the ids of people created (for invitations).
 */
export function importRoster({ actor, classId, csv }: { actor: Actor; classId: string; csv: string }) {
  const preview = previewRoster({ actor, classId, csv });
  if (preview.fileErrors.length || preview.summary.withErrors > 0) {
    throw new AppError("bad_request", preview.fileErrors[0] ?? `${preview.summary.withErrors} row(s) have problems. Nothing was imported; fix them and try again.`, { detail: { preview } });
  }
  return getDb().transaction((tx) => {
    const created: string[] = [];
    const idByEmail = new Map<string, string>();
    for (const u of lookupByEmail(preview.rows.flatMap((r) => [r.email, ...(r.parentEmail ? [r.parentEmail] : [])])).entries()) idByEmail.set(u[0], u[1].id);
    const enrol: string[] = [];
    for (const row of preview.rows) {
      let studentId = idByEmail.get(row.email);
      if (!studentId) {
        studentId = createUser({ actor, tx, input: { name: row.name, email: row.email, roles: ["student"], yearGroup: row.yearGroup } });
        idByEmail.set(row.email, studentId);
        created.push(studentId);
      }
      enrol.push(studentId);
      if (row.parentEmail && row.parentName) {
        let parentId = idByEmail.get(row.parentEmail);
        if (!parentId) {
          parentId = createUser({ actor, tx, input: { name: row.parentName, email: row.parentEmail, roles: ["parent"] } });
          idByEmail.set(row.parentEmail, parentId);
          created.push(parentId);
        }
        if (row.parent !== "already-linked") linkParent({ actor, tx, parentId, studentId, relationship: row.relationship ?? "Parent" });
      }
    }
    const enrolled = enrolStudents({ actor, tx, classId, studentIds: enrol });
    recordAudit(tx, { schoolId: actor.schoolId, actorId: actor.userId, action: "roster.import", entityType: "class", entityId: classId, after: { rows: preview.rows.length, created: created.length, enrolled } });
    return { created, enrolled, rows: preview.rows.length };
  });
}
