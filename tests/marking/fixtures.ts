import { readFileSync } from "node:fs";
import { dirname, join } from "node:path";
import { fileURLToPath } from "node:url";

/** tests/fixtures, found relative to this file so tests run from any working directory. */
const fixturesDirectory = join(dirname(fileURLToPath(import.meta.url)), "..", "fixtures");

export function readFixture(relativePath: string): string {
  return readFileSync(join(fixturesDirectory, relativePath), "utf8");
}

/** A NIST StRD linear dataset: data rows and the certified values parsed from its own header. */
export interface NistLinearDataset {
  readonly name: string;
  readonly x: number[];
  readonly y: number[];
  readonly certified: { estimates: number[]; stdDevs: number[]; residualStdDev: number; rSquared: number };
  /** Highest power of x in the model. */
  readonly degree: number;
  readonly throughOrigin: boolean;
  readonly difficulty: "Lower" | "Average" | "Higher";
}

const numberPattern = /[-+]?\d*\.?\d+(?:[eE][-+]?\d+)?/g;

function dataRows(lines: readonly string[]): number[][] {
  const rows: number[][] = [];
  for (const line of lines.slice(60)) {
    const parts = line.trim().split(/\s+/).filter(Boolean).map(Number);
    if (parts.length >= 2 && parts.every(Number.isFinite)) rows.push(parts);
  }
  return rows;
}

export function loadNistLinear(name: string): NistLinearDataset {
  const lines = readFixture(`nist-strd/${name}.dat`).split(/\r?\n/);
  const estimates: number[] = [];
  const stdDevs: number[] = [];
  let residualStdDev = Number.NaN;
  let rSquared = Number.NaN;
  for (const line of lines.slice(0, 60)) {
    const parameter = /^\s*B(\d+)\s+(\S+)\s+(\S+)/.exec(line);
    if (parameter) {
      estimates[Number(parameter[1])] = Number(parameter[2]);
      stdDevs[Number(parameter[1])] = Number(parameter[3]);
    }
    if (/Standard Deviation\s+[-+\d.]/.test(line)) residualStdDev = Number(line.match(numberPattern)?.at(-1));
    if (/R-Squared/.test(line)) rSquared = Number(line.match(numberPattern)?.at(-1));
  }
  const difficulty = (/(Lower|Average|Higher) Level of Difficulty/.exec(lines.join("\n"))?.[1] ?? "Lower") as NistLinearDataset["difficulty"];
  const throughOrigin = estimates[0] === undefined;
  const rows = dataRows(lines);
  return {
    name,
    y: rows.map((row) => row[0]),
    x: rows.map((row) => row[1]),
    certified: {
      estimates: throughOrigin ? estimates.slice(1) : estimates,
      stdDevs: throughOrigin ? stdDevs.slice(1) : stdDevs,
      residualStdDev,
      rSquared,
    },
    degree: estimates.length - 1,
    throughOrigin,
    difficulty,
  };
}

/** NIST StRD linear datasets in tests/fixtures/nist-strd (Longley, a multiple regression, is not used). */
export const nistLinearNames = ["Norris", "Pontius", "NoInt1", "NoInt2", "Filip", "Wampler1", "Wampler2", "Wampler3"] as const;

/** A NIST StRD non-linear dataset with both starting points and certified values. */
export interface NistNonlinearDataset {
  readonly x: number[];
  readonly y: number[];
  readonly starts: [number[], number[]];
  readonly certified: { estimates: number[]; stdDevs: number[]; residualSumOfSquares: number };
}

export function loadNistNonlinear(name: string): NistNonlinearDataset {
  const lines = readFixture(`nist-strd-nonlinear/${name}.dat`).split(/\r?\n/);
  const start1: number[] = [];
  const start2: number[] = [];
  const estimates: number[] = [];
  const stdDevs: number[] = [];
  let residualSumOfSquares = Number.NaN;
  for (const line of lines.slice(0, 60)) {
    const parameter = /^\s*b(\d+)\s*=\s*(\S+)\s+(\S+)\s+(\S+)\s+(\S+)/.exec(line);
    if (parameter) {
      const index = Number(parameter[1]) - 1;
      start1[index] = Number(parameter[2]);
      start2[index] = Number(parameter[3]);
      estimates[index] = Number(parameter[4]);
      stdDevs[index] = Number(parameter[5]);
    }
    if (/Residual Sum of Squares/.test(line)) residualSumOfSquares = Number(line.match(numberPattern)?.at(-1));
  }
  const rows = dataRows(lines);
  return {
    y: rows.map((row) => row[0]),
    x: rows.map((row) => row[1]),
    starts: [start1, start2],
    certified: { estimates, stdDevs, residualSumOfSquares },
  };
}

/** A CSV file from tests/fixtures/kinetics as an array of records (numbers where they parse). */
export function loadKineticsCsv(fileName: string): Record<string, string | number>[] {
  const [header, ...lines] = readFixture(`kinetics/${fileName}`).trim().split(/\r?\n/);
  const names = header.split(",");
  return lines.map((line) => {
    const cells = line.split(",");
    const record: Record<string, string | number> = {};
    names.forEach((name, i) => {
      const cell = cells[i] ?? "";
      record[name] = cell !== "" && Number.isFinite(Number(cell)) ? Number(cell) : cell;
    });
    return record;
  });
}

export function column(records: readonly Record<string, string | number>[], name: string): number[] {
  return records.map((record) => {
    const value = record[name];
    if (typeof value !== "number") throw new Error(`column ${name} has a non-number: ${String(value)}`);
    return value;
  });
}
