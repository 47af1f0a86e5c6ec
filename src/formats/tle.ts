// Two-line element sets: the column layout of Hoots & Roehrich, Spacetrack Report No. 3 (1980), as
// tabulated in Vallado, Crawford, Hujsak & Kelso, AIAA 2006-6753 (2006), read strictly: each line
// exactly 69 characters, the checksum in column 69 (the sum of the digits of columns 1-68, each
// minus sign counting 1, modulo 10), every field its format, blanks where the layout has blanks.
// Every problem is reported with its line, columns and what was expected, not only the first.
// Catalogue numbers may be Alpha-5 (a letter A-Z without I and O, then four digits). Two-digit
// epoch years follow the method's convention: 57-99 -> 1957-1999, 00-56 -> 2000-2056.

import { dayNumber, FIRST_SUPPORTED_YEAR, ttFromUtc } from '../solver/time/time.js';
import { ALPHA5, type ElementIssue, type ElementsRead } from './mean-elements.js';

export const TLE_LINE_LENGTH = 69;

/** The checksum of a line: digits of columns 1-68 summed, '-' counting 1, modulo 10 (Spacetrack Report No. 3). */
export function tleChecksum(line: string): number {
  let sum = 0;
  for (let i = 0; i < Math.min(68, line.length); i++) {
    const c = line.charCodeAt(i);
    if (c >= 48 && c <= 57) sum += c - 48;
    else if (c === 45) sum += 1;
  }
  return sum % 10;
}

interface Field {
  readonly name: string;
  /** 1-based first and last column. */
  readonly from: number;
  readonly to: number;
  readonly pattern: RegExp;
  readonly expected: string;
}

const f = (name: string, from: number, to: number, pattern: RegExp, expected: string): Field => ({ name, from, to, pattern, expected });
const ANGLE = /^[ \d]{2}\d\.\d{4}$/;
const EXPONENT = /^[ +-]\d{5}[+-]\d$/;
const EXPONENT_TEXT = 'a sign or blank, 5 digits with an assumed leading decimal point, and a signed exponent digit, like " 12345-4" or "-11606-4"';

const LINE1: readonly Field[] = [
  f('satellite number', 3, 7, /^(?:[\dA-HJ-NP-Z]\d{4}| *\d+)$/, 'five digits, or Alpha-5 (a letter A-Z without I and O, then four digits)'),
  f('classification', 8, 8, /^[UCS ]$/, 'U, C, S or blank'),
  f('international designator', 10, 17, /^(?:\d{5}[A-Z ]{3}| {8})$/, 'launch year (2 digits), launch number (3 digits) and piece (up to 3 letters), or blanks'),
  f('epoch year', 19, 20, /^\d{2}$/, 'two digits'),
  f('epoch day', 21, 32, /^[ \d]{2}\d\.\d{8}$/, 'day of the year with 8 decimals, like 176.82412014'),
  f('mean motion derivative', 34, 43, /^[ +-]\.\d{8}$/, 'a sign or blank, a decimal point and 8 digits, like " .00008885" (rev/day^2, divided by 2)'),
  f('mean motion second derivative', 45, 52, EXPONENT, EXPONENT_TEXT),
  f('BSTAR', 54, 61, EXPONENT, EXPONENT_TEXT),
  f('ephemeris type', 63, 63, /^[0 ]$/, '0 or blank (the SGP4 element type)'),
  f('element set number', 65, 68, /^ *\d* *$/, 'up to 4 digits'),
];

const LINE2: readonly Field[] = [
  f('satellite number', 3, 7, /^(?:[\dA-HJ-NP-Z]\d{4}| *\d+)$/, 'the satellite number of line 1'),
  f('inclination', 9, 16, ANGLE, 'degrees with 4 decimals, like " 51.6416"'),
  f('right ascension of the ascending node', 18, 25, ANGLE, 'degrees with 4 decimals, like "247.4627"'),
  f('eccentricity', 27, 33, /^\d{7}$/, 'seven digits with an assumed leading decimal point, like "0006703"'),
  f('argument of perigee', 35, 42, ANGLE, 'degrees with 4 decimals, like "130.5360"'),
  f('mean anomaly', 44, 51, ANGLE, 'degrees with 4 decimals, like "325.0288"'),
  f('mean motion', 53, 63, /^[ \d]\d\.\d{8}$/, 'revolutions per day with 8 decimals, like "15.72125391"'),
  f('revolution number', 64, 68, /^ *\d* *$/, 'up to 5 digits'),
];

/** Columns that the layout leaves blank. */
const BLANKS1 = [2, 9, 18, 33, 44, 53, 62, 64];
const BLANKS2 = [2, 8, 17, 26, 34, 43, 52];

const cols = (line: string, a: number, b: number): string => line.slice(a - 1, b);
const where = (n: 1 | 2, a: number, b: number): string => (a === b ? `line ${n} column ${a}` : `line ${n} columns ${a}-${b}`);
/** A found value, quoted, safe to print (control characters shown as \uXXXX). */
const shown = (s: string): string => JSON.stringify(s);

/** " 12345-4" -> 0.12345e-4 (assumed decimal point). */
const exponentField = (s: string): number => Number(`${s[0] === '-' ? '-' : ''}0.${s.slice(1, 6)}e${s.slice(6)}`);

/** The catalogue number of a (verified) field: digits, or Alpha-5. */
export function catalogNumberOf(field: string): number {
  const t = field.trim();
  const letter = ALPHA5.indexOf(t[0]!);
  return letter >= 0 ? (10 + letter) * 10_000 + Number(t.slice(1)) : Number(t);
}

function checkLine(line: string, n: 1 | 2, fields: readonly Field[], blanks: readonly number[], issues: ElementIssue[]): boolean {
  const path = `line${n}`;
  if (line.length !== TLE_LINE_LENGTH) {
    issues.push({ path, message: `line ${n}: expected ${TLE_LINE_LENGTH} characters, found ${line.length}` });
    return false;
  }
  if (!/^[\x20-\x7e]*$/.test(line)) {
    issues.push({ path, message: `line ${n}: expected printable ASCII only, found ${shown(line.replace(/[\x20-\x7e]/g, '').slice(0, 5))}` });
    return false;
  }
  let good = true;
  if (line[0] !== String(n)) {
    issues.push({ path, message: `${where(n, 1, 1)} (line number): expected ${n}, found ${shown(line[0]!)}` });
    good = false;
  }
  const sum = tleChecksum(line);
  if (!/^\d$/.test(line[68]!)) {
    issues.push({ path, message: `line ${n} checksum (column 69): expected the digit ${sum}, found ${shown(line[68]!)}` });
    good = false;
  } else if (Number(line[68]) !== sum) {
    issues.push({ path, message: `line ${n} checksum: expected ${sum}, found ${line[68]}` });
    good = false;
  }
  for (const c of blanks) {
    if (line[c - 1] !== ' ') {
      issues.push({ path, message: `${where(n, c, c)}: expected a blank, found ${shown(line[c - 1]!)}` });
      good = false;
    }
  }
  for (const fd of fields) {
    const s = cols(line, fd.from, fd.to);
    if (!fd.pattern.test(s)) {
      issues.push({ path, message: `${where(n, fd.from, fd.to)} (${fd.name}): expected ${fd.expected}, found ${shown(s)}` });
      good = false;
    }
  }
  return good;
}

/** Read a two-line set; every malformed field is an issue naming its line, columns and expectation. */
export function readTle(line1: string, line2: string, name?: string): ElementsRead {
  const issues: ElementIssue[] = [];
  const ok1 = checkLine(line1, 1, LINE1, BLANKS1, issues);
  const ok2 = checkLine(line2, 2, LINE2, BLANKS2, issues);
  if (!ok1 || !ok2) return { ok: false, unsupported: false, issues };

  const sat1 = cols(line1, 3, 7);
  const sat2 = cols(line2, 3, 7);
  if (catalogNumberOf(sat1) !== catalogNumberOf(sat2)) {
    issues.push({ path: 'line2', message: `line 2 columns 3-7 (satellite number): expected ${shown(sat1)} as on line 1, found ${shown(sat2)}` });
  }
  const yy = Number(cols(line1, 19, 20));
  const year = yy < 57 ? 2000 + yy : 1900 + yy; // Vallado et al. 2006: 57-99 -> 19xx
  const day = Number(cols(line1, 21, 32));
  const daysInYear = dayNumber(year + 1, 1, 1) - dayNumber(year, 1, 1);
  if (!(day >= 1 && day < daysInYear + 1)) {
    issues.push({ path: 'line1', message: `line 1 columns 21-32 (epoch day): expected a day of ${year} from 1 to ${daysInYear + 1} (exclusive), found ${shown(cols(line1, 21, 32))}` });
  }
  if (year < FIRST_SUPPORTED_YEAR) {
    issues.push({ path: 'line1', message: `line 1 columns 19-20 (epoch year): "${cols(line1, 19, 20)}" is ${year} (57-99 -> 1957-1999); epochs must lie in ${FIRST_SUPPORTED_YEAR}-2199 (UTC before 1972 had no leap-second form)` });
  }
  const num = (s: string): number => Number(s.trim());
  const inclination = num(cols(line2, 9, 16));
  const raan = num(cols(line2, 18, 25));
  const argPerigee = num(cols(line2, 35, 42));
  const meanAnomaly = num(cols(line2, 44, 51));
  const meanMotion = num(cols(line2, 53, 63));
  const range = (value: number, a: number, b: number, what: string, lo: number, hi: number, hiIncluded: boolean): void => {
    if (!(value >= lo && (hiIncluded ? value <= hi : value < hi))) {
      issues.push({ path: 'line2', message: `line 2 columns ${a}-${b} (${what}): expected ${lo} to ${hi}${hiIncluded ? '' : ' (exclusive)'}, found ${value}` });
    }
  };
  range(inclination, 9, 16, 'inclination', 0, 180, true);
  range(raan, 18, 25, 'right ascension of the ascending node', 0, 360, false);
  range(argPerigee, 35, 42, 'argument of perigee', 0, 360, false);
  range(meanAnomaly, 44, 51, 'mean anomaly', 0, 360, false);
  if (!(meanMotion > 0)) issues.push({ path: 'line2', message: `line 2 columns 53-63 (mean motion): expected more than 0 rev/day, found ${shown(cols(line2, 53, 63))}` });
  if (issues.length > 0) return { ok: false, unsupported: false, issues };

  const whole = Math.floor(day);
  const utcDay = dayNumber(year, 1, 1) + whole - 1;
  const epochTT = ttFromUtc(utcDay, (day - whole) * 86_400);
  const designator = cols(line1, 10, 17).trim();
  const setNo = cols(line1, 65, 68).trim();
  const rev = cols(line2, 64, 68).trim();
  const cls = line1[7]!.trim();
  return {
    ok: true,
    value: {
      format: 'tle',
      name: name ?? null,
      catalogNumber: catalogNumberOf(sat1),
      catalogId: sat1.trim(),
      internationalDesignator: designator === '' ? null : designator,
      classification: cls === '' ? null : cls,
      epochTT,
      meanMotion,
      eccentricity: Number(`0.${cols(line2, 27, 33)}`),
      inclination,
      raan,
      argPerigee,
      meanAnomaly,
      bstar: exponentField(cols(line1, 54, 61)),
      meanMotionDot: Number(cols(line1, 34, 43).replace(' ', '')),
      meanMotionDdot: exponentField(cols(line1, 45, 52)),
      elementSetNumber: setNo === '' ? null : Number(setNo),
      revolutionNumber: rev === '' ? null : Number(rev),
      sgp4: { source: { tle: { line1, line2 } }, epochTT },
    },
  };
}
