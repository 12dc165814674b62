import type { CheckOutcome, StudentCheckView } from "@/lib/checks/types";
import type { PracticalContent } from "@/lib/validation/practicals";
import type { GroupTables, WriteUpContent } from "@/lib/validation/write-ups";

export type WriteUpStatus = "draft" | "submitted" | "marked" | "returned";
export type LabSessionState = "upcoming" | "open" | "late" | "closed" | "cancelled";

/** One check's latest result as the API sends it (the staff view adds the full outcome). */
export type CheckStateJson = StudentCheckView & { stale: boolean; ranAt: number; outcome?: CheckOutcome };

/**
 * A write-up as GET /api/write-ups/[id] and POST /api/lab-sessions/[id]/write-up send it (dates
 * as ISO text). Pages that load it on the server pass it through JSON so the browser sees the
 * same shape; app/(app)/lab-sessions/[id]/write-up/page.tsx checks this type against the data
 * layer's own at compile time.
 */
export type WriteUpViewJson = {
  writeUp: {
    id: string;
    status: WriteUpStatus;
    revision: number;
    content: WriteUpContent;
    safetyAcknowledgedAt: string | null;
    submittedAt: string | null;
    late: boolean;
    updatedAt: string;
    studentName: string;
  };
  tables: GroupTables;
  group: { id: string; name: string; revision: number; members: { id: string; name: string }[] } | null;
  checks: Record<string, CheckStateJson>;
  practical: { id: string; versionId: string; title: string; topic: string; version: number; content: PracticalContent };
  labSession: {
    id: string;
    className: string;
    opensAt: string;
    dueAt: string;
    lateWork: "accept" | "accept-flagged" | "refuse";
    lateDays: number;
    state: LabSessionState;
    notes: string;
  };
  access: "owner" | "staff";
  canEdit: boolean;
  canSubmit: boolean;
  canReopen: boolean;
};

/** What a save answers. */
export type SaveAnswer = { revision: number; updatedAt: string };

/** A row of GET /api/lab-sessions/[id]/write-ups. */
export type SessionWriteUpRowJson = {
  studentId: string;
  studentName: string;
  writeUpId: string | null;
  status: "not-started" | WriteUpStatus;
  late: boolean;
  submittedAt: string | null;
  updatedAt: string | null;
  checks: Record<string, { verdict: CheckOutcome["verdict"]; stale: boolean; slip: string | null }>;
};
