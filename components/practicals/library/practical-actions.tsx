"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { ApiError, fetchJson } from "@/lib/fetch-json";
import { ConfirmButton } from "@/components/ui/confirm-button";

function message(e: unknown): string {
  return e instanceof ApiError ? e.message : "Something went wrong. Please try again.";
}

/** Opens the practical's draft for editing (the existing one, or a new copy of the published version). */
export function EditDraftButton({ practicalId, label = "Edit draft", variant = "primary" }: { practicalId: string; label?: string; variant?: "primary" | "secondary" }) {
  const router = useRouter();
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  return (
    <span className="inline-flex flex-col gap-1">
      <Button
        variant={variant}
        disabled={busy}
        onClick={async () => {
          setBusy(true);
          setError(null);
          try {
            const res = await fetchJson<{ versionId: string; created: boolean }>(`/api/practicals/${practicalId}/drafts`, { method: "POST", json: {} });
            router.push(`/practicals/${practicalId}/versions/${res.versionId}/edit`);
          } catch (e) {
            setError(message(e));
            setBusy(false);
          }
        }}
      >
        {busy ? "Opening…" : label}
      </Button>
      <span aria-live="polite" className="text-sm font-semibold text-bad">
        {error}
      </span>
    </span>
  );
}

/** Duplicate and archive/restore for one practical; the server refuses anyone who may not. */
export function PracticalManageActions({ practicalId, title, archived, openAfterDuplicate = true }: { practicalId: string; title: string; archived: boolean; openAfterDuplicate?: boolean }) {
  const router = useRouter();
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const [done, setDone] = useState<string | null>(null);

  const run = async (fn: () => Promise<void>) => {
    setBusy(true);
    setError(null);
    setDone(null);
    try {
      await fn();
    } catch (e) {
      setError(message(e));
    } finally {
      setBusy(false);
    }
  };

  return (
    <div className="flex flex-col gap-1">
      <div className="flex flex-wrap gap-2">
        <Button
          size="sm"
          variant="secondary"
          disabled={busy}
          aria-label={`Duplicate “${title}”`}
          onClick={() =>
            run(async () => {
              const res = await fetchJson<{ practicalId: string; versionId: string }>(`/api/practicals/${practicalId}/duplicate`, { method: "POST", json: {} });
              if (openAfterDuplicate) router.push(`/practicals/${res.practicalId}/versions/${res.versionId}/edit`);
              else {
                setDone(`A copy of “${title}” is in the library.`);
                router.refresh();
              }
            })
          }
        >
          Duplicate
        </Button>
        <ConfirmButton
          tone="caution"
          size="sm"
          variant="secondary"
          label={archived ? "Restore" : "Archive"}
          busy={busy}
          question={
            archived
              ? `Restore “${title}” to the library? Teachers will see it again.`
              : `Archive “${title}”? It leaves the library list (tick “Show archived” to find it). Lab sessions and write-ups that use it are not affected.`
          }
          confirmLabel={archived ? "Yes, restore it" : "Yes, archive it"}
          onConfirm={() =>
            run(async () => {
              await fetchJson(`/api/practicals/${practicalId}`, { method: "PATCH", json: { archived: !archived } });
              setDone(archived ? `“${title}” is back in the library.` : `“${title}” is archived.`);
              router.refresh();
            })
          }
        />
      </div>
      <p aria-live="polite" className="text-sm">
        {error ? <span className="font-semibold text-bad">{error}</span> : done ? <span className="text-good">{done}</span> : null}
      </p>
    </div>
  );
}
