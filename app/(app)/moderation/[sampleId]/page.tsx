import type { Metadata } from "next";
import type { SampleJson } from "@/components/marking/types";
import { SampleView } from "@/components/moderation/sample-view";
import { getSample } from "@/db/queries/moderation";
import { requirePageRole } from "@/lib/auth/guards";
import { asJson, orPageError } from "../../marking/load";

export const metadata: Metadata = { title: "Moderation sample" };

export default async function SamplePage({ params }: PageProps<"/moderation/[sampleId]">) {
  const { sampleId } = await params;
  const actor = await requirePageRole(["moderator", "admin"], `/moderation/${sampleId}`);
  const sample: SampleJson = asJson(orPageError(() => getSample({ actor, sampleId })));
  return <SampleView key={sampleId} initial={sample} />;
}
