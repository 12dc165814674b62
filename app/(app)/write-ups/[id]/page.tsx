import type { Metadata } from "next";
import Link from "next/link";
import { notFound, redirect } from "next/navigation";
import { Badge, type Tone } from "@/components/ui/badge";
import { Card } from "@/components/ui/card";
import { PageHeader } from "@/components/ui/page-header";
import { ReopenButton } from "@/components/write-up/reopen-button";
import { WriteUpReadOnly } from "@/components/write-up/write-up-read-only";
import { getWriteUp, type WriteUpView } from "@/db/queries/write-ups";
import { requirePageUser } from "@/lib/auth/guards";
import { AppError } from "@/lib/errors";
import { formatWhen, toViewJson } from "../view-json";

export const metadata: Metadata = { title: "Write-up" };

const STATUS: Record<WriteUpView["writeUp"]["status"], { label: string; tone: Tone }> = {
  draft: { label: "Not handed in yet", tone: "neutral" },
  submitted: { label: "Handed in", tone: "good" },
  marked: { label: "Marked", tone: "brand" },
  returned: { label: "Returned to the student", tone: "brand" },
};

/** One student's write-up for the class's teacher (or an admin): read-only, with full check outcomes and "Reopen". */
export default async function StaffWriteUpPage({ params }: PageProps<"/write-ups/[id]">) {
  const { id } = await params;
  const actor = await requirePageUser(`/write-ups/${id}`);
  let view: WriteUpView;
  try {
    view = getWriteUp({ actor, writeUpId: id });
  } catch (e) {
    if (e instanceof AppError && (e.code === "not_found" || e.code === "forbidden")) notFound();
    throw e;
  }
  // A student opening their own write-up by this address goes to where they work on it.
  if (view.access === "owner") redirect(`/lab-sessions/${view.labSession.id}/write-up`);

  const data = toViewJson(view);
  const w = view.writeUp;
  const s = view.labSession;
  const status = STATUS[w.status];
  return (
    <div className="flex flex-col gap-6">
      <p>
        <Link href={`/lab-sessions/${s.id}`}>← {s.className}: lab session</Link>
      </p>
      <PageHeader
        eyebrow={`${s.className} · ${view.practical.title}`}
        title={`${w.studentName}'s write-up`}
        lead={
          <span className="flex flex-wrap items-center gap-2">
            <Badge tone={status.tone}>{status.label}</Badge>
            {w.late ? <Badge tone="warn">Late</Badge> : null}
          </span>
        }
      />
      <Card className="flex flex-col gap-3">
        <dl className="grid gap-x-6 gap-y-1 sm:grid-cols-[max-content_1fr]">
          <dt className="font-semibold">Due</dt>
          <dd>{formatWhen(s.dueAt)}</dd>
          <dt className="font-semibold">Handed in</dt>
          <dd>{w.submittedAt ? `${formatWhen(w.submittedAt)}${w.late ? " (late)" : ""}${w.status === "draft" ? ", then reopened" : ""}` : "Not yet"}</dd>
          <dt className="font-semibold">Last saved</dt>
          <dd>{formatWhen(w.updatedAt)}</dd>
          {view.group ? (
            <>
              <dt className="font-semibold">Group</dt>
              <dd>
                {view.group.name}: {view.group.members.map((m) => m.name).join(", ")}
              </dd>
            </>
          ) : null}
        </dl>
        {view.access === "staff" ? <ReopenButton writeUpId={w.id} studentName={w.studentName} canReopen={view.canReopen} /> : null}
      </Card>
      <WriteUpReadOnly view={data} audience="staff" safetyConfirmedText={w.safetyAcknowledgedAt ? `The student confirmed the safety section on ${formatWhen(w.safetyAcknowledgedAt)}.` : null} />
    </div>
  );
}
