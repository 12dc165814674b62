import Link from "next/link";
import { AdminSection, ClassCards } from "@/components/home/home-sections";
import { StudentLabSessions, TeacherLabSessions } from "@/components/home/lab-session-sections";
import { buttonClasses } from "@/components/ui/button";
import { Card, CardTitle } from "@/components/ui/card";
import { EmptyState } from "@/components/ui/empty-state";
import { LogoMark } from "@/components/ui/logo";
import { PageHeader } from "@/components/ui/page-header";
import { listClasses } from "@/db/queries/classes";
import { adminOverview } from "@/db/queries/home";
import { listLabSessions } from "@/db/queries/lab-sessions";
import { listSamples } from "@/db/queries/moderation";
import { listChildrenProgress } from "@/db/queries/progress";
import { ChildCard } from "@/components/progress/child-card";
import { hasRole } from "@/lib/auth/actor";
import { currentActor } from "@/lib/auth/guards";

function Landing() {
  return (
    <div className="mx-auto flex max-w-3xl flex-col items-start gap-6 py-6">
      <LogoMark size={64} />
      <h1 className="text-3xl font-bold sm:text-4xl">Practical science, recorded and checked.</h1>
      <p className="text-lg text-muted">
        Meniscus is the lab notebook and marking bench for a school science department. Students record their results, graphs and calculations; every calculation is
        checked against the student&apos;s own data; teachers mark against their rubric; moderators check the marking; families see clear progress reports.
      </p>
      <Link href="/sign-in" className={buttonClasses("primary")}>
        Sign in
      </Link>
    </div>
  );
}

export default async function HomePage() {
  const actor = await currentActor();
  if (!actor) return <Landing />;
  const firstName = actor.name.split(" ")[0];
  const classes = hasRole(actor, "teacher", "student") ? listClasses({ actor }) : [];
  const children = hasRole(actor, "parent") ? listChildrenProgress({ actor }) : null;
  const now = new Date();
  const sessions = hasRole(actor, "teacher", "student") ? listLabSessions({ actor, now }) : [];
  const taughtIds = new Set(classes.filter((c) => c.teachers.some((t) => t.id === actor.userId)).map((c) => c.id));
  return (
    <div className="flex flex-col gap-8">
      <PageHeader title={`Hello, ${firstName}`} lead="Here is what needs doing next." />
      {hasRole(actor, "admin") ? <AdminSection overview={adminOverview(actor)} /> : null}
      {hasRole(actor, "teacher") ? <TeacherLabSessions items={sessions.filter((s) => taughtIds.has(s.classId))} now={now} /> : null}
      {hasRole(actor, "teacher") ? (
        <section aria-labelledby="teaching-heading" className="flex flex-col gap-3">
          <h2 id="teaching-heading" className="text-xl font-bold">
            Your classes
          </h2>
          <ClassCards classes={classes.filter((c) => c.teachers.some((t) => t.id === actor.userId))} teacherView emptyText="You are not teaching any classes yet. Ask your school's admin to add you to one." />
        </section>
      ) : null}
      {hasRole(actor, "student") ? <StudentLabSessions items={sessions.filter((s) => !taughtIds.has(s.classId) && !s.cancelledAt)} now={now} /> : null}
      {hasRole(actor, "student") ? (
        <section aria-labelledby="student-heading" className="flex flex-col gap-3">
          <h2 id="student-heading" className="text-xl font-bold">
            Your science classes
          </h2>
          <ClassCards classes={classes.filter((c) => !c.teachers.some((t) => t.id === actor.userId))} teacherView={false} emptyText="You are not in any classes yet." />
        </section>
      ) : null}
      {hasRole(actor, "moderator") ? <ModeratorSection samples={listSamples({ actor }).filter((x) => x.status === "open")} /> : null}
      {children ? <ParentSection items={children} /> : null}
    </div>
  );

}

function ModeratorSection({ samples }: { samples: ReturnType<typeof listSamples> }) {
  return (
    <section aria-labelledby="moderation-heading" className="flex flex-col gap-3">
      <h2 id="moderation-heading" className="text-xl font-bold">
        Second marking to do
      </h2>
      {samples.length ? (
        <ul className="grid gap-3 sm:grid-cols-2">
          {samples.map((x) => (
            <li key={x.id}>
              <Card>
                <CardTitle as="h3">
                  <Link href={`/moderation/${x.id}`} className="underline-offset-4 hover:underline">
                    {x.scope}
                  </Link>
                </CardTitle>
                <p className="text-muted">
                  {x.secondMarked} of {x.items} second-marked{x.secondMarked === x.items ? " · ready to compare with the teacher's marks" : ""}
                </p>
              </Card>
            </li>
          ))}
        </ul>
      ) : (
        <EmptyState title="No samples waiting for you.">When a moderation sample is drawn for you to second-mark, it appears here with the work to look at.</EmptyState>
      )}
    </section>
  );
}

function ParentSection({ items }: { items: ReturnType<typeof listChildrenProgress> }) {
  return (
    <section aria-labelledby="family-heading" className="flex flex-col gap-3">
      <h2 id="family-heading" className="text-xl font-bold">
        Your children
      </h2>
      {items.length ? (
        <>
          <p className="max-w-3xl text-muted">Practical science at school: marked work, what is due, and how each skill is going. Only work the teacher has marked and handed back shows here.</p>
          <ul className="grid gap-4 lg:grid-cols-2">
            {items.map((c) => (
              <li key={c.student.id}>
                <ChildCard progress={c} />
              </li>
            ))}
          </ul>
        </>
      ) : (
        <EmptyState title="No children are linked to your account yet.">Ask the school office to link your account to your child.</EmptyState>
      )}
    </section>
  );
}
