import type { Metadata } from "next";
import { AuditTrail } from "@/components/admin/audit-trail";
import { requirePageRole } from "@/lib/auth/guards";

export const metadata: Metadata = { title: "Audit trail" };

export default async function AuditPage({ searchParams }: PageProps<"/admin/audit">) {
  await requirePageRole(["admin"], "/admin/audit");
  const raw = (await searchParams).entityType;
  const entityType = (Array.isArray(raw) ? raw[0] : raw) ?? "";
  return <AuditTrail initialType={/^[a-z][a-z0-9-]{0,39}$/.test(entityType) ? entityType : ""} />;
}
