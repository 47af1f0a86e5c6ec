import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { analyseCentralForce, fromInitial, type CentralForceProblem } from '../../../src/solver/central/radial.js';
import { radialTrack } from '../../../src/solver/central/radial-track.js';
import { effectivePotential, type PotentialTerm } from '../../../src/solver/central/potential.js';
import type { Outcome } from '../../../src/solver/core/result.js';
import { expectClose, expectRelClose } from '../../helpers/approx.js';

function ok<T>(r: Outcome<T>): T {
  if (!r.ok) throw new Error(`${r.code}: ${r.message}`);
  return r.value;
}

const kepler: PotentialTerm[] = [{ kind: 'power', coefficient: -1, exponent: -1 }];

/** Kepler's equation M = E - e sin E by Newton iteration (Vallado, Fundamentals of Astrodynamics, 4th ed., Alg. 2). */
function eccentricAnomaly(M: number, e: number): number {
  let E = M + e * Math.sin(M);
  for (let i = 0; i < 50; i++) {
    const dE = (E - e * Math.sin(E) - M) / (1 - e * Math.cos(E));
    E -= dE;
    if (Math.abs(dE) < 1e-15) break;
  }
  return E;
}

describe('radialTrack(problem, analysis, request)', () => {
  const [m, k, a, e] = [1, 1, 1, 0.6];
  const problem: CentralForceProblem = { mass: m, terms: kepler, energy: -k / (2 * a), angularMomentum: Math.sqrt(m * k * a * (1 - e * e)) };
  const analysis = ok(analyseCentralForce(problem));

  it('follows the Kepler solution r = a (1 - e cos E), phi = true anomaly from periapsis over three orbits (Vallado 4th ed. sec. 2.2 — from memory)', () => {
    const track = ok(radialTrack(problem, analysis, { periods: 3, samples: 301 }));
    const n = Math.sqrt(k / (m * a ** 3)); // mean motion
    track.t.forEach((t, i) => {
      const E = eccentricAnomaly(n * t, e);
      const r = a * (1 - e * Math.cos(E));
      // Unwrapped true anomaly: 2 atan(sqrt((1+e)/(1-e)) tan(E/2)) plus whole turns.
      const turns = Math.round(E / (2 * Math.PI));
      const nu = 2 * Math.atan(Math.sqrt((1 + e) / (1 - e)) * Math.tan((E - turns * 2 * Math.PI) / 2)) + turns * 2 * Math.PI;
      expectClose(track.r[i]!, r, 1e-11, `r(${t})`);
      expectClose(track.phi[i]!, nu, 1e-9, `phi(${t})`);
    });
  });

  it('conserves energy to the integration tolerance; l is carried exactly', () => {
    const track = ok(radialTrack(problem, analysis, { periods: 20, samples: 201 }));
    expect(track.energyDriftRelative).toBeLessThan(1e-11);
    expectRelClose(track.energy, problem.energy, 1e-14, 'start energy');
    for (let i = 0; i < track.t.length; i++) {
      const eNow = (m * track.rDot[i]! ** 2) / 2 + effectivePotential({ terms: kepler, mass: m, angularMomentum: problem.angularMomentum }, track.r[i]!).value;
      expectRelClose(eNow, problem.energy, 5e-11, `E(${track.t[i]})`); // measured: 1.2e-11 after 20 orbits at relTol 1e-13
    }
    expect(track.angularMomentumDrift).toBe(0);
  });

  it('reaches the analytic turning points: apoapsis at T/2, periapsis at T, in a Yukawa potential; phi(T) = 2 x apsidal angle', () => {
    const p: CentralForceProblem = { mass: 1.3, terms: [{ kind: 'yukawa', coefficient: 2, range: 3 }], angularMomentum: 1.1, energy: -0.3 };
    const v = ok(analyseCentralForce(p));
    expect(v.motion).toBe('bound');
    const track = ok(radialTrack(p, v, { periods: 1, samples: 3 }));
    expectRelClose(track.r[0]!, v.periapsis!, 1e-15, 'start at periapsis');
    expectRelClose(track.r[1]!, v.apoapsis!, 1e-10, 'apoapsis at T/2');
    expectRelClose(track.r[2]!, v.periapsis!, 1e-10, 'periapsis at T');
    expectClose(track.rDot[1]!, 0, 1e-9, 'rdot at apoapsis');
    // Two independent methods: ODE integration of phi' = l/(m r^2) against the quadrature.
    expectRelClose(track.phi[2]!, 2 * v.apsidalAngle!, 1e-10, 'phi after one radial period');
    expectRelClose(track.phi[1]!, v.apsidalAngle!, 1e-10, 'phi at apoapsis');
  });

  it('track and quadrature agree on the period and apsidal angle for random bound problems (fast-check)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.5, max: 5, noNaN: true }),
        fc.double({ min: 0.2, max: 2, noNaN: true }),
        fc.double({ min: 0.05, max: 0.9, noNaN: true }),
        (range, l, depthFraction) => {
          // Kepler plus an exponential well: bound orbits between the circular-orbit energy and 0.
          const terms: PotentialTerm[] = [{ kind: 'power', coefficient: -1, exponent: -1 }, { kind: 'exponential', depth: 0.5, range }];
          const probe = ok(analyseCentralForce({ mass: 1, terms, angularMomentum: l, energy: 10 }));
          const min = Math.min(...probe.circularOrbits.filter((c) => c.stable).map((c) => c.energy));
          const p = { mass: 1, terms, angularMomentum: l, energy: min * (1 - depthFraction) };
          const v = ok(analyseCentralForce(p));
          if (v.motion !== 'bound') return;
          const track = ok(radialTrack(p, v, { periods: 1, samples: 2 }));
          expectRelClose(track.r[1]!, v.periapsis!, 1e-9, 'back at periapsis after T');
          expectRelClose(track.phi[1]!, 2 * v.apsidalAngle!, 1e-9, 'phi(T)');
        },
      ),
      { numRuns: 25 },
    );
  });

  it('runs backward in time symmetrically: r(-t) = r(t), phi(-t) = -phi(t) from periapsis', () => {
    const forward = ok(radialTrack(problem, analysis, { duration: 4, samples: 41 }));
    const backward = ok(radialTrack(problem, analysis, { duration: -4, samples: 41 }));
    backward.t.forEach((t, i) => {
      expectClose(t, -forward.t[i]!, 1e-15, 't');
      expectClose(backward.r[i]!, forward.r[i]!, 1e-11, `r(${t})`);
      expectClose(backward.phi[i]!, -forward.phi[i]!, 1e-10, `phi(${t})`);
    });
  });

  it('starts from the initial state when the problem has one', () => {
    const p = ok(fromInitial(1, kepler, { radius: 1.2, radialVelocity: 0.3, tangentialVelocity: 0.8 }));
    const v = ok(analyseCentralForce(p));
    const track = ok(radialTrack(p, v, { duration: 1, samples: 11 }));
    expect(track.r[0]).toBe(1.2);
    expect(track.rDot[0]).toBe(0.3);
    expect(track.r[1]!).toBeGreaterThan(1.2);
    const apo = ok(radialTrack(p, v, { start: 'apoapsis', duration: 1, samples: 2 }));
    expectRelClose(apo.r[0]!, v.apoapsis!, 1e-15, 'apoapsis start');
  });

  it('stops at the centre for captured motion and says so', () => {
    const p: CentralForceProblem = { mass: 1, terms: [{ kind: 'power', coefficient: -1, exponent: -3 }], angularMomentum: 0.5, energy: -1 };
    const v = ok(analyseCentralForce(p));
    expect(v.motion).toBe('captured');
    const track = ok(radialTrack(p, v, { duration: 10, samples: 101 }));
    expect(track.reachedCentre).toBe(true);
    expect(track.t.length).toBeLessThan(101);
    expect(Math.min(...track.r)).toBeGreaterThan(0);
  });

  it('refuses periods for unbound motion (no-radial-period) and bad requests (invalid-parameter)', () => {
    const p: CentralForceProblem = { mass: 1, terms: kepler, angularMomentum: 1, energy: 0.5 };
    const v = ok(analyseCentralForce(p));
    const r = radialTrack(p, v, { periods: 1, samples: 10 });
    expect(!r.ok && r.code).toBe('no-radial-period');
    expect(ok(radialTrack(p, v, { duration: 5, samples: 10 })).r.at(-1)!).toBeGreaterThan(1);
    for (const req of [{ samples: 10 }, { duration: 1, periods: 1, samples: 10 }, { duration: 1, samples: 1 }, { duration: 0, samples: 5 }, { duration: 1, samples: 5, relTol: 1 }]) {
      const x = radialTrack(problem, analysis, req);
      expect(!x.ok && x.code, JSON.stringify(req)).toBe('invalid-parameter');
    }
  });

  it('passes the integrator step limit on as integration-failed', () => {
    const r = radialTrack(problem, analysis, { periods: 50, samples: 10, maxSteps: 30 });
    expect(!r.ok && r.code).toBe('integration-failed');
  });
});
