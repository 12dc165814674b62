import { describe, expect, it } from "vitest";
import { meanOfRepeats } from "@/lib/marking/mean-of-repeats";
import { findAnomalies } from "@/lib/marking/find-anomalies";
import { expectClose, expectMarkingError } from "./helpers";

describe("findAnomalies: more than X % from the median of the repeats (common practice; X is the teacher's, default 10)", () => {
  it("flags the one reading that does not fit", () => {
    const flagged = findAnomalies([62, 64, 80]);
    expect(flagged.map((anomaly) => anomaly.index)).toEqual([2]);
    expectClose(flagged[0].percentFromMedian, 25, { rel: 1e-12 });
    expect(flagged[0].reason).toContain("25 %");
  });
  it("flags nothing when the readings agree, or with fewer than three", () => {
    expect(findAnomalies([45, 47, 46])).toEqual([]);
    expect(findAnomalies([40, 80])).toEqual([]);
  });
  it("flags nothing when half or more would be flagged (no agreed value)", () => {
    expect(findAnomalies([10, 20, 30, 40])).toEqual([]);
  });
  it("follows the teacher's threshold", () => {
    expect(findAnomalies([100, 104, 108], 3).map((anomaly) => anomaly.index)).toEqual([]);
    expect(findAnomalies([100, 101, 108], 5).map((anomaly) => anomaly.index)).toEqual([2]);
  });
  it("refuses a bad threshold or a NaN", () => {
    expectMarkingError(() => findAnomalies([1, 2, 3], 0), "invalid-option");
    expectMarkingError(() => findAnomalies([1, Number.NaN, 3]), "not-a-number");
  });
});

describe("meanOfRepeats", () => {
  it("leaves the anomaly out and reports both means and the half range", () => {
    const result = meanOfRepeats([62, 64, 80]);
    expect(result.mean).toBe(63);
    expectClose(result.meanOfAll, 206 / 3, { rel: 1e-15 });
    expect(result.used).toEqual([62, 64]);
    expect(result.halfRange).toBe(1);
  });
  it("skips blank cells", () => {
    const result = meanOfRepeats([45, null, 47]);
    expect(result.mean).toBe(46);
    expect(result.blanks).toBe(1);
  });
  it("can keep every reading", () => {
    expectClose(meanOfRepeats([62, 64, 80], { excludeAnomalies: false }).mean, 206 / 3, { rel: 1e-15 });
  });
  it("refuses all-blank rows and non-numbers", () => {
    expectMarkingError(() => meanOfRepeats([null, null]), "too-few-points");
    expectMarkingError(() => meanOfRepeats([1, Number.NaN]), "not-a-number");
  });
});
