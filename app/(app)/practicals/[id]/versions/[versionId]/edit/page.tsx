import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { PracticalEditor } from "@/components/practicals/editor/practical-editor";
import { EditDraftButton } from "@/components/practicals/library/practical-actions";
import { PracticalView } from "@/components/practicals/practical-view";
import { Alert } from "@/components/ui/alert";
import { PageHeader } from "@/components/ui/page-header";
import { canAuthor, getPracticalVersion, listTopics } from "@/db/queries/practicals";
import { requirePageRole } from "@/lib/auth/guards";
import { formatDateTime } from "@/lib/utils";
import { orPageError } from "../../../load";

export const metadata: Metadata = { title: "Edit practical" };

export default async function EditPracticalVersionPage({ params }: PageProps<"/practicals/[id]/versions/[versionId]/edit">) {
  const { id, versionId } = await params;
  const actor = await requirePageRole(["teacher", "admin", "moderator"], `/practicals/${id}/versions/${versionId}/edit`);
  const v = orPageError(() => getPracticalVersion({ actor, versionId }));
  if (v.practicalId !== id) notFound();
  const author = canAuthor(actor);
  const back = (
    <p>
      <Link href={`/practicals/${id}`}>← Back to the practical</Link>
    </p>
  );

  if (v.status === "published" || !author) {
    return (
      <div className="flex flex-col gap-6">
        {back}
        <PageHeader
          eyebrow={`${v.topic} · Year ${v.yearGroup} · ${v.subject}`}
          title={v.title}
          lead={v.status === "published" ? `Version ${v.version}, published ${formatDateTime(v.publishedAt)}.` : `Draft version ${v.version}.`}
          actions={v.status === "published" && author ? <EditDraftButton practicalId={id} label="Start a new draft" /> : null}
        />
        <Alert tone="info" title={v.status === "published" ? "Published versions cannot change" : "Read-only"}>
          {v.status === "published"
            ? "Write-ups keep the version they were started on. To make changes, start a new draft: it begins as a copy of the newest version."
            : "Only teachers and admins can change practicals. This is the draft as it stands."}
        </Alert>
        <PracticalView meta={v} content={v.content} />
      </div>
    );
  }

  return (
    <div className="flex flex-col gap-4">
      {back}
      <PageHeader eyebrow={`Draft v${v.version} · ${v.topic} · Year ${v.yearGroup}`} title={v.title || "Untitled practical"} lead="Work through the sections in any order. Changes save by themselves; publish when it is ready for students." />
      <PracticalEditor
        version={{
          id: v.id,
          practicalId: v.practicalId,
          version: v.version,
          title: v.title,
          topic: v.topic,
          subject: v.subject,
          yearGroup: v.yearGroup,
          content: v.content,
          revision: v.revision,
          updatedAt: v.updatedAt ? new Date(v.updatedAt).toISOString() : null,
        }}
        topics={listTopics({ actor })}
      />
    </div>
  );
}
