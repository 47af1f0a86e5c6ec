// Polynomial interpolation through distinct nodes (the Lagrange interpolant) in Newton's form:
// divided differences, then nested evaluation. Newton's form also gives the size of its last term,
// the change made by the last node: with the nodes ordered nearest first it estimates the error of
// the interpolant without that node (a conservative estimate for the one with it).
// Burden & Faires, Numerical Analysis, 9th ed., sec. 3.1-3.3 (Newton's divided differences; from memory).

/**
 * Newton coefficients c[0..n) of the polynomial through (x[i], y[i]), i < n (distinct x):
 * c[k] = f[x_0, ..., x_k]. Writes into c (length >= n).
 */
export function newtonCoefficients(x: ArrayLike<number>, y: ArrayLike<number>, n: number, c: Float64Array): void {
  for (let i = 0; i < n; i++) c[i] = y[i]!;
  for (let j = 1; j < n; j++) {
    for (let i = n - 1; i >= j; i--) c[i] = (c[i]! - c[i - 1]!) / (x[i]! - x[i - j]!);
  }
}

/**
 * The Newton form with abscissae z[0..n) and coefficients c at t: out[0] = P(t), out[1] = P'(t),
 * out[2] = the last term c[n-1] (t - z_0) ... (t - z_{n-2}) (P minus the form without it).
 */
export function newtonEvaluate(z: ArrayLike<number>, c: ArrayLike<number>, n: number, t: number, out: Float64Array): void {
  let p = c[n - 1]!;
  let dp = 0;
  let last = c[n - 1]!;
  for (let k = n - 2; k >= 0; k--) {
    const d = t - z[k]!;
    dp = dp * d + p;
    p = p * d + c[k]!;
    last *= d;
  }
  out[0] = p;
  out[1] = dp;
  out[2] = last;
}

/** The value at t of the polynomial through (x[i], y[i]) (distinct x; allocates: for light use and tests). */
export function lagrange(x: ArrayLike<number>, y: ArrayLike<number>, t: number): number {
  if (x.length !== y.length || x.length === 0) throw new RangeError('lagrange needs as many values as nodes, at least one');
  const c = new Float64Array(x.length);
  const out = new Float64Array(3);
  newtonCoefficients(x, y, x.length, c);
  newtonEvaluate(x, c, x.length, t, out);
  return out[0]!;
}
