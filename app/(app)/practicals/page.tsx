import type { Metadata } from "next";
import Link from "next/link";
import { LibraryFilters } from "@/components/practicals/library/library-filters";
import { NewPracticalForm } from "@/components/practicals/library/new-practical-form";
import { PracticalManageActions } from "@/components/practicals/library/practical-actions";
import { practicalStatusParts, sessionsLabel } from "@/components/practicals/status";
import { Badge } from "@/components/ui/badge";
import { EmptyState } from "@/components/ui/empty-state";
import { PageHeader } from "@/components/ui/page-header";
import { canAuthor, listPracticals, listTopics } from "@/db/queries/practicals";
import { requirePageRole } from "@/lib/auth/guards";
import { formatDate } from "@/lib/utils";

export const metadata: Metadata = { title: "Practicals" };

function one(v: string | string[] | undefined): string {
  return (Array.isArray(v) ? v[0] : v)?.slice(0, 100) ?? "";
}

export default async function PracticalsPage({ searchParams }: PageProps<"/practicals">) {
  const actor = await requirePageRole(["teacher", "admin", "moderator"], "/practicals");
  const sp = await searchParams;
  const search = one(sp.search);
  const topic = one(sp.topic);
  const yearText = one(sp.yearGroup);
  const year = /^(7|8|9|10|11|12|13)$/.test(yearText) ? Number(yearText) : undefined;
  const archived = one(sp.archived) === "true";
  const practicals = listPracticals({ actor, search, topic: topic || undefined, yearGroup: year, archived });
  const topics = listTopics({ actor });
  const author = canAuthor(actor);
  const filtered = Boolean(search || topic || year);

  return (
    <div className="flex flex-col gap-6">
      <PageHeader
        title="Practicals"
        lead={
          author
            ? "The department's practicals: write a new one, or reuse and adapt one a colleague has written."
            : "The department's practicals, to read. Only teachers and admins can change them."
        }
        actions={author ? <NewPracticalForm topics={topics} /> : null}
      />
      <LibraryFilters initial={{ search, topic, yearGroup: year ? String(year) : "", archived }} topics={topics} />
      <section aria-labelledby="library-heading" className="flex flex-col gap-3">
        <h2 id="library-heading" className="text-xl font-bold">
          {archived ? "Archived practicals" : "In the library"} <span className="font-normal text-muted">({practicals.length})</span>
        </h2>
        {practicals.length === 0 ? (
          <EmptyState title={filtered ? "No practicals match these filters." : archived ? "Nothing is archived." : "The library is empty."}>
            {filtered ? "Try a shorter search, or clear the topic and year group." : author && !archived ? "Press “New practical” to write the department's first one." : null}
          </EmptyState>
        ) : (
          <ul className="grid gap-3 md:grid-cols-2">
            {practicals.map((p) => (
              <li key={p.id} className="flex flex-col gap-2 rounded-lg border border-line bg-surface p-4">
                <div className="flex flex-col gap-1">
                  <h3 className="text-lg font-bold leading-snug">
                    <Link href={`/practicals/${p.id}`} className="text-ink hover:text-brand">
                      {p.title}
                    </Link>
                  </h3>
                  <p className="text-muted">
                    {p.topic} · Year {p.yearGroup} · {p.subject}
                  </p>
                </div>
                <div className="flex flex-wrap gap-1.5">
                  {practicalStatusParts(p).map((s) => (
                    <Badge key={s.label} tone={s.tone}>
                      {s.label}
                    </Badge>
                  ))}
                  {p.archived ? <Badge tone="warn">Archived</Badge> : null}
                </div>
                <p className="text-sm text-muted">
                  {sessionsLabel(p.sessions)} · updated {formatDate(p.updatedAt)}
                  {p.authorName ? ` · written by ${p.authorName}` : ""}
                </p>
                {author ? (
                  <div className="mt-auto border-t border-line pt-3">
                    <PracticalManageActions practicalId={p.id} title={p.title} archived={p.archived} openAfterDuplicate />
                  </div>
                ) : null}
              </li>
            ))}
          </ul>
        )}
      </section>
    </div>
  );
}
