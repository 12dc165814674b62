// @vitest-environment jsdom
import { cleanup, fireEvent, render, screen, within } from "@testing-library/react";
import { afterEach, describe, expect, it, vi } from "vitest";
import { defaultGroupCount, prepListHref } from "@/components/prep/prep-href";
import { PrepList } from "@/components/prep/prep-list";
import { formatAmount, prepTotals, spareGroupsFor, type PrepSection } from "@/components/prep/prep-totals";
import { PREP_CHECK_LINE, STANDING_CAUTION } from "@/lib/ghs";

vi.mock("next/navigation", () => ({ useRouter: () => ({ push: vi.fn(), refresh: vi.fn(), replace: vi.fn() }) }));
afterEach(() => cleanup());

const prep: PrepSection = {
  reagents: [
    { id: "acid", name: "Hydrochloric acid", concentration: 1, concentrationUnit: "mol/dm³", amountPerGroup: 60, amountUnit: "cm³", notes: "Includes a rinse" },
    { id: "mg", name: "Magnesium ribbon", concentration: null, concentrationUnit: "mol/dm³", amountPerGroup: 3, amountUnit: "pieces", notes: "" },
    { id: "cat", name: "Manganese(IV) oxide", concentration: null, concentrationUnit: "mol/dm³", amountPerGroup: 0.05, amountUnit: "g", notes: "" },
    { id: "h2o2", name: "Hydrogen peroxide", concentration: 10, concentrationUnit: "volume", amountPerGroup: 2.2, amountUnit: "g", notes: "" },
  ],
  apparatus: [{ id: "syr", name: "Gas syringe", perGroup: 1 }],
  spareMarginPercent: 10,
  technicianNotes: "Check the syringes slide freely.",
};

describe("prep totals (scaled by the engine)", () => {
  it("turns the spare margin into whole spare groups, rounded up", () => {
    expect(spareGroupsFor(8, 10)).toBe(1);
    expect(spareGroupsFor(10, 10)).toBe(1);
    expect(spareGroupsFor(11, 10)).toBe(2);
    expect(spareGroupsFor(8, 0)).toBe(0);
    expect(spareGroupsFor(8, 25)).toBe(2);
  });

  it("rounds totals up to a step that suits the unit, and small ones to two significant figures", () => {
    const t = prepTotals(prep, 8);
    expect(t.spareGroups).toBe(1);
    const line = (id: string) => t.reagents.find((r) => r.id === id)!.scaled;
    // 60 cm³ x 9 = 540 cm³: already a multiple of 10.
    expect(line("acid")).toEqual({ exact: 540, total: 540, step: 10 });
    // 3 pieces x 9 = 27 whole pieces.
    expect(line("mg")).toMatchObject({ exact: 27, total: 27 });
    // 0.05 g x 9 = 0.45 g: under five grams, so two significant figures, not 1 g.
    expect(line("cat")).toMatchObject({ total: 0.45 });
    // 2.2 g x 9 = 19.8 g: up to the next gram.
    expect(line("h2o2")).toMatchObject({ total: 20, step: 1 });
    expect(formatAmount((line("h2o2") as { exact: number }).exact)).toBe("19.8");
    expect(t.apparatus[0]!.scaled).toMatchObject({ exact: 9, total: 9 });
    // 60 cm³ x (7 + 1) = 480; 61 cm³ x 8 = 488 goes up to 490.
    expect(prepTotals({ ...prep, reagents: [{ ...prep.reagents[0]!, amountPerGroup: 61 }] }, 7).reagents[0]!.scaled).toMatchObject({ exact: 488, total: 490 });
  });

  it("sets a class's usual number of groups and links to a prep list", () => {
    expect(defaultGroupCount(24)).toBe(8);
    expect(defaultGroupCount(25)).toBe(9);
    expect(defaultGroupCount(0)).toBe(1);
    expect(prepListHref({ practicalId: "p 1", versionId: "v1", classId: "c1", groups: 8, date: "2026-12-08" })).toBe("/practicals/p%201/prep?version=v1&class=c1&groups=8&date=2026-12-08");
  });
});

function setup(initial = { classId: "", groups: "8", date: "2026-12-08" }) {
  return render(
    <PrepList
      practical={{ id: "p1", title: "Gas from magnesium and acid", topic: "Rates of reaction", yearGroup: 10 }}
      version={{ id: "v2", version: 2, status: "published" }}
      versions={[{ id: "v2", version: 2, status: "published" }]}
      prep={prep}
      hazards={[{ id: "h1", substance: "Hydrochloric acid, 1.0 mol/dm³", pictograms: ["GHS05", "GHS07"], signalWord: "Danger", hazardStatements: "Causes skin burns.", controls: "Goggles on." }]}
      eyeProtection="goggles"
      otherPpe={["Gloves"]}
      classes={[
        { id: "c1", name: "10C Chemistry", studentCount: 24 },
        { id: "c2", name: "12A Chemistry", studentCount: 14 },
      ]}
      initial={initial}
    />,
  );
}

const reagentRow = (name: string) => screen.getByRole("row", { name: new RegExp(`^${name}`) });

describe("PrepList", () => {
  it("shows the totals, the hazards with pictogram names, the standing caution and the check line in bold", () => {
    setup();
    expect(within(reagentRow("Hydrochloric acid")).getAllByRole("cell").map((c) => c.textContent)).toEqual(["Hydrochloric acid", "1 mol/dm³", "60 cm³", "540 cm³", "540 cm³", "Includes a rinse"]);
    expect(screen.getByText("8 + 1 spare (10 % margin)")).toBeTruthy();
    expect(screen.getByText(/^Tuesday,? 8 December 2026$/)).toBeTruthy();
    expect(screen.getByText("Corrosive")).toBeTruthy();
    expect(screen.getByText("Harmful or irritant")).toBeTruthy();
    expect(screen.getByText(STANDING_CAUTION)).toBeTruthy();
    const check = screen.getByText(PREP_CHECK_LINE);
    expect(check.className).toContain("font-bold");
    expect(screen.getByText("Check the syringes slide freely.")).toBeTruthy();
  });

  it("sets the number of groups from the class chosen (size ÷ 3, rounded up) and recalculates", () => {
    setup();
    fireEvent.change(screen.getByLabelText("Class"), { target: { value: "c2" } });
    expect((screen.getByLabelText("Number of groups") as HTMLInputElement).value).toBe("5");
    expect(within(reagentRow("Hydrochloric acid")).getAllByRole("cell")[4]!.textContent).toBe("360 cm³");
    expect(window.location.search).toContain("class=c2");
    expect(window.location.search).toContain("groups=5");
  });

  it("says what is wrong with the number of groups instead of showing totals", () => {
    setup();
    const groups = screen.getByLabelText("Number of groups");
    fireEvent.change(groups, { target: { value: "2.5" } });
    expect(groups.getAttribute("aria-invalid")).toBe("true");
    expect(screen.getAllByText("Enter the number of groups to see the totals.")).toHaveLength(2);
    expect(screen.getByText("Enter a whole number of groups, 1 or more.")).toBeTruthy();
    expect((screen.getByRole("button", { name: "Print prep list" }) as HTMLButtonElement).disabled).toBe(true);
  });
});
