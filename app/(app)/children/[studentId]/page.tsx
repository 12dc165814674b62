import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { StudentReport } from "@/components/progress/student-report";
import { getStudentProgress } from "@/db/queries/progress";
import { hasRole } from "@/lib/auth/actor";
import { requirePageRole } from "@/lib/auth/guards";
import { AppError } from "@/lib/errors";

export const metadata: Metadata = { title: "Progress report" };

/**
 * A student's progress report for their parents, and for their teachers and admins. The data
 * layer answers "not found" for anyone else, so a guessed id shows the 404 page.
 */
export default async function ChildReportPage({ params }: PageProps<"/children/[studentId]">) {
  const { studentId } = await params;
  const actor = await requirePageRole(["parent", "teacher", "admin"], `/children/${studentId}`);
  let progress: ReturnType<typeof getStudentProgress>;
  try {
    progress = getStudentProgress({ actor, studentId });
  } catch (e) {
    if (e instanceof AppError && e.code === "not_found") notFound();
    throw e;
  }
  // The data layer gives calculation checks to staff and leaves them out for parents.
  const reader = progress.checkHistory && hasRole(actor, "teacher", "admin") ? "staff" : "family";
  return <StudentReport progress={progress} reader={reader} eyebrow="Progress report" />;
}
