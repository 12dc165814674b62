import type { SkillStatus } from "@/lib/progress/summary";

/**
 * What the progress pages show, in the shapes the data layer returns (components never import the
 * database layer, so the shapes are written out here; the pages pass the query results straight in).
 */

export type SkillPoint = { date: Date; percent: number; practical: string };

export type SkillView = {
  title: string;
  points: SkillPoint[];
  averagePercent: number;
  latestPercent: number;
  status: SkillStatus;
};

export type ReturnedCriterion = { title: string; marks: number; max: number; level: string };

export type ReturnedPractical = {
  writeUpId: string;
  title: string;
  topic: string;
  returnedAt: Date;
  total: number;
  maxTotal: number;
  feedback: string;
  late: boolean;
  markerName: string | null;
  criteria: ReturnedCriterion[];
};

export type ComingState = "open" | "upcoming" | "late" | "closed" | "cancelled";
export type WriteUpStatus = "not-started" | "draft" | "submitted" | "marked" | "returned";

/** `writeUp` is one of WriteUpStatus; the data layer types it as a plain string. */
export type ComingPractical = { id: string; title: string; className: string; opensAt: Date; dueAt: Date; state: ComingState; writeUp: string };

export type MissedPractical = { id: string; title: string; dueAt: Date };

export type CheckKindView = { kind: string; label: string; checks: number; rightFirstTime: number; share: number };
export type SlipView = { code: string; message: string; count: number };
export type CheckHistoryView = { kinds: CheckKindView[]; slips: SlipView[] };

export type StudentProgressView = {
  student: { id: string; name: string; yearGroup: number | null; classes: { id: string; name: string }[] };
  returned: ReturnedPractical[];
  coming: ComingPractical[];
  missed: MissedPractical[];
  skills: SkillView[];
  checkHistory: CheckHistoryView | null;
};

/** Who is reading: the student themself ("you"), or a parent or member of staff (the student's first name). */
export type Reader = "student" | "family" | "staff";

export type ClassProgressRow = {
  studentId: string;
  name: string;
  handedIn: number;
  due: number;
  notHandedIn: string[];
  averagePercent: number | null;
  struggling: string[];
  commonSlip: string | null;
};

export type ClassProgressView = {
  class: { id: string; name: string };
  sessions: { id: string; title: string; dueAt: Date }[];
  rows: ClassProgressRow[];
};
