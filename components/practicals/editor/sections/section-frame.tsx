"use client";

import { forwardRef, type ReactNode } from "react";

/** A section of the editor: its heading (focused when the section opens), a line of help, the fields. */
export const SectionFrame = forwardRef<HTMLHeadingElement, { id: string; title: string; lead?: ReactNode; children: ReactNode }>(function SectionFrame({ id, title, lead, children }, ref) {
  return (
    <section aria-labelledby={`${id}-heading`} className="flex flex-col gap-5">
      <div>
        <h2 ref={ref} id={`${id}-heading`} tabIndex={-1} className="text-2xl font-bold">
          {title}
        </h2>
        {lead ? <p className="mt-1 max-w-3xl text-muted">{lead}</p> : null}
      </div>
      {children}
    </section>
  );
});
