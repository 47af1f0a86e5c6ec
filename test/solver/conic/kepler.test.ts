import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  eccentricFromTrue,
  hyperbolicFromTrue,
  meanFromEccentric,
  meanFromHyperbolic,
  meanFromParabolic,
  parabolicFromTrue,
  solveBarker,
  solveKeplerElliptic,
  solveKeplerHyperbolic,
  trueFromEccentric,
  trueFromHyperbolic,
  trueFromParabolic,
} from '../../../src/solver/conic/kepler.js';
import { DEG, TWO_PI } from '../../../src/solver/core/math.js';
import { expectClose, expectRelClose } from '../../helpers/approx.js';

const ok = <T>(r: { ok: true; value: T } | { ok: false; code: string; message: string }): T => {
  if (!r.ok) throw new Error(`${r.code}: ${r.message}`);
  return r.value;
};

describe('solveKeplerElliptic(M, e)', () => {
  it('gives E = 220.512074767522 deg for M = 235.4 deg, e = 0.4 (Vallado, Fundamentals of Astrodynamics and Applications, 4th ed., Example 2-1, from memory)', () => {
    expectClose(ok(solveKeplerElliptic(235.4 * DEG, 0.4)) / DEG, 220.512_074_767_522, 1e-10, 'E deg');
  });

  it('gives E = 1.7281 rad, M = 1.3601 rad, t = 4077 s at nu = 120 deg on a 9600 x 21000 km radius orbit (Curtis, Orbital Mechanics for Engineering Students, 3rd ed., Example 3.1, from memory)', () => {
    const mu = 398_600; // Curtis's value
    const [rp, ra] = [9_600, 21_000];
    const e = (ra - rp) / (ra + rp);
    const a = (ra + rp) / 2;
    const E = eccentricFromTrue(120 * DEG, e);
    expectClose(E, 1.7281, 5e-5, 'E');
    const M = meanFromEccentric(E, e);
    expectClose(M, 1.3601, 5e-5, 'M');
    expectClose(M / Math.sqrt(mu / a ** 3), 4077, 0.5, 't s');
  });

  it('gives M = 3.6029 rad, E = 3.4794 rad, nu = 193.2 deg three hours after perigee on the same orbit (Curtis 3rd ed., Example 3.2, from memory)', () => {
    const mu = 398_600;
    const e = (21_000 - 9_600) / 30_600;
    const M = 10_800 * Math.sqrt(mu / 15_300 ** 3);
    expectClose(M, 3.6029, 5e-5, 'M');
    const E = ok(solveKeplerElliptic(M, e));
    expectClose(E, 3.4794, 5e-5, 'E');
    expectClose(trueFromEccentric(E, e) / DEG, 193.2, 0.05, 'nu deg');
  });

  it('converges for e up to 0.9999 and any M: E - e sin E gives M back (property)', () => {
    fc.assert(fc.property(fc.double({ min: 0, max: 0.9999, noNaN: true }), fc.double({ min: -50, max: 50, noNaN: true }), (e, M) => {
      const E = ok(solveKeplerElliptic(M, e));
      // Plain Kepler's equation as the independent check; its own rounding is ~1e-16 |E|.
      return Math.abs(E - e * Math.sin(E) - M) <= 4e-16 * (Math.abs(E) + 4);
    }), { numRuns: 3000 });
  });

  it('keeps relative precision for tiny M near e = 1 (M recomputed to 1e-14 relative)', () => {
    fc.assert(fc.property(fc.double({ min: 0.9, max: 0.9999, noNaN: true }), fc.double({ min: 1e-12, max: 1e-3, noNaN: true }), (e, M) => {
      const E = ok(solveKeplerElliptic(M, e));
      return Math.abs(meanFromEccentric(E, e) - M) <= 1e-14 * M;
    }), { numRuns: 2000 });
  });

  it('keeps whole turns: M + 2 pi k gives E + 2 pi k', () => {
    const E0 = ok(solveKeplerElliptic(1, 0.5));
    expectClose(ok(solveKeplerElliptic(1 + 3 * TWO_PI, 0.5)), E0 + 3 * TWO_PI, 1e-13, 'E + 3 turns');
    expectClose(ok(solveKeplerElliptic(1 - 2 * TWO_PI, 0.5)), E0 - 2 * TWO_PI, 1e-13, 'E - 2 turns');
  });

  it('handles the edges: e = 0, M = 0, M = pi, e just below 1', () => {
    expect(ok(solveKeplerElliptic(0.3, 0))).toBe(0.3);
    expect(ok(solveKeplerElliptic(0, 0.9))).toBe(0);
    expectClose(ok(solveKeplerElliptic(Math.PI, 0.9999)), Math.PI, 1e-15, 'E at pi');
    const E = ok(solveKeplerElliptic(1e-9, 1 - 1e-12));
    expectRelClose(meanFromEccentric(E, 1 - 1e-12), 1e-9, 1e-13, 'M back');
  });

  it('refuses e outside [0, 1) and a non-finite M', () => {
    for (const e of [1, 1.2, -0.1, Number.NaN]) {
      const r = solveKeplerElliptic(1, e);
      expect(r.ok).toBe(false);
      if (!r.ok) expect(r.code).toBe('eccentricity-out-of-range');
    }
    const r = solveKeplerElliptic(Number.POSITIVE_INFINITY, 0.1);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.code).toBe('invalid-parameter');
  });
});

describe('solveKeplerHyperbolic(M, e)', () => {
  it('gives H = 1.601376144 rad for M = 235.4 deg (4.1085 rad), e = 2.4 (Vallado 4th ed., Example 2-3, from memory)', () => {
    expectClose(ok(solveKeplerHyperbolic(235.4 * DEG, 2.4)), 1.601_376_144, 1e-9, 'H');
  });

  it('reproduces the hyperbola of Curtis 3rd ed., Example 3.5 (vp = 15 km/s at 300 km altitude; from memory): t = 4141 s at nu = 100 deg, three hours later nu = 107.78 deg, r = 163180 km', () => {
    const mu = 398_600;
    const rp = 6_378 + 300;
    const h = rp * 15;
    const e = (h * h) / (mu * rp) - 1;
    const n = (mu * mu / h ** 3) * ((e * e - 1) ** 1.5); // M_h = n t (Curtis 3rd ed. sec. 3.6, from memory)
    const t = meanFromHyperbolic(hyperbolicFromTrue(100 * DEG, e), e) / n;
    expectClose(t, 4141, 1, 't s');
    const F = ok(solveKeplerHyperbolic(n * (t + 10_800), e));
    const nu = trueFromHyperbolic(F, e);
    expectClose(nu / DEG, 107.78, 0.01, 'nu deg');
    expectRelClose((h * h) / mu / (1 + e * Math.cos(nu)), 163_180, 1e-3, 'r km'); // printed to 5 figures; r is steep in nu here
  });

  it('converges for e in [1.0001, 50] and |M| up to 1e4: e sinh H - H gives M back (property)', () => {
    fc.assert(fc.property(fc.double({ min: 1.0001, max: 50, noNaN: true }), fc.double({ min: -1e4, max: 1e4, noNaN: true }), (e, M) => {
      const H = ok(solveKeplerHyperbolic(M, e));
      // Plain form as the independent check, to about one unit in the last place of H times dM/dH.
      return Math.abs(e * Math.sinh(H) - H - M) <= 4.5e-16 * (Math.abs(H) + 1) * (e * Math.cosh(H) + 1);
    }), { numRuns: 3000 });
  });

  it('keeps relative precision for tiny M near e = 1', () => {
    fc.assert(fc.property(fc.double({ min: 1.0001, max: 1.1, noNaN: true }), fc.double({ min: 1e-12, max: 1e-3, noNaN: true }), (e, M) => {
      const H = ok(solveKeplerHyperbolic(M, e));
      return Math.abs(meanFromHyperbolic(H, e) - M) <= 1e-14 * M;
    }), { numRuns: 2000 });
  });

  it('is odd in M, gives 0 at 0 and works for very large M', () => {
    expect(ok(solveKeplerHyperbolic(0, 3))).toBe(0);
    expect(ok(solveKeplerHyperbolic(-5, 1.5))).toBe(-ok(solveKeplerHyperbolic(5, 1.5)));
    const H = ok(solveKeplerHyperbolic(1e300, 1.0001));
    expectRelClose(meanFromHyperbolic(H, 1.0001), 1e300, 1e-12, 'M back');
  });

  it('refuses e <= 1', () => {
    for (const e of [1, 0.5, Number.NaN, Number.POSITIVE_INFINITY]) {
      const r = solveKeplerHyperbolic(1, e);
      expect(r.ok).toBe(false);
      if (!r.ok) expect(r.code).toBe('eccentricity-out-of-range');
    }
  });
});

describe('solveBarker(Mp) with Mp = B + B^3/3 = 2 sqrt(mu/p^3) (t - T)', () => {
  it('gives B = 0.817751 for p = 25512 km, t - T = 53.7874 min (Vallado 4th ed., Example 2-2, from memory)', () => {
    const Mp = 2 * Math.sqrt(398_600.4418 / 25_512 ** 3) * 53.7874 * 60;
    expectClose(solveBarker(Mp), 0.817_751, 1e-6, 'B');
  });

  it('agrees with the direct cubic formula (Cardano: sum of two cube roots, B^3 + 3B - 3Mp = 0) for |Mp| <= 100', () => {
    fc.assert(fc.property(fc.double({ min: -100, max: 100, noNaN: true }), (Mp) => {
      const s = Math.sqrt(2.25 * Mp * Mp + 1);
      const cardano = Math.cbrt(1.5 * Mp + s) + Math.cbrt(1.5 * Mp - s);
      // Cardano's sum cancels (small Mp) or loses digits in 1.5 Mp - s (large Mp): absolute floor 1.
      return Math.abs(solveBarker(Mp) - cardano) <= 1e-12 * Math.max(1, Math.abs(cardano));
    }));
  });

  it('inverts meanFromParabolic to full relative precision, including tiny Mp', () => {
    fc.assert(fc.property(fc.double({ min: -1e8, max: 1e8, noNaN: true }), (B) => {
      const back = solveBarker(meanFromParabolic(B));
      return Math.abs(back - B) <= 1e-14 * Math.max(Math.abs(B), 1e-300);
    }));
    expectRelClose(solveBarker(3e-12), 3e-12, 1e-15, 'B tiny');
  });
});

describe('anomaly conversions (each against its inverse)', () => {
  it('nu -> E -> nu over several turns and e in [0, 0.9999]', () => {
    fc.assert(fc.property(fc.double({ min: -20, max: 20, noNaN: true }), fc.double({ min: 0, max: 0.9999, noNaN: true }), (nu, e) => {
      const E = eccentricFromTrue(nu, e);
      return Math.abs(trueFromEccentric(E, e) - nu) <= 1e-9 * Math.max(1, Math.abs(nu)) && Math.abs(E - nu) < Math.PI;
    }), { numRuns: 2000 });
  });

  it('E and nu agree with the half-angle formula tan(E/2) = sqrt((1-e)/(1+e)) tan(nu/2) (Curtis 3rd ed. sec. 3.4, from memory)', () => {
    fc.assert(fc.property(fc.double({ min: -3, max: 3, noNaN: true }), fc.double({ min: 0, max: 0.99, noNaN: true }), (nu, e) => {
      const E = 2 * Math.atan(Math.sqrt((1 - e) / (1 + e)) * Math.tan(nu / 2));
      return Math.abs(eccentricFromTrue(nu, e) - E) <= 1e-12;
    }));
  });

  it('nu -> H -> nu inside the asymptote, and H agrees with tanh(H/2) = sqrt((e-1)/(e+1)) tan(nu/2) (Curtis 3rd ed. sec. 3.6, from memory)', () => {
    fc.assert(fc.property(fc.double({ min: 1.0001, max: 50, noNaN: true }), fc.double({ min: -0.999, max: 0.999, noNaN: true }), (e, f) => {
      const nu = f * Math.acos(-1 / e);
      const H = hyperbolicFromTrue(nu, e);
      const halfAngle = 2 * Math.atanh(Math.sqrt((e - 1) / (e + 1)) * Math.tan(nu / 2));
      return Math.abs(trueFromHyperbolic(H, e) - nu) <= 1e-9 && Math.abs(H - halfAngle) <= 1e-8 * Math.max(1, Math.abs(H));
    }), { numRuns: 2000 });
  });

  it('nu -> B -> nu for the parabola', () => {
    fc.assert(fc.property(fc.double({ min: -3.1, max: 3.1, noNaN: true }), (nu) => Math.abs(trueFromParabolic(parabolicFromTrue(nu)) - nu) <= 1e-14 * Math.max(1, Math.abs(nu))));
  });
});
