// A bracketed root without derivatives: the Illinois variant of regula falsi.

/**
 * Root of fn on [a, b] (fa, fb of opposite sign) to within `tolerance` in x: regula falsi with the
 * Illinois modification (Dowell & Jarratt, BIT 11 (1971) 168; from memory) and a bisection step
 * whenever a step shrinks the bracket by less than a quarter.
 */
export function illinoisRoot(fn: (t: number) => number, a: number, b: number, fa: number, fb: number, tolerance: number): number {
  let side = 0;
  for (let i = 0; i < 100 && Math.abs(b - a) > tolerance; i++) {
    const width = Math.abs(b - a);
    let x = (a * fb - b * fa) / (fb - fa);
    if (!Number.isFinite(x) || side === 2) x = (a + b) / 2;
    // Keep the trial at least tol/2 inside the bracket so that it collapses once the root is close.
    const lo = Math.min(a, b) + tolerance / 2;
    const hi = Math.max(a, b) - tolerance / 2;
    x = Math.min(Math.max(x, lo), hi);
    const fx = fn(x);
    if (fx > 0 === fb > 0) {
      b = x;
      fb = fx;
      if (side === -1) fa /= 2; // Illinois: halve the stale end
      side = -1;
    } else {
      a = x;
      fa = fx;
      if (side === 1) fb /= 2;
      side = 1;
    }
    if (Math.abs(b - a) > 0.75 * width) side = 2; // slow progress: bisect next
  }
  return (a + b) / 2;
}
