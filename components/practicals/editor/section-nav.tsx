"use client";

import { useEffect, useRef } from "react";
import { cn } from "@/lib/utils";
import { SECTIONS, type SectionKey } from "../draft";

/** The list of sections: down the side on a wide screen, a scrolling row across the top on a phone. */
export function SectionNav({ active, onSelect, problems }: { active: SectionKey; onSelect: (key: SectionKey) => void; problems: Partial<Record<string, number>> }) {
  const navRef = useRef<HTMLElement>(null);
  useEffect(() => {
    // On a phone the list scrolls sideways: keep the open section in sight (without moving the page).
    const nav = navRef.current;
    const link = nav?.querySelector<HTMLElement>('[aria-current="step"]');
    if (nav && link && nav.scrollWidth > nav.clientWidth) nav.scrollLeft = Math.max(0, link.offsetLeft - 16);
  }, [active]);
  return (
    <nav ref={navRef} aria-label="Sections of the practical" className="relative -mx-4 overflow-x-auto px-4 md:mx-0 md:overflow-visible md:px-0">
      <ol className="flex gap-1.5 pb-1 md:flex-col md:gap-1 md:pb-0">
        {SECTIONS.map((s, i) => {
          const n = problems[s.key] ?? 0;
          const current = s.key === active;
          return (
            <li key={s.key} className="shrink-0">
              <a
                href={`#${s.key}`}
                aria-current={current ? "step" : undefined}
                onClick={(e) => {
                  e.preventDefault();
                  onSelect(s.key);
                }}
                className={cn(
                  "flex min-h-11 items-center justify-between gap-2 rounded-md border px-3 py-2 text-[0.95rem] font-semibold whitespace-nowrap no-underline md:whitespace-normal",
                  current ? "border-brand bg-brand text-on-brand" : "border-line bg-surface text-ink hover:border-brand",
                )}
              >
                <span>
                  <span className={cn("mr-1.5 font-normal", current ? "text-on-brand/80" : "text-muted")}>{i + 1}.</span>
                  {s.label}
                </span>
                {n ? (
                  <span className={cn("shrink-0 rounded-full px-2 text-xs whitespace-nowrap", current ? "bg-on-brand text-brand" : "bg-warn-soft text-warn")}>
                    {n} to fix<span className="sr-only"> in this section</span>
                  </span>
                ) : null}
              </a>
            </li>
          );
        })}
      </ol>
    </nav>
  );
}
