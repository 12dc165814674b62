import type { Metadata } from "next";
import Link from "next/link";
import { AuthCard } from "@/components/auth/auth-card";
import { ForgotPasswordForm } from "@/components/auth/forgot-password-form";

export const metadata: Metadata = { title: "Forgot your password?" };

export default function ForgotPasswordPage() {
  return (
    <AuthCard title="Forgot your password?" lead="Enter the e-mail address you sign in with. We will send a link to choose a new password.">
      <ForgotPasswordForm />
      <p className="mt-4 text-center">
        <Link href="/sign-in">Back to sign in</Link>
      </p>
    </AuthCard>
  );
}
