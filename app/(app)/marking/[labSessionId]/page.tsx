import type { Metadata } from "next";
import Link from "next/link";
import { BenchTable } from "@/components/marking/bench-table";
import type { BenchJson } from "@/components/marking/types";
import { PageHeader } from "@/components/ui/page-header";
import { getMarkingBench } from "@/db/queries/marking";
import { requirePageRole } from "@/lib/auth/guards";
import { formatDate } from "@/lib/utils";
import { asJson, orPageError } from "../load";

export const metadata: Metadata = { title: "Marking bench" };

export default async function MarkingBenchPage({ params }: PageProps<"/marking/[labSessionId]">) {
  const { labSessionId } = await params;
  const actor = await requirePageRole(["teacher", "admin"], `/marking/${labSessionId}`);
  const bench: BenchJson = asJson(orPageError(() => getMarkingBench({ actor, labSessionId })));
  return (
    <div className="flex flex-col gap-4">
      <p className="no-print">
        <Link href="/marking">← All lab sessions to mark</Link>
      </p>
      <PageHeader
        eyebrow={`Marking bench · ${bench.labSession.className}`}
        title={bench.labSession.title}
        lead={`Due ${formatDate(bench.labSession.dueAt)}. ${bench.rubric ? `Marked against “${bench.rubric.title}”, out of ${bench.maxTotal}.` : "This practical has no rubric, so there is nothing to mark against."}`}
      />
      <BenchTable initial={bench} />
    </div>
  );
}
