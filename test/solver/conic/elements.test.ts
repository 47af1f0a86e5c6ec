import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  CIRCULAR_ECCENTRICITY,
  elementsToState,
  orbitTypeOf,
  stateToElements,
  type ClassicalElements,
  type ElementsInput,
} from '../../../src/solver/conic/elements.js';
import { DEG, TWO_PI, wrapPi } from '../../../src/solver/core/math.js';
import { cross, dot, norm, type Vec3 } from '../../../src/solver/core/vec3.js';
import { expectClose, expectRelClose, expectVecClose } from '../../helpers/approx.js';

type Result<T> = { ok: true; value: T } | { ok: false; code: string; message: string };
const ok = <T>(r: Result<T>): T => {
  if (!r.ok) throw new Error(`${r.code}: ${r.message}`);
  return r.value;
};
const codeOf = (r: { ok: true } | { ok: false; code: string }): string => (r.ok ? 'ok' : r.code);
/** Smallest angle between two directions, rad. */
const angleOff = (a: number, b: number): number => Math.abs(wrapPi(a - b));
const MU_EARTH = 398_600.4418;

const toState = (el: ElementsInput, mu = MU_EARTH) => ok(elementsToState(el, mu));
const toElements = (r: Vec3, v: Vec3, mu = MU_EARTH): ClassicalElements => ok(stateToElements(r, v, mu));

describe('stateToElements(r, v, mu): published examples', () => {
  it('Curtis, Orbital Mechanics for Engineering Students, 3rd ed., Example 4.3 (from memory): h = 58310, i = 153.2, RAAN = 255.3, e = 0.1712, omega = 20.07, nu = 28.45 deg, a = 8788 km', () => {
    const el = toElements([-6045, -3490, 2500], [-3.457, 6.618, 2.533], 398_600);
    expect(el.orbitType).toBe('elliptic');
    expectClose(Math.sqrt(398_600 * el.semiLatusRectum), 58_310, 5, 'h km^2/s (printed to 4 figures)');
    expectClose(el.inclination / DEG, 153.2, 0.05, 'i deg');
    expectClose(el.raan / DEG, 255.3, 0.05, 'RAAN deg');
    expectClose(el.eccentricity, 0.1712, 5e-5, 'e');
    expectClose(el.argPeriapsis / DEG, 20.07, 0.005, 'omega deg');
    expectClose(el.trueAnomaly / DEG, 28.45, 0.005, 'nu deg');
    expectClose(el.semiMajorAxis ?? Number.NaN, 8788, 0.5, 'a km');
    expect(el.raanDefined && el.argPeriapsisDefined).toBe(true);
  });

  it('Vallado, Fundamentals of Astrodynamics and Applications, 4th ed., Example 2-5 (from memory): p = 11067.790 km, a = 36127.343 km, e = 0.832853, i = 87.870, RAAN = 227.898, omega = 53.38, nu = 92.335 deg', () => {
    const el = toElements([6524.834, 6862.875, 6448.296], [4.901327, 5.533756, -1.976341]);
    // p and a agree to ~1e-6 relative with the recalled figures (last printed digits uncertain).
    expectRelClose(el.semiLatusRectum, 11_067.79, 1.5e-6, 'p km');
    expectRelClose(el.semiMajorAxis ?? Number.NaN, 36_127.343, 1e-6, 'a km');
    expectClose(el.eccentricity, 0.832_853, 1e-6, 'e');
    expectClose(el.inclination / DEG, 87.87, 0.001, 'i deg');
    expectClose(el.raan / DEG, 227.898, 0.001, 'RAAN deg');
    expectClose(el.argPeriapsis / DEG, 53.38, 0.005, 'omega deg');
    expectClose(el.trueAnomaly / DEG, 92.335, 0.001, 'nu deg');
  });
});

describe('elementsToState(elements, mu): published examples', () => {
  it('Curtis 3rd ed., Example 4.7 (from memory): h = 80000 km^2/s, e = 1.4, i = 30, RAAN = 40, omega = 60, nu = 30 deg -> r = (-4040, 4815, 3629) km, v = (-10.39, -4.772, 1.744) km/s', () => {
    const { r, v, elements } = toState({
      semiLatusRectum: 80_000 ** 2 / 398_600, eccentricity: 1.4,
      inclination: 30 * DEG, raan: 40 * DEG, argPeriapsis: 60 * DEG, trueAnomaly: 30 * DEG,
    }, 398_600);
    expectVecClose(r, [-4040, 4815, 3629], 0.5, 'r km');
    expectClose(v[0], -10.39, 0.005, 'vx km/s');
    expectClose(v[1], -4.772, 0.0005, 'vy km/s');
    expectClose(v[2], 1.744, 0.0005, 'vz km/s');
    expect(elements.orbitType).toBe('hyperbolic');
    expect(elements.semiMajorAxis).toBeLessThan(0);
  });

  it('Vallado 4th ed., Example 2-6 (from memory): the rounded elements of Example 2-5 give r = (6525.344, 6861.535, 6449.125) km, v = (4.902276, 5.533124, -1.975709) km/s', () => {
    const { r, v } = toState({
      semiLatusRectum: 11_067.79, eccentricity: 0.83285,
      inclination: 87.87 * DEG, raan: 227.89 * DEG, argPeriapsis: 53.38 * DEG, trueAnomaly: 92.335 * DEG,
    });
    // Recalled outputs differ from ours by up to 0.024 km / 1.6e-5 km/s (rounding of the recalled inputs).
    expectVecClose(r, [6525.344, 6861.535, 6449.125], 0.05, 'r km');
    expectVecClose(v, [4.902276, 5.533124, -1.975709], 5e-5, 'v km/s');
  });
});

// ---- round trips -------------------------------------------------------------------------------

const angle = fc.double({ min: 0, max: TWO_PI, maxExcluded: true, noNaN: true });

/** Compare recovered elements with the input ones, each angle to `tol` rad. */
function expectSameOrbit(got: ClassicalElements, input: ElementsInput & { trueAnomaly: number }, tol: { angle: number; relA: number; e: number }) {
  if (input.semiMajorAxis !== undefined) expectRelClose(got.semiMajorAxis ?? Number.NaN, input.semiMajorAxis, tol.relA, 'a');
  if (input.semiLatusRectum !== undefined) expectRelClose(got.semiLatusRectum, input.semiLatusRectum, tol.relA, 'p');
  expectClose(got.eccentricity, input.eccentricity, tol.e, 'e');
  expectClose(got.inclination, input.inclination, 1e-12, 'i');
  expectClose(angleOff(got.raan, input.raan), 0, tol.angle, 'raan');
  expectClose(angleOff(got.argPeriapsis, input.argPeriapsis), 0, tol.angle, 'argPeriapsis');
  expectClose(angleOff(got.trueAnomaly, input.trueAnomaly), 0, tol.angle, 'trueAnomaly');
}

/** The elements reported by elementsToState equal those recovered from its state. */
function expectConsistent(input: ElementsInput, mu = MU_EARTH, angleTol = 1e-10) {
  const { r, v, elements } = toState(input, mu);
  const back = toElements(r, v, mu);
  expect(back.orbitType).toBe(elements.orbitType);
  expect(back.raanDefined).toBe(elements.raanDefined);
  expect(back.argPeriapsisDefined).toBe(elements.argPeriapsisDefined);
  for (const k of ['raan', 'argPeriapsis', 'trueAnomaly', 'argLatitude', 'trueLongitude', 'longitudeOfPeriapsis', 'meanAnomaly'] as const) {
    expectClose(angleOff(back[k], elements[k]), 0, angleTol, k);
  }
  return { r, v, elements, back };
}

describe('elements -> state -> elements round trips (fast-check)', () => {
  it('elliptic orbits, prograde and retrograde', () => {
    fc.assert(fc.property(
      fc.double({ min: 6500, max: 100_000, noNaN: true }), fc.double({ min: 1e-4, max: 0.95, noNaN: true }),
      fc.double({ min: 0.01, max: Math.PI - 0.01, noNaN: true }), angle, angle, angle,
      (a, e, i, raan, w, nu) => {
        const input = { semiMajorAxis: a, eccentricity: e, inclination: i, raan, argPeriapsis: w, trueAnomaly: nu };
        const { r, v } = toState(input);
        expectSameOrbit(toElements(r, v), input, { angle: 1e-10, relA: 1e-11, e: 1e-12 });
        expectConsistent(input);
      }), { numRuns: 500 });
  });

  it('near-circular orbits (e from 1e-8 to 1e-6): periapsis and anomaly to ~1e-14 / e rad, their sum to 1e-11', () => {
    fc.assert(fc.property(
      fc.double({ min: 6500, max: 50_000, noNaN: true }), fc.double({ min: 1e-8, max: 1e-6, noNaN: true }),
      fc.double({ min: 0.01, max: Math.PI - 0.01, noNaN: true }), angle, angle, angle,
      (a, e, i, raan, w, nu) => {
        const input = { semiMajorAxis: a, eccentricity: e, inclination: i, raan, argPeriapsis: w, trueAnomaly: nu };
        const { r, v } = toState(input);
        const back = toElements(r, v);
        expect(back.orbitType).toBe('elliptic');
        expectSameOrbit(back, input, { angle: 2e-14 / e, relA: 1e-11, e: 1e-14 });
        expectClose(angleOff(back.argLatitude, w + nu), 0, 1e-11, 'u');
      }), { numRuns: 300 });
  });

  it('near-equatorial orbits (i or pi - i from 1e-7 to 1e-4): node and periapsis to 1e-15 / i rad', () => {
    fc.assert(fc.property(
      fc.double({ min: 6500, max: 50_000, noNaN: true }), fc.double({ min: 1e-3, max: 0.9, noNaN: true }),
      fc.double({ min: 1e-7, max: 1e-4, noNaN: true }), fc.boolean(), angle, angle, angle,
      (a, e, tilt, retro, raan, w, nu) => {
        const i = retro ? Math.PI - tilt : tilt;
        const input = { semiMajorAxis: a, eccentricity: e, inclination: i, raan, argPeriapsis: w, trueAnomaly: nu };
        const { r, v } = toState(input);
        const back = toElements(r, v);
        expect(back.raanDefined).toBe(true);
        expectClose(back.inclination, i, 1e-12, 'i');
        expectClose(angleOff(back.raan, raan), 0, 1e-15 / tilt, 'raan');
        expectClose(angleOff(back.argPeriapsis, w), 0, 1e-15 / tilt, 'argPeriapsis');
        expectClose(angleOff(back.trueAnomaly, nu), 0, 1e-10, 'nu');
        expectClose(angleOff(back.longitudeOfPeriapsis, raan + w), 0, 1e-10, 'longitude of periapsis');
      }), { numRuns: 300 });
  });

  it('hyperbolic orbits from e = 1.0001, true anomaly inside the asymptote', () => {
    fc.assert(fc.property(
      fc.double({ min: 1000, max: 1e6, noNaN: true }), fc.double({ min: 1.0001, max: 10, noNaN: true }),
      fc.double({ min: 0.01, max: Math.PI - 0.01, noNaN: true }), angle, angle, fc.double({ min: -0.95, max: 0.95, noNaN: true }),
      (p, e, i, raan, w, f) => {
        const nu = f * Math.acos(-1 / e);
        const input = { semiMajorAxis: -p / ((e - 1) * (e + 1)), eccentricity: e, inclination: i, raan, argPeriapsis: w, trueAnomaly: nu };
        const { r, v } = toState(input);
        const back = toElements(r, v);
        expect(back.orbitType).toBe('hyperbolic');
        expectSameOrbit(back, input, { angle: 1e-12, relA: 2e-11, e: 1e-13 });
        expectConsistent(input, MU_EARTH, 1e-10);
      }), { numRuns: 300 });
  });

  it('parabolic orbits (e = 1, given p)', () => {
    fc.assert(fc.property(
      fc.double({ min: 1000, max: 1e6, noNaN: true }), fc.double({ min: 0.01, max: Math.PI - 0.01, noNaN: true }),
      angle, angle, fc.double({ min: -0.95 * Math.PI, max: 0.95 * Math.PI, noNaN: true }),
      (p, i, raan, w, nu) => {
        const input = { semiLatusRectum: p, eccentricity: 1, inclination: i, raan, argPeriapsis: w, trueAnomaly: nu };
        const { r, v, elements } = toState(input);
        expect(elements.semiMajorAxis).toBeNull();
        const back = toElements(r, v);
        expect(back.orbitType).toBe('parabolic');
        expectSameOrbit(back, input, { angle: 1e-12, relA: 1e-12, e: 1e-13 });
        expectClose(back.eccentricAnomaly, Math.tan(nu / 2), 1e-9 * Math.max(1, Math.abs(Math.tan(nu / 2))), 'B = tan(nu/2)');
      }), { numRuns: 300 });
  });

  it('mean anomaly given: the reported mean anomaly is the one given (elliptic mod 2 pi, hyperbolic, parabolic)', () => {
    fc.assert(fc.property(fc.double({ min: -20, max: 20, noNaN: true }), fc.constantFrom(0.3, 0.99, 1, 1.0001, 3), (M, e) => {
      const input: ElementsInput = e === 1
        ? { semiLatusRectum: 9000, eccentricity: e, inclination: 0.5, raan: 1, argPeriapsis: 2, meanAnomaly: M }
        : { semiMajorAxis: e < 1 ? 9000 : -9000, eccentricity: e, inclination: 0.5, raan: 1, argPeriapsis: 2, meanAnomaly: M };
      const got = toState(input).elements.meanAnomaly;
      return e < 1 ? angleOff(got, M) <= 1e-12 : Math.abs(got - M) <= 1e-10 * Math.max(1, Math.abs(M));
    }), { numRuns: 500 });
  });

  it('state -> elements -> state gives the state back (random states, all orbit types)', () => {
    const comp = fc.double({ min: -1, max: 1, noNaN: true });
    fc.assert(fc.property(fc.tuple(comp, comp, comp), fc.tuple(comp, comp, comp), fc.double({ min: 6500, max: 60_000, noNaN: true }), fc.double({ min: 0.5, max: 12, noNaN: true }),
      (rd, vd, rMag, vMag) => {
        const rn = norm(rd), vn = norm(vd);
        if (rn < 1e-3 || vn < 1e-3 || norm(cross(rd, vd)) < 1e-3 * rn * vn) return;
        const r: Vec3 = [rd[0] * rMag / rn, rd[1] * rMag / rn, rd[2] * rMag / rn];
        const v: Vec3 = [vd[0] * vMag / vn, vd[1] * vMag / vn, vd[2] * vMag / vn];
        const el = toElements(r, v);
        const back = toState({
          ...(el.semiMajorAxis === null ? { semiLatusRectum: el.semiLatusRectum } : { semiMajorAxis: el.semiMajorAxis }),
          eccentricity: el.eccentricity, inclination: el.inclination, raan: el.raan, argPeriapsis: el.argPeriapsis, trueAnomaly: el.trueAnomaly,
        });
        // Where a convention drops an angle (i or e below its threshold) the state moves by up to 2 i |r| or 2 e |r|.
        const tilt = el.raanDefined ? 0 : Math.min(el.inclination, Math.PI - el.inclination);
        const ecc = el.argPeriapsisDefined ? 0 : el.eccentricity;
        // r = p / (1 + e cos nu) cancels on needle-like orbits far from periapsis: allow eps * r / p.
        const slack = 1e-11 + 2 * tilt + 2 * ecc + 1e-15 * (rMag / el.semiLatusRectum);
        expectVecClose(back.r, r, slack * rMag, 'r');
        expectVecClose(back.v, v, slack * vMag, 'v');
      }), { numRuns: 500 });
  });
});

describe('energy and angular momentum (vis-viva; h = sqrt(mu p); Curtis 3rd ed. sec. 2.7, from memory)', () => {
  it('energy of the state is -mu / (2a) and |r x v| = sqrt(mu p) for elliptic and hyperbolic input elements', () => {
    fc.assert(fc.property(
      fc.double({ min: 7000, max: 1e5, noNaN: true }), fc.oneof(fc.double({ min: 0, max: 0.99, noNaN: true }), fc.double({ min: 1.01, max: 20, noNaN: true })),
      angle, angle, angle, fc.double({ min: -0.9, max: 0.9, noNaN: true }),
      (size, e, i2, raan, w, f) => {
        const a = e < 1 ? size : -size;
        const nu = e < 1 ? f * Math.PI : f * Math.acos(-1 / e);
        const { r, v, elements } = toState({ semiMajorAxis: a, eccentricity: e, inclination: i2 / 2, raan, argPeriapsis: w, trueAnomaly: nu });
        const energy = dot(v, v) / 2 - MU_EARTH / norm(r);
        expectRelClose(energy, -MU_EARTH / (2 * a), 1e-11, 'energy');
        expectRelClose(norm(cross(r, v)), Math.sqrt(MU_EARTH * elements.semiLatusRectum), 1e-12, '|h|');
      }), { numRuns: 300 });
  });
});

describe('conventions for undefined angles', () => {
  it('classifies by eccentricity: 5e-10 circular, 2e-9 elliptic, 0.9999 elliptic, 1 + 5e-11 parabolic, 1.0001 hyperbolic', () => {
    expect(orbitTypeOf(0)).toBe('circular');
    expect(orbitTypeOf(5e-10)).toBe('circular');
    expect(orbitTypeOf(2e-9)).toBe('elliptic');
    expect(orbitTypeOf(0.9999)).toBe('elliptic');
    expect(orbitTypeOf(1 - 5e-11)).toBe('parabolic');
    expect(orbitTypeOf(1 + 5e-11)).toBe('parabolic');
    expect(orbitTypeOf(1.0001)).toBe('hyperbolic');
    expect(CIRCULAR_ECCENTRICITY).toBeGreaterThan(0);
  });

  it('circular inclined: argPeriapsis 0 (undefined), trueAnomaly = argument of latitude', () => {
    const input = { semiMajorAxis: 7000, eccentricity: 0, inclination: 0.9, raan: 1.1, argPeriapsis: 0.4, trueAnomaly: 2 };
    const { elements, back } = expectConsistent(input);
    for (const el of [elements, back]) {
      expect(el.orbitType).toBe('circular');
      expect(el.argPeriapsis).toBe(0);
      expect(el.argPeriapsisDefined).toBe(false);
      expect(el.raanDefined).toBe(true);
      expectClose(el.trueAnomaly, 2.4, 1e-12, 'u');
      expectClose(el.raan, 1.1, 1e-12, 'raan');
    }
  });

  it('circular equatorial: raan 0 and argPeriapsis 0, trueAnomaly = true longitude from the x axis', () => {
    const input = { semiMajorAxis: 42_164, eccentricity: 0, inclination: 0, raan: 1, argPeriapsis: 0.5, trueAnomaly: 0.25 };
    const { r, elements, back } = expectConsistent(input);
    for (const el of [elements, back]) {
      expect(el.raan).toBe(0);
      expect(el.raanDefined).toBe(false);
      expect(el.argPeriapsisDefined).toBe(false);
      expectClose(el.trueAnomaly, 1.75, 1e-12, 'true longitude');
    }
    expectClose(Math.atan2(r[1], r[0]), 1.75, 1e-12, 'position angle from x');
  });

  it('elliptic equatorial prograde: raan 0, argPeriapsis = longitude of periapsis (raan + omega)', () => {
    const { elements, back } = expectConsistent({ semiMajorAxis: 9000, eccentricity: 0.2, inclination: 0, raan: 0.7, argPeriapsis: 0.6, trueAnomaly: 1 });
    for (const el of [elements, back]) {
      expect(el.raan).toBe(0);
      expectClose(el.argPeriapsis, 1.3, 1e-12, 'omega');
      expectClose(el.trueAnomaly, 1, 1e-12, 'nu');
    }
  });

  it('elliptic equatorial retrograde: argPeriapsis measured in the direction of motion (omega - raan), and the state is unchanged', () => {
    const input = { semiMajorAxis: 9000, eccentricity: 0.2, inclination: Math.PI, raan: 0.7, argPeriapsis: 0.6, trueAnomaly: 1 };
    const { r, v, elements } = expectConsistent(input);
    expectClose(angleOff(elements.argPeriapsis, 0.6 - 0.7), 0, 1e-12, 'omega');
    // Periapsis lies at angle raan - omega from the x axis, counter-clockwise (seen from +z).
    const eVec = [(dot(v, v) - MU_EARTH / norm(r)) * r[0] - dot(r, v) * v[0], (dot(v, v) - MU_EARTH / norm(r)) * r[1] - dot(r, v) * v[1]];
    expectClose(angleOff(Math.atan2(eVec[1]!, eVec[0]!), 0.7 - 0.6), 0, 1e-12, 'periapsis direction');
    const again = toState({ semiMajorAxis: 9000, eccentricity: 0.2, inclination: Math.PI, raan: elements.raan, argPeriapsis: elements.argPeriapsis, trueAnomaly: elements.trueAnomaly });
    expectVecClose(again.r, r, 1e-8, 'same r');
    expectVecClose(again.v, v, 1e-11, 'same v');
  });

  it('dog-leg angles: argLatitude = omega + nu, trueLongitude = raan + omega + nu, longitudeOfPeriapsis = raan + omega', () => {
    const el = toState({ semiMajorAxis: 8000, eccentricity: 0.1, inclination: 1, raan: 5, argPeriapsis: 4, trueAnomaly: 3 }).elements;
    expectClose(el.argLatitude, 7 - TWO_PI, 1e-12, 'u');
    expectClose(el.trueLongitude, 12 - TWO_PI, 1e-12, 'lambda');
    expectClose(el.longitudeOfPeriapsis, 9 - TWO_PI, 1e-12, 'varpi');
  });
});

describe('failures', () => {
  const base = { semiMajorAxis: 8000, eccentricity: 0.1, inclination: 1, raan: 0, argPeriapsis: 0, trueAnomaly: 0 };

  it('zero position', () => {
    expect(codeOf(stateToElements([0, 0, 0], [1, 2, 3], MU_EARTH))).toBe('zero-position');
  });

  it('rectilinear motion: velocity parallel to position, or zero velocity', () => {
    expect(codeOf(stateToElements([7000, 0, 0], [3, 0, 0], MU_EARTH))).toBe('rectilinear-motion');
    expect(codeOf(stateToElements([7000, 1000, 0], [-7, -1, 0], MU_EARTH))).toBe('rectilinear-motion');
    expect(codeOf(stateToElements([7000, 0, 0], [0, 0, 0], MU_EARTH))).toBe('rectilinear-motion');
  });

  it('eccentricity below 0 or not finite', () => {
    expect(codeOf(elementsToState({ ...base, eccentricity: -0.1 }, MU_EARTH))).toBe('eccentricity-out-of-range');
    expect(codeOf(elementsToState({ ...base, eccentricity: Number.NaN }, MU_EARTH))).toBe('eccentricity-out-of-range');
  });

  it('semi-major axis of the wrong sign, or given for a parabola', () => {
    expect(codeOf(elementsToState({ ...base, semiMajorAxis: -8000 }, MU_EARTH))).toBe('semi-major-axis-sign');
    expect(codeOf(elementsToState({ ...base, eccentricity: 1.5 }, MU_EARTH))).toBe('semi-major-axis-sign');
    expect(codeOf(elementsToState({ ...base, eccentricity: 1 }, MU_EARTH))).toBe('semi-major-axis-sign');
  });

  it('hyperbolic true anomaly at or beyond the asymptote acos(-1/e)', () => {
    const hyp = { ...base, semiMajorAxis: -8000, eccentricity: 2 };
    expect(codeOf(elementsToState({ ...hyp, trueAnomaly: 120 * DEG }, MU_EARTH))).toBe('anomaly-beyond-asymptote'); // acos(-1/2), to rounding
    expect(codeOf(elementsToState({ ...hyp, trueAnomaly: -150 * DEG }, MU_EARTH))).toBe('anomaly-beyond-asymptote');
    expect(codeOf(elementsToState({ ...hyp, trueAnomaly: 119 * DEG }, MU_EARTH))).toBe('ok');
    expect(codeOf(elementsToState({ semiLatusRectum: 9000, eccentricity: 1, inclination: 0, raan: 0, argPeriapsis: 0, trueAnomaly: Math.PI }, MU_EARTH))).toBe('anomaly-beyond-asymptote');
  });

  it('invalid parameters: mu, both or neither size, both or neither anomaly, p <= 0, a = 0, inclination out of range, non-finite state', () => {
    const { trueAnomaly: _nu, ...noAnomaly } = base;
    const { semiMajorAxis: _a, ...noSize } = base;
    for (const [label, r] of [
      ['mu = 0', elementsToState(base, 0)],
      ['mu < 0', stateToElements([7000, 0, 0], [0, 7, 0], -1)],
      ['both sizes', elementsToState({ ...base, semiLatusRectum: 7000 }, MU_EARTH)],
      ['no size', elementsToState(noSize, MU_EARTH)],
      ['both anomalies', elementsToState({ ...base, meanAnomaly: 1 }, MU_EARTH)],
      ['no anomaly', elementsToState(noAnomaly, MU_EARTH)],
      ['p = 0', elementsToState({ ...noSize, semiLatusRectum: 0 }, MU_EARTH)],
      ['a = 0', elementsToState({ ...base, semiMajorAxis: 0 }, MU_EARTH)],
      ['i > pi', elementsToState({ ...base, inclination: 4 }, MU_EARTH)],
      ['NaN raan', elementsToState({ ...base, raan: Number.NaN }, MU_EARTH)],
      ['infinite position', stateToElements([Number.POSITIVE_INFINITY, 0, 0], [0, 7, 0], MU_EARTH)],
    ] as const) {
      expect(codeOf(r), label).toBe('invalid-parameter');
      if (!r.ok) expect(r.message.length, label).toBeGreaterThan(10);
    }
  });
});
