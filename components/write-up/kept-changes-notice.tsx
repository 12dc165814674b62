"use client";

import { useEffect, useState } from "react";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import type { GroupTables, WriteUpContent } from "@/lib/validation/write-ups";
import { clearLocalDraft, draftOffer, readLocalDraft } from "@/lib/write-ups/local-draft";
import { isGroupTables, isWriteUpContent } from "./content-helpers";

/**
 * On a write-up that can no longer be changed (handed in, or the lab session closed): says so
 * when this device still holds changes that never reached Meniscus, keeps them unless the
 * student removes them, and would offer them back if a teacher reopens the write-up.
 */
export function KeptChangesNotice({ writeUpId, server }: { writeUpId: string; server: { revision: number; updatedAt: string; content: WriteUpContent; tables: GroupTables; groupRevision: number | null } }) {
  const [found, setFound] = useState(false);
  useEffect(() => {
    const content = readLocalDraft(writeUpId, "content", isWriteUpContent);
    const tables = readLocalDraft(writeUpId, "group-tables", isGroupTables);
    const differs =
      draftOffer(content, { revision: server.revision, updatedAt: server.updatedAt, content: server.content }) !== null ||
      (server.groupRevision !== null && draftOffer(tables, { revision: server.groupRevision, updatedAt: null, content: server.tables }) !== null);
    // localStorage exists only in the browser, after the first render.
    // eslint-disable-next-line react-hooks/set-state-in-effect -- depends on this device's storage, unknown to the server render
    setFound(differs);
  }, [writeUpId, server]);

  if (!found) return null;
  return (
    <Alert tone="warn" title="Changes on this device were not saved">
      <p>This device holds changes that never reached Meniscus before the write-up was locked, so they are not part of it. They stay on this device in case your teacher reopens it.</p>
      <Button
        variant="secondary"
        size="sm"
        className="mt-2"
        onClick={() => {
          clearLocalDraft(writeUpId, "content");
          clearLocalDraft(writeUpId, "group-tables");
          setFound(false);
        }}
      >
        Remove them from this device
      </Button>
    </Alert>
  );
}
