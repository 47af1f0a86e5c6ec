// The finals2000A parser and interpolation, checked against rows of the IERS file itself
// (test/fixtures/finals2000A-2025-2027.txt: IERS Bulletin A (USNO), excerpt of finals2000A.all as
// packaged in astropy-iers-data 0.2026.9.28; format: its ReadMe, bytes as listed there).
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import {
  EOP_NUTATION_MISSING, EOP_NUTATION_PREDICTED, EOP_PM_PREDICTED, EOP_ROW_WIDTH, EOP_FLAGS,
  eopAt, eopCoverage, eopDays, eopLastMjd, eopSlice, mjdToIsoDate, parseFinals2000A, type EopTable,
} from '../../../src/solver/time/eop.js';
import { ut1Days } from '../../../src/solver/earth/frames.js';
import { parseUtcIso } from '../../../src/solver/time/time.js';
import { expectClose } from '../../helpers/approx.js';

const TEXT = readFileSync(new URL('../../fixtures/finals2000A-2025-2027.txt', import.meta.url), 'utf8');
const LINES = TEXT.split('\n');
const ARCSEC = Math.PI / 648_000;
const tt = (s: string): number => {
  const r = parseUtcIso(s);
  if (!r.ok) throw new Error(r.message);
  return r.value;
};
const table = (text: string): EopTable => {
  const r = parseFinals2000A(text);
  if (!r.ok) throw new Error(r.message);
  return r.value;
};
const EOP = table(TEXT);

/** The file's own values for one MJD, read here by the ReadMe's byte columns. */
function row(mjd: number): { xp: number; yp: number; dut1: number; dX: number; dY: number } {
  const line = LINES.find((l) => Number(l.slice(7, 15)) === mjd)!;
  return { xp: Number(line.slice(18, 27)), yp: Number(line.slice(37, 46)), dut1: Number(line.slice(58, 68)), dX: Number(line.slice(97, 106)), dY: Number(line.slice(116, 125)) };
}

describe('parseFinals2000A', () => {
  it('reads the excerpt: 2025-01-01 to the last predicted day, observed through 2026-09-17 (flags I/P of the file)', () => {
    expect(mjdToIsoDate(EOP.firstMjd)).toBe('2025-01-01');
    expect(mjdToIsoDate(eopLastMjd(EOP))).toBe('2027-09-25');
    expect(mjdToIsoDate(EOP.lastObservedMjd)).toBe('2026-09-17');
    expect(eopDays(EOP)).toBe(61_673 - 60_676 + 1);
    const flags = (mjd: number): number => EOP.rows[(mjd - EOP.firstMjd) * EOP_ROW_WIDTH + EOP_FLAGS]!;
    expect(flags(61_100)).toBe(0); // 2026-03-01: I I I
    expect(flags(61_278)).toBe(EOP_NUTATION_PREDICTED); // 2026-08-26: I I P
    expect(flags(61_545) & EOP_PM_PREDICTED).toBeTruthy(); // 2027-05-20: P P, no dX/dY
    expect(flags(61_545) & EOP_NUTATION_MISSING).toBeTruthy();
  });

  it('gives each row of the file back at 0h UTC (2025-01-01, 2026-03-01, 2026-08-26, 2027-05-20)', () => {
    for (const [iso, mjd] of [['2025-01-01', 60_676], ['2026-03-01', 61_100], ['2026-08-26', 61_278], ['2027-05-20', 61_545]] as const) {
      const e = eopAt(EOP, tt(`${iso}T00:00:00Z`));
      const f = row(mjd);
      expect(e.covered).toBe(true);
      expectClose(e.xp / ARCSEC, f.xp, 1e-12, `${iso} xp"`);
      expectClose(e.yp / ARCSEC, f.yp, 1e-12, `${iso} yp"`);
      expectClose(e.ut1MinusUtc, f.dut1, 1e-12, `${iso} UT1-UTC s`);
      expectClose(e.dX / ARCSEC * 1000, Number.isNaN(f.dX) ? 0 : f.dX, 1e-9, `${iso} dX mas`);
      expectClose(e.dY / ARCSEC * 1000, Number.isNaN(f.dY) ? 0 : f.dY, 1e-9, `${iso} dY mas`);
    }
  });

  it('interpolates linearly between two rows (ReadMe practice): 2026-03-01T18:00Z is 3/4 of the way to 2026-03-02', () => {
    const a = row(61_100);
    const b = row(61_101);
    const e = eopAt(EOP, tt('2026-03-01T18:00:00Z'));
    expectClose(e.xp / ARCSEC, a.xp + 0.75 * (b.xp - a.xp), 1e-12, 'xp"');
    expectClose(e.yp / ARCSEC, a.yp + 0.75 * (b.yp - a.yp), 1e-12, 'yp"');
    expectClose(e.ut1MinusUtc, a.dut1 + 0.75 * (b.dut1 - a.dut1), 1e-12, 'UT1-UTC s');
    expectClose(e.dX / ARCSEC * 1000, a.dX + 0.75 * (b.dX - a.dX), 1e-9, 'dX mas');
  });

  it('outside the table every value is 0 (UT1 = UTC) and covered is false; coverage says so', () => {
    for (const iso of ['2024-12-31T23:59:59Z', '2027-09-25T00:00:01Z', '2030-01-01T00:00:00Z']) {
      const e = eopAt(EOP, tt(iso));
      expect(e.covered, iso).toBe(false);
      expect([e.xp, e.yp, e.ut1MinusUtc, e.dX, e.dY]).toEqual([0, 0, 0, 0, 0]);
    }
    expect(eopCoverage(EOP, tt('2026-03-01T00:00:00Z'), tt('2026-03-02T00:00:00Z'))).toMatchObject({ outside: false, predicted: false });
    expect(eopCoverage(EOP, tt('2026-09-17T00:00:00Z'), tt('2026-09-18T00:00:00Z'))).toMatchObject({ outside: false, predicted: true });
    expect(eopCoverage(EOP, tt('2027-09-20T00:00:00Z'), tt('2027-10-01T00:00:00Z'))).toMatchObject({ outside: true, predicted: true });
  });

  it('a slice for a job gives the same values as the whole table inside its span, and stays outside outside it', () => {
    const a = tt('2026-03-01T05:00:00Z');
    const b = tt('2026-03-04T22:00:00Z');
    const s = eopSlice(EOP, a, b);
    expect(eopDays(s)).toBeLessThan(8);
    for (let t = a; t <= b; t += 3 * 3600 + 17) expect(eopAt(s, t)).toEqual(eopAt(EOP, t));
    const far = eopSlice(EOP, tt('2031-01-01T00:00:00Z'), tt('2031-01-02T00:00:00Z'));
    expect(eopAt(far, tt('2031-01-01T12:00:00Z')).covered).toBe(false);
    const before = eopSlice(EOP, tt('2020-01-01T00:00:00Z'), tt('2020-01-02T00:00:00Z'));
    expect(eopAt(before, tt('2020-01-01T12:00:00Z')).covered).toBe(false);
  });
});

/** A finals2000A row at the ReadMe's byte columns (test data written here). */
function line(y: number, m: number, d: number, mjd: number, xp: number, yp: number, dut1: number, nut?: [number, number]): string {
  const c = Array<string>(187).fill(' ');
  const put = (from: number, text: string): void => { for (let i = 0; i < text.length; i++) c[from - 1 + i] = text[i]!; };
  put(1, `${String(y % 100).padStart(2)}${String(m).padStart(2)}${String(d).padStart(2)}`);
  put(8, mjd.toFixed(2).padStart(8));
  put(17, 'I');
  put(19, xp.toFixed(6).padStart(9));
  put(38, yp.toFixed(6).padStart(9));
  put(58, 'I');
  put(59, dut1.toFixed(7).padStart(10));
  if (nut) {
    put(96, 'I');
    put(98, nut[0].toFixed(3).padStart(9));
    put(117, nut[1].toFixed(3).padStart(9));
  }
  return c.join('').trimEnd();
}

describe('leap seconds and bad files', () => {
  // Invented values shaped like the leap second at the end of 2016 (UT1-UTC steps up by 1 s).
  const LEAP = [
    line(2016, 12, 30, 57_752, 0.1, 0.25, -0.4075),
    line(2016, 12, 31, 57_753, 0.1, 0.25, -0.408),
    line(2017, 1, 1, 57_754, 0.1, 0.25, 0.5925),
    line(2017, 1, 2, 57_755, 0.1, 0.25, 0.592),
  ].join('\n');

  it('UT1-UTC is not interpolated across the leap-second jump: UT1-TAI is (IERS practice)', () => {
    const t = table(LEAP);
    // Halfway through the leap-second day (86401 s long): between -0.408 and (0.5925 - 1) s.
    expectClose(eopAt(t, tt('2016-12-31T12:00:00.5Z')).ut1MinusUtc, -0.40775, 1e-9, 'UT1-UTC s');
    // UT1 runs on through 23:59:60: two SI seconds from 23:59:59 to 00:00:00 are ~2 s of UT1.
    const before = ut1Days(tt('2016-12-31T23:59:59Z'), { eop: t });
    const after = ut1Days(tt('2017-01-01T00:00:00Z'), { eop: t });
    expectClose((after - before) * 86_400, 2, 1e-3, 'UT1 s');
  });

  it('a row without dX, dY takes 0 for them; a table ends at the blank future rows', () => {
    const t = table(`${line(2026, 3, 1, 61_100, 0.1, 0.2, 0.05, [0.3, -0.2])}\n${line(2026, 3, 2, 61_101, 0.1, 0.2, 0.05)}\n26 3 3 61102.00\n`);
    expect(eopDays(t)).toBe(2);
    expect(t.rows[EOP_ROW_WIDTH + EOP_FLAGS]! & EOP_NUTATION_MISSING).toBeTruthy();
  });

  it.each([
    ['a gap', `${line(2026, 3, 1, 61_100, 0.1, 0.2, 0.05)}\n${line(2026, 3, 3, 61_102, 0.1, 0.2, 0.05)}`, /line 2: MJD 61102 where 61101/],
    ['a date that is not its MJD', `${line(2026, 3, 1, 61_101, 0.1, 0.2, 0.05)}\n`, /line 1: MJD 61101 is 2026-03-02/],
    ['garbage', 'hello world\n', /line 1: not a finals2000A row/],
    ['a missing UT1-UTC', `${line(2026, 3, 1, 61_100, 0.1, 0.2, 0.05)}\n${line(2026, 3, 2, 61_101, 0.1, 0.2, 0.05).slice(0, 58)}`, /line 2: .*UT1-UTC/],
    ['a pole 30" off', `${line(2026, 3, 1, 61_100, 30, 0.2, 0.05)}\n`, /line 1: xp 30/],
    ['one row only', `${line(2026, 3, 1, 61_100, 0.1, 0.2, 0.05)}\n`, /at least two daily rows/],
    ['an empty file', '', /at least two daily rows/],
  ])('refuses %s, naming the line', (_name, text, message) => {
    const r = parseFinals2000A(text);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.message).toMatch(message);
  });
});
