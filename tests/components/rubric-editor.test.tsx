// @vitest-environment jsdom
import { QueryClient, QueryClientProvider } from "@tanstack/react-query";
import { cleanup, fireEvent, render, screen, waitFor } from "@testing-library/react";
import { afterEach, beforeEach, describe, expect, it, vi } from "vitest";
import { RubricEditor, whereIs } from "@/components/rubrics/rubric-editor";
import { competenceSwitchLoses, emptyRubric, switchStyle, toBody, totalMarks, valuesFromBody, type RubricFormValues } from "@/components/rubrics/rubric-values";
import type { RubricBody } from "@/lib/validation/practicals";

const router = { push: vi.fn(), refresh: vi.fn(), replace: vi.fn() };
vi.mock("next/navigation", () => ({ useRouter: () => router }));

const body: RubricBody = {
  title: "Rates write-up",
  style: "marks",
  criteria: [
    {
      id: "c1",
      title: "Recording",
      description: "",
      checkIds: [],
      levels: [
        { id: "l1", label: "Not yet", marks: 0, descriptor: "Readings missing." },
        { id: "l2", label: "Partly", marks: 1, descriptor: "" },
        { id: "l3", label: "Secure", marks: 3, descriptor: "Every reading, to the instrument's resolution." },
      ],
    },
    { id: "c2", title: "Evaluation", description: "", checkIds: ["k1"], levels: [{ id: "m1", label: "Not yet", marks: 0, descriptor: "" }, { id: "m2", label: "Secure", marks: 2, descriptor: "" }] },
  ],
};

describe("rubric form values", () => {
  it("round-trip a saved rubric, keeping linked checks", () => {
    const r = toBody(valuesFromBody(body));
    expect(r).toEqual({ ok: true, body });
  });

  it("key each problem by the field path the server uses", () => {
    const v = valuesFromBody(body);
    v.title = " ";
    v.criteria[0]!.levels[1]!.marks = "";
    v.criteria[0]!.levels[2]!.label = "";
    v.criteria[1]!.levels[1]!.marks = "0";
    const r = toBody(v);
    expect(r).toEqual({
      ok: false,
      errors: {
        title: "Give the rubric a title.",
        "criteria.0.levels.1.marks": "Enter the marks for this level.",
        "criteria.0.levels.2.label": "Name the level, for example “Secure”.",
        "criteria.1.levels.1.marks": "List levels from lowest to highest: each level must be worth more marks than the one before.",
      },
    });
  });

  it("refuse marks that are not whole numbers", () => {
    const v = valuesFromBody(body);
    v.criteria[1]!.levels[1]!.marks = "2.5";
    expect(toBody(v)).toEqual({ ok: false, errors: { "criteria.1.levels.1.marks": "Marks are whole numbers." } });
    v.criteria[1]!.levels[1]!.marks = "two";
    expect(toBody(v)).toEqual({ ok: false, errors: { "criteria.1.levels.1.marks": "Marks are whole numbers, for example 2." } });
  });

  it("switch to shown / not yet keeping the lowest and highest descriptors, and warn first when levels would go", () => {
    const v = valuesFromBody(body);
    expect(competenceSwitchLoses(v)).toBe(true);
    const c = switchStyle(v, "competence");
    expect(c.criteria[0]!.levels.map((l) => [l.label, l.marks, l.descriptor])).toEqual([
      ["Not yet", "0", "Readings missing."],
      ["Shown", "1", "Every reading, to the instrument's resolution."],
    ]);
    expect(competenceSwitchLoses(c)).toBe(false);
    expect(toBody(c).ok).toBe(true);
    expect(switchStyle(c, "marks").style).toBe("marks");
  });

  it("add up the top level of each criterion", () => {
    expect(totalMarks(valuesFromBody(body))).toBe(5);
    const blank: RubricFormValues = emptyRubric();
    expect(totalMarks(blank)).toBe(2);
  });

  it("say where a field is in plain words", () => {
    expect(whereIs("criteria.0.levels.1.marks", "marks")).toBe("Criterion 1, level 2 marks");
    expect(whereIs("criteria.2.title", "competence")).toBe("Skill 3 name");
    expect(whereIs("title", "marks")).toBe("Rubric title");
  });
});

const requests: { method: string; body: unknown }[] = [];
let answer: () => { status: number; body: unknown };
beforeEach(() => {
  requests.length = 0;
  vi.stubGlobal(
    "fetch",
    vi.fn(async (_url: string, init?: RequestInit) => {
      requests.push({ method: init?.method ?? "GET", body: init?.body ? JSON.parse(String(init.body)) : undefined });
      const { status, body: b } = answer();
      return new Response(JSON.stringify(b), { status, headers: { "content-type": "application/json" } });
    }),
  );
});
afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

function setup() {
  const client = new QueryClient();
  return render(
    <QueryClientProvider client={client}>
      <RubricEditor mode="edit" rubricId="r1" revision={4} archived={false} initial={valuesFromBody(body)} />
    </QueryClientProvider>,
  );
}

describe("RubricEditor", () => {
  it("shows a refused field from the server at that field", async () => {
    answer = () => ({ status: 400, body: { error: { code: "bad_request", message: "Some fields need attention.", fieldErrors: { "body.criteria.0.levels.1.marks": ["At most 100 marks for one level."] } } } });
    setup();
    fireEvent.click(screen.getByRole("button", { name: "Save changes" }));
    await waitFor(() => expect(screen.getByRole("alert").textContent).toContain("Criterion 1, level 2 marks: At most 100 marks for one level."));
    const marks = screen.getAllByLabelText("Marks")[1]!;
    expect(marks.getAttribute("aria-invalid")).toBe("true");
    expect(requests[0]).toMatchObject({ method: "PATCH", body: { revision: 4, body } });
  });

  it("when someone else saved first (409), keeps my changes and offers to reload theirs", async () => {
    const theirs = { ...body, title: "Rates write-up (department)" };
    answer = () => ({ status: 409, body: { error: { code: "conflict", message: "Someone saved this rubric since you opened it. Reload to see their changes.", reason: "stale", current: { revision: 5, body: theirs } } } });
    setup();
    fireEvent.change(screen.getByLabelText("Rubric title"), { target: { value: "My own title" } });
    fireEvent.click(screen.getByRole("button", { name: "Save changes" }));
    expect(await screen.findByText("Someone else saved this rubric while you were editing")).toBeTruthy();
    expect((screen.getByLabelText("Rubric title") as HTMLInputElement).value).toBe("My own title");
    fireEvent.click(screen.getByRole("button", { name: "Reload their version (discard mine)" }));
    expect((screen.getByLabelText("Rubric title") as HTMLInputElement).value).toBe("Rates write-up (department)");

    answer = () => ({ status: 200, body: { revision: 6 } });
    fireEvent.change(screen.getByLabelText("Rubric title"), { target: { value: "Merged title" } });
    fireEvent.click(screen.getByRole("button", { name: "Save changes" }));
    await waitFor(() => expect(requests).toHaveLength(2));
    expect(requests[1]).toMatchObject({ body: { revision: 5, body: { title: "Merged title" } } });
  });

  it("can save mine over theirs after a conflict, using their revision", async () => {
    answer = () => ({ status: 409, body: { error: { code: "conflict", message: "Stale.", current: { revision: 9, body } } } });
    setup();
    fireEvent.click(screen.getByRole("button", { name: "Save changes" }));
    const replace = await screen.findByRole("button", { name: "Save mine over theirs" });
    answer = () => ({ status: 200, body: { revision: 10 } });
    fireEvent.click(replace);
    await waitFor(() => expect(requests).toHaveLength(2));
    expect(requests[1]).toMatchObject({ body: { revision: 9 } });
    await waitFor(() => expect(screen.queryByText("Someone else saved this rubric while you were editing")).toBeNull());
  });
});
