"use client";

import { useState } from "react";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { Field, Input } from "@/components/ui/field";
import { ApiError, fetchJson } from "@/lib/fetch-json";

export function ForgotPasswordForm() {
  const [email, setEmail] = useState("");
  const [done, setDone] = useState<string | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [fieldError, setFieldError] = useState<string[] | undefined>();
  const [busy, setBusy] = useState(false);

  async function onSubmit(e: React.FormEvent) {
    e.preventDefault();
    setBusy(true);
    setError(null);
    setFieldError(undefined);
    try {
      const res = await fetchJson<{ message: string }>("/api/password-reset/request", { method: "POST", json: { email } });
      setDone(res.message);
    } catch (err) {
      if (err instanceof ApiError && err.fieldErrors.email) setFieldError(err.fieldErrors.email);
      else setError(err instanceof Error ? err.message : "Something went wrong.");
    } finally {
      setBusy(false);
    }
  }

  if (done) return <Alert tone="good">{done}</Alert>;
  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
      {error ? <Alert tone="bad">{error}</Alert> : null}
      <Field id="email" label="E-mail" error={fieldError}>
        {(p) => <Input {...p} type="email" autoComplete="username" inputMode="email" value={email} onChange={(e) => setEmail(e.target.value)} />}
      </Field>
      <Button type="submit" disabled={busy} className="w-full">
        {busy ? "Sending…" : "Send me a link"}
      </Button>
    </form>
  );
}
