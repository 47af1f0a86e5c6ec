// Two-body propagation in the universal variable chi: one formulation for ellipse, parabola and
// hyperbola, forwards or backwards in time. References: Curtis, Orbital Mechanics for Engineering
// Students, 3rd ed., sec. 3.7 and Algs. 3.3-3.4 (universal Kepler's equation, Lagrange f and g);
// Vallado, Fundamentals of Astrodynamics and Applications, 4th ed., Alg. 8 KEPLER (starters);
// Battin, An Introduction to the Mathematics and Methods of Astrodynamics, rev. ed., ch. 4
// (universal functions U0..U3). Section and algorithm numbers from memory.
//
// Limits: rectilinear motion (h = 0, or |h| <= 1e-10 |r||v|) is refused as 'rectilinear-motion'.
// Elliptic spans are reduced modulo the period first. Accuracy is set by the conditioning of the
// input: 1/a = 2/r - v^2/mu loses digits as e -> 1, and a relative error in the period grows into
// an along-track error proportional to the number of revolutions (measured against 40-digit
// arithmetic over -3 to +7 revolutions: 2e-14 relative for a LEO with a = 7181 km, 7e-12 at
// e = 0.97, a = 264 725 km). A state that no longer fits in a double (hyperbolic spans near
// 1e308 s) comes back as 'no-convergence'.

import { TWO_PI } from '../core/math.js';
import { failure, success, type Failure, type Outcome } from '../core/result.js';
import { stumpffInto, type StumpffPair } from './stumpff.js';
import { combine, dot, type Vec3 } from '../core/vec3.js';

/** |h| at or below this fraction of |r||v| counts as rectilinear (flight path within 1e-10 rad of radial). */
const RECTILINEAR_TOLERANCE = 1e-10;
/** Iteration cap of the root finders here; they are bracketed, so this only stops pathological input. */
const MAX_ITERATIONS = 300;
/** Relative Laguerre step at which chi is accepted; convergence is cubic, so the error left is ~1e-30. */
const CHI_TOLERANCE = 1e-10;
/** Absolute floor of that test (km^0.5), for spans so short that chi is subnormal. */
const CHI_FLOOR = 1e-300;

/** Constants of one arc and the universal functions at the current chi (one per call, never shared). */
class UniversalArc implements StumpffPair {
  readonly sqrtMu: number;
  readonly r0: number;
  /** r0 . v0 / sqrt(mu) */
  readonly sigma0: number;
  /** 1/a = 2/r0 - v0^2/mu (vis-viva); > 0 ellipse, 0 parabola, < 0 hyperbola. */
  readonly alpha: number;
  /** |r0 x v0| */
  readonly h: number;
  u0 = 1;
  u1 = 0;
  u2 = 0;
  u3 = 0;
  /** Stumpff C and S at the current z (scratch for stumpffInto). */
  c = 0.5;
  s = 1 / 6;

  /** Periapsis radius, apoapsis radius (Infinity unless bound) and periapsis speed: bounds on r and on chi. */
  private readonly rp: number;
  private readonly ra: number;
  private readonly vp: number;

  constructor(r0: Vec3, v0: Vec3, mu: number) {
    this.sqrtMu = Math.sqrt(mu);
    this.r0 = Math.sqrt(dot(r0, r0));
    this.sigma0 = dot(r0, v0) / this.sqrtMu;
    this.alpha = 2 / this.r0 - dot(v0, v0) / mu;
    this.h = angularMomentum(r0, v0);
    // p = h^2/mu, e^2 = 1 - alpha p, rp = p/(1 + e), ra = p/(1 - e) (Curtis 3rd ed. ch. 2); vp = h/rp.
    // e is widened by 1e-6: near e = 0 its rounding error is ~1e-8, and these only bound the search.
    const p = (this.h * this.h) / mu;
    const e = Math.sqrt(Math.max(0, 1 - this.alpha * p)) + 1e-6;
    this.rp = Math.min(p / (1 + e), this.r0);
    this.ra = e < 1 ? Math.max(p / (1 - e), this.r0) : Infinity;
    this.vp = this.h / this.rp;
  }

  /** U0..U3 at chi: U2 = chi^2 C(z), U3 = chi^3 S(z), U1 = chi - alpha U3, U0 = 1 - alpha U2, z = alpha chi^2 (Battin ch. 4). */
  setChi(chi: number): void {
    const chi2 = chi * chi;
    stumpffInto(this.alpha * chi2, this);
    this.u2 = chi2 * this.c;
    this.u3 = chi2 * chi * this.s;
    this.u1 = chi - this.alpha * this.u3;
    this.u0 = 1 - this.alpha * this.u2;
  }

  /** sqrt(mu) dt as a function of chi: the universal Kepler's equation (Curtis 3rd ed. sec. 3.7). */
  scaledTime(): number {
    return this.r0 * this.u1 + this.sigma0 * this.u2 + this.u3;
  }

  /** d(scaledTime)/d chi = r, the radius at chi. */
  radius(): number {
    return this.r0 * this.u0 + this.sigma0 * this.u1 + this.u2;
  }

  /** d r / d chi = r . v / sqrt(mu) at chi. */
  sigma(): number {
    return this.sigma0 * this.u0 + (1 - this.alpha * this.r0) * this.u1;
  }

  /** Period (s) of an ellipse, 2 pi / (sqrt(mu) alpha^1.5); Infinity otherwise. */
  period(): number {
    return this.alpha > 0 ? TWO_PI / (this.sqrtMu * this.alpha * Math.sqrt(this.alpha)) : Infinity;
  }

  /** dt reduced to [-P/2, P/2] for an ellipse of period P; unchanged otherwise. */
  reduce(dt: number): number {
    const p = this.period();
    return Math.abs(dt) > 0.5 * p ? dt - p * Math.round(dt / p) : dt;
  }

  /**
   * chi solving sqrt(mu) dt = scaledTime(chi). The function increases with slope r, and
   * rp <= r <= min(ra, r0 + vp |dt|) along the arc, so |chi| lies in
   * [sqrt(mu)|dt| / min(ra, r0 + vp|dt|), sqrt(mu)|dt| / rp]: a finite bracket from the start.
   * Steps: Laguerre's method, n = 5 (Conway, Celestial Mechanics 39, 1986; from memory) near the
   * root; far from it (scaledTime off by more than a factor 2) Newton on ln(scaledTime), against
   * ln|chi| while it grows like a power of chi and against chi once it grows exponentially
   * (hyperbolic terms). A step that leaves the bracket or fails to halve the residual is replaced
   * by bisection, geometric while the bracket spans more than a factor 16, so the iteration
   * always ends. Leaves U0..U3 at the root; NaN when it cannot (overflow on huge hyperbolic spans).
   */
  solve(scaledDt: number, guess: number): number {
    if (scaledDt === 0) return this.finish(0);
    // Work with y = |chi| = sign * chi; g(y) = sign (scaledTime(sign y) - scaledDt) increases from -|scaledDt|.
    const sign = scaledDt > 0 ? 1 : -1;
    const span = Math.abs(scaledDt);
    const maxRadius = Math.min(this.ra, this.r0 + (this.vp * span) / this.sqrtMu);
    let lo = (span / maxRadius) * (1 - 1e-12);
    let hi = (span / this.rp) * (1 + 1e-12);
    // |dt| so small that chi underflows: the initial state is the answer to rounding.
    if (!(hi > CHI_FLOOR)) return this.finish(0);
    let y = sign * guess > lo && sign * guess < hi ? sign * guess : Math.sqrt(lo) * Math.sqrt(hi);
    let lastResidual = Infinity;
    for (let i = 0; i < MAX_ITERATIONS; i++) {
      const chi = sign * y;
      this.setChi(chi);
      const t = this.scaledTime();
      const g = sign * (t - scaledDt);
      if (g === 0) return this.finish(chi);
      if (g < 0) lo = y;
      else hi = y; // NaN (overflow) lies beyond the root
      let next = Number.NaN;
      if (Number.isFinite(g)) {
        const r = this.radius();
        const ratio = t / scaledDt;
        if (ratio > 2 || ratio < 0.5) {
          const k = (r * chi) / t; // local exponent d ln t / d ln chi
          next = k <= 3 ? y * Math.exp(-Math.log(ratio) / k) : y - (Math.log(ratio) * Math.abs(t)) / r;
        } else {
          // Laguerre: n g / (g' + sqrt|(n-1)^2 g'^2 - n(n-1) g g''|), g' = r > 0, g'' = sign * sigma; divided by g'.
          const q = g / r;
          next = y - (5 * q) / (1 + Math.sqrt(Math.abs(16 - 20 * q * ((sign * this.sigma()) / r))));
          if (Math.abs(next - y) <= CHI_TOLERANCE * next + CHI_FLOOR) return this.finish(sign * next);
        }
        const residual = Math.abs(g);
        if (!(next > lo && next < hi && residual < 0.5 * lastResidual)) next = Number.NaN;
        lastResidual = residual;
      }
      if (Number.isNaN(next)) {
        next = hi > 16 * lo ? Math.sqrt(lo) * Math.sqrt(hi) : 0.5 * (lo + hi);
        if (hi - lo <= 4 * Number.EPSILON * hi) return this.finish(sign * next);
        lastResidual = Infinity;
      }
      y = next;
    }
    return Number.NaN;
  }

  private finish(chi: number): number {
    this.setChi(chi);
    return Number.isFinite(this.u0) && Number.isFinite(this.u1) && Number.isFinite(this.u3) && Number.isFinite(this.radius()) ? chi : NaN;
  }

  /**
   * Initial chi from Vallado 4th ed. Alg. 8: ellipse sqrt(mu) alpha dt; parabola from Barker's
   * equation; hyperbola the logarithmic estimate. Unless the orbit is clearly elliptic, every
   * candidate (and the first-order sqrt(mu) dt / r0) is tried and the one with the smallest
   * residual kept: near e = 1 neither conic's formula covers every span.
   */
  starter(dt: number): number {
    const { sqrtMu, alpha, r0 } = this;
    const scaledDt = sqrtMu * dt;
    if (alpha * r0 > 1e-3) return sqrtMu * alpha * dt;
    const mu = sqrtMu * sqrtMu;
    const p = (this.h * this.h) / mu;
    const s = 0.5 * Math.atan(1 / (3 * Math.sqrt(mu / (p * p * p)) * dt));
    const barker = (2 * Math.sqrt(p)) / Math.tan(2 * Math.atan(Math.cbrt(Math.tan(s))));
    let conic = sqrtMu * alpha * dt;
    if (alpha < 0) {
      const a = 1 / alpha;
      const sign = dt >= 0 ? 1 : -1;
      const denominator = this.sigma0 * sqrtMu + sign * Math.sqrt(-mu * a) * (1 - r0 * alpha);
      conic = sign * Math.sqrt(-a) * Math.log((-2 * mu * alpha * dt) / denominator);
    }
    let best = scaledDt / r0;
    let bestResidual = this.residual(best, scaledDt);
    for (const candidate of [barker, conic]) {
      const residual = this.residual(candidate, scaledDt);
      if (residual < bestResidual) {
        best = candidate;
        bestResidual = residual;
      }
    }
    return best;
  }

  /** |scaledTime(chi) - scaledDt|, Infinity when chi or the result is not finite. */
  private residual(chi: number, scaledDt: number): number {
    if (!Number.isFinite(chi)) return Infinity;
    this.setChi(chi);
    const f = Math.abs(this.scaledTime() - scaledDt);
    return Number.isNaN(f) ? Infinity : f;
  }
}

function angularMomentum(r: Vec3, v: Vec3): number {
  const hx = r[1] * v[2] - r[2] * v[1];
  const hy = r[2] * v[0] - r[0] * v[2];
  const hz = r[0] * v[1] - r[1] * v[0];
  return Math.sqrt(hx * hx + hy * hy + hz * hz);
}

/** The checks shared by propagate and propagateGrid; null when the state can be propagated. */
function checkTwoBodyInput(r0: Vec3, v0: Vec3, mu: number): Failure | null {
  if (!(mu > 0 && mu < Infinity)) return failure('invalid-parameter', `gravitational parameter must be positive and finite, got ${mu}`);
  const finite = Number.isFinite;
  if (!(finite(r0[0]) && finite(r0[1]) && finite(r0[2]) && finite(v0[0]) && finite(v0[1]) && finite(v0[2]))) {
    return failure('invalid-parameter', 'position and velocity must be finite numbers');
  }
  const rr = dot(r0, r0);
  if (!(rr > 0)) return failure('zero-position', 'the position vector is zero: the body sits at the centre of attraction');
  if (angularMomentum(r0, v0) <= RECTILINEAR_TOLERANCE * Math.sqrt(rr * dot(v0, v0))) {
    return failure('rectilinear-motion', 'the velocity is radial (zero angular momentum): rectilinear motion is not propagated');
  }
  return null;
}

/** Position and velocity after dt seconds (dt < 0 goes backwards) on the two-body orbit through (r0, v0). */
export function propagate(r0: Vec3, v0: Vec3, mu: number, dt: number): Outcome<{ r: Vec3; v: Vec3 }> {
  const bad = checkTwoBodyInput(r0, v0, mu);
  if (bad) return bad;
  if (!Number.isFinite(dt)) return failure('invalid-parameter', `time offset must be finite, got ${dt}`);
  if (dt === 0) return success({ r: r0, v: v0 });
  const arc = new UniversalArc(r0, v0, mu);
  const reduced = arc.reduce(dt);
  const chi = arc.solve(arc.sqrtMu * reduced, arc.starter(reduced));
  if (Number.isNaN(chi)) return failure('no-convergence', `universal Kepler's equation did not converge for dt = ${dt} s (span too long for this hyperbola?)`);
  // Lagrange coefficients (Curtis 3rd ed. Alg. 3.4); g = (r0 U1 + sigma0 U2)/sqrt(mu) equals dt - U3/sqrt(mu) without its cancellation.
  const r = arc.radius();
  const f = 1 - arc.u2 / arc.r0;
  const g = (arc.r0 * arc.u1 + arc.sigma0 * arc.u2) / arc.sqrtMu;
  const fd = (-arc.sqrtMu * arc.u1) / (r * arc.r0);
  const gd = 1 - arc.u2 / r;
  return success({ r: combine(r0, f, v0, g), v: combine(r0, fd, v0, gd) });
}

export interface ConservationDrift {
  /** max |eps_k - eps_0| / |eps_0| over the samples (specific energy eps = v^2/2 - mu/r). */
  readonly energy: number;
  /** max |eps_k - eps_0| / (mu/|r_0|): the meaningful figure near parabolic, where eps_0 ~ 0. */
  readonly energyVsPotential: number;
  /** max ||h_k| - |h_0|| / |h_0| (specific angular momentum h = r x v). */
  readonly angularMomentum: number;
  /** max |h_k - h_0| / |h_0| (vector difference: also catches a turning orbit plane). */
  readonly angularMomentumVector: number;
}

/** Drift of the two-body integrals across a table of states (6 numbers per sample), relative to the first sample. */
export function conservationDrift(table: { readonly states: Float64Array }, mu: number): ConservationDrift {
  const s = table.states;
  const n = Math.floor(s.length / 6);
  if (n === 0) return { energy: 0, energyVsPotential: 0, angularMomentum: 0, angularMomentumVector: 0 };
  const energyAt = (i: number): number =>
    0.5 * (s[i + 3]! ** 2 + s[i + 4]! ** 2 + s[i + 5]! ** 2) - mu / Math.sqrt(s[i]! ** 2 + s[i + 1]! ** 2 + s[i + 2]! ** 2);
  const e0 = energyAt(0);
  const hx0 = s[1]! * s[5]! - s[2]! * s[4]!;
  const hy0 = s[2]! * s[3]! - s[0]! * s[5]!;
  const hz0 = s[0]! * s[4]! - s[1]! * s[3]!;
  const h0 = Math.sqrt(hx0 * hx0 + hy0 * hy0 + hz0 * hz0);
  let de = 0;
  let dh = 0;
  let dhv = 0;
  for (let i = 6; i < 6 * n; i += 6) {
    de = Math.max(de, Math.abs(energyAt(i) - e0));
    const hx = s[i + 1]! * s[i + 5]! - s[i + 2]! * s[i + 4]!;
    const hy = s[i + 2]! * s[i + 3]! - s[i]! * s[i + 5]!;
    const hz = s[i]! * s[i + 4]! - s[i + 1]! * s[i + 3]!;
    dh = Math.max(dh, Math.abs(Math.sqrt(hx * hx + hy * hy + hz * hz) - h0));
    dhv = Math.max(dhv, Math.sqrt((hx - hx0) ** 2 + (hy - hy0) ** 2 + (hz - hz0) ** 2));
  }
  const potential0 = mu / Math.sqrt(s[0]! ** 2 + s[1]! ** 2 + s[2]! ** 2);
  return {
    energy: de === 0 ? 0 : de / Math.abs(e0),
    energyVsPotential: de / potential0,
    angularMomentum: dh === 0 ? 0 : dh / h0,
    angularMomentumVector: dhv === 0 ? 0 : dhv / h0,
  };
}

// ---- Grid kernel: many epochs of one orbit -------------------------------------------------

/** Ellipses below this eccentricity take the elliptic walk; the rest solve chi per sample. */
const WALK_MAX_ECCENTRICITY = 0.999;
/** Largest anomaly increment handled with the polynomial sine/cosine (their truncation is < 1e-17 there). */
const POLY_LIMIT = 0.25;
/** Samples between exact re-evaluations of cos x, sin x (bounds the angle-addition drift to ~64 ulp). */
const ANCHOR_EVERY = 64;
/** Halley step (rad) below which the increment is accepted; the error left, cubic in it, is < 1e-24. */
const STEP_TOLERANCE = 1e-9;

/** Below this |d| the short Taylor series suffice (first omitted terms < 1e-19 relative). */
const SHORT_POLY_LIMIT = 0.02;

/** sin d for |d| <= POLY_LIMIT: Taylor series through d^7 (|d| <= 0.02) or d^11. */
function sinSmall(d: number): number {
  const d2 = d * d;
  if (d2 <= SHORT_POLY_LIMIT * SHORT_POLY_LIMIT) return d * (1 + d2 * (-1 / 6 + d2 * (1 / 120 + d2 * (-1 / 5040))));
  return d * (1 + d2 * (-1 / 6 + d2 * (1 / 120 + d2 * (-1 / 5040 + d2 * (1 / 362_880 + d2 * (-1 / 39_916_800))))));
}

/** cos d - 1 for |d| <= POLY_LIMIT: Taylor series through d^8 (|d| <= 0.02) or d^12. */
function cosSmallMinusOne(d: number): number {
  const d2 = d * d;
  if (d2 <= SHORT_POLY_LIMIT * SHORT_POLY_LIMIT) return d2 * (-1 / 2 + d2 * (1 / 24 + d2 * (-1 / 720 + d2 * (1 / 40_320))));
  return d2 * (-1 / 2 + d2 * (1 / 24 + d2 * (-1 / 720 + d2 * (1 / 40_320 + d2 * (-1 / 3_628_800 + d2 * (1 / 479_001_600))))));
}

/**
 * Solves x - ec sin x + es (1 - cos x) = m for the eccentric-anomaly change x: the universal
 * Kepler's equation with chi = x sqrt(a), divided by a^1.5 (ec = e cos E0 = 1 - r0/a,
 * es = e sin E0 = sigma0/sqrt(a)). Halley's method kept in the bracket [m - es - e, m - es + e].
 * Writes x, 1 - cos x, sin x to scratch; false if it fails.
 */
function solveAnomalyChange(m: number, ec: number, es: number, guess: number, scratch: Float64Array): boolean {
  const e = Math.sqrt(ec * ec + es * es);
  let lo = m - es - e;
  let hi = m - es + e;
  let x = guess >= lo && guess <= hi ? guess : m - es;
  for (let i = 0; i < MAX_ITERATIONS; i++) {
    const c = Math.cos(x);
    const s = Math.sin(x);
    const g = x - ec * s + es * (1 - c) - m;
    if (g < 0) lo = x;
    else hi = x;
    const g1 = 1 - ec * c + es * s;
    const g2 = ec * s + es * c;
    let next = x - (2 * g * g1) / (2 * g1 * g1 - g * g2);
    if (!(next >= lo && next <= hi)) next = 0.5 * (lo + hi);
    if (Math.abs(next - x) <= 1e-12 || g === 0) {
      scratch[0] = next;
      scratch[1] = versine(next);
      scratch[2] = Math.sin(next);
      return true;
    }
    x = next;
  }
  return false;
}

/** 1 - cos x = 2 sin^2(x/2), without the cancellation near x = 0. */
function versine(x: number): number {
  const h = Math.sin(0.5 * x);
  return 2 * h * h;
}

/**
 * States at many times: out[6i..6i+5] = x, y, z, vx, vy, vz at dtSeconds[i], seconds from the
 * epoch of (r0, v0). Times are walked in the order given: any order is correct, and a smooth
 * sequence (increasing or decreasing) is fast. Ellipses with e < 0.999 walk the eccentric-anomaly
 * change x = chi sqrt(alpha) from sample to sample: Halley steps on the difference form of Kepler's
 * equation about the previous sample with polynomial sine/cosine of the small increment, cos x and
 * sin x carried by angle addition and re-taken from Math.cos/sin every 64 samples or after a large
 * jump. Other orbits solve chi per sample starting from the previous chi.
 * out must hold 6 * dtSeconds.length numbers (a shorter one throws).
 */
export function propagateGrid(r0: Vec3, v0: Vec3, mu: number, dtSeconds: Float64Array, out: Float64Array): Outcome<void> {
  if (out.length < 6 * dtSeconds.length) throw new RangeError(`out holds ${out.length} numbers, need ${6 * dtSeconds.length}`);
  const bad = checkTwoBodyInput(r0, v0, mu);
  if (bad) return bad;
  for (let i = 0; i < dtSeconds.length; i++) {
    if (!Number.isFinite(dtSeconds[i]!)) return failure('invalid-parameter', `time offset ${i} is not finite (${dtSeconds[i]})`);
  }
  const arc = new UniversalArc(r0, v0, mu);
  const ec = 1 - arc.alpha * arc.r0;
  const es = arc.sigma0 * Math.sqrt(Math.max(arc.alpha, 0));
  if (arc.alpha > 0 && Math.sqrt(ec * ec + es * es) < WALK_MAX_ECCENTRICITY) return ellipticWalk(arc, r0, v0, ec, es, dtSeconds, out);
  return universalWalk(arc, r0, v0, dtSeconds, out);
}

function universalWalk(arc: UniversalArc, r0: Vec3, v0: Vec3, dt: Float64Array, out: Float64Array): Outcome<void> {
  const { sqrtMu } = arc;
  let prevChi = 0;
  let prevT = 0;
  let prevR = arc.r0;
  for (let i = 0; i < dt.length; i++) {
    const t = arc.reduce(dt[i]!);
    const guess = i === 0 ? arc.starter(t) : prevChi + (sqrtMu * (t - prevT)) / prevR;
    const chi = arc.solve(sqrtMu * t, guess);
    if (Number.isNaN(chi)) return failure('no-convergence', `universal Kepler's equation did not converge at time offset ${dt[i]} s`);
    const r = arc.radius();
    writeState(out, 6 * i, r0, v0, 1 - arc.u2 / arc.r0, (arc.r0 * arc.u1 + arc.sigma0 * arc.u2) / sqrtMu, (-sqrtMu * arc.u1) / (r * arc.r0), 1 - arc.u2 / r);
    prevChi = chi;
    prevT = t;
    prevR = r;
  }
  return success(undefined);
}

function ellipticWalk(arc: UniversalArc, r0: Vec3, v0: Vec3, ec: number, es: number, dt: Float64Array, out: Float64Array): Outcome<void> {
  const { sqrtMu, sigma0, alpha } = arc;
  const r0n = arc.r0;
  const a = 1 / alpha;
  const sqrtA = Math.sqrt(a);
  const meanMotion = sqrtMu * alpha * Math.sqrt(alpha);
  const period = arc.period();
  const invPeriod = 1 / period;
  const invR0 = 1 / r0n;
  const invSqrtMu = 1 / sqrtMu;
  const scratch = new Float64Array(3);
  // Carried between samples: x, w = 1 - cos x (kept directly, so it stays exact near periapsis) and s = sin x.
  let x = 0;
  let w = 0;
  let sx = 0;
  let revs = 0;
  let sinceAnchor = 0;
  for (let i = 0; i < dt.length; i++) {
    const t = dt[i]!;
    // Reduce modulo the period, m = n (t - j P), and shift the carried x by the same whole turns.
    const j = Math.round(t * invPeriod);
    const m = meanMotion * (t - j * period);
    let done = false;
    if (i > 0) {
      if (j !== revs) x -= TWO_PI * (j - revs);
      // About the previous sample: F(d) = R + d - A sin d - B (cos d - 1) with A = e cos E, B = e sin E
      // there (angle addition in Kepler's equation); the first Halley step, from d = 0, needs no trig.
      const R = x - ec * sx + es * w - m;
      const A = ec * (1 - w) - es * sx;
      const B = ec * sx + es * (1 - w);
      const d1 = 1 - A;
      let d = (-2 * R * d1) / (2 * d1 * d1 - R * B);
      for (let it = 0; it < 3 && Math.abs(d) <= POLY_LIMIT; it++) {
        const sd = sinSmall(d);
        const ud = cosSmallMinusOne(d);
        const F = R + d - A * sd - B * ud;
        const F1 = d1 - A * ud + B * sd;
        const F2 = A * sd + B * (1 + ud);
        const step = (-2 * F * F1) / (2 * F1 * F1 - F * F2);
        d += step;
        if (Math.abs(step) <= STEP_TOLERANCE) {
          // sin d and cos d - 1 moved on by the last step to first order; the neglected step^2 is < 1e-18.
          const sFinal = sd + step * (1 + ud);
          const uFinal = ud - step * sd;
          // Angle addition: 1 - cos(x + d) = w - (1 - w)(cos d - 1) + sin x sin d; sin(x + d) = sin x cos d + cos x sin d.
          const wNext = w - (1 - w) * uFinal + sx * sFinal;
          sx = sx + sx * uFinal + (1 - w) * sFinal;
          // Back onto the unit circle, sin^2 x = w (2 - w): the state then stays on the orbit (energy and
          // h exact) and rounding only moves it along the track. The step contracts fastest near
          // periapsis (w ~ 0) and apoapsis (w ~ 2), where a (1 - cos x) is most sensitive.
          w = wNext < 1 ? (sx * sx) / (2 - wNext) : 2 - (sx * sx) / wNext;
          x += d;
          done = true;
          if (++sinceAnchor >= ANCHOR_EVERY) {
            w = versine(x);
            sx = Math.sin(x);
            sinceAnchor = 0;
          }
          break;
        }
      }
      if (!done && Number.isFinite(d)) x += d;
    } else {
      x = m;
    }
    if (!done) {
      if (!solveAnomalyChange(m, ec, es, x, scratch)) return failure('no-convergence', `Kepler's equation did not converge at time offset ${t} s`);
      x = scratch[0]!;
      w = scratch[1]!;
      sx = scratch[2]!;
      sinceAnchor = 0;
    }
    revs = j;
    // Universal functions at chi = x sqrt(a): U0 = cos x, U1 = sqrt(a) sin x, U2 = a (1 - cos x) (Battin ch. 4).
    const u1 = sqrtA * sx;
    const u2 = a * w;
    const invR = 1 / (r0n + sigma0 * u1 + (a - r0n) * w);
    const f = 1 - u2 * invR0;
    const g = (r0n * u1 + sigma0 * u2) * invSqrtMu;
    const fd = -sqrtMu * u1 * invR * invR0;
    const gd = 1 - u2 * invR;
    writeState(out, 6 * i, r0, v0, f, g, fd, gd);
  }
  return success(undefined);
}

/** r = f r0 + g v0, v = fd r0 + gd v0 into out[o..o+5] (Lagrange coefficients, Curtis 3rd ed. sec. 3.7). */
function writeState(out: Float64Array, o: number, r0: Vec3, v0: Vec3, f: number, g: number, fd: number, gd: number): void {
  out[o] = f * r0[0] + g * v0[0];
  out[o + 1] = f * r0[1] + g * v0[1];
  out[o + 2] = f * r0[2] + g * v0[2];
  out[o + 3] = fd * r0[0] + gd * v0[0];
  out[o + 4] = fd * r0[1] + gd * v0[1];
  out[o + 5] = fd * r0[2] + gd * v0[2];
}
