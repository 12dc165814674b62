import type { Metadata } from "next";
import Link from "next/link";
import { Badge } from "@/components/ui/badge";
import { buttonClasses } from "@/components/ui/button";
import { EmptyState } from "@/components/ui/empty-state";
import { PageHeader } from "@/components/ui/page-header";
import { Table, Td, Th } from "@/components/ui/table";
import { listRubrics } from "@/db/queries/rubrics";
import { hasRole } from "@/lib/auth/actor";
import { requirePageRole } from "@/lib/auth/guards";
import { formatDate } from "@/lib/utils";

export const metadata: Metadata = { title: "Rubrics" };

export default async function RubricsPage({ searchParams }: PageProps<"/rubrics">) {
  const actor = await requirePageRole(["teacher", "admin", "moderator"], "/rubrics");
  const sp = await searchParams;
  const showArchived = sp.archived === "show";
  const canEdit = hasRole(actor, "teacher", "admin");
  const all = listRubrics({ actor, includeArchived: true });
  const archivedCount = all.filter((r) => r.archived).length;
  const rubrics = showArchived ? all : all.filter((r) => !r.archived);
  return (
    <div className="flex flex-col gap-6">
      <PageHeader
        title="Rubrics"
        lead={canEdit ? "The department's marking rubrics. A practical takes a copy of a rubric, so changing one here does not change practicals that already use it." : "The department's marking rubrics, to read."}
        actions={
          canEdit ? (
            <Link href="/rubrics/new" className={buttonClasses("primary")}>
              New rubric
            </Link>
          ) : null
        }
      />
      {archivedCount ? (
        <p>
          {showArchived ? (
            <Link href="/rubrics">Hide archived rubrics</Link>
          ) : (
            <Link href="/rubrics?archived=show">
              Show {archivedCount} archived rubric{archivedCount === 1 ? "" : "s"}
            </Link>
          )}
        </p>
      ) : null}
      {rubrics.length === 0 ? (
        <EmptyState title="No rubrics yet.">{canEdit ? <Link href="/rubrics/new">Write the first one</Link> : "Teachers add rubrics here."}</EmptyState>
      ) : (
        <Table>
          <caption className="sr-only">Rubrics in the library</caption>
          <thead>
            <tr>
              <Th>Rubric</Th>
              <Th>Style</Th>
              <Th>Criteria</Th>
              <Th>Most marks</Th>
              <Th>Last changed</Th>
            </tr>
          </thead>
          <tbody>
            {rubrics.map((r) => {
              const most = r.body.style === "marks" ? r.body.criteria.reduce((s, c) => s + (c.levels[c.levels.length - 1]?.marks ?? 0), 0) : null;
              return (
                <tr key={r.id}>
                  <Td>
                    <Link href={`/rubrics/${r.id}`} className="font-semibold">
                      {r.title}
                    </Link>
                    {r.archived ? (
                      <Badge tone="warn" className="ml-2">
                        Archived
                      </Badge>
                    ) : null}
                  </Td>
                  <Td>{r.body.style === "competence" ? "Shown / not yet" : "Marks"}</Td>
                  <Td>{r.body.criteria.length}</Td>
                  <Td>{most ?? "—"}</Td>
                  <Td className="whitespace-nowrap">
                    {formatDate(r.updatedAt)}
                    {r.authorName ? <span className="block text-sm text-muted">by {r.authorName}</span> : null}
                  </Td>
                </tr>
              );
            })}
          </tbody>
        </Table>
      )}
    </div>
  );
}
