"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { Field, Input } from "@/components/ui/field";
import { ApiError, fetchJson } from "@/lib/fetch-json";

/** Sets a password from an invitation or reset link, then sends the person to sign in. */
export function ChoosePasswordForm({ token, endpoint, submitLabel }: { token: string; endpoint: string; submitLabel: string }) {
  const router = useRouter();
  const [password, setPassword] = useState("");
  const [confirm, setConfirm] = useState("");
  const [errors, setErrors] = useState<Record<string, string[]>>({});
  const [message, setMessage] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  async function onSubmit(e: React.FormEvent) {
    e.preventDefault();
    setBusy(true);
    setMessage(null);
    setErrors({});
    try {
      const { email } = await fetchJson<{ email: string }>(endpoint, { method: "POST", json: { token, password, confirm } });
      router.replace(`/sign-in?passwordSet=1&email=${encodeURIComponent(email)}`);
    } catch (err) {
      setBusy(false);
      if (err instanceof ApiError) {
        setErrors(err.fieldErrors);
        setMessage(Object.keys(err.fieldErrors).length ? null : err.message);
      } else setMessage("Something went wrong. Please try again.");
    }
  }

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
      {message ? <Alert tone="bad">{message}</Alert> : null}
      <Field id="password" label="New password" hint="At least 10 characters. A short sentence is easy to remember and hard to guess." error={errors.password}>
        {(p) => <Input {...p} type="password" autoComplete="new-password" value={password} onChange={(e) => setPassword(e.target.value)} />}
      </Field>
      <Field id="confirm" label="Type it again" error={errors.confirm}>
        {(p) => <Input {...p} type="password" autoComplete="new-password" value={confirm} onChange={(e) => setConfirm(e.target.value)} />}
      </Field>
      <Button type="submit" disabled={busy} className="w-full">
        {busy ? "Saving…" : submitLabel}
      </Button>
    </form>
  );
}
