import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { MarkingDesk } from "@/components/marking/marking-desk";
import type { MarkingItemJson } from "@/components/marking/types";
import { getMarkingItem } from "@/db/queries/marking";
import { requirePageRole } from "@/lib/auth/guards";
import { asJson, orPageError } from "../../load";

export const metadata: Metadata = { title: "Marking" };

export default async function MarkingItemPage({ params }: PageProps<"/marking/[labSessionId]/[writeUpId]">) {
  const { labSessionId, writeUpId } = await params;
  const actor = await requirePageRole(["teacher", "admin"], `/marking/${labSessionId}/${writeUpId}`);
  const item: MarkingItemJson = asJson(orPageError(() => getMarkingItem({ actor, writeUpId })));
  // The address names the lab session too; a write-up from another one is not on this bench.
  if (item.view.labSession.id !== labSessionId) notFound();
  return <MarkingDesk key={writeUpId} initial={item} />;
}
