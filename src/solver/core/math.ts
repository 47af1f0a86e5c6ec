// Shared numeric helpers and constants for the solver. No state, no I/O.

export const TWO_PI = 2 * Math.PI;
export const DEG = Math.PI / 180;
export const RAD = 180 / Math.PI;
export const SECONDS_PER_DAY = 86_400;

/**
 * TT seconds since J2000 rounded to the nearest microsecond (the nearest double to it). TT - UTC is
 * a whole number of microseconds (whole leap seconds + 32.184 s) and J2000.0 is 12:00:00 TT, so
 * this is also the nearest microsecond of UTC: the instant printed to the microsecond. Idempotent:
 * the integer count of microseconds (below 2^53 over 1972-2199) is exact and the division rounds once.
 */
export const roundToMicrosecond = (tt: number): number => Math.round(tt * 1e6) / 1e6;

/** acos with its argument clamped to [-1, 1] against rounding just outside the domain. */
export function acosClamped(x: number): number {
  return Math.acos(x > 1 ? 1 : x < -1 ? -1 : x);
}

/** asin with its argument clamped to [-1, 1]. */
export function asinClamped(x: number): number {
  return Math.asin(x > 1 ? 1 : x < -1 ? -1 : x);
}

/** Angle reduced to [0, 2pi); an angle already in range comes back unchanged. */
export function wrapTwoPi(angle: number): number {
  if (angle >= 0 && angle < TWO_PI) return angle;
  const r = angle % TWO_PI;
  const w = r < 0 ? r + TWO_PI : r;
  return w < TWO_PI ? w : 0; // a tiny negative angle would otherwise round up to 2pi
}

/** Angle reduced to (-pi, pi]; an angle already in range comes back unchanged (no rounding near 0). */
export function wrapPi(angle: number): number {
  if (angle > -Math.PI && angle <= Math.PI) return angle;
  const r = wrapTwoPi(angle);
  return r > Math.PI ? r - TWO_PI : r;
}

/** Relative difference |a - b| / max(|a|, |b|, tiny); 0 when both are 0. */
export function relativeDifference(a: number, b: number): number {
  const scale = Math.max(Math.abs(a), Math.abs(b));
  return scale === 0 ? 0 : Math.abs(a - b) / scale;
}

/**
 * floor(n / d) for integers 0 <= n < 2^53 and d > 0, from the product with inverse = 1 / d and a
 * one-step correction where its rounding crossed an integer (exact integer arithmetic): the same
 * quotient as the division, without one (common practice, no source).
 */
export function quotient(n: number, d: number, inverse: number): number {
  const q = Math.floor(n * inverse);
  const r = n - q * d;
  return r < 0 ? q - 1 : r >= d ? q + 1 : q;
}
