import { GhsPictogram } from "@/components/practicals/ghs-pictogram";
import { StandingCaution } from "@/components/practicals/standing-caution";
import { Badge } from "@/components/ui/badge";
import { EYE_PROTECTION, GHS_PICTOGRAMS } from "@/lib/ghs";
import type { PracticalContent } from "@/lib/validation/practicals";

/**
 * The practical's safety section as a student reads it before recording anything: each hazard
 * with its pictograms named in words, how the risk is controlled, the eye protection, what to
 * do if something goes wrong, and the standing caution to follow the school's own risk
 * assessment. Renders on the server (no browser code).
 */
export function SafetyDetails({ safety }: { safety: PracticalContent["safety"] }) {
  const eye = EYE_PROTECTION.find((e) => e.value === safety.eyeProtection)?.label;
  return (
    <div className="flex flex-col gap-4">
      <StandingCaution />
      <div className="flex flex-wrap items-center gap-2">
        <svg width="28" height="20" viewBox="0 0 28 20" aria-hidden="true" focusable="false" className="text-brand">
          <path d="M2 6q12-5 24 0v5q-1 6-7 6-3 0-5-3-2 3-5 3-6 0-7-6z" fill="none" stroke="currentColor" strokeWidth="2" strokeLinejoin="round" />
        </svg>
        <span className="font-semibold">Eye protection:</span>
        <span>{eye ?? "Ask your teacher"}</span>
        {safety.otherPpe.map((p, i) => (
          <Badge key={i}>{p}</Badge>
        ))}
      </div>
      {safety.hazards.length ? (
        <ul className="flex flex-col gap-3" aria-label="Hazards">
          {safety.hazards.map((h) => (
            <li key={h.id} className="rounded-lg border border-line bg-paper p-3">
              <div className="flex flex-wrap items-start justify-between gap-2">
                <h3 className="font-bold">{h.substance}</h3>
                {h.signalWord !== "None" ? <Badge tone={h.signalWord === "Danger" ? "bad" : "warn"}>{h.signalWord}</Badge> : null}
              </div>
              {h.pictograms.length ? (
                <ul className="my-2 flex flex-wrap gap-3" aria-label="Hazard symbols">
                  {h.pictograms.map((code) => {
                    const p = GHS_PICTOGRAMS.find((g) => g.code === code);
                    return (
                      <li key={code} className="flex max-w-64 items-center gap-2">
                        <GhsPictogram code={code} size={48} decorative />
                        <span className="text-[0.95rem]">
                          <strong>{p?.name}</strong>
                          <span className="block text-muted">{p?.meaning}</span>
                        </span>
                      </li>
                    );
                  })}
                </ul>
              ) : null}
              {h.hazardStatements ? (
                <p>
                  <strong>Hazard: </strong>
                  {h.hazardStatements}
                </p>
              ) : null}
              <p>
                <strong>How the risk is controlled: </strong>
                {h.controls}
              </p>
            </li>
          ))}
        </ul>
      ) : (
        <p className="text-muted">This practical lists no hazards. Ask your teacher before you start if you are unsure.</p>
      )}
      {safety.emergency.trim() ? (
        <div>
          <h3 className="font-bold">If something goes wrong</h3>
          <p className="whitespace-pre-line">{safety.emergency}</p>
        </div>
      ) : null}
      {safety.riskAssessmentRef.trim() ? (
        <p className="text-[0.95rem] text-muted">
          <strong>Risk assessment: </strong>
          {safety.riskAssessmentRef}
        </p>
      ) : null}
    </div>
  );
}
