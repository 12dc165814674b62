"use client";

import { Table, Td, Th } from "@/components/ui/table";
import { formatDateTime } from "@/lib/utils";
import type { AuditEntry } from "./api-types";
import { actionLabel, AuditChange, AuditSubject } from "./audit-change";

/** A table of audit entries: when, who, what was done, to what, and the change. */
export function AuditTable({ entries, names, caption, showSubject = true }: { entries: AuditEntry[]; names: Record<string, string>; caption: string; showSubject?: boolean }) {
  return (
    <Table>
      <caption className="sr-only">{caption}</caption>
      <thead>
        <tr>
          <Th>When</Th>
          <Th>Who</Th>
          <Th>What happened</Th>
          {showSubject ? <Th>About</Th> : null}
          <Th>Change</Th>
        </tr>
      </thead>
      <tbody>
        {entries.map((e) => (
          <tr key={e.id}>
            <Td className="whitespace-nowrap">{formatDateTime(e.at)}</Td>
            <Td className="whitespace-nowrap">{e.actorName ?? <span className="text-muted">Meniscus</span>}</Td>
            <Td className="min-w-44">{actionLabel(e.action)}</Td>
            {showSubject ? (
              <Td className="min-w-36">
                <AuditSubject entry={e} names={names} />
              </Td>
            ) : null}
            <Td className="min-w-64">
              <AuditChange entry={e} names={names} />
            </Td>
          </tr>
        ))}
      </tbody>
    </Table>
  );
}
