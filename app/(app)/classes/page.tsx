import type { Metadata } from "next";
import { ClassCards } from "@/components/home/home-sections";
import { PageHeader } from "@/components/ui/page-header";
import { listClasses } from "@/db/queries/classes";
import { hasRole } from "@/lib/auth/actor";
import { requirePageRole } from "@/lib/auth/guards";

export const metadata: Metadata = { title: "Classes" };

export default async function ClassesPage() {
  const actor = await requirePageRole(["teacher", "student", "admin"], "/classes");
  const classes = listClasses({ actor });
  const taught = classes.filter((c) => c.teachers.some((t) => t.id === actor.userId));
  const member = classes.filter((c) => !c.teachers.some((t) => t.id === actor.userId));
  return (
    <div className="flex flex-col gap-8">
      <PageHeader title="Classes" lead={hasRole(actor, "admin") ? "Every class in the school. Manage them under All classes." : undefined} />
      {hasRole(actor, "teacher") ? (
        <section aria-labelledby="taught" className="flex flex-col gap-3">
          <h2 id="taught" className="text-xl font-bold">
            Classes you teach
          </h2>
          <ClassCards classes={taught} teacherView emptyText="You are not teaching any classes yet." />
        </section>
      ) : null}
      {hasRole(actor, "student") || hasRole(actor, "admin") ? (
        <section aria-labelledby="member" className="flex flex-col gap-3">
          <h2 id="member" className="text-xl font-bold">
            {hasRole(actor, "admin") ? "All classes" : "Your classes"}
          </h2>
          <ClassCards classes={member} teacherView={hasRole(actor, "admin")} emptyText="You are not in any classes yet." />
        </section>
      ) : null}
    </div>
  );
}
