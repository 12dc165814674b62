"use client";

import { useState } from "react";
import { Button } from "@/components/ui/button";
import { Input, Select } from "@/components/ui/field";
import { cn } from "@/lib/utils";
import { ConfirmButton } from "@/components/ui/confirm-button";
import { assignStudent, groupProblems, makeGroups, MAX_GROUP_SIZE, MIN_GROUP_SIZE, nextGroupId, nextGroupName, type LabGroupDraft } from "./groups";

export type RosterStudent = { id: string; name: string; active?: boolean };

/**
 * Puts a class into groups that share one set of results, without dragging: each student has a
 * "Group" list, groups can be added, renamed and removed, and "Auto-make groups of 3" splits the
 * class in register order in one go.
 */
export function GroupBuilder({
  idPrefix,
  roster,
  groups,
  onChange,
  errors,
}: {
  idPrefix: string;
  roster: RosterStudent[];
  groups: LabGroupDraft[];
  onChange: (next: LabGroupDraft[]) => void;
  /** Messages keyed `groups`, `groups.0.studentIds`, `groups.0.name`. */
  errors: Record<string, string | undefined>;
}) {
  const [announcement, setAnnouncement] = useState("");
  const names = new Map(roster.map((s) => [s.id, s.name]));
  const groupOf = new Map(groups.flatMap((g) => g.studentIds.map((id) => [id, g.id] as const)));
  const { unassigned } = groupProblems(groups, roster.map((s) => s.id));
  const hasMembers = groups.some((g) => g.studentIds.length > 0);

  const autoMake = () => {
    const next = makeGroups(
      roster.filter((s) => s.active !== false).map((s) => s.id),
      3,
    );
    onChange(next);
    setAnnouncement(`Made ${next.length} group${next.length === 1 ? "" : "s"} from ${roster.length} students, in register order. Change any student's group below.`);
  };
  const addGroup = () => {
    const g = { id: nextGroupId(groups), name: nextGroupName(groups), studentIds: [] };
    onChange([...groups, g]);
    setAnnouncement(`Added ${g.name}. Choose its students in the list of students.`);
  };
  const removeGroup = (id: string) => {
    const g = groups.find((x) => x.id === id);
    onChange(groups.filter((x) => x.id !== id));
    setAnnouncement(`Removed ${g?.name ?? "the group"}; its students are not in a group now.`);
  };

  return (
    <div className="flex flex-col gap-4">
      <div className="flex flex-wrap items-start gap-2">
        {hasMembers ? (
          <ConfirmButton
            label="Auto-make groups of 3"
            variant="secondary"
            tone="danger"
            question="Replace the groups you have made with new groups of 3, in register order?"
            confirmLabel="Replace my groups"
            backOutLabel="Keep my groups"
            onConfirm={autoMake}
          />
        ) : (
          <Button variant="secondary" onClick={autoMake} disabled={roster.length === 0}>
            Auto-make groups of 3
          </Button>
        )}
        <Button variant="ghost" onClick={addGroup} disabled={groups.length >= 20}>
          Add a group
        </Button>
      </div>
      <p className="sr-only" aria-live="polite">
        {announcement}
      </p>
      {errors.groups ? (
        <p id={`${idPrefix}-groups-error`} className="text-sm font-semibold text-bad">
          {errors.groups}
        </p>
      ) : null}

      {groups.length ? (
        <ol className="grid gap-3 sm:grid-cols-2 lg:grid-cols-3" aria-label="Groups">
          {groups.map((g, i) => {
            const nameError = errors[`groups.${i}.name`];
            const memberError = errors[`groups.${i}.studentIds`];
            const inputId = `${idPrefix}-groups-${i}`;
            const count = g.studentIds.length;
            const sizeOk = count >= MIN_GROUP_SIZE && count <= MAX_GROUP_SIZE;
            return (
              <li key={g.id} className={cn("flex flex-col gap-2 rounded-lg border bg-surface p-3", memberError || nameError ? "border-bad" : "border-line")}>
                <label htmlFor={inputId} className="text-sm font-semibold">
                  Group name
                </label>
                <Input
                  id={inputId}
                  value={g.name}
                  maxLength={40}
                  aria-invalid={nameError || memberError ? true : undefined}
                  aria-describedby={[nameError ? `${inputId}-name-error` : "", memberError ? `${inputId}-error` : "", `${inputId}-count`].filter(Boolean).join(" ")}
                  onChange={(e) => onChange(groups.map((x) => (x.id === g.id ? { ...x, name: e.target.value } : x)))}
                />
                {nameError ? (
                  <p id={`${inputId}-name-error`} className="text-sm font-semibold text-bad">
                    {nameError}
                  </p>
                ) : null}
                <p id={`${inputId}-count`} className={cn("text-sm", sizeOk ? "text-muted" : "font-semibold text-warn")}>
                  {count} student{count === 1 ? "" : "s"}
                  {sizeOk ? "" : ` (groups have ${MIN_GROUP_SIZE} to ${MAX_GROUP_SIZE})`}
                </p>
                {count ? (
                  <ul className="text-[0.97rem]">
                    {g.studentIds.map((id) =>
                      names.has(id) ? (
                        <li key={id}>{names.get(id)}</li>
                      ) : (
                        <li key={id} className="flex flex-wrap items-center gap-2">
                          <span className="text-muted">A student no longer in the class</span>
                          <Button variant="ghost" size="sm" onClick={() => onChange(assignStudent(groups, id, null))}>
                            Take out of {g.name.trim() || "this group"}
                          </Button>
                        </li>
                      ),
                    )}
                  </ul>
                ) : null}
                {memberError ? (
                  <p id={`${inputId}-error`} className="text-sm font-semibold text-bad">
                    {memberError}
                  </p>
                ) : null}
                <Button variant="ghost" size="sm" className="self-start" onClick={() => removeGroup(g.id)}>
                  Remove {g.name.trim() || "this group"}
                </Button>
              </li>
            );
          })}
        </ol>
      ) : (
        <p className="text-muted">No groups yet. Auto-make groups of 3, or add groups one at a time and choose each student&apos;s group below.</p>
      )}

      {roster.length ? (
        <fieldset className="flex flex-col gap-1">
          <legend className="mb-1 font-semibold">Each student&apos;s group</legend>
          <ul className="grid gap-x-4 rounded-lg border border-line bg-surface px-1 lg:grid-cols-2">
            {roster.map((s) => {
              const selectId = `${idPrefix}-student-${s.id}`;
              return (
                <li key={s.id} className="flex flex-col gap-1 border-b border-line px-2 py-2 sm:flex-row sm:items-center sm:justify-between sm:gap-4">
                  <label htmlFor={selectId} className="font-semibold">
                    {s.name}
                    {s.active === false ? <span className="ml-2 text-sm font-normal text-muted">(account deactivated)</span> : null}
                  </label>
                  <Select
                    id={selectId}
                    className="sm:w-48"
                    value={groupOf.get(s.id) ?? ""}
                    disabled={groups.length === 0}
                    onChange={(e) => onChange(assignStudent(groups, s.id, e.target.value || null))}
                  >
                    <option value="">Not in a group</option>
                    {groups.map((g) => (
                      <option key={g.id} value={g.id}>
                        {g.name.trim() || "Unnamed group"}
                      </option>
                    ))}
                  </Select>
                </li>
              );
            })}
          </ul>
        </fieldset>
      ) : null}

      {groups.length && unassigned.length ? (
        <p className="rounded-md border border-warn/40 bg-warn-soft p-3 text-[0.97rem]" aria-live="polite">
          <span className="font-semibold">Not in a group yet: </span>
          {unassigned.map((id) => names.get(id) ?? id).join(", ")}. Put them in a group, or leave them out if they will not do this practical.
        </p>
      ) : null}
    </div>
  );
}
