"use client";

import { useMutation } from "@tanstack/react-query";
import { useRouter } from "next/navigation";
import { useEffect, useRef, useState } from "react";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { ApiError, fetchJson } from "@/lib/fetch-json";
import type { LabSessionInput } from "@/lib/validation/practicals";
import { ConfirmButton } from "@/components/ui/confirm-button";
import { valuesFromSession } from "./form-values";
import { LabSessionForm } from "./lab-session-form";

/** The session as the server sent it, with dates as ISO strings. */
export type EditableSession = Omit<LabSessionInput, "opensAt" | "dueAt"> & { id: string; opensAt: string; dueAt: string };

/**
 * A teacher's controls on a lab session page: change the dates, groups and rules in place, or
 * cancel it (kept for the record; students stop seeing it).
 */
export function ManageLabSession({ session, className, practicalTitle, cancelled }: { session: EditableSession; className: string; practicalTitle: string; cancelled: boolean }) {
  const router = useRouter();
  const [editing, setEditing] = useState(false);
  const [status, setStatus] = useState("");
  const editButton = useRef<HTMLButtonElement>(null);
  const heading = useRef<HTMLHeadingElement>(null);
  const wasEditing = useRef(false);

  useEffect(() => {
    if (editing) heading.current?.focus();
    else if (wasEditing.current) editButton.current?.focus();
    wasEditing.current = editing;
  }, [editing]);

  const cancel = useMutation({
    mutationFn: () => fetchJson(`/api/lab-sessions/${encodeURIComponent(session.id)}`, { method: "DELETE" }),
    onSuccess: () => {
      setStatus("The lab session is cancelled. Students no longer see it.");
      router.refresh();
    },
  });

  if (cancelled) return null;
  return (
    <section aria-label="Change or cancel this lab session" className="flex flex-col gap-3 no-print">
      <p className="sr-only" aria-live="polite">
        {status}
      </p>
      {status && !editing ? <Alert tone="good">{status}</Alert> : null}
      {cancel.isError ? (
        <Alert tone="bad" title="The lab session was not cancelled">
          {cancel.error instanceof ApiError ? cancel.error.message : "Something went wrong. Please try again."}
        </Alert>
      ) : null}
      {editing ? (
        <div className="rounded-lg border border-brand/40 bg-surface p-4 sm:p-5">
          <h2 ref={heading} tabIndex={-1} className="mb-4 text-xl font-bold">
            Change dates, groups or rules
          </h2>
          <LabSessionForm
            mode="edit"
            labSessionId={session.id}
            className={className}
            practicalTitle={practicalTitle}
            initial={valuesFromSession(session)}
            onDone={(saved) => {
              setEditing(false);
              setStatus(saved ? "Changes saved." : "");
            }}
          />
        </div>
      ) : (
        <div className="flex flex-wrap items-start gap-2">
          <Button ref={editButton} variant="secondary" onClick={() => { setStatus(""); setEditing(true); }}>
            Change dates, groups or rules
          </Button>
          <ConfirmButton
            label="Cancel this lab session"
            question={`Cancel this lab session for ${className}? Students will no longer see it. It stays in the record, but it cannot be reopened.`}
            confirmLabel="Yes, cancel it"
            backOutLabel="No, keep it"
            busy={cancel.isPending}
            onConfirm={() => cancel.mutate()}
          />
        </div>
      )}
    </section>
  );
}
