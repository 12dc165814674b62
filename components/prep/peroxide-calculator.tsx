"use client";

import { useId, useState } from "react";
import { Button } from "@/components/ui/button";
import { Field, Input, Select } from "@/components/ui/field";
import { PREP_CHECK_LINE } from "@/lib/ghs";
import { convertPeroxideStrength, MarkingInputError, physicalConstants, type PeroxideStrength } from "@/lib/marking";
import { formatResult, readPositive } from "./read-number";

type Known = "volumeStrength" | "concentration" | "percentWeightPerVolume";
const KNOWN: Record<Known, { label: string; unit: string; what: string }> = {
  volumeStrength: { label: "Volume strength", unit: "volume", what: "the volume strength" },
  concentration: { label: "Concentration", unit: "mol/dm³", what: "the concentration" },
  percentWeightPerVolume: { label: "Percentage, weight per volume", unit: "% w/v", what: "the percentage" },
};
const ORDER: Known[] = ["volumeStrength", "concentration", "percentWeightPerVolume"];

type Outcome = { ok: true; result: PeroxideStrength; given: Known } | { ok: false; message: string };

/** Converts one typed strength of hydrogen peroxide into the other two, through the engine. */
export function convertFromText(known: Known, typed: string): Outcome {
  const r = readPositive(typed, KNOWN[known].what);
  if (!r.ok) return { ok: false, message: r.message };
  try {
    const input = known === "volumeStrength" ? { volumeStrength: r.value } : known === "concentration" ? { concentration: r.value } : { percentWeightPerVolume: r.value };
    return { ok: true, result: convertPeroxideStrength(input), given: known };
  } catch (e) {
    if (e instanceof MarkingInputError) return { ok: false, message: e.message };
    throw e;
  }
}

export function PeroxideCalculator() {
  const p = useId().replace(/[^a-zA-Z0-9]/g, "");
  const [known, setKnown] = useState<Known>("volumeStrength");
  const [typed, setTyped] = useState("");
  const [submitted, setSubmitted] = useState(false);
  const outcome = submitted ? convertFromText(known, typed) : null;
  const fiveFigures = new Intl.NumberFormat("en-GB", { maximumSignificantDigits: 5 });
  const vm = fiveFigures.format(physicalConstants.molarVolumeAt273K101kPa);
  const mr = fiveFigures.format(physicalConstants.hydrogenPeroxideMolarMass);

  return (
    <form
      noValidate
      aria-labelledby={`${p}-h`}
      className="flex flex-col gap-4"
      onSubmit={(e) => {
        e.preventDefault();
        setSubmitted(true);
        if (!convertFromText(known, typed).ok) requestAnimationFrame(() => document.getElementById(`${p}-value`)?.focus());
      }}
    >
      <h2 id={`${p}-h`} className="text-xl font-bold">
        Hydrogen peroxide strength
      </h2>
      <p className="text-muted">Converts between volume strength (for example &ldquo;20 volume&rdquo;), concentration in mol/dm³ and percentage weight per volume.</p>
      <div className="grid gap-4 sm:grid-cols-2">
        <Field id={`${p}-known`} label="The strength you know">
          {(a) => (
            <Select {...a} value={known} onChange={(e) => setKnown(e.target.value as Known)}>
              {ORDER.map((k) => (
                <option key={k} value={k}>
                  {KNOWN[k].label} ({KNOWN[k].unit})
                </option>
              ))}
            </Select>
          )}
        </Field>
        <Field id={`${p}-value`} label={`${KNOWN[known].label} (${KNOWN[known].unit})`} error={outcome && !outcome.ok ? outcome.message : undefined}>
          {(a) => <Input {...a} inputMode="decimal" autoComplete="off" value={typed} onChange={(e) => setTyped(e.target.value)} />}
        </Field>
      </div>
      <div>
        <Button type="submit">Convert</Button>
      </div>
      <div aria-live="polite">
        {outcome?.ok ? (
          <div className="flex flex-col gap-3 rounded-lg border border-brand/40 bg-brand-soft/40 p-4">
            <h3 className="font-bold">Result</h3>
            <dl className="grid gap-2 sm:grid-cols-3">
              {ORDER.map((k) => (
                <div key={k}>
                  <dt className="text-sm text-muted">
                    {KNOWN[k].label}
                    {k === outcome.given ? " (your input)" : ""}
                  </dt>
                  <dd className="text-xl font-bold">
                    {formatResult(outcome.result[k])} {KNOWN[k].unit}
                  </dd>
                </div>
              ))}
            </dl>
            <div>
              <p className="font-semibold">How it is worked out</p>
              <p>
                Hydrogen peroxide decomposes as 2 H₂O₂ → 2 H₂O + O₂. A &ldquo;V volume&rdquo; solution gives V dm³ of oxygen, measured at 0 °C and 101.325 kPa, from each dm³ of
                solution. One mole of gas takes up {vm} dm³ at that temperature and pressure, and each mole of oxygen comes from two moles of hydrogen peroxide, so the
                concentration in mol/dm³ = 2 × volume strength ÷ {vm}. The percentage weight per volume (grams in 100 cm³) = concentration × {mr} ÷ 10, where {mr} g/mol is the
                molar mass of hydrogen peroxide.
              </p>
            </div>
            <p className="font-bold">{PREP_CHECK_LINE}</p>
          </div>
        ) : null}
      </div>
    </form>
  );
}
