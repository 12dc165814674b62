import type { Metadata } from "next";
import { RubricEditor } from "@/components/rubrics/rubric-editor";
import { emptyRubric } from "@/components/rubrics/rubric-values";
import { PageHeader } from "@/components/ui/page-header";
import { requirePageRole } from "@/lib/auth/guards";

export const metadata: Metadata = { title: "New rubric" };

export default async function NewRubricPage() {
  await requirePageRole(["teacher", "admin"], "/rubrics/new");
  return (
    <div className="flex max-w-5xl flex-col gap-4">
      <PageHeader title="New rubric" lead="List the criteria, and for each one its levels from lowest to highest." />
      <RubricEditor mode="create" initial={emptyRubric()} />
    </div>
  );
}
