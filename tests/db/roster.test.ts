import { beforeEach, describe, expect, it } from "vitest";
import { getClassDetail } from "@/db/queries/classes";
import { listChildren } from "@/db/queries/family";
import { importRoster, previewRoster, ROSTER_MAX_ROWS } from "@/db/queries/roster";
import { listUsers, loadActor } from "@/db/queries/users";
import type { Actor } from "@/lib/auth/actor";
import { auditEntries, countRows, freshDatabase, makeClass, makeSchool, makeUser } from "../helpers/db";
import { appErrorFrom, expectRefused } from "../helpers/errors";

const TABLES = ["users", "user_roles", "class_students", "parent_links", "audit_log"] as const;
const counts = () => Object.fromEntries(TABLES.map((t) => [t, countRows(t)]));

const lines = (...rows: string[]) => rows.join("\n") + "\n";

describe("roster import", () => {
  let schoolId: string;
  let admin: Actor;
  let classId: string;
  beforeEach(() => {
    freshDatabase();
    schoolId = makeSchool("Larchfield Academy");
    admin = makeUser(schoolId, ["admin"]);
    classId = makeClass(schoolId, { name: "10R Chemistry" });
  });

  /** Asserts the import is refused with a 400 and that not one row was written anywhere. */
  function expectRefusedImport(csv: string) {
    const before = counts();
    const err = appErrorFrom(() => importRoster({ actor: admin, classId, csv }));
    expect(err.code).toBe("bad_request");
    expect(counts()).toEqual(before);
    return err;
  }

  describe("files that cannot be read", () => {
    it("refuses a file with an unclosed quote, naming the problem", () => {
      const csv = lines("name,email", "Ada Fenn,ada@test.example", '"Bram Olsen,bram@test.example', "Cleo Hart,cleo@test.example");
      const preview = previewRoster({ actor: admin, classId, csv });
      expect(preview.rows).toEqual([]);
      expect(preview.fileErrors.join(" ")).toMatch(/Quoted field unterminated/);
      expectRefusedImport(csv);
    });

    it("names the line where the unclosed quote opens", () => {
      const csv = lines("name,email", "Ada Fenn,ada@test.example", '"Bram Olsen,bram@test.example', "Cleo Hart,cleo@test.example");
      const preview = previewRoster({ actor: admin, classId, csv });
      expect(preview.fileErrors).toContain("Line 3: Quoted field unterminated.");
    });

    it("refuses a file without a name or an email column, saying which", () => {
      const noName = lines("pupil,email", "Ada Fenn,ada@test.example");
      expect(previewRoster({ actor: admin, classId, csv: noName }).fileErrors).toEqual([expect.stringMatching(/no “name” column/)]);
      expectRefusedImport(noName);
      const noEmail = lines("name,mail", "Ada Fenn,ada@test.example");
      expect(previewRoster({ actor: admin, classId, csv: noEmail }).fileErrors).toEqual([expect.stringMatching(/no “email” column/)]);
      expectRefusedImport(noEmail);
    });

    it("refuses a header line with no students", () => {
      const csv = lines("name,email,year group");
      expect(previewRoster({ actor: admin, classId, csv }).fileErrors).toEqual(["The file has a header line but no students."]);
      expectRefusedImport(csv);
    });

    it(`accepts ${ROSTER_MAX_ROWS} rows and refuses ${ROSTER_MAX_ROWS + 1}`, () => {
      const rows = (n: number) => Array.from({ length: n }, (_, i) => `Student ${i + 1},s${i + 1}@test.example`);
      expect(previewRoster({ actor: admin, classId, csv: lines("name,email", ...rows(ROSTER_MAX_ROWS)) }).fileErrors).toEqual([]);
      const tooMany = lines("name,email", ...rows(ROSTER_MAX_ROWS + 1));
      expect(previewRoster({ actor: admin, classId, csv: tooMany }).fileErrors).toEqual([`The file has ${ROSTER_MAX_ROWS + 1} rows; import at most ${ROSTER_MAX_ROWS} at a time.`]);
      expectRefusedImport(tooMany);
    });
  });

  describe("rows with problems refuse the whole file", () => {
    it("flags an e-mail that appears twice in the file (in any case), on the second line", () => {
      const csv = lines("name,email", "Ada Fenn,ada@test.example", "Bram Olsen,bram@test.example", "Ada Fenn-Two,ADA@test.example");
      const preview = previewRoster({ actor: admin, classId, csv });
      expect(preview.rows.map((r) => r.errors)).toEqual([[], [], ["E-mail: ada@test.example is also on line 2 of this file."]]);
      expect(preview.summary.withErrors).toBe(1);
      const err = expectRefusedImport(csv);
      expect(err.message).toMatch(/1 row\(s\) have problems. Nothing was imported/);
    });

    it("flags an address that belongs to another school's account", () => {
      makeUser(makeSchool("Quarry Hill College"), ["student"], { email: "taken@test.example" });
      const csv = lines("name,email", "Ada Fenn,ada@test.example", "Tara Kemp,taken@test.example");
      expect(previewRoster({ actor: admin, classId, csv }).rows[1]!.errors).toEqual(["E-mail: this address already belongs to another account. Use a different address."]);
      expectRefusedImport(csv);
    });

    it("flags an address that belongs to a staff account, as student or as parent", () => {
      makeUser(schoolId, ["teacher"], { email: "teacher@test.example" });
      const asStudent = lines("name,email", "Ada Fenn,ada@test.example", "Tess Ward,teacher@test.example");
      expect(previewRoster({ actor: admin, classId, csv: asStudent }).rows[1]!.errors).toEqual(["E-mail: this address belongs to a staff or parent account, not a student."]);
      expectRefusedImport(asStudent);
      const asParent = lines("name,email,parent name,parent email", "Ada Fenn,ada@test.example,Tess Ward,teacher@test.example");
      expect(previewRoster({ actor: admin, classId, csv: asParent }).rows[0]!.errors).toEqual([expect.stringMatching(/^Parent e-mail: this address belongs to an account that is not a parent/)]);
      expectRefusedImport(asParent);
    });

    it("flags over-long names, invalid e-mails and year groups outside 1–13", () => {
      const long = "Bartholomew ".repeat(11);
      const csv = lines("name,email,year group", `${long},long@test.example,9`, "Cai Lund,not-an-email,9", "Dee Moss,dee@test.example,14", "Eli Nye,eli@test.example,ten", "Fay Orr,fay@test.example,9.5", "Gus Park,gus@test.example,0");
      const rows = previewRoster({ actor: admin, classId, csv }).rows;
      expect(long.trim().length).toBeGreaterThan(120);
      expect(rows.map((r) => r.errors)).toEqual([
        ["Name: A name can be at most 120 characters."],
        ["E-mail: Enter a valid e-mail address, like name@school.example."],
        ["Year group: Year group must be a whole number from 1 to 13."],
        ["Year group: Year group must be a whole number from 1 to 13."],
        ["Year group: Year group must be a whole number from 1 to 13."],
        ["Year group: Year group must be a whole number from 1 to 13."],
      ]);
      expectRefusedImport(csv);
    });

    it("flags a parent e-mail without a parent name, and the other way round", () => {
      const csv = lines("name,email,parent name,parent email", "Ada Fenn,ada@test.example,,mum.fenn@test.example", "Bram Olsen,bram@test.example,Olga Olsen,");
      expect(previewRoster({ actor: admin, classId, csv }).rows.map((r) => r.errors)).toEqual([
        ["Parent name: give the parent's name as well as their e-mail."],
        ["Parent e-mail: give the parent's e-mail as well as their name."],
      ]);
      expectRefusedImport(csv);
    });

    it("flags a parent e-mail that is the student's own, and one parent given two names", () => {
      const csv = lines(
        "name,email,parent name,parent email",
        "Ada Fenn,ada@test.example,Ada Fenn,ada@test.example",
        "Bram Olsen,bram@test.example,Olga Olsen,olsen@test.example",
        "Cleo Olsen,cleo@test.example,Olga Olsen-Berg,olsen@test.example",
      );
      const rows = previewRoster({ actor: admin, classId, csv }).rows;
      expect(rows[0]!.errors).toEqual(["Parent e-mail: it is the same as the student's e-mail."]);
      expect(rows[1]!.errors).toEqual([]);
      expect(rows[2]!.errors).toEqual(["Parent name: olsen@test.example is given as “Olga Olsen” on an earlier line."]);
      expectRefusedImport(csv);
    });

    it("flags an address used as a student on one line and as a parent on another", () => {
      const csv = lines("name,email,parent name,parent email", "Ada Fenn,ada@test.example,Olga Olsen,olsen@test.example", "Olga Olsen,olsen@test.example,,");
      expect(previewRoster({ actor: admin, classId, csv }).rows.map((r) => r.errors)).toEqual([
        ["Parent e-mail: olsen@test.example is also a student's e-mail on line 3."],
        ["E-mail: olsen@test.example is also given as a parent's e-mail on line 2."],
      ]);
      expectRefusedImport(csv);
    });
  });

  describe("files from real spreadsheets", () => {
    it("accepts a byte-order mark, Windows line endings, other header spellings and blank lines", () => {
      const csv =
        "\uFEFFFull name,E-mail,Year group,Parent/guardian name,Parent/guardian e-mail,Relationship,Tutor group\r\n" +
        "Ada Fenn,Ada@Test.Example,10,Olga Fenn,olga.fenn@test.example,Mother,10F\r\n" +
        "Bram Olsen,bram@test.example,,,,,10F\r\n" +
        ",,,,,,\r\n" +
        "\r\n";
      const preview = previewRoster({ actor: admin, classId, csv });
      expect(preview.fileErrors).toEqual([]);
      expect(preview.ignoredColumns).toEqual(["Tutor group"]);
      expect(preview.rows).toEqual([
        { line: 2, name: "Ada Fenn", email: "ada@test.example", yearGroup: 10, parentName: "Olga Fenn", parentEmail: "olga.fenn@test.example", relationship: "Mother", student: "new", parent: "new", errors: [] },
        { line: 3, name: "Bram Olsen", email: "bram@test.example", yearGroup: null, parentName: null, parentEmail: null, relationship: null, student: "new", parent: null, errors: [] },
      ]);
      expect(preview.summary).toEqual({ rows: 2, withErrors: 0, newStudents: 2, existingStudents: 0, newParents: 1 });
    });

    it("treats a cell holding only spaces as empty", () => {
      const csv = lines("name,email,year group,parent name,parent email", "Bram Olsen,bram@test.example, , , ");
      expect(previewRoster({ actor: admin, classId, csv }).rows[0]).toMatchObject({ errors: [], yearGroup: null, parentName: null, parentEmail: null });
    });

    it("numbers rows by their line in the file, even after a blank row", () => {
      const csv = lines("name,email", "Ada Fenn,ada@test.example", ",", "Bram Olsen,bram@test.example", "Ada Fenn,ada@test.example");
      const rows = previewRoster({ actor: admin, classId, csv }).rows;
      expect(rows.map((r) => r.line)).toEqual([2, 4, 5]);
    });
  });

  describe("a good import", () => {
    const csv = lines(
      "name,email,year group,parent name,parent email,relationship",
      "Ada Fenn,ada@test.example,10,Olga Fenn,olga.fenn@test.example,Mother",
      "Bram Fenn,bram@test.example,10,Olga Fenn,olga.fenn@test.example,Mother",
      "Cleo Hart,cleo@test.example,10,,,",
      "Dara Quinn,dara@test.example,10,Rhys Quinn,rhys.quinn@test.example,",
    );

    it("creates the students and parents, links them and enrols the students, in one audited step", () => {
      const result = importRoster({ actor: admin, classId, csv });
      expect(result).toMatchObject({ rows: 4, enrolled: 4 });
      expect(result.created).toHaveLength(6);
      const roster = getClassDetail({ actor: admin, classId }).students!;
      expect(roster.map((r) => [r.name, r.email, r.yearGroup])).toEqual([
        ["Ada Fenn", "ada@test.example", 10],
        ["Bram Fenn", "bram@test.example", 10],
        ["Cleo Hart", "cleo@test.example", 10],
        ["Dara Quinn", "dara@test.example", 10],
      ]);
      expect(roster.find((r) => r.name === "Dara Quinn")!.guardians).toEqual([{ name: "Rhys Quinn", relationship: "Parent" }]);
      const olga = listUsers({ actor: admin, search: "olga.fenn" });
      expect(olga).toHaveLength(1);
      expect(olga[0]!.roles).toEqual(["parent"]);
      expect(olga[0]!.status).toBe("not-invited");
      const olgaActor = loadActor(olga[0]!.id)!;
      expect(listChildren({ actor: olgaActor }).map((c) => [c.name, c.relationship])).toEqual([
        ["Ada Fenn", "Mother"],
        ["Bram Fenn", "Mother"],
      ]);
      expect(auditEntries(classId).map((a) => a.action)).toEqual(["class.enrol", "roster.import"]);
    });

    it("is harmless to run twice: everyone is found, nothing is duplicated", () => {
      importRoster({ actor: admin, classId, csv });
      const before = counts();
      const preview = previewRoster({ actor: admin, classId, csv });
      expect(preview.rows.map((r) => [r.student, r.parent])).toEqual([
        ["already-in-class", "already-linked"],
        ["already-in-class", "already-linked"],
        ["already-in-class", null],
        ["already-in-class", "already-linked"],
      ]);
      expect(preview.summary).toMatchObject({ withErrors: 0, newStudents: 0, existingStudents: 4, newParents: 0 });
      const again = importRoster({ actor: admin, classId, csv });
      expect(again).toEqual({ created: [], enrolled: 0, rows: 4 });
      const after = counts();
      expect({ ...after, audit_log: before.audit_log }).toEqual(before);
      expect(after.audit_log).toBe(before.audit_log + 1);
    });

    it("enrols existing students of the school and links an existing parent", () => {
      const ada = makeUser(schoolId, ["student"], { email: "ada@test.example", name: "Ada Fenn" });
      const olga = makeUser(schoolId, ["parent"], { email: "olga.fenn@test.example", name: "Olga Fenn" });
      const preview = previewRoster({ actor: admin, classId, csv });
      expect(preview.rows[0]).toMatchObject({ student: "existing", parent: "existing" });
      const result = importRoster({ actor: admin, classId, csv });
      expect(result.created).not.toContain(ada.userId);
      expect(result.created).not.toContain(olga.userId);
      expect(result.created).toHaveLength(4);
      expect(listChildren({ actor: olga }).map((c) => c.name)).toEqual(["Ada Fenn", "Bram Fenn"]);
    });
  });

  describe("who may import", () => {
    const csv = lines("name,email", "Ada Fenn,ada@test.example");

    it("refuses everyone but an admin, writing nothing", () => {
      const before = counts();
      for (const role of ["teacher", "student", "moderator", "parent"] as const) {
        const actor = makeUser(schoolId, [role]);
        expectRefused(() => previewRoster({ actor, classId, csv }), "forbidden");
        expectRefused(() => importRoster({ actor, classId, csv }), "forbidden");
      }
      expect(countRows("class_students")).toBe(before.class_students);
    });

    it("answers 404 to an admin of another school", () => {
      const outsider = makeUser(makeSchool("Quarry Hill College"), ["admin"]);
      expectRefused(() => previewRoster({ actor: outsider, classId, csv }), "not_found");
      expectRefused(() => importRoster({ actor: outsider, classId, csv }), "not_found");
      expect(countRows("class_students")).toBe(0);
    });
  });
});
