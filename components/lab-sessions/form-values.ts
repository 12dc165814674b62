import { labSessionSchema, type LabSessionInput } from "@/lib/validation/practicals";
import { groupProblems, type LabGroupDraft } from "./groups";
import { fromLocalParts, toLocalParts, type LocalPartsResult } from "./local-date-time";

export const LATE_WORK_OPTIONS = [
  { value: "accept", label: "Accept late work", description: "Write-ups handed in after the due date are accepted as normal." },
  { value: "accept-flagged", label: "Accept late work, but mark it as late", description: "You see which write-ups came in after the due date." },
  { value: "refuse", label: "Do not accept late work", description: "The write-up closes at the due date." },
] as const;

export type LateWork = (typeof LATE_WORK_OPTIONS)[number]["value"];

/** What the schedule form holds while someone types: dates and times as the inputs give them. */
export type LabSessionFormValues = {
  classId: string;
  practicalVersionId: string;
  opensDate: string;
  opensTime: string;
  dueDate: string;
  dueTime: string;
  grouping: "individual" | "groups";
  groups: LabGroupDraft[];
  lateWork: LateWork;
  lateDays: string;
  notes: string;
};

/** Form values for an existing lab session (dates shown in the browser's local time). */
export function valuesFromSession(s: Omit<LabSessionInput, "opensAt" | "dueAt"> & { opensAt: Date | string; dueAt: Date | string }): LabSessionFormValues {
  const opens = toLocalParts(new Date(s.opensAt));
  const due = toLocalParts(new Date(s.dueAt));
  return {
    classId: s.classId,
    practicalVersionId: s.practicalVersionId,
    opensDate: opens.date,
    opensTime: opens.time,
    dueDate: due.date,
    dueTime: due.time,
    grouping: s.grouping,
    groups: s.groups.map((g) => ({ id: g.id, name: g.name, studentIds: [...g.studentIds] })),
    lateWork: s.lateWork,
    lateDays: String(s.lateDays),
    notes: s.notes,
  };
}

const DATE_PROBLEMS: Record<Exclude<LocalPartsResult, { ok: true }>["problem"], (what: string) => [field: "date" | "time", message: string]> = {
  "missing-date": (what) => ["date", `Choose the date ${what}.`],
  "missing-time": (what) => ["time", `Choose the time ${what}.`],
  "bad-date": () => ["date", "That is not a real date. Use the date picker, or type it as day, month and year."],
  "bad-time": () => ["time", "That is not a real time. Use the 24-hour clock, for example 13:30."],
};

/** Where a field message from the server belongs in the form (`opensAt` → the opening date, …). */
export function formFieldFor(key: string): string | null {
  if (key === "opensAt") return "opensDate";
  if (key === "dueAt") return "dueDate";
  if (["classId", "practicalVersionId", "grouping", "groups", "lateWork", "lateDays", "notes"].includes(key)) return key;
  if (/^groups\.\d+\.(studentIds|name)$/.test(key)) return key;
  if (/^groups\.\d+(\..*)?$/.test(key)) return `groups.${key.split(".")[1]}.studentIds`;
  return null;
}

export type ToInputResult = { ok: true; input: LabSessionInput } | { ok: false; errors: Record<string, string> };

/**
 * Checks the form with the same schema the server uses, plus group sizes of 2 to 4, and turns it
 * into the request body. Every message is keyed by the form field it belongs to (`form` for the
 * rare one that belongs to no field).
 */
export function formValuesToInput(v: LabSessionFormValues): ToInputResult {
  const errors: Record<string, string> = {};
  const add = (key: string, message: string) => {
    if (!errors[key]) errors[key] = message;
  };
  const opens = fromLocalParts(v.opensDate, v.opensTime);
  const due = fromLocalParts(v.dueDate, v.dueTime);
  if (!opens.ok) {
    const [part, message] = DATE_PROBLEMS[opens.problem]("the lab session opens");
    add(part === "date" ? "opensDate" : "opensTime", message);
  }
  if (!due.ok) {
    const [part, message] = DATE_PROBLEMS[due.problem]("write-ups are due");
    add(part === "date" ? "dueDate" : "dueTime", message);
  }
  const lateDaysText = v.lateDays.trim();
  const lateDays = lateDaysText === "" ? (v.lateWork === "refuse" ? 0 : NaN) : Number(lateDaysText);
  if (v.lateWork !== "refuse" && !(Number.isInteger(lateDays) && lateDays >= 0 && lateDays <= 60)) add("lateDays", "Enter a whole number of days from 0 to 60.");
  if (v.grouping === "groups") for (const [key, message] of Object.entries(groupProblems(v.groups, []).errors)) add(key, message);

  const candidate = {
    classId: v.classId,
    practicalVersionId: v.practicalVersionId,
    opensAt: opens.ok ? opens.date : undefined,
    dueAt: due.ok ? due.date : undefined,
    grouping: v.grouping,
    groups: v.grouping === "groups" ? v.groups.map((g) => ({ id: g.id, name: g.name.trim(), studentIds: g.studentIds })) : [],
    lateWork: v.lateWork,
    lateDays: v.lateWork === "refuse" ? 0 : Number.isInteger(lateDays) ? lateDays : 0,
    notes: v.notes,
  };
  const parsed = labSessionSchema.safeParse(candidate);
  if (!parsed.success) {
    for (const issue of parsed.error.issues) {
      const key = issue.path.join(".");
      // Missing dates were already explained at the date or time input.
      if ((key === "opensAt" && !opens.ok) || (key === "dueAt" && !due.ok)) continue;
      if (key === "dueAt" && (errors.dueDate || errors.dueTime)) continue;
      add(formFieldFor(key) ?? "form", issue.message);
    }
  }
  if (Object.keys(errors).length || !parsed.success) return { ok: false, errors };
  return { ok: true, input: parsed.data };
}
