// @vitest-environment jsdom
import { act, cleanup, fireEvent, render, screen, waitFor, within } from "@testing-library/react";
import { useEffect, useMemo, useState } from "react";
import { afterEach, beforeEach, describe, expect, it, vi } from "vitest";
import type { Draft } from "@/components/practicals/draft";
import { localCopyKey, readLocalCopies, writeLocalCopy } from "@/components/practicals/local-copy";
import { CheckPreview, PreviewStoreContext, type PreviewInput } from "@/components/practicals/editor/check-preview";
import { ConflictPanel } from "@/components/practicals/editor/conflict-panel";
import { EditorErrorsContext, NumberField } from "@/components/practicals/editor/fields";
import { PracticalEditor } from "@/components/practicals/editor/practical-editor";
import { ProblemsSummary } from "@/components/practicals/editor/problems-summary";
import { SaveStatusText } from "@/components/practicals/editor/save-status";
import { useDraftSaver, type SavedVersion } from "@/components/practicals/editor/use-draft-saver";
import type { CheckOutcome, StudentCheckView } from "@/lib/checks/types";
import type { CheckSpec, TableTemplate } from "@/lib/validation/practicals";
import { completePracticalContent } from "../helpers/practicals";

vi.mock("next/navigation", () => ({ useRouter: () => ({ push: vi.fn(), refresh: vi.fn(), replace: vi.fn() }) }));

type Call = { url: string; method: string; body: unknown };
let calls: Call[] = [];
let answers: ((call: Call) => { status: number; body: unknown })[] = [];

function json(status: number, body: unknown) {
  return new Response(JSON.stringify(body), { status, headers: { "Content-Type": "application/json" } });
}

beforeEach(() => {
  calls = [];
  answers = [];
  window.localStorage.clear();
  window.history.replaceState(null, "", "/");
  // jsdom does not lay pages out, so it has no scrolling; the editor scrolls a field into view when it takes you there.
  Element.prototype.scrollIntoView = vi.fn();
  vi.stubGlobal(
    "fetch",
    vi.fn(async (url: string, init?: RequestInit) => {
      const call = { url, method: init?.method ?? "GET", body: init?.body ? JSON.parse(String(init.body)) : null };
      calls.push(call);
      const answer = answers.shift();
      if (!answer) throw new Error(`No answer prepared for ${call.method} ${url}`);
      const { status, body } = answer(call);
      return json(status, body);
    }),
  );
});

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

function draft(): Draft {
  return { title: "Gas collected over time", topic: "Rates of reaction", yearGroup: 10, subject: "Chemistry", content: completePracticalContent() };
}

type Saver = ReturnType<typeof useDraftSaver>;

function mountSaver(initial = draft(), revision = 4) {
  const saverRef: { current: Saver | null } = { current: null };
  function Harness() {
    const s = useDraftSaver({ versionId: "v1", initial, initialRevision: revision, initialUpdatedAt: null, autosaveMs: 40 });
    useEffect(() => {
      saverRef.current = s;
    });
    return <SaveStatusText status={s.status} />;
  }
  const view = render(<Harness />);
  return { saver: () => saverRef.current!, ...view };
}

const saved = (revision: number) => () => ({ status: 200, body: { revision, updatedAt: "2026-12-03T10:15:00.000Z" } });

describe("saving a draft", () => {
  it("sends the whole draft with the revision it started from, then carries on from the new one", async () => {
    const { saver } = mountSaver();
    answers.push(saved(5), saved(6));
    act(() => saver().change((d) => ({ ...d, title: "Gas collected (revised)" })));
    expect(screen.getByRole("status").textContent).toMatch(/Unsaved changes/);
    await act(async () => {
      expect(await saver().save(true)).toBe(true);
    });
    expect(calls[0]).toMatchObject({ url: "/api/practical-versions/v1", method: "PUT", body: { title: "Gas collected (revised)", revision: 4 } });
    expect(screen.getByRole("status").textContent).toMatch(/All changes saved at/);
    act(() => saver().change((d) => ({ ...d, topic: "Kinetics" })));
    await act(async () => {
      await saver().save(true);
    });
    expect(calls[1]!.body).toMatchObject({ topic: "Kinetics", revision: 5 });
  });

  it("saves by itself a moment after the changes stop", async () => {
    const { saver } = mountSaver();
    answers.push(saved(5));
    act(() => saver().change((d) => ({ ...d, title: "A" })));
    act(() => saver().change((d) => ({ ...d, title: "AB" })));
    await waitFor(() => expect(screen.getByRole("status").textContent).toMatch(/All changes saved/));
    expect(calls).toHaveLength(1);
    expect(calls[0]!.body).toMatchObject({ title: "AB" });
  });

  it("does not send a draft the server would refuse: the problems wait at their fields, and the typing stays", async () => {
    const { saver } = mountSaver();
    act(() => saver().change((d) => ({ ...d, title: "", content: { ...d.content, tables: [{ ...d.content.tables[0]!, rowCount: Number.NaN }] } })));
    await act(async () => {
      expect(await saver().save(true)).toBe(false);
    });
    expect(calls).toHaveLength(0);
    expect(saver().clientErrors.title).toEqual(["Give the practical a title."]);
    expect(Object.keys(saver().clientErrors)).toContain("content.tables.0.rowCount");
    expect(saver().draft.title).toBe("");
    expect(screen.getByRole("status").textContent).toMatch(/Not saved yet: 2 things need finishing/);
  });

  it("puts the server's field errors (400) where the fields are", async () => {
    const { saver } = mountSaver();
    answers.push(() => ({ status: 400, body: { error: { code: "bad_request", message: "The text is nested too deeply.", fieldErrors: { "content.method": ["The text is nested too deeply."] } } } }));
    act(() => saver().change((d) => ({ ...d, title: "X" })));
    await act(async () => {
      await saver().save(true);
    });
    expect(saver().serverErrors).toEqual({ "content.method": ["The text is nested too deeply."] });
    expect(screen.getByRole("status").textContent).toBe("Not saved: The text is nested too deeply.");
    expect(saver().draft.title).toBe("X");
  });

  it("on a conflict, keeps this editor's version on top of the saved one when asked (the prep list stays theirs)", async () => {
    const { saver } = mountSaver();
    const theirs = draft();
    theirs.title = "Their title";
    theirs.content.prep.spareMarginPercent = 25;
    const current: SavedVersion = { ...theirs, revision: 9, updatedAt: "2026-12-03T10:00:00.000Z" };
    answers.push(() => ({ status: 409, body: { error: { code: "conflict", message: "Someone saved this practical since you opened it.", reason: "stale", current } } }), saved(10));
    act(() => saver().change((d) => ({ ...d, title: "My title" })));
    await act(async () => {
      expect(await saver().save(true)).toBe(false);
    });
    expect(saver().conflict?.revision).toBe(9);
    expect(screen.getByRole("status").textContent).toMatch(/someone else saved/);
    await act(async () => {
      expect(await saver().keepMine()).toBe(true);
    });
    expect(calls[1]!.body).toMatchObject({ title: "My title", revision: 9, content: { prep: { spareMarginPercent: 25 } } });
    expect(saver().conflict).toBeNull();
  });

  it("on a conflict, takes the saved version instead when asked, without saving anything", async () => {
    const { saver } = mountSaver();
    const current: SavedVersion = { ...draft(), title: "Their title", revision: 9, updatedAt: "2026-12-03T10:00:00.000Z" };
    answers.push(() => ({ status: 409, body: { error: { code: "conflict", message: "Stale.", reason: "stale", current } } }));
    act(() => saver().change((d) => ({ ...d, title: "My title" })));
    await act(async () => {
      await saver().save(true);
    });
    const before = saver().generation;
    act(() => saver().takeSaved());
    expect(saver().draft.title).toBe("Their title");
    expect(saver().generation).toBe(before + 1);
    expect(saver().status.kind).toBe("saved");
    expect(calls).toHaveLength(1);
    expect(readLocalCopies("v1")).toEqual([]);
  });

  it("keeps a copy in the browser while changes are unsaved and offers it back next time", async () => {
    const first = mountSaver();
    answers.push(() => ({ status: 503, body: { error: { code: "unavailable", message: "Meniscus cannot save right now." } } }));
    act(() => first.saver().change((d) => ({ ...d, title: "Typed before the crash" })));
    await act(async () => {
      await first.saver().save(true);
    });
    await waitFor(() => expect(window.localStorage.getItem(localCopyKey("v1", 4))).not.toBeNull());
    first.unmount();
    calls = [];
    answers = [];
    const second = mountSaver();
    await waitFor(() => expect(second.saver().restoreOffer?.draft.title).toBe("Typed before the crash"));
    answers.push(saved(5));
    act(() => second.saver().restoreLocal());
    expect(second.saver().draft.title).toBe("Typed before the crash");
    await waitFor(() => expect(calls[0]?.body).toMatchObject({ title: "Typed before the crash", revision: 4 }));
  });

  it("does not offer a copy that says the same as the saved draft, and skips damaged entries", async () => {
    writeLocalCopy("v1", 4, draft(), 1);
    window.localStorage.setItem(localCopyKey("v1", 3), "{not json");
    const { saver } = mountSaver();
    await act(async () => {});
    expect(saver().restoreOffer).toBeNull();
    expect(readLocalCopies("v1")).toEqual([]);
  });
});

describe("NumberField", () => {
  it("keeps exactly what was typed and reports the value: a number, null when blank, NaN when not a number", () => {
    const onChange = vi.fn();
    function Field() {
      const [value, setValue] = useState<number | null>(0.5);
      return (
        <NumberField
          path="content.tables.0.columns.0.resolution"
          label="Instrument resolution"
          value={value}
          onChange={(n) => {
            onChange(n);
            setValue(n);
          }}
        />
      );
    }
    render(<Field />);
    const input = screen.getByLabelText("Instrument resolution") as HTMLInputElement;
    expect(input.value).toBe("0.5");
    fireEvent.change(input, { target: { value: "0." } });
    expect(onChange).toHaveBeenLastCalledWith(0);
    expect(input.value).toBe("0.");
    fireEvent.change(input, { target: { value: "" } });
    expect(onChange).toHaveBeenLastCalledWith(null);
    fireEvent.change(input, { target: { value: "half" } });
    expect(onChange.mock.lastCall![0]).toBeNaN();
    expect(input.value).toBe("half");
    expect(input.getAttribute("aria-invalid")).toBe("true");
    expect(screen.getByText(/Type a number/)).toBeTruthy();
  });

  it("shows the error for its path, linked to the input", () => {
    render(
      <EditorErrorsContext.Provider value={{ "content.checks.0.tolerancePercent": ["Tolerance can be at most 60 %."] }}>
        <NumberField path="content.checks.0.tolerancePercent" label="Tolerance" value={80} onChange={() => {}} />
      </EditorErrorsContext.Provider>,
    );
    const input = screen.getByLabelText("Tolerance");
    expect(input.id).toBe("f-content-checks-0-tolerancePercent");
    const describedBy = input.getAttribute("aria-describedby")!;
    expect(document.getElementById(describedBy)!.textContent).toBe("Tolerance can be at most 60 %.");
  });
});

const table: TableTemplate = completePracticalContent().tables[0]!;
const check = completePracticalContent().checks[0]! as CheckSpec;

/** The preview keeps its input in the editor's store; this stands in for the editor. */
function PreviewHarness() {
  const [inputs, setInputs] = useState<Record<string, PreviewInput>>({});
  const store = useMemo(() => ({ get: (id: string) => inputs[id], set: (id: string, input: PreviewInput) => setInputs((all) => ({ ...all, [id]: input })) }), [inputs]);
  return (
    <PreviewStoreContext.Provider value={store}>
      <CheckPreview check={check} table={table} index={0} />
    </PreviewStoreContext.Provider>
  );
}

describe("CheckPreview", () => {
  it("takes readings pasted from a spreadsheet, sends them with the answer, and shows the student's view and the full reason", async () => {
    render(<PreviewHarness />);
    fireEvent.click(screen.getByText("Try this check with sample data"));
    const first = screen.getByLabelText("Row 1, time / s");
    fireEvent.paste(first, { clipboardData: { getData: () => "time / s\tvolume of gas / cm³\n0\t0\n10\t14\n20\t25\n30\t33\n" } });
    expect((screen.getByLabelText("Row 4, volume of gas / cm³") as HTMLInputElement).value).toBe("33");
    expect(screen.getByText(/first pasted row looked like headings/)).toBeTruthy();
    fireEvent.change(screen.getByLabelText("Value, as typed"), { target: { value: "1.10" } });
    const outcome: CheckOutcome = {
      checkId: "k1",
      verdict: "agrees",
      hint: "Your mean rate agrees with your data.",
      reason: "Expected 1.10 cm³/s from (33 − 0) ÷ (30 − 0); the answer is within 5 %.",
      expected: { value: 1.1, unit: "cm³/s", uncertainty: null, method: "Δy/Δx between two readings" },
      deviationPercent: 0,
      sigFigs: { typed: 3, ok: true, message: null },
      unit: { ok: true, message: null },
      likelySlip: null,
      tangent: null,
      rows: null,
    };
    const studentView: StudentCheckView = { checkId: "k1", verdict: "agrees", hint: outcome.hint, expected: null, rows: null };
    answers.push(() => ({ status: 200, body: { outcome, studentView } }));
    await act(async () => {
      fireEvent.click(screen.getByRole("button", { name: "Check this answer" }));
    });
    expect(calls[0]!.url).toBe("/api/checks/preview");
    const body = calls[0]!.body as { check: CheckSpec; table: TableTemplate; rows: Record<string, string | null>[]; answer: { value: string; unit: string } };
    expect(body.check.id).toBe("k1");
    expect(body.table.id).toBe("t1");
    expect(body.rows.slice(0, 4)).toEqual([
      { time: "0", vol: "0" },
      { time: "10", vol: "14" },
      { time: "20", vol: "25" },
      { time: "30", vol: "33" },
    ]);
    expect(body.answer).toMatchObject({ value: "1.10", unit: "cm³/s" });
    const student = screen.getByRole("region", { name: "What the student sees" });
    expect(within(student).getByText("Agrees")).toBeTruthy();
    expect(within(student).getByText("Your mean rate agrees with your data.")).toBeTruthy();
    const teacher = screen.getByRole("region", { name: "The full reason, for you" });
    expect(teacher.textContent).toContain("(33 − 0) ÷ (30 − 0)");
    expect(teacher.textContent).toContain("Meniscus’s value: 1.1 cm³/s");
  });

  it("names cells that are not numbers and sends nothing", async () => {
    render(<PreviewHarness />);
    fireEvent.click(screen.getByText("Try this check with sample data"));
    fireEvent.change(screen.getByLabelText("Row 2, volume of gas / cm³"), { target: { value: "12 ml" } });
    fireEvent.click(screen.getByRole("button", { name: "Check this answer" }));
    expect(calls).toHaveLength(0);
    expect(screen.getAllByText(/Row 2, volume of gas: “12 ml” is not a number/).length).toBeGreaterThan(0);
  });
});

describe("ConflictPanel and ProblemsSummary", () => {
  it("shows both versions, which sections differ, and both ways out", async () => {
    const mine = draft();
    const theirs: SavedVersion = { ...draft(), title: "Their title", revision: 7, updatedAt: "2026-12-03T09:30:00.000Z" };
    theirs.content.safety.emergency = "Tell the teacher.";
    const keep = vi.fn(async () => true);
    const take = vi.fn();
    render(<ConflictPanel mine={mine} mineChangedAt={null} saved={theirs} onKeepMine={keep} onTakeSaved={take} />);
    expect(screen.getByText("Their title")).toBeTruthy();
    expect(screen.getByText("Gas collected over time")).toBeTruthy();
    const items = screen.getAllByRole("listitem").map((li) => li.textContent);
    expect(items).toContain("≠Details: differs");
    expect(items).toContain("≠Safety: differs");
    expect(items).toContain("=Method: the same");
    await act(async () => {
      fireEvent.click(screen.getByRole("button", { name: /Keep mine/ }));
    });
    expect(keep).toHaveBeenCalledOnce();
    fireEvent.click(screen.getByRole("button", { name: /Take the saved one/ }));
    expect(take).toHaveBeenCalledOnce();
  });

  it("lists each problem as a link to its section and field", () => {
    const onGo = vi.fn();
    render(
      <ProblemsSummary
        title="Before this practical can be published"
        errors={{ "content.safety.hazards": ["List at least one hazard."], title: ["Give the practical a title."], "content.prep.reagents.0.concentration": ["Not a possible concentration."] }}
        draft={draft()}
        onGo={onGo}
        prepHref="/practicals/p1/prep"
      />,
    );
    const links = screen.getAllByRole("link");
    expect(links.map((l) => l.textContent)).toEqual(["Title", "Safety › Hazards", "Prep list › Reagent 1 (hydrochloric acid) › Concentration"]);
    fireEvent.click(links[1]!);
    expect(onGo).toHaveBeenCalledWith("safety", "content.safety.hazards");
    expect(links[2]!.getAttribute("href")).toBe("/practicals/p1/prep");
  });
});

describe("PracticalEditor", () => {
  const version = { id: "v1", practicalId: "p1", version: 2, ...draft(), revision: 3, updatedAt: "2026-12-03T09:00:00.000Z" };

  it("shows the server's field errors at the field, through the list of problems", async () => {
    answers.push(() => ({ status: 400, body: { error: { code: "bad_request", message: "This check is bound to a column that is not in the table.", fieldErrors: { "content.checks.0.y": ["Choose a column from the table for y."] } } } }));
    render(<PracticalEditor version={version} topics={["Rates of reaction"]} />);
    fireEvent.change(screen.getByLabelText("Title"), { target: { value: "Gas collected, second go" } });
    await act(async () => {
      fireEvent.click(screen.getByRole("button", { name: "Save" }));
    });
    expect(calls[0]!.body).toMatchObject({ title: "Gas collected, second go", revision: 3 });
    const summary = screen.getByRole("region", { name: "Not saved yet: finish these first" });
    const link = within(summary).getByRole("link", { name: "Calculation checks › Check 1 (Mean rate from 0 to 30 s) › y column" });
    expect(screen.getByRole("link", { name: /Calculation checks\s*1 to fix/ })).toBeTruthy();
    fireEvent.click(link);
    await waitFor(() => expect(document.getElementById("f-content-checks-0-y")).not.toBeNull());
    const select = document.getElementById("f-content-checks-0-y")!;
    await waitFor(() => expect(document.activeElement).toBe(select));
    expect(select.getAttribute("aria-invalid")).toBe("true");
    expect(document.getElementById(select.getAttribute("aria-describedby")!.split(" ").at(-1)!)!.textContent).toBe("Choose a column from the table for y.");
    expect((screen.getByRole("heading", { level: 2, name: "Calculation checks" }) as HTMLElement).tagName).toBe("H2");
  });

  it("lists what stands in the way of publishing, and publishes once the server agrees", async () => {
    const empty = { ...version, content: { ...version.content, safety: { ...version.content.safety, hazards: [] } } };
    answers.push(saved(4), () => ({ status: 400, body: { error: { code: "bad_request", message: "This practical is not ready to publish yet.", fieldErrors: { "content.safety.hazards": ["A practical cannot be published without a safety section: list at least one hazard and how it is controlled."] } } } }));
    render(<PracticalEditor version={empty} topics={[]} />);
    fireEvent.change(screen.getByLabelText("Topic"), { target: { value: "Kinetics" } });
    await act(async () => {
      fireEvent.click(screen.getAllByRole("button", { name: "Publish" })[0]!);
    });
    expect(calls.map((c) => `${c.method} ${c.url}`)).toEqual(["PUT /api/practical-versions/v1", "POST /api/practical-versions/v1/publish"]);
    expect(calls[1]!.body).toEqual({ revision: 4 });
    const summary = screen.getByRole("region", { name: "Before this practical can be published" });
    expect(within(summary).getByRole("link", { name: "Safety › Hazards" })).toBeTruthy();
    expect(screen.getByRole("link", { name: /Safety\s*1 to fix/ })).toBeTruthy();
  });
});
