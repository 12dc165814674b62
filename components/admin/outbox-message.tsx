"use client";

import { useQuery } from "@tanstack/react-query";
import Link from "next/link";
import { Card } from "@/components/ui/card";
import { PageHeader } from "@/components/ui/page-header";
import { fetchJson } from "@/lib/fetch-json";
import { formatDateTime } from "@/lib/utils";
import type { OutboxMessage } from "./api-types";
import { LinkedText } from "./linked-text";
import { formatSize } from "./outbox-list";
import { LoadError, Loading } from "./query-state";

/** One caught e-mail: its headers and its plain-text body, with addresses as links. */
export function OutboxMessageView({ id }: { id: string }) {
  const query = useQuery({ queryKey: ["outbox-message", id], queryFn: () => fetchJson<{ message: OutboxMessage }>(`/api/outbox/${encodeURIComponent(id)}`) });
  const back = (
    <p className="mb-2">
      <Link href="/admin/outbox">← Outbox</Link>
    </p>
  );
  if (query.isPending) return <>{back}<Loading label="Loading the message…" /></>;
  if (query.isError) return <>{back}<LoadError error={query.error} what="this message" onRetry={() => query.refetch()} /></>;
  const m = query.data.message;
  return (
    <div className="flex flex-col gap-4">
      <div>
        {back}
        <PageHeader eyebrow="E-mail" title={m.subject} />
      </div>
      <Card>
        <dl className="grid gap-x-6 gap-y-1 sm:grid-cols-[max-content_1fr]">
          <dt className="font-semibold">From</dt>
          <dd className="break-all">{m.from}</dd>
          <dt className="font-semibold">To</dt>
          <dd className="break-all">{m.to}</dd>
          <dt className="font-semibold">Sent</dt>
          <dd>{formatDateTime(m.receivedAt)}</dd>
          <dt className="font-semibold">Attachments</dt>
          <dd>
            {m.attachments.length ? (
              <ul>
                {m.attachments.map((a, i) => (
                  <li key={`${a.filename}-${i}`}>
                    {a.filename} <span className="text-muted">({a.contentType}, {formatSize(a.size)})</span>
                  </li>
                ))}
              </ul>
            ) : (
              <span className="text-muted">None</span>
            )}
          </dd>
        </dl>
      </Card>
      <section aria-labelledby="message-body-heading">
        <h2 id="message-body-heading" className="mb-2 text-lg font-bold">
          Message
        </h2>
        <div className="rounded-lg border border-line bg-surface p-4 whitespace-pre-wrap break-words sm:p-5">{m.text ? <LinkedText text={m.text} /> : <span className="text-muted">This message has no text.</span>}</div>
        <p className="mt-2 text-sm text-muted">The plain-text version of the e-mail is shown. Links open here in Meniscus, as they would from the recipient&apos;s inbox.</p>
      </section>
    </div>
  );
}
