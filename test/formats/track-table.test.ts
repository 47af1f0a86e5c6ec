import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { fixed } from '../../src/formats/track-table.js';

// Number.prototype.toFixed is the reference (ECMA-262, sec. 21.1.3.3: exact decimal rounding),
// except that a value rounding to zero prints without a minus sign.
const reference = (x: number, d: number): string => {
  const text = x.toFixed(d);
  return /^-0(\.0*)?$/.test(text) ? text.slice(1) : text;
};

describe('fixed(value, decimals)', () => {
  it('prints exactly what toFixed prints, for track-sized numbers and 0-12 decimals', () => {
    fc.assert(fc.property(fc.double({ min: -1e9, max: 1e9, noNaN: true }), fc.integer({ min: 0, max: 12 }), (x, d) => fixed(x, d) === reference(x, d)), { numRuns: 20_000 });
  });

  it('decides ties and near-ties like toFixed', () => {
    for (const x of [0.1851851835, 1.0000005, -2.5e-7, 0.0000005, 6378.1370005, -0.0000004999]) {
      for (const d of [6, 9]) expect(fixed(x, d), `${x} ${d}`).toBe(reference(x, d));
    }
  });

  it('takes the exact path beyond 9e15 / 10^decimals and refuses what toFixed would print in exponent form', () => {
    expect(fixed(1.5e12, 6)).toBe((1.5e12).toFixed(6));
    expect(() => fixed(1e21, 2)).toThrow(RangeError);
    expect(() => fixed(Number.NaN, 2)).toThrow(RangeError);
  });
});
