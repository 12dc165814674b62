import type { Metadata } from "next";
import { OutboxMessageView } from "@/components/admin/outbox-message";
import { requirePageRole } from "@/lib/auth/guards";

export const metadata: Metadata = { title: "E-mail" };

export default async function OutboxMessagePage({ params }: PageProps<"/admin/outbox/[id]">) {
  const { id } = await params;
  await requirePageRole(["admin"], `/admin/outbox/${id}`);
  return <OutboxMessageView id={id} />;
}
