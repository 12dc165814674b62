import type { Metadata } from "next";
import { ClassDetailView } from "@/components/admin/class-detail";
import { requirePageRole } from "@/lib/auth/guards";

export const metadata: Metadata = { title: "Class" };

export default async function ClassPage({ params }: PageProps<"/admin/classes/[id]">) {
  const { id } = await params;
  await requirePageRole(["admin"], `/admin/classes/${id}`);
  return <ClassDetailView id={id} />;
}
