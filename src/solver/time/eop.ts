// Earth orientation parameters from an IERS finals2000A file (format: the file's ReadMe, IERS
// Rapid Service / Prediction Centre): a pure parser and linear interpolation between the daily rows,
// as the ReadMe advises. Values are Bulletin A (observed rows flagged I, predictions P).
// UT1-UTC jumps by 1 s at a leap second: it is interpolated as UT1-TAI, which is continuous, and
// converted back with the TAI-UTC of the epoch (IERS Conventions 2010 ch. 5; common practice).

import { failure, success, type Outcome } from '../core/result.js';
import { civilDate, taiMinusUtc, utcFromTt, endsWithLeapSecond } from './time.js';

const ARCSEC = Math.PI / 648_000;
const MAS = ARCSEC / 1000;
/** MJD of 2000-01-01 (the day numbering of time.ts starts there). */
export const MJD_2000 = 51_544;

/** Numbers per day in EopTable.rows. */
export const EOP_ROW_WIDTH = 6;
/** Row layout: xp, yp (rad), UT1-UTC (s), dX, dY (rad; offsets of the celestial pole w.r.t. IAU 2006/2000A), flags. */
export const EOP_XP = 0;
export const EOP_YP = 1;
export const EOP_UT1_UTC = 2;
export const EOP_DX = 3;
export const EOP_DY = 4;
export const EOP_FLAGS = 5;
/** Flag bits: polar motion / UT1-UTC / dX,dY predicted (P) rather than observed (I); dX,dY absent (taken as 0). */
export const EOP_PM_PREDICTED = 1;
export const EOP_UT1_PREDICTED = 2;
export const EOP_NUTATION_PREDICTED = 4;
export const EOP_NUTATION_MISSING = 8;

/** One row per consecutive UTC day from firstMjd on; plain data (crosses worker threads as is). */
export interface EopTable {
  readonly firstMjd: number;
  readonly rows: Float64Array;
  /** Last day whose polar motion and UT1-UTC are both observed (flag I); NaN when none. */
  readonly lastObservedMjd: number;
}

export const eopDays = (table: EopTable): number => table.rows.length / EOP_ROW_WIDTH;
export const eopLastMjd = (table: EopTable): number => table.firstMjd + eopDays(table) - 1;

/** ISO date (YYYY-MM-DD) of an MJD. */
export function mjdToIsoDate(mjd: number): string {
  const d = civilDate(mjd - MJD_2000);
  return `${String(d.year).padStart(4, '0')}-${String(d.month).padStart(2, '0')}-${String(d.day).padStart(2, '0')}`;
}

// Byte columns of the ReadMe (1-based, inclusive) as [start, end).
const field = (line: string, from: number, to: number): string => line.slice(from - 1, to);
const number = (text: string): number => (text.trim() === '' ? NaN : Number(text));

/**
 * Parse a finals2000A text (finals2000A.all, .data or .daily: same format). Rows must be daily and
 * consecutive; the table ends at the first row without polar motion or UT1-UTC (the file's blank
 * future rows). A row with no dX, dY keeps polar motion and UT1 and takes dX = dY = 0 (flagged).
 */
export function parseFinals2000A(text: string): Outcome<EopTable> {
  const lines = text.split('\n');
  const values: number[] = [];
  let firstMjd = NaN;
  let lastObservedMjd = NaN;
  for (let n = 0; n < lines.length; n++) {
    const line = lines[n]!.replace(/\r$/, '');
    if (line.trim() === '') continue;
    const where = `line ${n + 1}`;
    const mjd = number(field(line, 8, 15));
    const [yy, mm, dd] = [number(field(line, 1, 2)), number(field(line, 3, 4)), number(field(line, 5, 6))];
    if (!Number.isInteger(mjd) || !Number.isInteger(yy) || !Number.isInteger(mm) || !Number.isInteger(dd)) {
      return failure('invalid-parameter', `${where}: not a finals2000A row (date in bytes 1-6, MJD in bytes 8-15)`);
    }
    const date = civilDate(mjd - MJD_2000);
    if (date.year % 100 !== yy || date.month !== mm || date.day !== dd) {
      return failure('invalid-parameter', `${where}: MJD ${mjd} is ${mjdToIsoDate(mjd)}, the row says ${yy}-${mm}-${dd}`);
    }
    const expected = Number.isNaN(firstMjd) ? mjd : firstMjd + values.length / EOP_ROW_WIDTH;
    if (mjd !== expected) return failure('invalid-parameter', `${where}: MJD ${mjd} where ${expected} (daily rows, increasing, no gap) was expected`);
    const pmFlag = field(line, 17, 17);
    const ut1Flag = field(line, 58, 58);
    const nutFlag = field(line, 96, 96);
    const xp = number(field(line, 19, 27));
    const yp = number(field(line, 38, 46));
    const dut1 = number(field(line, 59, 68));
    if (Number.isNaN(xp) && Number.isNaN(yp) && Number.isNaN(dut1) && pmFlag.trim() === '') break; // the blank future rows
    if (!Number.isFinite(xp) || !Number.isFinite(yp) || !Number.isFinite(dut1)) {
      return failure('invalid-parameter', `${where}: polar motion (bytes 19-27, 38-46) or UT1-UTC (bytes 59-68) is missing or not a number`);
    }
    if (Math.abs(xp) > 2 || Math.abs(yp) > 2 || Math.abs(dut1) > 1) {
      return failure('invalid-parameter', `${where}: xp ${xp}", yp ${yp}" or UT1-UTC ${dut1} s is outside any published value (|pole| <= 2", |UT1-UTC| <= 1 s)`);
    }
    if (!/^[IP]$/.test(pmFlag) || !/^[IP]$/.test(ut1Flag)) return failure('invalid-parameter', `${where}: the I/P flags of bytes 17 and 58 are "${pmFlag}", "${ut1Flag}"`);
    let dX = number(field(line, 98, 106));
    let dY = number(field(line, 117, 125));
    let flags = (pmFlag === 'P' ? EOP_PM_PREDICTED : 0) | (ut1Flag === 'P' ? EOP_UT1_PREDICTED : 0);
    if (Number.isNaN(dX) || Number.isNaN(dY)) {
      if (field(line, 98, 125).trim() !== '') return failure('invalid-parameter', `${where}: dX (bytes 98-106) or dY (bytes 117-125) is not a number`);
      dX = 0;
      dY = 0;
      flags |= EOP_NUTATION_MISSING;
    } else {
      if (Math.abs(dX) > 100 || Math.abs(dY) > 100) return failure('invalid-parameter', `${where}: dX ${dX} or dY ${dY} mas is outside any published value (100 mas)`);
      if (nutFlag === 'P') flags |= EOP_NUTATION_PREDICTED;
    }
    if (Number.isNaN(firstMjd)) firstMjd = mjd;
    if (pmFlag === 'I' && ut1Flag === 'I') lastObservedMjd = mjd;
    values.push(xp * ARCSEC, yp * ARCSEC, dut1, dX * MAS, dY * MAS, flags);
  }
  if (values.length < 2 * EOP_ROW_WIDTH) return failure('invalid-parameter', 'a finals2000A table needs at least two daily rows with polar motion and UT1-UTC');
  return success({ firstMjd, rows: Float64Array.from(values), lastObservedMjd });
}

/** Earth orientation at one instant. */
export interface EopValues {
  /** Pole coordinates, rad. */
  readonly xp: number;
  readonly yp: number;
  /** UT1-UTC, s (UT1-TAI interpolated, so a leap second is not smeared). */
  readonly ut1MinusUtc: number;
  /** UT1-TAI, s: continuous across leap seconds. */
  readonly ut1MinusTai: number;
  /** Celestial pole offsets, rad. */
  readonly dX: number;
  readonly dY: number;
  /** False outside the table: then every value is 0 (UT1 = UTC), the documented fallback. */
  readonly covered: boolean;
}

/** Fractional MJD (UTC) of a TT epoch; a leap-second day is 86401 s long. */
export function mjdUtc(tt: number): number {
  const { utcDay, secondOfDay } = utcFromTt(tt);
  return utcDay + MJD_2000 + secondOfDay / (86_400 + (endsWithLeapSecond(utcDay) ? 1 : 0));
}

/** Values at TT epoch `tt`, linear between the daily rows (at 0h UTC). */
export function eopAt(table: EopTable, tt: number): EopValues {
  const mjd = mjdUtc(tt);
  const taiNow = taiMinusUtc(Math.floor(mjd) - MJD_2000);
  const x = mjd - table.firstMjd;
  const last = eopDays(table) - 1;
  if (!(x >= 0 && x <= last)) return { xp: 0, yp: 0, ut1MinusUtc: 0, ut1MinusTai: -taiNow, dX: 0, dY: 0, covered: false };
  const i = Math.min(Math.floor(x), last - 1);
  const f = x - i;
  const r = table.rows;
  const a = i * EOP_ROW_WIDTH;
  const b = a + EOP_ROW_WIDTH;
  const lin = (k: number): number => r[a + k]! + f * (r[b + k]! - r[a + k]!);
  const ua = r[a + EOP_UT1_UTC]! - taiMinusUtc(table.firstMjd + i - MJD_2000);
  const ub = r[b + EOP_UT1_UTC]! - taiMinusUtc(table.firstMjd + i + 1 - MJD_2000);
  const ut1MinusTai = ua + f * (ub - ua);
  return { xp: lin(EOP_XP), yp: lin(EOP_YP), ut1MinusUtc: ut1MinusTai + taiNow, ut1MinusTai, dX: lin(EOP_DX), dY: lin(EOP_DY), covered: true };
}

/** How a span [startTT, stopTT] sits in the table. */
export interface EopCoverage {
  /** Some epoch of the span lies outside the table (values 0 there). */
  readonly outside: boolean;
  /** Some epoch of the span uses predicted rows (after the last observed day). */
  readonly predicted: boolean;
  readonly firstDate: string;
  readonly lastDate: string;
}

export function eopCoverage(table: EopTable, startTT: number, stopTT: number): EopCoverage {
  const lo = mjdUtc(Math.min(startTT, stopTT));
  const hi = mjdUtc(Math.max(startTT, stopTT));
  const last = eopLastMjd(table);
  return {
    outside: lo < table.firstMjd || hi > last,
    predicted: !(hi <= table.lastObservedMjd) && hi >= table.firstMjd,
    firstDate: mjdToIsoDate(table.firstMjd),
    lastDate: mjdToIsoDate(last),
  };
}

/** The rows a span needs (one day of margin each side), as a smaller table: what a job carries to a worker. */
export function eopSlice(table: EopTable, startTT: number, stopTT: number): EopTable {
  const days = eopDays(table);
  const from = Math.max(0, Math.floor(mjdUtc(Math.min(startTT, stopTT))) - table.firstMjd - 1);
  const to = Math.min(days, Math.floor(mjdUtc(Math.max(startTT, stopTT))) - table.firstMjd + 3);
  if (to - from < 2) {
    // Entirely outside: two end rows keep the table valid and the epochs outside it.
    const at = from >= days - 1 ? days - 2 : 0;
    return { firstMjd: table.firstMjd + at, rows: table.rows.slice(at * EOP_ROW_WIDTH, (at + 2) * EOP_ROW_WIDTH), lastObservedMjd: table.lastObservedMjd };
  }
  return { firstMjd: table.firstMjd + from, rows: table.rows.slice(from * EOP_ROW_WIDTH, to * EOP_ROW_WIDTH), lastObservedMjd: table.lastObservedMjd };
}
