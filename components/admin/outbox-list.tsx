"use client";

import { useQuery } from "@tanstack/react-query";
import Link from "next/link";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { EmptyState } from "@/components/ui/empty-state";
import { Field, Input } from "@/components/ui/field";
import { PageHeader } from "@/components/ui/page-header";
import { Table, Td, Th } from "@/components/ui/table";
import { fetchJson } from "@/lib/fetch-json";
import { formatDateTime } from "@/lib/utils";
import type { OutboxRow } from "./api-types";
import { LoadError, Loading } from "./query-state";
import { useDebouncedValue } from "./use-debounced-value";

export function formatSize(bytes: number): string {
  return bytes < 1024 ? `${bytes} bytes` : bytes < 1024 * 1024 ? `${Math.round(bytes / 1024)} kB` : `${(bytes / 1024 / 1024).toFixed(1)} MB`;
}

/** The mail catcher's outbox: every message Meniscus sent, newest first, filterable by recipient. */
export function OutboxList({ initialTo }: { initialTo: string }) {
  const [to, setTo] = useState(initialTo);
  const term = useDebouncedValue(to.trim(), 250);
  const messages = useQuery({
    queryKey: ["outbox", term],
    queryFn: () => fetchJson<{ messages: OutboxRow[] }>(`/api/outbox${term ? `?to=${encodeURIComponent(term)}` : ""}`),
    placeholderData: (previous) => previous,
    refetchInterval: 15_000,
  });
  const list = messages.data?.messages ?? [];
  return (
    <div className="flex flex-col gap-6">
      <PageHeader
        eyebrow="Administration"
        title="Outbox"
        lead="E-mails Meniscus has sent, caught here instead of being delivered, so that you can read them: for example to follow an invitation link while trying Meniscus out. Once your school connects a real mail server, messages are delivered and no longer appear here."
      />
      <form role="search" className="flex flex-col gap-3 sm:flex-row sm:items-end" onSubmit={(e) => e.preventDefault()}>
        <Field id="outbox-to" label="Recipient" hint="Part of an e-mail address" className="sm:w-96">
          {(p) => <Input {...p} type="search" inputMode="email" value={to} onChange={(e) => setTo(e.target.value)} />}
        </Field>
        <Button variant="secondary" onClick={() => messages.refetch()} disabled={messages.isFetching}>
          {messages.isFetching ? "Checking…" : "Check for new mail"}
        </Button>
      </form>
      <p aria-live="polite" className="text-sm text-muted">
        {messages.isPending ? "" : messages.isError ? "" : `${list.length} message${list.length === 1 ? "" : "s"}${list.length >= 100 ? " (the latest 100)" : ""}`}
      </p>
      {messages.isPending ? (
        <Loading label="Loading the outbox…" />
      ) : messages.isError ? (
        <LoadError error={messages.error} what="the outbox" onRetry={() => messages.refetch()} />
      ) : list.length === 0 ? (
        <EmptyState title={term ? "No messages to that address." : "No e-mails yet."}>
          {term ? "Check the spelling, or clear the recipient box." : "Invitations, password resets and other e-mails will appear here as soon as they are sent."}
        </EmptyState>
      ) : (
        <Table>
          <caption className="sr-only">Caught e-mails, newest first</caption>
          <thead>
            <tr>
              <Th>To</Th>
              <Th>Subject</Th>
              <Th>Sent</Th>
              <Th>Attachments</Th>
            </tr>
          </thead>
          <tbody>
            {list.map((m) => (
              <tr key={m.id}>
                <Td className="whitespace-nowrap">{m.to}</Td>
                <Td className="min-w-56 font-semibold">
                  <Link href={`/admin/outbox/${m.id}`}>{m.subject}</Link>
                </Td>
                <Td className="whitespace-nowrap">{formatDateTime(m.receivedAt)}</Td>
                <Td className="min-w-32">{m.attachments.length ? m.attachments.map((a) => `${a.filename} (${formatSize(a.size)})`).join(", ") : <span className="text-muted">None</span>}</Td>
              </tr>
            ))}
          </tbody>
        </Table>
      )}
    </div>
  );
}
