// @vitest-environment jsdom
import { cleanup, fireEvent, render, screen, within } from "@testing-library/react";
import { afterEach, describe, expect, it, vi } from "vitest";
import { contentParts, groupTableParts } from "@/components/write-up/compare";
import { VersionChooser } from "@/components/write-up/version-chooser";
import { writeUpContentSchema, type WriteUpContent } from "@/lib/validation/write-ups";
import { completePracticalContent } from "../helpers/practicals";

afterEach(cleanup);

const practical = completePracticalContent();
const doc = (text: string) => ({ type: "doc" as const, content: [{ type: "paragraph", content: [{ type: "text", text }] }] });
const base = (): WriteUpContent => writeUpContentSchema.parse({});

/** This device's version: more plan, a table with readings and an answer. */
function mine(): WriteUpContent {
  const c = base();
  return {
    ...c,
    sections: { ...c.sections, plan: doc("Measure the gas every ten seconds with the syringe."), conclusion: doc("Same in both.") },
    tables: { t1: { rows: [{ time: "0", vol: "0" }, { time: "10", vol: "18" }, { time: "20", vol: "31" }], decisions: {} } },
    answers: { k1: { value: "1.37", unit: "cm³/s", working: doc("41 divided by 30"), tangent: null } },
  };
}

/** The saved version: a shorter plan, fewer readings, no answer. */
function saved(): WriteUpContent {
  const c = base();
  return { ...c, sections: { ...c.sections, plan: doc("Measure the gas."), conclusion: doc("Same in both.") }, tables: { t1: { rows: [{ time: "0", vol: "0" }], decisions: {} } } };
}

function chooser(over: Partial<Parameters<typeof VersionChooser>[0]> = {}) {
  return (
    <VersionChooser
      title="Your write-up was changed somewhere else"
      intro={<p>Choose which version to keep.</p>}
      mineLabel="Yours (this device)"
      otherLabel="Saved version"
      mine={contentParts(mine(), practical)}
      other={contentParts(saved(), practical)}
      keepMineLabel="Keep mine"
      keepOtherLabel="Keep the saved version"
      onKeepMine={() => undefined}
      onKeepOther={() => undefined}
      {...over}
    />
  );
}

describe("VersionChooser", () => {
  it("puts the two versions side by side, part by part, only where they differ", () => {
    render(chooser());
    const region = screen.getByRole("region", { name: "Your write-up was changed somewhere else" });
    const parts = within(region).getAllByRole("listitem");
    expect(parts.map((p) => p.getAttribute("data-part"))).toEqual(["section:plan", "table:t1", "answer:k1"]);
    const plan = parts[0]!;
    expect(plan.querySelector('[data-side="mine"]')?.textContent).toBe("9 words: “Measure the gas every ten seconds with the syringe.”");
    expect(plan.querySelector('[data-side="other"]')?.textContent).toBe("3 words: “Measure the gas.”");
    const table = parts[1]!;
    expect(within(table).getByText("Volume of gas against time")).toBeTruthy();
    expect(table.querySelector('[data-side="mine"]')?.textContent).toBe("6 cells filled");
    expect(table.querySelector('[data-side="other"]')?.textContent).toBe("2 cells filled");
    expect(parts[2]!.querySelector('[data-side="mine"]')?.textContent).toBe("Answer 1.37 cm³/s; working 4 words");
    expect(parts[2]!.querySelector('[data-side="other"]')?.textContent).toBe("No answer");
    expect(within(region).getByText("Everything else is the same in both.")).toBeTruthy();
    // The headings of the two sides are named for screen readers on every part.
    expect(within(plan).getByText("Yours (this device)", { selector: "dt" })).toBeTruthy();
  });

  it("notices a change of readings even when the number of cells is the same", () => {
    const other = mine();
    other.tables.t1!.rows[2] = { time: "20", vol: "35" };
    render(chooser({ other: contentParts(other, practical) }));
    const parts = screen.getAllByRole("listitem");
    expect(parts.map((p) => p.getAttribute("data-part"))).toEqual(["table:t1"]);
  });

  it("keeps mine or keeps the saved version on the person's choice, and never by itself", () => {
    const onKeepMine = vi.fn();
    const onKeepOther = vi.fn();
    render(chooser({ onKeepMine, onKeepOther }));
    expect(onKeepMine).not.toHaveBeenCalled();
    expect(onKeepOther).not.toHaveBeenCalled();
    fireEvent.click(screen.getByRole("button", { name: "Keep mine" }));
    expect(onKeepMine).toHaveBeenCalledTimes(1);
    fireEvent.click(screen.getByRole("button", { name: "Keep the saved version" }));
    expect(onKeepOther).toHaveBeenCalledTimes(1);
  });

  it("takes the keyboard focus to its heading when it appears", () => {
    render(chooser());
    expect(document.activeElement).toBe(screen.getByRole("heading", { name: "Your write-up was changed somewhere else" }));
  });

  it("waits with the buttons off while the saved version is still on its way", () => {
    render(chooser({ other: [], busy: true }));
    expect((screen.getByRole("button", { name: "Keep mine" }) as HTMLButtonElement).disabled).toBe(true);
    expect((screen.getByRole("button", { name: "Keep the saved version" }) as HTMLButtonElement).disabled).toBe(true);
  });

  it("says so when both versions hold the same work", () => {
    render(chooser({ other: contentParts(mine(), practical) }));
    expect(screen.getByText("The two versions hold the same work. Either choice keeps it.")).toBeTruthy();
  });

  it("compares a group's shared tables on their own", () => {
    render(chooser({ mine: groupTableParts(mine().tables, practical), other: groupTableParts({}, practical), keepOtherLabel: "Keep the group's version" }));
    const parts = screen.getAllByRole("listitem");
    expect(parts).toHaveLength(1);
    expect(parts[0]!.querySelector('[data-side="other"]')?.textContent).toBe("No readings");
  });
});
