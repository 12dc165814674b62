import type { Metadata } from "next";
import { AccountSettings } from "@/components/account/account-settings";
import { PageHeader } from "@/components/ui/page-header";
import { requirePageUser } from "@/lib/auth/guards";
import { ROLE_LABELS } from "@/lib/roles";

export const metadata: Metadata = { title: "Your account" };

export default async function AccountPage() {
  const actor = await requirePageUser("/account");
  return (
    <div>
      <PageHeader title="Your account" lead={`${actor.name} · ${actor.roles.map((r) => ROLE_LABELS[r]).join(", ")}`} />
      <AccountSettings />
    </div>
  );
}
