import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { assignStudent, groupProblems, makeGroups, nextGroupId, nextGroupName } from "@/components/lab-sessions/groups";

const ids = (n: number) => Array.from({ length: n }, (_, i) => `s${i + 1}`);
const sizes = (n: number, size = 3) => makeGroups(ids(n), size).map((g) => g.studentIds.length);

describe("makeGroups (auto-make groups of 3)", () => {
  it("splits a class of 24 into 8 threes, in register order", () => {
    const groups = makeGroups(ids(24));
    expect(groups).toHaveLength(8);
    expect(groups[0]).toEqual({ id: "g1", name: "Group 1", studentIds: ["s1", "s2", "s3"] });
    expect(groups[7]!.studentIds).toEqual(["s22", "s23", "s24"]);
  });

  it("never leaves anyone on their own: leftovers make twos instead", () => {
    expect(sizes(7)).toEqual([3, 2, 2]);
    expect(sizes(25)).toEqual([3, 3, 3, 3, 3, 3, 3, 2, 2]);
    expect(sizes(4)).toEqual([2, 2]);
    expect(sizes(2)).toEqual([2]);
    expect(sizes(10, 4)).toEqual([4, 3, 3]);
  });

  it("makes no groups from an empty class and one group from a single student", () => {
    expect(makeGroups([])).toEqual([]);
    expect(sizes(1)).toEqual([1]);
  });

  it("puts every student in exactly one group of 2 or 3, for any class of 2 to 40", () => {
    fc.assert(
      fc.property(fc.integer({ min: 2, max: 40 }), (n) => {
        const groups = makeGroups(ids(n));
        expect(groups.flatMap((g) => g.studentIds)).toEqual(ids(n));
        for (const g of groups) expect(g.studentIds.length === 2 || g.studentIds.length === 3).toBe(true);
        expect(new Set(groups.map((g) => g.id)).size).toBe(groups.length);
      }),
    );
  });

  it("refuses a group size that is not a whole number", () => {
    expect(() => makeGroups(ids(6), 0)).toThrow(/whole number/);
    expect(() => makeGroups(ids(6), 2.5)).toThrow(/whole number/);
  });
});

describe("editing groups by hand", () => {
  it("moves a student from one group to another, or out of every group", () => {
    const groups = makeGroups(ids(6));
    const moved = assignStudent(groups, "s1", "g2");
    expect(moved.map((g) => g.studentIds)).toEqual([
      ["s2", "s3"],
      ["s4", "s5", "s6", "s1"],
    ]);
    expect(assignStudent(moved, "s1", null).map((g) => g.studentIds)).toEqual([
      ["s2", "s3"],
      ["s4", "s5", "s6"],
    ]);
  });

  it("names and numbers a new group without clashing with existing ones", () => {
    const groups = [
      { id: "g1", name: "Group 1", studentIds: [] },
      { id: "g3", name: "Group 2", studentIds: [] },
    ];
    expect(nextGroupId(groups)).toBe("g4");
    expect(nextGroupName(groups)).toBe("Group 3");
  });

  it("reports groups outside 2 to 4, blank names and students left out, keyed as the server keys them", () => {
    const { errors, unassigned } = groupProblems(
      [
        { id: "g1", name: "Bench A", studentIds: ["s1"] },
        { id: "g2", name: " ", studentIds: ["s2", "s3", "s4", "s5", "s6"] },
        { id: "g3", name: "Bench C", studentIds: [] },
        { id: "g4", name: "Bench D", studentIds: ["s7", "s8"] },
      ],
      ids(10),
    );
    expect(errors).toEqual({
      "groups.0.studentIds": "Put at least 2 students in this group, or remove it.",
      "groups.1.name": "Name the group.",
      "groups.1.studentIds": "At most 4 students in a group: move 1 to another group.",
      "groups.2.studentIds": "This group is empty: put 2 to 4 students in it, or remove it.",
    });
    expect(unassigned).toEqual(["s9", "s10"]);
    expect(groupProblems([], ids(3)).errors.groups).toMatch(/at least one group/);
  });
});
