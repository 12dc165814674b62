import type { ReactNode } from "react";
import { cn } from "@/lib/utils";

export type Tone = "neutral" | "brand" | "good" | "warn" | "bad" | "accent";

const TONES: Record<Tone, string> = {
  neutral: "bg-sunken text-ink border-line",
  brand: "bg-brand-soft text-brand-strong border-brand/30",
  good: "bg-good-soft text-good border-good/30",
  warn: "bg-warn-soft text-warn border-warn/30",
  bad: "bg-bad-soft text-bad border-bad/30",
  accent: "bg-accent-soft text-accent border-accent/30",
};

export function Badge({ tone = "neutral", children, className }: { tone?: Tone; children: ReactNode; className?: string }) {
  return <span className={cn("inline-flex items-center gap-1 rounded-full border px-2 py-0.5 text-sm font-semibold whitespace-nowrap", TONES[tone], className)}>{children}</span>;
}
