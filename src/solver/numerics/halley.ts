// Halley's method kept inside a bracket: cubic convergence where it behaves, bisection where it does not.

/**
 * Root of an increasing f on [lo, hi] (f(lo) <= 0 <= f(hi)) by Halley's method (Danby 2nd ed.
 * ch. 6, from memory), falling back to bisection whenever a step leaves the bracket. Null when the cap is hit.
 */
export function safeguardedHalley(
  f: (x: number) => number,
  df: (x: number) => number,
  d2f: (x: number) => number,
  start: number,
  lo: number,
  hi: number,
  limits: { readonly maxIterations: number; readonly stepTolerance: number },
): number | null {
  const { maxIterations, stepTolerance } = limits;
  let x = Math.min(Math.max(start, lo), hi);
  for (let k = 0; k < maxIterations; k++) {
    const fx = f(x);
    if (fx === 0) return x;
    if (fx < 0) lo = x;
    else hi = x;
    const d1 = df(x);
    const step = fx / (d1 - (0.5 * fx * d2f(x)) / d1);
    const halley = x - step;
    // A step below the resolution of x: converged (it may touch the bracket end by rounding).
    if (Math.abs(step) <= stepTolerance * Math.abs(halley)) return halley;
    const next = halley > lo && halley < hi ? halley : 0.5 * (lo + hi);
    if (next === lo || next === hi || hi - lo <= stepTolerance * Math.abs(next)) return next;
    x = next;
  }
  return null;
}
