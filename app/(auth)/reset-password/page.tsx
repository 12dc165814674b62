import type { Metadata } from "next";
import Link from "next/link";
import { AuthCard } from "@/components/auth/auth-card";
import { ChoosePasswordForm } from "@/components/auth/choose-password-form";
import { Alert } from "@/components/ui/alert";
import { previewToken } from "@/db/queries/invitations";

export const metadata: Metadata = { title: "Choose a new password" };

export default async function ResetPasswordPage({ searchParams }: PageProps<"/reset-password">) {
  const raw = (await searchParams).token;
  const token = (Array.isArray(raw) ? raw[0] : raw) ?? "";
  const preview = token ? previewToken({ token, kind: "password-reset" }) : null;
  if (!preview || !preview.ok) {
    return (
      <AuthCard title="This link does not work">
        <Alert tone="bad">{preview?.message ?? "The link has no token. Copy the whole link from the e-mail."}</Alert>
        <p className="mt-4 text-center">
          <Link href="/forgot-password">Ask for a new link</Link>
        </p>
      </AuthCard>
    );
  }
  return (
    <AuthCard title="Choose a new password" lead={<>For {preview.email}.</>}>
      <ChoosePasswordForm token={token} endpoint="/api/password-reset/confirm" submitLabel="Save my new password" />
    </AuthCard>
  );
}
