import { describe, expect, it } from "vitest";
import { formatDate, formatDateTime } from "@/lib/utils";

// Dates as pages show them, against the platform's own Intl formatting in UK English (ECMA-402:
// the same options through Date.prototype.toLocaleString give the same text).
describe("formatting dates for pages", () => {
  const when = new Date(Date.UTC(2026, 11, 3, 14, 5));
  it("writes a date and time as the platform does for en-GB", () => {
    expect(formatDateTime(when)).toBe(when.toLocaleString("en-GB", { day: "numeric", month: "short", year: "numeric", hour: "2-digit", minute: "2-digit" }));
    expect(formatDateTime(when.getTime())).toBe(formatDateTime(when.toISOString()));
    expect(formatDate(when)).toBe(when.toLocaleDateString("en-GB", { day: "numeric", month: "short", year: "numeric" }));
    expect(formatDate(when)).toMatch(/^\d{1,2} Dec 2026$/);
  });
  it("writes a dash for a missing or unreadable date, never 'Invalid Date'", () => {
    for (const d of [null, undefined, "not a date", Number.NaN]) {
      expect(formatDateTime(d)).toBe("—");
      expect(formatDate(d)).toBe("—");
    }
  });
});
