// Stumpff functions C(z) and S(z) for the universal-variable formulation of two-body motion.
// Closed forms: Curtis, Orbital Mechanics for Engineering Students, 3rd ed., eqs. 3.52-3.53
// (equation numbers from memory); series from the same section: C = sum (-z)^k/(2k+2)!,
// S = sum (-z)^k/(2k+3)!. Near z = 0 (near-parabolic arcs, short steps) the closed forms cancel
// catastrophically, so |z| < SERIES_LIMIT uses the series, exact there to machine precision.

/** Below this |z| the series is used; beyond it the closed forms lose at most ~2 ulp. */
const SERIES_LIMIT = 2.5;

// Reciprocal factorials 1/(2k+2)! and 1/(2k+3)!, k = 0..10. The first omitted terms,
// 2.5^11/24! and 2.5^11/25!, are below 1e-19 of the leading 1/2 and 1/6.
const C0 = 1 / 2, C1 = 1 / 24, C2 = 1 / 720, C3 = 1 / 40_320, C4 = 1 / 3_628_800, C5 = 1 / 479_001_600;
const C6 = 1 / 87_178_291_200, C7 = 1 / 20_922_789_888_000, C8 = 1 / 6_402_373_705_728_000;
const C9 = 1 / 2.43290200817664e18, C10 = 1 / 1.1240007277776077e21;
const S0 = 1 / 6, S1 = 1 / 120, S2 = 1 / 5040, S3 = 1 / 362_880, S4 = 1 / 39_916_800, S5 = 1 / 6_227_020_800;
const S6 = 1 / 1_307_674_368_000, S7 = 1 / 355_687_428_096_000, S8 = 1 / 1.21645100408832e17;
const S9 = 1 / 5.109094217170944e19, S10 = 1 / 2.585201673888498e22;

/** Receives C(z) and S(z) from stumpffInto (any object with writable fields c and s). */
export interface StumpffPair {
  c: number;
  s: number;
}

/**
 * Writes C(z) to out.c and S(z) to out.s:
 * C = (1 - cos sqrt z)/z, S = (sqrt z - sin sqrt z)/sqrt(z)^3 for z > 0;
 * C = (cosh sqrt(-z) - 1)/(-z), S = (sinh sqrt(-z) - sqrt(-z))/sqrt(-z)^3 for z < 0; 1/2 and 1/6 at 0.
 * Both are Infinity once sqrt(-z) exceeds ~709 (cosh overflows).
 */
export function stumpffInto(z: number, out: StumpffPair): void {
  if (Math.abs(z) < SERIES_LIMIT) {
    const w = -z;
    out.c = C0 + w * (C1 + w * (C2 + w * (C3 + w * (C4 + w * (C5 + w * (C6 + w * (C7 + w * (C8 + w * (C9 + w * C10)))))))));
    out.s = S0 + w * (S1 + w * (S2 + w * (S3 + w * (S4 + w * (S5 + w * (S6 + w * (S7 + w * (S8 + w * (S9 + w * S10)))))))));
    return;
  }
  if (z > 0) {
    const x = Math.sqrt(z);
    out.c = (1 - Math.cos(x)) / z;
    out.s = (x - Math.sin(x)) / (z * x);
    return;
  }
  const x = Math.sqrt(-z);
  const ex = Math.exp(x);
  const inv = 1 / ex;
  out.c = (0.5 * (ex + inv) - 1) / -z;
  out.s = (0.5 * (ex - inv) - x) / (-z * x);
}

/** Stumpff C(z) (see stumpffInto). */
export function stumpffC(z: number): number {
  const pair = { c: 0, s: 0 };
  stumpffInto(z, pair);
  return pair.c;
}

/** Stumpff S(z) (see stumpffInto). */
export function stumpffS(z: number): number {
  const pair = { c: 0, s: 0 };
  stumpffInto(z, pair);
  return pair.s;
}
