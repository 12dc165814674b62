import type { Metadata } from "next";
import { MarkingSessionList, type MarkingSessionSummary } from "@/components/marking/session-list";
import { PageHeader } from "@/components/ui/page-header";
import { listLabSessions } from "@/db/queries/lab-sessions";
import { getMarkingBench } from "@/db/queries/marking";
import { hasRole } from "@/lib/auth/actor";
import { requirePageRole } from "@/lib/auth/guards";
import { AppError } from "@/lib/errors";

export const metadata: Metadata = { title: "Marking" };

export default async function MarkingPage() {
  const actor = await requirePageRole(["teacher", "admin"], "/marking");
  const sessions: MarkingSessionSummary[] = [];
  for (const s of listLabSessions({ actor })) {
    if (s.cancelledAt) continue;
    let bench;
    try {
      bench = getMarkingBench({ actor, labSessionId: s.id });
    } catch (e) {
      // A class the person studies in rather than teaches (someone with both roles).
      if (e instanceof AppError && e.code === "forbidden") continue;
      throw e;
    }
    const counts = { submitted: 0, late: 0, marked: 0, returned: 0, draft: 0, notStarted: 0 };
    for (const r of bench.rows) {
      if (r.status === "not-started") counts.notStarted++;
      else counts[r.status]++;
    }
    sessions.push({ id: s.id, title: s.title, className: s.className, dueAt: s.dueAt.toISOString(), state: s.state, counts, students: bench.rows.length });
  }
  const teaching = hasRole(actor, "teacher");
  return (
    <div className="flex flex-col gap-6">
      <PageHeader
        title="Marking"
        lead={
          teaching
            ? "Your classes' lab sessions. Open one to mark its write-ups on the marking bench."
            : "Every lab session in the school. Admins can read the marking bench; only a class's teachers mark."
        }
      />
      <MarkingSessionList sessions={sessions} />
    </div>
  );
}
