import type { Metadata } from "next";
import { StudentReport } from "@/components/progress/student-report";
import { getStudentProgress } from "@/db/queries/progress";
import { requirePageRole } from "@/lib/auth/guards";

export const metadata: Metadata = { title: "Your progress" };

/** A student's own progress report, with their calculation-check history. */
export default async function MyProgressPage() {
  const actor = await requirePageRole(["student"], "/progress");
  const progress = getStudentProgress({ actor, studentId: actor.userId });
  return <StudentReport progress={progress} reader="student" eyebrow="Progress" />;
}
