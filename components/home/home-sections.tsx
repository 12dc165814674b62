import { actionLabel } from "@/components/admin/audit-change";
import Link from "next/link";
import { Card, CardTitle } from "@/components/ui/card";
import { EmptyState } from "@/components/ui/empty-state";
import { formatDateTime } from "@/lib/utils";

type ClassItem = { id: string; name: string; subject: string; studentCount: number; teachers: { id: string; name: string }[] };

export function ClassCards({ classes, teacherView, emptyText }: { classes: ClassItem[]; teacherView: boolean; emptyText: string }) {
  if (!classes.length) return <EmptyState title={emptyText} />;
  return (
    <ul className="grid gap-3 sm:grid-cols-2 lg:grid-cols-3">
      {classes.map((c) => (
        <li key={c.id}>
          <Link href={`/classes/${c.id}`} className="block rounded-lg border border-line bg-surface p-4 text-ink no-underline hover:border-brand">
            <span className="block text-lg font-bold">{c.name}</span>
            <span className="block text-muted">
              {teacherView ? `${c.studentCount} student${c.studentCount === 1 ? "" : "s"}` : `Taught by ${c.teachers.map((t) => t.name).join(" and ") || "—"}`}
            </span>
          </Link>
        </li>
      ))}
    </ul>
  );
}

export function AdminSection({
  overview,
}: {
  overview: {
    byRole: Partial<Record<string, number>>;
    notSetUp: number;
    pendingInvitations: number;
    classesWithoutTeacher: { id: string; name: string }[];
    studentsWithoutClass: number;
    classCount: number;
    recent: { id: number; action: string; actorName: string | null; at: Date; entityType: string }[];
  };
}) {
  const todo: { text: string; href: string }[] = [];
  if (overview.notSetUp) todo.push({ text: `${overview.notSetUp} account${overview.notSetUp === 1 ? " is" : "s are"} not set up yet (${overview.pendingInvitations} invitation${overview.pendingInvitations === 1 ? "" : "s"} waiting)`, href: "/admin/people?status=not-set-up" });
  for (const c of overview.classesWithoutTeacher) todo.push({ text: `${c.name} has no teacher`, href: `/admin/classes/${c.id}` });
  if (overview.studentsWithoutClass) todo.push({ text: `${overview.studentsWithoutClass} student${overview.studentsWithoutClass === 1 ? " is" : "s are"} not in any class`, href: "/admin/people?role=student" });
  return (
    <section aria-labelledby="admin-heading" className="flex flex-col gap-4">
      <h2 id="admin-heading" className="text-xl font-bold">
        School administration
      </h2>
      <dl className="grid grid-cols-2 gap-3 sm:grid-cols-5">
        {[
          ["Students", overview.byRole.student ?? 0],
          ["Teachers", overview.byRole.teacher ?? 0],
          ["Parents", overview.byRole.parent ?? 0],
          ["Moderators", overview.byRole.moderator ?? 0],
          ["Classes", overview.classCount],
        ].map(([label, n]) => (
          <div key={label} className="rounded-lg border border-line bg-surface p-3">
            <dt className="text-sm text-muted">{label}</dt>
            <dd className="text-2xl font-bold">{n}</dd>
          </div>
        ))}
      </dl>
      <Card>
        <CardTitle as="h3">To do</CardTitle>
        {todo.length ? (
          <ul className="flex flex-col gap-1">
            {todo.map((t) => (
              <li key={t.text}>
                <Link href={t.href}>{t.text}</Link>
              </li>
            ))}
          </ul>
        ) : (
          <p className="text-muted">Nothing needs your attention.</p>
        )}
      </Card>
      <Card>
        <CardTitle as="h3">Recent changes</CardTitle>
        {overview.recent.length ? (
          <ul className="flex flex-col gap-1">
            {overview.recent.map((r) => (
              <li key={r.id} className="flex flex-wrap items-center gap-2">
                <span className="font-semibold">{actionLabel(r.action)}</span>
                <span className="text-muted">by {r.actorName ?? "Meniscus"}</span>
                <span className="text-sm text-muted">{formatDateTime(r.at)}</span>
              </li>
            ))}
          </ul>
        ) : (
          <p className="text-muted">No changes yet.</p>
        )}
        <p className="mt-2">
          <Link href="/admin/audit">Open the audit trail</Link>
        </p>
      </Card>
    </section>
  );
}
