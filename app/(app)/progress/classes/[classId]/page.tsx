import type { Metadata } from "next";
import Link from "next/link";
import { forbidden, notFound } from "next/navigation";
import { ClassProgress } from "@/components/progress/class-progress";
import { PageHeader } from "@/components/ui/page-header";
import { getClassProgress } from "@/db/queries/progress";
import { requirePageRole } from "@/lib/auth/guards";
import { AppError } from "@/lib/errors";

export const metadata: Metadata = { title: "Class progress" };

/** A class's progress across its practicals, for its teachers and admins. */
export default async function ClassProgressPage({ params }: PageProps<"/progress/classes/[classId]">) {
  const { classId } = await params;
  const actor = await requirePageRole(["teacher", "admin"], `/progress/classes/${classId}`);
  let data: ReturnType<typeof getClassProgress>;
  try {
    data = getClassProgress({ actor, classId });
  } catch (e) {
    if (e instanceof AppError && e.code === "not_found") notFound();
    if (e instanceof AppError && e.code === "forbidden") forbidden();
    throw e;
  }
  return (
    <div className="flex flex-col gap-6">
      <PageHeader
        eyebrow={
          <Link href="/progress/classes" className="text-accent">
            Class progress
          </Link>
        }
        title={data.class.name}
        lead="Lab sessions that have passed their due date. Open a student's name for their full progress report, the same one their family sees."
      />
      <ClassProgress data={data} />
    </div>
  );
}
