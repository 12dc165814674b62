// Invented templates and readings for the write-up grid and graph tests.
import { graphSchema, tableSchema, type GraphSpec, type TableTemplate } from "@/lib/validation/practicals";
import type { FilledTable } from "@/lib/validation/write-ups";

/** Gas collected over time: times preset every 10 s, volumes typed (gas syringe read to 1 cm³, 0–100 cm³). */
export const gasTable: TableTemplate = tableSchema.parse({
  id: "gas",
  title: "Volume of gas against time",
  rowCount: 8,
  columns: [
    { id: "t", quantity: "time", symbol: "t", unit: "s", role: "independent", resolution: 1, decimalPlaces: 0, rangeMin: 0, rangeMax: 600 },
    { id: "v", quantity: "volume of gas", symbol: "V", unit: "cm³", role: "dependent", resolution: 1, decimalPlaces: 0, rangeMin: 0, rangeMax: 100 },
  ],
  presetRows: Array.from({ length: 8 }, (_, i) => ({ t: i * 10 })),
});

export const gasGraph: GraphSpec = graphSchema.parse({ id: "vt", title: "Volume of gas against time", tableId: "gas", xColumn: "t", yColumn: "v", fit: "curve", tangents: true });

/** Invented volumes following V = 60(1 − e^(−0.05 t)) rounded to whole cm³. */
export const gasVolumes = [0, 24, 38, 47, 52, 55, 57, 58];

export function gasFilled(volumes: (string | null)[] = gasVolumes.map(String)): FilledTable {
  return { rows: volumes.map((v, i) => ({ t: String(i * 10), v })), decisions: {} };
}

/** Mass on a top-pan balance read to 0.01 g (DOMAIN.md: a top-pan balance to 0.01 g). */
export const massTable: TableTemplate = tableSchema.parse({
  id: "mass",
  title: "Mass of flask against time",
  rowCount: 4,
  columns: [
    { id: "t", quantity: "time", symbol: "t", unit: "s", role: "independent", resolution: 1, decimalPlaces: 0 },
    { id: "m", quantity: "mass", symbol: "m", unit: "g", role: "dependent", resolution: 0.01, rangeMin: 0, rangeMax: 400 },
  ],
});

/** Clock reaction with three hand-timed runs and a mean (stopwatch shows 0.01 s, recorded to 0.1 s: common practice). */
export const clockTable: TableTemplate = tableSchema.parse({
  id: "clock",
  title: "Time for the cross to disappear",
  rowCount: 3,
  columns: [
    { id: "T", quantity: "temperature", symbol: "θ", unit: "°C", role: "independent", resolution: 0.5, decimalPlaces: 1, rangeMin: 0, rangeMax: 100 },
    { id: "r1", quantity: "time, run 1", symbol: "t", unit: "s", role: "repeat", resolution: 0.01, decimalPlaces: 1 },
    { id: "r2", quantity: "time, run 2", symbol: "t", unit: "s", role: "repeat", resolution: 0.01, decimalPlaces: 1 },
    { id: "r3", quantity: "time, run 3", symbol: "t", unit: "s", role: "repeat", resolution: 0.01, decimalPlaces: 1 },
    { id: "tm", quantity: "mean time", symbol: "t", unit: "s", role: "mean", decimalPlaces: 1, meanOf: ["r1", "r2", "r3"] },
    { id: "inv", quantity: "1/t", symbol: "1/t", unit: "s⁻¹", role: "derived", decimalPlaces: 4, derivedFrom: "tm", formula: "reciprocal" },
  ],
});

/** A column with no resolution or decimal places set, so only consistency within it is judged. */
export const freeTable: TableTemplate = tableSchema.parse({
  id: "free",
  title: "Length against load",
  rowCount: 4,
  columns: [
    { id: "f", quantity: "load", symbol: "F", unit: "N", role: "independent" },
    { id: "l", quantity: "extension", symbol: "x", unit: "cm", role: "dependent" },
  ],
});

export const blank = (): FilledTable => ({ rows: [], decisions: {} });
