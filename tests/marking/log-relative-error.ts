/**
 * Log relative error, the number of agreeing significant digits used by NIST's StRD:
 * LRE = -log10(|estimate - certified| / |certified|), or -log10(|estimate|) when the certified
 * value is 0; capped at 15; 0 for a non-finite estimate.
 */
export function logRelativeError(estimate: number, certified: number): number {
  if (!Number.isFinite(estimate)) return 0;
  const error = certified === 0 ? Math.abs(estimate) : Math.abs(estimate - certified) / Math.abs(certified);
  if (error === 0) return 15;
  return Math.max(0, Math.min(15, -Math.log10(error)));
}
