// The radial (effective-potential) problem of motion in a central force: E = m rdot^2 / 2 + U_eff(r)
// with U_eff = U + l^2/(2 m r^2); apsides where E = U_eff, circular orbits where dU_eff/dr = 0
// (Goldstein, Classical Mechanics, 3rd ed., sec. 3.3; Landau & Lifshitz, Mechanics, 3rd ed.,
// sec. 14 — from memory). Any consistent unit system; angles in radians.

import { brentRoot } from '../numerics/brent.js';
import { TWO_PI } from '../core/math.js';
import { failure, success, type Failure, type Outcome } from '../core/result.js';
import {
  effectiveIncrement,
  effectiveLimits,
  effectivePotential,
  energyScale,
  lengthScales,
  potential,
  validateTerms,
  type PotentialTerm,
  type RadialSystem,
} from './potential.js';

export interface CentralForceProblem {
  /** (Reduced) mass m. */
  readonly mass: number;
  readonly terms: readonly PotentialTerm[];
  /** l = m r^2 phidot; its sign is the sense of rotation. */
  readonly angularMomentum: number;
  /** E = m rdot^2 / 2 + U_eff(r). */
  readonly energy: number;
  /** Set by fromInitial: picks the allowed region (and the track's start). */
  readonly initial?: { readonly radius: number; readonly radialVelocity: number };
}

/**
 * 'bound': between two turning points (or a turning point and an unstable circular orbit);
 * 'unbound': reaches infinity; 'captured': reaches r = 0 (with l = 0 that is a line through the
 * centre); 'circular': E equals the minimum of a stable circular orbit within TOUCH_TOLERANCE.
 * A region open at both ends is 'captured' when the initial radial velocity points inward,
 * else 'unbound'.
 */
export type Motion = 'bound' | 'unbound' | 'captured' | 'circular';
/** What ends an allowed region: the centre r = 0, a simple turning point, an unstable circular orbit reached only asymptotically (E at the top of a barrier), or nothing (infinity). */
export type RegionEnd = 'centre' | 'turning-point' | 'unstable-circular-orbit' | 'infinity';

export interface AllowedRegion {
  readonly inner: number;
  /** null: extends to infinity. */
  readonly outer: number | null;
  readonly innerEnd: RegionEnd;
  readonly outerEnd: RegionEnd;
  readonly motion: Motion;
}

export interface CircularOrbit {
  readonly radius: number;
  /** d2U_eff/dr2 > 0. */
  readonly stable: boolean;
  /** U_eff at the radius: the energy of the circular orbit. */
  readonly energy: number;
  /** Small-oscillation radial angular frequency sqrt(U_eff''/m); null when unstable. */
  readonly radialFrequency: number | null;
  /** |l| / (m r^2). */
  readonly angularFrequency: number;
  /** radialFrequency / angularFrequency; null when unstable or l = 0. */
  readonly frequencyRatio: number | null;
  /** Apsidal angle of near-circular orbits, pi / frequencyRatio (Goldstein 3rd ed. sec. 3.6 — from memory). */
  readonly apsidalAngle: number | null;
}

export interface PotentialSample { readonly r: number; readonly u: number; readonly uEff: number }

export interface CentralForceAnalysis {
  readonly mass: number;
  readonly angularMomentum: number;
  readonly energy: number;
  readonly effectivePotential: PotentialSample[];
  readonly sampleSpacing: 'linear' | 'log';
  /** Ascending radii where E = U_eff, in every region (a double root, E touching an extremum, listed once). */
  readonly turningPoints: number[];
  readonly circularOrbits: CircularOrbit[];
  /** Every interval of r where E >= U_eff, ascending. */
  readonly allowedRegions: AllowedRegion[];
  /** Index in allowedRegions of the region analysed: the one holding the initial radius, else the outermost. */
  readonly regionIndex: number;
  readonly motion: Motion;
  /** l = 0: motion along a line through the centre; no apsidal angle. */
  readonly rectilinear: boolean;
  /** Inner end of the region (null at the centre) and outer end (null at infinity). */
  readonly periapsis: number | null;
  readonly apoapsis: number | null;
  /** Time from periapsis to apoapsis and back; bound or circular motion only (circular: 2 pi / radialFrequency). */
  readonly radialPeriod: number | null;
  /** Angle swept from periapsis to apoapsis, radians (circular: the near-circular limit). */
  readonly apsidalAngle: number | null;
  /** 2 apsidalAngle - 2 pi, radians per radial period. */
  readonly precessionPerOrbit: number | null;
}

export interface AnalysisOptions {
  /** Effective-potential samples (default 400, 2 to 10 000). */
  readonly samples?: number;
  readonly rMin?: number;
  readonly rMax?: number;
}

export const DEFAULT_SAMPLES = 400;
export const MAX_SAMPLES = 10_000;
/** E within this fraction of the energy scale of an extremum of U_eff counts as touching it. */
export const TOUCH_TOLERANCE = 1e-12;
const QUADRATURE_TOLERANCE = 1e-13;
/** Stretch level and node limit of each quadrature attempt. */
const QUADRATURE_LEVELS: readonly (readonly [number, number])[] = [[0, 1 << 12], [1, 1 << 14], [2, 1 << 15]];
const GRID_POINTS_PER_DECADE = 64;
const MAX_GRID_POINTS = 8000;

const EPS = Number.EPSILON;
const isFin = Number.isFinite;

/** A problem from an initial radius and velocity: l = m r v_t, E = m (v_r^2 + v_t^2)/2 + U(r). */
export function fromInitial(
  mass: number,
  terms: readonly PotentialTerm[],
  state: { radius: number; radialVelocity: number; tangentialVelocity: number },
): Outcome<CentralForceProblem> {
  const { radius, radialVelocity: vr, tangentialVelocity: vt } = state;
  if (!(radius > 0) || !isFin(radius)) return failure('invalid-parameter', 'initial radius must be positive and finite');
  if (!isFin(vr) || !isFin(vt)) return failure('invalid-parameter', 'initial velocity must be finite');
  const checked = checkSystem(mass, terms);
  if (!checked.ok) return checked;
  const energy = (mass * (vr * vr + vt * vt)) / 2 + potential(terms, radius).value;
  if (!isFin(energy)) return failure('invalid-parameter', `the potential is not finite at the initial radius ${radius}`);
  return success({ mass, terms, angularMomentum: mass * radius * vt, energy, initial: { radius, radialVelocity: vr } });
}

function checkSystem(mass: number, terms: readonly PotentialTerm[]): Outcome<true> {
  if (!(mass > 0) || !isFin(mass)) return failure('invalid-parameter', 'mass must be positive and finite');
  const t = validateTerms(terms);
  return t.ok ? success(true) : t;
}


/** Search grid: log-spaced over the problem's length scales (3 decades beyond each end), plus fine linear patches over Gaussian terms. */
function searchGrid(sys: RadialSystem, scales: readonly number[]): { grid: number[]; lo: number; hi: number } {
  const lo = Math.min(...scales) / 1e3;
  const hi = Math.max(...scales) * 1e3;
  const decades = Math.log10(hi / lo);
  const count = Math.min(MAX_GRID_POINTS, Math.max(64, Math.ceil(decades * GRID_POINTS_PER_DECADE)));
  const grid = Array.from({ length: count + 1 }, (_, i) => lo * (hi / lo) ** (i / count));
  grid[count] = hi;
  for (const t of sys.terms) {
    if (t.kind !== 'gaussian') continue;
    const c = t.center ?? 0;
    for (let i = -64; i <= 64; i++) {
      const r = c + (i * t.width) / 8;
      if (r > lo && r < hi) grid.push(r);
    }
  }
  grid.sort((a, b) => a - b);
  return { grid: grid.filter((r, i) => i === 0 || r > grid[i - 1]!), lo, hi };
}

interface Extremum { readonly r: number; readonly curvature: number }

/**
 * Radii where dU_eff/dr = 0: sign changes of U_eff' on the grid, plus close pairs found through a
 * sign change of U_eff''. Grid points where U_eff' is exactly 0 (a flat, underflowed tail) are
 * skipped, so a plateau is not taken for a row of extrema.
 */
function findExtrema(sys: RadialSystem, grid: readonly number[]): Extremum[] {
  const d1 = (r: number): number => effectivePotential(sys, r).first;
  const d2 = (r: number): number => effectivePotential(sys, r).second;
  const points = grid
    .map((r) => ({ r, ...effectivePotential(sys, r) }))
    .filter((p) => isFin(p.first) && isFin(p.second) && p.first !== 0);
  const roots: number[] = [];
  for (let i = 0; i + 1 < points.length; i++) {
    const a = points[i]!;
    const b = points[i + 1]!;
    if (a.first * b.first < 0) roots.push(brentRoot(d1, a.r, b.r, a.first, b.first));
    else if (a.second * b.second < 0) {
      // U_eff' keeps its sign at both ends but its slope turns: two extrema may hide in this cell.
      const m = brentRoot(d2, a.r, b.r, a.second, b.second);
      const dm = d1(m);
      if (dm * a.first < 0) roots.push(brentRoot(d1, a.r, m, a.first, dm), brentRoot(d1, m, b.r, dm, b.first));
    }
  }
  return roots.map((r) => ({ r, curvature: d2(r) }));
}

interface Node { readonly r: number; readonly f: number; readonly touching?: 'minimum' | 'maximum' }

/** Root of F = E - U_eff between two nodes whose F values have opposite signs; extends past the grid towards 0 or infinity. */
function rootBetween(F: (r: number) => number, a: Node, b: Node): number | null {
  let lo = a.r;
  let hi = b.r;
  let fLo = a.f;
  let fHi = b.f;
  if (lo === 0) {
    // U_eff is monotonic below the grid: step down by decades until F takes its sign near 0.
    let r = hi;
    for (let k = 0; k < 60; k++) {
      r /= 10;
      const v = F(r);
      if (!isFin(v)) return null;
      if (Math.sign(v) === Math.sign(a.f)) {
        lo = r;
        fLo = v;
        break;
      }
      hi = r;
      fHi = v;
    }
    if (lo === 0) return null;
  } else if (hi === Infinity) {
    let r = lo;
    for (let k = 0; k < 60; k++) {
      r *= 10;
      const v = F(r);
      if (!isFin(v)) return null;
      if (Math.sign(v) === Math.sign(b.f)) {
        hi = r;
        fHi = v;
        break;
      }
      lo = r;
      fLo = v;
    }
    if (hi === Infinity) return null;
  }
  return brentRoot(F, lo, hi, fLo, fHi);
}

interface Breakpoint { readonly r: number; readonly touching?: 'minimum' | 'maximum' }

function regionMotion(inner: number, outer: number | null, initialRadialVelocity: number | undefined): Motion {
  if (outer !== null && inner === outer) return 'circular';
  if (inner === 0 && outer === null) return (initialRadialVelocity ?? 0) < 0 ? 'captured' : 'unbound';
  if (outer === null) return 'unbound';
  return inner === 0 ? 'captured' : 'bound';
}

/** Allowed regions from the ordered nodes (limits at 0 and infinity, grid ends, extrema) and the turning points between them. */
function allowedRegions(nodes: readonly Node[], breaks: readonly Breakpoint[], F: (r: number) => number, initial: CentralForceProblem['initial']): AllowedRegion[] {
  const edges: Breakpoint[] = [{ r: 0 }, ...breaks, { r: Infinity }];
  const regions: AllowedRegion[] = [];
  for (let i = 0; i + 1 < edges.length; i++) {
    const left = edges[i]!;
    const right = edges[i + 1]!;
    const inside = nodes.filter((n) => n.r > left.r && n.r < right.r && n.f !== 0);
    const finiteInside = inside.filter((n) => n.r > 0 && n.r < Infinity);
    let sign: number;
    if (finiteInside.length > 0) sign = Math.sign(finiteInside[0]!.f);
    else if (inside.length > 0) sign = Math.sign(inside[0]!.f);
    else if (left.touching || right.touching) sign = (left.touching ?? right.touching) === 'maximum' ? 1 : -1;
    else sign = Math.sign(F(right.r === Infinity ? 2 * left.r : left.r === 0 ? right.r / 2 : Math.sqrt(left.r * right.r)));
    if (sign <= 0) continue;
    const outer = right.r === Infinity ? null : right.r;
    const end = (b: Breakpoint, atLimit: RegionEnd): RegionEnd => (b.r === 0 || b.r === Infinity ? atLimit : b.touching === 'maximum' ? 'unstable-circular-orbit' : 'turning-point');
    regions.push({ inner: left.r, outer, innerEnd: end(left, 'centre'), outerEnd: end(right, 'infinity'), motion: regionMotion(left.r, outer, initial?.radialVelocity) });
  }
  for (const b of breaks) {
    if (b.touching === 'minimum') regions.push({ inner: b.r, outer: b.r, innerEnd: 'turning-point', outerEnd: 'turning-point', motion: 'circular' });
  }
  return regions.sort((a, b) => a.inner - b.inner);
}

/** The region holding the initial radius (the nearest one if rounding puts it just outside), else the outermost. */
function pickRegion(regions: readonly AllowedRegion[], initialRadius: number | undefined): number {
  if (initialRadius === undefined) return regions.length - 1;
  let best = 0;
  let bestGap = Infinity;
  regions.forEach((g, i) => {
    const gap = Math.max(0, g.inner - initialRadius, initialRadius - (g.outer ?? Infinity)) / initialRadius;
    if (gap < bestGap) {
      best = i;
      bestGap = gap;
    }
  });
  return best;
}

/**
 * Radial period T = 2 int dr / sqrt(2 (E - U_eff)/m) and apsidal angle
 * dphi = int (|l|/r^2) dr / sqrt(2 m (E - U_eff)) between simple turning points r1 < r2
 * (Landau & Lifshitz, Mechanics, 3rd ed., sec. 14 — from memory).
 * r = (r1 + r2)/2 - (r2 - r1)/2 cos(theta) removes the inverse-square-root endpoint singularities;
 * the integrand is then smooth and even-periodic in theta, where the trapezoidal rule converges
 * geometrically (Trefethen & Weideman, SIAM Review 56 (2014) 385 — from memory), doubled until
 * two successive results agree (with end-clustered nodes if needed, see periodicTrapezoid).
 * E - U_eff is built from increments anchored at each turning point (exact zeros there), blended:
 * evaluated plainly, rounding makes it negative next to the turning points (measured: the plain
 * form fails already at e = 0.01). Measured on Kepler orbits: ~1e-14 relative for
 * 0.01 <= e <= 1 - 1e-11, about 1e-16 / e below e = 0.01.
 */
function radialQuadrature(sys: RadialSystem, r1: number, r2: number): Outcome<{ period: number; apsidalAngle: number }> {
  const m = sys.mass;
  const absL = Math.abs(sys.angularMomentum);
  const h = (r2 - r1) / 2;
  // E - U_eff at r anchored at r1 (x = r - r1) and at r2 (x = r - r2).
  const f1 = (x: number, r: number): number => -effectiveIncrement(sys, r1, x, r);
  const f2 = (x: number, r: number): number => -effectiveIncrement(sys, r2, x, r);
  // Blend F = w f1 + (1 - w) f2 with w = cos^2(theta/2) exp(-sin^2(theta/2) / mu): each anchored
  // form is used where it is accurate (f1 loses digits once r - r1 >> r1, so w decays on that scale
  // when r1 << r2). Exact zeros at both ends; the ends' limits follow from F ~ theta^2 g.
  const mu = r1 / h;
  const g0 = (-effectivePotential(sys, r1).first * h) / 2 + ((1 + 1 / mu) * f2(r1 - r2, r1)) / 4;
  const gPi = (effectivePotential(sys, r2).first * h) / 2 + (Math.exp(-1 / mu) * f1(r2 - r1, r2)) / 4;
  if (!(g0 > 0) || !(gPi > 0)) {
    return failure('no-convergence', `turning points ${r1} and ${r2} are not simple roots of E = U_eff (E at or near the top of a barrier, or U_eff too flat there to resolve)`);
  }
  // psi = dt/dtheta at the ends.
  const edge = (g: number, r: number): [number, number] => {
    const psi = h / Math.sqrt((2 * g) / m);
    return [psi, (absL / (m * r * r)) * psi];
  };
  const [a0, b0] = edge(g0, r1);
  const [aPi, bPi] = edge(gPi, r2);
  let bad: number | null = null;
  // [dt/dtheta, dphi/dtheta] at distance tau from the end r1 (atStart) or r2: the distance is
  // passed, not theta, so that the small half-angle factor keeps full precision at either end.
  const integrand = (tau: number, atStart: boolean): [number, number] => {
    if (tau < 1e-150) return atStart ? [a0, b0] : [aPi, bPi]; // sin^2(tau/2) would underflow
    const near = Math.sin(tau / 2);
    const far = Math.cos(tau / 2);
    const [s, c] = atStart ? [near, far] : [far, near]; // sin and cos of theta/2
    const s2 = s * s;
    const c2 = c * c;
    const r = atStart ? r1 + 2 * h * s2 : r2 - 2 * h * c2;
    const w = c2 * Math.exp(-s2 / mu);
    const F = w * f1(2 * h * s2, r) + (1 - w) * f2(-2 * h * c2, r);
    if (!(F > 0) || !isFin(F)) bad ??= r;
    const psi = (2 * h * s * c) / Math.sqrt((2 * F) / m);
    return [psi, (absL / (m * r * r)) * psi];
  };
  // Very eccentric orbits (r2/r1 >> 1) and E near a barrier top put a narrow peak at an end:
  // if the plain rule has not converged, retry with nodes clustered at the ends.
  for (const [level, maxNodes] of QUADRATURE_LEVELS) {
    const q = periodicTrapezoid(integrand, level, maxNodes);
    if (bad !== null) return failure('no-convergence', `E - U_eff is not positive at r = ${bad} between the turning points ${r1} and ${r2}`);
    if (q) return success({ period: 2 * q[0], apsidalAngle: q[1] });
  }
  return failure('no-convergence', `radial quadrature between ${r1} and ${r2} did not converge (E very close to the top of a barrier?)`);
}

/**
 * theta(phi) after `level` applications of Sidi's sin^2 transformation T(x) = x - sin(2x)/2
 * (A. Sidi, 1993 — from memory), with d theta / d phi. Each application maps [0, pi] onto itself,
 * clusters nodes at both ends (theta ~ (2/3) phi^3) and keeps an even periodic integrand periodic.
 * Used for phi in [0, pi/2] (the distance from the nearer end).
 */
function stretch(phi: number, level: number): [theta: number, weight: number] {
  let theta = phi;
  let weight = 1;
  for (let i = 0; i < level; i++) {
    const sn = Math.sin(theta);
    weight *= 2 * sn * sn; // T'(x) = 1 - cos 2x
    theta -= sn * Math.cos(theta);
  }
  return [theta, weight];
}

/**
 * Trapezoidal rule for both integrals over theta in [0, pi] in the stretched variable, doubled
 * from 8 nodes until two results agree to QUADRATURE_TOLERANCE; null if maxNodes is reached first.
 * Node j of n sits at phi = j pi / n; the stretch is applied to the distance from the nearer end
 * (T(pi - x) = pi - T(x)).
 */
function periodicTrapezoid(integrand: (tau: number, atStart: boolean) => [number, number], level: number, maxNodes: number): [number, number] | null {
  const sample = (j: number, n: number): [number, number] => {
    const atStart = 2 * j <= n;
    const [tau, weight] = stretch(((atStart ? j : n - j) * Math.PI) / n, level);
    if (weight === 0) return [0, 0];
    const [a, b] = integrand(tau, atStart);
    return [a * weight, b * weight];
  };
  let n = 8;
  const [a0, b0] = sample(0, n);
  const [aPi, bPi] = sample(n, n);
  let sumA = (a0 + aPi) / 2;
  let sumB = (b0 + bPi) / 2;
  for (let j = 1; j < n; j++) {
    const [a, b] = sample(j, n);
    sumA += a;
    sumB += b;
  }
  let ta = (sumA * Math.PI) / n;
  let tb = (sumB * Math.PI) / n;
  while (n < maxNodes) {
    for (let j = 1; j < 2 * n; j += 2) {
      const [a, b] = sample(j, 2 * n);
      sumA += a;
      sumB += b;
    }
    n *= 2;
    const na = (sumA * Math.PI) / n;
    const nb = (sumB * Math.PI) / n;
    const converged = Math.abs(na - ta) <= QUADRATURE_TOLERANCE * na && Math.abs(nb - tb) <= QUADRATURE_TOLERANCE * Math.max(nb, EPS);
    ta = na;
    tb = nb;
    if (converged && n >= 32) return [ta, tb];
  }
  return null;
}

/** Radii for the effective-potential samples: around the analysed region's turning points, circular orbits and initial radius. */
function sampleRadii(
  region: AllowedRegion,
  features: { turning: readonly number[]; circular: readonly number[]; initial?: number; scales: readonly number[] },
  opts: AnalysisOptions,
  count: number,
): { radii: number[]; spacing: 'linear' | 'log' } {
  const core = [region.inner, region.outer ?? 0, features.initial ?? 0].filter((r) => r > 0);
  const near = (r: number): boolean => core.length === 0 || (r > Math.min(...core) / 10 && r < Math.max(...core) * 10);
  const all = [...core, ...features.turning.filter(near), ...features.circular.filter(near)];
  const pts = all.length > 0 ? all : [...features.scales];
  let lo = opts.rMin ?? Math.min(...pts) / 2;
  let hi = opts.rMax ?? Math.max(...pts) * (region.outer === null ? 4 : 2);
  if (!(hi > lo)) [lo, hi] = [Math.min(lo, hi) / 2, Math.max(lo, hi) * 2];
  const spacing = hi / lo > 20 ? 'log' : 'linear';
  const radii = Array.from({ length: count }, (_, i) => {
    const q = count === 1 ? 0 : i / (count - 1);
    return spacing === 'log' ? lo * (hi / lo) ** q : lo + (hi - lo) * q;
  });
  radii[count - 1] = hi;
  return { radii, spacing };
}

/**
 * Effective-potential analysis: samples, turning points, circular orbits and their stability,
 * allowed regions and the motion in the region holding the initial radius (else the outermost),
 * with radial period, apsidal angle and precession for bound motion.
 * Failures: 'invalid-parameter', 'energy-below-minimum' (no r with E >= U_eff),
 * 'no-convergence' (quadrature, e.g. E at the top of a barrier).
 */
/** The checks of a problem and its options that the schema cannot make; null when all pass. */
function invalidInput(p: CentralForceProblem, opts: AnalysisOptions): Failure | null {
  const checked = checkSystem(p.mass, p.terms);
  if (!checked.ok) return checked;
  if (!isFin(p.angularMomentum) || !isFin(p.energy)) return failure('invalid-parameter', 'angular momentum and energy must be finite');
  const count = opts.samples ?? DEFAULT_SAMPLES;
  if (!Number.isInteger(count) || count < 2 || count > MAX_SAMPLES) return failure('invalid-parameter', `samples must be an integer in 2..${MAX_SAMPLES}`);
  for (const [name, v] of [['rMin', opts.rMin], ['rMax', opts.rMax]] as const) {
    if (v !== undefined && !(v > 0 && isFin(v))) return failure('invalid-parameter', `${name} must be positive and finite`);
  }
  if (opts.rMin !== undefined && opts.rMax !== undefined && !(opts.rMax > opts.rMin)) return failure('invalid-parameter', 'rMax must exceed rMin');
  if (p.initial && !(p.initial.radius > 0 && isFin(p.initial.radius) && isFin(p.initial.radialVelocity))) return failure('invalid-parameter', 'initial radius must be positive and finite');
  return null;
}

/** Where E - U_eff changes sign or touches zero, from r = 0 to infinity, and the regions where E >= U_eff. */
function regionsOf(sys: RadialSystem, E: number, initial: CentralForceProblem['initial']) {
  const F = (r: number): number => E - effectivePotential(sys, r).value;
  const scales = lengthScales(sys, E);
  if (initial) scales.push(initial.radius);
  const { grid, lo, hi } = searchGrid(sys, scales);
  const extrema = findExtrema(sys, grid);
  const limits = effectiveLimits(sys);
  const nodes: Node[] = [
    { r: 0, f: E - limits.atZero },
    { r: lo, f: F(lo) },
    ...extrema.map((x): Node => {
      const f = F(x.r);
      if (Math.abs(f) > TOUCH_TOLERANCE * (energyScale(sys, x.r) + Math.abs(E))) return { r: x.r, f };
      return { r: x.r, f: 0, touching: x.curvature > 0 ? 'minimum' : 'maximum' };
    }),
    { r: hi, f: F(hi) },
    { r: Infinity, f: E - limits.atInfinity },
  ];
  const breaks: Breakpoint[] = [];
  for (let i = 0; i + 1 < nodes.length; i++) {
    const a = nodes[i]!;
    const b = nodes[i + 1]!;
    if (a.touching) breaks.push({ r: a.r, touching: a.touching });
    if (a.f * b.f < 0) {
      const root = rootBetween(F, a, b);
      if (root !== null) breaks.push({ r: root });
    }
  }
  return { scales, extrema, breaks, regions: allowedRegions(nodes, breaks, F, initial) };
}

/** The circular orbit at each extremum of U_eff, with its stability and small-oscillation frequencies. */
function circularOrbitsAt(sys: RadialSystem, extrema: readonly Extremum[]): CircularOrbit[] {
  const { mass, angularMomentum: l } = sys;
  return extrema.map((x): CircularOrbit => {
    const stable = x.curvature > 0;
    const radialFrequency = stable ? Math.sqrt(x.curvature / mass) : null; // small oscillations, Goldstein 3rd ed. sec. 3.6 — from memory
    const angularFrequency = Math.abs(l) / (mass * x.r * x.r);
    const frequencyRatio = radialFrequency !== null && angularFrequency > 0 ? radialFrequency / angularFrequency : null;
    return {
      radius: x.r,
      stable,
      energy: effectivePotential(sys, x.r).value,
      radialFrequency,
      angularFrequency,
      frequencyRatio,
      apsidalAngle: frequencyRatio !== null ? Math.PI / frequencyRatio : null,
    };
  });
}

/** Radial period and apsidal angle of the motion in a region (null where the motion is not periodic; no apsidal angle when rectilinear). */
function periodOf(sys: RadialSystem, region: AllowedRegion, circularOrbits: readonly CircularOrbit[]): Outcome<{ radialPeriod: number | null; apsidalAngle: number | null }> {
  let radialPeriod: number | null = null;
  let apsidalAngle: number | null = null;
  if (region.motion === 'circular') {
    const orbit = circularOrbits.find((c) => c.radius === region.inner);
    if (orbit?.radialFrequency) radialPeriod = TWO_PI / orbit.radialFrequency;
    apsidalAngle = orbit?.apsidalAngle ?? null;
  } else if (region.motion === 'bound' && region.innerEnd === 'turning-point' && region.outerEnd === 'turning-point') {
    const q = radialQuadrature(sys, region.inner, region.outer!);
    if (!q.ok) return q;
    radialPeriod = q.value.period;
    apsidalAngle = q.value.apsidalAngle;
  }
  return success({ radialPeriod, apsidalAngle: sys.angularMomentum === 0 ? null : apsidalAngle });
}

/**
 * The effective-potential analysis of a problem: validate, find the allowed regions and their
 * turning points, the circular orbits, the radial period and apsidal angle of the region the
 * motion is in, and U, U_eff sampled over it.
 */
export function analyseCentralForce(p: CentralForceProblem, opts: AnalysisOptions = {}): Outcome<CentralForceAnalysis> {
  const invalid = invalidInput(p, opts);
  if (invalid) return invalid;
  const { mass, energy: E, angularMomentum: l } = p;
  const sys: RadialSystem = { terms: p.terms, mass, angularMomentum: l };
  const { scales, extrema, breaks, regions } = regionsOf(sys, E, p.initial);
  if (regions.length === 0) {
    return failure('energy-below-minimum', `no radius has E >= U_eff: the energy ${E} lies below the minimum of the effective potential`);
  }
  const regionIndex = pickRegion(regions, p.initial?.radius);
  const region = regions[regionIndex]!;
  const circularOrbits = circularOrbitsAt(sys, extrema);
  const period = periodOf(sys, region, circularOrbits);
  if (!period.ok) return period;
  const { radialPeriod, apsidalAngle } = period.value;

  const features = {
    turning: breaks.map((b) => b.r),
    circular: extrema.map((x) => x.r),
    scales,
    ...(p.initial ? { initial: p.initial.radius } : {}),
  };
  const { radii, spacing } = sampleRadii(region, features, opts, opts.samples ?? DEFAULT_SAMPLES);
  const effectiveSamples = radii
    .map((r) => ({ r, u: potential(p.terms, r).value, uEff: effectivePotential(sys, r).value }))
    .filter((s) => isFin(s.u) && isFin(s.uEff));

  return success({
    mass,
    angularMomentum: l,
    energy: E,
    effectivePotential: effectiveSamples,
    sampleSpacing: spacing,
    turningPoints: breaks.map((b) => b.r),
    circularOrbits,
    allowedRegions: regions,
    regionIndex,
    motion: region.motion,
    rectilinear: l === 0,
    periapsis: region.inner > 0 ? region.inner : null,
    apoapsis: region.outer,
    radialPeriod,
    apsidalAngle,
    precessionPerOrbit: apsidalAngle !== null ? 2 * apsidalAngle - TWO_PI : null,
  });
}
