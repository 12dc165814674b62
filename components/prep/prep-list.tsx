"use client";

import { useRouter } from "next/navigation";
import { useId, useState } from "react";
import { Button } from "@/components/ui/button";
import { Field, Input, Select } from "@/components/ui/field";
import { Table, Td, Th } from "@/components/ui/table";
import { GhsPictogram, ghsName } from "@/components/practicals/ghs-pictogram";
import { StandingCaution } from "@/components/practicals/standing-caution";
import { EYE_PROTECTION, PREP_CHECK_LINE, type GhsCode } from "@/lib/ghs";
import { fromLocalParts } from "@/components/lab-sessions/local-date-time";
import { defaultGroupCount } from "./prep-href";
import { formatAmount, formatConcentration, prepTotals, type PrepSection, type ScaledLine } from "./prep-totals";
import "./prep-print.css";

export type PrepHazard = { id: string; substance: string; pictograms: GhsCode[]; signalWord: string; hazardStatements: string; controls: string };
export type PrepClass = { id: string; name: string; studentCount: number };
export type PrepVersion = { id: string; version: number; status: "draft" | "published" };

const MAX_GROUPS = 60;

function parseGroups(text: string): { ok: true; value: number } | { ok: false; message: string } {
  const t = text.trim();
  if (!t) return { ok: false, message: "Enter the number of groups." };
  const n = Number(t);
  if (!Number.isInteger(n) || n < 1) return { ok: false, message: "Enter a whole number of groups, 1 or more." };
  if (n > MAX_GROUPS) return { ok: false, message: `At most ${MAX_GROUPS} groups.` };
  return { ok: true, value: n };
}

function neededBy(date: string): string | null {
  const d = fromLocalParts(date, "12:00");
  return d.ok ? d.date.toLocaleDateString("en-GB", { weekday: "long", day: "numeric", month: "long", year: "numeric" }) : null;
}

function Total({ line, unit }: { line: ScaledLine; unit: string }) {
  if ("error" in line) return <span className="font-semibold text-bad">{line.error}</span>;
  return (
    <span className="font-bold">
      {formatAmount(line.total)} {unit}
    </span>
  );
}

function Exact({ line, unit }: { line: ScaledLine; unit: string }) {
  if ("error" in line) return <span className="text-muted">—</span>;
  return (
    <span className="text-muted">
      {formatAmount(line.exact)} {unit}
    </span>
  );
}

/**
 * A technician's prep list for one practical: reagent and apparatus totals for a number of
 * groups plus spares (calculated by the engine in lib/marking), with the hazards, technician
 * notes and the check line, laid out to print cleanly.
 */
export function PrepList({
  practical,
  version,
  versions,
  prep,
  hazards,
  eyeProtection,
  otherPpe,
  classes,
  initial,
}: {
  practical: { id: string; title: string; topic: string; yearGroup: number };
  version: PrepVersion;
  versions: PrepVersion[];
  prep: PrepSection;
  hazards: PrepHazard[];
  eyeProtection: string | null;
  otherPpe: string[];
  classes: PrepClass[];
  initial: { classId: string; groups: string; date: string };
}) {
  const router = useRouter();
  const p = useId().replace(/[^a-zA-Z0-9]/g, "");
  const [classId, setClassId] = useState(initial.classId);
  const [groupsText, setGroupsText] = useState(initial.groups);
  const [date, setDate] = useState(initial.date);

  const cls = classes.find((c) => c.id === classId) ?? null;
  const groups = parseGroups(groupsText);
  const totals = groups.ok ? prepTotals(prep, groups.value) : null;
  const needed = neededBy(date);
  const eye = EYE_PROTECTION.find((e) => e.value === eyeProtection)?.label ?? null;

  const remember = (next: { classId?: string; groups?: string; date?: string }) => {
    const q = new URLSearchParams(window.location.search);
    const set = (k: string, v: string | undefined) => (v ? q.set(k, v) : q.delete(k));
    set("class", next.classId ?? classId);
    set("groups", next.groups ?? groupsText);
    set("date", next.date ?? date);
    window.history.replaceState(null, "", `${window.location.pathname}?${q.toString()}`);
  };

  return (
    <div className="prep-sheet flex flex-col gap-6">
      <article aria-labelledby={`${p}-title`} className="flex flex-col gap-5">
        <header className="flex flex-col gap-1">
          <p className="text-sm font-semibold uppercase tracking-wide text-accent">Prep list</p>
          <h1 id={`${p}-title`} className="text-2xl font-bold sm:text-3xl">
            {practical.title}
          </h1>
          <p className="text-muted">
            {practical.topic} · Year {practical.yearGroup} · version {version.version}
            {version.status === "draft" ? " (draft: not published yet, may still change)" : ""}
          </p>
          <dl className="mt-2 grid gap-x-6 gap-y-1 sm:grid-cols-3">
            <div>
              <dt className="text-sm text-muted">Class</dt>
              <dd className="font-semibold">{cls ? `${cls.name} (${cls.studentCount} students)` : "Not given"}</dd>
            </div>
            <div>
              <dt className="text-sm text-muted">Groups</dt>
              <dd className="font-semibold" aria-live="polite">
                {totals ? `${totals.groups} + ${totals.spareGroups} spare (${prep.spareMarginPercent} % margin)` : "Not given"}
              </dd>
            </div>
            <div>
              <dt className="text-sm text-muted">Needed by</dt>
              <dd className="font-semibold">{needed ?? "Not given"}</dd>
            </div>
          </dl>
        </header>

        <section aria-labelledby={`${p}-setup`} className="no-print flex flex-col gap-4 rounded-lg border border-line bg-surface p-4 sm:p-5">
          <h2 id={`${p}-setup`} className="text-lg font-bold">
            Scale the list
          </h2>
          <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-4">
            {versions.length > 1 ? (
              <Field id={`${p}-version`} label="Version of the practical">
                {(a) => (
                  <Select
                    {...a}
                    value={version.id}
                    onChange={(e) => {
                      const q = new URLSearchParams(window.location.search);
                      q.set("version", e.target.value);
                      router.push(`/practicals/${practical.id}/prep?${q.toString()}`);
                    }}
                  >
                    {versions.map((v) => (
                      <option key={v.id} value={v.id}>
                        Version {v.version}
                        {v.status === "draft" ? " (draft, not published)" : ""}
                      </option>
                    ))}
                  </Select>
                )}
              </Field>
            ) : null}
            {classes.length ? (
              <Field id={`${p}-class`} label="Class" hint="Sets the number of groups to the class size ÷ 3, rounded up.">
                {(a) => (
                  <Select
                    {...a}
                    value={classId}
                    onChange={(e) => {
                      const next = e.target.value;
                      const c = classes.find((x) => x.id === next);
                      const g = c ? String(defaultGroupCount(c.studentCount)) : groupsText;
                      setClassId(next);
                      setGroupsText(g);
                      remember({ classId: next, groups: g });
                    }}
                  >
                    <option value="">No class chosen</option>
                    {classes.map((c) => (
                      <option key={c.id} value={c.id}>
                        {c.name} ({c.studentCount} students)
                      </option>
                    ))}
                  </Select>
                )}
              </Field>
            ) : null}
            <Field id={`${p}-groups`} label="Number of groups" hint={`Spares are added on top: ${prep.spareMarginPercent} % of the groups, rounded up.`} error={groups.ok ? undefined : groups.message}>
              {(a) => (
                <Input
                  {...a}
                  type="number"
                  inputMode="numeric"
                  min={1}
                  max={MAX_GROUPS}
                  step={1}
                  value={groupsText}
                  onChange={(e) => {
                    setGroupsText(e.target.value);
                    remember({ groups: e.target.value });
                  }}
                />
              )}
            </Field>
            <Field id={`${p}-date`} label="Date needed">
              {(a) => (
                <Input
                  {...a}
                  type="date"
                  value={date}
                  onChange={(e) => {
                    setDate(e.target.value);
                    remember({ date: e.target.value });
                  }}
                />
              )}
            </Field>
          </div>
          <div>
            <Button onClick={() => window.print()} disabled={!totals}>
              Print prep list
            </Button>
          </div>
        </section>

        <section aria-labelledby={`${p}-reagents`} className="flex flex-col gap-2">
          <h2 id={`${p}-reagents`} className="text-lg font-bold">
            Reagents
          </h2>
          {prep.reagents.length === 0 ? (
            <p className="text-muted">This practical lists no reagents.</p>
          ) : !totals ? (
            <p className="font-semibold text-bad">Enter the number of groups to see the totals.</p>
          ) : (
            <Table>
              <caption className="sr-only">Reagent totals for {totals.groups + totals.spareGroups} groups including spares</caption>
              <thead>
                <tr>
                  <Th>Reagent</Th>
                  <Th>Concentration</Th>
                  <Th>Per group</Th>
                  <Th>Exact total</Th>
                  <Th>Prepare (rounded up)</Th>
                  <Th>Notes</Th>
                </tr>
              </thead>
              <tbody>
                {totals.reagents.map((r) => (
                  <tr key={r.id}>
                    <Td className="font-semibold">{r.name}</Td>
                    <Td className="whitespace-nowrap">{formatConcentration(r.concentration, r.concentrationUnit)}</Td>
                    <Td className="whitespace-nowrap">
                      {formatAmount(r.amountPerGroup)} {r.amountUnit}
                    </Td>
                    <Td className="whitespace-nowrap">
                      <Exact line={r.scaled} unit={r.amountUnit} />
                    </Td>
                    <Td className="whitespace-nowrap">
                      <Total line={r.scaled} unit={r.amountUnit} />
                    </Td>
                    <Td>{r.notes || <span className="text-muted">—</span>}</Td>
                  </tr>
                ))}
              </tbody>
            </Table>
          )}
        </section>

        <section aria-labelledby={`${p}-apparatus`} className="flex flex-col gap-2">
          <h2 id={`${p}-apparatus`} className="text-lg font-bold">
            Apparatus
          </h2>
          {prep.apparatus.length === 0 ? (
            <p className="text-muted">This practical lists no apparatus for the technician.</p>
          ) : !totals ? (
            <p className="font-semibold text-bad">Enter the number of groups to see the totals.</p>
          ) : (
            <Table>
              <caption className="sr-only">Apparatus totals for {totals.groups + totals.spareGroups} groups including spares</caption>
              <thead>
                <tr>
                  <Th>Item</Th>
                  <Th>Per group</Th>
                  <Th>Total</Th>
                </tr>
              </thead>
              <tbody>
                {totals.apparatus.map((a) => (
                  <tr key={a.id}>
                    <Td className="font-semibold">{a.name}</Td>
                    <Td>{a.perGroup}</Td>
                    <Td>
                      <Total line={a.scaled} unit="" />
                    </Td>
                  </tr>
                ))}
              </tbody>
            </Table>
          )}
        </section>

        <p className="rounded-md border-2 border-accent/60 bg-accent-soft p-3 font-bold">{PREP_CHECK_LINE}</p>
        {totals ? (
          <p className="text-sm text-muted">
            Each total is the amount per group × ({totals.groups} groups + {totals.spareGroups} spare), rounded up to a step that suits the unit (for example the next 10 cm³ or
            the next gram); small amounts are rounded up to two significant figures.
          </p>
        ) : null}

        <section aria-labelledby={`${p}-notes`} className="flex flex-col gap-2">
          <h2 id={`${p}-notes`} className="text-lg font-bold">
            Notes for the technician
          </h2>
          {prep.technicianNotes.trim() ? <p className="whitespace-pre-line">{prep.technicianNotes}</p> : <p className="text-muted">No notes.</p>}
        </section>

        <section aria-labelledby={`${p}-hazards`} className="flex flex-col gap-2">
          <h2 id={`${p}-hazards`} className="text-lg font-bold">
            Hazards and protection
          </h2>
          <p>
            <span className="font-semibold">Eye protection: </span>
            {eye ?? "Not stated in the practical: check the risk assessment."}
            {otherPpe.length ? (
              <>
                {" "}
                · <span className="font-semibold">Also: </span>
                {otherPpe.join(", ")}
              </>
            ) : null}
          </p>
          {hazards.length ? (
            <ul className="flex flex-col gap-2">
              {hazards.map((h) => (
                <li key={h.id} className="prep-card rounded-md border border-line bg-surface p-3">
                  <p className="font-semibold">
                    {h.substance}
                    {h.signalWord !== "None" ? <span className="ml-2 rounded border border-bad/40 px-1.5 text-sm font-bold text-bad uppercase">{h.signalWord}</span> : null}
                  </p>
                  {h.pictograms.length ? (
                    <ul className="my-1 flex flex-wrap gap-3" aria-label="Hazard pictograms">
                      {h.pictograms.map((c) => (
                        <li key={c} className="flex items-center gap-1.5 text-[0.97rem]">
                          <GhsPictogram code={c} size={32} decorative />
                          <span>
                            {ghsName(c)} <span className="text-muted">({c})</span>
                          </span>
                        </li>
                      ))}
                    </ul>
                  ) : null}
                  {h.hazardStatements.trim() ? <p className="text-[0.97rem]">{h.hazardStatements}</p> : null}
                  <p className="text-[0.97rem]">
                    <span className="font-semibold">Control measures: </span>
                    {h.controls}
                  </p>
                </li>
              ))}
            </ul>
          ) : (
            <p className="text-muted">No hazards are listed in this version.</p>
          )}
          <StandingCaution />
        </section>

        <section aria-label="Sign-off" className="grid gap-4 border-t border-line pt-4 sm:grid-cols-2">
          <p>
            Prepared by: <span className="inline-block w-48 border-b border-ink/60" aria-hidden="true">&nbsp;</span>
          </p>
          <p>
            Checked by (competent person): <span className="inline-block w-40 border-b border-ink/60" aria-hidden="true">&nbsp;</span>
          </p>
        </section>
      </article>
    </div>
  );
}
