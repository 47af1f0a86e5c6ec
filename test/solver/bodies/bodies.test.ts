import { describe, expect, it } from 'vitest';
import * as Astronomy from 'astronomy-engine';
import { BODIES, BODY_NAMES, isBodyName, type BodyName } from '../../../src/solver/bodies/bodies.js';
import { expectClose, expectRelClose } from '../../helpers/approx.js';

const NUMERIC_FIELDS = ['gm', 'radius', 'j2', 'rotationRateRadS', 'flattening', 'heliocentricMeanMotionRadS'] as const;
/** Sources are keyed by the public field names of GET /v1/bodies (units converted there, names without the unit). */
const SOURCE_KEY: Record<(typeof NUMERIC_FIELDS)[number], string> = {
  gm: 'gm', radius: 'radius', j2: 'j2', rotationRateRadS: 'rotationRateDegPerDay', flattening: 'flattening', heliocentricMeanMotionRadS: 'heliocentricMeanMotionDegPerDay',
};
const capital = (name: BodyName) => (name.charAt(0).toUpperCase() + name.slice(1)) as Astronomy.Body;

describe('BODIES catalogue', () => {
  it('holds exactly the ten named bodies, each under its own name', () => {
    expect(Object.keys(BODIES).sort()).toEqual([...BODY_NAMES].sort());
    for (const name of BODY_NAMES) expect(BODIES[name].name).toBe(name);
    expect(isBodyName('earth')).toBe(true);
    expect(isBodyName('pluto')).toBe(false);
  });

  it('names a published source for every value and for nothing else', () => {
    for (const name of BODY_NAMES) {
      const body = BODIES[name];
      const present = NUMERIC_FIELDS.filter((f) => body[f] !== undefined);
      expect(Object.keys(body.sources).sort(), name).toEqual(present.map((f) => SOURCE_KEY[f]).sort());
      for (const f of present) {
        expect(Number.isFinite(body[f]), `${name}.${f}`).toBe(true);
        expect((body.sources[SOURCE_KEY[f]] ?? '').length, `${name}.${f} source`).toBeGreaterThan(10);
      }
      expect(body.gm).toBeGreaterThan(0);
      expect(body.radius ?? 0).toBeGreaterThan(0);
    }
  });

  it('Earth carries the WGS-84 defining parameters (NIMA TR8350.2, 3rd ed.) and the EGM-96 J2 1.0826267e-3 (from memory)', () => {
    const e = BODIES.earth;
    expect(e.gm).toBe(398_600.4418);
    expect(e.radius).toBe(6378.137);
    expect(e.rotationRateRadS).toBe(7.292_115e-5);
    expectClose(1 / (e.flattening ?? 0), 298.257_223_563, 1e-9, '1/f');
    expectRelClose(e.j2 ?? 0, 1.082_626_68e-3, 1e-8, 'J2');
  });

  it('Sun radius is the IAU 2015 nominal value 695 700 km (Resolution B3)', () => {
    expect(BODIES.sun.radius).toBe(695_700);
  });

  it('GM agrees with the independent astronomy-engine 2.1.19 masses (MassProduct, DE405-era values in au^3/day^2) to 1.5e-5', () => {
    const au = Astronomy.KM_PER_AU;
    for (const name of BODY_NAMES) {
      const gm = (Astronomy.MassProduct(capital(name)) * au ** 3) / 86_400 ** 2;
      expectRelClose(BODIES[name].gm, gm, 1.5e-5, `${name} GM`);
    }
  });

  it('Jupiter radii agree with astronomy-engine (JUPITER_EQUATORIAL_RADIUS_KM, JUPITER_POLAR_RADIUS_KM)', () => {
    expect(BODIES.jupiter.radius).toBe(Astronomy.JUPITER_EQUATORIAL_RADIUS_KM);
    expectClose(BODIES.jupiter.flattening ?? 0, 1 - Astronomy.JUPITER_POLAR_RADIUS_KM / Astronomy.JUPITER_EQUATORIAL_RADIUS_KM, 1e-15, 'f');
  });

  it('heliocentric mean motions agree with the orbital periods of astronomy-engine (PlanetOrbitalPeriod); Earth uses the tropical year, 20.4 min shorter than the sidereal', () => {
    for (const name of ['mercury', 'venus', 'mars', 'jupiter', 'saturn', 'neptune'] as const) {
      const n = (2 * Math.PI) / (Astronomy.PlanetOrbitalPeriod(capital(name)) * 86_400);
      expectRelClose(BODIES[name].heliocentricMeanMotionRadS ?? 0, n, 1e-9, `${name} n`);
    }
    const tropicalDays = (2 * Math.PI) / (BODIES.earth.heliocentricMeanMotionRadS ?? 1) / 86_400;
    // Sidereal minus tropical year is ~20.4 min (precession of the equinoxes; common practice, no source).
    expectClose((Astronomy.PlanetOrbitalPeriod(Astronomy.Body.Earth) - tropicalDays) * 1440, 20.4, 1.5, 'minutes');
    for (const name of ['sun', 'moon', 'uranus'] as const) expect(BODIES[name].heliocentricMeanMotionRadS).toBeUndefined();
  });

  it('rotation rates match the sidereal rotation periods of the NASA planetary fact sheets (hours, from memory) to 0.1 %', () => {
    const periodsH: Record<BodyName, number> = {
      sun: 609.12, mercury: 1407.6, venus: -5832.5, earth: 23.9345, moon: 655.72,
      mars: 24.6229, jupiter: 9.925, saturn: 10.656, uranus: -17.24,
      // Neptune: 15.9663 h, the period behind the WGCCRE 2015 W rate (Karkoschka 2011; the fact sheet's 16.11 h is the older radio period), from memory.
      neptune: 15.9663,
    };
    for (const name of BODY_NAMES) {
      const periodH = (2 * Math.PI) / (BODIES[name].rotationRateRadS ?? Number.NaN) / 3600;
      expectRelClose(periodH, periodsH[name], 1e-3, `${name} rotation period h`);
    }
  });

  it('flattenings match the NASA planetary fact sheets (from memory) to their printed digits', () => {
    const f: Record<BodyName, number> = {
      sun: 0, mercury: 0.0009, venus: 0, earth: 0.003_35, moon: 0.0012,
      mars: 0.005_89, jupiter: 0.064_87, saturn: 0.097_96, uranus: 0.022_93, neptune: 0.017_08,
    };
    for (const name of BODY_NAMES) expectClose(BODIES[name].flattening ?? Number.NaN, f[name], 1e-4, `${name} f`);
  });

  it('J2 is positive and below 0.02 for every body (oblate bodies; common practice, no source)', () => {
    for (const name of BODY_NAMES) {
      expect(BODIES[name].j2 ?? 0, name).toBeGreaterThan(0);
      expect(BODIES[name].j2 ?? 1, name).toBeLessThan(0.02);
    }
  });
});
