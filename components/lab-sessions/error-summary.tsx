"use client";

import { forwardRef } from "react";

export type SummaryItem = { message: string; href: string };

/**
 * The list of problems at the top of a form after a refused save, each a link to its field. It
 * takes focus so keyboard and screen-reader users hear what to fix first.
 */
export const ErrorSummary = forwardRef<HTMLDivElement, { title: string; items: SummaryItem[]; lead?: string | null }>(function ErrorSummary({ title, items, lead }, ref) {
  return (
    <div ref={ref} tabIndex={-1} role="alert" className="rounded-md border border-l-4 border-bad/40 bg-bad-soft p-3 text-ink">
      <p className="font-bold">{title}</p>
      {lead ? <p>{lead}</p> : null}
      {items.length ? (
        <ul className="mt-1 list-disc pl-5">
          {items.map((item, i) => (
            <li key={`${item.href}-${i}`}>
              <a
                href={item.href}
                onClick={(e) => {
                  const target = document.getElementById(item.href.slice(1));
                  if (target) {
                    e.preventDefault();
                    target.focus();
                    target.scrollIntoView({ block: "center" });
                  }
                }}
              >
                {item.message}
              </a>
            </li>
          ))}
        </ul>
      ) : null}
    </div>
  );
});
