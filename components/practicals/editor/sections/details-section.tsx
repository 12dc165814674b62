"use client";

import type { Draft } from "../../draft";
import { SelectField, TextField } from "../fields";
import type { Change } from "../state";

const SUBJECTS = ["Chemistry", "Physics", "Biology", "Combined science"] as const;

export function DetailsSection({ draft, change, topics }: { draft: Draft; change: Change; topics: string[] }) {
  const subjects = SUBJECTS.includes(draft.subject as (typeof SUBJECTS)[number]) ? SUBJECTS : ([draft.subject, ...SUBJECTS] as const);
  return (
    <div className="grid gap-4 sm:grid-cols-2">
      <TextField path="title" label="Title" hint="What students and colleagues will see in lists." value={draft.title} onChange={(title) => change((d) => ({ ...d, title }))} className="sm:col-span-2" />
      <TextField
        path="topic"
        label="Topic"
        hint="Practicals with the same topic are grouped together."
        value={draft.topic}
        onChange={(topic) => change((d) => ({ ...d, topic }))}
        inputProps={{ list: "editor-topics", autoComplete: "off" }}
      />
      <datalist id="editor-topics">
        {topics.map((t) => (
          <option key={t} value={t} />
        ))}
      </datalist>
      <SelectField
        path="subject"
        label="Subject"
        value={draft.subject}
        options={subjects.map((s) => ({ value: s, label: s }))}
        onChange={(subject) => change((d) => ({ ...d, subject }))}
      />
      <SelectField
        path="yearGroup"
        label="Year group"
        value={String(draft.yearGroup)}
        options={[7, 8, 9, 10, 11, 12, 13].map((y) => ({ value: String(y), label: `Year ${y}` }))}
        onChange={(y) => change((d) => ({ ...d, yearGroup: Number(y) }))}
      />
    </div>
  );
}
