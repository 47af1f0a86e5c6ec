// Two-line sets of invented spacecraft for tests, written column by column after the layout of
// Spacetrack Report No. 3 (Vallado et al., AIAA 2006-6753, its table of the format), with their
// checksums computed here independently of src/formats/tle.ts.

export interface InventedElements {
  satnum?: string; // 5 characters
  year: number; // two digits
  day: number; // day of year with fraction
  ndot?: number; // rev/day^2 / 2
  bstar?: string; // the 8-column exponent field, e.g. ' 12345-4'
  inclination: number;
  raan: number;
  eccentricity: number;
  argPerigee: number;
  meanAnomaly: number;
  meanMotion: number;
}

/** The checksum digit: digits summed, '-' counting 1, modulo 10 (Spacetrack Report No. 3). */
export const checksum = (s: string): number => [...s.slice(0, 68)].reduce((n, c) => n + (c === '-' ? 1 : /\d/.test(c) ? Number(c) : 0), 0) % 10;
/** The line with column 69 set to its right checksum. */
export const withChecksum = (s: string): string => s.slice(0, 68) + String(checksum(s));

const angle = (x: number): string => x.toFixed(4).padStart(8, ' ');

export function inventedTle(e: InventedElements): { line1: string; line2: string } {
  const sat = e.satnum ?? '99901';
  const ndot = e.ndot ?? 0.00001234;
  const ndotText = (ndot < 0 ? '-' : ' ') + Math.abs(ndot).toFixed(8).slice(1); // ' .00001234'
  const l1 = `1 ${sat}U 26900A   ${String(e.year).padStart(2, '0')}${e.day.toFixed(8).padStart(12, '0')} ${ndotText}  00000-0 ${e.bstar ?? ' 12345-4'} 0  999`;
  const ecc = e.eccentricity.toFixed(7).slice(2);
  const l2 = `2 ${sat} ${angle(e.inclination)} ${angle(e.raan)} ${ecc} ${angle(e.argPerigee)} ${angle(e.meanAnomaly)} ${e.meanMotion.toFixed(8).padStart(11, ' ')}  123`;
  if (l1.length !== 68 || l2.length !== 68) throw new Error(`invented TLE lines of ${l1.length} and ${l2.length} characters before the checksum`);
  return { line1: withChecksum(`${l1}0`), line2: withChecksum(`${l2}0`) };
}

/** An invented sun-synchronous LEO spacecraft (PLOVER-7) at 2026-12-01 00:00:00 UTC (day 335). */
export const PLOVER_TLE = inventedTle({ year: 26, day: 335, inclination: 97.6, raan: 40, eccentricity: 0.0012, argPerigee: 90, meanAnomaly: 10, meanMotion: 15.2 });
