"use client";

import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import Link from "next/link";
import { useEffect, useRef, useState, type ReactNode } from "react";
import { Alert } from "@/components/ui/alert";
import { Badge } from "@/components/ui/badge";
import { buttonClasses } from "@/components/ui/button";
import { Card } from "@/components/ui/card";
import { EmptyState } from "@/components/ui/empty-state";
import { PageHeader } from "@/components/ui/page-header";
import { Table, Td, Th } from "@/components/ui/table";
import { fetchJson } from "@/lib/fetch-json";
import type { ClassRow } from "./api-types";
import { academicYearOf, ClassForm } from "./class-form";
import { ConfirmButton } from "@/components/ui/confirm-button";
import { errorMessage, LoadError, Loading } from "./query-state";

/** All classes, with a form to create one and archive / restore buttons. */
export function ClassList() {
  const queryClient = useQueryClient();
  const [showArchived, setShowArchived] = useState(false);
  const [creating, setCreating] = useState(false);
  const [message, setMessage] = useState<{ tone: "good" | "bad"; text: ReactNode } | null>(null);
  const heading = useRef<HTMLHeadingElement>(null);
  useEffect(() => {
    if (creating) heading.current?.focus();
  }, [creating]);

  const classes = useQuery({
    queryKey: ["classes", { archived: showArchived }],
    queryFn: () => fetchJson<{ classes: ClassRow[] }>(`/api/classes${showArchived ? "?archived=include" : ""}`),
    placeholderData: (previous) => previous,
  });

  const archive = useMutation({
    mutationFn: ({ id, archived }: { id: string; name: string; archived: boolean }) => fetchJson(`/api/classes/${id}`, { method: "PATCH", json: { archived } }),
    onSuccess: async (_d, v) => {
      setMessage({ tone: "good", text: v.archived ? `${v.name} is archived. It is hidden from teachers' and students' lists; nothing in it is deleted.` : `${v.name} is back in use.` });
      await queryClient.invalidateQueries({ queryKey: ["classes"] });
      await queryClient.invalidateQueries({ queryKey: ["class", v.id] });
    },
    onError: (e) => setMessage({ tone: "bad", text: errorMessage(e) }),
  });

  const list = classes.data?.classes ?? [];
  return (
    <div className="flex flex-col gap-6">
      <PageHeader
        eyebrow="Administration"
        title="Classes"
        lead="Every teaching group in the school, with its teachers and students."
        actions={
          <button type="button" className={buttonClasses(creating ? "secondary" : "primary")} aria-expanded={creating} aria-controls="create-class" onClick={() => setCreating((c) => !c)}>
            {creating ? "Close the form" : "Create a class"}
          </button>
        }
      />
      {creating ? (
        <Card id="create-class">
          <h2 ref={heading} tabIndex={-1} className="mb-3 text-lg font-bold">
            Create a class
          </h2>
          <ClassForm
            idPrefix="new-class"
            initial={{ name: "", subject: "", yearGroup: undefined, academicYear: academicYearOf(new Date()), teacherIds: [] }}
            submitLabel="Create class"
            busyLabel="Creating…"
            onCancel={() => setCreating(false)}
            onSubmit={async (values) => {
              const { id } = await fetchJson<{ id: string }>("/api/classes", { method: "POST", json: values });
              setCreating(false);
              setMessage({
                tone: "good",
                text: (
                  <>
                    {values.name} has been created. <Link href={`/admin/classes/${id}`}>Open it to add students or import a roster</Link>.
                  </>
                ),
              });
              await queryClient.invalidateQueries({ queryKey: ["classes"] });
            }}
          />
        </Card>
      ) : null}

      <div aria-live="polite">{message ? <Alert tone={message.tone}>{message.text}</Alert> : null}</div>

      <section aria-labelledby="class-list-heading" className="flex flex-col gap-3">
        <div className="flex flex-wrap items-center justify-between gap-2">
          <h2 id="class-list-heading" className="text-xl font-bold">
            {showArchived ? "All classes, including archived ones" : "Classes in use"}
          </h2>
          <label htmlFor="show-archived" className="flex min-h-11 cursor-pointer items-center gap-2">
            <input id="show-archived" type="checkbox" className="size-5 accent-brand" checked={showArchived} onChange={(e) => setShowArchived(e.target.checked)} />
            Show archived classes
          </label>
        </div>
        {classes.isPending ? (
          <Loading label="Loading classes…" />
        ) : classes.isError ? (
          <LoadError error={classes.error} what="the classes" onRetry={() => classes.refetch()} />
        ) : list.length === 0 ? (
          <EmptyState title="There are no classes yet.">Create a class, then add its students one by one or import a roster file.</EmptyState>
        ) : (
          <Table>
            <caption className="sr-only">Classes by year group and name</caption>
            <thead>
              <tr>
                <Th>Class</Th>
                <Th>Subject</Th>
                <Th>Year</Th>
                <Th>Academic year</Th>
                <Th>Teachers</Th>
                <Th>Students</Th>
                <Th>
                  <span className="sr-only">Actions</span>
                </Th>
              </tr>
            </thead>
            <tbody>
              {list.map((c) => (
                <tr key={c.id} className={c.archived ? "text-muted" : undefined}>
                  <Td className="whitespace-nowrap font-semibold">
                    <Link href={`/admin/classes/${c.id}`}>{c.name}</Link> {c.archived ? <Badge>Archived</Badge> : null}
                  </Td>
                  <Td>{c.subject}</Td>
                  <Td>{c.yearGroup}</Td>
                  <Td className="whitespace-nowrap">{c.academicYear}</Td>
                  <Td className="min-w-40">{c.teachers.length ? c.teachers.map((t) => t.name).join(", ") : <Badge tone="warn">No teacher</Badge>}</Td>
                  <Td>{c.studentCount}</Td>
                  <Td className="min-w-40">
                    {c.archived ? (
                      <button
                        type="button"
                        className={buttonClasses("secondary", "sm")}
                        disabled={archive.isPending}
                        onClick={() => archive.mutate({ id: c.id, name: c.name, archived: false })}
                      >
                        Restore<span className="sr-only"> {c.name}</span>
                      </button>
                    ) : (
                      <ConfirmButton
                        size="sm"
                        variant="secondary"
                        label={<>Archive<span className="sr-only"> {c.name}</span></>}
                        question={`Archive ${c.name}? It disappears from everyone's class lists. Its students, work and marks are kept, and you can restore it.`}
                        confirmLabel="Yes, archive"
                        busy={archive.isPending}
                        onConfirm={() => archive.mutate({ id: c.id, name: c.name, archived: true })}
                      />
                    )}
                  </Td>
                </tr>
              ))}
            </tbody>
          </Table>
        )}
      </section>
    </div>
  );
}
