"use client";

import { signIn } from "next-auth/react";
import Link from "next/link";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { Field, Input } from "@/components/ui/field";

function safeCallback(url: string | undefined): string {
  return url && url.startsWith("/") && !url.startsWith("//") ? url : "/";
}

export function SignInForm({ callbackUrl, initialEmail, notice }: { callbackUrl?: string; initialEmail?: string; notice?: string }) {
  const router = useRouter();
  const [email, setEmail] = useState(initialEmail ?? "");
  const [password, setPassword] = useState("");
  const [error, setError] = useState<string | null>(null);
  const [fieldErrors, setFieldErrors] = useState<{ email?: string; password?: string }>({});
  const [busy, setBusy] = useState(false);

  async function onSubmit(e: React.FormEvent) {
    e.preventDefault();
    const fe: typeof fieldErrors = {};
    if (!email.trim()) fe.email = "Enter your e-mail address.";
    if (!password) fe.password = "Enter your password.";
    setFieldErrors(fe);
    if (fe.email || fe.password) return;
    setBusy(true);
    setError(null);
    const res = await signIn("credentials", { email: email.trim(), password, redirect: false });
    if (!res || res.error) {
      setBusy(false);
      setError(
        res?.error === "RateLimited"
          ? "Too many attempts for this account. Wait 15 minutes, or use “Forgot your password?”."
          : res?.error === "CredentialsSignin" || !res
            ? "That e-mail and password do not match an account. Check them and try again."
            : "Signing in did not work just now. Please try again.",
      );
      return;
    }
    router.replace(safeCallback(callbackUrl));
    router.refresh();
  }

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4" aria-describedby={error ? "sign-in-error" : undefined}>
      {notice ? <Alert tone="good">{notice}</Alert> : null}
      {error ? (
        <div id="sign-in-error">
          <Alert tone="bad">{error}</Alert>
        </div>
      ) : null}
      <Field id="email" label="E-mail" error={fieldErrors.email}>
        {(p) => <Input {...p} type="email" name="email" autoComplete="username" inputMode="email" value={email} onChange={(e) => setEmail(e.target.value)} />}
      </Field>
      <Field id="password" label="Password" error={fieldErrors.password}>
        {(p) => <Input {...p} type="password" name="password" autoComplete="current-password" value={password} onChange={(e) => setPassword(e.target.value)} />}
      </Field>
      <Button type="submit" disabled={busy} className="w-full">
        {busy ? "Signing in…" : "Sign in"}
      </Button>
      <p className="text-center">
        <Link href="/forgot-password">Forgot your password?</Link>
      </p>
    </form>
  );
}
