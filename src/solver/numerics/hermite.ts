// Cubic Hermite interpolation on one step: the cubic through two nodes' values and derivatives
// (Burden & Faires, Numerical Analysis, 9th ed., sec. 3.4; from memory).

/**
 * Weights at fraction u in [0, 1] of a step of length h, written into out (8 numbers, no allocation):
 * value = out[0] p0 + out[1] m0 + out[2] p1 + out[3] m1, derivative = out[4] p0 + out[5] m0 + out[6] p1 + out[7] m1,
 * where p are the node values and m their derivatives with respect to the step's own variable.
 */
export function cubicHermiteWeights(u: number, h: number, out: Float64Array | number[]): void {
  const u2 = u * u;
  const u3 = u2 * u;
  out[0] = 2 * u3 - 3 * u2 + 1;
  out[1] = (u3 - 2 * u2 + u) * h;
  out[2] = -2 * u3 + 3 * u2;
  out[3] = (u3 - u2) * h;
  out[4] = (6 * u2 - 6 * u) / h;
  out[5] = 3 * u2 - 4 * u + 1;
  out[6] = (-6 * u2 + 6 * u) / h;
  out[7] = 3 * u2 - 2 * u;
}
