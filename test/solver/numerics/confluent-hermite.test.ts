import { describe, expect, it } from 'vitest';
import { hermite, hermiteCoefficients } from '../../../src/solver/numerics/confluent-hermite.js';
import { newtonEvaluate } from '../../../src/solver/numerics/lagrange.js';
import { expectClose } from '../../helpers/approx.js';

// The Hermite polynomial of degree n m - 1 is unique, so a polynomial of that degree is reproduced
// exactly (Burden & Faires, Numerical Analysis, 9th ed., Theorem 3.9, from memory).
const quintic = (t: number): number => 1 + t - 2 * t ** 2 + 0.3 * t ** 3 - 0.1 * t ** 4 + 0.02 * t ** 5;
const quinticD1 = (t: number): number => 1 - 4 * t + 0.9 * t ** 2 - 0.4 * t ** 3 + 0.1 * t ** 4;
const quinticD2 = (t: number): number => -4 + 1.8 * t - 1.2 * t ** 2 + 0.4 * t ** 3;

describe('hermite(x, [f, f\', f\'\'], t)', () => {
  it('reproduces a quintic from 3 nodes with values and first derivatives', () => {
    const x = [-1, 0.5, 2];
    for (const t of [-1.5, -1, 0, 0.7, 2, 2.6]) {
      const h = hermite(x, [x.map(quintic), x.map(quinticD1)], t);
      expectClose(h.value, quintic(t), 1e-11, `P(${t})`);
      expectClose(h.slope, quinticD1(t), 1e-11, `P'(${t})`);
    }
  });

  it('reproduces a quintic from 2 nodes with values, first and second derivatives', () => {
    const x = [0, 1.5];
    for (const t of [-0.2, 0.4, 1.1, 1.5]) {
      const h = hermite(x, [x.map(quintic), x.map(quinticD1), x.map(quinticD2)], t);
      expectClose(h.value, quintic(t), 1e-11, `P(${t})`);
      expectClose(h.slope, quinticD1(t), 1e-11, `P'(${t})`);
    }
  });

  it('matches the values and slopes given at the nodes', () => {
    const x = [0, 1, 3];
    const f = [2, -1, 4];
    const d = [0.5, 3, -2];
    x.forEach((xi, i) => {
      const h = hermite(x, [f, d], xi);
      expectClose(h.value, f[i]!, 1e-13, 'value');
      expectClose(h.slope, d[i]!, 1e-12, 'slope');
    });
  });

  it('interpolates cos within the remainder bound |prod (t - x_i)^2| / 6! on 3 nodes (Burden & Faires 9th ed. Theorem 3.9)', () => {
    const x = [0, 0.5, 1];
    for (let t = 0; t <= 1; t += 0.05) {
      const bound = x.reduce((p, xi) => p * (t - xi) ** 2, 1) / 720;
      expect(Math.abs(hermite(x, [x.map(Math.cos), x.map((v) => -Math.sin(v))], t).value - Math.cos(t))).toBeLessThanOrEqual(bound + 1e-15);
    }
  });

  it('refuses more than two derivative orders and mismatched lengths', () => {
    expect(() => hermite([0], [[1], [1], [1], [1]], 0)).toThrow(RangeError);
    expect(() => hermite([0, 1], [[1, 2], [1]], 0)).toThrow(RangeError);
  });

  it('fills Newton coefficients a workspace can reuse', () => {
    const z = new Float64Array(6);
    const c = new Float64Array(6);
    const out = new Float64Array(3);
    const x = [0, 1, 2];
    hermiteCoefficients(x, [x.map(quintic), x.map(quinticD1)], 3, z, c);
    expect(Array.from(z)).toEqual([0, 0, 1, 1, 2, 2]);
    newtonEvaluate(z, c, 6, 1.3, out);
    expectClose(out[0]!, quintic(1.3), 1e-12, 'value');
  });
});
