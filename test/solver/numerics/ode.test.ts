import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { integrate } from '../../../src/solver/numerics/ode.js';
import { expectClose, expectRelClose } from '../../helpers/approx.js';

const decay = (_t: number, y: readonly number[]): number[] => [-y[0]!];
const oscillator = (_t: number, y: readonly number[]): number[] => [y[1]!, -y[0]!];
const linspace = (a: number, b: number, n: number): number[] => Array.from({ length: n }, (_, i) => a + ((b - a) * i) / (n - 1));

describe('integrate(f, y0, t0, times)', () => {
  it('reproduces exponential decay y = exp(-t) at every requested time (exact solution of y\' = -y)', () => {
    const times = linspace(0, 10, 41);
    const r = integrate(decay, [1], 0, times, { absTol: 1e-14, relTol: 1e-12 });
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.value.t).toEqual(times);
    r.value.t.forEach((t, i) => expectRelClose(r.value.y[i]![0]!, Math.exp(-t), 1e-10, `y(${t})`));
    expect(r.value.stopped).toBe(false);
  });

  it('follows the harmonic oscillator x = cos t, v = -sin t over 20 periods (exact solution of x\'\' = -x)', () => {
    const times = linspace(0, 40 * Math.PI, 801);
    const r = integrate(oscillator, [1, 0], 0, times, { absTol: 1e-13, relTol: 1e-13 });
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    r.value.t.forEach((t, i) => {
      expectClose(r.value.y[i]![0]!, Math.cos(t), 1e-9, `x(${t})`);
      expectClose(r.value.y[i]![1]!, -Math.sin(t), 1e-9, `v(${t})`);
    });
  });

  it('integrates backward when the times lie before t0 (exp(-t) from t = 5 back to 0)', () => {
    const times = linspace(5, 0, 26);
    const r = integrate(decay, [Math.exp(-5)], 5, times, { absTol: 1e-16, relTol: 1e-12 });
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.value.t).toEqual(times);
    r.value.t.forEach((t, i) => expectRelClose(r.value.y[i]![0]!, Math.exp(-t), 1e-10, `y(${t})`));
  });

  it('always returns the last requested time, also when it is not a multiple of any step (no dropped sample)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.1, max: 50, noNaN: true }), fc.integer({ min: 2, max: 60 }), (tEnd, n) => {
        const times = linspace(0, tEnd, n);
        const r = integrate(oscillator, [1, 0], 0, times);
        expect(r.ok).toBe(true);
        if (!r.ok) return;
        expect(r.value.t.length).toBe(n);
        expect(r.value.t[n - 1]).toBe(times[n - 1]);
        expectClose(r.value.y[n - 1]![0]!, Math.cos(times[n - 1]!), 1e-7, 'x(tEnd)');
      }),
      { numRuns: 40 },
    );
  });

  it('gives y0 back for times equal to t0 without integrating', () => {
    const r = integrate(decay, [2], 3, [3, 3]);
    expect(r.ok && r.value.y).toEqual([[2], [2]]);
  });

  it('fails with integration-failed when the step limit is reached, instead of returning an old state', () => {
    const r = integrate(oscillator, [1, 0], 0, [1000], { maxSteps: 20, absTol: 1e-12, relTol: 1e-12 });
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.code).toBe('integration-failed');
    expect(r.message).toMatch(/step limit of 20/);
  });

  it('fails with integration-failed when the right-hand side produces NaN', () => {
    // y' = sqrt(1 - t): NaN past t = 1.
    const r = integrate((t) => [Math.sqrt(1 - t)], [0], 0, [0.5, 2]);
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.code).toBe('integration-failed');
    expect(r.message).toMatch(/not finite/);
  });

  it('fails with integration-failed when the solution blows up (y\' = y^2, y(0) = 1 reaches infinity at t = 1)', () => {
    const r = integrate((_t, y) => [y[0]! * y[0]!], [1], 0, [0.5, 2]);
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.code).toBe('integration-failed');
  });

  it('stops where the stop predicate says and keeps the samples before it', () => {
    // Falling from x = 1 under x'' = -1: x = 1 - t^2/2 reaches 0 at t = sqrt 2.
    const times = linspace(0, 3, 31);
    const r = integrate((_t, y) => [y[1]!, -1], [1, 0], 0, times, { stop: (_t, y) => y[0]! < 0 });
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.value.stopped).toBe(true);
    expect(r.value.t.length).toBe(15); // t = 0, 0.1, ..., 1.4; the sample at 1.5 has x < 0
    expect(r.value.t.at(-1)).toBeCloseTo(1.4, 12);
    r.value.t.forEach((t, i) => expectClose(r.value.y[i]![0]!, 1 - (t * t) / 2, 1e-9, `x(${t})`));
  });

  it('refuses times that run both ways, non-finite input and bad tolerances', () => {
    expect(integrate(decay, [1], 0, [1, 0.5]).ok).toBe(false);
    expect(integrate(decay, [1], 0, [-1, 1]).ok).toBe(false);
    expect(integrate(decay, [Number.NaN], 0, [1]).ok).toBe(false);
    expect(integrate(decay, [1], 0, []).ok).toBe(false);
    expect(integrate(decay, [1], 0, [1], { absTol: 0 }).ok).toBe(false);
    expect(integrate(decay, [1], 0, [1], { relTol: -1e-9 }).ok).toBe(false);
    expect(integrate(decay, [1], 0, [1], { absTol: [1e-9, 1e-9] }).ok).toBe(false);
    const r = integrate(decay, [1], 0, [1], { maxSteps: 0 });
    expect(!r.ok && r.code).toBe('invalid-parameter');
  });
});
