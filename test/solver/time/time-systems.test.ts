import { describe, expect, it } from 'vitest';
import { epochAsUtc, parseCalendar, parseEpochIn, type TimeSystem } from '../../../src/solver/time/time-systems.js';
import { parseUtcIso } from '../../../src/solver/time/time.js';
import { roundToMicrosecond } from '../../../src/solver/core/math.js';
import fc from 'fast-check';

const ok = <T>(r: { ok: true; value: T } | { ok: false; message: string }): T => {
  if (!r.ok) throw new Error(r.message);
  return r.value;
};

// One instant in four systems: TAI - UTC = 37 s since 2017-01-01 (IERS Bulletin C 52), TT - TAI =
// 32.184 s (IAU 1991 Res. A4), GPS - UTC = 18 s since 2017-01-01 (TAI - GPS = 19 s; IS-GPS-200, from memory).
const SAME: ReadonlyArray<readonly [string, TimeSystem]> = [
  ['2026-12-01T00:00:00Z', 'UTC'],
  ['2026-12-01T00:00:37', 'TAI'],
  ['2026-12-01T00:01:09.184', 'TT'],
  ['2026-12-01T00:00:18', 'GPS'],
];

describe('time systems', () => {
  it('reads one instant given in UTC, TAI, TT and GPS to the same TT seconds', () => {
    const utc = ok(parseUtcIso('2026-12-01T00:00:00Z'));
    for (const [text, system] of SAME) expect(ok(parseEpochIn(text, system)), `${system} ${text}`).toBeCloseTo(utc, 6);
  });

  it('rewrites each of them to the same UTC text, exactly', () => {
    for (const [text, system] of SAME) expect(ok(epochAsUtc(text, system))).toBe('2026-12-01T00:00:00Z');
    expect(ok(epochAsUtc('2026-12-01T00:01:09.184000001', 'TT'))).toBe('2026-12-01T00:00:00.000000001Z');
    expect(ok(epochAsUtc('2026-12-01T00:01:09.1', 'TT'))).toBe('2026-11-30T23:59:59.916Z');
    expect(ok(epochAsUtc('2026-12-01T00:00:00.500Z', 'UTC'))).toBe('2026-12-01T00:00:00.5Z');
  });

  it('lands inside the leap second at the end of 2016 (TAI - UTC 36 s before, 37 s after; IERS Bulletin C 52)', () => {
    expect(ok(epochAsUtc('2017-01-01T00:00:36', 'TAI'))).toBe('2016-12-31T23:59:60Z');
    expect(ok(epochAsUtc('2017-01-01T00:00:36.75', 'TAI'))).toBe('2016-12-31T23:59:60.75Z');
    expect(ok(epochAsUtc('2017-01-01T00:00:37', 'TAI'))).toBe('2017-01-01T00:00:00Z');
    expect(ok(epochAsUtc('2016-12-31T23:59:60.5Z', 'UTC'))).toBe('2016-12-31T23:59:60.5Z');
    expect(ok(parseEpochIn('2017-01-01T00:00:36.5', 'TAI'))).toBeCloseTo(ok(parseUtcIso('2016-12-31T23:59:60.5Z')), 6);
  });

  it('GPS time began equal to UTC on 1980-01-06 (IS-GPS-200, from memory)', () => {
    expect(ok(epochAsUtc('1980-01-06T00:00:00', 'GPS'))).toBe('1980-01-06T00:00:00Z');
  });

  it('reads the day-of-year form (2026-335 is 1 December; common practice, no source)', () => {
    expect(ok(epochAsUtc('2026-335T00:00:37', 'TAI'))).toBe('2026-12-01T00:00:00Z');
    expect(parseCalendar('2026-366T00:00:00', 'UTC').ok).toBe(false);
    expect(ok(parseCalendar('2024-366T00:00:00', 'UTC')).day).toBe(ok(parseCalendar('2024-12-31T00:00:00', 'UTC')).day);
  });

  it('refuses a zone letter on non-UTC epochs, second 60 outside UTC leap seconds, and impossible dates', () => {
    expect(parseCalendar('2026-12-01T00:00:37Z', 'TAI')).toMatchObject({ ok: false, code: 'invalid-epoch' });
    expect(parseCalendar('2016-12-31T23:59:60', 'TAI').ok).toBe(false);
    expect(parseCalendar('2016-12-30T23:59:60', 'UTC').ok).toBe(false);
    expect(parseCalendar('2026-02-29T00:00:00', 'UTC').ok).toBe(false);
    expect(parseCalendar('1969-12-31T00:00:00', 'TT')).toMatchObject({ ok: false, code: 'epoch-out-of-range' });
  });
});

describe('rounding to the microsecond (the service\'s time resolution)', () => {
  it('epochAsUtc rounds half up in integer nanoseconds and carries across the day and a leap second', () => {
    expect(epochAsUtc('2026-12-01T00:00:00.1234565Z', 'UTC', 6)).toEqual({ ok: true, value: '2026-12-01T00:00:00.123457Z' });
    expect(epochAsUtc('2026-12-01T00:00:00.1234564Z', 'UTC', 6)).toEqual({ ok: true, value: '2026-12-01T00:00:00.123456Z' });
    expect(epochAsUtc('2026-12-01T23:59:59.9999996Z', 'UTC', 6)).toEqual({ ok: true, value: '2026-12-02T00:00:00Z' });
    // 2016-12-31 ended with a leap second (IERS Bulletin C 52): 23:59:59.9999996 rounds into it, 23:59:60.9999996 out of it.
    expect(epochAsUtc('2016-12-31T23:59:59.9999996Z', 'UTC', 6)).toEqual({ ok: true, value: '2016-12-31T23:59:60Z' });
    expect(epochAsUtc('2016-12-31T23:59:60.9999996Z', 'UTC', 6)).toEqual({ ok: true, value: '2017-01-01T00:00:00Z' });
    expect(epochAsUtc('2026-12-01T00:00:00.1234565Z', 'UTC')).toEqual({ ok: true, value: '2026-12-01T00:00:00.1234565Z' });
  });

  it('roundToMicrosecond is idempotent and moves an epoch by at most half a microsecond', () => {
    fc.assert(fc.property(fc.double({ min: -8.8e8, max: 6.3e9, noNaN: true }), (tt) => {
      const r = roundToMicrosecond(tt);
      expect(roundToMicrosecond(r)).toBe(r);
      expect(Math.abs(r - tt)).toBeLessThanOrEqual(5.001e-7);
    }), { numRuns: 2000, seed: 11 });
  });
});
