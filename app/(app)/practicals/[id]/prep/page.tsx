import type { Metadata } from "next";
import Link from "next/link";
import { forbidden, notFound } from "next/navigation";
import { fromLocalParts } from "@/components/lab-sessions/local-date-time";
import { defaultGroupCount } from "@/components/prep/prep-href";
import { PrepList } from "@/components/prep/prep-list";
import { EmptyState } from "@/components/ui/empty-state";
import { PageHeader } from "@/components/ui/page-header";
import { listClasses } from "@/db/queries/classes";
import { getPracticalDetail, getPracticalVersion } from "@/db/queries/practicals";
import { hasRole } from "@/lib/auth/actor";
import { requirePageRole } from "@/lib/auth/guards";
import { AppError } from "@/lib/errors";

export const metadata: Metadata = { title: "Prep list" };

function rethrowAsPage(e: unknown): never {
  if (e instanceof AppError && e.code === "forbidden") forbidden();
  if (e instanceof AppError && e.code === "not_found") notFound();
  throw e;
}

export default async function PrepListPage({ params, searchParams }: PageProps<"/practicals/[id]/prep">) {
  const { id } = await params;
  const sp = await searchParams;
  const actor = await requirePageRole(["teacher", "admin", "moderator"], `/practicals/${id}/prep`);
  let detail: ReturnType<typeof getPracticalDetail>;
  try {
    detail = getPracticalDetail({ actor, practicalId: id });
  } catch (e) {
    rethrowAsPage(e);
  }
  const wanted = typeof sp.version === "string" ? sp.version : "";
  const chosen = wanted ? detail.versions.find((v) => v.id === wanted) : detail.versions.find((v) => v.status === "published");
  if (!chosen) {
    const drafts = detail.versions.filter((v) => v.status === "draft");
    return (
      <div className="flex flex-col gap-6">
        <PageHeader eyebrow="Prep list" title={detail.title} />
        <EmptyState title={wanted ? "That version of the practical was not found." : "This practical has no published version yet."}>
          {drafts.length ? (
            <>
              A prep list is normally made from a published version. You can still see one for the draft:{" "}
              {drafts.map((d) => (
                <Link key={d.id} href={`/practicals/${id}/prep?version=${d.id}`}>
                  version {d.version} (draft)
                </Link>
              ))}
              .
            </>
          ) : (
            <Link href={`/practicals/${id}`}>Back to the practical</Link>
          )}
        </EmptyState>
      </div>
    );
  }
  let version: ReturnType<typeof getPracticalVersion>;
  try {
    version = getPracticalVersion({ actor, versionId: chosen.id });
  } catch (e) {
    rethrowAsPage(e);
  }

  const admin = hasRole(actor, "admin");
  const classes = hasRole(actor, "teacher", "admin")
    ? listClasses({ actor })
        .filter((c) => admin || c.teachers.some((t) => t.id === actor.userId))
        .map((c) => ({ id: c.id, name: c.name, studentCount: c.studentCount }))
    : [];
  const classId = typeof sp.class === "string" && classes.some((c) => c.id === sp.class) ? sp.class : "";
  const cls = classes.find((c) => c.id === classId);
  const groupsParam = typeof sp.groups === "string" && /^\d{1,3}$/.test(sp.groups) ? sp.groups : "";
  const groups = groupsParam || String(cls ? defaultGroupCount(cls.studentCount) : 8);
  const date = typeof sp.date === "string" && fromLocalParts(sp.date, "12:00").ok ? sp.date : "";
  const content = version.content;
  return (
    <div className="flex flex-col gap-4">
      <nav aria-label="Breadcrumb" className="no-print text-sm">
        <Link href={`/practicals/${id}`}>← {detail.title}</Link>
      </nav>
      <PrepList
        practical={{ id, title: version.title, topic: version.topic, yearGroup: version.yearGroup }}
        version={{ id: version.id, version: version.version, status: version.status }}
        versions={detail.versions.map((v) => ({ id: v.id, version: v.version, status: v.status }))}
        prep={content.prep}
        hazards={content.safety.hazards}
        eyeProtection={content.safety.eyeProtection}
        otherPpe={content.safety.otherPpe}
        classes={classes}
        initial={{ classId, groups, date }}
      />
    </div>
  );
}
