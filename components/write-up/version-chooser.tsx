"use client";

import { useEffect, useId, useRef, type ReactNode } from "react";
import { Button } from "@/components/ui/button";
import type { ComparedPart } from "./compare";

/**
 * Two versions of the same work side by side, part by part (only the parts that differ), and a
 * choice of which to keep. Used when a save finds the saved version has moved on (another tab,
 * another device, a group member) and when a copy kept on this device is found on loading.
 * Nothing is thrown away until the person chooses.
 */
export function VersionChooser({
  title,
  intro,
  mineLabel,
  otherLabel,
  mine,
  other,
  keepMineLabel,
  keepOtherLabel,
  onKeepMine,
  onKeepOther,
  busy = false,
  focusOnShow = true,
}: {
  title: string;
  intro: ReactNode;
  mineLabel: string;
  otherLabel: string;
  mine: ComparedPart[];
  other: ComparedPart[];
  keepMineLabel: string;
  keepOtherLabel: string;
  onKeepMine: () => void;
  onKeepOther: () => void;
  busy?: boolean;
  focusOnShow?: boolean;
}) {
  const id = useId();
  const headingRef = useRef<HTMLHeadingElement>(null);
  useEffect(() => {
    if (focusOnShow) headingRef.current?.focus();
  }, [focusOnShow]);

  const otherByKey = new Map(other.map((p) => [p.key, p]));
  const keys = [...mine.map((p) => p.key), ...other.filter((p) => !mine.some((m) => m.key === p.key)).map((p) => p.key)];
  const mineByKey = new Map(mine.map((p) => [p.key, p]));
  const differing = keys.filter((k) => mineByKey.get(k)?.detail !== otherByKey.get(k)?.detail);

  return (
    <section role="region" aria-labelledby={`${id}-title`} className="flex flex-col gap-3 rounded-lg border-2 border-warn/60 bg-warn-soft p-4" data-testid="version-chooser">
      <h2 id={`${id}-title`} ref={headingRef} tabIndex={-1} className="text-lg font-bold">
        {title}
      </h2>
      <div>{intro}</div>
      {differing.length === 0 ? (
        <p>The two versions hold the same work. Either choice keeps it.</p>
      ) : (
        <div className="flex flex-col gap-2">
          <div className="grid grid-cols-2 gap-2 text-sm font-bold" aria-hidden="true">
            <span>{mineLabel}</span>
            <span>{otherLabel}</span>
          </div>
          <ul className="flex flex-col gap-2">
            {differing.map((k) => {
              const m = mineByKey.get(k);
              const o = otherByKey.get(k);
              return (
                <li key={k} className="rounded-md border border-line bg-surface p-2" data-part={k}>
                  <p className="font-semibold">{m?.label ?? o?.label}</p>
                  <dl className="grid grid-cols-2 gap-2 text-[0.95rem]">
                    <div className="min-w-0 border-r border-line pr-2">
                      <dt className="sr-only">{mineLabel}</dt>
                      <dd className="break-words" data-side="mine">
                        {m?.summary ?? "Not there"}
                      </dd>
                    </div>
                    <div className="min-w-0">
                      <dt className="sr-only">{otherLabel}</dt>
                      <dd className="break-words" data-side="other">
                        {o?.summary ?? "Not there"}
                      </dd>
                    </div>
                  </dl>
                </li>
              );
            })}
          </ul>
          {differing.length < keys.length ? <p className="text-sm">Everything else is the same in both.</p> : null}
        </div>
      )}
      <div className="flex flex-wrap gap-2">
        <Button onClick={onKeepMine} disabled={busy}>
          {keepMineLabel}
        </Button>
        <Button variant="secondary" onClick={onKeepOther} disabled={busy}>
          {keepOtherLabel}
        </Button>
      </div>
    </section>
  );
}
