import type { Metadata } from "next";
import { LabSessionForm } from "@/components/lab-sessions/lab-session-form";
import { suggestParts } from "@/components/lab-sessions/local-date-time";
import { PageHeader } from "@/components/ui/page-header";
import { listClasses } from "@/db/queries/classes";
import { listSchedulableVersions } from "@/db/queries/practicals";
import { hasRole } from "@/lib/auth/actor";
import { requirePageRole } from "@/lib/auth/guards";

export const metadata: Metadata = { title: "Schedule a lab session" };

export default async function NewLabSessionPage({ searchParams }: PageProps<"/lab-sessions/new">) {
  const actor = await requirePageRole(["teacher", "admin"], "/lab-sessions/new");
  const sp = await searchParams;
  const admin = hasRole(actor, "admin");
  const classes = listClasses({ actor })
    .filter((c) => admin || c.teachers.some((t) => t.id === actor.userId))
    .map((c) => ({ id: c.id, name: c.name, studentCount: c.studentCount }));
  const versions = listSchedulableVersions({ actor });
  const practicals = versions.map((v) => ({ versionId: v.id, title: v.title, version: v.version, topic: v.topic, yearGroup: v.yearGroup }));
  const wantedClass = typeof sp.classId === "string" ? sp.classId : "";
  const wantedPractical = typeof sp.practicalId === "string" ? sp.practicalId : "";
  const now = new Date();
  const opens = suggestParts(now, 1, 9);
  const due = suggestParts(now, 8, 16);
  return (
    <div className="flex max-w-4xl flex-col gap-4">
      <PageHeader
        title="Schedule a lab session"
        lead={admin ? "Set a published practical for any class, with the dates students can work on it." : "Set a published practical for one of your classes, with the dates students can work on it."}
      />
      <LabSessionForm
        mode="create"
        classes={classes}
        practicals={practicals}
        initial={{
          classId: classes.some((c) => c.id === wantedClass) ? wantedClass : classes.length === 1 ? classes[0]!.id : "",
          practicalVersionId: versions.find((v) => v.practicalId === wantedPractical)?.id ?? "",
          opensDate: opens.date,
          opensTime: opens.time,
          dueDate: due.date,
          dueTime: due.time,
          grouping: "individual",
          groups: [],
          lateWork: "accept-flagged",
          lateDays: "7",
          notes: "",
        }}
      />
    </div>
  );
}
