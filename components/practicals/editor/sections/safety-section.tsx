"use client";

import { Button } from "@/components/ui/button";
import { EYE_PROTECTION, GHS_PICTOGRAMS, SIGNAL_WORDS, type GhsCode } from "@/lib/ghs";
import type { PracticalContent } from "@/lib/validation/practicals";
import { cn } from "@/lib/utils";
import { ConfirmButton } from "@/components/ui/confirm-button";
import { fieldDomId, type Draft } from "../../draft";
import { GhsPictogram } from "../../ghs-pictogram";
import { newPartId } from "../../ids";
import { StandingCaution } from "../../standing-caution";
import { ChoiceGroup, PathErrors, TextAreaField, TextField, useErrorsUnder } from "../fields";
import { changeContent, removeAt, replaceAt, type Change } from "../state";
import { StringList } from "../string-list";

type Safety = PracticalContent["safety"];
type Hazard = Safety["hazards"][number];

const SIGNAL_HINTS: Record<(typeof SIGNAL_WORDS)[number], string> = {
  Danger: "Danger — the more severe hazards",
  Warning: "Warning — the less severe hazards",
  None: "No signal word",
};

/** The nine pictograms as toggle buttons: press to add one to the hazard, press again to take it off. */
export function PictogramPicker({ path, value, onChange }: { path: string; value: GhsCode[]; onChange: (codes: GhsCode[]) => void }) {
  return (
    <ChoiceGroup path={path} legend="GHS pictograms" hint="Choose the ones on the supplier's label or safety data sheet. Press again to remove one.">
      <ul className="grid grid-cols-3 gap-2 sm:grid-cols-5 lg:grid-cols-9">
        {GHS_PICTOGRAMS.map((p) => {
          const on = value.includes(p.code);
          return (
            <li key={p.code}>
              <button
                type="button"
                aria-pressed={on}
                title={p.meaning}
                onClick={() => onChange(on ? value.filter((c) => c !== p.code) : GHS_PICTOGRAMS.map((x) => x.code).filter((c) => c === p.code || value.includes(c)))}
                className={cn(
                  "flex h-full w-full flex-col items-center gap-1 rounded-md border-2 p-1.5 text-center text-xs leading-tight",
                  on ? "border-brand bg-brand-soft font-bold text-brand-strong" : "border-line bg-surface text-ink hover:border-brand",
                )}
              >
                <GhsPictogram code={p.code} size={48} decorative />
                <span>{p.name}</span>
                <span className="sr-only">{on ? " (chosen)" : ""}</span>
              </button>
            </li>
          );
        })}
      </ul>
    </ChoiceGroup>
  );
}

function HazardCard({ hazard, index, onChange, onRemove }: { hazard: Hazard; index: number; onChange: (h: Hazard) => void; onRemove: () => void }) {
  const base = `content.safety.hazards.${index}`;
  const problems = useErrorsUnder(base);
  return (
    <li id={fieldDomId(base)} tabIndex={-1} className={cn("flex flex-col gap-4 rounded-lg border bg-surface p-4", problems ? "border-warn" : "border-line")}>
      <div className="flex flex-wrap items-start justify-between gap-2">
        <h3 className="text-lg font-bold">
          Hazard {index + 1}
          {hazard.substance.trim() ? <span className="font-normal text-muted">: {hazard.substance}</span> : null}
        </h3>
        <ConfirmButton
          tone="caution"
          size="sm"
          label="Remove hazard"
          variant="ghost"
          question={`Remove hazard ${index + 1}${hazard.substance.trim() ? ` (${hazard.substance.trim()})` : ""} and what you wrote about it?`}
          confirmLabel="Yes, remove it"
          onConfirm={onRemove}
        />
      </div>
      <TextField
        path={`${base}.substance`}
        label="Substance or activity"
        hint="With its concentration where it matters, for example “hydrochloric acid, 1.0 mol/dm³” or “hot water bath”."
        value={hazard.substance}
        onChange={(substance) => onChange({ ...hazard, substance })}
      />
      <PictogramPicker path={`${base}.pictograms`} value={hazard.pictograms} onChange={(pictograms) => onChange({ ...hazard, pictograms })} />
      <ChoiceGroup path={`${base}.signalWord`} legend="Signal word">
        <div className="flex flex-wrap gap-x-5 gap-y-1">
          {SIGNAL_WORDS.map((w) => (
            <label key={w} className="flex min-h-11 items-center gap-2">
              <input type="radio" name={`${base}-signal`} className="size-5 accent-brand" checked={hazard.signalWord === w} onChange={() => onChange({ ...hazard, signalWord: w })} />
              {SIGNAL_HINTS[w]}
            </label>
          ))}
        </div>
      </ChoiceGroup>
      <TextAreaField
        path={`${base}.hazardStatements`}
        label="Hazard statements"
        hint="From the safety data sheet, for example “H315 Causes skin irritation. H319 Causes serious eye irritation.”"
        rows={2}
        value={hazard.hazardStatements}
        onChange={(hazardStatements) => onChange({ ...hazard, hazardStatements })}
      />
      <TextAreaField
        path={`${base}.controls`}
        label="Control measures"
        hint="How the risk is kept low: amounts, concentrations, eye protection, ventilation, supervision."
        rows={3}
        value={hazard.controls}
        onChange={(controls) => onChange({ ...hazard, controls })}
      />
    </li>
  );
}

export function SafetySection({ draft, change }: { draft: Draft; change: Change }) {
  const safety = draft.content.safety;
  const setSafety = (fn: (s: Safety) => Safety) => changeContent(change, "safety", fn);
  return (
    <div className="flex flex-col gap-6">
      <StandingCaution />
      <section aria-labelledby="hazards-heading" className="flex flex-col gap-3">
        <h3 id="hazards-heading" className="text-xl font-bold">
          Hazards and control measures
        </h3>
        <div id={fieldDomId("content.safety.hazards")} tabIndex={-1}>
          <PathErrors path="content.safety.hazards" />
        </div>
        {safety.hazards.length ? (
          <ol className="flex flex-col gap-4">
            {safety.hazards.map((h, i) => (
              <HazardCard
                key={h.id}
                hazard={h}
                index={i}
                onChange={(next) => setSafety((s) => ({ ...s, hazards: replaceAt(s.hazards, i, next) }))}
                onRemove={() => setSafety((s) => ({ ...s, hazards: removeAt(s.hazards, i) }))}
              />
            ))}
          </ol>
        ) : (
          <p className="text-muted">No hazards yet. List each substance or activity that could hurt someone, and how the risk is controlled.</p>
        )}
        <div>
          <Button
            variant="secondary"
            disabled={safety.hazards.length >= 30}
            onClick={() =>
              setSafety((s) => ({
                ...s,
                hazards: [...s.hazards, { id: newPartId("hz", s.hazards.map((h) => h.id)), substance: "", pictograms: [], signalWord: "None", hazardStatements: "", controls: "" }],
              }))
            }
          >
            Add a hazard
          </Button>
        </div>
      </section>

      <section aria-labelledby="ppe-heading" className="flex flex-col gap-4">
        <h3 id="ppe-heading" className="text-xl font-bold">
          Protective equipment
        </h3>
        <ChoiceGroup path="content.safety.eyeProtection" legend="Eye protection" hint="Eye protection is standard for work with chemicals.">
          <div className="flex flex-col">
            {EYE_PROTECTION.map((e) => (
              <label key={e.value} className="flex min-h-11 items-center gap-2">
                <input type="radio" name="eye-protection" className="size-5 accent-brand" checked={safety.eyeProtection === e.value} onChange={() => setSafety((s) => ({ ...s, eyeProtection: e.value }))} />
                {e.label}
              </label>
            ))}
          </div>
        </ChoiceGroup>
        <StringList
          path="content.safety.otherPpe"
          legend="Other protective equipment"
          hint="For example “lab coat”, “heat-resistant gloves”."
          itemLabel="Protective equipment"
          addLabel="Add protective equipment"
          items={safety.otherPpe}
          maxItems={10}
          maxLength={60}
          onChange={(otherPpe) => setSafety((s) => ({ ...s, otherPpe }))}
        />
      </section>

      <section aria-labelledby="emergency-heading" className="flex flex-col gap-4">
        <h3 id="emergency-heading" className="text-xl font-bold">
          If something goes wrong
        </h3>
        <TextAreaField
          path="content.safety.emergency"
          label="What to do"
          hint="Spills, splashes in the eye, burns, breakages: what students do and who they tell."
          rows={4}
          value={safety.emergency}
          onChange={(emergency) => setSafety((s) => ({ ...s, emergency }))}
        />
        <TextField
          path="content.safety.riskAssessmentRef"
          label="Risk assessment reference"
          hint="Where your school's risk assessment for this practical is kept, once you have checked it against that."
          value={safety.riskAssessmentRef}
          onChange={(riskAssessmentRef) => setSafety((s) => ({ ...s, riskAssessmentRef }))}
        />
      </section>
    </div>
  );
}
