import type { Metadata } from "next";
import { AccountSettings } from "@/components/account/account-settings";
import { buttonClasses } from "@/components/ui/button";
import { Card, CardTitle } from "@/components/ui/card";
import { PageHeader } from "@/components/ui/page-header";
import { requirePageUser } from "@/lib/auth/guards";
import { hasRole } from "@/lib/auth/actor";
import { ROLE_LABELS } from "@/lib/roles";

export const metadata: Metadata = { title: "Your account" };

export default async function AccountPage() {
  const actor = await requirePageUser("/account");
  const what = hasRole(actor, "student")
    ? "your account, classes, write-ups with marks and feedback once returned, progress, calculation checks, the history of changes to your work, the e-mails sent to you, and your photos"
    : hasRole(actor, "parent")
      ? "your account, your links to your children and their returned work and progress, the history of changes to your account, and the e-mails sent to you"
      : "your account, your classes, the history of changes to your account, the e-mails sent to you and the photos you added";
  return (
    <div className="flex flex-col gap-4">
      <PageHeader title="Your account" lead={`${actor.name} · ${actor.roles.map((r) => ROLE_LABELS[r]).join(", ")}`} />
      <AccountSettings />
      <Card>
        <CardTitle>Your data</CardTitle>
        <p className="mb-3">Download everything Meniscus holds about you: {what}. It comes as a zip file with the data as JSON and the photos as they are stored.</p>
        <a href="/api/me/export" download className={buttonClasses("secondary")}>
          Download my data
        </a>
      </Card>
    </div>
  );
}
