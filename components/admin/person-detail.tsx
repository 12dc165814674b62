"use client";

import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import Link from "next/link";
import { useState } from "react";
import { Alert } from "@/components/ui/alert";
import { Badge } from "@/components/ui/badge";
import { Button } from "@/components/ui/button";
import { Card, CardTitle } from "@/components/ui/card";
import { PageHeader } from "@/components/ui/page-header";
import { fetchJson } from "@/lib/fetch-json";
import { ROLE_LABELS } from "@/lib/roles";
import { formatDateTime } from "@/lib/utils";
import type { AuditPage, PersonDetail } from "./api-types";
import { AuditTable } from "./audit-list";
import { ConfirmButton } from "@/components/ui/confirm-button";
import { EraseLeaverCard, ErasedNotice, type Erased } from "./erase-leaver";
import { FamilyLinks } from "./family-links";
import { PersonDetailsForm } from "./person-details-form";
import { errorMessage, LoadError, Loading } from "./query-state";
import { StatusBadge } from "./status-badge";

type Message = { tone: "good" | "bad" | "warn"; text: string } | null;

function statusOf(p: PersonDetail) {
  if (!p.active) return "deactivated" as const;
  if (p.invitation.state === "set-up") return "active" as const;
  if (p.invitation.state === "invited") return "invited" as const;
  return "not-invited" as const;
}

/** Account status, invitations, deactivation: the controls that change whether a person can sign in. */
function AccountCard({ person, isSelf }: { person: PersonDetail; isSelf: boolean }) {
  const queryClient = useQueryClient();
  const [message, setMessage] = useState<Message>(null);
  const refresh = async () => {
    await queryClient.invalidateQueries({ queryKey: ["person", person.id] });
    await queryClient.invalidateQueries({ queryKey: ["people"] });
    await queryClient.invalidateQueries({ queryKey: ["audit"] });
  };
  const invite = useMutation({
    mutationFn: () => fetchJson<{ sent: true; expiresAt: string }>(`/api/users/${person.id}/invitation`, { method: "POST" }),
    onSuccess: async (res) => {
      setMessage({ tone: "good", text: `Invitation sent to ${person.email}. The link works until ${formatDateTime(res.expiresAt)}; any earlier link no longer works.` });
      await refresh();
    },
    onError: (e) => setMessage({ tone: "bad", text: errorMessage(e) }),
  });
  const setActive = useMutation({
    mutationFn: (active: boolean) => fetchJson<{ person: PersonDetail }>(`/api/users/${person.id}`, { method: "PATCH", json: { active } }),
    onSuccess: async ({ person: saved }) => {
      queryClient.setQueryData(["person", person.id], { person: saved });
      setMessage(
        saved.active
          ? { tone: "good", text: `${saved.name}'s account is active again.` }
          : { tone: "warn", text: `${saved.name}'s account is deactivated. They have been signed out and cannot sign in.` },
      );
      await refresh();
    },
    onError: (e) => setMessage({ tone: "bad", text: errorMessage(e) }),
  });

  const inv = person.invitation;
  let statusText: string;
  if (!person.active) statusText = "This account is deactivated: they cannot sign in. Their records and work are kept.";
  else if (inv.state === "set-up") statusText = `They can sign in. Last signed in: ${person.lastSignInAt ? formatDateTime(person.lastSignInAt) : "never"}.`;
  else if (inv.state === "invited") statusText = `Invited on ${formatDateTime(inv.sentAt)}. The link works until ${formatDateTime(inv.expiresAt)}.`;
  else if (inv.state === "expired") statusText = `The invitation sent on ${formatDateTime(inv.sentAt)} expired on ${formatDateTime(inv.expiresAt)}. Send a new one.`;
  else statusText = "Not invited yet: they cannot sign in until they choose a password from an invitation.";

  const canInvite = person.active && inv.state !== "set-up";
  return (
    <Card>
      <CardTitle>Account</CardTitle>
      <div className="flex flex-col gap-3">
        <p className="flex flex-wrap items-center gap-2">
          <StatusBadge status={statusOf(person)} />
          <span>{statusText}</span>
        </p>
        <div className="flex flex-wrap items-start gap-2">
          {canInvite ? (
            inv.state === "invited" ? (
              <ConfirmButton
                variant="secondary"
                label="Send the invitation again"
                question={`Send a new invitation to ${person.email}? The link in the earlier e-mail will stop working.`}
                confirmLabel="Yes, send a new link"
                busy={invite.isPending}
                onConfirm={() => invite.mutate()}
              />
            ) : (
              <Button variant="primary" disabled={invite.isPending} onClick={() => invite.mutate()}>
                {invite.isPending ? "Sending…" : inv.state === "expired" ? "Send a new invitation" : "Send an invitation"}
              </Button>
            )
          ) : null}
          {isSelf ? (
            <p className="text-sm text-muted">This is your own account, so you cannot deactivate it here.</p>
          ) : person.active ? (
            <ConfirmButton
              label="Deactivate account"
              question={`Deactivate ${person.name}'s account? They are signed out at once and cannot sign in until an admin reactivates it. Nothing they have done is deleted.`}
              confirmLabel="Yes, deactivate"
              busy={setActive.isPending}
              onConfirm={() => setActive.mutate(false)}
            />
          ) : (
            <ConfirmButton
              variant="secondary"
              label="Reactivate account"
              question={`Reactivate ${person.name}'s account? They can sign in again with their password${inv.state === "set-up" ? "" : " once they have set one up"}.`}
              confirmLabel="Yes, reactivate"
              busy={setActive.isPending}
              onConfirm={() => setActive.mutate(true)}
            />
          )}
        </div>
        <div aria-live="polite">{message ? <Alert tone={message.tone}>{message.text}</Alert> : null}</div>
      </div>
    </Card>
  );
}

function ClassesCard({ person }: { person: PersonDetail }) {
  const isTeacher = person.roles.includes("teacher");
  const isStudent = person.roles.includes("student");
  if (!isTeacher && !isStudent && !person.teaches.length && !person.studiesIn.length) return null;
  const list = (items: { id: string; name: string }[], empty: string) =>
    items.length ? (
      <ul className="flex flex-wrap gap-2">
        {items.map((c) => (
          <li key={c.id}>
            <Link href={`/admin/classes/${c.id}`} className="inline-block rounded-md border border-line px-3 py-1.5 font-semibold no-underline hover:border-brand">
              {c.name}
            </Link>
          </li>
        ))}
      </ul>
    ) : (
      <p className="text-muted">{empty}</p>
    );
  return (
    <Card>
      <CardTitle>Classes</CardTitle>
      <div className="flex flex-col gap-4">
        {isTeacher || person.teaches.length ? (
          <div>
            <h3 className="mb-1 font-semibold">Teaches</h3>
            {list(person.teaches, "Not teaching any class. Add them as a teacher from a class's page.")}
          </div>
        ) : null}
        {isStudent || person.studiesIn.length ? (
          <div>
            <h3 className="mb-1 font-semibold">Studies in</h3>
            {list(person.studiesIn, "Not in any class yet. Add them from a class's page.")}
          </div>
        ) : null}
      </div>
    </Card>
  );
}

function HistoryCard({ personId }: { personId: string }) {
  const history = useQuery({
    queryKey: ["audit", { entityId: personId }],
    queryFn: () => fetchJson<AuditPage>(`/api/audit?entityId=${encodeURIComponent(personId)}&limit=50`),
  });
  return (
    <Card>
      <CardTitle>History</CardTitle>
      {history.isPending ? (
        <Loading label="Loading history…" />
      ) : history.isError ? (
        <LoadError error={history.error} what="the history" onRetry={() => history.refetch()} />
      ) : history.data.entries.length ? (
        <div className="flex flex-col gap-2">
          <AuditTable entries={history.data.entries} names={history.data.names} caption="Changes to this person, newest first" showSubject={false} />
          {history.data.hasMore ? (
            <p className="text-sm text-muted">
              Showing the latest 50. <Link href="/admin/audit?entityType=user">See the full audit trail</Link>.
            </p>
          ) : null}
        </div>
      ) : (
        <p className="text-muted">No changes recorded yet.</p>
      )}
    </Card>
  );
}

/** One person's admin page. */
export function PersonDetailView({ id, isSelf }: { id: string; isSelf: boolean }) {
  const [erased, setErased] = useState<{ name: string; result: Erased } | null>(null);
  const query = useQuery({ queryKey: ["person", id], queryFn: () => fetchJson<{ person: PersonDetail }>(`/api/users/${encodeURIComponent(id)}`), enabled: !erased });
  const back = (
    <p className="mb-2">
      <Link href="/admin/people">← All people</Link>
    </p>
  );
  if (erased) return <ErasedNotice name={erased.name} result={erased.result} />;
  if (query.isPending) return <>{back}<Loading label="Loading this person…" /></>;
  if (query.isError) return <>{back}<LoadError error={query.error} what="this person" onRetry={() => query.refetch()} /></>;
  const person = query.data.person;
  const isStudent = person.roles.includes("student");
  const isParent = person.roles.includes("parent");
  return (
    <div className="flex flex-col gap-6">
      <div>
        {back}
        <PageHeader
          eyebrow="Person"
          title={person.name}
          lead={
            <span className="flex flex-wrap items-center gap-2">
              <span>{person.email}</span>
              {person.roles.map((r) => (
                <Badge key={r} tone="brand">
                  {ROLE_LABELS[r]}
                </Badge>
              ))}
              {isStudent && person.yearGroup ? <Badge>Year {person.yearGroup}</Badge> : null}
            </span>
          }
        />
      </div>
      <AccountCard person={person} isSelf={isSelf} />
      <Card>
        <CardTitle>Details and roles</CardTitle>
        <PersonDetailsForm person={person} isSelf={isSelf} />
      </Card>
      <ClassesCard person={person} />
      {isStudent || person.guardians.length ? (
        <Card>
          <CardTitle>Parents and guardians</CardTitle>
          <FamilyLinks person={person} side="guardians" />
        </Card>
      ) : null}
      {isParent || person.children.length ? (
        <Card>
          <CardTitle>Children</CardTitle>
          <FamilyLinks person={person} side="children" />
        </Card>
      ) : null}
      <HistoryCard personId={person.id} />
      <EraseLeaverCard person={person} isSelf={isSelf} onErased={(result) => setErased({ name: person.name, result })} />
    </div>
  );
}
