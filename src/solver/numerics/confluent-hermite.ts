// Hermite interpolation: the polynomial matching values and derivatives (first, optionally second)
// at each node, in Newton's form over repeated nodes (confluent divided differences; a node given
// with m values appears m times and its k-th divided difference is f^(k)/k!).
// Burden & Faires, Numerical Analysis, 9th ed., sec. 3.4 (from memory).

import { newtonEvaluate } from './lagrange.js';

/**
 * Abscissae z[0..n m) and Newton coefficients c[0..n m) of the Hermite polynomial through nodes
 * x[0..n), where derivs[k][i] = f^(k)(x_i) for k < m = derivs.length (1 to 3). The degree is n m - 1.
 * Writes into z and c (length >= n m).
 */
export function hermiteCoefficients(x: ArrayLike<number>, derivs: readonly ArrayLike<number>[], n: number, z: Float64Array, c: Float64Array): void {
  const m = derivs.length;
  if (m < 1 || m > 3) throw new RangeError(`hermiteCoefficients takes values and up to two derivatives, got ${m} orders`);
  const size = n * m;
  for (let i = 0; i < size; i++) {
    const node = Math.floor(i / m);
    z[i] = x[node]!;
    c[i] = derivs[0]![node]!;
  }
  for (let j = 1; j < size; j++) {
    for (let i = size - 1; i >= j; i--) {
      const node = Math.floor(i / m);
      // z_{i-j} .. z_i all one node exactly when i - j belongs to it (j < m then).
      c[i] = Math.floor((i - j) / m) === node
        ? derivs[j]![node]! / (j === 2 ? 2 : 1)
        : (c[i]! - c[i - 1]!) / (z[i]! - z[i - j]!);
    }
  }
}

/** Value and first derivative at t of the Hermite polynomial through the nodes (allocates: for light use and tests). */
export function hermite(x: ArrayLike<number>, derivs: readonly ArrayLike<number>[], t: number): { value: number; slope: number } {
  const size = x.length * derivs.length;
  if (x.length === 0 || derivs.some((d) => d.length !== x.length)) throw new RangeError('hermite needs one value per node for each order');
  const z = new Float64Array(size);
  const c = new Float64Array(size);
  const out = new Float64Array(3);
  hermiteCoefficients(x, derivs, x.length, z, c);
  newtonEvaluate(z, c, size, t, out);
  return { value: out[0]!, slope: out[1]! };
}
