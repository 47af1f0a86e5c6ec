// Central potentials U(r) as a sum of terms, with analytic first and second derivatives, and the
// effective potential U_eff(r) = U(r) + l^2 / (2 m r^2) (Goldstein, Classical Mechanics, 3rd ed.,
// sec. 3.3 — from memory). Any consistent unit system; r > 0 throughout.
// Sign convention: a positive coefficient/depth makes yukawa, gaussian and exponential terms
// attractive (U < 0); power and logarithmic terms are exactly k r^n and k ln(r / r0).

import { failure, success, type Outcome } from '../core/result.js';

/** U = k r^n (n = -1 Kepler/Coulomb, n = 2 harmonic). n = 0 is a constant: it shifts energies, no force. */
export interface PowerTerm { readonly kind: 'power'; readonly coefficient: number; readonly exponent: number }
/** U = -k e^(-r/a) / r; k > 0 attractive. */
export interface YukawaTerm { readonly kind: 'yukawa'; readonly coefficient: number; readonly range: number }
/** U = -V0 exp(-(r - r0)^2 / (2 s^2)); V0 > 0 is a well, V0 < 0 a bump. center r0 defaults to 0. */
export interface GaussianTerm { readonly kind: 'gaussian'; readonly depth: number; readonly center?: number; readonly width: number }
/** U = -V0 e^(-r/a); V0 > 0 attractive. */
export interface ExponentialTerm { readonly kind: 'exponential'; readonly depth: number; readonly range: number }
/** U = k ln(r / r0). */
export interface LogarithmicTerm { readonly kind: 'logarithmic'; readonly coefficient: number; readonly scale: number }

export type PotentialTerm = PowerTerm | YukawaTerm | GaussianTerm | ExponentialTerm | LogarithmicTerm;

/** A function's value with its first and second derivatives with respect to r. */
export interface Derivatives { readonly value: number; readonly first: number; readonly second: number }

export const MAX_TERMS = 32;
/** |n| above this overflows doubles over ordinary radius ranges; refused. */
export const MAX_ABS_EXPONENT = 20;

/** U, dU/dr, d2U/dr2 of one term (derivatives by direct differentiation). */
export function termDerivatives(term: PotentialTerm, r: number): Derivatives {
  switch (term.kind) {
    case 'power': {
      const { coefficient: k, exponent: n } = term;
      if (n === 0) return { value: k, first: 0, second: 0 };
      const u = k * r ** n;
      return { value: u, first: (n * u) / r, second: (n * (n - 1) * u) / (r * r) };
    }
    case 'yukawa': {
      const { coefficient: k, range: a } = term;
      const f = Math.exp(-r / a) / r; // U = -k f, f' = -f (1/a + 1/r), f'' = f ((1/a + 1/r)^2 + 1/r^2)
      const g = 1 / a + 1 / r;
      return { value: -k * f, first: k * f * g, second: -k * f * (g * g + 1 / (r * r)) };
    }
    case 'gaussian': {
      const { depth: v0, width: s } = term;
      const x = r - (term.center ?? 0);
      const g = Math.exp(-(x * x) / (2 * s * s));
      const s2 = s * s;
      return { value: -v0 * g, first: (v0 * x * g) / s2, second: -v0 * g * ((x * x) / (s2 * s2) - 1 / s2) };
    }
    case 'exponential': {
      const { depth: v0, range: a } = term;
      const e = Math.exp(-r / a);
      return { value: -v0 * e, first: (v0 * e) / a, second: (-v0 * e) / (a * a) };
    }
    case 'logarithmic': {
      const { coefficient: k, scale: r0 } = term;
      return { value: k * Math.log(r / r0), first: k / r, second: -k / (r * r) };
    }
  }
}

/** ln((r + d) / r), from log1p for small steps and from the target radius for large ones (where r + d may have lost digits of r). */
const logRatio = (r: number, d: number, target: number): number => (Math.abs(d) < 0.5 * r ? Math.log1p(d / r) : Math.log(target / r));

/**
 * U(r + d) - U(r) for one term, free of cancellation when |d| << r (expm1/log1p forms).
 * `target` is r + d when the caller knows it more precisely than the sum.
 */
export function termIncrement(term: PotentialTerm, r: number, d: number, target = r + d): number {
  const direct = (): number => termDerivatives(term, target).value - termDerivatives(term, r).value;
  switch (term.kind) {
    case 'power':
      return term.exponent === 0 ? 0 : term.coefficient * r ** term.exponent * Math.expm1(term.exponent * logRatio(r, d, target));
    case 'yukawa': {
      const q = -d / term.range - logRatio(r, d, target);
      return Math.abs(q) > 0.5 ? direct() : ((-term.coefficient * Math.exp(-r / term.range)) / r) * Math.expm1(q);
    }
    case 'gaussian': {
      const x = r - (term.center ?? 0);
      const q = (-d * (2 * x + d)) / (2 * term.width * term.width);
      return Math.abs(q) > 0.5 ? direct() : -term.depth * Math.exp(-(x * x) / (2 * term.width * term.width)) * Math.expm1(q);
    }
    case 'exponential': {
      const q = -d / term.range;
      return Math.abs(q) > 0.5 ? direct() : -term.depth * Math.exp(-r / term.range) * Math.expm1(q);
    }
    case 'logarithmic':
      return term.coefficient * logRatio(r, d, target);
  }
}

/** U, dU/dr, d2U/dr2 of the sum of terms. */
export function potential(terms: readonly PotentialTerm[], r: number): Derivatives {
  let value = 0;
  let first = 0;
  let second = 0;
  for (const term of terms) {
    const t = termDerivatives(term, r);
    value += t.value;
    first += t.first;
    second += t.second;
  }
  return { value, first, second };
}

/** The radial problem's data: potential terms, (reduced) mass m and angular momentum l. */
export interface RadialSystem { readonly terms: readonly PotentialTerm[]; readonly mass: number; readonly angularMomentum: number }

/** l^2 / (2 m), the coefficient of the centrifugal term r^-2. */
export const centrifugalCoefficient = (s: RadialSystem): number => (s.angularMomentum * s.angularMomentum) / (2 * s.mass);

/** U_eff = U + l^2/(2 m r^2) with its derivatives (Goldstein 3rd ed. sec. 3.3 — from memory). */
export function effectivePotential(s: RadialSystem, r: number): Derivatives {
  const u = potential(s.terms, r);
  const c = centrifugalCoefficient(s) / (r * r);
  return { value: u.value + c, first: u.first - (2 * c) / r, second: u.second + (6 * c) / (r * r) };
}

/** U_eff(r + d) - U_eff(r) without cancellation for small d; `target` as in termIncrement. */
export function effectiveIncrement(s: RadialSystem, r: number, d: number, target = r + d): number {
  let sum = (centrifugalCoefficient(s) / (r * r)) * Math.expm1(-2 * logRatio(r, d, target));
  for (const term of s.terms) sum += termIncrement(term, r, d, target);
  return sum;
}

/** Sum of the magnitudes of all parts of U_eff at r: the scale against which energies are compared. */
export function energyScale(s: RadialSystem, r: number): number {
  let sum = centrifugalCoefficient(s) / (r * r);
  for (const term of s.terms) sum += Math.abs(termDerivatives(term, r).value);
  return sum;
}

/** A term's leading behaviour c r^n (n may be 0 for a constant). */
interface PowerLaw { readonly coefficient: number; readonly exponent: number }

/** Sign of the dominant power among (coefficient, exponent) pairs, most extreme exponent first (exact cancellations skipped). */
function dominantSign(laws: readonly PowerLaw[], pickLarger: boolean): number {
  const sums = new Map<number, number>();
  for (const { coefficient, exponent } of laws) sums.set(exponent, (sums.get(exponent) ?? 0) + coefficient);
  const exponents = [...sums.keys()].sort((a, b) => (pickLarger ? b - a : a - b));
  for (const n of exponents) {
    const c = sums.get(n)!;
    if (c !== 0) return Math.sign(c);
  }
  return 0;
}

/**
 * Limits of U_eff at r -> 0+ and r -> infinity (+-Infinity or a finite value), from the dominant
 * terms: powers and the centrifugal term dominate logarithms, which dominate bounded terms.
 */
export function effectiveLimits(s: RadialSystem): { atZero: number; atInfinity: number } {
  const singular: PowerLaw[] = []; // terms that blow up at 0
  const growing: PowerLaw[] = []; // terms that blow up at infinity
  let logSum = 0;
  let finiteAtZero = 0;
  let finiteAtInfinity = 0;
  const centrifugal = centrifugalCoefficient(s);
  if (centrifugal !== 0) singular.push({ coefficient: centrifugal, exponent: -2 });
  for (const t of s.terms) {
    switch (t.kind) {
      case 'power':
        if (t.exponent < 0) singular.push(t);
        else if (t.exponent > 0) growing.push(t);
        else {
          finiteAtZero += t.coefficient;
          finiteAtInfinity += t.coefficient;
        }
        break;
      case 'yukawa': // -k/r + k/a - ... near 0
        singular.push({ coefficient: -t.coefficient, exponent: -1 });
        finiteAtZero += t.coefficient / t.range;
        break;
      case 'gaussian': {
        const c = t.center ?? 0;
        finiteAtZero += -t.depth * Math.exp(-(c * c) / (2 * t.width * t.width));
        break;
      }
      case 'exponential':
        finiteAtZero += -t.depth;
        break;
      case 'logarithmic':
        logSum += t.coefficient;
        break;
    }
  }
  const zeroSign = dominantSign(singular, false);
  const atZero = zeroSign !== 0 ? zeroSign * Infinity : logSum !== 0 ? -Math.sign(logSum) * Infinity : finiteAtZero;
  const infSign = dominantSign(growing, true);
  const atInfinity = infSign !== 0 ? infSign * Infinity : logSum !== 0 ? Math.sign(logSum) * Infinity : finiteAtInfinity;
  return { atZero, atInfinity };
}

/**
 * Characteristic lengths of the problem: term ranges, widths, centres and scales; radii where two
 * power-like parts of U_eff balance (|c_i / c_j|^(1/(n_j - n_i))); radii where one part alone
 * equals the energy. Used to place search grids; never empty.
 */
export function lengthScales(s: RadialSystem, energy: number): number[] {
  const laws: PowerLaw[] = [];
  const out: number[] = [];
  const centrifugal = centrifugalCoefficient(s);
  if (centrifugal !== 0) laws.push({ coefficient: centrifugal, exponent: -2 });
  for (const t of s.terms) {
    if (t.kind === 'power' && t.exponent !== 0 && t.coefficient !== 0) laws.push(t);
    else if (t.kind === 'yukawa') {
      out.push(t.range);
      if (t.coefficient !== 0) laws.push({ coefficient: -t.coefficient, exponent: -1 });
    } else if (t.kind === 'gaussian') {
      const c = t.center ?? 0;
      out.push(t.width, c, c + 3 * t.width, c - 3 * t.width);
    } else if (t.kind === 'exponential') out.push(t.range);
    else if (t.kind === 'logarithmic') out.push(t.scale);
  }
  for (let i = 0; i < laws.length; i++) {
    const a = laws[i]!;
    if (energy !== 0) out.push(Math.abs(energy / a.coefficient) ** (1 / a.exponent));
    for (let j = i + 1; j < laws.length; j++) {
      const b = laws[j]!;
      if (a.exponent !== b.exponent) out.push(Math.abs(a.coefficient / b.coefficient) ** (1 / (b.exponent - a.exponent)));
    }
  }
  const positive = out.filter((x) => Number.isFinite(x) && x > 0);
  return positive.length > 0 ? positive : [1];
}

const finite = (...xs: (number | undefined)[]): boolean => xs.every((x) => x === undefined || Number.isFinite(x));

/** Checks a list of terms: finite parameters, positive ranges/widths/scales, bounded exponents. */
export function validateTerms(terms: readonly PotentialTerm[]): Outcome<readonly PotentialTerm[]> {
  if (terms.length === 0) return failure('invalid-parameter', 'the potential needs at least one term');
  if (terms.length > MAX_TERMS) return failure('invalid-parameter', `at most ${MAX_TERMS} potential terms`);
  for (const [i, t] of terms.entries()) {
    const bad = (why: string): Outcome<never> => failure('invalid-parameter', `potential term ${i} (${t.kind}): ${why}`);
    switch (t.kind) {
      case 'power':
        if (!finite(t.coefficient, t.exponent)) return bad('coefficient and exponent must be finite');
        if (Math.abs(t.exponent) > MAX_ABS_EXPONENT) return bad(`|exponent| must not exceed ${MAX_ABS_EXPONENT}`);
        break;
      case 'yukawa':
      case 'exponential':
        if (!finite(t.kind === 'yukawa' ? t.coefficient : t.depth, t.range)) return bad('parameters must be finite');
        if (!(t.range > 0)) return bad('range must be positive');
        break;
      case 'gaussian':
        if (!finite(t.depth, t.center, t.width)) return bad('parameters must be finite');
        if (!(t.width > 0)) return bad('width must be positive');
        break;
      case 'logarithmic':
        if (!finite(t.coefficient, t.scale)) return bad('parameters must be finite');
        if (!(t.scale > 0)) return bad('scale must be positive');
        break;
      default:
        return failure('invalid-parameter', `potential term ${i}: unknown kind`);
    }
  }
  return success(terms);
}
