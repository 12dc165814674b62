"use client";

import { useMutation, useQuery } from "@tanstack/react-query";
import { useId, useMemo, useState, type FormEvent } from "react";
import { LoadError, Loading } from "@/components/admin/query-state";
import { Button } from "@/components/ui/button";
import { Field, Input, Select } from "@/components/ui/field";
import { ApiError, fetchJson } from "@/lib/fetch-json";
import { formatDate } from "@/lib/utils";
import type { SampleDrawn, SampleScopesJson } from "@/components/marking/types";
import { ruleInWords } from "./words";

export type Drawer = { id: string; name: string; admin: boolean; moderator: boolean };

/**
 * Draws a moderation sample: one lab session, or one practical across every class that did it;
 * for which moderator (an admin chooses, a moderator draws for themselves); blind or not; and the
 * tolerance in marks. The school's rule is shown in words, and the recorded seed after drawing.
 */
export function DrawSampleForm({ me, onDrawn, onCancel }: { me: Drawer; onDrawn: (drawn: SampleDrawn) => void; onCancel: () => void }) {
  const scopes = useQuery({ queryKey: ["moderation-scopes"], queryFn: () => fetchJson<SampleScopesJson>("/api/moderation/scopes") });
  const [kind, setKind] = useState<"session" | "practical">("session");
  const [labSessionId, setLabSessionId] = useState("");
  const [practicalId, setPracticalId] = useState("");
  const [moderatorId, setModeratorId] = useState(me.moderator && !me.admin ? me.id : "");
  const [blind, setBlind] = useState(true);
  const [tolerance, setTolerance] = useState("1");
  const [errors, setErrors] = useState<Record<string, string[]>>({});
  const [message, setMessage] = useState<string | null>(null);
  const kindName = useId();

  const practicals = useMemo(() => {
    const map = new Map<string, { practicalId: string; title: string; classes: string[]; marked: number }>();
    for (const s of scopes.data?.sessions ?? []) {
      const p = map.get(s.practicalId) ?? { practicalId: s.practicalId, title: s.title, classes: [], marked: 0 };
      p.classes.push(s.className);
      p.marked += s.marked;
      map.set(s.practicalId, p);
    }
    return [...map.values()].sort((a, b) => a.title.localeCompare(b.title));
  }, [scopes.data]);

  const draw = useMutation({
    mutationFn: (body: Record<string, unknown>) => fetchJson<SampleDrawn>("/api/moderation/samples", { method: "POST", json: body }),
    onSuccess: (d) => {
      setErrors({});
      setMessage(null);
      onDrawn(d);
    },
    onError: (e) => {
      setErrors(e instanceof ApiError ? e.fieldErrors : {});
      setMessage(e instanceof ApiError ? e.message : "Something went wrong. Please try again.");
    },
  });

  const submit = (e: FormEvent) => {
    e.preventDefault();
    const local: Record<string, string[]> = {};
    const tol = Number(tolerance);
    if (kind === "session" && !labSessionId) local.labSessionId = ["Choose a lab session."];
    if (kind === "practical" && !practicalId) local.practicalId = ["Choose a practical."];
    if (!moderatorId) local.moderatorId = ["Choose a moderator."];
    if (tolerance.trim() === "" || !Number.isInteger(tol) || tol < 0 || tol > 50) local.toleranceMarks = ["A whole number of marks from 0 to 50."];
    if (Object.keys(local).length) {
      setErrors(local);
      setMessage("Some choices need attention.");
      return;
    }
    draw.mutate({ ...(kind === "session" ? { labSessionId } : { practicalId }), moderatorId, blind, toleranceMarks: tol });
  };

  if (scopes.isPending) return <Loading label="Loading marked work…" />;
  if (scopes.isError) return <LoadError error={scopes.error} onRetry={() => scopes.refetch()} what="the marked work" />;
  const data = scopes.data;

  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-4" aria-describedby="rule-words">
      <p id="rule-words" className="rounded-md border border-line bg-paper p-3">
        <span className="font-semibold">How the sample is chosen: </span>
        {ruleInWords(data.rule)} Work the moderator marked is never in their sample.
      </p>
      {data.sessions.length === 0 ? <p className="text-muted">No lab session has marked work yet, so there is nothing to sample.</p> : null}
      <fieldset className="flex flex-col gap-2">
        <legend className="font-semibold">What to sample</legend>
        <label className="flex items-center gap-2">
          <input type="radio" name={kindName} checked={kind === "session"} onChange={() => setKind("session")} className="size-4 accent-brand" />
          One lab session (one class)
        </label>
        <label className="flex items-center gap-2">
          <input type="radio" name={kindName} checked={kind === "practical"} onChange={() => setKind("practical")} className="size-4 accent-brand" />
          One practical, across every class that did it
        </label>
      </fieldset>
      {kind === "session" ? (
        <Field id="draw-session" label="Lab session" error={errors.labSessionId}>
          {(p) => (
            <Select {...p} value={labSessionId} onChange={(e) => setLabSessionId(e.target.value)}>
              <option value="">Choose a lab session…</option>
              {data.sessions.map((s) => (
                <option key={s.labSessionId} value={s.labSessionId}>
                  {s.title} — {s.className}, due {formatDate(s.dueAt)} ({s.marked} marked)
                </option>
              ))}
            </Select>
          )}
        </Field>
      ) : (
        <Field id="draw-practical" label="Practical" error={errors.practicalId ?? errors.labSessionId}>
          {(p) => (
            <Select {...p} value={practicalId} onChange={(e) => setPracticalId(e.target.value)}>
              <option value="">Choose a practical…</option>
              {practicals.map((x) => (
                <option key={x.practicalId} value={x.practicalId}>
                  {x.title} — {x.classes.join(", ")} ({x.marked} marked)
                </option>
              ))}
            </Select>
          )}
        </Field>
      )}
      {me.admin ? (
        <Field id="draw-moderator" label="Moderator" hint="Who second-marks this sample. Work they marked themselves is left out." error={errors.moderatorId}>
          {(p) => (
            <Select {...p} value={moderatorId} onChange={(e) => setModeratorId(e.target.value)}>
              <option value="">Choose a moderator…</option>
              {data.moderators.map((m) => (
                <option key={m.id} value={m.id}>
                  {m.name}
                  {m.id === me.id ? " (you)" : ""}
                </option>
              ))}
            </Select>
          )}
        </Field>
      ) : (
        <p>
          <span className="font-semibold">Moderator:</span> you ({me.name}). Only an admin can draw a sample for someone else.
          {errors.moderatorId ? <span className="block text-sm font-semibold text-bad">{errors.moderatorId.join(" ")}</span> : null}
        </p>
      )}
      <div className="flex flex-col gap-1">
        <label className="flex items-center gap-2 font-semibold">
          <input type="checkbox" checked={blind} onChange={(e) => setBlind(e.target.checked)} className="size-4 accent-brand" aria-describedby="draw-blind-hint" />
          Blind second marking
        </label>
        <p id="draw-blind-hint" className="text-sm text-muted">
          The teacher&apos;s marks stay hidden from the moderator until they finish second-marking each piece.
        </p>
      </div>
      <Field id="draw-tolerance" label="Tolerance (marks)" hint="Totals this close to the moderator's count as agreeing." error={errors.toleranceMarks} className="max-w-xs">
        {(p) => <Input {...p} type="number" inputMode="numeric" min={0} max={50} step={1} value={tolerance} onChange={(e) => setTolerance(e.target.value)} />}
      </Field>
      <div aria-live="polite">{message ? <p className="font-semibold text-bad">{message}</p> : null}</div>
      <div className="flex flex-wrap gap-2">
        <Button type="submit" disabled={draw.isPending || data.sessions.length === 0}>
          {draw.isPending ? "Drawing…" : "Draw the sample"}
        </Button>
        <Button variant="secondary" onClick={onCancel}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
