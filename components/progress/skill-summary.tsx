import type { SkillStatus } from "@/lib/progress/summary";
import { cn } from "@/lib/utils";
import type { SkillView } from "./types";
import { skillGroups, wholePercent } from "./words";

const GROUP_STYLE: Record<SkillStatus, { box: string; bar: string; mark: string }> = {
  secure: { box: "border-good/40 bg-good-soft", bar: "bg-good", mark: "✓" },
  developing: { box: "border-brand/30 bg-brand-soft", bar: "bg-brand", mark: "↗" },
  focus: { box: "border-accent/40 bg-accent-soft", bar: "bg-accent", mark: "→" },
};

/** One skill: its name, a bar for its average share of the marks, and the numbers in words. */
function SkillLine({ skill, status }: { skill: SkillView; status: SkillStatus }) {
  const average = Math.max(0, Math.min(100, skill.averagePercent));
  return (
    <li className="flex flex-col gap-1">
      <span className="font-semibold">{skill.title}</span>
      <span className="h-2 w-full overflow-hidden rounded-full bg-surface" aria-hidden="true">
        <span className={cn("block h-full rounded-full", GROUP_STYLE[status].bar)} style={{ width: `${average}%` }} />
      </span>
      <span className="text-sm text-muted">
        {wholePercent(skill.averagePercent)} of the marks on average
        {skill.points.length > 1 ? `; ${wholePercent(skill.latestPercent)} in the latest practical` : ""}
      </span>
    </li>
  );
}

/**
 * Skills under their plain words: "Doing well", "Getting there", "Work on next". Empty groups are
 * left out; with no skills at all, a sentence says why.
 */
export function SkillGroups({ skills, headingLevel = "h3", compact = false }: { skills: SkillView[]; headingLevel?: "h3" | "h4"; compact?: boolean }) {
  const H = headingLevel;
  const groups = skillGroups(skills).filter((g) => g.skills.length > 0);
  if (!groups.length) return <p className="text-muted">Skills appear here once marked work has been handed back.</p>;
  return (
    <div className={cn("grid gap-3", compact ? "" : "md:grid-cols-3")}>
      {groups.map((g) => (
        <div key={g.status} className={cn("rounded-lg border p-3", GROUP_STYLE[g.status].box)}>
          <H className="flex items-center gap-2 text-base font-bold">
            <span aria-hidden="true">{GROUP_STYLE[g.status].mark}</span>
            {g.label}
          </H>
          <p className="mb-2 text-sm text-muted">{g.meaning}</p>
          <ul className="flex flex-col gap-3">
            {g.skills.map((s) => (
              <SkillLine key={s.title} skill={s} status={g.status} />
            ))}
          </ul>
        </div>
      ))}
    </div>
  );
}
