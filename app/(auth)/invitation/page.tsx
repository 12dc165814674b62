import type { Metadata } from "next";
import Link from "next/link";
import { AuthCard } from "@/components/auth/auth-card";
import { ChoosePasswordForm } from "@/components/auth/choose-password-form";
import { Alert } from "@/components/ui/alert";
import { previewToken } from "@/db/queries/invitations";
import { formatDateTime } from "@/lib/utils";

export const metadata: Metadata = { title: "Set up your account" };

export default async function InvitationPage({ searchParams }: PageProps<"/invitation">) {
  const raw = (await searchParams).token;
  const token = (Array.isArray(raw) ? raw[0] : raw) ?? "";
  const preview = token ? previewToken({ token, kind: "invitation" }) : null;
  if (!preview || !preview.ok) {
    return (
      <AuthCard title="This invitation does not work">
        <Alert tone="bad">{preview?.message ?? "The link has no token. Copy the whole link from the e-mail."}</Alert>
        <p className="mt-4 text-center">
          <Link href="/sign-in">Go to sign in</Link>
        </p>
      </AuthCard>
    );
  }
  return (
    <AuthCard
      title={`Welcome, ${preview.name.split(" ")[0]}`}
      lead={
        <>
          <p>
            {preview.school} has set up a Meniscus account for <strong className="text-ink">{preview.email}</strong>. Choose a password to finish.
          </p>
          <p className="mt-1 text-sm">This link works once, until {formatDateTime(preview.expiresAt)}.</p>
        </>
      }
    >
      <ChoosePasswordForm token={token} endpoint="/api/invitations/accept" submitLabel="Set up my account" />
    </AuthCard>
  );
}
