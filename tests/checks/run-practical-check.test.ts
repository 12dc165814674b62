import { afterEach, describe, expect, it, vi } from "vitest";
import { POST } from "@/app/api/checks/preview/route";
import { runPracticalCheck, studentView } from "@/lib/checks/run";
import type { CheckSpec, TableTemplate } from "@/lib/validation/practicals";
import { checkSchema, tableSchema } from "@/lib/validation/practicals";
import { freshDatabase, makeSchool, makeUser } from "../helpers/db";
import { jsonRequest, signInAs } from "../helpers/session";

vi.mock("@/lib/auth/session", async () => (await import("../helpers/session")).mockSession());

// Invented readings of gas volume against time. The mean rate from 0 s to 30 s is the chord
// gradient (41 − 0) cm³ / (30 − 0) s = 1.3667 cm³/s — worked by hand from the definition of a mean
// rate as change in quantity over time taken (IUPAC Gold Book "rate of reaction", see
// tests/fixtures/README.md for the reference summary).
const table: TableTemplate = tableSchema.parse({
  id: "gas",
  title: "Gas against time",
  rowCount: 7,
  columns: [
    { id: "t", quantity: "time", unit: "s", role: "independent" },
    { id: "v", quantity: "volume of gas", unit: "cm³", role: "dependent" },
  ],
});
const rows = [0, 10, 20, 30, 40, 50, 60].map((t, i) => ({ t: String(t), v: String([0, 18, 31, 41, 48, 53, 56][i]) }));
const meanRate = checkSchema.parse({ id: "k", label: "Mean rate 0–30 s", kind: "mean-rate", tableId: "gas", x: "t", y: "v", from: 0, to: 30, tolerancePercent: 5, sigFigs: { min: 2, max: 3 }, expectedUnit: "cm³/s", show: "hint" }) as CheckSpec;

describe("running a practical's check on a student's table", () => {
  it("agrees with the hand-worked mean rate and reports the expected value to the teacher", () => {
    const o = runPracticalCheck(meanRate, table, rows, { value: "1.37", unit: "cm³/s" });
    expect(o.verdict).toBe("agrees");
    expect(o.expected!.value).toBeCloseTo(41 / 30, 10);
    expect(o.sigFigs).toMatchObject({ typed: 3, ok: true });
  });

  it("converts an equivalent unit rather than refusing it (82 cm³/min = 1.367 cm³/s)", () => {
    expect(runPracticalCheck(meanRate, table, rows, { value: "82", unit: "cm3/min" }).verdict).toBe("agrees");
  });

  it("names the slip when the ratio is inverted", () => {
    const o = runPracticalCheck(meanRate, table, rows, { value: "0.732", unit: "" });
    expect(o.verdict).not.toBe("agrees");
    expect(o.likelySlip?.code).toBe("inverted-ratio");
  });

  it("flags too many significant figures", () => {
    const o = runPracticalCheck(meanRate, table, rows, { value: "1.36667", unit: "cm³/s" });
    expect(o.sigFigs.ok).toBe(false);
    expect(o.sigFigs.message).toMatch(/2 to 3 significant figures/);
  });

  it("says it cannot check yet when the data do not reach the interval, instead of throwing", () => {
    const o = runPracticalCheck(meanRate, table, rows.slice(0, 2), { value: "1.4", unit: "cm³/s" });
    expect(o.verdict).toBe("cannot-check");
    expect(o.hint.length).toBeGreaterThan(10);
  });

  it("checks 1/t row by row from the student's own answer column (1/50.0 s = 0.0200 s⁻¹)", () => {
    const clock = tableSchema.parse({
      id: "c",
      title: "Clock",
      rowCount: 2,
      columns: [
        { id: "tm", quantity: "time", unit: "s", role: "dependent" },
        { id: "inv", quantity: "1/t", unit: "s⁻¹", role: "derived", derivedFrom: "tm", formula: "reciprocal" },
      ],
    });
    const spec = checkSchema.parse({ id: "r", label: "1/t", kind: "reciprocal-time", tableId: "c", t: "tm", answerColumn: "inv", tolerancePercent: 2, expectedUnit: "s⁻¹" }) as CheckSpec;
    const o = runPracticalCheck(spec, clock, [{ tm: "50.0", inv: "0.0200" }, { tm: "25.0", inv: "0.25" }], { value: "", unit: "" });
    expect(o.rows!.map((r) => r.verdict)).toEqual(["agrees", "disagrees"]);
  });

  it("hides the expected value from students unless the teacher reveals it after marking", () => {
    const o = runPracticalCheck(meanRate, table, rows, { value: "2.0", unit: "cm³/s" });
    const hidden = studentView(o, "hint", false);
    expect(JSON.stringify(hidden)).not.toMatch(/1\.36/);
    expect(hidden.expected).toBeNull();
    expect(studentView(o, "verdict", true).hint).toBeNull();
    expect(studentView(o, "expected-after-marking", true).expected!.value).toBeCloseTo(41 / 30, 10);
  });
});

describe("POST /api/checks/preview", () => {
  afterEach(() => signInAs(null));

  it("lets a teacher preview what a student would see, and refuses students and bad bindings", async () => {
    freshDatabase();
    const school = makeSchool();
    signInAs(makeUser(school, ["teacher"]));
    const ok = await POST(jsonRequest("/api/checks/preview", "POST", { check: meanRate, table, rows, answer: { value: "1.37", unit: "cm³/s" } }) as never, { params: Promise.resolve({}) });
    expect(ok.status).toBe(200);
    const body = await ok.json();
    expect(body.studentView.verdict).toBe("agrees");
    expect(body.studentView.expected).toBeNull();

    const bad = await POST(jsonRequest("/api/checks/preview", "POST", { check: { ...meanRate, y: "missing" }, table, rows, answer: { value: "1", unit: "" } }) as never, { params: Promise.resolve({}) });
    expect(bad.status).toBe(400);
    expect((await bad.json()).error.fieldErrors["check.y"][0]).toMatch(/column/);

    signInAs(makeUser(school, ["student"]));
    const refused = await POST(jsonRequest("/api/checks/preview", "POST", { check: meanRate, table, rows, answer: { value: "1", unit: "" } }) as never, { params: Promise.resolve({}) });
    expect(refused.status).toBe(403);
  });
});

describe("a student's reasoned decision to keep a flagged reading", () => {
  // Invented repeats: 62.0, 64.0 and 80.0 s; 80.0 is more than 10 % from the median (64.0), so the
  // rule (common practice) leaves it out: mean (62 + 64) / 2 = 63.0 s. Kept in, the mean is
  // (62 + 64 + 80) / 3 = 68.67 s (hand-worked).
  const repeats = tableSchema.parse({
    id: "r",
    title: "Repeats",
    rowCount: 1,
    columns: [
      { id: "a", quantity: "time, run 1", unit: "s", role: "repeat" },
      { id: "b", quantity: "time, run 2", unit: "s", role: "repeat" },
      { id: "c", quantity: "time, run 3", unit: "s", role: "repeat" },
      { id: "m", quantity: "mean time", unit: "s", role: "mean", meanOf: ["a", "b", "c"] },
    ],
  });
  const spec = checkSchema.parse({ id: "mm", label: "Mean", kind: "mean-of-repeats", tableId: "r", repeats: ["a", "b", "c"], answerColumn: "m", tolerancePercent: 1, expectedUnit: "s" }) as CheckSpec;

  it("follows the anomaly rule when the student made no decision", () => {
    expect(runPracticalCheck(spec, repeats, [{ a: "62.0", b: "64.0", c: "80.0", m: "63.0" }], { value: "", unit: "" }).rows![0]!.verdict).toBe("agrees");
  });

  it("includes the reading the student kept in, so their mean agrees", () => {
    const o = runPracticalCheck(spec, repeats, [{ a: "62.0", b: "64.0", c: "80.0", m: "68.7" }], { value: "", unit: "" }, { keptIn: new Set(["0:c"]) });
    expect(o.rows![0]!.verdict).toBe("agrees");
    expect(o.rows![0]!.expected!).toBeCloseTo(206 / 3, 8);
  });
});
