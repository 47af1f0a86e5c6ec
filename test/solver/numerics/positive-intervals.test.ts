import { describe, expect, it } from 'vitest';
import { positiveIntervals } from '../../../src/solver/numerics/positive-intervals.js';
import { expectClose } from '../../helpers/approx.js';

describe('positiveIntervals', () => {
  const search = (fn: (t: number) => number, rate: (t: number) => number, stop: number, step: number) => {
    const times = Array.from({ length: Math.ceil(stop / step) + 1 }, (_, k) => Math.min(k * step, stop));
    return positiveIntervals({
      times,
      sample: (k) => times[k]!,
      at: (t) => t,
      value: fn,
      rate,
      edges: { startsBefore: true, endsAfter: true },
      rootTolS: 1e-9,
      peakTolS: 1e-9,
    });
  };

  it('sin(t + 0.5) > 0 on [0, pi - 0.5) and (2 pi - 0.5, 3 pi - 0.5) over [0, 9.5]: crossings exact, the first clipped', () => {
    const out = search((t) => Math.sin(t + 0.5), (t) => Math.cos(t + 0.5), 9.5, 0.7);
    expect(out).toHaveLength(2);
    expect(out[0]!.startsBefore).toBe(true);
    expectClose(out[0]!.stop, Math.PI - 0.5, 1e-8, 'first stop');
    expectClose(out[1]!.start, 2 * Math.PI - 0.5, 1e-8, 'second start');
    expectClose(out[1]!.stop, 3 * Math.PI - 0.5, 1e-8, 'second stop');
    expect(out[1]!.endsAfter).toBe(false);
  });

  it('finds an interval shorter than the step from the rate changing sign', () => {
    // 1e-4 - (t - 3.3)^2 > 0 for |t - 3.3| < 0.01: 0.02 s long, inside the step [3, 4].
    const out = search((t) => 1e-4 - (t - 3.3) ** 2, (t) => -2 * (t - 3.3), 10, 1);
    expect(out).toHaveLength(1);
    expectClose(out[0]!.start, 3.29, 1e-7, 'start');
    expectClose(out[0]!.stop, 3.31, 1e-7, 'stop');
  });

  it('valueAt in place of at: the same intervals to the bit; neither given is a programmer error', () => {
    const fn = (t: number): number => Math.sin(1.3 * t) - 0.2;
    const rate = (t: number): number => 1.3 * Math.cos(1.3 * t);
    const times = Array.from({ length: 31 }, (_, k) => k * 0.45);
    const common = { times, sample: (k: number) => times[k]!, value: fn, rate, edges: { startsBefore: true, endsAfter: true }, rootTolS: 1e-6, peakTolS: 1e-6 };
    const withAt = positiveIntervals({ ...common, at: (t) => t });
    expect(withAt.length).toBeGreaterThan(1);
    expect(positiveIntervals({ ...common, valueAt: fn })).toEqual(withAt);
    expect(() => positiveIntervals(common)).toThrow(TypeError);
  });
});
