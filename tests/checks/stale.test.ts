import { describe, expect, it } from "vitest";
import { answerFingerprint, checkDataFingerprint, fingerprint, isStale, stableStringify } from "@/lib/write-ups/stale";

describe("stale-check detection", () => {
  const tables = { gas: { rows: [{ t: "0", v: "0" }, { t: "10", v: "18" }], decisions: {} } };

  it("gives the same fingerprint whatever the key order", () => {
    expect(stableStringify({ b: 1, a: [2, { d: 3, c: 4 }] })).toBe('{"a":[2,{"c":4,"d":3}],"b":1}');
    expect(fingerprint({ b: 1, a: 2 })).toBe(fingerprint({ a: 2, b: 1 }));
  });

  it("goes stale when a reading in the check's table changes, not when another table changes", () => {
    const ran = { dataHash: checkDataFingerprint({ tableId: "gas" }, tables), answerHash: answerFingerprint({ value: "1.4", unit: "cm³/s" }) };
    const other = { ...tables, other: { rows: [{ x: "5" }], decisions: {} } };
    expect(isStale(ran, { dataHash: checkDataFingerprint({ tableId: "gas" }, other), answerHash: ran.answerHash })).toBe(false);
    const edited = { gas: { rows: [{ t: "0", v: "0" }, { t: "10", v: "19" }], decisions: {} } };
    expect(isStale(ran, { dataHash: checkDataFingerprint({ tableId: "gas" }, edited), answerHash: ran.answerHash })).toBe(true);
  });

  it("goes stale when a reading is excluded, or the answer or tangent changes; spaces alone do not count", () => {
    const ran = { dataHash: checkDataFingerprint({ tableId: "gas" }, tables), answerHash: answerFingerprint({ value: "1.4", unit: "cm³/s" }) };
    const decided = { gas: { ...tables.gas, decisions: { "1:v": { include: false, reason: "syringe stuck" } } } };
    expect(isStale(ran, { dataHash: checkDataFingerprint({ tableId: "gas" }, decided), answerHash: ran.answerHash })).toBe(true);
    expect(isStale(ran, { dataHash: ran.dataHash, answerHash: answerFingerprint({ value: " 1.4 ", unit: "cm³/s" }) })).toBe(false);
    expect(isStale(ran, { dataHash: ran.dataHash, answerHash: answerFingerprint({ value: "1.40", unit: "cm³/s" }) })).toBe(true);
    expect(isStale(ran, { dataHash: ran.dataHash, answerHash: answerFingerprint({ value: "1.4", unit: "cm³/s", tangent: { x1: 0, y1: 0, x2: 1, y2: 1 } }) })).toBe(true);
  });

  it("is never stale when the check has not run", () => {
    expect(isStale(undefined, { dataHash: "a", answerHash: "b" })).toBe(false);
  });
});
