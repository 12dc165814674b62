"use client";

import { describeErrorPath, sectionOfPath, SECTIONS, type Draft, type FieldErrors, type SectionKey } from "../draft";

/**
 * Everything that needs attention, as links: each takes the teacher to its section and field.
 * Shown above the editor after a save or publish has been refused.
 */
export function ProblemsSummary({ title, intro, errors, draft, onGo, prepHref }: { title: string; intro?: string; errors: FieldErrors; draft: Draft; onGo: (section: SectionKey, path: string) => void; prepHref: string }) {
  const entries = Object.entries(errors);
  if (!entries.length) return null;
  const order = (path: string) => {
    const s = sectionOfPath(path);
    return s === "prep" ? SECTIONS.length : SECTIONS.findIndex((x) => x.key === s);
  };
  entries.sort(([a], [b]) => order(a) - order(b));
  return (
    <section aria-labelledby="problems-title" id="problems-summary" tabIndex={-1} className="rounded-lg border border-warn/50 border-l-4 border-l-warn bg-warn-soft p-4">
      <h2 id="problems-title" className="font-bold">
        {title}
      </h2>
      {intro ? <p className="text-[0.97rem]">{intro}</p> : null}
      <ul className="mt-2 flex flex-col gap-1.5">
        {entries.map(([path, messages]) => {
          const section = sectionOfPath(path);
          return (
            <li key={path}>
              {section === "prep" ? (
                <a href={prepHref} className="font-semibold">
                  {describeErrorPath(path, draft)}
                </a>
              ) : (
                <a
                  href={`#${section}`}
                  className="font-semibold"
                  onClick={(e) => {
                    e.preventDefault();
                    onGo(section, path);
                  }}
                >
                  {describeErrorPath(path, draft)}
                </a>
              )}
              : {messages.join(" ")}
            </li>
          );
        })}
      </ul>
    </section>
  );
}
