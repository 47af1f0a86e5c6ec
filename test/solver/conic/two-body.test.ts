import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { bodyTracksAboutBarycentre, reduceTwoBody, type BodyState, type TwoBodyReduction } from '../../../src/solver/conic/two-body.js';
import { propagateGrid } from '../../../src/solver/conic/universal.js';
import type { Vec3 } from '../../../src/solver/core/vec3.js';
import { expectClose, expectRelClose, expectVecClose } from '../../helpers/approx.js';

// Published GM values (km^3/s^2): Earth 398600.4418, Moon 4902.800; mean Earth-Moon distance
// 384 400 km (facts of the trade: common practice, no source).
const GM_EARTH = 398_600.4418;
const GM_MOON = 4902.8;
const EARTH_MOON_KM = 384_400;

const reduced = (b1: BodyState, b2: BodyState): TwoBodyReduction => {
  const out = reduceTwoBody(b1, b2);
  if (!out.ok) throw new Error(`${out.code}: ${out.message}`);
  return out.value;
};

/** Earth at the origin at rest, the Moon on +x with the circular relative speed, tilted 5 degrees. */
function earthMoon(): { earth: BodyState; moon: BodyState } {
  const speed = Math.sqrt((GM_EARTH + GM_MOON) / EARTH_MOON_KM);
  const tilt = (5 * Math.PI) / 180;
  return {
    earth: { gm: GM_EARTH, r: [0, 0, 0], v: [0, 0, 0] },
    moon: { gm: GM_MOON, r: [EARTH_MOON_KM, 0, 0], v: [0, speed * Math.cos(tilt), speed * Math.sin(tilt)] },
  };
}

describe('reduceTwoBody(b1, b2)', () => {
  it('puts the Earth-Moon barycentre about 4670 km from the Earth\'s centre (common practice, no source)', () => {
    const { earth, moon } = earthMoon();
    const red = reduced(earth, moon);
    const distance = Math.hypot(...red.barycentre.r);
    expectClose(distance, 4670, 5, 'barycentre distance (km)');
    // m2/M of the separation, by hand: 384400 * 4902.8 / 403503.2418
    expectRelClose(distance, (EARTH_MOON_KM * GM_MOON) / (GM_EARTH + GM_MOON), 1e-14, 'barycentre distance');
    expectRelClose(red.totalGm, GM_EARTH + GM_MOON, 1e-15, 'mu');
    expectRelClose(red.reducedGm, (GM_EARTH * GM_MOON) / (GM_EARTH + GM_MOON), 1e-15, 'reduced GM');
  });

  it('gives momenta about the barycentre that sum to zero, and bodies on opposite sides of it (Goldstein 3rd ed. sec. 3.1)', () => {
    const { earth, moon } = earthMoon();
    const red = reduced(earth, moon);
    for (let c = 0; c < 3; c++) {
      // G m1 v1' + G m2 v2' = 0 and G m1 r1' + G m2 r2' = 0
      expectClose(GM_EARTH * red.body1.v[c]! + GM_MOON * red.body2.v[c]!, 0, 1e-9, `momentum[${c}]`);
      expectClose(GM_EARTH * red.body1.r[c]! + GM_MOON * red.body2.r[c]!, 0, 1e-6, `mass moment[${c}]`);
      expectClose(red.body2.r[c]! - red.body1.r[c]!, red.relative.r[c]!, 1e-9, `r2' - r1' = r [${c}]`);
    }
  });

  it('gives total energy and angular momentum equal to the reduced mass times the relative values (Goldstein 3rd ed. sec. 3.1)', () => {
    const { earth, moon } = earthMoon();
    const red = reduced(earth, moon);
    expectRelClose(red.energyTimesG.direct, red.energyTimesG.fromRelative, 1e-12, 'G E');
    expectVecClose(red.angularMomentumTimesG.direct, red.angularMomentumTimesG.fromRelative, 1e-12 * Math.hypot(...red.angularMomentumTimesG.fromRelative), 'G L');
    // Circular relative orbit: specific energy -mu/(2r) (vis-viva).
    expectRelClose(red.specificEnergy, -(GM_EARTH + GM_MOON) / (2 * EARTH_MOON_KM), 1e-13, 'specific energy');
  });

  it('splits the semi-major axis as a1 = a m2/M, a2 = a m1/M with one period of about 27.3 days (sidereal month, common practice)', () => {
    const { earth, moon } = earthMoon();
    const red = reduced(earth, moon);
    expect(red.semiMajorAxes).not.toBeNull();
    const axes = red.semiMajorAxes!;
    expectRelClose(axes.relative, EARTH_MOON_KM, 1e-12, 'a');
    expectRelClose(axes.body1 + axes.body2, axes.relative, 1e-15, 'a1 + a2 = a');
    expectRelClose(axes.body1 / axes.body2, GM_MOON / GM_EARTH, 1e-14, 'a1/a2 = m2/m1');
    expectClose(red.periodS! / 86_400, 27.3, 0.1, 'period (days)');
  });

  it('agrees between the two routes for random pairs, and a common velocity only moves the barycentre (Galilean invariance)', () => {
    const vec = (m: number) => fc.tuple(fc.double({ min: -m, max: m, noNaN: true }), fc.double({ min: -m, max: m, noNaN: true }), fc.double({ min: -m, max: m, noNaN: true }));
    fc.assert(
      fc.property(fc.double({ min: 1e-3, max: 1e6, noNaN: true }), fc.double({ min: 1e-3, max: 1e6, noNaN: true }), vec(1e5), vec(1e5), vec(10), vec(10), vec(10), (gm1, gm2, ra, rb, va, vb, boost) => {
        fc.pre(Math.hypot(ra[0] - rb[0], ra[1] - rb[1], ra[2] - rb[2]) > 1);
        const red = reduced({ gm: gm1, r: ra, v: va }, { gm: gm2, r: rb, v: vb });
        const scaleE = 0.5 * (gm1 * (va[0] ** 2 + va[1] ** 2 + va[2] ** 2) + gm2 * (vb[0] ** 2 + vb[1] ** 2 + vb[2] ** 2)) + (gm1 * gm2) / Math.hypot(...red.relative.r);
        expectClose(red.energyTimesG.direct, red.energyTimesG.fromRelative, 1e-11 * scaleE, 'G E');
        const scaleL = (gm1 + gm2) * 2e5 * 20;
        expectVecClose(red.angularMomentumTimesG.direct, red.angularMomentumTimesG.fromRelative, 1e-11 * scaleL, 'G L');
        const add = (a: Vec3, b: Vec3): Vec3 => [a[0] + b[0], a[1] + b[1], a[2] + b[2]];
        const boosted = reduced({ gm: gm1, r: ra, v: add(va, boost) }, { gm: gm2, r: rb, v: add(vb, boost) });
        expectVecClose(boosted.relative.v, red.relative.v, 1e-12 * 40, 'relative v unchanged');
        expectVecClose(boosted.barycentre.v, add(red.barycentre.v, boost), 1e-12 * 40, 'barycentre v moves by the boost');
        expectRelClose(boosted.energyTimesG.direct, red.energyTimesG.direct, 1e-9, 'energy about the barycentre unchanged', scaleE);
      }),
    );
  });

  it('reports no semi-major axis or period for an unbound pair', () => {
    const red = reduced({ gm: GM_EARTH, r: [0, 0, 0], v: [0, 0, 0] }, { gm: 1e-6, r: [7000, 0, 0], v: [0, 12, 0] });
    expect(red.specificEnergy).toBeGreaterThan(0);
    expect(red.semiMajorAxes).toBeNull();
    expect(red.periodS).toBeNull();
  });

  it('names the reason for bad input', () => {
    const { earth, moon } = earthMoon();
    const code = (b1: BodyState, b2: BodyState): string => {
      const out = reduceTwoBody(b1, b2);
      return out.ok ? 'ok' : out.code;
    };
    expect(code({ ...earth, gm: 0 }, moon)).toBe('invalid-parameter');
    expect(code(earth, { ...moon, gm: -1 })).toBe('invalid-parameter');
    expect(code(earth, { ...moon, gm: Number.NaN })).toBe('invalid-parameter');
    expect(code(earth, { ...moon, r: [Number.POSITIVE_INFINITY, 0, 0] })).toBe('invalid-parameter');
    expect(code(earth, { ...moon, r: [0, 0, 0] })).toBe('zero-position');
  });
});

describe('bodyTracksAboutBarycentre(reduction, relativeTable)', () => {
  it('turns a relative track into two tracks about the barycentre: r1 = -(m2/M) r, r2 = (m1/M) r', () => {
    const { earth, moon } = earthMoon();
    const red = reduced(earth, moon);
    const n = 200;
    const dt = Float64Array.from({ length: n }, (_, i) => i * 3600 * 4);
    const states = new Float64Array(6 * n);
    const ok = propagateGrid(red.relative.r, red.relative.v, red.totalGm, dt, states);
    expect(ok.ok).toBe(true);
    const { body1, body2 } = bodyTracksAboutBarycentre(red, { epochsTT: dt, states });
    expect(body1.epochsTT).toBe(dt);
    for (let i = 0; i < 6 * n; i++) {
      expectClose(GM_EARTH * body1.states[i]! + GM_MOON * body2.states[i]!, 0, 1e-6 * GM_MOON, `moment ${i}`);
      expectClose(body2.states[i]! - body1.states[i]!, states[i]!, 1e-9 * EARTH_MOON_KM, `difference ${i}`);
    }
    // Earth stays on its small circle of radius a1 about the barycentre.
    for (let i = 0; i < n; i++) expectRelClose(Math.hypot(body1.states[6 * i]!, body1.states[6 * i + 1]!, body1.states[6 * i + 2]!), red.semiMajorAxes!.body1, 1e-12, `|r1| at ${i}`);
  });
});
