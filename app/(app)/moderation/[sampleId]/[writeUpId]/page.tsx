import type { Metadata } from "next";
import type { ModerationItemJson } from "@/components/marking/types";
import { SecondMarkingDesk } from "@/components/moderation/second-marking-desk";
import { getModerationItem, getSample } from "@/db/queries/moderation";
import { requirePageRole } from "@/lib/auth/guards";
import { asJson, orPageError } from "../../../marking/load";

export const metadata: Metadata = { title: "Second marking" };

/** One sampled write-up for its moderator to second-mark (an admin reads it). */
export default async function SecondMarkingPage({ params }: PageProps<"/moderation/[sampleId]/[writeUpId]">) {
  const { sampleId, writeUpId } = await params;
  const actor = await requirePageRole(["moderator", "admin"], `/moderation/${sampleId}/${writeUpId}`);
  const item: ModerationItemJson = asJson(orPageError(() => getModerationItem({ actor, sampleId, writeUpId })));
  // The pieces still in the sample, in the sample's order, to move to the previous or next one.
  const order = orPageError(() => getSample({ actor, sampleId }))
    .items.filter((i) => !i.removed)
    .map((i) => ({ writeUpId: i.writeUpId, studentName: i.studentName, finished: !!i.moderation?.completed }));
  return <SecondMarkingDesk key={writeUpId} sampleId={sampleId} initial={item} order={order} />;
}
