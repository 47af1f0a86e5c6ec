import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  effectiveIncrement,
  effectiveLimits,
  effectivePotential,
  lengthScales,
  potential,
  termDerivatives,
  termIncrement,
  validateTerms,
  type PotentialTerm,
} from '../../../src/solver/central/potential.js';
import { expectRelClose } from '../../helpers/approx.js';

// Central differences with Richardson extrapolation (error O(h^4)): an independent check of the
// analytic derivatives (Burden & Faires, Numerical Analysis, 9th ed., sec. 4.2 — from memory).
function numericDerivative(f: (r: number) => number, r: number): number {
  const d = (h: number): number => (f(r + h) - f(r - h)) / (2 * h);
  const h = 1e-3 * r;
  return (4 * d(h / 2) - d(h)) / 3;
}

const terms: Record<string, PotentialTerm> = {
  power: { kind: 'power', coefficient: -2.5, exponent: -1 },
  powerFractional: { kind: 'power', coefficient: 0.7, exponent: 1.5 },
  yukawa: { kind: 'yukawa', coefficient: 3, range: 1.7 },
  gaussian: { kind: 'gaussian', depth: 1.2, center: 2, width: 0.6 },
  exponential: { kind: 'exponential', depth: 0.8, range: 0.9 },
  logarithmic: { kind: 'logarithmic', coefficient: 0.4, scale: 1.3 },
};

describe('termDerivatives(term, r)', () => {
  it('gives the values of the defining formulas at r = 1.1', () => {
    // Definitions of the terms (power law k r^n; Yukawa -k e^(-r/a)/r; Gaussian well; exponential well; logarithm).
    const r = 1.1;
    expectRelClose(termDerivatives(terms.power!, r).value, -2.5 / r, 1e-15, 'k r^n');
    expectRelClose(termDerivatives(terms.powerFractional!, r).value, 0.7 * r ** 1.5, 1e-15, 'k r^1.5');
    expectRelClose(termDerivatives(terms.yukawa!, r).value, (-3 * Math.exp(-r / 1.7)) / r, 1e-15, 'Yukawa');
    expectRelClose(termDerivatives(terms.gaussian!, r).value, -1.2 * Math.exp(-((r - 2) ** 2) / (2 * 0.36)), 1e-15, 'Gaussian');
    expectRelClose(termDerivatives(terms.exponential!, r).value, -0.8 * Math.exp(-r / 0.9), 1e-15, 'exponential');
    expectRelClose(termDerivatives(terms.logarithmic!, r).value, 0.4 * Math.log(r / 1.3), 1e-15, 'logarithmic');
  });

  it('treats exponent 0 as a constant with no force', () => {
    expect(termDerivatives({ kind: 'power', coefficient: 4, exponent: 0 }, 3)).toEqual({ value: 4, first: 0, second: 0 });
  });

  for (const [name, term] of Object.entries(terms)) {
    it(`${name}: first and second derivatives match numerical differentiation`, () => {
      fc.assert(
        fc.property(fc.double({ min: 0.2, max: 6, noNaN: true }), (r) => {
          const d = termDerivatives(term, r);
          const first = numericDerivative((x) => termDerivatives(term, x).value, r);
          const second = numericDerivative((x) => termDerivatives(term, x).first, r);
          // Richardson-extrapolated differences with h = 1e-3 r: truncation error ~ (h / width)^4 ~ 1e-8.
          expectRelClose(d.first, first, 1e-7, `${name} U'(${r})`, 1e-3);
          expectRelClose(d.second, second, 1e-7, `${name} U''(${r})`, 1e-3);
        }),
        { numRuns: 200 },
      );
    });

    it(`${name}: termIncrement equals U(r + d) - U(r), also for tiny d (Taylor check)`, () => {
      const r = 1.4;
      const d = termDerivatives(term, r);
      for (const step of [1e-9, -1e-9, 1e-6]) {
        // U(r + h) - U(r) = U' h + U'' h^2 / 2 + O(h^3) (Taylor).
        expectRelClose(termIncrement(term, r, step), d.first * step + (d.second * step * step) / 2, 1e-9, `${name} dU(${step})`, 1e-30);
      }
      for (const step of [0.3, -0.9, 4]) {
        const direct = termDerivatives(term, r + step).value - d.value;
        expectRelClose(termIncrement(term, r, step), direct, 1e-12, `${name} dU(${step})`, 1e-12);
      }
    });
  }
});

describe('potential and effectivePotential', () => {
  const all = Object.values(terms);

  it('potential sums the terms', () => {
    const r = 2.2;
    const sum = all.reduce((s, t) => s + termDerivatives(t, r).value, 0);
    expectRelClose(potential(all, r).value, sum, 1e-15, 'U');
  });

  it('U_eff = U + l^2/(2 m r^2), U_eff\' = U\' - l^2/(m r^3), U_eff\'\' = U\'\' + 3 l^2/(m r^4) (Goldstein 3rd ed. sec. 3.3 — from memory)', () => {
    const s = { terms: all, mass: 1.7, angularMomentum: 0.9 };
    const r = 0.8;
    const u = potential(all, r);
    const e = effectivePotential(s, r);
    const l2 = 0.81;
    expectRelClose(e.value, u.value + l2 / (2 * 1.7 * r * r), 1e-14, 'U_eff');
    expectRelClose(e.first, u.first - l2 / (1.7 * r ** 3), 1e-14, "U_eff'");
    expectRelClose(e.second, u.second + (3 * l2) / (1.7 * r ** 4), 1e-14, "U_eff''");
  });

  it('effectiveIncrement keeps full relative accuracy where direct subtraction cancels', () => {
    const s = { terms: [terms.power!], mass: 1, angularMomentum: 1.3 };
    const r = 2;
    const d = 1e-9;
    const e = effectivePotential(s, r);
    expectRelClose(effectiveIncrement(s, r, d), e.first * d + (e.second * d * d) / 2, 1e-10, 'dU_eff');
  });
});

describe('effectiveLimits(system)', () => {
  const kepler: PotentialTerm = { kind: 'power', coefficient: -1, exponent: -1 };
  it('Kepler with l != 0: +infinity at the centre (centrifugal barrier), 0 at infinity', () => {
    expect(effectiveLimits({ terms: [kepler], mass: 1, angularMomentum: 1 })).toEqual({ atZero: Infinity, atInfinity: 0 });
  });
  it('Kepler with l = 0 falls to -infinity at the centre', () => {
    expect(effectiveLimits({ terms: [kepler], mass: 1, angularMomentum: 0 }).atZero).toBe(-Infinity);
  });
  it('an attractive r^-3 term beats the centrifugal r^-2 term at the centre', () => {
    const t: PotentialTerm = { kind: 'power', coefficient: -1e-6, exponent: -3 };
    expect(effectiveLimits({ terms: [kepler, t], mass: 1, angularMomentum: 1 }).atZero).toBe(-Infinity);
  });
  it('harmonic grows without bound; a constant sets the level at infinity', () => {
    const s = { terms: [{ kind: 'power', coefficient: 1, exponent: 2 } as const], mass: 1, angularMomentum: 0 };
    expect(effectiveLimits(s)).toEqual({ atZero: 0, atInfinity: Infinity });
    const c = { terms: [kepler, { kind: 'power', coefficient: 3, exponent: 0 } as const], mass: 1, angularMomentum: 1 };
    expect(effectiveLimits(c).atInfinity).toBe(3);
  });
  it('bounded terms give finite limits; logarithms dominate them', () => {
    expect(effectiveLimits({ terms: [terms.gaussian!, terms.exponential!], mass: 1, angularMomentum: 0 }).atZero).toBeCloseTo(-1.2 * Math.exp(-4 / 0.72) - 0.8, 14);
    expect(effectiveLimits({ terms: [terms.logarithmic!, terms.exponential!], mass: 1, angularMomentum: 0 })).toEqual({ atZero: -Infinity, atInfinity: Infinity });
    expect(effectiveLimits({ terms: [terms.yukawa!], mass: 1, angularMomentum: 0 }).atZero).toBe(-Infinity);
  });
});

describe('lengthScales and validateTerms', () => {
  it('lengthScales includes the Kepler balance radius l^2/(2 m k) and the energy radius k/|E|', () => {
    const s = lengthScales({ terms: [{ kind: 'power', coefficient: -2, exponent: -1 }], mass: 1, angularMomentum: 2 }, -0.5);
    expect(s.some((x) => Math.abs(x - 1) < 1e-12)).toBe(true); // (l^2/2m)/k = 2/2
    expect(s.some((x) => Math.abs(x - 4) < 1e-12)).toBe(true); // k/|E|
    expect(lengthScales({ terms: [{ kind: 'power', coefficient: 1, exponent: 2 }], mass: 1, angularMomentum: 0 }, 0)).toEqual([1]);
  });

  it('refuses empty lists, non-finite numbers, non-positive ranges, widths, scales and huge exponents', () => {
    const bad: PotentialTerm[][] = [
      [],
      [{ kind: 'power', coefficient: Number.NaN, exponent: -1 }],
      [{ kind: 'power', coefficient: 1, exponent: 40 }],
      [{ kind: 'yukawa', coefficient: 1, range: 0 }],
      [{ kind: 'gaussian', depth: 1, width: -1 }],
      [{ kind: 'exponential', depth: 1, range: Infinity }],
      [{ kind: 'logarithmic', coefficient: 1, scale: 0 }],
      [{ kind: 'spline' } as unknown as PotentialTerm],
    ];
    for (const t of bad) {
      const r = validateTerms(t);
      expect(r.ok, JSON.stringify(t)).toBe(false);
      if (!r.ok) expect(r.code).toBe('invalid-parameter');
    }
    expect(validateTerms(Object.values(terms)).ok).toBe(true);
  });
});
