import type { CheckOutcome } from "@/lib/checks/types";

/** A number to four significant figures, without trailing noise. */
export const fourFigures = (n: number) => String(Number(n.toPrecision(4)));

/**
 * The rows every staff view of a check shares, inside a `<dl>`: the value expected from this
 * student's own data, how far off the answer is against the teacher's tolerance, the likely slip,
 * significant figures, unit and tangent. Each row shows only when the engine has something to say.
 */
export function CheckOutcomeRows({ outcome: o, tolerancePercent }: { outcome: CheckOutcome; tolerancePercent: number }) {
  return (
    <>
      {o.expected ? (
        <>
          <dt className="font-semibold">Expected</dt>
          <dd className="tabular-nums">
            {fourFigures(o.expected.value)}
            {o.expected.uncertainty ? ` ± ${Number(o.expected.uncertainty.toPrecision(2))}` : ""}
            {o.expected.unit ? ` ${o.expected.unit}` : ""} <span className="text-muted">from this student&apos;s data</span>
          </dd>
        </>
      ) : null}
      {o.deviationPercent != null ? (
        <>
          <dt className="font-semibold">Deviation</dt>
          <dd className="tabular-nums">
            {o.deviationPercent >= 0 ? "+" : "−"}
            {Math.abs(o.deviationPercent).toFixed(1)} % <span className="text-muted">(allowed ±{tolerancePercent} %)</span>
          </dd>
        </>
      ) : null}
      {o.likelySlip ? (
        <>
          <dt className="font-semibold">Likely slip</dt>
          <dd>{o.likelySlip.message}</dd>
        </>
      ) : null}
      {o.sigFigs.message ? (
        <>
          <dt className="font-semibold">Significant figures</dt>
          <dd>{o.sigFigs.message}</dd>
        </>
      ) : null}
      {o.unit.message ? (
        <>
          <dt className="font-semibold">Unit</dt>
          <dd>{o.unit.message}</dd>
        </>
      ) : null}
      {o.tangent ? (
        <>
          <dt className="font-semibold">Tangent</dt>
          <dd>{o.tangent.message}</dd>
        </>
      ) : null}
    </>
  );
}
