"use client";

import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import Link from "next/link";
import { useState } from "react";
import { Alert } from "@/components/ui/alert";
import { Badge } from "@/components/ui/badge";
import { Button } from "@/components/ui/button";
import { Card, CardTitle } from "@/components/ui/card";
import { EmptyState } from "@/components/ui/empty-state";
import { PageHeader } from "@/components/ui/page-header";
import { Table, Td, Th } from "@/components/ui/table";
import { fetchJson } from "@/lib/fetch-json";
import { AddStudents } from "./add-students";
import type { ClassDetail } from "./api-types";
import { ClassForm } from "./class-form";
import { ConfirmButton } from "@/components/ui/confirm-button";
import { errorMessage, LoadError, Loading } from "./query-state";
import { RosterImport } from "./roster-import";

type Message = { tone: "good" | "bad"; text: string } | null;

function Roster({ cls }: { cls: ClassDetail }) {
  const queryClient = useQueryClient();
  const [message, setMessage] = useState<Message>(null);
  const students = cls.students ?? [];
  const remove = useMutation({
    mutationFn: (s: { id: string; name: string }) => fetchJson(`/api/classes/${cls.id}/students/${s.id}`, { method: "DELETE" }),
    onSuccess: async (_d, s) => {
      setMessage({ tone: "good", text: `${s.name} has been taken out of ${cls.name}. Their account and work are kept.` });
      await queryClient.invalidateQueries({ queryKey: ["class", cls.id] });
      await queryClient.invalidateQueries({ queryKey: ["classes"] });
    },
    onError: (e) => setMessage({ tone: "bad", text: errorMessage(e) }),
  });
  return (
    <div className="flex flex-col gap-3">
      <div aria-live="polite">{message ? <Alert tone={message.tone}>{message.text}</Alert> : null}</div>
      {students.length ? (
        <Table>
          <caption className="sr-only">Students in {cls.name}</caption>
          <thead>
            <tr>
              <Th>Name</Th>
              <Th>E-mail</Th>
              <Th>Year</Th>
              <Th>Parents and guardians</Th>
              <Th>
                <span className="sr-only">Actions</span>
              </Th>
            </tr>
          </thead>
          <tbody>
            {students.map((s) => (
              <tr key={s.id} className={s.active ? undefined : "text-muted"}>
                <Td className="whitespace-nowrap font-semibold">
                  <Link href={`/admin/people/${s.id}`}>{s.name}</Link> {s.active ? null : <Badge>Deactivated</Badge>}
                </Td>
                <Td className="whitespace-nowrap">{s.email}</Td>
                <Td>{s.yearGroup ?? "—"}</Td>
                <Td className="min-w-44">{s.guardians.length ? s.guardians.map((g) => `${g.name} (${g.relationship})`).join(", ") : <span className="text-muted">None linked</span>}</Td>
                <Td className="min-w-40">
                  <ConfirmButton
                    size="sm"
                    label={<>Remove<span className="sr-only"> {s.name}</span></>}
                    question={`Take ${s.name} out of ${cls.name}? Their account, other classes and work are kept.`}
                    confirmLabel="Yes, remove"
                    busy={remove.isPending}
                    onConfirm={() => remove.mutate({ id: s.id, name: s.name })}
                  />
                </Td>
              </tr>
            ))}
          </tbody>
        </Table>
      ) : (
        <EmptyState title="No students in this class yet.">Add students who already have accounts below, or import a roster file.</EmptyState>
      )}
    </div>
  );
}

/** One class's admin page: details and teachers, roster, adding students and roster import. */
export function ClassDetailView({ id }: { id: string }) {
  const queryClient = useQueryClient();
  const [editing, setEditing] = useState(false);
  const [message, setMessage] = useState<Message>(null);
  const query = useQuery({ queryKey: ["class", id], queryFn: () => fetchJson<{ class: ClassDetail }>(`/api/classes/${encodeURIComponent(id)}`) });
  const restore = useMutation({
    mutationFn: (archived: boolean) => fetchJson<{ class: ClassDetail }>(`/api/classes/${id}`, { method: "PATCH", json: { archived } }),
    onSuccess: async ({ class: saved }) => {
      queryClient.setQueryData(["class", id], { class: saved });
      setMessage({ tone: "good", text: saved.archived ? `${saved.name} is archived.` : `${saved.name} is back in use.` });
      await queryClient.invalidateQueries({ queryKey: ["classes"] });
    },
    onError: (e) => setMessage({ tone: "bad", text: errorMessage(e) }),
  });

  const back = (
    <p className="mb-2">
      <Link href="/admin/classes">← All classes</Link>
    </p>
  );
  if (query.isPending) return <>{back}<Loading label="Loading this class…" /></>;
  if (query.isError) return <>{back}<LoadError error={query.error} what="this class" onRetry={() => query.refetch()} /></>;
  const cls = query.data.class;
  const enrolledIds = (cls.students ?? []).map((s) => s.id);

  return (
    <div className="flex flex-col gap-6">
      <div>
        {back}
        <PageHeader
          eyebrow="Class"
          title={cls.name}
          lead={`${cls.subject} · Year ${cls.yearGroup} · ${cls.academicYear} · ${cls.teachers.length ? `Taught by ${cls.teachers.map((t) => t.name).join(" and ")}` : "No teacher yet"}`}
          actions={
            cls.archived ? null : (
              <ConfirmButton
                variant="secondary"
                label="Archive class"
                question={`Archive ${cls.name}? It disappears from everyone's class lists. Its students, work and marks are kept, and you can restore it.`}
                confirmLabel="Yes, archive"
                busy={restore.isPending}
                onConfirm={() => restore.mutate(true)}
              />
            )
          }
        />
      </div>
      <div aria-live="polite">{message ? <Alert tone={message.tone}>{message.text}</Alert> : null}</div>
      {cls.archived ? (
        <Alert tone="warn" title="This class is archived.">
          <p>Teachers and students no longer see it in their lists. Nothing in it has been deleted.</p>
          <Button variant="secondary" size="sm" className="mt-2" disabled={restore.isPending} onClick={() => restore.mutate(false)}>
            Restore this class
          </Button>
        </Alert>
      ) : null}

      <Card>
        <div className="mb-2 flex flex-wrap items-center justify-between gap-2">
          <CardTitle className="mb-0">Details and teachers</CardTitle>
          {editing ? null : (
            <Button variant="secondary" size="sm" onClick={() => setEditing(true)} aria-controls="class-edit">
              Edit details and teachers
            </Button>
          )}
        </div>
        {editing ? (
          <div id="class-edit">
            <ClassForm
              idPrefix="edit-class"
              initial={{ name: cls.name, subject: cls.subject, yearGroup: cls.yearGroup, academicYear: cls.academicYear, teacherIds: cls.teachers.map((t) => t.id) }}
              extraTeachers={cls.teachers}
              submitLabel="Save changes"
              busyLabel="Saving…"
              onCancel={() => setEditing(false)}
              onSubmit={async (values) => {
                const { class: saved } = await fetchJson<{ class: ClassDetail }>(`/api/classes/${id}`, { method: "PATCH", json: values });
                queryClient.setQueryData(["class", id], { class: saved });
                setEditing(false);
                setMessage({ tone: "good", text: "Class details saved." });
                await queryClient.invalidateQueries({ queryKey: ["classes"] });
              }}
            />
          </div>
        ) : (
          <dl className="grid gap-x-6 gap-y-2 sm:grid-cols-[max-content_1fr]">
            <dt className="font-semibold">Subject</dt>
            <dd>{cls.subject}</dd>
            <dt className="font-semibold">Year group</dt>
            <dd>Year {cls.yearGroup}</dd>
            <dt className="font-semibold">Academic year</dt>
            <dd>{cls.academicYear}</dd>
            <dt className="font-semibold">Teachers</dt>
            <dd>
              {cls.teachers.length ? (
                cls.teachers.map((t, i) => (
                  <span key={t.id}>
                    {i ? ", " : ""}
                    <Link href={`/admin/people/${t.id}`}>{t.name}</Link>
                  </span>
                ))
              ) : (
                <Badge tone="warn">No teacher yet</Badge>
              )}
            </dd>
          </dl>
        )}
      </Card>

      <section aria-labelledby="roster-heading" className="flex flex-col gap-3">
        <h2 id="roster-heading" className="text-xl font-bold">
          Students ({enrolledIds.length})
        </h2>
        <Roster cls={cls} />
      </section>

      <Card>
        <CardTitle>Add students who already have accounts</CardTitle>
        <AddStudents classId={cls.id} className={cls.name} enrolledIds={enrolledIds} />
      </Card>

      <Card>
        <CardTitle>Import a roster file</CardTitle>
        <RosterImport classId={cls.id} className={cls.name} />
      </Card>
    </div>
  );
}
