/**
 * Benchmark for the calculation engine (`npm run bench:marking`).
 *
 * 1. Accuracy: log relative error (LRE, agreeing significant digits, capped at 15) on the NIST
 *    StRD datasets in tests/fixtures, for our engine and for the general-purpose npm packages run
 *    on the same data; the minimum over the coefficients of each dataset.
 * 2. Throughput: runCheck on generated write-ups (seeded pseudo-random numbers, so every run
 *    checks the same data): one class of 30 write-ups x 6 checks, and 10,000 write-ups.
 */
import { loadavg } from "node:os";
import { levenbergMarquardt as mlLevenbergMarquardt } from "ml-levenberg-marquardt";
import { firstOrderFit, linearFit, polynomialFit, runCheck } from "../lib/marking";
import type { CheckAnswerInput, CheckDefinition, ResultsTable } from "../lib/marking";
import { loadNistLinear, loadNistNonlinear, nistLinearNames } from "../tests/marking/fixtures";
import { logRelativeError } from "../tests/marking/log-relative-error";
import { minimumCoefficientLre, ourFit, referenceFits } from "../tests/marking/reference-packages";

function pad(text: string, width: number): string {
  return text.length >= width ? text : text + " ".repeat(width - text.length);
}

function formatLre(value: number | null): string {
  return value === null ? "   -" : value.toFixed(1).padStart(4);
}

function accuracyTable(): void {
  const implementations = [
    "ours",
    "simple-statistics linearRegression",
    "ml-regression SimpleLinearRegression",
    "ml-regression PolynomialRegression",
    "jstat models.ols",
  ];
  console.log("Accuracy on NIST StRD linear datasets: minimum LRE over the coefficients (digits; 15 = exact to double precision)");
  console.log("Columns: our engine; simple-statistics linearRegression; ml-regression SimpleLinearRegression and PolynomialRegression;");
  console.log("jstat models.ols; then our standard errors (minimum) and residual SD. '-' means the package has no such model.");
  console.log(`${pad("dataset", 10)}${pad("difficulty", 11)}${["ours", "simple-stats", "ml SLR", "ml Poly", "jstat ols"].map((name) => pad(name, 12)).join(" ")}  ours: std errors, residual SD`);
  for (const name of nistLinearNames) {
    const data = loadNistLinear(name);
    const row: (number | null)[] = [minimumCoefficientLre(ourFit(data), data.certified.estimates)];
    const references = referenceFits(data);
    for (const implementation of implementations.slice(1)) {
      const found = references.find((reference) => reference.implementation === implementation);
      row.push(found ? minimumCoefficientLre(found.coefficients, data.certified.estimates) : null);
    }
    let stdErrs: readonly number[];
    let residualStdDev: number;
    if (data.degree === 1) {
      const fit = linearFit(data.x, data.y, { throughOrigin: data.throughOrigin });
      stdErrs = data.throughOrigin ? [fit.slopeStdErr] : [fit.interceptStdErr, fit.slopeStdErr];
      residualStdDev = fit.residualStdDev;
    } else {
      const fit = polynomialFit(data.x, data.y, data.degree);
      stdErrs = fit.coefficientStdErrs;
      residualStdDev = fit.residualStdDev;
    }
    const stdErrLre = Math.min(...stdErrs.map((value, i) => logRelativeError(value, data.certified.stdDevs[i])));
    console.log(
      `${pad(name, 10)}${pad(data.difficulty, 11)}${row.map((value) => pad(formatLre(value), 12)).join(" ")}  ${formatLre(stdErrLre)}, ${formatLre(logRelativeError(residualStdDev, data.certified.residualStdDev))}`,
    );
  }

  console.log("");
  console.log("NIST StRD Misra1a, y = b1 (1 - e^(-b2 x)): minimum LRE over b1, b2");
  const misra = loadNistNonlinear("Misra1a");
  const starts: [string, { a: number; k: number } | undefined][] = [
    ["NIST start 1", { a: misra.starts[0][0], k: misra.starts[0][1] }],
    ["NIST start 2", { a: misra.starts[1][0], k: misra.starts[1][1] }],
    ["start from the data", undefined],
  ];
  for (const [label, start] of starts) {
    let ours = 0;
    try {
      const fit = firstOrderFit(misra.x, misra.y, { kind: "rise", offset: false, start });
      ours = Math.min(logRelativeError(fit.a, misra.certified.estimates[0]), logRelativeError(fit.k, misra.certified.estimates[1]));
    } catch {
      ours = 0;
    }
    let theirs = 0;
    if (start) {
      try {
        const result = mlLevenbergMarquardt(
          { x: misra.x, y: misra.y },
          ([b1, b2]: number[]) => (x: number) => b1 * (1 - Math.exp(-b2 * x)),
          { initialValues: [start.a, start.k], maxIterations: 1000, errorTolerance: 1e-12 },
        );
        theirs = Math.min(
          logRelativeError(result.parameterValues[0], misra.certified.estimates[0]),
          logRelativeError(result.parameterValues[1], misra.certified.estimates[1]),
        );
      } catch {
        theirs = 0;
      }
    }
    console.log(`  ${pad(label, 22)} ours ${formatLre(ours)}   ml-levenberg-marquardt ${start ? formatLre(theirs) : "   -"}`);
  }
}

/** Mulberry32: a small seeded pseudo-random generator, so the generated classes are the same every run. */
function seededRandom(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

interface WriteUpCheck {
  readonly definition: CheckDefinition;
  readonly table: ResultsTable;
  readonly answer: CheckAnswerInput;
}

/**
 * One student's write-up: gas collected over time with the flask's mass, and a clock reaction at
 * four temperatures with three repeats (an anomaly now and then). The typed answers start from
 * the value the engine expects for that student's own data and then, like real answers, are
 * rounded, scattered a little, or carry a slip (minutes for seconds, a lost sign, an inverted
 * ratio, cm³ for dm³, or a wild value).
 */
function generateWriteUp(random: () => number): WriteUpCheck[] {
  const normal = (): number => {
    const u = Math.max(random(), 1e-12);
    return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * random());
  };
  const finalVolume = 40 + 50 * random();
  const k = 0.015 + 0.04 * random();
  const times = [0, 10, 20, 30, 40, 50, 60, 80, 100, 120];
  const gas: ResultsTable = {
    columns: [
      { id: "t", unit: "s", significantFigures: 2 },
      { id: "v", unit: "cm3", significantFigures: 2 },
      { id: "m", unit: "g", significantFigures: 4 },
    ],
    rows: times.map((t) => [
      t,
      Math.max(0, Math.round(finalVolume * (1 - Math.exp(-k * t)) + 0.6 * normal())),
      Number((82.4 - 0.0018 * finalVolume * (1 - Math.exp(-k * t)) + 0.003 * normal()).toFixed(2)),
    ]),
  };
  const ea = 45e3 + 15e3 * random();
  const clockRows = [20, 30, 40, 50].map((theta) => {
    const time = 0.02 / (5e6 * Math.exp(-ea / (8.31446261815324 * (theta + 273.15))));
    const repeats = [0, 1, 2].map(() => Number((time * (1 + 0.03 * normal())).toFixed(1)));
    if (random() < 0.1) repeats[2] = Number((repeats[2] * 1.4).toFixed(1));
    return [theta, ...repeats];
  });
  const clock: ResultsTable = {
    columns: [
      { id: "T", unit: "°C" },
      { id: "t1", unit: "s" },
      { id: "t2", unit: "s" },
      { id: "t3", unit: "s" },
    ],
    rows: clockRows,
  };
  const withMeans: ResultsTable = {
    columns: [...clock.columns, { id: "mean", unit: "s" }],
    rows: clockRows.map((row) => [...row, (row[1] + row[2] + row[3]) / 3]),
  };
  const typed = (value: number, unit: string): { value: string; unit: string } => {
    const roll = random();
    const answer =
      roll < 0.7 ? value * (1 + 0.04 * normal())
      : roll < 0.78 ? value * 60
      : roll < 0.83 ? -value
      : roll < 0.88 ? 1 / value
      : roll < 0.92 ? value * 1000
      : value * (0.2 + 3 * random());
    return { value: answer.toPrecision(2 + Math.floor(random() * 2)), unit };
  };
  const single = (definition: CheckDefinition, table: ResultsTable, unit: string): WriteUpCheck => {
    const expected = runCheck(definition, table, { value: "0" }).expected?.value ?? 1;
    return { definition, table, answer: typed(expected, unit) };
  };
  const repeats: CheckDefinition = { kind: "mean-of-repeats", repeats: ["t1", "t2", "t3"] };
  const rowExpected = runCheck(repeats, clock, { rows: [] }).rows ?? [];
  return [
    single({ kind: "mean-rate", x: "t", y: "v", from: 0, to: 30 }, gas, "cm3/s"),
    single({ kind: "gradient", x: "t", y: "m" }, gas, "g/s"),
    single({ kind: "rate-at", x: "t", y: "v", at: 40 }, gas, "cm3 s-1"),
    single({ kind: "initial-rate", x: "t", y: "v" }, gas, "cm³ s⁻¹"),
    { definition: repeats, table: clock, answer: { rows: rowExpected.map((row) => (random() < 0.9 ? { value: (row.expected?.value ?? 0).toPrecision(3), unit: "s" } : typed(row.expected?.value ?? 1, "s"))) } },
    single({ kind: "activation-energy", temperature: "T", rate: "mean", rateIs: "time" }, withMeans, "kJ/mol"),
  ];
}

function cpuMilliseconds(since: NodeJS.CpuUsage): number {
  const used = process.cpuUsage(since);
  return (used.user + used.system) / 1000;
}

function throughput(): void {
  const random = seededRandom(20261201);
  const verdictCounts: Record<string, number> = {};
  const markAll = (writeUps: readonly WriteUpCheck[][]): void => {
    for (const writeUp of writeUps) {
      for (const check of writeUp) {
        const result = runCheck(check.definition, check.table, check.answer);
        verdictCounts[result.verdict] = (verdictCounts[result.verdict] ?? 0) + 1;
      }
    }
  };
  // Warm up the JIT on separate write-ups so the timings are for steady running.
  markAll(Array.from({ length: 1500 }, () => generateWriteUp(random)));

  // Twenty different classes, so no class is marked twice (remembered fits would flatter it).
  const classes = Array.from({ length: 20 }, () => Array.from({ length: 30 }, () => generateWriteUp(random)));
  const classWall: number[] = [];
  const classesCpu = process.cpuUsage();
  for (const writeUps of classes) {
    const start = performance.now();
    markAll(writeUps);
    classWall.push(performance.now() - start);
  }
  // The operating system counts CPU time in clock ticks, so it is read over all twenty classes.
  const cpuPerClass = cpuMilliseconds(classesCpu) / classes.length;
  const median = (values: number[]): number => [...values].sort((a, b) => a - b)[Math.floor(values.length / 2)];
  console.log("");
  console.log("Throughput (one Node process, so one core; CPU time is this process's own, wall time includes waiting for a busy machine)");
  console.log(`  machine load average over the last minute: ${loadavg()[0].toFixed(1)} (timings are only comparable at similar load)`);
  console.log(
    `  a class of 30 write-ups x 6 checks (180 checks), 20 different classes: wall median ${median(classWall).toFixed(2)} ms, best ${Math.min(...classWall).toFixed(2)} ms; CPU ${cpuPerClass.toFixed(2)} ms per class (target well under 10 ms)`,
  );
  const large = Array.from({ length: 10_000 }, () => generateWriteUp(random));
  for (const key of Object.keys(verdictCounts)) delete verdictCounts[key];
  const cpu = process.cpuUsage();
  const start = performance.now();
  markAll(large);
  const wall = performance.now() - start;
  console.log(
    `  10,000 write-ups x 6 checks (60,000 checks): CPU ${(cpuMilliseconds(cpu) / 1000).toFixed(2)} s, wall ${(wall / 1000).toFixed(2)} s (target under 2 s)`,
  );
  console.log(`  verdicts over the 10,000: ${Object.entries(verdictCounts).map(([verdict, count]) => `${verdict} ${count}`).join(", ")}`);
}

accuracyTable();
throughput();
