import { describe, expect, it } from "vitest";
import { isCurrentSection } from "@/components/app-shell/nav-item";

describe("isCurrentSection", () => {
  it("marks Home only on the home page", () => {
    expect(isCurrentSection("/", "/")).toBe(true);
    expect(isCurrentSection("/practicals", "/")).toBe(false);
  });
  it("marks a section on its own page and the pages under it", () => {
    expect(isCurrentSection("/practicals", "/practicals")).toBe(true);
    expect(isCurrentSection("/practicals/abc/versions/def", "/practicals")).toBe(true);
  });
  it("does not mark a section whose name merely starts the same way", () => {
    expect(isCurrentSection("/progress/classes/10c", "/progress")).toBe(true);
    expect(isCurrentSection("/progressive", "/progress")).toBe(false);
    expect(isCurrentSection("/lab-sessions-old", "/lab-sessions")).toBe(false);
  });
});
