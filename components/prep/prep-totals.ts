import { MarkingInputError, scalePrepQuantity } from "@/lib/marking";

export type PrepReagent = {
  id: string;
  name: string;
  concentration: number | null;
  concentrationUnit: "mol/dm³" | "g/dm³" | "% w/v" | "volume";
  amountPerGroup: number;
  amountUnit: "cm³" | "dm³" | "g" | "mg" | "pieces" | "cm";
  notes: string;
};
export type PrepApparatus = { id: string; name: string; perGroup: number };
export type PrepSection = { reagents: PrepReagent[]; apparatus: PrepApparatus[]; spareMarginPercent: number; technicianNotes: string };

/**
 * The step a total is rounded up to, by unit, so a technician measures sensible amounts: the
 * nearest 10 cm³, 0.1 dm³, 1 g, 100 mg, whole pieces, 10 cm. Small totals (under five steps)
 * are left to the engine's own rounding to two significant figures, so 0.6 g stays 0.6 g
 * rather than becoming 1 g (common practice).
 */
export const ROUNDING_STEP: Record<PrepReagent["amountUnit"], number> = { "cm³": 10, "dm³": 0.1, g: 1, mg: 100, pieces: 1, cm: 10 };

export type ScaledLine = { exact: number; total: number; step: number } | { error: string };
export type PrepTotals = {
  groups: number;
  spareGroups: number;
  reagents: (PrepReagent & { scaled: ScaledLine })[];
  apparatus: (PrepApparatus & { scaled: ScaledLine })[];
};

/**
 * Spare groups from the practical's spare margin: the margin as a share of the class's groups,
 * rounded up to whole groups (10 % of 8 groups is 1 spare group; 0 % is none).
 */
export function spareGroupsFor(groups: number, spareMarginPercent: number): number {
  return Math.max(0, Math.ceil(groups * (spareMarginPercent / 100) - 1e-9));
}

function scale(perGroup: number, groups: number, spareGroups: number, step: number | undefined): ScaledLine {
  try {
    const firstTry = scalePrepQuantity({ perGroup, groups, spareGroups });
    const useStep = step !== undefined && firstTry.exact >= 5 * step;
    const r = useStep ? scalePrepQuantity({ perGroup, groups, spareGroups, roundUpTo: step }) : firstTry;
    return { exact: r.exact, total: r.total, step: r.step };
  } catch (e) {
    if (e instanceof MarkingInputError) return { error: e.message };
    throw e;
  }
}

/** Every reagent and apparatus line of a prep list scaled for `groups` groups plus spares. */
export function prepTotals(prep: PrepSection, groups: number): PrepTotals {
  const spareGroups = spareGroupsFor(groups, prep.spareMarginPercent);
  return {
    groups,
    spareGroups,
    reagents: prep.reagents.map((r) => ({ ...r, scaled: scale(r.amountPerGroup, groups, spareGroups, ROUNDING_STEP[r.amountUnit]) })),
    apparatus: prep.apparatus.map((a) => ({ ...a, scaled: scale(a.perGroup, groups, spareGroups, 1) })),
  };
}

/** "1.0 mol/dm³", "20 volume", "6 % w/v", or a dash when no concentration is given. */
export function formatConcentration(value: number | null, unit: PrepReagent["concentrationUnit"]): string {
  if (value == null) return "—";
  return `${formatAmount(value)} ${unit}`;
}

/** A quantity as a technician reads it: no long decimal tails, no floating-point noise. */
export function formatAmount(value: number): string {
  return new Intl.NumberFormat("en-GB", { maximumFractionDigits: 3, useGrouping: false }).format(value);
}
