// @vitest-environment jsdom
import { cleanup, render, screen, within } from "@testing-library/react";
import { afterEach, describe, expect, it } from "vitest";
import { GhsPictogram } from "@/components/practicals/ghs-pictogram";
import { PracticalView } from "@/components/practicals/practical-view";
import { practicalStatusParts, sessionsLabel } from "@/components/practicals/status";
import { emptyContent } from "@/db/queries/practicals";
import { GHS_PICTOGRAMS, STANDING_CAUTION } from "@/lib/ghs";
import { completePracticalContent } from "../helpers/practicals";

afterEach(() => cleanup());

const meta = { title: "Gas collected over time", topic: "Rates of reaction", subject: "Chemistry", yearGroup: 10 };

describe("GhsPictogram", () => {
  it("names each of the nine pictograms for screen readers", () => {
    render(
      <div>
        {GHS_PICTOGRAMS.map((p) => (
          <GhsPictogram key={p.code} code={p.code} />
        ))}
      </div>,
    );
    expect(screen.getAllByRole("img").map((i) => i.getAttribute("aria-label"))).toEqual(GHS_PICTOGRAMS.map((p) => p.name));
  });

  it("hides itself when a visible label already names it", () => {
    const { container } = render(<GhsPictogram code="GHS05" decorative />);
    expect(screen.queryByRole("img")).toBeNull();
    expect(container.querySelector("svg")?.getAttribute("aria-hidden")).toBe("true");
  });
});

describe("PracticalView", () => {
  it("shows the standing caution, the header row as quantity / unit, pictograms by name, checks in words and the rubric", () => {
    render(<PracticalView meta={meta} content={completePracticalContent()} />);
    expect(screen.getByRole("complementary", { name: "Safety caution" }).textContent).toContain(STANDING_CAUTION);
    const table = screen.getByRole("table", { name: "Volume of gas against time" });
    expect(within(table).getAllByRole("columnheader").map((h) => h.textContent)).toEqual(["time / s", "volume of gas / cm³"]);
    const pictos = screen.getByRole("list", { name: "Hazard pictograms" });
    expect(pictos.textContent).toContain("Harmful or irritant");
    expect(screen.getByText(/Eye protection: Chemical splash goggles/)).toBeTruthy();
    expect(screen.getByText(/divided by the change in “time \/ s”, from 0 s to 30 s/)).toBeTruthy();
    expect(screen.getByText(/Marked out of 5/)).toBeTruthy();
    expect(screen.getByText(/Uses the checks: Mean rate from 0 to 30 s, Rate at 20 s from a tangent/)).toBeTruthy();
  });

  it("says plainly what is missing from a new practical", () => {
    render(<PracticalView meta={meta} content={emptyContent()} />);
    expect(screen.getByText("No aim written yet.")).toBeTruthy();
    expect(screen.getByText("No method written yet.")).toBeTruthy();
    expect(screen.getByText(/No hazards listed yet/)).toBeTruthy();
    expect(screen.getByText("No rubric yet.")).toBeTruthy();
    expect(screen.getByRole("complementary", { name: "Safety caution" })).toBeTruthy();
  });
});

describe("library status words", () => {
  it("says what is published and what is in progress", () => {
    expect(practicalStatusParts({ latestVersion: 1, latestStatus: "draft", publishedVersion: null })).toEqual([{ label: "Draft v1", tone: "warn" }]);
    expect(practicalStatusParts({ latestVersion: 3, latestStatus: "draft", publishedVersion: 2 }).map((p) => p.label)).toEqual(["Published v2", "Draft v3 in progress"]);
    expect(practicalStatusParts({ latestVersion: 2, latestStatus: "published", publishedVersion: 2 }).map((p) => p.label)).toEqual(["Published v2"]);
    expect(sessionsLabel(0)).toBe("Not used by any lab session yet");
    expect(sessionsLabel(1)).toBe("Used by 1 lab session");
    expect(sessionsLabel(4)).toBe("Used by 4 lab sessions");
  });
});
