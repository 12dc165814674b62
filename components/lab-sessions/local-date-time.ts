/**
 * Date and time inputs work in the browser's local time, which is the school's time for the
 * people who schedule lab sessions. These helpers turn a Date into the two input values and back.
 */

const pad = (n: number) => String(n).padStart(2, "0");

/** The values for `<input type="date">` and `<input type="time">` that show this moment locally. */
export function toLocalParts(d: Date): { date: string; time: string } {
  return { date: `${d.getFullYear()}-${pad(d.getMonth() + 1)}-${pad(d.getDate())}`, time: `${pad(d.getHours())}:${pad(d.getMinutes())}` };
}

export type LocalPartsResult = { ok: true; date: Date } | { ok: false; problem: "missing-date" | "missing-time" | "bad-date" | "bad-time" };

/**
 * The moment a date input and a time input name, in local time. Blank or impossible values
 * (31 April, 25:00) are refused rather than rolled over into another day.
 */
export function fromLocalParts(date: string, time: string): LocalPartsResult {
  const d = date.trim();
  const t = time.trim();
  if (!d) return { ok: false, problem: "missing-date" };
  if (!t) return { ok: false, problem: "missing-time" };
  const dm = /^(\d{4})-(\d{2})-(\d{2})$/.exec(d);
  if (!dm) return { ok: false, problem: "bad-date" };
  const tm = /^(\d{2}):(\d{2})(?::\d{2})?$/.exec(t);
  if (!tm) return { ok: false, problem: "bad-time" };
  const [year, month, day] = [Number(dm[1]), Number(dm[2]), Number(dm[3])];
  const [hour, minute] = [Number(tm[1]), Number(tm[2])];
  if (hour > 23 || minute > 59) return { ok: false, problem: "bad-time" };
  const out = new Date(year, month - 1, day, hour, minute, 0, 0);
  if (out.getFullYear() !== year || out.getMonth() !== month - 1 || out.getDate() !== day) return { ok: false, problem: "bad-date" };
  return { ok: true, date: out };
}

/** A local date `days` after the given one, at a set time: used for sensible first suggestions. */
export function suggestParts(from: Date, days: number, hour: number, minute = 0): { date: string; time: string } {
  const d = new Date(from.getFullYear(), from.getMonth(), from.getDate() + days, hour, minute, 0, 0);
  return toLocalParts(d);
}
