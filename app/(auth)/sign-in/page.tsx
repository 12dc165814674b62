import type { Metadata } from "next";
import { redirect } from "next/navigation";
import { AuthCard } from "@/components/auth/auth-card";
import { SignInForm } from "@/components/auth/sign-in-form";
import { currentActor } from "@/lib/auth/guards";

export const metadata: Metadata = { title: "Sign in" };

const NOTICES: Record<string, string> = {
  signedOut: "You have signed out.",
  passwordSet: "Your password is set. Sign in with it now.",
};

export default async function SignInPage({ searchParams }: PageProps<"/sign-in">) {
  const sp = await searchParams;
  const first = (v: string | string[] | undefined) => (Array.isArray(v) ? v[0] : v);
  if (await currentActor()) redirect("/");
  const notice = first(sp.signedOut) ? NOTICES.signedOut : first(sp.passwordSet) ? NOTICES.passwordSet : undefined;
  return (
    <AuthCard title="Sign in" lead="Use the e-mail address your school gave Meniscus.">
      <SignInForm callbackUrl={first(sp.callbackUrl)} initialEmail={first(sp.email)} notice={notice} />
    </AuthCard>
  );
}
