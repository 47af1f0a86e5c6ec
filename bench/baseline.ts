// The common baseline of every benchmark: one Math.sin and one Math.cos per iteration.
// Ratios against it are stable across machines where absolute times are not.

/** Runs the baseline loop `n` times; returns the sum so the work is not optimised away. */
export function baselineLoop(n: number, seed = 0.1): number {
  let acc = 0;
  let x = seed;
  for (let i = 0; i < n; i++) {
    acc += Math.sin(x) + Math.cos(x);
    x += 1e-3;
  }
  return acc;
}

/** Nanoseconds per call of `fn(n)` (n inner iterations), the best of `rounds` runs. */
export function nsPerIteration(fn: (n: number) => number, n: number, rounds = 5): { ns: number; sink: number } {
  let best = Infinity;
  let sink = 0;
  for (let r = 0; r < rounds; r++) {
    const t0 = process.hrtime.bigint();
    sink += fn(n);
    const dt = Number(process.hrtime.bigint() - t0);
    best = Math.min(best, dt / n);
  }
  return { ns: best, sink };
}
