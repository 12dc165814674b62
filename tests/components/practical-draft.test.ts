import { describe, expect, it } from "vitest";
import {
  cleanForSave,
  describeErrorPath,
  draftPublishProblems,
  errorCountsBySection,
  fieldDomId,
  fieldDomIdCandidates,
  mergeErrors,
  sameDraft,
  sectionDiff,
  sectionOfPath,
  stableStringify,
  validateDraft,
  type Draft,
} from "@/components/practicals/draft";
import { emptyContent } from "@/db/queries/practicals";
import { practicalDraftSchema } from "@/lib/validation/practicals";
import { fieldErrorsOf } from "@/lib/validation/common";
import { completePracticalContent } from "../helpers/practicals";

function draft(content = completePracticalContent()): Draft {
  return { title: "Gas collected over time", topic: "Rates of reaction", yearGroup: 10, subject: "Chemistry", content };
}

describe("error paths and sections", () => {
  it("puts each path in the section where its field lives", () => {
    expect(sectionOfPath("title")).toBe("details");
    expect(sectionOfPath("yearGroup")).toBe("details");
    expect(sectionOfPath("content.aim")).toBe("aim");
    expect(sectionOfPath("content.introduction")).toBe("aim");
    expect(sectionOfPath("content.method")).toBe("method");
    expect(sectionOfPath("content.apparatus.2")).toBe("variables");
    expect(sectionOfPath("content.safety.hazards")).toBe("safety");
    expect(sectionOfPath("content.tables.0.columns.1.unit")).toBe("tables");
    expect(sectionOfPath("content.graphs.0.xColumn")).toBe("graphs");
    expect(sectionOfPath("content.checks.0.y")).toBe("checks");
    expect(sectionOfPath("content.rubric.criteria.1.levels.2.marks")).toBe("rubric");
    expect(sectionOfPath("content.prep.reagents.0.concentration")).toBe("prep");
  });

  it("turns a path into a DOM id, and offers the enclosing parts when a field is missing", () => {
    expect(fieldDomId("content.checks.0.y")).toBe("f-content-checks-0-y");
    expect(fieldDomIdCandidates("content.checks.0.y")).toEqual(["f-content-checks-0-y", "f-content-checks-0", "f-content-checks", "f-content"]);
  });

  it("describes a path in words, naming the part by what the teacher wrote", () => {
    const d = draft();
    expect(describeErrorPath("title", d)).toBe("Title");
    expect(describeErrorPath("content.safety.hazards", d)).toBe("Safety › Hazards");
    expect(describeErrorPath("content.safety.hazards.0.controls", d)).toBe("Safety › Hazard 1 (dilute acid) › Control measures");
    expect(describeErrorPath("content.checks.0.y", d)).toBe("Calculation checks › Check 1 (Mean rate from 0 to 30 s) › y column");
    expect(describeErrorPath("content.tables.0.columns.1.unit", d)).toBe("Results tables › Table 1 (Volume of gas against time) › Column 2 (volume of gas) › Unit");
    expect(describeErrorPath("content.rubric.criteria.1.levels.2.marks", d)).toBe("Rubric › Criterion 2 (Processing) › Level 3 (Secure) › Marks");
    expect(describeErrorPath("content.rubric", d)).toBe("Rubric");
    expect(describeErrorPath("content.method", d)).toBe("Method");
  });

  it("counts problems per section and merges error maps without repeating a message", () => {
    const a = { "content.aim": ["Write the aim."], title: ["Give a title."] };
    const b = { "content.aim": ["Write the aim.", "Too long."], "content.checks.0.y": ["Choose a column."] };
    const merged = mergeErrors(a, null, b);
    expect(merged["content.aim"]).toEqual(["Write the aim.", "Too long."]);
    expect(errorCountsBySection(merged)).toEqual({ aim: 1, details: 1, checks: 1 });
  });
});

describe("validateDraft", () => {
  it("accepts a complete practical and an empty new one", () => {
    expect(validateDraft(draft(), 3)).toEqual({});
    expect(validateDraft(draft(emptyContent()), 0)).toEqual({});
  });

  it("gives the same keys the server's field errors use", () => {
    const content = completePracticalContent();
    content.checks[0] = { ...content.checks[0]!, kind: "mean-rate", y: "nope" } as (typeof content.checks)[number];
    content.safety.hazards[0]!.controls = "";
    const d = { ...draft(content), title: "" };
    const mine = validateDraft(d, 0);
    const server = practicalDraftSchema.safeParse({ ...d, revision: 0 });
    expect(server.success).toBe(false);
    expect(Object.keys(mine).sort()).toEqual(Object.keys(fieldErrorsOf(server.error!)).sort());
    expect(mine["content.checks.0.y"]?.[0]).toMatch(/not in “Volume of gas against time”/);
    expect(mine["content.safety.hazards.0.controls"]).toEqual(["Say how the risk is controlled."]);
    expect(mine.title).toEqual(["Give the practical a title."]);
  });

  it("reports a number typed wrongly (NaN) at its field", () => {
    const content = completePracticalContent();
    content.tables[0]!.columns[0]!.resolution = Number.NaN;
    content.rubric!.criteria[0]!.levels[1]!.marks = 0;
    const errors = validateDraft(draft(content), 0);
    expect(errors["content.tables.0.columns.0.resolution"]?.[0]).toMatch(/resolution must be a number/i);
    expect(errors["content.rubric.criteria.0.levels.1.marks"]).toEqual(["List levels from lowest to highest: each level must be worth more marks than the one before."]);
  });

  it("puts one plain message on the planned values when one is not a number", () => {
    const content = completePracticalContent();
    content.tables[0]!.presetRows = [{ time: 0 }, { time: Number.NaN }];
    expect(validateDraft(draft(content), 0)).toEqual({ "content.tables.0.presetRows": ["Planned values must be numbers, separated by commas."] });
  });

  it("ignores blank lines in the short lists, which are left out when saving", () => {
    const content = completePracticalContent();
    content.apparatus = ["gas syringe", "  ", "flask"];
    content.variables.controlled = [""];
    content.safety.otherPpe = ["lab coat", ""];
    expect(validateDraft(draft(content), 0)).toEqual({});
    const cleaned = cleanForSave(draft(content)).content;
    expect(cleaned.apparatus).toEqual(["gas syringe", "flask"]);
    expect(cleaned.variables.controlled).toEqual([]);
    expect(cleaned.safety.otherPpe).toEqual(["lab coat"]);
  });
});

describe("publish problems in the browser", () => {
  it("uses the server's rule: nothing for a complete practical, the safety section for an empty one", () => {
    expect(draftPublishProblems(draft())).toEqual({});
    const problems = draftPublishProblems(draft(emptyContent()));
    expect(Object.keys(problems).sort()).toEqual(["content.aim", "content.method", "content.rubric", "content.safety.emergency", "content.safety.eyeProtection", "content.safety.hazards", "content.tables"]);
  });
});

describe("sectionDiff", () => {
  it("sees no difference once both are normalised (defaults, extra editor attributes)", () => {
    const mine = draft();
    const theirs = draft();
    mine.content.method = {
      type: "doc",
      content: [{ type: "orderedList", attrs: { start: 1, type: null }, content: [{ type: "listItem", content: [{ type: "paragraph", content: [{ type: "text", text: "Read the syringe every 10 s." }] }] }] }],
    };
    expect(sectionDiff(mine, theirs).filter((s) => s.differs)).toEqual([]);
    expect(sameDraft(mine, theirs)).toBe(true);
  });

  it("names exactly the sections that differ", () => {
    const mine = draft();
    const theirs = draft();
    theirs.title = "Gas collected (revised)";
    theirs.content.safety.emergency = "Call the teacher.";
    theirs.content.prep.spareMarginPercent = 20;
    const differs = sectionDiff(mine, theirs)
      .filter((s) => s.differs)
      .map((s) => s.label);
    expect(differs).toEqual(["Details", "Safety", "Prep list"]);
  });

  it("compares objects whatever the order of their keys", () => {
    expect(stableStringify({ b: 1, a: [{ y: 2, x: 1 }] })).toBe(stableStringify({ a: [{ x: 1, y: 2 }], b: 1 }));
    expect(stableStringify({ a: undefined, b: null })).toBe('{"b":null}');
  });
});
