import type { CheckStateJson } from "@/components/write-up/types";
import type { Verdict } from "@/lib/checks/types";
import type { PracticalContent } from "@/lib/validation/practicals";
import type { GroupTables, WriteUpContent } from "@/lib/validation/write-ups";

/*
 * The shapes the marking and moderation route handlers send (dates as ISO text). Pages that
 * load the same data on the server pass it through JSON and assign it to these types, so the
 * compiler says so if the data layer and these components drift apart.
 */

/** Where a student's work stands, in the bench's own words (see status.ts). */
export type BenchStatus = "not-started" | "draft" | "submitted" | "late" | "marked" | "returned";

export type Rubric = NonNullable<PracticalContent["rubric"]>;
export type RubricCriterion = Rubric["criteria"][number];

/** GET /api/lab-sessions/[id]/bench */
export type BenchJson = {
  labSession: { id: string; title: string; className: string; dueAt: string };
  canMark: boolean;
  rubric: { title: string; style: "marks" | "competence"; criteria: { id: string; title: string; max: number; levels: { id: string; label: string; marks: number }[] }[] } | null;
  maxTotal: number;
  checks: { id: string; label: string }[];
  rows: BenchRow[];
};

export type BenchRow = {
  studentId: string;
  studentName: string;
  writeUpId: string | null;
  status: BenchStatus;
  late: boolean;
  submittedAt: string | null;
  checks: Record<string, Verdict>;
  marks: Record<string, number>;
  total: number | null;
  adjusted: boolean;
};


/** The teacher's marks as a reader of the write-up sees them (hidden from a blind moderator). */
export type ReaderMarkJson = {
  criteria: Record<string, { levelId: string; marks: number; fromChecks?: boolean; overrideReason?: string | null }>;
  comments: Record<string, string>;
  feedback: string;
  total: number;
  teacherTotal: number;
  maxTotal: number;
  returnedAt: string | null;
};

/** The parts of the staff write-up view the marking pages read. */
export type ReaderViewJson = {
  writeUp: {
    id: string;
    status: "draft" | "submitted" | "marked" | "returned";
    content: WriteUpContent;
    safetyAcknowledgedAt: string | null;
    submittedAt: string | null;
    late: boolean;
    studentName: string;
  };
  tables: GroupTables;
  mark: ReaderMarkJson | null;
  group: { id: string; name: string; members: { id: string; name: string }[] } | null;
  checks: Record<string, CheckStateJson>;
  practical: { id: string; title: string; version: number; content: PracticalContent };
  labSession: { id: string; className: string; dueAt: string };
  canReopen: boolean;
};

/** The teacher's saved marks, as GET /api/write-ups/[id]/marking and a 409 send them. */
export type TeacherMarkJson = {
  criteria: Record<string, { levelId: string; marks: number; fromChecks: boolean; overrideReason: string | null }>;
  comments: Record<string, string>;
  feedback: string;
  total: number;
  maxTotal: number;
  adjustedTotal: number | null;
  revision: number;
  markedAt: string | null;
  returnedAt: string | null;
};

/** GET /api/write-ups/[id]/marking */
export type MarkingItemJson = {
  view: ReaderViewJson;
  canMark: boolean;
  rubric: Rubric | null;
  maxTotal: number;
  mark: TeacherMarkJson | null;
  suggestions: Record<string, { levelId: string; reason: string }>;
  previousId: string | null;
  nextId: string | null;
};

/** PUT /api/write-ups/[id]/mark */
export type MarkSaved = { revision: number; total: number; maxTotal: number; complete: boolean; status: "draft" | "submitted" | "marked" | "returned" };

/** What the teacher has chosen for one criterion, before it is saved. */
export type CriterionChoice = { levelId: string; overrideReason: string };

/* ---------- moderation ---------- */

export type SampleRule = { minCount: number; percent: number; includeExtremes: boolean; everyMarker: boolean };

/** GET /api/moderation/samples */
export type SampleSummaryJson = { id: string; scope: string; moderatorName: string; status: "open" | "completed"; items: number; secondMarked: number; createdAt: string };

/** GET /api/moderation/scopes */
export type SampleScopesJson = {
  sessions: { labSessionId: string; practicalId: string; title: string; className: string; dueAt: string; marked: number }[];
  moderators: { id: string; name: string }[];
  rule: SampleRule;
};

/** POST /api/moderation/samples */
export type SampleDrawn = { sampleId: string; seed: number; ids: string[]; cohortSize: number };

export type SampleItemJson = {
  writeUpId: string;
  studentName: string;
  className: string;
  markerName: string | null;
  origin: "drawn" | "added" | "swapped-in";
  note: string;
  removed: boolean;
  removedReason: string | null;
  moderation: { total: number; completed: boolean } | null;
  teacherTotal: number | null;
  difference: number | null;
};

export type CriterionAgreementJson = { id: string; count: number; exactShare: number; withinOneLevelShare: number; meanLevelDifference: number; kappa: number | null };

export type AgreementJson = {
  count: number;
  criteria: CriterionAgreementJson[];
  totals: { meanDifference: number; meanAbsoluteDifference: number; largestDifference: number; withinToleranceShare: number };
  verdict: "confirmed" | "review-needed";
  reasons: string[];
};

export type SuggestionJson = {
  slope: number;
  intercept: number;
  rSquared: number | null;
  points: { teacher: number; moderator: number }[];
  changes: { id: string; before: number; after: number; studentName: string }[];
};

/** GET /api/moderation/samples/[id] */
export type SampleJson = {
  id: string;
  scope: string;
  labSessionId: string | null;
  practicalId: string | null;
  rule: SampleRule;
  seed: number;
  blind: boolean;
  toleranceMarks: number;
  status: "open" | "completed";
  isModerator: boolean;
  cohortSize: number;
  maxTotal: number;
  rubric: { criteria: { id: string; title: string; levels: { id: string; label: string; marks: number; descriptor: string }[] }[] } | null;
  items: SampleItemJson[];
  agreement: AgreementJson | null;
  suggestion: SuggestionJson | null;
  adjustments: { id: string; status: "proposed" | "accepted" | "rejected"; slope: number; intercept: number; reason: string | null; decidedAt: string | null; changes: number }[];
  candidates: { writeUpId: string; studentName: string; className: string }[];
};

/** GET /api/moderation/samples/[id]/items/[writeUpId] */
export type ModerationItemJson = {
  sample: { id: string; blind: boolean; scope: string };
  view: ReaderViewJson;
  rubric: Rubric | null;
  moderationMark: { criteria: Record<string, { levelId: string; marks: number }>; total: number; comment: string; revision: number; completedAt: string | null } | null;
  canMark: boolean;
  teacherMarksHidden: boolean;
};

/** PUT /api/moderation/samples/[id]/items/[writeUpId] */
export type ModerationMarkSaved = { revision: number; total: number; completed: boolean };
