import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { formatUtcIso, julianDateTT, parseUtcIso, taiMinusUtc, dayNumber, civilDate } from '../../../src/solver/time/time.js';
import { expectClose } from '../../helpers/approx.js';

const tt = (s: string): number => {
  const r = parseUtcIso(s);
  if (!r.ok) throw new Error(r.message);
  return r.value;
};

describe('time scales', () => {
  it('J2000.0 is 2000-01-01T11:58:55.816 UTC (TT - UTC = 64.184 s in 2000; IERS Conventions 2010 sec. 10.1, from memory)', () => {
    expectClose(tt('2000-01-01T11:58:55.816Z'), 0, 1e-9, 'tt');
    expect(formatUtcIso(0)).toBe('2000-01-01T11:58:55.816000Z');
  });

  it('TAI - UTC is 37 s from 2017-01-01 and 36 s the day before (IERS Bulletin C 52)', () => {
    expect(taiMinusUtc(dayNumber(2017, 1, 1))).toBe(37);
    expect(taiMinusUtc(dayNumber(2016, 12, 31))).toBe(36);
    expect(taiMinusUtc(dayNumber(1972, 1, 1))).toBe(10);
  });

  it('the leap second 2016-12-31T23:59:60 exists and lasts one second of TT', () => {
    const before = tt('2016-12-31T23:59:59Z');
    const leap = tt('2016-12-31T23:59:60.5Z');
    const after = tt('2017-01-01T00:00:00Z');
    expectClose(leap - before, 1.5, 1e-9, 'into leap');
    expectClose(after - before, 2, 1e-9, 'across leap');
    expect(formatUtcIso(leap)).toBe('2016-12-31T23:59:60.500000Z');
    expect(formatUtcIso(after)).toBe('2017-01-01T00:00:00.000000Z');
  });

  it('Julian date of 1996-10-26T14:20:00 UTC is 2450383.09722222 UTC (Vallado, Fundamentals of Astrodynamics and Applications, 4th ed., Example 3-4, from memory)', () => {
    // JD(TT) = JD(UTC) + (TAI-UTC + 32.184)/86400 with TAI-UTC = 30 s in 1996.
    const jdTT = julianDateTT(tt('1996-10-26T14:20:00Z'));
    expectClose(jdTT - (30 + 32.184) / 86_400, 2_450_383.097_222_22, 1e-8, 'JD UTC');
  });

  it('refuses timestamps that are not dates', () => {
    for (const bad of ['2026-02-30T00:00:00Z', '2026-13-01T00:00:00Z', '2026-12-01T24:00:00Z', '2026-12-01T00:00:60Z', 'yesterday', '2026-12-01T00:00:00']) {
      const r = parseUtcIso(bad);
      expect(r.ok, bad).toBe(false);
      if (!r.ok) expect(r.code).toBe('invalid-epoch');
    }
    const old = parseUtcIso('1969-07-20T20:17:00Z');
    expect(old.ok).toBe(false);
    if (!old.ok) expect(old.code).toBe('epoch-out-of-range');
  });

  it('civilDate inverts dayNumber (round trip over 1972-2199)', () => {
    fc.assert(fc.property(fc.integer({ min: dayNumber(1972, 1, 1), max: dayNumber(2199, 12, 31) }), (d) => {
      const c = civilDate(d);
      return dayNumber(c.year, c.month, c.day) === d;
    }));
  });

  it('formats the instants at and next to whole seconds, minutes and hours as Date#toISOString does (ECMA-262 sec. 21.4.4.36)', () => {
    // The splitter's quotients by 10^d, 3600 and 60 are products with a one-step correction:
    // check them where the product can round across an integer.
    const base = Date.UTC(2026, 11, 1);
    for (const second of [0, 1, 59, 60, 61, 3599, 3600, 3601, 43_200, 86_340, 86_399]) {
      for (const ms of [0, 1, 999]) {
        const iso = new Date(base + second * 1000 + ms).toISOString(); // e.g. 2026-12-01T13:00:00.001Z
        expect(formatUtcIso(tt(iso), 3), iso).toBe(iso);
        // Six digits: an epoch near 2026 is a TT double good to about 1e-7 s, not to nine digits.
        expect(formatUtcIso(tt(iso), 6), iso).toBe(iso.replace('Z', '000Z'));
        if (ms === 0) expect(formatUtcIso(tt(iso), 0), iso).toBe(iso.replace('.000Z', 'Z'));
      }
    }
  });

  it('format then parse returns the epoch to the printed precision', () => {
    fc.assert(fc.property(fc.double({ min: -8e8, max: 3e9, noNaN: true }), (t) => {
      const back = tt(formatUtcIso(t, 6));
      return Math.abs(back - t) <= 5.1e-7;
    }));
  });
});
