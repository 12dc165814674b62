import { describe, expect, it } from "vitest";
import { formFieldFor, formValuesToInput, valuesFromSession, type LabSessionFormValues } from "@/components/lab-sessions/form-values";
import { fromLocalParts, suggestParts, toLocalParts } from "@/components/lab-sessions/local-date-time";

describe("date and time inputs in local time", () => {
  it("reads a date and a time as that moment in local time, and back", () => {
    const r = fromLocalParts("2026-12-08", "09:05");
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect([r.date.getFullYear(), r.date.getMonth(), r.date.getDate(), r.date.getHours(), r.date.getMinutes()]).toEqual([2026, 11, 8, 9, 5]);
    expect(toLocalParts(r.date)).toEqual({ date: "2026-12-08", time: "09:05" });
  });

  it("refuses blank and impossible dates and times instead of rolling them over", () => {
    expect(fromLocalParts("", "09:00")).toEqual({ ok: false, problem: "missing-date" });
    expect(fromLocalParts("2026-12-08", " ")).toEqual({ ok: false, problem: "missing-time" });
    expect(fromLocalParts("2026-04-31", "09:00")).toEqual({ ok: false, problem: "bad-date" });
    expect(fromLocalParts("2027-02-29", "09:00")).toEqual({ ok: false, problem: "bad-date" });
    expect(fromLocalParts("8/12/2026", "09:00")).toEqual({ ok: false, problem: "bad-date" });
    expect(fromLocalParts("2026-12-08", "24:00")).toEqual({ ok: false, problem: "bad-time" });
    expect(fromLocalParts("2026-12-08", "9am")).toEqual({ ok: false, problem: "bad-time" });
    expect(fromLocalParts("2028-02-29", "00:00").ok).toBe(true);
  });

  it("suggests a date some days on, at a set time, across a month end", () => {
    expect(suggestParts(new Date(2026, 11, 30, 15, 47), 3, 9)).toEqual({ date: "2027-01-02", time: "09:00" });
  });
});

const values = (over: Partial<LabSessionFormValues> = {}): LabSessionFormValues => ({
  classId: "class-1",
  practicalVersionId: "version-1",
  opensDate: "2026-12-08",
  opensTime: "09:00",
  dueDate: "2026-12-15",
  dueTime: "16:00",
  grouping: "individual",
  groups: [],
  lateWork: "accept-flagged",
  lateDays: "7",
  notes: "",
  ...over,
});

describe("the schedule form's values", () => {
  it("become the request body, with the dates as moments", () => {
    const r = formValuesToInput(values({ notes: "Lab 3" }));
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.input).toMatchObject({ classId: "class-1", practicalVersionId: "version-1", grouping: "individual", groups: [], lateWork: "accept-flagged", lateDays: 7, notes: "Lab 3" });
    expect(r.input.opensAt.getTime()).toBe(new Date(2026, 11, 8, 9, 0).getTime());
    expect(r.input.dueAt.getTime()).toBe(new Date(2026, 11, 15, 16, 0).getTime());
  });

  it("put each problem at its own input", () => {
    const r = formValuesToInput(values({ classId: "", practicalVersionId: "", opensTime: "", dueDate: "2026-02-30", lateDays: "-1" }));
    expect(r).toEqual({
      ok: false,
      errors: {
        opensTime: "Choose the time the lab session opens.",
        dueDate: "That is not a real date. Use the date picker, or type it as day, month and year.",
        lateDays: "Enter a whole number of days from 0 to 60.",
        classId: "Choose a class.",
        practicalVersionId: "Choose a published practical.",
      },
    });
  });

  it("say so at the due date when it is not after the opening", () => {
    const same = formValuesToInput(values({ dueDate: "2026-12-08", dueTime: "09:00" }));
    expect(same).toEqual({ ok: false, errors: { dueDate: "The due date must be after the opening date." } });
  });

  it("ignore the number of late days when late work is refused", () => {
    const r = formValuesToInput(values({ lateWork: "refuse", lateDays: "" }));
    expect(r.ok && r.input.lateDays).toBe(0);
  });

  it("check groups of 2 to 4 and a student in only one group", () => {
    const r = formValuesToInput(
      values({
        grouping: "groups",
        groups: [
          { id: "g1", name: "Group 1", studentIds: ["a", "b"] },
          { id: "g2", name: "Group 2", studentIds: ["b"] },
        ],
      }),
    );
    expect(r).toEqual({ ok: false, errors: { "groups.1.studentIds": "Put at least 2 students in this group, or remove it." } });
    const twice = formValuesToInput(
      values({
        grouping: "groups",
        groups: [
          { id: "g1", name: "Group 1", studentIds: ["a", "b"] },
          { id: "g2", name: "Group 2", studentIds: ["b", "c"] },
        ],
      }),
    );
    expect(twice).toEqual({ ok: false, errors: { "groups.1.studentIds": "A student can only be in one group." } });
  });

  it("send no groups when each student records their own data", () => {
    const r = formValuesToInput(values({ grouping: "individual", groups: [{ id: "g1", name: "Group 1", studentIds: ["a"] }] }));
    expect(r.ok && r.input.groups).toEqual([]);
  });

  it("come back from a saved lab session unchanged", () => {
    const saved = formValuesToInput(values({ grouping: "groups", groups: [{ id: "g1", name: "Bench A", studentIds: ["a", "b"] }], notes: "x" }));
    if (!saved.ok) throw new Error("expected valid values");
    expect(valuesFromSession({ ...saved.input, opensAt: saved.input.opensAt.toISOString(), dueAt: saved.input.dueAt.toISOString() })).toEqual(
      values({ grouping: "groups", groups: [{ id: "g1", name: "Bench A", studentIds: ["a", "b"] }], notes: "x" }),
    );
  });

  it("map the server's field keys onto the form's inputs", () => {
    expect(formFieldFor("opensAt")).toBe("opensDate");
    expect(formFieldFor("dueAt")).toBe("dueDate");
    expect(formFieldFor("groups.2.studentIds")).toBe("groups.2.studentIds");
    expect(formFieldFor("groups.2.studentIds.0")).toBe("groups.2.studentIds");
    expect(formFieldFor("classId")).toBe("classId");
    expect(formFieldFor("somethingElse")).toBeNull();
  });
});
