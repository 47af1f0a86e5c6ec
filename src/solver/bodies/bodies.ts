// Built-in central bodies, each value with the published source it comes from, naming the table
// or constant where the publication has one. Values marked "from memory" were recalled and not
// checked against the publication or a copy of it: check them before relying on the last digits.
// Checked (2026-12-02) against published copies of the constants: the DE440 GMs (the GM* constants
// of the DE440 ephemeris), the WGS 84 defining parameters, the EGM96 C20, the IAU 2015 nominal
// solar radius, the WGCCRE 2015 prime-meridian rates W and the radii of Mercury, Mars, Jupiter
// and Saturn.

import { DEG, SECONDS_PER_DAY, TWO_PI } from '../core/math.js';

export interface CentralBody {
  readonly name: string; // 'earth'
  readonly gm: number; // km^3/s^2
  readonly radius?: number; // km, mean equatorial; also the reference radius of j2
  readonly j2?: number;
  readonly rotationRateRadS?: number; // rad/s, sidereal; negative for retrograde spin
  readonly flattening?: number;
  readonly heliocentricMeanMotionRadS?: number; // rad/s, the body's mean motion about the Sun
  readonly sources: Readonly<Record<string, string>>; // answer field name (GET /v1/bodies) -> source text
}

export const BODY_NAMES = ['sun', 'mercury', 'venus', 'earth', 'moon', 'mars', 'jupiter', 'saturn', 'uranus', 'neptune'] as const;
export type BodyName = (typeof BODY_NAMES)[number];

/** Rotation rate (rad/s) from the daily rate of the prime-meridian angle W (deg/day). */
const spin = (degPerDay: number): number => (degPerDay * DEG) / SECONDS_PER_DAY;
/** Mean motion (rad/s) from an orbital period in days. */
const perDays = (days: number): number => TWO_PI / (days * SECONDS_PER_DAY);
/** Flattening f = 1 - polar / equatorial radius. */
const flat = (equatorial: number, polar: number): number => 1 - polar / equatorial;

const DE440 = 'JPL DE440 (Park et al. 2021, AJ 161:105)';
const de440 = (constant: string): string => `${DE440}, ephemeris constant ${constant}`;
const de440System = (constant: string): string => `${de440(constant)}: GM of the planetary system (planet + satellites); the planet alone is lighter by up to ~2.5e-4 relative (Jupiter, Saturn), from memory`;
const WGCCRE = 'IAU WGCCRE 2015 report (Archinal et al. 2018, Celest. Mech. Dyn. Astr. 130:22)';
/** The prime-meridian rate of W = W0 + rate d of the WGCCRE tables (Table 1: Sun and planets, Table 2: the Moon; table numbers from memory). */
const wRate = (table: 1 | 2, text: string): string => `${WGCCRE}, Table ${table}, W rate ${text} deg/day`;
const FACT_SHEET = 'NASA GSFC planetary fact sheet';
const J2_RADIUS = 'reference radius taken as the equatorial radius above';
const SIDEREAL_PERIOD = `360 deg / sidereal orbital period`;

export const BODIES: Readonly<Record<BodyName, CentralBody>> = {
  sun: {
    name: 'sun',
    gm: 132_712_440_041.279_419,
    radius: 695_700,
    j2: 2.2e-7,
    rotationRateRadS: spin(14.184_4),
    flattening: 0,
    sources: {
      gm: de440('GMS'),
      radius: 'IAU 2015 Resolution B3, nominal solar radius R_N = 695 700 km',
      j2: 'helioseismic estimate ~2.2e-7 (e.g. Mecheri et al. 2004, Solar Physics 222), from memory',
      rotationRateDegPerDay: wRate(1, '14.1844000 (Carrington)'),
      flattening: 'IAU 2015 Resolution B3 treats the nominal Sun as a sphere',
    },
  },
  mercury: {
    name: 'mercury',
    gm: 22_031.868_551,
    radius: 2_440.53,
    j2: 50.3e-6,
    rotationRateRadS: spin(6.138_510_8),
    flattening: flat(2_440.53, 2_438.26),
    heliocentricMeanMotionRadS: perDays(87.969),
    sources: {
      gm: de440('GM1'),
      radius: `${WGCCRE}, radii of Mercury 2440.53 / 2438.26 km (as in NAIF pck00011)`,
      j2: `${FACT_SHEET} (J2 = 50.3e-6), from memory; ${J2_RADIUS}`,
      rotationRateDegPerDay: wRate(1, '6.1385108'),
      flattening: `${WGCCRE}, radii 2440.53 / 2438.26 km (as in NAIF pck00011)`,
      heliocentricMeanMotionDegPerDay: `${SIDEREAL_PERIOD} 87.969 d (${FACT_SHEET}), from memory`,
    },
  },
  venus: {
    name: 'venus',
    gm: 324_858.592,
    radius: 6_051.8,
    j2: 4.458e-6,
    rotationRateRadS: spin(-1.481_368_8),
    flattening: 0,
    heliocentricMeanMotionRadS: perDays(224.701),
    sources: {
      gm: de440('GM2'),
      radius: `${WGCCRE}, radius 6051.8 km (sphere), from memory`,
      j2: `${FACT_SHEET} (J2 = 4.458e-6), from memory; ${J2_RADIUS}`,
      rotationRateDegPerDay: wRate(1, '-1.4813688 (retrograde)'),
      flattening: `${WGCCRE}: Venus is modelled as a sphere`,
      heliocentricMeanMotionDegPerDay: `${SIDEREAL_PERIOD} 224.701 d (${FACT_SHEET}), from memory`,
    },
  },
  earth: {
    name: 'earth',
    gm: 398_600.441_8,
    radius: 6_378.137,
    // J2 = -C20 = -sqrt(2n + 1) * normalised C20, n = 2, m = 0 (Vallado 4th ed. sec. 8.6.1, from memory);
    // EGM-96 normalised C20 = -0.484165371736e-3.
    j2: Math.sqrt(5) * 0.484_165_371_736e-3,
    rotationRateRadS: 7.292_115e-5,
    flattening: 1 / 298.257_223_563,
    heliocentricMeanMotionRadS: perDays(365.242_2),
    sources: {
      gm: 'WGS 84 GM = 3986004.418e8 m^3/s^2 (NIMA TR8350.2, 3rd ed., Table 3.1, defining parameters; the GM of EGM96 too)',
      radius: 'WGS 84 semi-major axis a = 6378137.0 m (NIMA TR8350.2, 3rd ed., Table 3.1, defining parameters)',
      j2: 'EGM96 (Lemoine et al. 1998, NASA/TP-1998-206861), coefficient file: normalised C20 = -0.484165371736e-3; J2 = -sqrt(5) C20 = 1.08262668e-3 (the unnormalising factor: Vallado 4th ed. sec. 8.6.1, from memory)',
      rotationRateDegPerDay: 'WGS 84 omega = 7292115.0e-11 rad/s (NIMA TR8350.2, 3rd ed., Table 3.1, defining parameters), in deg/day',
      flattening: 'WGS 84 1/f = 298.257223563 (NIMA TR8350.2, 3rd ed., Table 3.1, defining parameters)',
      heliocentricMeanMotionDegPerDay: '360 deg / 365.2422 d (tropical year: the mean Sun against the moving equinox), common practice',
    },
  },
  moon: {
    // No heliocentricMeanMotionRadS: the lunar spin axis precesses in 18.6 years (Cassini state), so a
    // fixed-frame J2 node rate does not hold a lunar orbit at a fixed Sun angle.
    name: 'moon',
    gm: 4_902.800_118,
    radius: 1_738.1,
    j2: 202.7e-6,
    rotationRateRadS: spin(13.176_358_15),
    flattening: flat(1_738.1, 1_736.0),
    sources: {
      gm: de440('GMM'),
      radius: `${FACT_SHEET}, equatorial radius 1738.1 km (the IAU mean sphere is 1737.4 km), from memory`,
      j2: `${FACT_SHEET} (J2 = 202.7e-6), from memory; ${J2_RADIUS}`,
      rotationRateDegPerDay: wRate(2, '13.17635815 (periodic terms left out)'),
      flattening: `${FACT_SHEET}, radii 1738.1 / 1736.0 km, from memory`,
    },
  },
  mars: {
    name: 'mars',
    gm: 42_828.375_816,
    radius: 3_396.19,
    j2: 1_960.45e-6,
    rotationRateRadS: spin(350.891_982_26),
    flattening: flat(3_396.19, 3_376.2),
    heliocentricMeanMotionRadS: perDays(686.98),
    sources: {
      gm: de440System('GM4'),
      radius: `${WGCCRE}, equatorial radius 3396.19 km`,
      j2: `${FACT_SHEET} (J2 = 1960.45e-6), from memory; ${J2_RADIUS}`,
      rotationRateDegPerDay: wRate(1, '350.89198226'),
      flattening: `${WGCCRE}, equatorial 3396.19 km, mean polar 3376.20 km, from memory`,
      heliocentricMeanMotionDegPerDay: `${SIDEREAL_PERIOD} 686.980 d (${FACT_SHEET}), from memory`,
    },
  },
  jupiter: {
    name: 'jupiter',
    gm: 126_712_764.1,
    radius: 71_492,
    j2: 14_736e-6,
    rotationRateRadS: spin(870.536),
    flattening: flat(71_492, 66_854),
    heliocentricMeanMotionRadS: perDays(4_332.589),
    sources: {
      gm: de440System('GM5'),
      radius: `${WGCCRE}, 1-bar equatorial radius 71492 km`,
      j2: `${FACT_SHEET} (J2 = 14736e-6), from memory; ${J2_RADIUS}`,
      rotationRateDegPerDay: wRate(1, '870.5360000 (System III)'),
      flattening: `${WGCCRE}, radii 71492 / 66854 km`,
      heliocentricMeanMotionDegPerDay: `${SIDEREAL_PERIOD} 4332.589 d (${FACT_SHEET}), from memory`,
    },
  },
  saturn: {
    name: 'saturn',
    gm: 37_940_584.841_8,
    radius: 60_268,
    j2: 16_298e-6,
    rotationRateRadS: spin(810.793_902_4),
    flattening: flat(60_268, 54_364),
    heliocentricMeanMotionRadS: perDays(10_759.22),
    sources: {
      gm: de440System('GM6'),
      radius: `${WGCCRE}, 1-bar equatorial radius 60268 km`,
      j2: `${FACT_SHEET} (J2 = 16298e-6), from memory; ${J2_RADIUS}`,
      rotationRateDegPerDay: wRate(1, '810.7939024 (System III)'),
      flattening: `${WGCCRE}, radii 60268 / 54364 km, from memory`,
      heliocentricMeanMotionDegPerDay: `${SIDEREAL_PERIOD} 10759.22 d (${FACT_SHEET}), from memory`,
    },
  },
  uranus: {
    // No heliocentricMeanMotionRadS: with an obliquity near 98 deg the Sun moves far from the equator
    // plane, so a node rate matched to the mean motion does not hold a fixed Sun angle.
    name: 'uranus',
    gm: 5_794_556.4,
    radius: 25_559,
    j2: 3_343.43e-6,
    rotationRateRadS: spin(-501.160_092_8),
    flattening: flat(25_559, 24_973),
    sources: {
      gm: de440System('GM7'),
      radius: `${WGCCRE}, 1-bar equatorial radius 25559 km, from memory`,
      j2: `${FACT_SHEET} (J2 = 3343.43e-6), from memory; ${J2_RADIUS}`,
      rotationRateDegPerDay: wRate(1, '-501.1600928 (retrograde)'),
      flattening: `${WGCCRE}, radii 25559 / 24973 km, from memory`,
    },
  },
  neptune: {
    name: 'neptune',
    gm: 6_836_527.100_58,
    radius: 24_764,
    j2: 3_411e-6,
    rotationRateRadS: spin(541.139_775_7),
    flattening: flat(24_764, 24_341),
    heliocentricMeanMotionRadS: perDays(60_189),
    sources: {
      gm: de440System('GM8'),
      radius: `${WGCCRE}, 1-bar equatorial radius 24764 km, from memory`,
      j2: `${FACT_SHEET} (J2 = 3411e-6), from memory; ${J2_RADIUS}`,
      rotationRateDegPerDay: wRate(1, '541.1397757 (periodic term left out)'),
      flattening: `${WGCCRE}, radii 24764 / 24341 km, from memory`,
      heliocentricMeanMotionDegPerDay: `${SIDEREAL_PERIOD} 60189 d (${FACT_SHEET}), from memory`,
    },
  },
};

/** True when `name` is a built-in body. */
export const isBodyName = (name: string): name is BodyName => (BODY_NAMES as readonly string[]).includes(name);
