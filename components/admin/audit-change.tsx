import Link from "next/link";
import { ROLE_LABELS, ROLES, type Role } from "@/lib/roles";
import { formatDateTime } from "@/lib/utils";
import type { AuditEntry } from "./api-types";

/** Plain words for the actions the audit trail records; unknown ones are shown as recorded. */
export const ACTION_LABELS: Record<string, string> = {
  "user.create": "Added a person",
  "user.update": "Changed a person's details",
  "user.deactivate": "Deactivated an account",
  "user.reactivate": "Reactivated an account",
  "user.preferences": "Changed e-mail preferences",
  "user.password-change": "Changed their password",
  "invitation.send": "Sent an invitation",
  "invitation.accept": "Set up their account",
  "invitation.resend-by-request": "Asked for a new invitation link",
  "password.reset": "Chose a new password",
  "password.reset-request": "Asked to reset their password",
  "class.create": "Created a class",
  "class.update": "Changed a class",
  "class.archive": "Archived a class",
  "class.enrol": "Added students to a class",
  "class.unenrol": "Took a student out of a class",
  "family.link": "Linked a parent or guardian",
  "family.unlink": "Removed a family link",
  "roster.import": "Imported a class roster",
  "school.seed": "Set up the demo school",
  "user.erase": "Deleted a leaver's data",
  "practical.create": "Wrote a new practical",
  "practical.new-draft": "Started a new version of a practical",
  "practical.publish": "Published a practical",
  "practical.archive": "Archived a practical",
  "practical.restore": "Brought back an archived practical",
  "rubric.create": "Wrote a rubric",
  "rubric.update": "Changed a rubric",
  "rubric.archive": "Archived a rubric",
  "lab-session.schedule": "Scheduled a lab session",
  "lab-session.update": "Changed a lab session",
  "lab-session.cancel": "Cancelled a lab session",
  "write-up.safety-acknowledged": "Read the safety notes",
  "write-up.submit": "Handed in a write-up",
  "write-up.return": "Handed back marked work",
  "write-up.reopen": "Reopened a write-up",
  "mark.save": "Marked a write-up",
  "mark.save-with-override": "Marked a write-up, changing a check's verdict",
  "mark.adjust": "Adjusted marks after moderation",
  "moderation.rule": "Changed the sampling rule",
  "moderation.draw": "Drew a moderation sample",
  "moderation.mark": "Second-marked a write-up",
  "moderation.complete": "Finished a moderation sample",
  "moderation.add": "Added work to a moderation sample",
  "moderation.swap": "Swapped work in a moderation sample",
  "moderation.adjustment-accept": "Accepted a mark adjustment",
  "moderation.adjustment-reject": "Turned down a mark adjustment",
  "evidence.add": "Added a photo",
  "evidence.delete": "Removed a photo",
  "progress.email-reports": "Sent term reports to families",
};

export const ENTITY_LABELS: Record<string, string> = { user: "Person", class: "Class", school: "School", "write-up": "Write-up", "lab-session": "Lab session" };

export function entityLabel(type: string): string {
  return ENTITY_LABELS[type] ?? type.replace(/-/g, " ").replace(/^./, (c) => c.toUpperCase());
}

const FIELD_LABELS: Record<string, string> = {
  name: "Name",
  email: "E-mail",
  roles: "Roles",
  yearGroup: "Year group",
  active: "Account",
  emailNotifications: "E-mail notifications",
  subject: "Subject",
  academicYear: "Academic year",
  archived: "Archived",
  teacherIds: "Teachers",
  studentIds: "Students",
  studentId: "Student",
  parentId: "Parent or guardian",
  relationship: "Relationship",
  expiresAt: "Link works until",
  rows: "Rows in the file",
  created: "New accounts",
  enrolled: "Added to the class",
  people: "People",
  classes: "Classes",
  domain: "E-mail domain",
  writeUps: "Write-ups deleted",
  photos: "Photos deleted",
  classPlaces: "Class places removed",
  familyLinks: "Family links removed",
  emails: "Kept e-mails deleted",
  erased: "Personal details removed",
};

const ISO_DATE = /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}/;

function show(key: string, value: unknown, names: Record<string, string>): string {
  if (value === null || value === undefined || value === "") return "—";
  if (key === "active") return value ? "Active" : "Deactivated";
  if (key === "roles" && Array.isArray(value)) return value.map((r) => ((ROLES as readonly string[]).includes(String(r)) ? ROLE_LABELS[r as Role] : String(r))).join(", ") || "none";
  if (typeof value === "boolean") return value ? "Yes" : "No";
  if (Array.isArray(value)) return value.map((v) => show(key, v, names)).join(", ") || "none";
  if (typeof value === "string") {
    if (names[value]) return names[value]!;
    if (ISO_DATE.test(value)) return formatDateTime(value);
    return value;
  }
  if (typeof value === "number") return String(value);
  return JSON.stringify(value);
}

const asRecord = (v: unknown): Record<string, unknown> | null => (v && typeof v === "object" && !Array.isArray(v) ? (v as Record<string, unknown>) : null);

/** What changed in one audit entry, as "Field: before → after" lines (only the fields that changed). */
export function AuditChange({ entry, names }: { entry: Pick<AuditEntry, "before" | "after">; names: Record<string, string> }) {
  const before = asRecord(entry.before);
  const after = asRecord(entry.after);
  if (!before && !after) return <span className="text-muted">—</span>;
  const keys = [...new Set([...Object.keys(before ?? {}), ...Object.keys(after ?? {})])];
  const lines = keys.flatMap((key) => {
    const label = FIELD_LABELS[key] ?? key;
    const was = before?.[key];
    const now = after?.[key];
    if (before && after) {
      if (JSON.stringify(was) === JSON.stringify(now)) return [];
      return [{ key, label, text: `${show(key, was, names)} → ${show(key, now, names)}` }];
    }
    return [{ key, label, text: show(key, before ? was : now, names) }];
  });
  if (!lines.length) return <span className="text-muted">No change</span>;
  return (
    <ul className="flex flex-col gap-0.5">
      {lines.map((l) => (
        <li key={l.key}>
          <span className="font-semibold">{l.label}:</span> {before && !after ? <span className="line-through decoration-1">{l.text}</span> : l.text}
        </li>
      ))}
    </ul>
  );
}

/** The record an entry is about, linked to its admin page when it still exists. */
export function AuditSubject({ entry, names }: { entry: Pick<AuditEntry, "entityType" | "entityId">; names: Record<string, string> }) {
  const name = names[entry.entityId];
  const href = entry.entityType === "user" ? `/admin/people/${entry.entityId}` : entry.entityType === "class" ? `/admin/classes/${entry.entityId}` : null;
  return (
    <span>
      <span className="block text-sm text-muted">{entityLabel(entry.entityType)}</span>
      {name && href ? <Link href={href}>{name}</Link> : <span>{name ?? (entry.entityType === "school" ? "This school" : "(no longer exists)")}</span>}
    </span>
  );
}

export function actionLabel(action: string): string {
  return ACTION_LABELS[action] ?? action;
}
