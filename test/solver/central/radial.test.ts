import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { analyseCentralForce, fromInitial, type CentralForceAnalysis } from '../../../src/solver/central/radial.js';
import type { PotentialTerm } from '../../../src/solver/central/potential.js';
import type { Outcome } from '../../../src/solver/core/result.js';
import { expectClose, expectRelClose } from '../../helpers/approx.js';

function ok<T>(r: Outcome<T>): T {
  if (!r.ok) throw new Error(`${r.code}: ${r.message}`);
  return r.value;
}

const kepler = (k: number): PotentialTerm[] => [{ kind: 'power', coefficient: -k, exponent: -1 }];

/** Kepler problem from a, e: E = -k/(2a), l^2 = m k a (1 - e^2) (Goldstein 3rd ed. eqs. 3.61-3.62 region, sec. 3.7 — from memory). */
function keplerProblem(m: number, k: number, a: number, e: number) {
  return { mass: m, terms: kepler(k), energy: -k / (2 * a), angularMomentum: Math.sqrt(m * k * a * (1 - e * e)) };
}

describe('analyseCentralForce: Kepler potential U = -k/r', () => {
  it('turning points a(1 - e), a(1 + e); radial period 2 pi sqrt(m a^3 / k); apsidal angle pi (Goldstein 3rd ed. secs. 3.6-3.7, Bertrand\'s theorem — from memory)', () => {
    const [m, k, a] = [2.5, 7, 3];
    for (const e of [0.001, 0.1, 0.5, 0.9, 0.99]) {
      const v = ok(analyseCentralForce(keplerProblem(m, k, a, e)));
      expect(v.motion).toBe('bound');
      expect(v.turningPoints.length).toBe(2);
      // A turning point is as well conditioned as |dU_eff/dr| there allows: about 1e-16/e relative (a few times that measured).
      const rootTol = Math.max(3e-14, 1e-15 / e);
      expectRelClose(v.periapsis!, a * (1 - e), rootTol, `periapsis e=${e}`);
      expectRelClose(v.apoapsis!, a * (1 + e), rootTol, `apoapsis e=${e}`);
      expectRelClose(v.radialPeriod!, 2 * Math.PI * Math.sqrt((m * a ** 3) / k), 1e-12, `period e=${e}`);
      expectRelClose(v.apsidalAngle!, Math.PI, 1e-12, `apsidal angle e=${e}`);
      expectClose(v.precessionPerOrbit!, 0, 1e-11, `precession e=${e}`);
    }
  });

  it('holds for random mass, strength, size and eccentricity (fast-check)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1e-3, max: 1e3, noNaN: true }),
        fc.double({ min: 1e-2, max: 1e6, noNaN: true }),
        fc.double({ min: 1e-2, max: 1e4, noNaN: true }),
        fc.double({ min: 1e-3, max: 0.98, noNaN: true }),
        (m, k, a, e) => {
          const v = ok(analyseCentralForce(keplerProblem(m, k, a, e)));
          expectRelClose(v.radialPeriod!, 2 * Math.PI * Math.sqrt((m * a ** 3) / k), 1e-11, 'period');
          expectRelClose(v.apsidalAngle!, Math.PI, 1e-11, 'apsidal angle');
          expectRelClose(v.periapsis!, a * (1 - e), Math.max(3e-14, 1e-15 / e), 'periapsis');
        },
      ),
      { numRuns: 60 },
    );
  });

  it('stays accurate for nearly circular orbits (measured: e = 1e-4 to 1e-11, e = 1e-5 to 1e-10)', () => {
    for (const [e, tol] of [[1e-3, 1e-12], [1e-4, 1e-11], [1e-5, 1e-10]] as const) {
      const v = ok(analyseCentralForce(keplerProblem(1, 1, 1, e)));
      expect(v.motion).toBe('bound');
      expectRelClose(v.radialPeriod!, 2 * Math.PI, tol, `period e=${e}`);
      expectRelClose(v.apsidalAngle!, Math.PI, tol, `apsidal e=${e}`);
    }
  });

  it('stays accurate for very eccentric orbits, r2/r1 up to 2e9 (e = 1 - 1e-9; end-clustered quadrature)', () => {
    for (const e of [0.999, 0.99999, 1 - 1e-7, 1 - 1e-9]) {
      const v = ok(analyseCentralForce(keplerProblem(1, 1, 1, e)));
      expectRelClose(v.radialPeriod!, 2 * Math.PI, 1e-12, `period e=${e}`);
      expectRelClose(v.apsidalAngle!, Math.PI, 1e-12, `apsidal e=${e}`);
    }
  });

  it('hyperbolic energy: unbound, periapsis p/(1 + e), no period (Goldstein 3rd ed. eq. 3.55 — from memory)', () => {
    const [m, k, l, E] = [1, 1, 1, 0.5];
    const e = Math.sqrt(1 + (2 * E * l * l) / (m * k * k));
    const v = ok(analyseCentralForce({ mass: m, terms: kepler(k), angularMomentum: l, energy: E }));
    expect(v.motion).toBe('unbound');
    expectRelClose(v.periapsis!, (l * l) / (m * k) / (1 + e), 1e-14, 'periapsis');
    expect(v.apoapsis).toBeNull();
    expect(v.radialPeriod).toBeNull();
    expect(v.apsidalAngle).toBeNull();
  });

  it('parabolic energy E = 0 escapes (unbound) with periapsis p/2', () => {
    const v = ok(analyseCentralForce({ mass: 1, terms: kepler(1), angularMomentum: 1, energy: 0 }));
    expect(v.motion).toBe('unbound');
    expectRelClose(v.periapsis!, 0.5, 1e-14, 'periapsis');
  });

  it('one stable circular orbit at r = l^2/(m k) with E = -m k^2/(2 l^2) and frequency ratio 1', () => {
    const [m, k, l] = [2, 3, 1.5];
    const v = ok(analyseCentralForce({ mass: m, terms: kepler(k), angularMomentum: l, energy: -0.1 }));
    expect(v.circularOrbits.length).toBe(1);
    const c = v.circularOrbits[0]!;
    expect(c.stable).toBe(true);
    expectRelClose(c.radius, (l * l) / (m * k), 1e-14, 'circular radius');
    expectRelClose(c.energy, -(m * k * k) / (2 * l * l), 1e-14, 'circular energy');
    expectRelClose(c.frequencyRatio!, 1, 1e-12, 'omega_r / omega_phi');
  });

  it('fails with energy-below-minimum below the circular-orbit energy', () => {
    const r = analyseCentralForce({ mass: 1, terms: kepler(1), angularMomentum: 1, energy: -0.6 });
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.code).toBe('energy-below-minimum');
  });

  it('l = 0 is rectilinear: falls to the centre from r = k/|E|, no apsidal angle', () => {
    const v = ok(analyseCentralForce({ mass: 1, terms: kepler(2), angularMomentum: 0, energy: -0.5 }));
    expect(v.rectilinear).toBe(true);
    expect(v.motion).toBe('captured');
    expect(v.periapsis).toBeNull();
    expectRelClose(v.apoapsis!, 4, 1e-14, 'apoapsis');
    expect(v.apsidalAngle).toBeNull();
    expect(v.precessionPerOrbit).toBeNull();
  });
});

describe('analyseCentralForce: other potentials', () => {
  it('isotropic harmonic U = k r^2/2: apsidal angle pi/2, radial period pi sqrt(m/k), turning points from the quadratic in r^2 (Goldstein 3rd ed. sec. 3.6 — from memory)', () => {
    const [m, k, l, E] = [2, 3, 0.7, 3];
    const v = ok(analyseCentralForce({ mass: m, terms: [{ kind: 'power', coefficient: k / 2, exponent: 2 }], angularMomentum: l, energy: E }));
    // E = k r^2/2 + l^2/(2 m r^2)  =>  r^2 = (E -+ sqrt(E^2 - k l^2/m)) / k.
    const root = Math.sqrt(E * E - (k * l * l) / m);
    expectRelClose(v.periapsis!, Math.sqrt((E - root) / k), 1e-13, 'periapsis');
    expectRelClose(v.apoapsis!, Math.sqrt((E + root) / k), 1e-13, 'apoapsis');
    expectRelClose(v.apsidalAngle!, Math.PI / 2, 1e-12, 'apsidal angle');
    expectRelClose(v.radialPeriod!, Math.PI * Math.sqrt(m / k), 1e-12, 'radial period');
    expectRelClose(v.precessionPerOrbit!, -Math.PI, 1e-12, 'precession');
  });

  it('near-circular orbits in a force F ~ r^n have apsidal angle pi / sqrt(n + 3) (Goldstein 3rd ed. sec. 3.6; Taylor, Classical Mechanics, ch. 8 — from memory)', () => {
    for (const n of [-2.5, -1.5, -0.5, 0, 1, 3]) {
      // U = c r^(n+1), attractive (c (n+1) > 0).
      const c = n + 1 > 0 ? 1 : -1;
      const terms: PotentialTerm[] = [{ kind: 'power', coefficient: c, exponent: n + 1 }];
      const probe = ok(analyseCentralForce({ mass: 1, terms, angularMomentum: 1, energy: 1000 }));
      const circ = probe.circularOrbits.find((o) => o.stable);
      expect(circ, `n = ${n}`).toBeDefined();
      const expected = Math.PI / Math.sqrt(n + 3);
      expectRelClose(circ!.apsidalAngle!, expected, 1e-12, `circular-limit apsidal angle n=${n}`);
      // A slightly eccentric orbit (E a 1e-6 fraction above the minimum) gives the same angle to O(1e-6).
      const near = ok(analyseCentralForce({ mass: 1, terms, angularMomentum: 1, energy: circ!.energy + 1e-6 * Math.abs(circ!.energy) }));
      expect(near.motion).toBe('bound');
      expectRelClose(near.apsidalAngle!, expected, 2e-5, `near-circular apsidal angle n=${n}`);
    }
  });

  it('U = -k/r + beta/r^2 gives a precessing ellipse with apsidal angle exactly pi l / sqrt(l^2 + 2 m beta) (Landau & Lifshitz, Mechanics, 3rd ed., sec. 15, problem 3 — from memory)', () => {
    const [m, k, l] = [1.3, 2, 0.9];
    // beta chosen for a precession of about -1e-7 of a turn per orbit.
    const beta = 1e-7 * l * l / m;
    const terms: PotentialTerm[] = [{ kind: 'power', coefficient: -k, exponent: -1 }, { kind: 'power', coefficient: beta, exponent: -2 }];
    for (const E of [-0.9, -0.5, -0.05]) {
      const v = ok(analyseCentralForce({ mass: m, terms, angularMomentum: l, energy: E }));
      const apsidal = (Math.PI * l) / Math.sqrt(l * l + 2 * m * beta);
      expectRelClose(v.apsidalAngle!, apsidal, 1e-13, `apsidal angle E=${E}`);
      // Precession 2 apsidal - 2 pi, about -6.3e-7 rad: three significant digits asked, 1e-5 held.
      const precession = (-2 * Math.PI * (2 * m * beta)) / (l * l + 2 * m * beta + l * Math.sqrt(l * l + 2 * m * beta));
      expectRelClose(v.precessionPerOrbit!, precession, 1e-5, `precession E=${E}`);
    }
  });

  it('relativistic correction U = -GMm/r - GM l^2/(c^2 m r^3): Mercury\'s perihelion advances 6 pi GM/(c^2 a (1 - e^2)) per orbit, about 43 arcsec per century (Misner, Thorne & Wheeler, Gravitation, sec. 40.5 — from memory)', () => {
    // GM_sun, AU (IAU 2012 Resolution B2), Mercury's a and e — from memory.
    const GM = 1.32712440018e20; // m^3/s^2
    const AU = 149_597_870_700; // m
    const a = 0.38709927 * AU;
    const e = 0.20563593;
    const c = 299_792_458; // m/s, exact by definition of the metre
    const m = 1;
    const [r1, r2] = [a * (1 - e), a * (1 + e)];
    // U_eff = -GMm/r + l^2 [1/(2 m r^2) - GM/(c^2 m r^3)] is linear in E and l^2: choose both so r1, r2 are the turning points.
    const A = (r: number): number => 1 / (2 * m * r * r) - GM / (c * c * m * r ** 3);
    const l2 = (GM * m * (1 / r1 - 1 / r2)) / (A(r1) - A(r2));
    const E = (-GM * m) / r1 + l2 * A(r1);
    const l = Math.sqrt(l2);
    const terms: PotentialTerm[] = [
      { kind: 'power', coefficient: -GM * m, exponent: -1 },
      { kind: 'power', coefficient: (-GM * l2) / (c * c * m), exponent: -3 },
    ];
    const v = ok(analyseCentralForce({ mass: m, terms, angularMomentum: l, energy: E }));
    expect(v.motion).toBe('bound');
    expectRelClose(v.periapsis!, r1, 1e-13, 'perihelion');
    expectRelClose(v.apoapsis!, r2, 1e-13, 'aphelion');
    const perOrbit = (6 * Math.PI * GM) / (c * c * a * (1 - e * e));
    expectRelClose(v.precessionPerOrbit!, perOrbit, 1e-3, 'precession per orbit (three significant digits)');
    expectRelClose(v.precessionPerOrbit!, perOrbit, 1e-6, 'precession per orbit (held to 1e-6)');
    const arcsecPerCentury = ((v.precessionPerOrbit! * (36_525 * 86_400)) / v.radialPeriod!) * (180 / Math.PI) * 3600;
    expectClose(arcsecPerCentury, 43.0, 0.05, 'arcsec per century');
    expectRelClose(v.radialPeriod! / 86_400, 87.969, 1e-4, 'orbital period, days (Mercury, from memory)');
    // The r^-3 term also opens a capture region near the centre, behind an unstable circular orbit.
    expect(v.allowedRegions.map((g) => g.motion)).toEqual(['captured', 'bound']);
    expect(v.circularOrbits.map((o) => o.stable)).toEqual([false, true]);
  });

  it('Gaussian well with l = 0: small oscillations at sqrt(V0 / (m s^2)) about its centre', () => {
    const [V0, s, r0, m] = [2, 0.5, 10, 3];
    const v = ok(analyseCentralForce({ mass: m, terms: [{ kind: 'gaussian', depth: V0, center: r0, width: s }], angularMomentum: 0, energy: -V0 * (1 - 1e-8) }));
    expect(v.rectilinear).toBe(true);
    const c = v.circularOrbits.find((o) => o.stable)!;
    expectRelClose(c.radius, r0, 1e-14, 'equilibrium radius');
    // U = -V0 (1 - x^2/(2 s^2) + ...): U'' = V0 / s^2 (Taylor expansion).
    expectRelClose(c.radialFrequency!, Math.sqrt(V0 / (m * s * s)), 1e-12, 'small-oscillation frequency');
    expectRelClose(v.radialPeriod!, (2 * Math.PI) / Math.sqrt(V0 / (m * s * s)), 1e-7, 'period of a small oscillation');
    expect(v.apsidalAngle).toBeNull();
  });

  it('E exactly at the top of a barrier: the region ends at the unstable circular orbit and has no finite period', () => {
    const terms: PotentialTerm[] = [
      { kind: 'power', coefficient: -1, exponent: -1 },
      { kind: 'power', coefficient: -0.05, exponent: -3 },
      { kind: 'power', coefficient: 0.5, exponent: 2 },
    ];
    const probe = ok(analyseCentralForce({ mass: 1, terms, angularMomentum: 1, energy: 0 }));
    const top = probe.circularOrbits.find((o) => !o.stable)!;
    const v = ok(analyseCentralForce({ mass: 1, terms, angularMomentum: 1, energy: top.energy }));
    const region = v.allowedRegions[v.regionIndex]!;
    expect(region.innerEnd).toBe('unstable-circular-orbit');
    expect(v.radialPeriod).toBeNull();
    // Just below the top the period is finite and grows like log(1/dE) (Landau & Lifshitz sec. 11 — from memory).
    const periods = [1e-6, 1e-8].map((dE) => ok(analyseCentralForce({ mass: 1, terms, angularMomentum: 1, energy: top.energy - dE })).radialPeriod!);
    expect(periods[1]).toBeGreaterThan(periods[0]!);
  });
});

describe('fromInitial and the choice of region', () => {
  it('fromInitial gives l = m r v_t and E = m v^2/2 + U(r)', () => {
    const p = ok(fromInitial(2, kepler(3), { radius: 1.5, radialVelocity: 0.4, tangentialVelocity: -0.9 }));
    expectRelClose(p.angularMomentum, 2 * 1.5 * -0.9, 1e-15, 'l');
    expectRelClose(p.energy, (2 * (0.16 + 0.81)) / 2 - 3 / 1.5, 1e-15, 'E');
  });

  it('circular speed sqrt(k/(m r)) gives circular motion with period 2 pi sqrt(m r^3 / k)', () => {
    const [m, k, r] = [1.5, 4, 2.5];
    const p = ok(fromInitial(m, kepler(k), { radius: r, radialVelocity: 0, tangentialVelocity: Math.sqrt(k / (m * r)) }));
    const v = ok(analyseCentralForce(p));
    expect(v.motion).toBe('circular');
    expectRelClose(v.periapsis!, r, 1e-12, 'radius');
    expectRelClose(v.radialPeriod!, 2 * Math.PI * Math.sqrt((m * r ** 3) / k), 1e-12, 'period');
    expectRelClose(v.apsidalAngle!, Math.PI, 1e-12, 'apsidal angle');
  });

  it('picks the region holding the initial radius; without one, the outermost', () => {
    const terms: PotentialTerm[] = [{ kind: 'power', coefficient: -1, exponent: -1 }, { kind: 'power', coefficient: -0.05, exponent: -3 }];
    const inner = ok(fromInitial(1, terms, { radius: 0.1, radialVelocity: -1, tangentialVelocity: 4 }));
    const outer = ok(fromInitial(1, terms, { radius: 1, radialVelocity: 0.1, tangentialVelocity: 1 }));
    const a = ok(analyseCentralForce(inner));
    expect(a.motion).toBe('captured');
    const b = ok(analyseCentralForce(outer));
    expect(b.motion).toBe('bound');
    const c = ok(analyseCentralForce({ ...outer, initial: undefined }));
    expect(c.regionIndex).toBe(c.allowedRegions.length - 1);
  });

  it('refuses non-positive mass, non-finite numbers, no terms and bad options with invalid-parameter', () => {
    const base = keplerProblem(1, 1, 1, 0.5);
    const cases: Outcome<CentralForceAnalysis>[] = [
      analyseCentralForce({ ...base, mass: 0 }),
      analyseCentralForce({ ...base, mass: -1 }),
      analyseCentralForce({ ...base, energy: Number.NaN }),
      analyseCentralForce({ ...base, angularMomentum: Infinity }),
      analyseCentralForce({ ...base, terms: [] }),
      analyseCentralForce(base, { samples: 1 }),
      analyseCentralForce(base, { samples: 10_001 }),
      analyseCentralForce(base, { rMin: 2, rMax: 1 }),
    ];
    for (const r of cases) expect(!r.ok && r.code).toBe('invalid-parameter');
    expect(fromInitial(1, kepler(1), { radius: 0, radialVelocity: 0, tangentialVelocity: 1 }).ok).toBe(false);
  });
});

describe('effective-potential samples', () => {
  it('default 400 samples around the turning points, with U_eff - U = l^2/(2 m r^2)', () => {
    const p = keplerProblem(2, 1, 1, 0.3);
    const v = ok(analyseCentralForce(p));
    expect(v.effectivePotential.length).toBe(400);
    const first = v.effectivePotential[0]!;
    const last = v.effectivePotential.at(-1)!;
    expect(first.r).toBeLessThan(v.periapsis!);
    expect(last.r).toBeGreaterThan(v.apoapsis!);
    for (const s of v.effectivePotential) {
      expectRelClose(s.u, -1 / s.r, 1e-15, 'U');
      expectRelClose(s.uEff - s.u, p.angularMomentum ** 2 / (2 * p.mass * s.r * s.r), 1e-12, 'centrifugal part');
    }
  });

  it('honours samples, rMin and rMax, and spaces logarithmically over a wide range', () => {
    const v = ok(analyseCentralForce(keplerProblem(1, 1, 1, 0.5), { samples: 50, rMin: 0.01, rMax: 100 }));
    expect(v.effectivePotential.length).toBe(50);
    expect(v.effectivePotential[0]!.r).toBe(0.01);
    expect(v.effectivePotential.at(-1)!.r).toBe(100);
    expect(v.sampleSpacing).toBe('log');
    expectRelClose(v.effectivePotential[1]!.r / v.effectivePotential[0]!.r, 10 ** (4 / 49), 1e-12, 'log step');
  });
});
