// Time grids for tracks: a regular grid from start to stop, or a list of epochs. TT seconds since J2000.

/** Samples of the regular grid start, start +- step, ... ending exactly at stop (the last step may be shorter). */
export function regularGridCount(startTT: number, stopTT: number, stepS: number): number {
  if (!(stepS > 0)) throw new RangeError('step must be positive');
  const span = Math.abs(stopTT - startTT);
  // Tolerance of a microsecond so that a stop on the grid does not add a sliver of a step. One
  // division: a tiny step gives an infinite count (never Infinity - Infinity = NaN).
  const steps = Math.ceil((span - 1e-6) / stepS);
  return Math.max(steps, 0) + 1;
}

/** The regular grid (forwards when stop > start, backwards when stop < start); in memory `lend(n)` gives, when it gives n numbers. */
export function regularGrid(startTT: number, stopTT: number, stepS: number, lend?: (n: number) => Float64Array | undefined): Float64Array {
  const n = regularGridCount(startTT, stopTT, stepS);
  const direction = stopTT >= startTT ? 1 : -1;
  const lent = lend?.(n);
  const epochs = lent && lent.length >= n ? lent.subarray(0, n) : new Float64Array(n);
  // start + k * step (not repeated addition): no drift over long grids.
  for (let k = 0; k < n - 1; k++) epochs[k] = startTT + direction * k * stepS;
  epochs[n - 1] = stopTT;
  return epochs;
}

