import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { EditDraftButton } from "@/components/practicals/library/practical-actions";
import { PracticalView } from "@/components/practicals/practical-view";
import { Badge } from "@/components/ui/badge";
import { PageHeader } from "@/components/ui/page-header";
import { canAuthor, getPracticalVersion } from "@/db/queries/practicals";
import { requirePageRole } from "@/lib/auth/guards";
import { formatDateTime } from "@/lib/utils";
import { orPageError } from "../../load";

export const metadata: Metadata = { title: "Practical version" };

export default async function PracticalVersionPage({ params }: PageProps<"/practicals/[id]/versions/[versionId]">) {
  const { id, versionId } = await params;
  const actor = await requirePageRole(["teacher", "admin", "moderator"], `/practicals/${id}/versions/${versionId}`);
  const v = orPageError(() => getPracticalVersion({ actor, versionId }));
  if (v.practicalId !== id) notFound();
  const author = canAuthor(actor);
  return (
    <div className="flex flex-col gap-6">
      <p>
        <Link href={`/practicals/${id}`}>← Back to the practical</Link>
      </p>
      <PageHeader
        eyebrow={`${v.topic} · Year ${v.yearGroup} · ${v.subject}`}
        title={v.title}
        lead={v.status === "published" ? `Version ${v.version}, published ${formatDateTime(v.publishedAt)}. Published versions never change.` : `Draft version ${v.version}, last saved ${formatDateTime(v.updatedAt)}.`}
        actions={
          author ? (
            v.status === "draft" ? (
              <Link href={`/practicals/${id}/versions/${v.id}/edit`} className="font-semibold">
                Open the editor
              </Link>
            ) : (
              <EditDraftButton practicalId={id} label="Start a new draft from the newest version" />
            )
          ) : null
        }
      />
      <Badge tone={v.status === "published" ? "good" : "warn"} className="self-start">
        {v.status === "published" ? `Published v${v.version}` : `Draft v${v.version}`}
      </Badge>
      <PracticalView meta={v} content={v.content} />
    </div>
  );
}
