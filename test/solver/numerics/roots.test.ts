// The generic numerical methods, each alone, on problems whose answers are known in closed form
// (common practice, no source: cos has its zero at pi/2, x^3 = 2 at the cube root of 2, sin peaks at pi/2).
import { describe, expect, it } from 'vitest';
import { brentRoot } from '../../../src/solver/numerics/brent.js';
import { goldenSectionMax } from '../../../src/solver/numerics/golden-section.js';
import { safeguardedHalley } from '../../../src/solver/numerics/halley.js';
import { cubicHermiteWeights } from '../../../src/solver/numerics/hermite.js';
import { illinoisRoot } from '../../../src/solver/numerics/illinois.js';
import { expectClose } from '../../helpers/approx.js';

describe('brentRoot', () => {
  it('finds cos x = 0 at pi/2 to a few ulps, and a sign jump in a step function', () => {
    expectClose(brentRoot(Math.cos, 1, 2), Math.PI / 2, 4e-16, 'pi/2');
    const jump = brentRoot((x) => (x < 0.3 ? -1 : 1), 0, 1);
    expectClose(jump, 0.3, 1e-15, 'jump');
  });

  it('takes the bracket in either order and a root at an end', () => {
    expectClose(brentRoot((x) => x * x - 2, 2, 0), Math.SQRT2, 1e-15, 'sqrt 2');
    expect(brentRoot((x) => x - 1, 1, 3)).toBe(1);
  });
});

describe('illinoisRoot', () => {
  it('brackets the root to the asked tolerance, also for a flat-then-steep function', () => {
    for (const tol of [1e-3, 1e-9]) {
      expectClose(illinoisRoot(Math.cos, 1, 2, Math.cos(1), Math.cos(2), tol), Math.PI / 2, tol, `pi/2 at ${tol}`);
    }
    const steep = (x: number) => x ** 9 - 0.5;
    expectClose(illinoisRoot(steep, 0, 1, steep(0), steep(1), 1e-10), 0.5 ** (1 / 9), 1e-10, 'x^9 = 0.5');
  });
});

describe('goldenSectionMax', () => {
  it('finds the peak of sin on [0, pi] and of a narrow parabola to the tolerance', () => {
    const peak = goldenSectionMax(Math.sin, 0, Math.PI, 1e-8);
    expectClose(peak.t, Math.PI / 2, 1e-8, 'argmax');
    expectClose(peak.value, 1, 1e-15, 'max');
    const narrow = goldenSectionMax((t) => -((t - 0.123) ** 2), -5, 5, 1e-6);
    expectClose(narrow.t, 0.123, 1e-6, 'parabola');
  });
});

describe('safeguardedHalley', () => {
  const limits = { maxIterations: 100, stepTolerance: 1e-15 };
  it('solves x^3 = 2 from a poor start and stays in its bracket', () => {
    const root = safeguardedHalley((x) => x ** 3 - 2, (x) => 3 * x * x, (x) => 6 * x, 100, 0, 100, limits);
    expectClose(root ?? Number.NaN, Math.cbrt(2), 4e-16, 'cbrt 2');
  });
  it('answers null when the iteration cap is hit', () => {
    expect(safeguardedHalley((x) => x ** 3 - 2, (x) => 3 * x * x, (x) => 6 * x, 100, 0, 100, { maxIterations: 1, stepTolerance: 1e-15 })).toBeNull();
  });
});

describe('cubicHermiteWeights', () => {
  it('reproduces a cubic and its derivative exactly between two nodes (the interpolant of a cubic is the cubic)', () => {
    const p = (x: number) => 2 * x ** 3 - x ** 2 + 3 * x - 5;
    const dp = (x: number) => 6 * x ** 2 - 2 * x + 3;
    const [x0, h] = [1.5, 0.75];
    const w = new Float64Array(8);
    for (const u of [0, 0.1, 0.5, 0.9, 1]) {
      cubicHermiteWeights(u, h, w);
      const x = x0 + u * h;
      const value = w[0]! * p(x0) + w[1]! * dp(x0) + w[2]! * p(x0 + h) + w[3]! * dp(x0 + h);
      const slope = w[4]! * p(x0) + w[5]! * dp(x0) + w[6]! * p(x0 + h) + w[7]! * dp(x0 + h);
      expectClose(value, p(x), 1e-12, `p(${x})`);
      expectClose(slope, dp(x), 1e-12, `p'(${x})`);
    }
  });
});
