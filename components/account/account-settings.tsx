"use client";

import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { useState } from "react";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { Card, CardTitle } from "@/components/ui/card";
import { Field, Input } from "@/components/ui/field";
import { ApiError, fetchJson } from "@/lib/fetch-json";

type Account = { name: string; email: string; emailNotifications: boolean; roles: string[] };

export function AccountSettings() {
  const qc = useQueryClient();
  const account = useQuery({ queryKey: ["me"], queryFn: () => fetchJson<Account>("/api/me") });
  const prefs = useMutation({
    mutationFn: (emailNotifications: boolean) => fetchJson<Account>("/api/me", { method: "PATCH", json: { emailNotifications } }),
    onSuccess: (data) => qc.setQueryData(["me"], data),
  });

  const [form, setForm] = useState({ current: "", password: "", confirm: "" });
  const [errors, setErrors] = useState<Record<string, string[]>>({});
  const password = useMutation({
    mutationFn: () => fetchJson<{ message: string }>("/api/me/password", { method: "POST", json: form }),
    onSuccess: () => {
      setForm({ current: "", password: "", confirm: "" });
      setErrors({});
    },
    onError: (e) => setErrors(e instanceof ApiError ? e.fieldErrors : {}),
  });

  if (account.isPending) return <p aria-live="polite">Loading your account…</p>;
  if (account.isError) return <Alert tone="bad">{account.error.message}</Alert>;
  const a = account.data;
  return (
    <div className="grid gap-4 lg:grid-cols-2">
      <Card>
        <CardTitle>E-mail from Meniscus</CardTitle>
        <p className="mb-3 text-muted">
          Signed in as <strong className="text-ink">{a.email}</strong>.
        </p>
        <label className="flex items-start gap-3">
          <input
            type="checkbox"
            className="mt-1 size-5 accent-[var(--brand)]"
            checked={a.emailNotifications}
            disabled={prefs.isPending}
            onChange={(e) => prefs.mutate(e.target.checked)}
          />
          <span>
            <span className="font-semibold">Send me e-mails</span>
            <span className="block text-sm text-muted">When marked work is returned and when a progress report is ready. Invitations and password links are always sent.</span>
          </span>
        </label>
        <div aria-live="polite" className="mt-2 text-sm">
          {prefs.isSuccess ? <span className="text-good">Saved.</span> : null}
          {prefs.isError ? <span className="text-bad">{prefs.error.message}</span> : null}
        </div>
      </Card>
      <Card>
        <CardTitle>Change your password</CardTitle>
        <form
          noValidate
          className="flex flex-col gap-3"
          onSubmit={(e) => {
            e.preventDefault();
            password.mutate();
          }}
        >
          {password.isSuccess ? <Alert tone="good">{password.data.message}</Alert> : null}
          {password.isError && !Object.keys(errors).length ? <Alert tone="bad">{password.error.message}</Alert> : null}
          <Field id="current" label="Current password" error={errors.current}>
            {(p) => <Input {...p} type="password" autoComplete="current-password" value={form.current} onChange={(e) => setForm({ ...form, current: e.target.value })} />}
          </Field>
          <Field id="new-password" label="New password" hint="At least 10 characters." error={errors.password}>
            {(p) => <Input {...p} type="password" autoComplete="new-password" value={form.password} onChange={(e) => setForm({ ...form, password: e.target.value })} />}
          </Field>
          <Field id="confirm" label="Type it again" error={errors.confirm}>
            {(p) => <Input {...p} type="password" autoComplete="new-password" value={form.confirm} onChange={(e) => setForm({ ...form, confirm: e.target.value })} />}
          </Field>
          <Button type="submit" disabled={password.isPending}>
            {password.isPending ? "Saving…" : "Change password"}
          </Button>
        </form>
      </Card>
    </div>
  );
}
