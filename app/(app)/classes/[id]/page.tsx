import type { Metadata } from "next";
import Link from "next/link";
import { forbidden, notFound } from "next/navigation";
import { Badge } from "@/components/ui/badge";
import { buttonClasses } from "@/components/ui/button";
import { Card, CardTitle } from "@/components/ui/card";
import { EmptyState } from "@/components/ui/empty-state";
import { PageHeader } from "@/components/ui/page-header";
import { Table, Td, Th } from "@/components/ui/table";
import { getClassDetail } from "@/db/queries/classes";
import { requirePageUser } from "@/lib/auth/guards";
import { AppError } from "@/lib/errors";

export const metadata: Metadata = { title: "Class" };

export default async function ClassPage({ params }: PageProps<"/classes/[id]">) {
  const { id } = await params;
  const actor = await requirePageUser(`/classes/${id}`);
  let cls: ReturnType<typeof getClassDetail>;
  try {
    cls = getClassDetail({ actor, classId: id });
  } catch (e) {
    if (e instanceof AppError && e.code === "forbidden") forbidden();
    if (e instanceof AppError && e.code === "not_found") notFound();
    throw e;
  }
  return (
    <div className="flex flex-col gap-6">
      <PageHeader
        eyebrow={`${cls.subject} · Year ${cls.yearGroup} · ${cls.academicYear}`}
        title={cls.name}
        lead={`Taught by ${cls.teachers.map((t) => t.name).join(" and ") || "no teacher yet"}.`}
        actions={
          cls.canManage ? (
            <Link href={`/admin/classes/${cls.id}`} className={buttonClasses("secondary")}>
              Manage this class
            </Link>
          ) : null
        }
      />
      {cls.archived ? <Badge tone="warn">Archived</Badge> : null}
      {cls.students ? (
        <section aria-labelledby="roster">
          <h2 id="roster" className="mb-3 text-xl font-bold">
            Students ({cls.students.length})
          </h2>
          {cls.students.length ? (
            <Table>
              <thead>
                <tr>
                  <Th>Name</Th>
                  <Th>E-mail</Th>
                  <Th>Year</Th>
                  <Th>Parents and guardians</Th>
                </tr>
              </thead>
              <tbody>
                {cls.students.map((s) => (
                  <tr key={s.id}>
                    <Td className="font-semibold">
                      {s.name} {s.active ? null : <Badge tone="warn">Deactivated</Badge>}
                    </Td>
                    <Td className="break-all">{s.email}</Td>
                    <Td>{s.yearGroup ?? "—"}</Td>
                    <Td>{s.guardians.length ? s.guardians.map((g) => `${g.name} (${g.relationship})`).join(", ") : <span className="text-muted">None on record</span>}</Td>
                  </tr>
                ))}
              </tbody>
            </Table>
          ) : (
            <EmptyState title="No students in this class yet." />
          )}
        </section>
      ) : (
        <Card>
          <CardTitle>Your class</CardTitle>
          <p className="text-muted">Your teacher sets practicals for this class. When one opens, it appears on your home page.</p>
        </Card>
      )}
    </div>
  );
}
