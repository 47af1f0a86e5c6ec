import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { AsciiWriter } from '../../src/formats/ascii-writer.js';
import { fixed } from '../../src/formats/track-table.js';
import { formatUtcIso, parseUtcIso } from '../../src/solver/time/time.js';

/** Number.prototype.toFixed (ECMA-262 sec. 21.1.3.3, exact decimal rounding), with a zero printed unsigned as the track formats print it. */
const reference = (x: number, d: number): string => {
  const text = x.toFixed(d);
  return /^-0(\.0*)?$/.test(text) ? text.slice(1) : text;
};

const written = (write: (w: AsciiWriter) => void, digits?: number): string => {
  const w = digits === undefined ? new AsciiWriter(undefined, 128) : new AsciiWriter(digits, 128);
  write(w);
  return w.take().toString('latin1');
};

describe('AsciiWriter', () => {
  it('writes numbers exactly as fixed() prints them (toFixed text), above and below 2^31 and near ties', () => {
    fc.assert(fc.property(fc.double({ min: -1e12, max: 1e12, noNaN: true }), fc.integer({ min: 0, max: 12 }), (x, d) => written((w) => w.fixed(x, d)) === reference(x, d) && fixed(x, d) === reference(x, d)), { numRuns: 20_000 });
    for (const x of [0, -0, 2147483647.5, 2147483648.25, -9.9999999995, 0.1851851835, 1e20, -1e-30, 0.5, 0.05, 4294967296.0001, 8999999999999.99]) {
      for (const d of [0, 3, 6, 9, 10, 12]) {
        expect(written((w) => w.fixed(x, d)), `${x} ${d}`).toBe(reference(x, d));
        expect(fixed(x, d), `${x} ${d}`).toBe(reference(x, d));
      }
    }
  });

  it('writes epochs exactly as formatUtcIso, leap second included', () => {
    // Across the leap second 2016-12-31T23:59:60 (IERS Bulletin C 52).
    const parsed = parseUtcIso('2016-12-31T23:59:58Z');
    if (!parsed.ok) throw new Error(parsed.message);
    const leap = parsed.value;
    fc.assert(fc.property(fc.double({ min: -8e8, max: 3e9, noNaN: true }), fc.integer({ min: 0, max: 9 }), (t, d) => written((w) => w.utc(t), d) === formatUtcIso(t, d)));
    const seen = new Set<string>();
    for (let t = leap; t < leap + 4; t += 0.25) {
      const text = written((w) => w.utc(t));
      expect(text).toBe(formatUtcIso(t));
      seen.add(text.slice(11, 19));
    }
    expect([...seen]).toEqual(['23:59:58', '23:59:59', '23:59:60', '00:00:00']);
  });

  it('grows past its chunk size rather than dropping bytes, and hands out each chunk once', () => {
    const w = new AsciiWriter(3, 16);
    for (let i = 0; i < 10; i++) w.fixed(123456.789, 6).char(44);
    const text = w.take().toString('latin1');
    expect(text).toBe('123456.789000,'.repeat(10));
    expect(w.size).toBe(0);
  });

  it('writes digits across every quotient boundary of its division by 100 and 10^4 as toFixed does', () => {
    // The writer divides by multiplying with 0.01 and 1e-4 (the comment above writeDigitsBefore in ascii-writer.ts): check
    // the integers on both sides of multiples of 100 and 10^4, up to 2^31 - 1, as whole parts and
    // as 9-decimal fractions.
    const edges: number[] = [];
    for (const base of [100, 10_000, 1_000_000, 100_000_000]) {
      for (let k = 1; k * base < 2 ** 31; k = k * 3 + 1) for (const m of [k * base - 1, k * base, k * base + 1]) edges.push(m);
    }
    edges.push(2 ** 31 - 1, 2 ** 31 - 100, 999_999_999, 1_000_000_000);
    for (const m of edges) {
      expect(written((w) => w.fixed(m + 0.25, 2)), `${m}`).toBe(reference(m + 0.25, 2));
      if (m < 1e9) {
        const x = 3 + m / 1e9; // fraction digits m, 9 decimals
        expect(written((w) => w.fixed(x, 9)), `${m}`).toBe(reference(x, 9));
      }
    }
  });

  it('splits whole and decimal digits as toFixed does where the scaled number is a multiple of 10^d or next to one', () => {
    // The whole part is a product with 1 / 10^d, corrected by one (the comment above INV_SCALES in
    // ascii-writer.ts): the product can round across an integer exactly at and next to multiples.
    for (let d = 1; d <= 9; d++) {
      for (const whole of [1, 3, 7, 9, 10, 99, 6928, 7000, 65_535, 999_999, 2 ** 31 - 1]) {
        for (const step of [-1, 0, 1]) {
          const x = (whole * 10 ** d + step) / 10 ** d;
          for (const v of [x, -x]) expect(written((w) => w.fixed(v, d)), `${v} ${d}`).toBe(reference(v, d));
        }
      }
    }
  });

  it('writes numbers that use all 53 bits exactly as toFixed (fc.double alone favours round values)', () => {
    const uniform = fc.tuple(fc.integer({ min: -(2 ** 52), max: 2 ** 52 }), fc.integer({ min: -12, max: 9 })).map(([n, e]) => (n / 2 ** 52) * 10 ** e);
    fc.assert(fc.property(uniform, fc.integer({ min: 0, max: 12 }), (x, d) => written((w) => w.fixed(x, d)) === reference(x, d)), { numRuns: 20_000 });
  });

  it('fixedRun writes what fixed() and the separators write one by one', () => {
    const values = new Float64Array([6878.137, -0.0000004, 1234.5678905, 7.612345678, -0.5, 1e13 + 0.1]);
    const decimals = [6, 6, 6, 9, 9, 3];
    const byOne = written((w) => { for (let c = 0; c < 6; c++) w.char(44).fixed(values[c]!, decimals[c]!); });
    expect(written((w) => w.fixedRun(values, 0, 6, decimals, 44, true))).toBe(byOne);
    expect(written((w) => w.fixedRun(values, 2, 3, decimals.slice(2), 44, false))).toBe(byOne.split(',').slice(3, 6).join(','));
  });
});
