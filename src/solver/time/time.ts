// Time scales. Internally an epoch is TT seconds since J2000.0 (2000-01-01T12:00:00 TT,
// JD 2451545.0 TT): a uniform scale, so differences are plain subtraction, and a double
// keeps ~0.1 microsecond resolution over centuries.
// UTC -> TAI by the leap-second table below; TT = TAI + 32.184 s (IAU 1991, Resolution A4).
// UT1 = UTC + dut1, with dut1 = 0 unless the caller gives UT1-UTC.

import { quotient, SECONDS_PER_DAY } from '../core/math.js';
import { failure, success, type Outcome } from '../core/result.js';

/** TT - TAI in seconds (IAU 1991 Resolution A4; IERS Conventions 2010, sec. 10.1). */
export const TT_MINUS_TAI_S = 32.184;
/** JD of J2000.0 (TT). */
export const JD_J2000 = 2_451_545.0;

/** Days from 1970-01-01 to 2000-01-01. */
const DAYS_1970_TO_2000 = 10_957;

/**
 * TAI - UTC (s) from each UTC date on. Source: IERS Bulletin C (leap-second history, as in the
 * IERS file Leap_Second.dat); last entry 2017-01-01 (TAI - UTC = 37 s). Bulletin C 70 (July 2025)
 * announced no leap second for the end of 2025 (from memory). Epochs after the last review assume
 * no further leap second: re-check this table against each new Bulletin C.
 * UTC before 1972 had fractional offsets and rate changes; those epochs are refused.
 */
export const LEAP_SECONDS: ReadonlyArray<readonly [year: number, month: number, taiMinusUtc: number]> = [
  [1972, 1, 10], [1972, 7, 11], [1973, 1, 12], [1974, 1, 13], [1975, 1, 14], [1976, 1, 15],
  [1977, 1, 16], [1978, 1, 17], [1979, 1, 18], [1980, 1, 19], [1981, 7, 20], [1982, 7, 21],
  [1983, 7, 22], [1985, 7, 23], [1988, 1, 24], [1990, 1, 25], [1991, 1, 26], [1992, 7, 27],
  [1993, 7, 28], [1994, 7, 29], [1996, 1, 30], [1997, 7, 31], [1999, 1, 32], [2006, 1, 33],
  [2009, 1, 34], [2012, 7, 35], [2015, 7, 36], [2017, 1, 37],
];
export const LEAP_SECONDS_LAST_ENTRY = '2017-01-01';
/**
 * Fractional-second digits of every printed epoch: the microsecond. A double of TT seconds since
 * J2000 resolves about 0.1 microsecond over 1972-2199, and the service samples on the microsecond
 * (core/math.ts roundToMicrosecond), so the epoch printed beside a state is the epoch it is at.
 */
export const EPOCH_FRACTION_DIGITS = 6;
export const FIRST_SUPPORTED_YEAR = 1972;
export const LAST_SUPPORTED_YEAR = 2199;

/** Days since 2000-01-01 of a proleptic Gregorian date (H. Hinnant, "chrono-compatible low-level date algorithms", days_from_civil). */
export function dayNumber(year: number, month: number, day: number): number {
  const y = month <= 2 ? year - 1 : year;
  const era = Math.floor(y / 400);
  const yoe = y - era * 400;
  const mp = (month + 9) % 12;
  const doy = Math.floor((153 * mp + 2) / 5) + day - 1;
  const doe = yoe * 365 + Math.floor(yoe / 4) - Math.floor(yoe / 100) + doy;
  return era * 146_097 + doe - 719_468 - DAYS_1970_TO_2000;
}

/** Inverse of dayNumber (Hinnant, civil_from_days). */
export function civilDate(days: number): { year: number; month: number; day: number } {
  const z = days + DAYS_1970_TO_2000 + 719_468;
  const era = Math.floor(z / 146_097);
  const doe = z - era * 146_097;
  const yoe = Math.floor((doe - Math.floor(doe / 1460) + Math.floor(doe / 36_524) - Math.floor(doe / 146_096)) / 365);
  const doy = doe - (365 * yoe + Math.floor(yoe / 4) - Math.floor(yoe / 100));
  const mp = Math.floor((5 * doy + 2) / 153);
  const day = doy - Math.floor((153 * mp + 2) / 5) + 1;
  const month = mp < 10 ? mp + 3 : mp - 9;
  return { year: yoe + era * 400 + (month <= 2 ? 1 : 0), month, day };
}

const LEAP_DAYS = LEAP_SECONDS.map(([y, m, s]) => ({ day: dayNumber(y, m, 1), taiMinusUtc: s }));

/** TAI - UTC (s) in force on a UTC day (days since 2000-01-01). */
export function taiMinusUtc(utcDay: number): number {
  let value = LEAP_DAYS[0]!.taiMinusUtc;
  for (const entry of LEAP_DAYS) {
    if (utcDay >= entry.day) value = entry.taiMinusUtc;
    else break;
  }
  return value;
}

/** True when the UTC day ends with a leap second (23:59:60 exists). */
export function endsWithLeapSecond(utcDay: number): boolean {
  return taiMinusUtc(utcDay + 1) > taiMinusUtc(utcDay);
}

/** TT seconds since J2000 from a UTC calendar day and seconds of that day (may reach 86400 + fraction on a leap-second day). */
export function ttFromUtc(utcDay: number, secondOfDay: number): number {
  return utcDay * SECONDS_PER_DAY + secondOfDay - SECONDS_PER_DAY / 2 + taiMinusUtc(utcDay) + TT_MINUS_TAI_S;
}

/** UTC day and second of day from TT seconds since J2000; secondOfDay >= 86400 only inside a leap second. */
export function utcFromTt(tt: number): { utcDay: number; secondOfDay: number } {
  const tai = tt - TT_MINUS_TAI_S + SECONDS_PER_DAY / 2; // TAI seconds since 2000-01-01T00:00:00 TAI-labelled
  let day = Math.floor((tai - taiMinusUtc(Math.floor(tai / SECONDS_PER_DAY))) / SECONDS_PER_DAY);
  // The offset may change across the day boundary: settle the day by checking both neighbours.
  for (let i = 0; i < 3; i++) {
    const sod = tai - taiMinusUtc(day) - day * SECONDS_PER_DAY;
    const dayLength = SECONDS_PER_DAY + (endsWithLeapSecond(day) ? 1 : 0);
    if (sod < 0) day -= 1;
    else if (sod >= dayLength) day += 1;
    else return { utcDay: day, secondOfDay: sod };
  }
  return { utcDay: day, secondOfDay: tai - taiMinusUtc(day) - day * SECONDS_PER_DAY };
}

/** TT of 2200-01-01T00:00:00Z: epochs at or after it are outside the supported range. */
export const END_OF_SUPPORTED_RANGE_TT = ttFromUtc(dayNumber(LAST_SUPPORTED_YEAR + 1, 1, 1), 0);

const ISO_UTC = /^(\d{4})-(\d{2})-(\d{2})T(\d{2}):(\d{2}):(\d{2}(?:\.\d{1,9})?)(Z|([+-])(\d{2}):(\d{2}))$/;

/**
 * Minutes to subtract from a local clock reading with the zone suffix `Z` or `+hh:mm` / `-hh:mm`
 * (ISO 8601 / RFC 3339 sec. 5.6) to get UTC; null for an offset that is not a clock offset.
 */
export function zoneOffsetMinutes(zone: string): number | null {
  if (zone === 'Z') return 0;
  const m = /^([+-])(\d{2}):(\d{2})$/.exec(zone);
  if (!m || Number(m[2]) > 23 || Number(m[3]) > 59) return null;
  return (m[1] === '-' ? -1 : 1) * (Number(m[2]) * 60 + Number(m[3]));
}

/**
 * A local calendar day and minute of day with a zone offset -> the UTC day and minute of day
 * (the seconds, up to 60 in a leap second, are the same in both).
 */
export function toUtcMinute(day: number, minuteOfDay: number, offsetMinutes: number): { day: number; minuteOfDay: number } {
  const m = minuteOfDay - offsetMinutes;
  const shift = Math.floor(m / 1440);
  return { day: day + shift, minuteOfDay: m - shift * 1440 };
}

/** Parse an ISO 8601 UTC timestamp (`2026-12-01T00:00:00Z`, or with an offset `2026-12-01T01:00:00+01:00`; fractional seconds allowed) to TT seconds since J2000. */
export function parseUtcIso(text: string): Outcome<number> {
  const m = ISO_UTC.exec(text);
  if (!m) return failure('invalid-epoch', `"${text}" is not an ISO 8601 UTC timestamp like 2026-12-01T00:00:00Z`);
  const [year, month, day, hour, minute] = [m[1], m[2], m[3], m[4], m[5]].map(Number) as [number, number, number, number, number];
  const second = Number(m[6]);
  if (month < 1 || month > 12) return failure('invalid-epoch', `"${text}": month ${month} does not exist`);
  const days = dayNumber(year, month, day);
  if (civilDate(days).day !== day || day < 1) return failure('invalid-epoch', `"${text}": day ${day} does not exist in ${year}-${m[2]}`);
  if (hour > 23 || minute > 59) return failure('invalid-epoch', `"${text}": time of day out of range`);
  const offset = zoneOffsetMinutes(m[7]!);
  if (offset === null) return failure('invalid-epoch', `"${text}": zone offset ${m[7]} is not +hh:mm with hh <= 23 and mm <= 59`);
  const utc = toUtcMinute(days, hour * 60 + minute, offset);
  if (second >= 61 || (second >= 60 && !(utc.minuteOfDay === 1439 && endsWithLeapSecond(utc.day)))) {
    return failure('invalid-epoch', `"${text}": second ${m[6]} exists only inside a leap second`);
  }
  const utcYear = civilDate(utc.day).year;
  if (utcYear < FIRST_SUPPORTED_YEAR || utcYear > LAST_SUPPORTED_YEAR) {
    return failure('epoch-out-of-range', `"${text}": epochs must lie in ${FIRST_SUPPORTED_YEAR}-${LAST_SUPPORTED_YEAR} UTC (UTC before 1972 had no leap-second form)`);
  }
  return success(ttFromUtc(utc.day, utc.minuteOfDay * 60 + second));
}

const pad = (n: number, width = 2): string => String(n).padStart(width, '0');
const TWO_DIGITS = Array.from({ length: 61 }, (_, i) => pad(i));

/** An epoch split for printing: "YYYY-MM-DDT" and the clock fields (second 60 inside a leap second). */
export interface UtcFields {
  datePrefix: string;
  hour: number;
  minute: number;
  second: number;
  /** Fractional second in units of 10^-fractionDigits s. */
  fraction: number;
}

/**
 * A splitter of TT seconds since J2000 into UTC fields, rounded half up to `fractionDigits` (0-9).
 * It keeps the UTC day of the previous call, so a track's sorted epochs cost a few integer
 * operations each. Writes into `out` (no allocation per call).
 */
export function utcSplitter(fractionDigits = EPOCH_FRACTION_DIGITS): (tt: number, out: UtcFields) => void {
  if (!(Number.isInteger(fractionDigits) && fractionDigits >= 0 && fractionDigits <= 9)) {
    throw new RangeError(`fractionDigits must be an integer 0-9, got ${fractionDigits}`);
  }
  const unitsPerSecond = 10 ** fractionDigits;
  const secondsPerUnit = 1 / unitsPerSecond;
  let dayStartTT = NaN;
  let dayLengthUnits = 0;
  let nextDayStartTT = NaN;
  let prefix = '';
  let nextPrefix = '';

  const enterDay = (utcDay: number): void => {
    dayStartTT = ttFromUtc(utcDay, 0);
    nextDayStartTT = ttFromUtc(utcDay + 1, 0);
    dayLengthUnits = (SECONDS_PER_DAY + (endsWithLeapSecond(utcDay) ? 1 : 0)) * unitsPerSecond;
    const d = civilDate(utcDay);
    const n = civilDate(utcDay + 1);
    prefix = `${pad(d.year, 4)}-${TWO_DIGITS[d.month]}-${TWO_DIGITS[d.day]}T`;
    nextPrefix = `${pad(n.year, 4)}-${TWO_DIGITS[n.month]}-${TWO_DIGITS[n.day]}T`;
  };

  return (tt: number, out: UtcFields): void => {
    if (!(tt >= dayStartTT && tt < nextDayStartTT)) enterDay(utcFromTt(tt).utcDay);
    let units = Math.round((tt - dayStartTT) * unitsPerSecond);
    out.datePrefix = prefix;
    if (units >= dayLengthUnits) {
      // Rounded up into the next day.
      units -= dayLengthUnits;
      out.datePrefix = nextPrefix;
    }
    const wholeSeconds = quotient(units, unitsPerSecond, secondsPerUnit);
    out.fraction = units - wholeSeconds * unitsPerSecond;
    if (wholeSeconds >= SECONDS_PER_DAY) {
      // Inside a leap second.
      out.hour = 23;
      out.minute = 59;
      out.second = 60;
    } else {
      out.hour = quotient(wholeSeconds, 3600, 1 / 3600);
      const rest = wholeSeconds - out.hour * 3600;
      out.minute = quotient(rest, 60, 1 / 60);
      out.second = rest - out.minute * 60;
    }
  };
}

export const newUtcFields = (): UtcFields => ({ datePrefix: '', hour: 0, minute: 0, second: 0, fraction: 0 });

/** A formatter of TT seconds since J2000 as ISO 8601 UTC with a fixed number of fractional digits (0-9). */
export function utcFormatter(fractionDigits = EPOCH_FRACTION_DIGITS): (tt: number) => string {
  const split = utcSplitter(fractionDigits);
  const f = newUtcFields();
  return (tt: number): string => {
    split(tt, f);
    const clock = `${f.datePrefix}${TWO_DIGITS[f.hour]}:${TWO_DIGITS[f.minute]}:${TWO_DIGITS[f.second]}`;
    return fractionDigits > 0 ? `${clock}.${String(f.fraction).padStart(fractionDigits, '0')}Z` : `${clock}Z`;
  };
}

/** Format TT seconds since J2000 as ISO 8601 UTC with a fixed number of fractional digits (0-9), rounding half up. */
export function formatUtcIso(tt: number, fractionDigits = EPOCH_FRACTION_DIGITS): string {
  return utcFormatter(fractionDigits)(tt);
}

/** Julian date (TT) of an epoch. */
export const julianDateTT = (tt: number): number => JD_J2000 + tt / SECONDS_PER_DAY;

/** Julian centuries of TT since J2000.0. */
export const julianCenturiesTT = (tt: number): number => tt / (SECONDS_PER_DAY * 36_525);

/** Days of UT1 since J2000.0 (JD_UT1 - 2451545.0), with UT1 = UTC + dut1 seconds. */
export function ut1DaysSinceJ2000(tt: number, dut1Seconds = 0): number {
  const { utcDay, secondOfDay } = utcFromTt(tt);
  return utcDay - 0.5 + (secondOfDay + dut1Seconds) / SECONDS_PER_DAY;
}
