import type { Metadata } from "next";
import { PersonDetailView } from "@/components/admin/person-detail";
import { requirePageRole } from "@/lib/auth/guards";

export const metadata: Metadata = { title: "Person" };

export default async function PersonPage({ params }: PageProps<"/admin/people/[id]">) {
  const { id } = await params;
  const actor = await requirePageRole(["admin"], `/admin/people/${id}`);
  return <PersonDetailView id={id} isSelf={actor.userId === id} />;
}
