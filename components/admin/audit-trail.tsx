"use client";

import { useQuery } from "@tanstack/react-query";
import { useEffect, useState } from "react";
import { Button } from "@/components/ui/button";
import { EmptyState } from "@/components/ui/empty-state";
import { Field, Select } from "@/components/ui/field";
import { PageHeader } from "@/components/ui/page-header";
import { fetchJson } from "@/lib/fetch-json";
import type { AuditPage } from "./api-types";
import { AuditTable } from "./audit-list";
import { entityLabel } from "./audit-change";
import { LoadError, Loading } from "./query-state";

const PAGE = 100;
const MAX = 1000;

/** The school's audit trail, newest first, filterable by the kind of record. */
export function AuditTrail({ initialType }: { initialType: string }) {
  const [entityType, setEntityType] = useState(initialType);
  const [limit, setLimit] = useState(PAGE);
  useEffect(() => {
    window.history.replaceState(null, "", entityType ? `?entityType=${encodeURIComponent(entityType)}` : window.location.pathname);
  }, [entityType]);
  const trail = useQuery({
    queryKey: ["audit", { entityType, limit }],
    queryFn: () => fetchJson<AuditPage>(`/api/audit?${new URLSearchParams({ ...(entityType ? { entityType } : {}), limit: String(limit) })}`),
    placeholderData: (previous) => previous,
  });
  const types = [...new Set([...(trail.data?.entityTypes ?? []), ...(entityType ? [entityType] : [])])];
  const entries = trail.data?.entries ?? [];
  return (
    <div className="flex flex-col gap-6">
      <PageHeader
        eyebrow="Administration"
        title="Audit trail"
        lead="Every change to people, classes, family links and invitations, with who made it and when. Newest first. Entries cannot be changed or removed."
      />
      <Field id="audit-type" label="Show changes to" className="sm:w-80">
        {(p) => (
          <Select
            {...p}
            value={entityType}
            onChange={(e) => {
              setEntityType(e.target.value);
              setLimit(PAGE);
            }}
          >
            <option value="">Everything</option>
            {types.map((t) => (
              <option key={t} value={t}>
                {t === "user" ? "People" : t === "class" ? "Classes" : entityLabel(t)}
              </option>
            ))}
          </Select>
        )}
      </Field>
      <p aria-live="polite" className="text-sm text-muted">
        {trail.isPending || trail.isError ? "" : `${entries.length} change${entries.length === 1 ? "" : "s"} shown${trail.isFetching ? " (updating…)" : ""}`}
      </p>
      {trail.isPending ? (
        <Loading label="Loading the audit trail…" />
      ) : trail.isError ? (
        <LoadError error={trail.error} what="the audit trail" onRetry={() => trail.refetch()} />
      ) : entries.length === 0 ? (
        <EmptyState title="No changes recorded yet." />
      ) : (
        <>
          <AuditTable entries={entries} names={trail.data.names} caption="Audit trail, newest first" />
          {trail.data.hasMore && limit < MAX ? (
            <div>
              <Button variant="secondary" disabled={trail.isFetching} onClick={() => setLimit((l) => Math.min(l + PAGE, MAX))}>
                {trail.isFetching ? "Loading…" : "Show older changes"}
              </Button>
            </div>
          ) : trail.data.hasMore ? (
            <p className="text-sm text-muted">Showing the latest {MAX} changes. Choose a kind of record above to look further back.</p>
          ) : null}
        </>
      )}
    </div>
  );
}
