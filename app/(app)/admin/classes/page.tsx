import type { Metadata } from "next";
import { ClassList } from "@/components/admin/class-list";
import { requirePageRole } from "@/lib/auth/guards";

export const metadata: Metadata = { title: "Classes" };

export default async function ClassesPage() {
  await requirePageRole(["admin"], "/admin/classes");
  return <ClassList />;
}
