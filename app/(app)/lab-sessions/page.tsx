import type { Metadata } from "next";
import Link from "next/link";
import { LabSessionList, type LabSessionListItem, type LabSessionState } from "@/components/lab-sessions/session-parts";
import { buttonClasses } from "@/components/ui/button";
import { EmptyState } from "@/components/ui/empty-state";
import { Select } from "@/components/ui/field";
import { PageHeader } from "@/components/ui/page-header";
import { listClasses } from "@/db/queries/classes";
import { listLabSessions } from "@/db/queries/lab-sessions";
import { hasRole } from "@/lib/auth/actor";
import { requirePageRole } from "@/lib/auth/guards";

export const metadata: Metadata = { title: "Lab sessions" };

const STAFF_GROUPS: { state: LabSessionState; heading: string; empty: string }[] = [
  { state: "open", heading: "Open now", empty: "No lab sessions are open right now." },
  { state: "late", heading: "Past due, still taking late work", empty: "None." },
  { state: "upcoming", heading: "Coming up", empty: "Nothing scheduled yet." },
  { state: "closed", heading: "Closed", empty: "None in the last 120 days." },
  { state: "cancelled", heading: "Cancelled", empty: "None." },
];

export default async function LabSessionsPage({ searchParams }: PageProps<"/lab-sessions">) {
  const actor = await requirePageRole(["teacher", "student", "admin"], "/lab-sessions");
  const now = new Date();
  const staff = hasRole(actor, "teacher", "admin");
  if (!staff) return <StudentView items={listLabSessions({ actor, now })} now={now} />;

  const sp = await searchParams;
  const admin = hasRole(actor, "admin");
  const classes = listClasses({ actor }).filter((c) => admin || c.teachers.some((t) => t.id === actor.userId));
  const wanted = typeof sp.class === "string" ? sp.class : "";
  const classId = classes.some((c) => c.id === wanted) ? wanted : undefined;
  const sessions = listLabSessions({ actor, classId, now }).filter((s) => admin || classes.some((c) => c.id === s.classId));
  return (
    <div className="flex flex-col gap-6">
      <PageHeader
        title="Lab sessions"
        lead={admin ? "Every lab session in the school: due in the last 120 days, or coming up." : "Lab sessions for the classes you teach: due in the last 120 days, or coming up."}
        actions={
          <Link href={classId ? `/lab-sessions/new?classId=${classId}` : "/lab-sessions/new"} className={buttonClasses("primary")}>
            Schedule a lab session
          </Link>
        }
      />
      {classes.length > 1 ? (
        <form method="get" className="flex flex-wrap items-end gap-2" aria-label="Show one class">
          <div className="flex flex-col gap-1">
            <label htmlFor="class-filter" className="font-semibold">
              Class
            </label>
            <Select id="class-filter" name="class" defaultValue={classId ?? ""} className="w-64">
              <option value="">All {admin ? "classes" : "your classes"}</option>
              {classes.map((c) => (
                <option key={c.id} value={c.id}>
                  {c.name}
                </option>
              ))}
            </Select>
          </div>
          <button type="submit" className={buttonClasses("secondary")}>
            Show
          </button>
        </form>
      ) : null}
      {sessions.length === 0 ? (
        <EmptyState title={classId ? "No lab sessions for this class yet." : "No lab sessions yet."}>
          <Link href={classId ? `/lab-sessions/new?classId=${classId}` : "/lab-sessions/new"}>Schedule a lab session</Link> to set a published practical for a class.
        </EmptyState>
      ) : (
        STAFF_GROUPS.map((g) => {
          let items: LabSessionListItem[] = sessions.filter((s) => s.state === g.state);
          if (g.state === "closed" || g.state === "cancelled") items = [...items].reverse();
          if (!items.length && (g.state === "late" || g.state === "cancelled")) return null;
          return (
            <section key={g.state} aria-labelledby={`group-${g.state}`} className="flex flex-col gap-2">
              <h2 id={`group-${g.state}`} className="text-xl font-bold">
                {g.heading} <span className="text-base font-normal text-muted">({items.length})</span>
              </h2>
              {items.length ? <LabSessionList items={items} now={now} showClass={!classId} /> : <p className="text-muted">{g.empty}</p>}
            </section>
          );
        })
      )}
    </div>
  );
}

function StudentView({ items, now }: { items: LabSessionListItem[]; now: Date }) {
  const open = items.filter((s) => s.state === "open" || s.state === "late");
  const upcoming = items.filter((s) => s.state === "upcoming");
  return (
    <div className="flex flex-col gap-6">
      <PageHeader title="Your lab sessions" lead="Practicals your teachers have set for your classes." />
      <section aria-labelledby="open-now" className="flex flex-col gap-2">
        <h2 id="open-now" className="text-xl font-bold">
          Open now
        </h2>
        <LabSessionList items={open} now={now} emptyText="Nothing is open for you right now." />
      </section>
      <section aria-labelledby="coming-up" className="flex flex-col gap-2">
        <h2 id="coming-up" className="text-xl font-bold">
          Coming up
        </h2>
        <LabSessionList items={upcoming} now={now} emptyText="Nothing is coming up yet." />
      </section>
    </div>
  );
}
