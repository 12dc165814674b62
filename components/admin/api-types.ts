import type { Role } from "@/lib/roles";

// JSON shapes the admin route handlers answer with, as the browser receives them (dates are
// ISO strings). Kept beside the components that read them; the route tests pin the shapes.

export type PersonStatus = "active" | "invited" | "not-invited" | "deactivated";

export type PersonRow = {
  id: string;
  name: string;
  email: string;
  roles: Role[];
  yearGroup: number | null;
  status: PersonStatus;
  lastSignInAt: string | null;
};

export type InvitationState =
  | { state: "set-up"; expiresAt: null; sentAt: string | null }
  | { state: "not-invited"; expiresAt: null; sentAt: null }
  | { state: "invited" | "expired"; expiresAt: string; sentAt: string };

export type PersonDetail = {
  id: string;
  name: string;
  email: string;
  roles: Role[];
  active: boolean;
  yearGroup: number | null;
  emailNotifications: boolean;
  lastSignInAt: string | null;
  createdAt: string;
  invitation: InvitationState;
  teaches: { id: string; name: string }[];
  studiesIn: { id: string; name: string }[];
  children: { id: string; name: string; relationship: string }[];
  guardians: { id: string; name: string; email: string; relationship: string }[];
};

export type CreatedPerson = { id: string; invitation: { sent: true; expiresAt: string } | { sent: false; message: string } | null };

export type PickerPerson = { id: string; name: string; email: string; yearGroup: number | null };

export type ClassRow = {
  id: string;
  name: string;
  subject: string;
  yearGroup: number;
  academicYear: string;
  archived: boolean;
  studentCount: number;
  teachers: { id: string; name: string }[];
};

export type ClassDetail = {
  id: string;
  name: string;
  subject: string;
  yearGroup: number;
  academicYear: string;
  archived: boolean;
  teachers: { id: string; name: string }[];
  students: { id: string; name: string; email: string; yearGroup: number | null; active: boolean; guardians: { name: string; relationship: string }[] }[] | null;
  canManage: boolean;
};

export type RosterPreviewRow = {
  line: number;
  name: string;
  email: string;
  yearGroup: number | null;
  parentName: string | null;
  parentEmail: string | null;
  relationship: string | null;
  student: "new" | "existing" | "already-in-class" | null;
  parent: "new" | "existing" | "already-linked" | null;
  errors: string[];
};

export type RosterPreview = {
  rows: RosterPreviewRow[];
  fileErrors: string[];
  ignoredColumns: string[];
  summary: { rows: number; withErrors: number; newStudents: number; existingStudents: number; newParents: number };
};

export type RosterImportResult = {
  imported: { rows: number; enrolled: number; created: { id: string; name: string; email: string; roles: Role[] }[] };
  invitations: { requested: boolean; sent: number; failed: { id: string; name: string; email: string; message: string }[] };
};

export type OutboxRow = {
  id: string;
  to: string;
  subject: string;
  receivedAt: string;
  attachments: { filename: string; contentType: string; size: number }[];
};

export type OutboxMessage = OutboxRow & { from: string; text: string };

export type AuditEntry = {
  id: number;
  action: string;
  entityType: string;
  entityId: string;
  before: unknown;
  after: unknown;
  at: string;
  actorName: string | null;
};

export type AuditPage = { entries: AuditEntry[]; hasMore: boolean; names: Record<string, string>; entityTypes: string[] };
