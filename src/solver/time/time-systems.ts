// Epochs written in one of four time systems: UTC, TAI, TT, GPS. Calendar text in any of them is
// read to TT seconds since J2000 (the solver's scale), or rewritten exactly as UTC text (integer
// seconds and nanoseconds, no rounding) so that one instant has one spelling whatever system it
// was given in.
//   TAI = UTC + (TAI - UTC) from the leap-second table (time.ts)
//   TT  = TAI + 32.184 s (IAU 1991 Resolution A4; IERS Conventions 2010, sec. 10.1)
//   GPS = TAI - 19 s (GPS time was aligned with UTC on 1980-01-06, when TAI - UTC was 19 s; IS-GPS-200, from memory)
// Calendar forms: YYYY-MM-DDThh:mm:ss[.fff...] and the day-of-year form YYYY-DDDThh:mm:ss[.fff...]
// (CCSDS 301.0-B-4 ASCII time codes A and B, from memory); a trailing Z is UTC's zone letter.

import { failure, success, type Outcome } from '../core/result.js';
import {
  civilDate, dayNumber, endsWithLeapSecond, FIRST_SUPPORTED_YEAR, LAST_SUPPORTED_YEAR, taiMinusUtc, toUtcMinute, TT_MINUS_TAI_S, ttFromUtc, zoneOffsetMinutes,
} from './time.js';

export const TIME_SYSTEMS = ['UTC', 'TAI', 'TT', 'GPS'] as const;
export type TimeSystem = (typeof TIME_SYSTEMS)[number];

/** TAI - GPS time, s (constant since 1980-01-06; IS-GPS-200, from memory). */
export const TAI_MINUS_GPS_S = 19;

const SECONDS_PER_DAY = 86_400;
const NANOS = 1_000_000_000;
const TT_MINUS_TAI_NS = Math.round(TT_MINUS_TAI_S * NANOS); // 32 184 000 000 exactly

/** Calendar fields of an epoch text: day number (since 2000-01-01), whole second of day, nanoseconds, zone letter seen. */
export interface CalendarEpoch {
  readonly day: number;
  readonly second: number;
  readonly nanos: number;
  readonly zulu: boolean;
}

const CALENDAR = /^(\d{4})-(?:(\d{2})-(\d{2})|(\d{3}))T(\d{2}):(\d{2}):(\d{2})(?:\.(\d+))?(Z|[+-]\d{2}:\d{2})?$/;

/** Read calendar text; `system` decides whether second 60 (UTC leap second) may occur. */
export function parseCalendar(text: string, system: TimeSystem): Outcome<CalendarEpoch> {
  const m = CALENDAR.exec(text);
  if (!m) return failure('invalid-epoch', `"${text}" is not a calendar epoch like 2026-12-01T00:00:00 (or 2026-335T00:00:00)`);
  let year = Number(m[1]);
  let day: number;
  if (m[4] !== undefined) {
    const doy = Number(m[4]);
    const leapYear = dayNumber(year, 3, 1) - dayNumber(year, 2, 28) === 2;
    if (doy < 1 || doy > (leapYear ? 366 : 365)) return failure('invalid-epoch', `"${text}": day of year ${doy} does not exist in ${year}`);
    day = dayNumber(year, 1, 1) + doy - 1;
  } else {
    const [month, dom] = [Number(m[2]), Number(m[3])];
    if (month < 1 || month > 12) return failure('invalid-epoch', `"${text}": month ${month} does not exist`);
    day = dayNumber(year, month, dom);
    if (dom < 1 || civilDate(day).day !== dom) return failure('invalid-epoch', `"${text}": day ${dom} does not exist in ${year}-${m[2]}`);
  }
  const [hour, minute, sec] = [Number(m[5]), Number(m[6]), Number(m[7])];
  if (hour > 23 || minute > 59) return failure('invalid-epoch', `"${text}": time of day out of range`);
  if (m[9] !== undefined && system !== 'UTC') return failure('invalid-epoch', `"${text}": the zone letter Z (or an offset) means UTC; write ${system} epochs without it`);
  // A UTC clock with an offset: the UTC day and minute (the seconds are the same).
  const offset = m[9] === undefined ? 0 : zoneOffsetMinutes(m[9]);
  if (offset === null) return failure('invalid-epoch', `"${text}": zone offset ${m[9]} is not +hh:mm with hh <= 23 and mm <= 59`);
  const utc = toUtcMinute(day, hour * 60 + minute, offset);
  day = utc.day;
  if (sec > 60 || (sec === 60 && !(system === 'UTC' && utc.minuteOfDay === 1439 && endsWithLeapSecond(day)))) {
    return failure('invalid-epoch', `"${text}": second ${m[7]} exists only inside a UTC leap second`);
  }
  if (offset !== 0) year = civilDate(day).year;
  if (year < FIRST_SUPPORTED_YEAR || year > LAST_SUPPORTED_YEAR) {
    return failure('epoch-out-of-range', `"${text}": epochs must lie in ${FIRST_SUPPORTED_YEAR}-${LAST_SUPPORTED_YEAR} (UTC before 1972 had no leap-second form)`);
  }
  const digits = m[8] ?? '';
  // Up to 9 digits are exact nanoseconds; beyond that the rest is rounded to the nanosecond.
  let nanos = digits.length <= 9 ? Number(digits.padEnd(9, '0')) : Math.round(Number(`0.${digits}`) * NANOS);
  let second = utc.minuteOfDay * 60 + sec;
  if (nanos === NANOS) { nanos = 0; second += 1; }
  return success({ day, second, nanos, zulu: m[9] !== undefined });
}

/** Seconds (whole) and nanoseconds of TAI since 2000-01-01T00:00:00 TAI of calendar fields in a system. */
function taiOf(c: CalendarEpoch, system: TimeSystem): { s: number; ns: number } {
  let s = c.day * SECONDS_PER_DAY + c.second;
  let ns = c.nanos;
  if (system === 'UTC') s += taiMinusUtc(c.day);
  else if (system === 'GPS') s += TAI_MINUS_GPS_S;
  else if (system === 'TT') {
    ns -= TT_MINUS_TAI_NS;
    const borrow = Math.floor(ns / NANOS);
    s += borrow;
    ns -= borrow * NANOS;
  }
  return { s, ns };
}

/** TT seconds since J2000 of calendar text in a time system. */
export function parseEpochIn(text: string, system: TimeSystem): Outcome<number> {
  const c = parseCalendar(text, system);
  if (!c.ok) return c;
  const { day, second, nanos } = c.value;
  if (system === 'UTC') return success(ttFromUtc(day, second + nanos / NANOS));
  const { s, ns } = taiOf(c.value, system);
  // TT = TAI + 32.184 s; J2000.0 is 2000-01-01T12:00:00 TT.
  return success(s - SECONDS_PER_DAY / 2 + (ns + TT_MINUS_TAI_NS) / NANOS);
}

const two = (n: number): string => String(n).padStart(2, '0');

/**
 * The instant of calendar text in a system as UTC text: YYYY-MM-DDThh:mm:ss[.f]Z with the fraction
 * rounded to `fractionDigits` (9: exact to the nanosecond) and its trailing zeros dropped (second
 * 60 inside a leap second). The canonical spelling of an input epoch (src/api/epoch.ts rounds it to
 * the microsecond).
 */
export function epochAsUtc(text: string, system: TimeSystem, fractionDigits = 9): Outcome<string> {
  const c = parseCalendar(text, system);
  if (!c.ok) return c;
  const exact = taiOf(c.value, system);
  // Rounded half up to 10^-fractionDigits s in integer nanoseconds (exact), carrying into the second;
  // TAI and UTC differ by whole seconds, so this is the rounding of the UTC text.
  const unit = 10 ** (9 - fractionDigits);
  let tai = exact.s;
  let ns = Math.round(exact.ns / unit) * unit;
  if (ns >= NANOS) { tai += 1; ns -= NANOS; }
  // The UTC day whose seconds [0, length) hold this TAI second (the offset changes only at day ends).
  let day = Math.floor((tai - taiMinusUtc(Math.floor(tai / SECONDS_PER_DAY))) / SECONDS_PER_DAY);
  let sod = tai - taiMinusUtc(day) - day * SECONDS_PER_DAY;
  for (let i = 0; i < 3 && (sod < 0 || sod >= SECONDS_PER_DAY + (endsWithLeapSecond(day) ? 1 : 0)); i++) {
    day += sod < 0 ? -1 : 1;
    sod = tai - taiMinusUtc(day) - day * SECONDS_PER_DAY;
  }
  const d = civilDate(day);
  if (d.year < FIRST_SUPPORTED_YEAR || d.year > LAST_SUPPORTED_YEAR) {
    return failure('epoch-out-of-range', `"${text}" ${system} is ${d.year} in UTC: epochs must lie in ${FIRST_SUPPORTED_YEAR}-${LAST_SUPPORTED_YEAR}`);
  }
  const [hour, minute, second] = sod >= SECONDS_PER_DAY ? [23, 59, 60] : [Math.floor(sod / 3600), Math.floor(sod / 60) % 60, sod % 60];
  const fraction = ns === 0 ? '' : `.${String(ns).padStart(9, '0').replace(/0+$/, '')}`;
  return success(`${String(d.year).padStart(4, '0')}-${two(d.month)}-${two(d.day)}T${two(hour)}:${two(minute)}:${two(second)}${fraction}Z`);
}
