// Kepler's equation in its elliptic, hyperbolic and parabolic forms, and the conversions between
// true, eccentric (hyperbolic, parabolic) and mean anomaly. Radians throughout; each function sits
// next to its inverse. The elliptic solver keeps the whole turns of M: E - e sin E = M for any M.

import { TWO_PI, wrapPi } from '../core/math.js';
import { failure, success, type Outcome } from '../core/result.js';
import { safeguardedHalley } from '../numerics/halley.js';

/** Iteration cap of the safeguarded solvers; a bisection fallback makes every step shrink the bracket. */
export const KEPLER_MAX_ITERATIONS = 200;
/** Relative step size at which an iteration counts as converged (a few units in the last place). */
const STEP_TOLERANCE = 1e-15;
const HALLEY_LIMITS = { maxIterations: KEPLER_MAX_ITERATIONS, stepTolerance: STEP_TOLERANCE };

/** Odd series x^3/3! - x^5/5! + ... = x - sin x, or sinh x - x with all signs +, for |x| < 1; no digits cancel. */
function cubicTail(x: number, hyperbolic: boolean): number {
  const x2 = x * x;
  let term = (x * x2) / 6;
  let sum = term;
  for (let k = 2; k < 30 && Math.abs(term) > 1e-17 * Math.abs(sum); k++) {
    term *= (hyperbolic ? x2 : -x2) / ((2 * k) * (2 * k + 1));
    sum += term;
  }
  return sum;
}

// ---- elliptic: E ----------------------------------------------------------------------------

/** Eccentric anomaly E from true anomaly nu, same half-turn as nu (Vallado 4th ed. Alg. 5, sin/cos form; alg. number from memory). */
export function eccentricFromTrue(nu: number, e: number): number {
  const base = Math.atan2(Math.sqrt((1 - e) * (1 + e)) * Math.sin(nu), e + Math.cos(nu));
  return nu + wrapPi(base - nu);
}

/** True anomaly nu from eccentric anomaly E, same half-turn as E (Vallado 4th ed. Alg. 6, sin/cos form; alg. number from memory). */
export function trueFromEccentric(E: number, e: number): number {
  const base = Math.atan2(Math.sqrt((1 - e) * (1 + e)) * Math.sin(E), Math.cos(E) - e);
  return E + wrapPi(base - E);
}

/** Mean anomaly M = E - e sin E (Kepler's equation; Vallado 4th ed. sec. 2.2), written
 * (1 - e) E + e (E - sin E) for |E| < 1 so it keeps its digits near e = 1, E = 0. */
export function meanFromEccentric(E: number, e: number): number {
  return Math.abs(E) < 1 ? (1 - e) * E + e * cubicTail(E, false) : E - e * Math.sin(E);
}

/**
 * E from M and 0 <= e < 1 (inverse of meanFromEccentric). M is reduced to (-pi, pi] and solved
 * on [0, pi] by symmetry; the whole turns are added back. Halley's iteration (Danby, Fundamentals
 * of Celestial Mechanics, 2nd ed., ch. 6, from memory) from the root of the cubic (1 - e) E + e E^3 / 6 = M,
 * which is a lower bound of E, kept inside the bracket [M, min(M + e, pi)] by bisection.
 */
export function solveKeplerElliptic(M: number, e: number): Outcome<number> {
  if (!Number.isFinite(M)) return failure('invalid-parameter', `Kepler's equation needs a finite mean anomaly, got ${M}`);
  if (!(e >= 0 && e < 1)) return failure('eccentricity-out-of-range', `the elliptic Kepler equation needs 0 <= e < 1, got e = ${e}`);
  const reduced = wrapPi(M);
  const turns = Math.round((M - reduced) / TWO_PI) * TWO_PI;
  const m = Math.abs(reduced);
  if (m === 0 || e === 0) return success(turns + reduced);
  const residual = (E: number): number => meanFromEccentric(E, e) - m;
  const lo = m;
  const hi = Math.min(m + e, Math.PI);
  const cubic = cubicRoot((6 * (1 - e)) / e, (6 * m) / e);
  const danby = m + 0.85 * e; // Danby's starter M + 0.85 e (Danby 2nd ed. ch. 6, from memory), for M far from 0
  const start = Math.abs(residual(cubic)) < Math.abs(residual(Math.min(danby, hi))) ? cubic : Math.min(danby, hi);
  const solved = safeguardedHalley(residual, (E) => 1 - e * Math.cos(E), (E) => e * Math.sin(E), start, lo, hi, HALLEY_LIMITS);
  if (solved === null) {
    return failure('no-convergence', `Kepler's equation did not converge in ${KEPLER_MAX_ITERATIONS} iterations (M = ${M}, e = ${e})`);
  }
  return success(turns + Math.sign(reduced) * solved);
}

// ---- hyperbolic: H --------------------------------------------------------------------------

/** Hyperbolic anomaly H from true anomaly nu, |nu| below the asymptote acos(-1/e)
 * (sinh H = sqrt(e^2 - 1) sin nu / (1 + e cos nu); Vallado 4th ed. Alg. 5, from memory). */
export function hyperbolicFromTrue(nu: number, e: number): number {
  return Math.asinh((Math.sqrt((e - 1) * (e + 1)) * Math.sin(nu)) / (1 + e * Math.cos(nu)));
}

/** True anomaly from H, in (-acos(-1/e), acos(-1/e)): tan(nu/2) = sqrt((e+1)/(e-1)) tanh(H/2) (Curtis 3rd ed. sec. 3.6, from memory). */
export function trueFromHyperbolic(H: number, e: number): number {
  return 2 * Math.atan(Math.sqrt((e + 1) / (e - 1)) * Math.tanh(H / 2));
}

/** Hyperbolic mean anomaly M_h = e sinh H - H (Vallado 4th ed. sec. 2.2; Curtis 3rd ed. sec. 3.6), written
 * (e - 1) H + e (sinh H - H) for |H| < 1 so it keeps its digits near e = 1, H = 0. */
export function meanFromHyperbolic(H: number, e: number): number {
  return Math.abs(H) < 1 ? (e - 1) * H + e * cubicTail(H, true) : e * Math.sinh(H) - H;
}

/**
 * H from M_h and e > 1 (inverse of meanFromHyperbolic), any finite M_h. Solved for |M_h| by
 * symmetry inside the bracket [asinh(M/e), asinh(M/(e - 1))] (the root satisfies
 * e sinh H = M + H); starter: the better of the log-like fixed point asinh((M + lo)/e) and the
 * root of (e - 1) H + e H^3 / 6 = M; then safeguarded Halley as for the ellipse.
 */
export function solveKeplerHyperbolic(M: number, e: number): Outcome<number> {
  if (!Number.isFinite(M)) return failure('invalid-parameter', `the hyperbolic Kepler equation needs a finite mean anomaly, got ${M}`);
  if (!(e > 1 && Number.isFinite(e))) return failure('eccentricity-out-of-range', `the hyperbolic Kepler equation needs e > 1, got e = ${e}`);
  const m = Math.abs(M);
  if (m === 0) return success(0);
  const residual = (H: number): number => meanFromHyperbolic(H, e) - m;
  const lo = Math.asinh(m / e);
  const ratio = m / (e - 1);
  const hi = Number.isFinite(ratio) ? Math.asinh(ratio) : Math.log(2 * m) - Math.log(e - 1) + 1;
  const fixedPoint = Math.asinh((m + lo) / e);
  const cubic = Math.min(cubicRoot((6 * (e - 1)) / e, (6 * m) / e), hi);
  const start = Math.abs(residual(cubic)) < Math.abs(residual(fixedPoint)) ? cubic : fixedPoint;
  const solved = safeguardedHalley(residual, (H) => e * Math.cosh(H) - 1, (H) => e * Math.sinh(H), start, lo, hi, HALLEY_LIMITS);
  if (solved === null) {
    return failure('no-convergence', `the hyperbolic Kepler equation did not converge in ${KEPLER_MAX_ITERATIONS} iterations (M = ${M}, e = ${e})`);
  }
  return success(Math.sign(M) * solved);
}

// ---- parabolic: B = tan(nu/2) ---------------------------------------------------------------
// Parabolic mean anomaly M_p = B + B^3/3 = n_p (t - T), with B = tan(nu/2), the parabolic mean
// motion n_p = 2 sqrt(mu / p^3) and T the time of periapsis passage (Barker's equation; Vallado
// 4th ed. sec. 2.2 and Alg. 3, from memory). Curtis 3rd ed. sec. 3.5 uses half this M_p with
// mean motion sqrt(mu / p^3).

/** Parabolic anomaly B = tan(nu/2) (dimensionless), |nu| < pi (Vallado 4th ed. sec. 2.2). */
export const parabolicFromTrue = (nu: number): number => Math.tan(nu / 2);

/** True anomaly nu = 2 atan(B), in (-pi, pi). */
export const trueFromParabolic = (B: number): number => 2 * Math.atan(B);

/** Parabolic mean anomaly M_p = B + B^3 / 3 (Barker's equation, Vallado 4th ed. sec. 2.2). */
export const meanFromParabolic = (B: number): number => B + (B * B * B) / 3;

/**
 * B from M_p: the one real root of B^3 + 3B - 3M_p = 0 in closed form. With B = 2 sinh(phi),
 * B^3 + 3B = 2 sinh(3 phi), so B = 2 sinh(asinh(3 M_p / 2) / 3) (the hyperbolic form of Cardano's
 * solution for a cubic with one real root; common practice, no source). No digits cancel for
 * small or large M_p, unlike the sum of two cube roots.
 */
export function solveBarker(Mp: number): number {
  return 2 * Math.sinh(Math.asinh(1.5 * Mp) / 3);
}

// ---- shared pieces --------------------------------------------------------------------------

/** Real root of x^3 + p x - q = 0 for p >= 0, q >= 0, by the same hyperbolic form (p = 0: cube root). */
function cubicRoot(p: number, q: number): number {
  if (p === 0) return Math.cbrt(q);
  const s = Math.sqrt(p / 3);
  const s3 = s * s * s;
  return Number.isFinite(s3) ? 2 * s * Math.sinh(Math.asinh(q / (2 * s3)) / 3) : q / p; // p huge: x = q / p
}

