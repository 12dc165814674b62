import type { ReactNode } from "react";
import { cn } from "@/lib/utils";

const TONES = {
  info: "border-brand/40 bg-brand-soft",
  good: "border-good/40 bg-good-soft",
  warn: "border-warn/40 bg-warn-soft",
  bad: "border-bad/40 bg-bad-soft",
} as const;

/** A boxed message. Errors are announced to screen readers. */
export function Alert({ tone = "info", title, children, className }: { tone?: keyof typeof TONES; title?: ReactNode; children?: ReactNode; className?: string }) {
  return (
    <div role={tone === "bad" ? "alert" : "status"} className={cn("rounded-md border-l-4 border p-3 text-ink", TONES[tone], className)}>
      {title ? <p className="font-bold">{title}</p> : null}
      {children ? <div className="text-[0.97rem]">{children}</div> : null}
    </div>
  );
}
