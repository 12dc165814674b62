"use client";

import { useId, useState } from "react";
import { Button } from "@/components/ui/button";
import { Field, Input, Select } from "@/components/ui/field";
import { MarkingInputError, solveDilution, type Dilution } from "@/lib/marking";
import { PREP_CHECK_LINE } from "@/lib/ghs";
import { formatResult, readPositive } from "./read-number";

type Quantity = "c1" | "v1" | "c2" | "v2";
const CONCENTRATION_UNITS = ["mol/dm³", "g/dm³", "% w/v", "volume"] as const;
const VOLUME_UNITS = ["cm³", "dm³"] as const;

const QUANTITIES: Record<Quantity, { label: string; symbol: string; what: string; kind: "concentration" | "volume"; solveLabel: string }> = {
  c1: { label: "Stock concentration", symbol: "c1", what: "the stock concentration", kind: "concentration", solveLabel: "the stock concentration needed (c1)" },
  v1: { label: "Volume of stock", symbol: "V1", what: "the volume of stock", kind: "volume", solveLabel: "the volume of stock to use (V1)" },
  c2: { label: "Concentration wanted", symbol: "c2", what: "the concentration wanted", kind: "concentration", solveLabel: "the concentration after diluting (c2)" },
  v2: { label: "Final volume", symbol: "V2", what: "the final volume", kind: "volume", solveLabel: "the final volume (V2)" },
};
const ORDER: Quantity[] = ["c1", "v1", "c2", "v2"];

const FORMULA_FOR: Record<Quantity, string> = {
  c1: "c1 = c2 × V2 ÷ V1",
  v1: "V1 = c2 × V2 ÷ c1",
  c2: "c2 = c1 × V1 ÷ V2",
  v2: "V2 = c1 × V1 ÷ c2",
};

type Outcome = { ok: true; result: Dilution; typed: Partial<Record<Quantity, string>> } | { ok: false; errors: Partial<Record<Quantity | "form", string>> };

/** Works out the one unknown of c1 V1 = c2 V2, with the engine refusing impossible requests. */
export function solveFromText(unknown: Quantity, typed: Record<Quantity, string>): Outcome {
  const errors: Partial<Record<Quantity | "form", string>> = {};
  const known: Partial<Record<Quantity, number>> = {};
  for (const q of ORDER) {
    if (q === unknown) continue;
    const r = readPositive(typed[q], QUANTITIES[q].what);
    if (r.ok) known[q] = r.value;
    else errors[q] = r.message;
  }
  if (Object.keys(errors).length) return { ok: false, errors };
  try {
    return { ok: true, result: solveDilution(known), typed: Object.fromEntries(ORDER.filter((q) => q !== unknown).map((q) => [q, typed[q].trim()])) };
  } catch (e) {
    if (!(e instanceof MarkingInputError)) throw e;
    if (e.code === "impossible-request") {
      // With both concentrations given, only c2 > c1 can be impossible: the engine's message says so.
      if (unknown === "v1" || unknown === "v2") return { ok: false, errors: { c2: e.message } };
      // With both volumes given, the cause is V1 > V2, whichever consequence the engine names.
      return { ok: false, errors: { v1: "The volume of stock cannot be more than the final volume: diluting only adds water. Check V1 and V2." } };
    }
    return { ok: false, errors: { form: e.message } };
  }
}

export function DilutionCalculator() {
  const p = useId().replace(/[^a-zA-Z0-9]/g, "");
  const [unknown, setUnknown] = useState<Quantity>("v1");
  const [typed, setTyped] = useState<Record<Quantity, string>>({ c1: "", v1: "", c2: "", v2: "" });
  const [cUnit, setCUnit] = useState<(typeof CONCENTRATION_UNITS)[number]>("mol/dm³");
  const [vUnit, setVUnit] = useState<(typeof VOLUME_UNITS)[number]>("cm³");
  const [submitted, setSubmitted] = useState(false);

  const outcome = submitted ? solveFromText(unknown, typed) : null;
  const errors = outcome && !outcome.ok ? outcome.errors : {};
  const unitOf = (q: Quantity) => (QUANTITIES[q].kind === "concentration" ? cUnit : vUnit);
  const show = (q: Quantity, value: number) => `${formatResult(value)} ${unitOf(q)}`;

  return (
    <form
      noValidate
      aria-labelledby={`${p}-h`}
      className="flex flex-col gap-4"
      onSubmit={(e) => {
        e.preventDefault();
        setSubmitted(true);
        const next = solveFromText(unknown, typed);
        if (!next.ok) {
          const first = ORDER.find((q) => next.errors[q]);
          if (first) requestAnimationFrame(() => document.getElementById(`${p}-${first}`)?.focus());
        }
      }}
    >
      <h2 id={`${p}-h`} className="text-xl font-bold">
        Diluting a solution (c1 V1 = c2 V2)
      </h2>
      <fieldset className="flex flex-col gap-1">
        <legend className="mb-1 font-semibold">Work out</legend>
        <div className="grid gap-1 sm:grid-cols-2">
          {ORDER.map((q) => (
            <label key={q} htmlFor={`${p}-solve-${q}`} className="flex min-h-11 cursor-pointer items-center gap-3 rounded-md px-1 hover:bg-sunken">
              <input id={`${p}-solve-${q}`} type="radio" name={`${p}-solve`} className="size-5 accent-brand" checked={unknown === q} onChange={() => setUnknown(q)} />
              <span>{QUANTITIES[q].solveLabel.charAt(0).toUpperCase() + QUANTITIES[q].solveLabel.slice(1)}</span>
            </label>
          ))}
        </div>
      </fieldset>
      <div className="grid gap-4 sm:grid-cols-2">
        <Field id={`${p}-cunit`} label="Concentration unit" hint="c1 and c2 are in the same unit.">
          {(a) => (
            <Select {...a} value={cUnit} onChange={(e) => setCUnit(e.target.value as typeof cUnit)}>
              {CONCENTRATION_UNITS.map((u) => (
                <option key={u} value={u}>
                  {u === "volume" ? "volume strength (for hydrogen peroxide)" : u}
                </option>
              ))}
            </Select>
          )}
        </Field>
        <Field id={`${p}-vunit`} label="Volume unit" hint="V1 and V2 are in the same unit.">
          {(a) => (
            <Select {...a} value={vUnit} onChange={(e) => setVUnit(e.target.value as typeof vUnit)}>
              {VOLUME_UNITS.map((u) => (
                <option key={u} value={u}>
                  {u}
                </option>
              ))}
            </Select>
          )}
        </Field>
      </div>
      <div className="grid gap-4 sm:grid-cols-3">
        {ORDER.filter((q) => q !== unknown).map((q) => (
          <Field key={q} id={`${p}-${q}`} label={`${QUANTITIES[q].label}, ${QUANTITIES[q].symbol} (${unitOf(q)})`} error={errors[q]}>
            {(a) => <Input {...a} inputMode="decimal" autoComplete="off" value={typed[q]} onChange={(e) => setTyped({ ...typed, [q]: e.target.value })} />}
          </Field>
        ))}
      </div>
      <div>
        <Button type="submit">Work it out</Button>
      </div>
      <div aria-live="polite" className="flex flex-col gap-3">
        {errors.form ? <p className="font-semibold text-bad">{errors.form}</p> : null}
        {outcome?.ok ? <DilutionResult r={outcome.result} typed={outcome.typed} show={show} cUnit={cUnit} vUnit={vUnit} /> : null}
      </div>
    </form>
  );
}

function DilutionResult({ r, typed, show, cUnit, vUnit }: { r: Dilution; typed: Partial<Record<Quantity, string>>; show: (q: Quantity, v: number) => string; cUnit: string; vUnit: string }) {
  const shown = (q: Quantity) => (typed[q] ? `${typed[q]} ${QUANTITIES[q].kind === "concentration" ? cUnit : vUnit}` : show(q, r[q]));
  const solved = r.solvedFor;
  return (
    <div className="flex flex-col gap-3 rounded-lg border border-brand/40 bg-brand-soft/40 p-4">
      <h3 className="font-bold">Result</h3>
      <p className="text-2xl font-bold">
        {QUANTITIES[solved].symbol} = {show(solved, r[solved])}
      </p>
      <div>
        <p className="font-semibold">Inputs</p>
        <ul className="list-disc pl-5">
          {ORDER.filter((q) => q !== solved).map((q) => (
            <li key={q}>
              {QUANTITIES[q].label}, {QUANTITIES[q].symbol} = {shown(q)}
            </li>
          ))}
        </ul>
      </div>
      <div>
        <p className="font-semibold">How it is worked out</p>
        <p>
          Diluting adds water but not solute, so the amount of solute stays the same: stock concentration × volume of stock = concentration after diluting × final volume
          (c1 × V1 = c2 × V2). Rearranged: {FORMULA_FOR[solved]}.
        </p>
      </div>
      <div>
        <p className="font-semibold">To make it</p>
        <p>
          Measure {solved === "v1" ? show("v1", r.v1) : shown("v1")} of the {solved === "c1" ? show("c1", r.c1) : shown("c1")} stock and make it up to {solved === "v2" ? show("v2", r.v2) : shown("v2")} with distilled water
          {r.solventToAdd > 0 ? ` (about ${formatResult(r.solventToAdd)} ${vUnit} of water)` : ""}. This gives {solved === "c2" ? show("c2", r.c2) : shown("c2")}.
        </p>
      </div>
      <p className="font-bold">{PREP_CHECK_LINE}</p>
    </div>
  );
}
