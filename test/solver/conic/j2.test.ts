import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { isSunSynchronous, j2SecularRates, SUN_SYNCHRONOUS_TOLERANCE, sunSynchronousInclination } from '../../../src/solver/conic/j2.js';
import { BODIES, type CentralBody } from '../../../src/solver/bodies/bodies.js';
import { DEG, SECONDS_PER_DAY } from '../../../src/solver/core/math.js';
import { expectClose } from '../../helpers/approx.js';

const DEG_PER_DAY = DEG / SECONDS_PER_DAY;
// The Earth constants Curtis uses in his worked examples (3rd ed., from memory): mu = 398600,
// R = 6378 km, J2 = 0.00108263; the Sun's mean motion 360 deg / 365.26 d.
const CURTIS_EARTH: CentralBody = {
  name: 'curtis-earth', gm: 398_600, radius: 6378, j2: 0.001_082_63,
  heliocentricMeanMotionRadS: (2 * Math.PI) / (365.26 * SECONDS_PER_DAY), sources: {},
};

describe('j2SecularRates(a, e, i, mu, j2, radius)', () => {
  it('a 280 km x 400 km orbit at i = 51.43 deg regresses its node at -5.181 deg/day and advances perigee at 3.920 deg/day (Curtis, Orbital Mechanics for Engineering Students, worked J2 example; Example 4.9 in the 3rd ed., example number and values from memory)', () => {
    const [rp, ra] = [6378 + 280, 6378 + 400];
    const rates = j2SecularRates((rp + ra) / 2, (ra - rp) / (ra + rp), 51.43 * DEG, 398_600, 0.001_082_63, 6378);
    expectClose(rates.raanRateRadS / DEG_PER_DAY, -5.181, 0.0005, 'dRAAN/dt deg/day');
    expectClose(rates.argPeriapsisRateRadS / DEG_PER_DAY, 3.92, 0.0005, 'domega/dt deg/day');
  });

  it('vanish where the textbooks say: node rate at i = 90 deg, perigee rate at the critical inclination 63.435 deg, mean-anomaly correction at 54.736 deg (sin^2 i = 2/3) (the zeros of the factors in Vallado 4th ed. eq. 9-41; critical inclination as in Curtis 3rd ed. sec. 4.7, from memory)', () => {
    const at = (iDeg: number) => j2SecularRates(7000, 0.01, iDeg * DEG, 398_600.4418, 1.0826e-3, 6378.137);
    expectClose(at(90).raanRateRadS, 0, 1e-20, 'node at 90');
    expectClose(at(Math.asin(Math.sqrt(0.8)) / DEG).argPeriapsisRateRadS, 0, 1e-20, 'perigee at critical');
    expectClose(Math.asin(Math.sqrt(0.8)) / DEG, 63.435, 5e-4, 'critical inclination');
    expectClose(at(Math.asin(Math.sqrt(2 / 3)) / DEG).meanAnomalyRateRadS, 0, 1e-20, 'mean anomaly');
    expect(at(28).raanRateRadS).toBeLessThan(0); // prograde orbits regress
    expect(at(150).raanRateRadS).toBeGreaterThan(0);
  });

  it('scale as a^-7/2 for circular orbits (n (R/a)^2) (property)', () => {
    fc.assert(fc.property(fc.double({ min: 6600, max: 40_000, noNaN: true }), fc.double({ min: 0, max: Math.PI, noNaN: true }), (a, i) => {
      const r1 = j2SecularRates(a, 0, i, 398_600, 1e-3, 6378).raanRateRadS;
      const r2 = j2SecularRates(2 * a, 0, i, 398_600, 1e-3, 6378).raanRateRadS;
      return Math.abs(r2 - r1 * 2 ** -3.5) <= 1e-12 * Math.abs(r1) + 1e-300;
    }));
  });

  it('throws for an unbound orbit (a programmer error: callers check first)', () => {
    expect(() => j2SecularRates(-7000, 1.2, 0.5, 398_600, 1e-3, 6378)).toThrow(RangeError);
    expect(() => j2SecularRates(7000, 1, 0.5, 398_600, 1e-3, 6378)).toThrow(RangeError);
  });
});

describe('sunSynchronousInclination(a, e, body) and isSunSynchronous(raanRateRadS, body)', () => {
  it('a circular orbit of period 100 min needs i = 98.43 deg at 758.63 km altitude (Curtis 3rd ed., sun-synchronous worked example, Example 4.10 from memory)', () => {
    const a = Math.cbrt(398_600 * (6000 / (2 * Math.PI)) ** 2);
    expectClose(a - 6378, 758.63, 0.01, 'altitude km');
    const i = sunSynchronousInclination(a, 0, CURTIS_EARTH);
    expect(i).not.toBeNull();
    expectClose((i ?? 0) / DEG, 98.43, 0.005, 'i deg');
    expect(isSunSynchronous(j2SecularRates(a, 0, i ?? 0, 398_600, CURTIS_EARTH.j2 ?? 0, 6378).raanRateRadS, CURTIS_EARTH)).toBe(true);
  });

  it('an 800 km circular Earth orbit is sun-synchronous near i = 98.6 deg (common practice, no source), and not at 97.5 deg', () => {
    const a = 6378.137 + 800;
    const i = sunSynchronousInclination(a, 0, BODIES.earth) ?? Number.NaN;
    expectClose(i / DEG, 98.6, 0.05, 'i deg');
    const rate = (inc: number) => j2SecularRates(a, 0, inc, BODIES.earth.gm, BODIES.earth.j2 ?? 0, BODIES.earth.radius ?? 0).raanRateRadS;
    expect(isSunSynchronous(rate(i), BODIES.earth)).toBe(true);
    expect(isSunSynchronous(rate(97.5 * DEG), BODIES.earth)).toBe(false);
    // The node moves 360 deg in a tropical year within the tolerance.
    expectClose(rate(i) / DEG_PER_DAY, 360 / 365.2422, 1e-9, 'deg/day');
  });

  it('uses a tolerance of 0.01 deg/day', () => {
    expectClose(SUN_SYNCHRONOUS_TOLERANCE / DEG_PER_DAY, 0.01, 1e-15, 'deg/day');
    const n = BODIES.earth.heliocentricMeanMotionRadS ?? 0;
    expect(isSunSynchronous(n + 0.009 * DEG_PER_DAY, BODIES.earth)).toBe(true);
    expect(isSunSynchronous(n - 0.011 * DEG_PER_DAY, BODIES.earth)).toBe(false);
  });

  it('is null where no inclination works or the body has no heliocentric motion, and for unbound orbits', () => {
    expect(sunSynchronousInclination(6051.8 * 1.05, 0, BODIES.venus)).toBeNull(); // J2 = 4.5e-6 is far too weak
    expect(sunSynchronousInclination(2440.53 * 1.05, 0, BODIES.mercury)).toBeNull();
    expect(sunSynchronousInclination(1738.1 * 1.1, 0, BODIES.moon)).toBeNull();
    expect(sunSynchronousInclination(700_000 * 1.1, 0, BODIES.sun)).toBeNull();
    expect(sunSynchronousInclination(6378.137 * 20, 0, BODIES.earth)).toBeNull(); // too high: |cos i| > 1
    expect(sunSynchronousInclination(-9000, 1.5, BODIES.earth)).toBeNull();
    expect(isSunSynchronous(0, BODIES.sun)).toBe(false);
  });
});
