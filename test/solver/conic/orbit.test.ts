import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { solveOrbit, type OrbitSolution } from '../../../src/solver/conic/orbit.js';
import { BODIES, type CentralBody } from '../../../src/solver/bodies/bodies.js';
import { elementsToState, type ElementsInput } from '../../../src/solver/conic/elements.js';
import { DEG, TWO_PI } from '../../../src/solver/core/math.js';
import { cross, norm } from '../../../src/solver/core/vec3.js';
import { expectClose, expectRelClose, expectVecClose } from '../../helpers/approx.js';

type Result<T> = { ok: true; value: T } | { ok: false; code: string; message: string };
const ok = <T>(r: Result<T>): T => {
  if (!r.ok) throw new Error(`${r.code}: ${r.message}`);
  return r.value;
};
// Curtis works with mu = 398600 km^3/s^2 and R = 6378 km (3rd ed., from memory).
const CURTIS_EARTH: CentralBody = { name: 'curtis-earth', gm: 398_600, radius: 6378, sources: {} };
const POINT_MASS: CentralBody = { name: 'point', gm: 398_600, sources: {} };
const fromElements = (body: CentralBody, elements: ElementsInput): OrbitSolution => ok(solveOrbit(body, { elements }));

describe('solveOrbit(body, state): Curtis 3rd ed., Example 4.3 (from memory)', () => {
  const sol = ok(solveOrbit(CURTIS_EARTH, { r: [-6045, -3490, 2500], v: [-3.457, 6.618, 2.533] }));

  it('perigee 7284 km, apogee 10290 km, a = 8788 km', () => {
    expectClose(sol.apsides.periapsis.radius, 7284, 1, 'rp km');
    expectClose(sol.apsides.apoapsis?.radius ?? 0, 10_290, 5, 'ra km (printed to 4 figures)');
    expectClose(sol.elements.semiMajorAxis ?? 0, 8788, 0.5, 'a km');
    expectClose(sol.apsides.periapsis.altitude ?? 0, 7284 - 6378, 1, 'perigee altitude km');
  });

  it('period by Kepler\'s third law on the printed a = 8788 km: 8198 s (the brief recalled 8189 s; 2 pi sqrt(8788^3 / 398600) = 8198.7 s)', () => {
    expectClose(sol.periodS ?? 0, TWO_PI * Math.sqrt(8788 ** 3 / 398_600), 1, 'T s');
  });

  it('h = 58310 km^2/s, the angular momentum vector is r x v, energy = -mu / 2a', () => {
    expectClose(sol.specificAngularMomentumMagnitude, 58_310, 5, 'h');
    expectVecClose(sol.specificAngularMomentum, cross([-6045, -3490, 2500], [-3.457, 6.618, 2.533]), 1e-9, 'h vector');
    expectRelClose(sol.specificEnergy, -398_600 / (2 * (sol.elements.semiMajorAxis ?? 0)), 1e-12, 'energy');
    expectRelClose(norm(sol.eccentricityVector), 0.1712, 3e-4, '|e|');
  });
});

describe('solveOrbit: times to the next apsis passage', () => {
  // Curtis 3rd ed., Example 3.1: rp = 9600 km, ra = 21000 km, T = 18834 s, and 4077 s from perigee to nu = 120 deg (from memory).
  const ellipse = (nuDeg: number) => fromElements(POINT_MASS, {
    semiMajorAxis: 15_300, eccentricity: 11_400 / 30_600, inclination: 0.3, raan: 0.2, argPeriapsis: 0.1, trueAnomaly: nuDeg * DEG,
  });

  it('at nu = 120 deg on the orbit of Curtis Example 3.1: perigee in T - 4077 s, apogee in T/2 - 4077 s, T = 18834 s', () => {
    const sol = ellipse(120);
    expectClose(sol.periodS ?? 0, 18_834, 1, 'T');
    expectClose(sol.apsides.periapsis.secondsToNextPassage ?? 0, 18_834 - 4077, 1.5, 'to perigee');
    expectClose(sol.apsides.apoapsis?.secondsToNextPassage ?? 0, 18_834 / 2 - 4077, 1.5, 'to apogee');
  });

  it('exactly at periapsis the next passage is 0 s, and the apoapsis half a period ahead', () => {
    const sol = ellipse(0);
    expect(sol.apsides.periapsis.secondsToNextPassage).toBe(0);
    expectRelClose(sol.apsides.apoapsis?.secondsToNextPassage ?? 0, (sol.periodS ?? 0) / 2, 1e-14, 'to apogee');
  });

  it('on a hyperbola the periapsis passage is reported only when ahead: 4141 s before perigee at nu = -100 deg (Curtis 3rd ed., Example 3.5, from memory)', () => {
    const rp = 6678;
    const h = rp * 15;
    const e = (h * h) / (398_600 * rp) - 1;
    const el = { semiLatusRectum: (h * h) / 398_600, eccentricity: e, inclination: 0.4, raan: 0, argPeriapsis: 0 };
    const before = fromElements(CURTIS_EARTH, { ...el, trueAnomaly: -100 * DEG });
    expectClose(before.apsides.periapsis.secondsToNextPassage ?? 0, 4141, 1, 'to perigee s');
    expect(fromElements(CURTIS_EARTH, { ...el, trueAnomaly: 100 * DEG }).apsides.periapsis.secondsToNextPassage).toBeNull();
    expect(before.apsides.apoapsis).toBeNull();
    expect(before.periodS).toBeNull();
    expect(before.j2).toBeUndefined();
    expectRelClose(before.meanMotion, Math.sqrt(398_600 / (-(before.elements.semiMajorAxis ?? 0)) ** 3), 1e-15, 'n');
  });

  it('on a parabola: t to perigee = (2/3) sqrt(p^3/mu) at nu = -90 deg (Barker in Curtis\'s form mu^2/h^3 t = B/2 + B^3/6, 3rd ed. sec. 3.5, from memory)', () => {
    const p = 20_000;
    const sol = fromElements(POINT_MASS, { semiLatusRectum: p, eccentricity: 1, inclination: 0.2, raan: 0, argPeriapsis: 0, trueAnomaly: -90 * DEG });
    expect(sol.elements.orbitType).toBe('parabolic');
    expectRelClose(sol.apsides.periapsis.secondsToNextPassage ?? 0, (2 / 3) * Math.sqrt(p ** 3 / 398_600), 1e-13, 't s');
    expectRelClose(sol.meanMotion, 2 * Math.sqrt(398_600 / p ** 3), 1e-15, 'n_p');
    expect(sol.apsides.apoapsis).toBeNull();
    expect(sol.periodS).toBeNull();
    expect(sol.apsides.periapsis.altitude).toBeNull(); // the point mass has no radius
  });

  it('a circular orbit has no passage times (periapsis undefined)', () => {
    const sol = fromElements(BODIES.earth, { semiMajorAxis: 7000, eccentricity: 0, inclination: 1, raan: 0, argPeriapsis: 0, trueAnomaly: 1 });
    expect(sol.elements.orbitType).toBe('circular');
    expect(sol.apsides.periapsis.secondsToNextPassage).toBeNull();
    expect(sol.apsides.apoapsis?.secondsToNextPassage).toBeNull();
    expectClose(sol.apsides.periapsis.radius, 7000, 1e-9, 'r');
  });
});

describe('solveOrbit: properties over random orbits', () => {
  const closedOrOpen = fc.oneof(fc.double({ min: 0.001, max: 0.95, noNaN: true }), fc.double({ min: 1.01, max: 5, noNaN: true }));
  const gen = fc.tuple(fc.double({ min: 7000, max: 80_000, noNaN: true }), closedOrOpen, fc.double({ min: 0, max: Math.PI, noNaN: true }),
    fc.double({ min: 0, max: TWO_PI, noNaN: true }), fc.double({ min: 0, max: TWO_PI, noNaN: true }), fc.double({ min: -0.9, max: 0.9, noNaN: true }));
  const build = ([p, e, i, raan, w, f]: [number, number, number, number, number, number]) => {
    const nu = e < 1 ? f * Math.PI : f * Math.acos(-1 / e);
    return fromElements(BODIES.earth, { semiLatusRectum: p, eccentricity: e, inclination: i, raan, argPeriapsis: w, trueAnomaly: nu });
  };

  it('flight-path angle obeys tan(gamma) = e sin(nu) / (1 + e cos(nu)) (Curtis 3rd ed. eq. 2.51, from memory)', () => {
    fc.assert(fc.property(gen, (args) => {
      const sol = build(args);
      const { eccentricity: e, trueAnomaly: nu } = sol.elements;
      expectClose(sol.flightPathAngle, Math.atan2(e * Math.sin(nu), 1 + e * Math.cos(nu)), 1e-10, 'gamma');
    }), { numRuns: 300 });
  });

  it('apsis speeds obey vis-viva v^2 = mu (2/r - 1/a) (Curtis 3rd ed. eq. 2.80, from memory)', () => {
    fc.assert(fc.property(gen, (args) => {
      const sol = build(args);
      const a = sol.elements.semiMajorAxis ?? Number.NaN;
      const mu = BODIES.earth.gm;
      const { periapsis, apoapsis } = sol.apsides;
      expectRelClose(periapsis.speed, Math.sqrt(mu * (2 / periapsis.radius - 1 / a)), 1e-11, 'vp');
      if (apoapsis) expectRelClose(apoapsis.speed, Math.sqrt(mu * (2 / apoapsis.radius - 1 / a)), 1e-11, 'va');
      expectRelClose(sol.specificEnergy, -mu / (2 * a), 1e-10, 'energy');
      expectRelClose(sol.speed, Math.sqrt(mu * (2 / sol.radius - 1 / a)), 1e-11, 'speed at epoch');
    }), { numRuns: 300 });
  });

  it('a closed orbit reaches periapsis one period after the last one: time to next periapsis + time since it = T', () => {
    fc.assert(fc.property(fc.double({ min: 0.01, max: 0.9, noNaN: true }), fc.double({ min: 0.01, max: TWO_PI - 0.01, noNaN: true }), (e, M) => {
      const sol = fromElements(BODIES.earth, { semiMajorAxis: 12_000, eccentricity: e, inclination: 1, raan: 1, argPeriapsis: 1, meanAnomaly: M });
      const T = TWO_PI * Math.sqrt(12_000 ** 3 / BODIES.earth.gm); // Kepler's third law
      expectRelClose((sol.apsides.periapsis.secondsToNextPassage ?? 0) + (M / TWO_PI) * T, T, 1e-12, 'T');
    }), { numRuns: 200 });
  });
});

describe('solveOrbit: state from elements, J2 block, failures', () => {
  it('returns the state of the elements and reports J2 rates only for bodies with J2 and bound orbits', () => {
    const elements = { semiMajorAxis: 6378.137 + 800, eccentricity: 0.001, inclination: 98.6 * DEG, raan: 0.3, argPeriapsis: 0.2, trueAnomaly: 0.1 };
    const sol = fromElements(BODIES.earth, elements);
    const state = ok(elementsToState(elements, BODIES.earth.gm));
    expectVecClose(sol.position, state.r, 0, 'r');
    expectVecClose(sol.velocity, state.v, 0, 'v');
    expect(sol.j2?.sunSynchronous).toBe(true);
    expectClose((sol.j2?.sunSynchronousInclination ?? 0) / DEG, 98.6, 0.05, 'sun-synchronous i (common practice, no source)');
    expect(sol.j2?.raanRateRadS).toBeGreaterThan(0);
    expect(fromElements(POINT_MASS, elements).j2).toBeUndefined();
    expect(fromElements({ ...BODIES.earth, j2: undefined }, elements).j2).toBeUndefined();
  });

  it('passes solver failures through with their codes', () => {
    const zero = solveOrbit(BODIES.earth, { r: [0, 0, 0], v: [1, 0, 0] });
    expect(zero.ok ? 'ok' : zero.code).toBe('zero-position');
    const radial = solveOrbit(BODIES.earth, { r: [7000, 0, 0], v: [1, 0, 0] });
    expect(radial.ok ? 'ok' : radial.code).toBe('rectilinear-motion');
    const sign = solveOrbit(BODIES.earth, { elements: { semiMajorAxis: 7000, eccentricity: 1.5, inclination: 0, raan: 0, argPeriapsis: 0, trueAnomaly: 0 } });
    expect(sign.ok ? 'ok' : sign.code).toBe('semi-major-axis-sign');
    const badMu = solveOrbit({ name: 'x', gm: 0, sources: {} }, { r: [7000, 0, 0], v: [0, 7, 0] });
    expect(badMu.ok ? 'ok' : badMu.code).toBe('invalid-parameter');
  });
});
