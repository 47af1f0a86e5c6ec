import { describe, expect, it } from 'vitest';
import { elementsToState } from '../../../src/solver/conic/elements.js';
import { brouwerRates, j2AnalyticPropagator, meanHamiltonian, meanToOsculating, osculatingToMean, type J2Elements } from '../../../src/solver/propagation/j2-analytic.js';
import { statesAt } from '../../../src/solver/propagation/propagator.js';
import { expectClose } from '../../helpers/approx.js';
import { DAY, DEG, earth, ECCENTRIC, EPOCH_TT, J2_ORBITS, startState, worstPositionDifference } from './j2-orbits.js';

const j2 = earth.j2!;
const R = earth.radius!;
const MU = earth.gm;
const analytic = (s: { r: readonly [number, number, number]; v: readonly [number, number, number] }, epochsTT: Float64Array) =>
  statesAt({ body: earth, model: 'j2-analytic', r0: s.r, v0: s.v, epochTT: EPOCH_TT }, epochsTT);
const numerical = (s: { r: readonly [number, number, number]; v: readonly [number, number, number] }, epochsTT: Float64Array) =>
  statesAt({ body: earth, model: 'numerical', forces: [{ kind: 'j2' }], r0: s.r, v0: s.v, epochTT: EPOCH_TT }, epochsTT);

describe('j2-analytic against the numerical model with J2 only (both about the Earth\'s intermediate pole at mid-span)', () => {
  // Limits of issue 11: first sample within 1 km (LEO) or 2 km (eccentric) of the given state; over
  // 7 days within 10 km of numerical J2 (LEO) or 50 km (eccentric). The model does far better (the
  // measured figures are in docs/accuracy.md); the second bound of each check is that measurement
  // with a margin, so a regression shows.
  const week = Float64Array.from({ length: 7 * 144 + 1 }, (_, k) => EPOCH_TT + k * 600);
  for (const [name, el] of Object.entries(J2_ORBITS)) {
    const eccentric = ECCENTRIC.has(name);
    it(`${name}: first sample at the given state, and within ${eccentric ? '50' : '10'} km of numerical J2 over 7 days`, () => {
      const s = startState(el);
      const got = analytic(s, week);
      const want = numerical(s, week);
      if (!got.ok || !want.ok) throw new Error(got.ok ? (want as { message: string }).message : got.message);
      const first = Math.hypot(got.value[0]! - s.r[0], got.value[1]! - s.r[1], got.value[2]! - s.r[2]);
      expect(first, 'first sample from the given state, km').toBeLessThan(eccentric ? 2 : 1);
      expect(first, 'first sample: the inversion reproduces the state').toBeLessThan(1e-6);
      const worst = worstPositionDifference(got.value, want.value);
      expect(worst, 'worst over 7 days, km').toBeLessThan(eccentric ? 50 : 10);
      expect(worst, 'worst over 7 days, km (measured, with margin)').toBeLessThan(eccentric ? 3 : 0.3);
    });
  }

  const hard: Array<[string, { a: number; e: number; i: number; raan: number; argp: number; nu: number }]> = [
    ['at the critical inclination 63.435 deg (where the long-period terms it leaves out are singular), e 0.72', { a: 26_554, e: 0.72, i: Math.acos(Math.sqrt(0.2)) / DEG, raan: 40, argp: 270, nu: 30 }],
    ['e 0.9, periapsis 1,620 km', { a: 80_000, e: 0.9, i: 30, raan: 10, argp: 30, nu: 0 }],
    ['e 0.94, periapsis 820 km', { a: 120_000, e: 0.94, i: 30, raan: 10, argp: 30, nu: 0 }],
  ];
  for (const [label, el] of hard) {
    it(`${label}: within 50 km of numerical J2 over 7 days`, () => {
      const s = startState(el);
      const got = analytic(s, week);
      const want = numerical(s, week);
      if (!got.ok || !want.ok) throw new Error('propagation failed');
      expect(worstPositionDifference(got.value, want.value)).toBeLessThan(50);
    });
  }
});

describe('j2-analytic pieces', () => {
  it('a circular equatorial orbit at the J2 circular speed keeps its radius within 0.1 km over a day (the second-order terms the theory leaves out: 51 m seen): v^2 = mu/r (1 + 3/2 J2 (R/r)^2) (the J2 pull in the equator plane, -mu/r^2 (1 + 3/2 J2 (R/r)^2); Vallado 4th ed. sec. 8.6.1 potential, from memory)', () => {
    const r = 7000;
    const v = Math.sqrt((MU / r) * (1 + 1.5 * j2 * (R / r) ** 2));
    const p = j2AnalyticPropagator(earth, [r, 0, 0], [0, v, 0], 0);
    if (!p.ok) throw new Error(p.message);
    for (let t = 0; t <= DAY; t += 300) {
      const s = p.value(t);
      if (!s.ok) throw new Error(s.message);
      expectClose(Math.hypot(...s.value.r), r, 0.1, `radius at ${t} s`);
    }
  });

  it('its mean -> osculating map and the inversion are each other\'s inverse to rounding, equatorial, circular and retrograde included', () => {
    const cases: J2Elements[] = [
      { a: 7000, e: 0, i: 0, raan: 0, argp: 0, meanAnomaly: 1 },
      { a: 7100, e: 0.02, i: 98 * DEG, raan: 2, argp: 1, meanAnomaly: 4 },
      { a: 26_000, e: 0.7, i: 63.4 * DEG, raan: 4, argp: 4.7, meanAnomaly: 0.1 },
      { a: 42_164, e: 0.0002, i: 179.99 * DEG, raan: 1, argp: 2, meanAnomaly: 3 },
    ];
    for (const m of cases) {
      const o = meanToOsculating(m, j2, R);
      if (!o.ok) throw new Error(o.message);
      const back = osculatingToMean(o.value, j2, R);
      if (!back.ok) throw new Error(back.message);
      const b = back.value;
      expectClose(b.a, m.a, 1e-9 * m.a, 'a');
      expectClose(b.e * Math.cos(b.argp + b.raan), m.e * Math.cos(m.argp + m.raan), 1e-12, 'k');
      expectClose(Math.cos(b.i), Math.cos(m.i), 1e-12, 'cos i');
      expectClose(Math.sin(b.meanAnomaly + b.argp + b.raan - m.meanAnomaly - m.argp - m.raan), 0, 1e-12, 'mean longitude');
    }
  });

  it('Brouwer\'s secular rates are the derivatives of the mean Hamiltonian in the Delaunay momenta L = sqrt(mu a), G = L eta, H = G cos i (Hamilton\'s equations; Brouwer 1959)', () => {
    for (const [a, e, i] of [[7000, 0.01, 51.6], [26_554, 0.74, 63.4], [24_396, 0.73, 27], [7378, 0.01, 0.5], [7078, 0.01, 98.2]] as const) {
      const L = Math.sqrt(MU * a);
      const G = L * Math.sqrt(1 - e * e);
      const H = G * Math.cos(i * DEG);
      const K = (l: number, g: number, h: number) => meanHamiltonian(l * l / MU, Math.sqrt(Math.max(0, 1 - (g / l) ** 2)), Math.acos(h / g), MU, j2, R);
      const d = 1e-6;
      const rates = brouwerRates({ a, e, i: i * DEG, raan: 0, argp: 0, meanAnomaly: 0 }, MU, j2, R);
      const n = Math.sqrt(MU / a ** 3);
      expectClose((K(L * (1 + d), G, H) - K(L * (1 - d), G, H)) / (2 * d * L), rates.meanAnomaly, 1e-9 * n, `dK/dL at a ${a}`);
      expectClose((K(L, G * (1 + d), H) - K(L, G * (1 - d), H)) / (2 * d * G), rates.argp, 1e-9 * n, `dK/dG at a ${a}`);
      const dh = d * G;
      expectClose((K(L, G, H + dh) - K(L, G, H - dh)) / (2 * dh), rates.raan, 1e-9 * n, `dK/dH at a ${a}`);
    }
  });

  it('refuses, with invalid-parameter and a reason, what the theory does not cover', () => {
    const cases: Array<[string, { r: [number, number, number]; v: [number, number, number] }, RegExp]> = [
      ['hyperbola', { r: [7000, 0, 0], v: [0, 12, 0] }, /bound/],
      ['e = 0.97', (() => { const s = elementsToState({ semiMajorAxis: 300_000, eccentricity: 0.97, inclination: 0.5, raan: 0, argPeriapsis: 0, trueAnomaly: 0 }, MU); if (!s.ok) throw new Error(s.message); return { r: [...s.value.r] as [number, number, number], v: [...s.value.v] as [number, number, number] }; })(), /eccentricit/],
    ];
    for (const [label, s, why] of cases) {
      const p = j2AnalyticPropagator(earth, s.r, s.v, 0);
      expect(p.ok, label).toBe(false);
      if (!p.ok) { expect(p.code).toBe('invalid-parameter'); expect(p.message).toMatch(why); }
    }
    const noJ2 = j2AnalyticPropagator({ name: 'point-mass', gm: MU, radius: R, sources: {} }, [7000, 0, 0], [0, 7.5, 0], 0);
    expect(noJ2.ok).toBe(false);
    if (!noJ2.ok) expect(noJ2.message).toMatch(/j2/);
  });
});
