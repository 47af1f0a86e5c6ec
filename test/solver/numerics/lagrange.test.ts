import { describe, expect, it } from 'vitest';
import { lagrange, newtonCoefficients, newtonEvaluate } from '../../../src/solver/numerics/lagrange.js';
import { expectClose } from '../../helpers/approx.js';

// A polynomial of degree <= n is its own interpolant through n + 1 distinct nodes (uniqueness of the
// interpolating polynomial; Burden & Faires, Numerical Analysis, 9th ed., Theorem 3.2, from memory).
const cubic = (t: number): number => 2 - 3 * t + 0.5 * t * t - 0.25 * t ** 3;
const cubicSlope = (t: number): number => -3 + t - 0.75 * t * t;

describe('lagrange(x, y, t)', () => {
  it('reproduces a cubic from 4 uneven nodes, inside and outside them', () => {
    const x = [-1.3, 0.2, 0.9, 2.5];
    const y = x.map(cubic);
    for (const t of [-2, -1.3, 0, 0.55, 1.7, 2.5, 3.1]) expectClose(lagrange(x, y, t), cubic(t), 1e-12, `P(${t})`);
  });

  it('matches the nodes exactly and needs at least one node', () => {
    expect(lagrange([1, 2, 4], [5, -1, 7], 2)).toBe(-1);
    expect(lagrange([3], [8], 100)).toBe(8);
    expect(() => lagrange([], [], 0)).toThrow(RangeError);
  });

  it('interpolates sin on 8 nodes within the remainder bound max|f^(8)| |prod(t - x_i)| / 8! (Burden & Faires 9th ed. Theorem 3.3)', () => {
    const x = Array.from({ length: 8 }, (_, i) => 0.3 * i);
    const y = x.map(Math.sin);
    for (let t = 0; t <= 2.1; t += 0.05) {
      const bound = x.reduce((p, xi) => p * Math.abs(t - xi), 1) / 40_320;
      expect(Math.abs(lagrange(x, y, t) - Math.sin(t))).toBeLessThanOrEqual(bound + 1e-15);
    }
  });
});

describe('newtonEvaluate', () => {
  it('gives the derivative of the interpolant (exact for a cubic)', () => {
    const x = [0, 1, 2, 3.5];
    const c = new Float64Array(4);
    const out = new Float64Array(3);
    newtonCoefficients(x, x.map(cubic), 4, c);
    for (const t of [-0.5, 0.3, 1.5, 3]) {
      newtonEvaluate(x, c, 4, t, out);
      expectClose(out[0]!, cubic(t), 1e-12, 'value');
      expectClose(out[1]!, cubicSlope(t), 1e-12, 'slope');
    }
  });

  it('reports the last term as the difference from the interpolant without the last node', () => {
    const x = [0.4, 0.5, 0.3, 0.6, 0.2]; // nearest first around t = 0.45
    const y = x.map(Math.exp);
    const c = new Float64Array(5);
    const out = new Float64Array(3);
    newtonCoefficients(x, y, 5, c);
    newtonEvaluate(x, c, 5, 0.45, out);
    const withoutLast = lagrange(x.slice(0, 4), y.slice(0, 4), 0.45);
    expectClose(out[2]!, out[0]! - withoutLast, 1e-15, 'last term');
    // and it is of the size of that interpolant's error
    const err4 = Math.abs(withoutLast - Math.exp(0.45));
    expect(Math.abs(out[2]!)).toBeGreaterThan(0.3 * err4);
    expect(Math.abs(out[2]!)).toBeLessThan(3 * err4);
  });
});
