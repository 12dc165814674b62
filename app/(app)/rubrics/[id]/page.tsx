import type { Metadata } from "next";
import Link from "next/link";
import { forbidden, notFound } from "next/navigation";
import { RubricEditor } from "@/components/rubrics/rubric-editor";
import { valuesFromBody } from "@/components/rubrics/rubric-values";
import { RubricView } from "@/components/rubrics/rubric-view";
import { Alert } from "@/components/ui/alert";
import { Badge } from "@/components/ui/badge";
import { PageHeader } from "@/components/ui/page-header";
import { getRubric } from "@/db/queries/rubrics";
import { hasRole } from "@/lib/auth/actor";
import { requirePageRole } from "@/lib/auth/guards";
import { AppError } from "@/lib/errors";
import { formatDateTime } from "@/lib/utils";

export const metadata: Metadata = { title: "Rubric" };

export default async function RubricPage({ params, searchParams }: PageProps<"/rubrics/[id]">) {
  const { id } = await params;
  const sp = await searchParams;
  const actor = await requirePageRole(["teacher", "admin", "moderator"], `/rubrics/${id}`);
  let rubric: ReturnType<typeof getRubric>;
  try {
    rubric = getRubric({ actor, rubricId: id });
  } catch (e) {
    if (e instanceof AppError && e.code === "forbidden") forbidden();
    if (e instanceof AppError && e.code === "not_found") notFound();
    throw e;
  }
  const canEdit = hasRole(actor, "teacher", "admin");
  return (
    <div className="flex max-w-5xl flex-col gap-4">
      <nav aria-label="Breadcrumb" className="text-sm">
        <Link href="/rubrics">← Rubrics</Link>
      </nav>
      <PageHeader
        eyebrow={rubric.body.style === "competence" ? "Shown / not yet" : "Marks"}
        title={rubric.title}
        lead={
          <span className="flex flex-wrap items-center gap-2">
            Last changed {formatDateTime(rubric.updatedAt)}
            {rubric.archived ? <Badge tone="warn">Archived</Badge> : null}
          </span>
        }
      />
      {sp.created === "1" ? <Alert tone="good">Rubric saved to the library.</Alert> : null}
      {canEdit ? (
        <RubricEditor mode="edit" rubricId={rubric.id} revision={rubric.revision} archived={rubric.archived} initial={valuesFromBody(rubric.body)} />
      ) : (
        <RubricView body={rubric.body} />
      )}
    </div>
  );
}
