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
import { listLabSessions } from "@/db/queries/lab-sessions";
import { LabSessionList } from "@/components/lab-sessions/session-parts";
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
  const now = new Date();
  const sessions = listLabSessions({ actor, classId: id, now });
  const staff = cls.students !== null;
  const current = sessions.filter((s) => s.state === "open" || s.state === "late" || s.state === "upcoming");
  const past = sessions.filter((s) => s.state === "closed" || s.state === "cancelled").reverse();
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
      <section aria-labelledby="class-sessions" className="flex flex-col gap-3">
        <div className="flex flex-wrap items-center justify-between gap-2">
          <h2 id="class-sessions" className="text-xl font-bold">
            Lab sessions
          </h2>
          {staff ? (
            <Link href={`/lab-sessions/new?classId=${cls.id}`} className={buttonClasses("primary", "sm")}>
              Schedule a lab session for {cls.name}
            </Link>
          ) : null}
        </div>
        <LabSessionList items={current} now={now} showClass={false} emptyText={staff ? "Nothing open or coming up for this class." : "Nothing open or coming up for you in this class."} />
        {staff && past.length ? (
          <details className="rounded-lg border border-line bg-surface p-3">
            <summary className="cursor-pointer font-semibold">Closed and cancelled ({past.length})</summary>
            <div className="mt-3">
              <LabSessionList items={past} now={now} showClass={false} />
            </div>
          </details>
        ) : null}
      </section>
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
          <p className="text-muted">Your teacher sets practicals for this class as lab sessions. Open and coming-up ones are listed above and on your home page.</p>
        </Card>
      )}
    </div>
  );
}
