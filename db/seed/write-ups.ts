// Demo write-ups: invented readings generated with realistic scatter, and a few deliberate student
// slips (minutes for seconds, an inverted ratio, the wrong interval, too many significant figures,
// a tangent that misses the curve) so that every verdict shows up in the demo.
import { runPracticalCheck } from "@/lib/checks/run";
import type { PracticalContent } from "@/lib/validation/practicals";
import { writeUpContentSchema, type WriteUpContent } from "@/lib/validation/write-ups";
import { keptInReadings, rowsForCheck } from "@/lib/write-ups/rows-for-check";
import { answerFingerprint, checkDataFingerprint } from "@/lib/write-ups/stale";
import type { StoredCheckResults } from "../schema";
import { seededRandom } from "./people";

export type Scenario = "not-started" | "draft" | "submitted" | "late";
type Slip = "none" | "minutes" | "inverted" | "interval" | "sigfigs" | "tangent-miss" | "careless";

const para = (text: string) => ({ type: "doc" as const, content: [{ type: "paragraph", content: [{ type: "text", text }] }] });

function gaussian(rand: () => number): number {
  const u = Math.max(rand(), 1e-12);
  return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * rand());
}

const round = (x: number, dp: number) => Number(x.toFixed(dp));

/** Gas collected over time: V = Vmax (1 − e^(−kt)) with reading scatter of about ±1 cm³. */
function gasReadings(rand: () => number, times: number[]) {
  const vmax = 62 + rand() * 26;
  const k = 0.03 + rand() * 0.03;
  return { vmax, k, v: times.map((t) => Math.max(0, Math.round(vmax * (1 - Math.exp(-k * t)) + (t === 0 ? 0 : gaussian(rand) * 0.9)))) };
}

/** Times for the cross to disappear: Arrhenius with Ea about 50–60 kJ/mol and ±3 % scatter. */
function clockTimes(rand: () => number, temps: number[]) {
  const ea = 48_000 + rand() * 12_000;
  const t20 = 95 + rand() * 30;
  const R = 8.314462618;
  return temps.map((c) => {
    const base = t20 * Math.exp((ea / R) * (1 / (c + 273.15) - 1 / 293.15));
    return [0, 1, 2].map(() => round(base * (1 + gaussian(rand) * 0.03), 1));
  });
}

export function writeUpFor(practicalKey: string, practical: PracticalContent, index: number, scenario: Scenario): { content: WriteUpContent; checkResults: StoredCheckResults; attempts: { checkId: string; kind: string; verdict: string; slipCode: string | null }[] } {
  const rand = seededRandom(1000 + index * 7919 + practicalKey.length);
  const slips: Slip[] = ["none", "none", "minutes", "none", "inverted", "none", "interval", "sigfigs", "none", "tangent-miss", "none", "careless"];
  const slip = slips[index % slips.length]!;
  const base = writeUpContentSchema.parse({});
  if (scenario === "not-started") return { content: base, checkResults: {}, attempts: [] };

  let tables: WriteUpContent["tables"] = {};
  const answers: WriteUpContent["answers"] = {};
  const graphs: WriteUpContent["graphs"] = {};

  if (practicalKey === "mg-acid") {
    const times = Array.from({ length: 13 }, (_, i) => i * 10);
    const { vmax, k, v } = gasReadings(rand, times);
    const filled = scenario === "draft" && index % 3 === 0 ? 8 : 13;
    tables = { gas: { rows: times.map((t, i) => ({ t: String(t), v: i < filled ? String(v[i]) : "" })), decisions: {} } };
    const mean = v[3]! / 30;
    const rate20 = vmax * k * Math.exp(-k * 20);
    const meanAnswer = slip === "minutes" ? mean * 60 : slip === "inverted" ? 1 / mean : slip === "interval" ? (v[4]! - v[1]!) / 30 : slip === "careless" ? mean * 1.4 : mean;
    const typed = slip === "sigfigs" ? meanAnswer.toFixed(5) : meanAnswer.toPrecision(3);
    // A careless draft answer that is not a number at all: the check cannot run until it is fixed.
    answers.mean030 = { value: slip === "careless" && scenario === "draft" ? `about ${Math.round(meanAnswer)}` : typed, unit: "cm³/s", working: null };
    // The tangent: the student's drawn line at 20 s, with hand-drawn scatter in its slope.
    const y20 = vmax * (1 - Math.exp(-k * 20));
    const drawnSlope = rate20 * (1 + gaussian(rand) * 0.08);
    const lift = slip === "tangent-miss" ? 9 : gaussian(rand) * 0.6;
    const tangent = { at: 20, x1: 0, y1: round(y20 + lift - drawnSlope * 20, 1), x2: 50, y2: round(y20 + lift + drawnSlope * 30, 1) };
    graphs.vt = { tangent };
    answers.rate20 = { value: drawnSlope.toPrecision(2), unit: "cm³/s", working: null, tangent: { x1: tangent.x1, y1: tangent.y1, x2: tangent.x2, y2: tangent.y2 } };
    if (filled === 13) answers.initial = { value: (vmax * k * (1 + gaussian(rand) * 0.1)).toPrecision(2), unit: "cm³ s⁻¹", working: null };
  } else if (practicalKey === "chips") {
    const times = Array.from({ length: 11 }, (_, i) => i * 30);
    const total = 2.1 + rand() * 0.3;
    const chips = times.map((t) => Math.max(0, total * (1 - Math.exp(-0.004 * t)) + (t ? gaussian(rand) * 0.01 : 0)));
    const powder = times.map((t) => Math.max(0, total * (1 - Math.exp(-0.02 * t)) + (t ? gaussian(rand) * 0.01 : 0)));
    tables = { mass: { rows: times.map((t, i) => ({ t: String(t), mc: chips[i]!.toFixed(2), mp: powder[i]!.toFixed(2) })), decisions: {} } };
    const mp = Number(powder[4]!.toFixed(2)) / 120;
    const mc = Number(chips[4]!.toFixed(2)) / 120;
    answers.mean02 = { value: (slip === "minutes" ? mp * 60 : mp).toPrecision(2), unit: "g/s", working: null };
    answers.mean02c = { value: (slip === "inverted" ? 1 / mc : mc).toPrecision(2), unit: "g/s", working: null };
  } else if (practicalKey === "peroxide") {
    const times = Array.from({ length: 10 }, (_, i) => i * 20);
    const vmax = 55 + rand() * 15;
    const k = 0.015 + rand() * 0.01;
    const slow = 0.04 + rand() * 0.02;
    const vc = times.map((t) => Math.max(0, Math.round(vmax * (1 - Math.exp(-k * t)) + (t ? gaussian(rand) * 0.8 : 0))));
    const vn = times.map((t) => Math.max(0, Math.round(slow * t + (t ? gaussian(rand) * 0.5 : 0))));
    tables = { o2: { rows: times.map((t, i) => ({ t: String(t), vn: String(vn[i]), vc: String(vc[i]) })), decisions: {} } };
    answers.initcat = { value: (vmax * k * (1 + gaussian(rand) * 0.08)).toPrecision(2), unit: "cm³/s", working: null };
    answers.gradnone = { value: (slip === "inverted" ? 1 / slow : slow * (1 + gaussian(rand) * 0.05)).toPrecision(2), unit: "cm³/s", working: null };
  } else if (practicalKey === "thiosulfate") {
    const temps = [20, 30, 40, 50, 60];
    const runs = clockTimes(rand, temps);
    if (index % 4 === 1) runs[2]![1] = round(runs[2]![1]! * 1.35, 1); // an anomalous repeat
    const rows = temps.map((c, i) => {
      const [a, b, d] = runs[i]!;
      const kept = index % 4 === 1 && i === 2 ? [a!, d!] : [a!, b!, d!];
      const m = kept.reduce((s, x) => s + x, 0) / kept.length;
      return { T: c.toFixed(1), t1: String(a), t2: String(b), t3: String(d), tm: m.toFixed(1), inv: (1 / m).toFixed(4), invT: (1 / (c + 273.15)).toFixed(6), ln: Math.log(1 / m).toFixed(2) };
    });
    tables = { times: { rows, decisions: index % 4 === 1 ? { "2:t2": { include: false, reason: "I started the stopwatch late on this run." } } : {} } };
    const means = rows.map((r) => Number(r.tm));
    const xs = temps.map((c) => 1 / (c + 273.15));
    const ys = means.map((m) => Math.log(1 / m));
    const xbar = xs.reduce((s, x) => s + x, 0) / xs.length;
    const ybar = ys.reduce((s, y) => s + y, 0) / ys.length;
    const slope = xs.reduce((s, x, i) => s + (x - xbar) * (ys[i]! - ybar), 0) / xs.reduce((s, x) => s + (x - xbar) ** 2, 0);
    let ea = (-slope * 8.314) / 1000;
    if (slip === "minutes") ea = ea / 1000; // gave J/mol figure as kJ
    if (slip === "inverted") ea = -ea;
    answers.ea = { value: ea.toPrecision(slip === "sigfigs" ? 6 : 3), unit: "kJ/mol", working: null };
  }

  const content: WriteUpContent = {
    ...base,
    sections: {
      plan: para("I will keep the volume and concentration of the acid the same and change only the variable in the aim."),
      observations: para(practicalKey === "thiosulfate" ? "The mixture turned cloudy and pale yellow; it went cloudy faster in the hotter water." : "Bubbles formed on the ribbon straight away and the flask got slightly warm."),
      conclusion: scenario === "draft" && index % 2 === 0 ? { type: "doc", content: [] } : para("The reaction was fastest at the start and slowed down as the reactants were used up."),
      evaluation: scenario === "draft" ? { type: "doc", content: [] } : para("The syringe sometimes stuck, so some readings may be low. I would repeat each run three times."),
    },
    tables,
    graphs,
    answers,
  };

  const checkResults: StoredCheckResults = {};
  const attempts: { checkId: string; kind: string; verdict: string; slipCode: string | null }[] = [];
  const now = Date.now();
  for (const spec of practical.checks) {
    const table = practical.tables.find((t) => t.id === spec.tableId);
    const filled = content.tables[spec.tableId];
    const answer = content.answers[spec.id];
    const perRow = spec.kind === "reciprocal-time" || spec.kind === "mean-of-repeats";
    if (!table || !filled || (!answer && !perRow)) continue;
    const a = { value: answer?.value ?? "", unit: answer?.unit ?? "", tangent: answer?.tangent ?? null };
    const outcome = runPracticalCheck(spec, table, rowsForCheck(filled), a, { keptIn: keptInReadings(filled) });
    checkResults[spec.id] = { outcome, dataHash: checkDataFingerprint(spec, content.tables), answerHash: answerFingerprint(answer), at: now };
    attempts.push({ checkId: spec.id, kind: spec.kind, verdict: outcome.verdict, slipCode: outcome.likelySlip?.code ?? null });
  }
  return { content, checkResults, attempts };
}
