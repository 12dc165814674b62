import Link from "next/link";
import { Badge, type Tone } from "@/components/ui/badge";
import { EmptyState } from "@/components/ui/empty-state";

export type LabSessionState = "upcoming" | "open" | "late" | "closed" | "cancelled";

export type LabSessionListItem = {
  id: string;
  title: string;
  className: string;
  opensAt: Date;
  dueAt: Date;
  state: LabSessionState;
  lateWork: "accept" | "accept-flagged" | "refuse";
  lateDays: number;
  grouping: "individual" | "groups";
};

export const STATE_LABELS: Record<LabSessionState, string> = {
  upcoming: "Coming up",
  open: "Open now",
  late: "Past due: late work accepted",
  closed: "Closed",
  cancelled: "Cancelled",
};

const STATE_TONES: Record<LabSessionState, Tone> = { upcoming: "brand", open: "good", late: "warn", closed: "neutral", cancelled: "bad" };

/** Where a lab session stands, always in words. */
export function StateBadge({ state }: { state: LabSessionState }) {
  return <Badge tone={STATE_TONES[state]}>{STATE_LABELS[state]}</Badge>;
}

/** "Tue 8 Dec 2026, 09:00": a weekday helps when planning lessons. */
export function formatWhen(d: Date | string): string {
  return new Date(d).toLocaleString("en-GB", { weekday: "short", day: "numeric", month: "short", year: "numeric", hour: "2-digit", minute: "2-digit" });
}

/** "in 3 days", "tomorrow", "2 hours ago", for a date compared with now. */
export function relativeTo(d: Date | string, now: Date): string {
  const diffMs = new Date(d).getTime() - now.getTime();
  const rtf = new Intl.RelativeTimeFormat("en-GB", { numeric: "auto" });
  const abs = Math.abs(diffMs);
  if (abs < 3_600_000) return rtf.format(Math.round(diffMs / 60_000), "minute");
  if (abs < 86_400_000) return rtf.format(Math.round(diffMs / 3_600_000), "hour");
  return rtf.format(Math.round(diffMs / 86_400_000), "day");
}

/** The end of the late window, or null when late work is refused. */
export function lateUntil(s: { dueAt: Date | string; lateWork: string; lateDays: number }): Date | null {
  if (s.lateWork === "refuse") return null;
  return new Date(new Date(s.dueAt).getTime() + s.lateDays * 86_400_000);
}

/** The one line of dates a list shows for a lab session in its current state. */
export function whenLine(s: LabSessionListItem, now: Date): string {
  switch (s.state) {
    case "upcoming":
      return `Opens ${formatWhen(s.opensAt)} (${relativeTo(s.opensAt, now)}) · due ${formatWhen(s.dueAt)}`;
    case "open":
      return `Due ${formatWhen(s.dueAt)} (${relativeTo(s.dueAt, now)})`;
    case "late": {
      const until = lateUntil(s);
      return `Was due ${formatWhen(s.dueAt)} · late work until ${until ? formatWhen(until) : "—"}`;
    }
    case "closed":
      return `Closed · was due ${formatWhen(s.dueAt)}`;
    case "cancelled":
      return `Cancelled · was due ${formatWhen(s.dueAt)}`;
  }
}

/** Lab sessions as a list of links, each with its class, state and dates. */
export function LabSessionList({ items, now, showClass = true, emptyText, headingLevel = "h3" }: { items: LabSessionListItem[]; now: Date; showClass?: boolean; emptyText?: string; headingLevel?: "h3" | "h4" }) {
  if (!items.length) return emptyText ? <EmptyState title={emptyText} /> : null;
  const H = headingLevel;
  return (
    <ul className="flex flex-col gap-2">
      {items.map((s) => (
        <li key={s.id}>
          <Link href={`/lab-sessions/${s.id}`} className="flex flex-col gap-1 rounded-lg border border-line bg-surface p-3 text-ink no-underline hover:border-brand sm:flex-row sm:items-center sm:justify-between sm:gap-4">
            <span className="flex flex-col">
              <H className="text-base font-bold text-brand-strong underline decoration-brand/40 underline-offset-4">{s.title}</H>
              <span className="text-[0.97rem] text-muted">
                {showClass ? `${s.className} · ` : ""}
                {whenLine(s, now)}
              </span>
            </span>
            <span className="shrink-0">
              <StateBadge state={s.state} />
            </span>
          </Link>
        </li>
      ))}
    </ul>
  );
}
