import type { Metadata } from "next";
import { OutboxList } from "@/components/admin/outbox-list";
import { requirePageRole } from "@/lib/auth/guards";

export const metadata: Metadata = { title: "Outbox" };

export default async function OutboxPage({ searchParams }: PageProps<"/admin/outbox">) {
  await requirePageRole(["admin"], "/admin/outbox");
  const to = (await searchParams).to;
  return <OutboxList initialTo={((Array.isArray(to) ? to[0] : to) ?? "").slice(0, 254)} />;
}
