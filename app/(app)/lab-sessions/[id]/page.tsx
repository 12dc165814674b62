import type { Metadata } from "next";
import Link from "next/link";
import { forbidden, notFound } from "next/navigation";
import { toLocalParts } from "@/components/lab-sessions/local-date-time";
import { ManageLabSession } from "@/components/lab-sessions/manage-lab-session";
import { formatWhen, lateUntil, relativeTo, StateBadge } from "@/components/lab-sessions/session-parts";
import { defaultGroupCount, prepListHref } from "@/components/prep/prep-href";
import { Alert } from "@/components/ui/alert";
import { buttonClasses } from "@/components/ui/button";
import { Card, CardTitle } from "@/components/ui/card";
import { PageHeader } from "@/components/ui/page-header";
import { getClassDetail } from "@/db/queries/classes";
import { getLabSession } from "@/db/queries/lab-sessions";
import { requirePageUser } from "@/lib/auth/guards";
import type { Actor } from "@/lib/auth/actor";
import { AppError } from "@/lib/errors";

export const metadata: Metadata = { title: "Lab session" };

type Session = ReturnType<typeof getLabSession>;

function lateRule(s: Session): string {
  if (s.lateWork === "refuse") return "Late work is not accepted: write-ups close at the due date.";
  const until = lateUntil(s);
  const when = until ? formatWhen(until) : "";
  return s.lateWork === "accept"
    ? `Late work is accepted for ${s.lateDays} day${s.lateDays === 1 ? "" : "s"} after the due date (until ${when}).`
    : `Late work is accepted for ${s.lateDays} day${s.lateDays === 1 ? "" : "s"} after the due date (until ${when}), and marked as late.`;
}

export default async function LabSessionPage({ params, searchParams }: PageProps<"/lab-sessions/[id]">) {
  const { id } = await params;
  const sp = await searchParams;
  const actor = await requirePageUser(`/lab-sessions/${id}`);
  const now = new Date();
  let s: Session;
  try {
    s = getLabSession({ actor, labSessionId: id, now });
  } catch (e) {
    if (e instanceof AppError && e.code === "forbidden") forbidden();
    if (e instanceof AppError && e.code === "not_found") notFound();
    throw e;
  }
  return s.canManage ? <StaffView s={s} actor={actor} justScheduled={sp.scheduled === "1"} now={now} /> : <StudentView s={s} now={now} actorId={actor.userId} />;
}

function Dates({ s, now }: { s: Session; now: Date }) {
  return (
    <dl className="grid gap-3 sm:grid-cols-2">
      <div>
        <dt className="text-sm text-muted">Opens</dt>
        <dd className="font-semibold">
          {formatWhen(s.opensAt)} <span className="font-normal text-muted">({relativeTo(s.opensAt, now)})</span>
        </dd>
      </div>
      <div>
        <dt className="text-sm text-muted">Due</dt>
        <dd className="font-semibold">
          {formatWhen(s.dueAt)} <span className="font-normal text-muted">({relativeTo(s.dueAt, now)})</span>
        </dd>
      </div>
      <div className="sm:col-span-2">
        <dt className="text-sm text-muted">Late work</dt>
        <dd>{lateRule(s)}</dd>
      </div>
    </dl>
  );
}

function StaffView({ s, actor, justScheduled, now }: { s: Session; actor: Actor; justScheduled: boolean; now: Date }) {
  const cls = getClassDetail({ actor, classId: s.classId });
  const students = cls.students ?? [];
  const names = new Map(students.map((st) => [st.id, st.name]));
  const groupCount = s.grouping === "groups" && s.groups.length ? s.groups.length : defaultGroupCount(students.length);
  const prepHref = prepListHref({ practicalId: s.practicalId, versionId: s.practicalVersionId, classId: s.classId, groups: groupCount, date: toLocalParts(s.opensAt).date });
  const cancelled = s.state === "cancelled";
  return (
    <div className="flex flex-col gap-6">
      <PageHeader
        eyebrow={
          <Link href={`/classes/${s.classId}`} className="text-accent">
            {s.className}
          </Link>
        }
        title={s.title}
        lead={
          <span className="flex flex-wrap items-center gap-2">
            <StateBadge state={s.state} />
            <span>
              Version {s.version} · {s.topic}
            </span>
          </span>
        }
      />
      {justScheduled && !cancelled ? (
        <Alert tone="good" title="Lab session scheduled">
          Students in {s.className} can see it now{s.state === "upcoming" ? ", and can start their write-ups when it opens" : ""}.
        </Alert>
      ) : null}
      {cancelled ? (
        <Alert tone="warn" title="Cancelled">
          This lab session was cancelled{s.cancelledAt ? ` on ${formatWhen(s.cancelledAt)}` : ""}. Students no longer see it; it is kept for the record.
        </Alert>
      ) : null}
      <ManageLabSession
        cancelled={cancelled}
        className={s.className}
        practicalTitle={`${s.title} (version ${s.version})`}
        session={{
          id: s.id,
          classId: s.classId,
          practicalVersionId: s.practicalVersionId,
          opensAt: s.opensAt.toISOString(),
          dueAt: s.dueAt.toISOString(),
          grouping: s.grouping,
          groups: s.groups,
          lateWork: s.lateWork,
          lateDays: s.lateDays,
          notes: s.notes,
        }}
      />
      <div className="grid gap-4 lg:grid-cols-[2fr_1fr]">
        <div className="flex flex-col gap-4">
          <Card>
            <CardTitle>Dates</CardTitle>
            <Dates s={s} now={now} />
          </Card>
          <Card>
            <CardTitle>{s.grouping === "groups" ? `Groups sharing data (${s.groups.length})` : "How students record data"}</CardTitle>
            {s.grouping === "individual" ? (
              <p>Each student records their own data ({students.length} student{students.length === 1 ? "" : "s"} in the class).</p>
            ) : (
              <GroupsTable groups={s.groups} names={names} rosterIds={students.map((st) => st.id)} />
            )}
          </Card>
          <Card>
            <CardTitle>Notes for students</CardTitle>
            {s.notes.trim() ? <p className="whitespace-pre-line">{s.notes}</p> : <p className="text-muted">No notes.</p>}
          </Card>
        </div>
        <div className="flex flex-col gap-4">
          <Card>
            <CardTitle>For this lab session</CardTitle>
            <ul className="flex flex-col gap-2">
              <li>
                <Link href={`/practicals/${s.practicalId}`}>Read the practical</Link>
                <span className="block text-sm text-muted">Version {s.version}, as students see it.</span>
              </li>
              <li>
                <Link href={prepHref}>Prep list for this lab session</Link>
                <span className="block text-sm text-muted">
                  For {groupCount} group{groupCount === 1 ? "" : "s"}, needed by {formatWhen(s.opensAt)}.
                </span>
              </li>
              <li>
                <Link href={`/classes/${s.classId}`}>{s.className}</Link>
                <span className="block text-sm text-muted">The class and its other lab sessions.</span>
              </li>
            </ul>
            {s.createdByName ? <p className="mt-3 text-sm text-muted">Scheduled by {s.createdByName}.</p> : null}
          </Card>
        </div>
      </div>
    </div>
  );
}

function GroupsTable({ groups, names, rosterIds }: { groups: Session["groups"]; names: Map<string, string>; rosterIds: string[] }) {
  const placed = new Set(groups.flatMap((g) => g.studentIds));
  const unplaced = rosterIds.filter((id) => !placed.has(id));
  return (
    <div className="flex flex-col gap-3">
      <ul className="grid gap-2 sm:grid-cols-2">
        {groups.map((g) => (
          <li key={g.id} className="rounded-md border border-line p-3">
            <p className="font-semibold">
              {g.name} <span className="font-normal text-muted">({g.studentIds.length})</span>
            </p>
            <p className="text-[0.97rem]">{g.studentIds.map((id) => names.get(id) ?? "A student who has left the class").join(", ")}</p>
          </li>
        ))}
      </ul>
      {unplaced.length ? (
        <p className="text-[0.97rem]">
          <span className="font-semibold">Not in a group: </span>
          {unplaced.map((id) => names.get(id)).join(", ")}
        </p>
      ) : null}
    </div>
  );
}

function StudentView({ s, now, actorId }: { s: Session; now: Date; actorId: string }) {
  const group = s.groups.find((g) => g.studentIds.includes(actorId));
  const open = s.state === "open" || s.state === "late";
  return (
    <div className="flex max-w-3xl flex-col gap-6">
      <PageHeader eyebrow={s.className} title={s.title} lead={<StateBadge state={s.state} />} />
      {open ? (
        <Card className="border-brand/50">
          <CardTitle>Your write-up</CardTitle>
          <p className="mb-3">{s.state === "late" ? "The due date has passed, but late work is still accepted." : `Hand it in by ${formatWhen(s.dueAt)}.`}</p>
          <Link href={`/lab-sessions/${s.id}/write-up`} className={buttonClasses("primary")}>
            Start your write-up
          </Link>
        </Card>
      ) : s.state === "upcoming" ? (
        <Alert tone="info" title="Not open yet">
          Your write-up opens here when the lab session opens, on {formatWhen(s.opensAt)}.
        </Alert>
      ) : (
        <Alert tone="info" title="This lab session has closed">
          Write-ups can no longer be handed in.
        </Alert>
      )}
      <Card>
        <CardTitle>Dates</CardTitle>
        <Dates s={s} now={now} />
      </Card>
      <Card>
        <CardTitle>How you record data</CardTitle>
        {s.grouping === "individual" ? (
          <p>You record your own data.</p>
        ) : group ? (
          <p>
            You are in <strong>{group.name}</strong>, with {group.studentIds.length - 1} other student{group.studentIds.length - 1 === 1 ? "" : "s"}. Your group shares one set of results.
          </p>
        ) : (
          <p>Your teacher has not put you in a group yet. Ask them which group to join.</p>
        )}
      </Card>
      {s.notes.trim() ? (
        <Card>
          <CardTitle>Notes from your teacher</CardTitle>
          <p className="whitespace-pre-line">{s.notes}</p>
        </Card>
      ) : null}
    </div>
  );
}
