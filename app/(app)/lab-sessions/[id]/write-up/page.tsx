import type { Metadata } from "next";
import Link from "next/link";
import { notFound, redirect } from "next/navigation";
import { RichTextView } from "@/components/editor/rich-text-view";
import { EvidenceGallery } from "@/components/evidence/evidence-gallery";
import { ReturnedMarks } from "@/components/marking/returned-marks";
import { Alert } from "@/components/ui/alert";
import { Badge } from "@/components/ui/badge";
import { PageHeader } from "@/components/ui/page-header";
import { KeptChangesNotice } from "@/components/write-up/kept-changes-notice";
import { SafetyDetails } from "@/components/write-up/safety-details";
import { WriteUpEditor } from "@/components/write-up/write-up-editor";
import { WriteUpReadOnly } from "@/components/write-up/write-up-read-only";
import { openWriteUp, type WriteUpView } from "@/db/queries/write-ups";
import { hasRole } from "@/lib/auth/actor";
import { requirePageUser } from "@/lib/auth/guards";
import { AppError } from "@/lib/errors";
import type { PracticalContent } from "@/lib/validation/practicals";
import { formatWhen, toViewJson } from "../../../write-ups/view-json";

export const metadata: Metadata = { title: "Your write-up" };

function PracticalIntro({ practicalId, content }: { practicalId: string; content: PracticalContent }) {
  return (
    <div className="flex flex-col gap-2">
      {content.aim.trim() ? (
        <p>
          <strong>Aim: </strong>
          {content.aim}
        </p>
      ) : null}
      <RichTextView doc={content.introduction} headingOffset={2} />
      <h3 className="font-bold">Method</h3>
      <RichTextView doc={content.method} headingOffset={2} empty={<p className="text-muted">Your teacher has not written a method.</p>} />
      <EvidenceGallery target={{ practicalId }} label="Photos from your teacher" heading={<h3 className="font-bold">Photos from your teacher</h3>} empty={null} />
    </div>
  );
}

function lateRule(s: WriteUpView["labSession"], now: Date): string | null {
  if (now.getTime() <= s.dueAt.getTime()) return null;
  if (s.lateWork === "refuse") return "The due date has passed.";
  const until = new Date(s.dueAt.getTime() + s.lateDays * 86_400_000);
  return `The due date has passed. Late work is accepted until ${formatWhen(until)}, and is recorded as late.`;
}

/** The student's own write-up for a lab session: opened (or started) on the server, then edited in the browser. */
export default async function WriteUpPage({ params }: PageProps<"/lab-sessions/[id]/write-up">) {
  const { id } = await params;
  const actor = await requirePageUser(`/lab-sessions/${id}/write-up`);
  // Staff follow students' write-ups from the lab session's page.
  if (!hasRole(actor, "student")) redirect(`/lab-sessions/${id}`);
  const now = new Date();
  let view: WriteUpView;
  try {
    view = openWriteUp({ actor, labSessionId: id, now });
  } catch (e) {
    if (e instanceof AppError && e.code === "not_found") notFound();
    if (e instanceof AppError && e.code === "conflict") {
      return (
        <div className="flex max-w-3xl flex-col gap-4">
          <PageHeader title="Your write-up" />
          <Alert tone="info" title="Your write-up is not open">
            <p>{e.message}</p>
          </Alert>
          <p>
            <Link href={`/lab-sessions/${id}`}>← Back to the lab session</Link>
          </p>
        </div>
      );
    }
    throw e;
  }

  const data = toViewJson(view);
  const w = view.writeUp;
  const s = view.labSession;
  const header = (
    <PageHeader
      eyebrow={
        <Link href={`/lab-sessions/${s.id}`} className="text-accent">
          {s.className} · lab session
        </Link>
      }
      title={view.practical.title}
      lead={
        w.status === "draft" ? (
          `Your write-up. Due ${formatWhen(s.dueAt)}.`
        ) : (
          <span className="flex flex-wrap items-center gap-2">
            <Badge tone="good">Handed in</Badge>
            {w.late ? <Badge tone="warn">Late</Badge> : null}
          </span>
        )
      }
    />
  );

  if (view.canEdit) {
    const rule = lateRule(s, now);
    return (
      <div className="flex flex-col gap-2">
        {header}
        <WriteUpEditor
          initialView={data}
          practicalIntro={<PracticalIntro practicalId={view.practical.id} content={view.practical.content} />}
          safetyDetails={<SafetyDetails safety={view.practical.content.safety} />}
          labels={{ due: `Due ${formatWhen(s.dueAt)}.`, lateRule: rule, lateNow: rule !== null }}
        />
      </div>
    );
  }

  const handedIn = w.submittedAt ? `Handed in at ${formatWhen(w.submittedAt)}${w.late ? " (late)" : ""}.` : null;
  return (
    <div className="flex flex-col gap-6">
      {header}
      {handedIn ? (
        <Alert tone="good" title={handedIn}>
          <p>{w.status === "returned" ? "Your teacher has marked it and returned it to you." : w.status === "marked" ? "Your teacher has marked it." : "It is locked now. If you need to change something, ask your teacher to reopen it."}</p>
        </Alert>
      ) : (
        <Alert tone="warn" title="This lab session has closed">
          <p>This write-up was not handed in, and it can no longer be changed. Talk to your teacher.</p>
        </Alert>
      )}
      {w.status === "returned" && view.mark ? <ReturnedMarks mark={view.mark} practical={view.practical.content} /> : null}
      <KeptChangesNotice
        writeUpId={w.id}
        server={{ revision: data.writeUp.revision, updatedAt: data.writeUp.updatedAt, content: data.writeUp.content, tables: data.tables, groupRevision: data.group?.revision ?? null }}
      />
      <WriteUpReadOnly view={data} audience="student" safetyConfirmedText={w.safetyAcknowledgedAt ? `You confirmed the safety section on ${formatWhen(w.safetyAcknowledgedAt)}.` : null} />
    </div>
  );
}
