"use client";

import { cn } from "@/lib/utils";
import type { SaveStatus } from "./use-draft-saver";

function time(d: Date): string {
  return d.toLocaleTimeString("en-GB", { hour: "2-digit", minute: "2-digit" });
}

/** The save state in words, with a tone; colours always come with the words. */
export function describeSaveStatus(status: SaveStatus): { text: string; tone: "good" | "muted" | "warn" | "bad" } {
  switch (status.kind) {
    case "saved":
      return { text: status.at ? `All changes saved at ${time(status.at)}` : "No changes yet", tone: "good" };
    case "unsaved":
      return { text: "Unsaved changes: saving when you pause…", tone: "muted" };
    case "saving":
      return { text: "Saving…", tone: "muted" };
    case "invalid":
      return {
        text: status.message
          ? `Not saved: ${status.message}`
          : `Not saved yet: ${status.count} ${status.count === 1 ? "thing needs" : "things need"} finishing first`,
        tone: "warn",
      };
    case "error":
      return { text: `Not saved: ${status.message}`, tone: "bad" };
    case "conflict":
      return { text: "Not saved: someone else saved this practical. Choose which version to keep.", tone: "bad" };
    case "published":
      return { text: `Not saved: ${status.message}`, tone: "bad" };
  }
}

const DOT: Record<string, string> = { good: "bg-good", muted: "bg-muted", warn: "bg-warn", bad: "bg-bad" };
const TEXT: Record<string, string> = { good: "text-good", muted: "text-muted", warn: "text-warn", bad: "text-bad" };

export function SaveStatusText({ status }: { status: SaveStatus }) {
  const { text, tone } = describeSaveStatus(status);
  return (
    <p role="status" aria-live="polite" className={cn("flex items-center gap-2 text-sm font-semibold", TEXT[tone])}>
      <span aria-hidden="true" className={cn("inline-block size-2.5 shrink-0 rounded-full", DOT[tone], status.kind === "saving" && "animate-pulse")} />
      <span>{text}</span>
    </p>
  );
}
