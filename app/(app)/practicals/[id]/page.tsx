import type { Metadata } from "next";
import Link from "next/link";
import { EvidenceGallery } from "@/components/evidence/evidence-gallery";
import { EditDraftButton, PracticalManageActions } from "@/components/practicals/library/practical-actions";
import { PracticalView } from "@/components/practicals/practical-view";
import { sessionsLabel } from "@/components/practicals/status";
import { Badge } from "@/components/ui/badge";
import { buttonClasses } from "@/components/ui/button";
import { Card } from "@/components/ui/card";
import { PageHeader } from "@/components/ui/page-header";
import { Table, Td, Th } from "@/components/ui/table";
import { getPracticalDetail, getPracticalVersion } from "@/db/queries/practicals";
import { requirePageRole } from "@/lib/auth/guards";
import { formatDateTime } from "@/lib/utils";
import { orPageError } from "./load";

export const metadata: Metadata = { title: "Practical" };

export default async function PracticalOverviewPage({ params }: PageProps<"/practicals/[id]">) {
  const { id } = await params;
  const actor = await requirePageRole(["teacher", "admin", "moderator"], `/practicals/${id}`);
  const p = orPageError(() => getPracticalDetail({ actor, practicalId: id }));
  const published = p.versions.find((v) => v.status === "published");
  const draft = p.versions.find((v) => v.status === "draft");
  const shown = published ? orPageError(() => getPracticalVersion({ actor, versionId: published.id })) : null;

  return (
    <div className="flex flex-col gap-6">
      <p>
        <Link href="/practicals">← All practicals</Link>
      </p>
      <PageHeader
        eyebrow={`${p.topic} · Year ${p.yearGroup} · ${p.subject}`}
        title={p.title}
        lead={published ? `Version ${published.version} is published; lab sessions use it.` : "Not published yet: it cannot be scheduled for a class until it is."}
        actions={
          <>
            {p.canEdit ? <EditDraftButton practicalId={p.id} label={draft ? `Edit draft v${draft.version}` : "Edit (start a new draft)"} /> : null}
            <Link href={`/practicals/${p.id}/prep`} className={buttonClasses("secondary")}>
              Prep list
            </Link>
          </>
        }
      />
      {p.archived ? <Badge tone="warn">Archived</Badge> : null}
      {p.canEdit ? (
        <Card className="flex flex-col gap-2">
          <h2 className="font-bold">Reuse or tidy away</h2>
          <PracticalManageActions practicalId={p.id} title={p.title} archived={p.archived} />
        </Card>
      ) : null}

      <section aria-labelledby="versions-heading" className="flex flex-col gap-3">
        <h2 id="versions-heading" className="text-xl font-bold">
          Versions
        </h2>
        <p className="text-muted">A published version never changes, so every write-up keeps the practical it was started on. Changes go into a new draft.</p>
        <Table>
          <thead>
            <tr>
              <Th>Version</Th>
              <Th>Status</Th>
              <Th>When</Th>
              <Th>Lab sessions</Th>
              <Th className="relative">
                <span className="sr-only">Open</span>
              </Th>
            </tr>
          </thead>
          <tbody>
            {p.versions.map((v) => (
              <tr key={v.id}>
                <Td className="font-semibold">v{v.version}</Td>
                <Td>{v.status === "published" ? <Badge tone="good">Published</Badge> : <Badge tone="warn">Draft</Badge>}</Td>
                <Td>{v.status === "published" ? `Published ${formatDateTime(v.publishedAt)}` : `Last saved ${formatDateTime(v.updatedAt)}`}</Td>
                <Td>{v.sessions ? sessionsLabel(v.sessions).replace("Used by ", "") : <span className="text-muted">none</span>}</Td>
                <Td>
                  {v.status === "draft" && p.canEdit ? (
                    <Link href={`/practicals/${p.id}/versions/${v.id}/edit`}>Open the editor</Link>
                  ) : (
                    <Link href={`/practicals/${p.id}/versions/${v.id}`}>Read v{v.version}</Link>
                  )}
                </Td>
              </tr>
            ))}
          </tbody>
        </Table>
      </section>

      <section aria-labelledby="photos-heading" className="flex flex-col gap-3">
        <h2 id="photos-heading" className="text-xl font-bold">
          Reference photos
        </h2>
        <EvidenceGallery
          target={{ practicalId: p.id }}
          label="Reference photos"
          empty={<p className="text-muted">{p.canEdit ? "None yet. Add them in the editor, under Method." : "None yet."}</p>}
        />
      </section>

      {shown ? (
        <section aria-labelledby="published-heading" className="flex flex-col gap-3">
          <h2 id="published-heading" className="text-2xl font-bold">
            The practical as published (v{shown.version})
          </h2>
          <PracticalView meta={shown} content={shown.content} />
        </section>
      ) : (
        <Card>
          <h2 className="mb-1 font-bold">Nothing published yet</h2>
          <p className="text-muted">
            {p.canEdit
              ? "Open the draft, fill in each section and press Publish. The editor lists anything that still needs doing."
              : "The author has not published this practical yet."}
          </p>
          {draft ? (
            <p className="mt-2">
              <Link href={`/practicals/${p.id}/versions/${draft.id}`}>Read the draft as it stands</Link>
            </p>
          ) : null}
        </Card>
      )}
    </div>
  );
}
