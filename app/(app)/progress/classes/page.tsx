import type { Metadata } from "next";
import Link from "next/link";
import { EmptyState } from "@/components/ui/empty-state";
import { PageHeader } from "@/components/ui/page-header";
import { listClasses } from "@/db/queries/classes";
import { hasRole } from "@/lib/auth/actor";
import { requirePageRole } from "@/lib/auth/guards";

export const metadata: Metadata = { title: "Class progress" };

/** Choose a class to see its progress: the classes a teacher teaches, or every class for an admin. */
export default async function ClassProgressPickerPage() {
  const actor = await requirePageRole(["teacher", "admin"], "/progress/classes");
  const admin = hasRole(actor, "admin");
  // listClasses also returns classes a teacher studies in or is a parent in; only taught ones have progress to show.
  const classes = listClasses({ actor }).filter((c) => admin || c.teachers.some((t) => t.id === actor.userId));
  return (
    <div className="flex flex-col gap-6">
      <PageHeader
        title="Class progress"
        lead={admin ? "Every class in the school. Choose one to see who has handed in what, marks, calculations and slips, and to send term reports to families." : "Choose one of your classes to see who has handed in what, marks, calculations and slips, and to send term reports to families."}
      />
      {classes.length ? (
        <ul className="grid gap-3 sm:grid-cols-2 lg:grid-cols-3">
          {classes.map((c) => (
            <li key={c.id}>
              <Link href={`/progress/classes/${c.id}`} className="block rounded-lg border border-line bg-surface p-4 text-ink no-underline hover:border-brand">
                <span className="block text-lg font-bold text-brand">{c.name}</span>
                <span className="block text-muted">
                  {c.subject} · Year {c.yearGroup} · {c.studentCount} student{c.studentCount === 1 ? "" : "s"}
                </span>
                {admin ? <span className="block text-sm text-muted">Taught by {c.teachers.map((t) => t.name).join(" and ") || "no teacher yet"}</span> : null}
              </Link>
            </li>
          ))}
        </ul>
      ) : (
        <EmptyState title={admin ? "There are no classes yet." : "You are not teaching any classes yet."}>{admin ? "Add classes under All classes." : "Ask your school's admin to add you to a class."}</EmptyState>
      )}
    </div>
  );
}
