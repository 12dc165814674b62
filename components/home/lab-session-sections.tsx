import Link from "next/link";
import { LabSessionList, type LabSessionListItem } from "@/components/lab-sessions/session-parts";
import { buttonClasses } from "@/components/ui/button";
import { EmptyState } from "@/components/ui/empty-state";

const LIMIT = 6;

function MoreLink({ shown, total }: { shown: number; total: number }) {
  return total > shown ? (
    <p>
      <Link href="/lab-sessions">See all {total}</Link>
    </p>
  ) : null;
}

/** A teacher's lab sessions on the home page: open now (including the late window) and coming up. */
export function TeacherLabSessions({ items, now }: { items: LabSessionListItem[]; now: Date }) {
  const open = items.filter((s) => s.state === "open" || s.state === "late");
  const upcoming = items.filter((s) => s.state === "upcoming");
  return (
    <section aria-labelledby="teacher-sessions-heading" className="flex flex-col gap-3">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h2 id="teacher-sessions-heading" className="text-xl font-bold">
          Lab sessions
        </h2>
        <div className="flex flex-wrap gap-2">
          <Link href="/lab-sessions/new" className={buttonClasses("primary", "sm")}>
            Schedule a lab session
          </Link>
          <Link href="/lab-sessions" className={buttonClasses("secondary", "sm")}>
            All lab sessions
          </Link>
        </div>
      </div>
      {open.length === 0 && upcoming.length === 0 ? (
        <EmptyState title="Nothing open or coming up for your classes.">Schedule a lab session to set a published practical for a class.</EmptyState>
      ) : (
        <div className="grid gap-4 lg:grid-cols-2">
          <div className="flex flex-col gap-2">
            <h3 className="font-bold">Open now ({open.length})</h3>
            {open.length ? <LabSessionList items={open.slice(0, LIMIT)} now={now} headingLevel="h4" /> : <p className="text-muted">None open right now.</p>}
            <MoreLink shown={Math.min(open.length, LIMIT)} total={open.length} />
          </div>
          <div className="flex flex-col gap-2">
            <h3 className="font-bold">Coming up ({upcoming.length})</h3>
            {upcoming.length ? <LabSessionList items={upcoming.slice(0, LIMIT)} now={now} headingLevel="h4" /> : <p className="text-muted">Nothing scheduled yet.</p>}
            <MoreLink shown={Math.min(upcoming.length, LIMIT)} total={upcoming.length} />
          </div>
        </div>
      )}
    </section>
  );
}

/** A student's open and upcoming lab sessions on the home page, with due dates. */
export function StudentLabSessions({ items, now }: { items: LabSessionListItem[]; now: Date }) {
  const open = items.filter((s) => s.state === "open" || s.state === "late");
  const upcoming = items.filter((s) => s.state === "upcoming");
  return (
    <>
      <section aria-labelledby="student-open-heading" className="flex flex-col gap-3">
        <h2 id="student-open-heading" className="text-xl font-bold">
          Open now
        </h2>
        <LabSessionList items={open} now={now} emptyText="Nothing is open for you right now." />
      </section>
      <section aria-labelledby="student-upcoming-heading" className="flex flex-col gap-3">
        <h2 id="student-upcoming-heading" className="text-xl font-bold">
          Coming up
        </h2>
        <LabSessionList items={upcoming} now={now} emptyText="Nothing is coming up yet." />
      </section>
    </>
  );
}
