// Ground-station pass search: when is a spacecraft above each station's horizon mask?
//
// 1. Coarse scan. The spacecraft's Earth-fixed state is computed once per coarse step and shared
//    by all stations. Step: propagation/scan-step.ts with the Earth's rotation as the reference
//    rate (the direction seen from the Earth's centre turns relative to the Earth at most at
//    w = h / rp^2 + omegaEarth). Elevation falls as the central angle psi between station and
//    spacecraft grows, so an elevation maximum (psi near a minimum) and the next minimum are at
//    least pi / w apart, and each step of pi / (8 w) holds at most one extremum of elevation
//    (333 s at 500 km altitude; 10 s to 600 s). A pass shorter than a step (a grazing one, max
//    elevation just above the limit) has negative "elevation - limit" at both ends of its step,
//    but the elevation rate changes sign from + to - there: each such step is searched for its
//    maximum (numerics/positive-intervals.ts), so grazing passes are not missed.
// 2. Prefilter. A station at radius R sees the spacecraft at radius r above geocentric elevation e
//    only when psi <= acos(R/r cos e) - e (plane triangle centre-station-spacecraft; common
//    practice, no source). psi and r change at bounded rates (1.5 x the two-body bounds) over a
//    step, so most steps are ruled out with two dot products and no look angles.
// 3. Refinement. AOS/LOS: bracketed root of "elevation - limit" (Illinois regula falsi with a
//    bisection safeguard; Dowell & Jarratt, BIT 11 (1971) 168, from memory) to 1e-3 s. TCA (time
//    of maximum elevation inside the pass): golden-section search (Kiefer 1953; Press et al.,
//    Numerical Recipes 3rd ed. sec. 10.2) to 1e-2 s.
// 4. Masks. The limit is piecewise linear in azimuth, so "elevation - limit" has kinks. The
//    coarse scan runs on its smooth envelope "elevation - lowest limit"; inside each envelope
//    interval a fine scan (steps of at most 10 s and 0.5 deg of azimuth or elevation) finds where
//    the spacecraft is above the mask itself. A mask notch narrower than 0.5 deg of azimuth can
//    hide a sub-second window.
// 5. Refraction (optional, stations/refraction.ts): every elevation the search reads is the
//    apparent one, a rising function of the geometric elevation, so the extrema and the step
//    argument stay as they are; the prefilter's bound is lowered by the largest refraction.
// Limits: orbits whose Earth-fixed track loops (near the apoapsis of high orbits) may show two
// elevation extrema within one step; a visibility shorter than a step that begins and ends with
// the same elevation trend can then be missed. Passes already up at the window start or still up
// at its end are clipped to the window and flagged.

import { EARTH_ROTATION_RATE_RAD_S, gcrfToItrfTabledInto, orientationTable, type FrameOptions, type OrientationTable } from '../earth/frames.js';
import { createHorizonMask, horizonLimit, horizonLimitSlope, isFlatMask, type HorizonMask, type MaskPoint } from './horizon-mask.js';
import { BODIES } from '../bodies/bodies.js';
import { goldenSectionMax } from '../numerics/golden-section.js';
import { positiveIntervals, type PositiveInterval } from '../numerics/positive-intervals.js';
import { PropagationStopped, gcrfStateAt, unwrapState, type StateAt, type StateBatch } from '../propagation/state-source.js';
import { scanStep } from '../propagation/scan-step.js';
import { DEG, roundToMicrosecond, SECONDS_PER_DAY } from '../core/math.js';
import { failure, success, type Outcome } from '../core/result.js';
import { refractionOf, type Refraction, type RefractionSpec } from './refraction.js';
import {
  dopplerFactor, elevationOf, lookAnglesInto, stationFromGeodetic, LOOK_AZIMUTH, LOOK_AZIMUTH_RATE, LOOK_ELEVATION, LOOK_ELEVATION_RATE,
  LOOK_RANGE, LOOK_RANGE_RATE, type LookAngles, type Station,
} from './topocentric.js';
import { dot, norm, type Vec3 } from '../core/vec3.js';

/** Longest pass-search window, s (31 days). */
export const MAX_PASS_WINDOW_S = 31 * SECONDS_PER_DAY;
/** Most stations in one search. */
export const MAX_PASS_STATIONS = 100;
/** Most pointing samples over all passes of one search. */
export const MAX_POINTING_SAMPLES = 500_000;
/** Smallest pointing step, s. */
export const MIN_POINTING_STEP_S = 0.1;

const ROOT_TOLERANCE_S = 1e-3;
const PEAK_TOLERANCE_S = 1e-2;
const FINE_MAX_STEP_S = 10;
const FINE_MIN_STEP_S = 0.01;
const FINE_ANGLE_STEP = 0.5 * DEG;
/** Safety factor on the rate bounds of the prefilter (perturbed orbits drift from the osculating bound). */
const RATE_MARGIN = 1.5;
/** Added to the two-body bound on the radial speed, km/s. */
const RADIAL_SPEED_FLOOR = 0.05;

export type { GcrfState, StateAt, StateBatch } from '../propagation/state-source.js';

export interface PassStation {
  /** Unique within one search. */
  readonly id: string;
  /** Geodetic latitude, longitude (rad) and height (km, -10 to 100) on WGS-84. */
  readonly latitude: number;
  readonly longitude: number;
  readonly height: number;
  /** rad. */
  readonly minElevation: number;
  readonly mask?: readonly MaskPoint[];
}

export interface PassSearchOptions extends FrameOptions {
  /** Pointing track step, s; no pointing track when absent. */
  readonly pointingStepS?: number;
  /** GM used to size the coarse step (default Earth's), km^3/s^2. */
  readonly gm?: number;
  /**
   * Atmospheric refraction (stations/refraction.ts): elevations become apparent ones, so AOS/LOS
   * are where the apparent elevation crosses the limit, and maxElevation and the pointing
   * elevations are apparent. Absent or "none": geometric elevations.
   */
  readonly refraction?: RefractionSpec;
}

export interface PassSearch {
  readonly stateAt: StateAt;
  readonly stateBatch?: StateBatch;
  readonly startTT: number;
  readonly stopTT: number;
  readonly stations: readonly PassStation[];
  readonly options?: PassSearchOptions;
}

export interface PointingSample {
  readonly tt: number;
  readonly azimuth: number;
  readonly elevation: number;
  readonly range: number;
  readonly rangeRate: number;
  readonly dopplerFactor: number;
}

export interface Pass {
  readonly station: string;
  /** TT seconds since J2000. */
  readonly aos: number;
  readonly los: number;
  /** Time of maximum elevation within [aos, los]. */
  readonly tca: number;
  readonly durationS: number;
  /** rad. */
  readonly maxElevation: number;
  readonly azimuthAos: number;
  readonly azimuthTca: number;
  readonly azimuthLos: number;
  /** km. */
  readonly rangeTca: number;
  readonly startsBeforeWindow: boolean;
  readonly endsAfterWindow: boolean;
  readonly pointing?: readonly PointingSample[];
}

export interface PassSearchResult {
  readonly passes: readonly Pass[];
  readonly coarseStepS: number;
  /** Propagator calls made (coarse track, refinement and pointing). */
  readonly evaluations: number;
}

/**
 * Coarse step (s) and the rate bounds behind it, from an osculating state (propagation/scan-step.ts).
 */
export function coarseStepFor(r: Vec3, v: Vec3, gm = BODIES.earth.gm): RateBounds & { stepS: number } {
  const scan = scanStep(r, v, gm, EARTH_ROTATION_RATE_RAD_S);
  const [e, h] = [scan.eccentricity, scan.angularMomentum];
  // Radial speed |dr/dt| = (gm / h) e |sin(nu)| <= gm e / h (Vallado 4th ed. sec. 2.3, from memory);
  // the constant term covers perturbations of near-circular orbits (J2: a few m/s).
  const radialSpeedMax = h > 0 ? RATE_MARGIN * ((gm * e) / h) + RADIAL_SPEED_FLOOR : norm(v);
  return { stepS: scan.stepS, psiDotMax: RATE_MARGIN * scan.turnRateRadS, radialSpeedMax };
}

/** Upper bounds on the Earth-fixed turn rate of the spacecraft direction (rad/s) and on |dr/dt| (km/s). */
interface RateBounds {
  readonly psiDotMax: number;
  readonly radialSpeedMax: number;
}

interface Prepared {
  readonly id: string;
  readonly index: number;
  readonly station: Station;
  readonly mask: HorizonMask;
  readonly flat: boolean;
  readonly unit: Vec3;
  readonly radius: number;
  /** Lowest limit minus the geodetic/geocentric vertical deflection: a geocentric elevation bound. */
  readonly geocentricLow: number;
}

/** `lift`: the largest refraction (rad), by which the prefilter's geometric bound is lowered. */
function prepareStations(stations: readonly PassStation[], lift: number): Outcome<Prepared[]> {
  const seen = new Set<string>();
  const out: Prepared[] = [];
  for (const [index, s] of stations.entries()) {
    if (typeof s.id !== 'string' || s.id === '' || seen.has(s.id)) {
      return failure('invalid-parameter', `station ${index}: id must be a non-empty string used once (got "${s.id}")`);
    }
    seen.add(s.id);
    if (!(Math.abs(s.latitude) <= Math.PI / 2) || !Number.isFinite(s.longitude) || !(s.height >= -10 && s.height <= 100)) {
      return failure('invalid-parameter', `station "${s.id}": latitude must lie in [-90, 90] deg, longitude be finite, height in [-10, 100] km`);
    }
    const mask = createHorizonMask(s.mask ?? [], s.minElevation);
    if (!mask.ok) return failure(mask.code, `station "${s.id}": ${mask.message}`);
    const station = stationFromGeodetic(s.latitude, s.longitude, s.height);
    const radius = norm(station.position);
    const unit: Vec3 = [station.position[0] / radius, station.position[1] / radius, station.position[2] / radius];
    const deflection = Math.acos(Math.min(1, dot(unit, station.up)));
    out.push({ id: s.id, index, station, mask: mask.value, flat: isFlatMask(mask.value), unit, radius, geocentricLow: mask.value.lowest - deflection - lift - 1e-6 });
  }
  return success(out);
}

/** Earth-fixed states kept from the latest TCA search (its final point is looked at again). */
const RECENT = 64;

/**
 * Shared state of one search: the orientation table, the propagator, a call counter and scratch
 * arrays. Every evaluation writes its Earth-fixed state and look angles into these arrays instead
 * of new objects (the search makes tens of thousands of them); the numbers are those of
 * gcrfToItrfTabled and lookAngles, bit for bit.
 */
interface Context {
  readonly table: OrientationTable;
  readonly stateAt: StateAt;
  readonly startTT: number;
  readonly stopTT: number;
  /** Elevations (and their rates) become apparent ones when refraction is asked. */
  readonly refraction: Refraction | null;
  /** One Earth-fixed state (r, v) and its look angles (slots LOOK_*). */
  readonly state: Float64Array;
  readonly angles: Float64Array;
  /** The fine scan of a masked station: sample times and 6 look angles per sample; grown as needed. */
  fineTimes: Float64Array;
  fineLooks: Float64Array;
  /** Epochs and Earth-fixed states of the latest TCA search's evaluations. */
  readonly recentTimes: Float64Array;
  readonly recentStates: Float64Array;
  recentCount: number;
  calls: number;
}

/** The Earth-fixed state at tt written to out[o..o+5]: one propagator call. */
function earthFixedInto(ctx: Context, tt: number, out: Float64Array, o: number): void {
  ctx.calls++;
  const { r, v } = gcrfStateAt(ctx.stateAt, tt);
  gcrfToItrfTabledInto(ctx.table, tt, r[0], r[1], r[2], v[0], v[1], v[2], out, o);
}

/** Look angles of the Earth-fixed state s[o..] into out[p..] as the search reads them (apparent elevation with refraction). */
function anglesInto(ctx: Context, st: Prepared, s: Float64Array, o: number, out: Float64Array, p: number): void {
  lookAnglesInto(st.station, s, o, out, p);
  const rf = ctx.refraction;
  if (!rf) return;
  const geometric = out[p + LOOK_ELEVATION]!;
  out[p + LOOK_ELEVATION] = rf.apparent(geometric);
  out[p + LOOK_ELEVATION_RATE] = rf.slope(geometric) * out[p + LOOK_ELEVATION_RATE]!;
}

/** The elevation of the Earth-fixed position s[o..] as the search reads it. */
function elevationIn(ctx: Context, st: Prepared, s: Float64Array, o: number): number {
  const geometric = elevationOf(st.station, s, o);
  return ctx.refraction ? ctx.refraction.apparent(geometric) : geometric;
}

/** Look angles of the Earth-fixed state s[o..] as an object. */
function looksOf(ctx: Context, st: Prepared, s: Float64Array, o: number): LookAngles {
  const a = ctx.angles;
  anglesInto(ctx, st, s, o, a, 0);
  return {
    azimuth: a[LOOK_AZIMUTH]!,
    elevation: a[LOOK_ELEVATION]!,
    range: a[LOOK_RANGE]!,
    rangeRate: a[LOOK_RANGE_RATE]!,
    azimuthRate: a[LOOK_AZIMUTH_RATE]!,
    elevationRate: a[LOOK_ELEVATION_RATE]!,
  };
}

/** Look angles at an epoch (one propagator call). */
function lookAt(ctx: Context, st: Prepared, tt: number): LookAngles {
  earthFixedInto(ctx, tt, ctx.state, 0);
  return looksOf(ctx, st, ctx.state, 0);
}

/** Elevation at an epoch (one propagator call, no azimuth or rates). */
function elevationAt(ctx: Context, st: Prepared, tt: number): number {
  earthFixedInto(ctx, tt, ctx.state, 0);
  return elevationIn(ctx, st, ctx.state, 0);
}

/** The coarse Earth-fixed track: times and 6 numbers per sample. */
interface Track {
  readonly times: Float64Array;
  readonly states: Float64Array;
  /** |r| per sample (norm() of vec3.ts), for the prefilter. */
  readonly radii: Float64Array;
}

function coarseTrack(ctx: Context, batch: StateBatch | undefined, stepS: number): Track {
  const count = Math.ceil((ctx.stopTT - ctx.startTT) / stepS) + 1;
  const times = new Float64Array(count);
  for (let k = 0; k < count; k++) times[k] = Math.min(ctx.startTT + k * stepS, ctx.stopTT);
  const states = new Float64Array(6 * count);
  const gcrf = batch ? unwrapState(batch(times), 'the coarse track') : undefined;
  if (gcrf && gcrf.length !== 6 * count) throw new TypeError('stateBatch must return 6 numbers per epoch');
  for (let k = 0; k < count; k++) {
    const tt = times[k]!;
    const o = 6 * k;
    if (gcrf) {
      ctx.calls++;
      gcrfToItrfTabledInto(ctx.table, tt, gcrf[o]!, gcrf[o + 1]!, gcrf[o + 2]!, gcrf[o + 3]!, gcrf[o + 4]!, gcrf[o + 5]!, states, o);
    } else {
      earthFixedInto(ctx, tt, states, o);
    }
  }
  const radii = new Float64Array(count);
  for (let k = 0; k < count; k++) radii[k] = Math.hypot(states[6 * k]!, states[6 * k + 1]!, states[6 * k + 2]!);
  return { times, states, radii };
}

/** An interval where the station sees the spacecraft. */
type Interval = PositiveInterval;

/** Room for n fine samples. */
function fineCapacity(ctx: Context, n: number): void {
  if (n <= ctx.fineTimes.length) return;
  const size = Math.max(n, 2 * ctx.fineTimes.length);
  const times = new Float64Array(size);
  const looks = new Float64Array(6 * size);
  times.set(ctx.fineTimes);
  looks.set(ctx.fineLooks);
  ctx.fineTimes = times;
  ctx.fineLooks = looks;
}

/**
 * Fine sample times across [a, b] (steps of at most 10 s and 0.5 deg of azimuth or elevation) and
 * their look angles, written to ctx.fineTimes and ctx.fineLooks; returns the sample count.
 */
function fineSamples(ctx: Context, st: Prepared, a: number, b: number): number {
  let n = 0;
  const push = (t: number): void => {
    fineCapacity(ctx, n + 1);
    ctx.fineTimes[n] = t;
    earthFixedInto(ctx, t, ctx.state, 0);
    anglesInto(ctx, st, ctx.state, 0, ctx.fineLooks, 6 * n);
    n++;
  };
  push(a);
  let t = a;
  while (t < b) {
    const o = 6 * (n - 1);
    const rate = Math.max(Math.abs(ctx.fineLooks[o + LOOK_AZIMUTH_RATE]!), Math.abs(ctx.fineLooks[o + LOOK_ELEVATION_RATE]!), 1e-12);
    let dt = Math.min(FINE_MAX_STEP_S, Math.max(FINE_MIN_STEP_S, FINE_ANGLE_STEP / rate));
    if (b - (t + dt) < FINE_MIN_STEP_S) dt = b - t;
    t += dt;
    push(t);
  }
  return n;
}

function searchStation(ctx: Context, st: Prepared, track: Track, bounds: RateBounds): Interval[] {
  const count = track.times.length;
  const cache = new Array<LookAngles | undefined>(count);
  const sample = (k: number): LookAngles => (cache[k] ??= looksOf(ctx, st, track.states, 6 * k));
  // Central angle between station and spacecraft per sample (each sample serves two steps of the prefilter).
  const psis = new Float64Array(count).fill(Number.NaN);
  const [u0, u1, u2] = st.unit;
  const psi = (k: number): number => {
    let x = psis[k]!;
    if (Number.isNaN(x)) {
      const s = track.states;
      const o = 6 * k;
      // dot() of vec3.ts written out.
      x = Math.acos(Math.min(1, Math.max(-1, (s[o]! * u0 + s[o + 1]! * u1 + s[o + 2]! * u2) / track.radii[k]!)));
      psis[k] = x;
    }
    return x;
  };
  const low = st.mask.lowest;
  const tolerances = { rootTolS: ROOT_TOLERANCE_S, peakTolS: PEAK_TOLERANCE_S };
  const envelope = positiveIntervals<LookAngles>({
    times: track.times,
    sample,
    ruledOut: (k) => !mayBeVisible(st, track, k, bounds, psi(k), psi(k + 1)),
    valueAt: (t) => elevationAt(ctx, st, t) - low,
    value: (l) => l.elevation - low,
    rate: (l) => l.elevationRate,
    edges: { startsBefore: true, endsAfter: true },
    ...tolerances,
  });
  if (st.flat) return envelope;
  const mask = st.mask;
  const angles = ctx.angles;
  const out: Interval[] = [];
  for (const iv of envelope) {
    const n = fineSamples(ctx, st, iv.start, iv.stop);
    const looks = ctx.fineLooks;
    // Fine sample k is its index; its look angles are looks[6k + LOOK_*].
    const inside = positiveIntervals<number>({
      times: ctx.fineTimes.subarray(0, n),
      sample: (k) => k,
      valueAt: (t) => {
        earthFixedInto(ctx, t, ctx.state, 0);
        anglesInto(ctx, st, ctx.state, 0, angles, 0);
        return angles[LOOK_ELEVATION]! - horizonLimit(mask, angles[LOOK_AZIMUTH]!);
      },
      value: (k) => looks[6 * k + LOOK_ELEVATION]! - horizonLimit(mask, looks[6 * k + LOOK_AZIMUTH]!),
      rate: (k) => looks[6 * k + LOOK_ELEVATION_RATE]! - horizonLimitSlope(mask, looks[6 * k + LOOK_AZIMUTH]!) * looks[6 * k + LOOK_AZIMUTH_RATE]!,
      edges: iv,
      ...tolerances,
    });
    out.push(...inside);
  }
  return out;
}

/**
 * Prefilter: false when the station cannot see the spacecraft anywhere in step k (central angles
 * psiA, psiB at its ends). Uses lower
 * bounds on the central angle and upper bounds on the radius over the step (Lipschitz bounds
 * from psiDotMax and radialSpeedMax).
 */
function mayBeVisible(st: Prepared, track: Track, k: number, bounds: RateBounds, psiA: number, psiB: number): boolean {
  const na = track.radii[k]!;
  const nb = track.radii[k + 1]!;
  const dt = track.times[k + 1]! - track.times[k]!;
  const psiLow = (psiA + psiB - bounds.psiDotMax * dt) / 2;
  const rHigh = (na + nb + bounds.radialSpeedMax * dt) / 2;
  const e = st.geocentricLow;
  const c = (st.radius / rHigh) * Math.cos(e);
  if (!(c < 1)) return true;
  const psiVisible = Math.acos(c) - e; // cos(e + psi) = (R / r) cos e
  return psiLow <= psiVisible;
}

/** Bracket of the highest elevation in [a, b]: around the best coarse sample inside (long passes may hold several maxima). */
function peakBracket(ctx: Context, st: Prepared, track: Track, a: number, b: number): [number, number] {
  const { times } = track;
  let best = -1;
  let bestEl = -Infinity;
  const first = Math.max(0, Math.floor((a - times[0]!) / (times[1]! - times[0]!)));
  for (let k = first; k < times.length && times[k]! < b; k++) {
    if (times[k]! <= a) continue;
    const el = elevationIn(ctx, st, track.states, 6 * k);
    if (el > bestEl) {
      bestEl = el;
      best = k;
    }
  }
  if (best < 0) return [a, b];
  return [Math.max(a, times[best - 1] ?? a), Math.min(b, times[best + 1] ?? b)];
}

/** The elevation at tt, its Earth-fixed state kept among the recent ones (the TCA search). */
function elevationKept(ctx: Context, st: Prepared, tt: number): number {
  const slot = ctx.recentCount % RECENT;
  ctx.recentCount++;
  ctx.recentTimes[slot] = tt;
  earthFixedInto(ctx, tt, ctx.recentStates, 6 * slot);
  return elevationIn(ctx, st, ctx.recentStates, 6 * slot);
}

/** Look angles at tt: from a recent state of that very epoch when one is kept, else one propagator call. */
function lookAtRecent(ctx: Context, st: Prepared, tt: number): LookAngles {
  for (let j = ctx.recentCount - 1; j >= 0 && j >= ctx.recentCount - RECENT; j--) {
    const slot = j % RECENT;
    if (ctx.recentTimes[slot] === tt) return looksOf(ctx, st, ctx.recentStates, 6 * slot);
  }
  return lookAt(ctx, st, tt);
}

function describe(ctx: Context, st: Prepared, track: Track, iv: Interval, pointingStepS: number | undefined): Pass {
  // Events and pointing samples sit on the microsecond, the resolution of the printed epochs: every
  // look angle is at the epoch printed beside it (a window edge is on the microsecond already).
  const aosT = roundToMicrosecond(iv.start);
  const losT = roundToMicrosecond(iv.stop);
  const aos = lookAt(ctx, st, aosT);
  const los = lookAt(ctx, st, losT);
  const [a, b] = peakBracket(ctx, st, track, iv.start, iv.stop);
  ctx.recentCount = 0;
  let tca = roundToMicrosecond(b - a > PEAK_TOLERANCE_S ? goldenSectionMax((t) => elevationKept(ctx, st, t), a, b, PEAK_TOLERANCE_S).t : a);
  let top = lookAtRecent(ctx, st, tca);
  for (const [t, l] of [[aosT, aos], [losT, los]] as const) {
    if (l.elevation > top.elevation) {
      tca = t;
      top = l;
    }
  }
  const pass: Pass = {
    station: st.id,
    aos: aosT,
    los: losT,
    tca,
    durationS: losT - aosT,
    maxElevation: top.elevation,
    azimuthAos: aos.azimuth,
    azimuthTca: top.azimuth,
    azimuthLos: los.azimuth,
    rangeTca: top.range,
    startsBeforeWindow: iv.startsBefore,
    endsAfterWindow: iv.endsAfter,
  };
  if (pointingStepS === undefined) return pass;
  const pointing: PointingSample[] = [];
  for (let i = 0; ; i++) {
    const t = Math.min(roundToMicrosecond(aosT + i * pointingStepS), losT);
    const l = t === aosT ? aos : t === losT ? los : lookAt(ctx, st, t);
    pointing.push({ tt: t, azimuth: l.azimuth, elevation: l.elevation, range: l.range, rangeRate: l.rangeRate, dopplerFactor: dopplerFactor(l.rangeRate) });
    if (t >= losT) break;
  }
  return { ...pass, pointing };
}

/** All passes of one spacecraft over the stations in [startTT, stopTT], in time order (then station order). */
export function findPasses(search: PassSearch): Outcome<PassSearchResult> {
  const { startTT, stopTT, stations } = search;
  const options = search.options ?? {};
  if (!Number.isFinite(startTT) || !Number.isFinite(stopTT) || !(stopTT > startTT)) {
    return failure('invalid-parameter', 'the pass window needs finite start and stop epochs with stop after start');
  }
  if (stopTT - startTT > MAX_PASS_WINDOW_S) {
    return failure('window-too-long', `the pass window lasts ${((stopTT - startTT) / SECONDS_PER_DAY).toFixed(3)} days; the limit is ${MAX_PASS_WINDOW_S / SECONDS_PER_DAY} days`);
  }
  if (stations.length > MAX_PASS_STATIONS) {
    return failure('too-many-stations', `${stations.length} stations given; the limit is ${MAX_PASS_STATIONS}`);
  }
  const step = options.pointingStepS;
  if (step !== undefined && !(step >= MIN_POINTING_STEP_S && Number.isFinite(step))) {
    return failure('invalid-parameter', `pointing step ${step} s: it must be at least ${MIN_POINTING_STEP_S} s`);
  }
  const refraction = options.refraction ? refractionOf(options.refraction) : null;
  const prepared = prepareStations(stations, refraction?.max ?? 0);
  if (!prepared.ok) return prepared;
  const ctx: Context = {
    table: orientationTable(startTT, stopTT, options),
    stateAt: search.stateAt,
    startTT,
    stopTT,
    refraction,
    state: new Float64Array(6),
    angles: new Float64Array(6),
    fineTimes: new Float64Array(256),
    fineLooks: new Float64Array(6 * 256),
    recentTimes: new Float64Array(RECENT),
    recentStates: new Float64Array(6 * RECENT),
    recentCount: 0,
    calls: 0,
  };
  try {
    ctx.calls++;
    const first = gcrfStateAt(ctx.stateAt, startTT);
    const bounds = coarseStepFor(first.r, first.v, options.gm);
    const track = coarseTrack(ctx, search.stateBatch, bounds.stepS);
    const found: Array<{ st: Prepared; iv: Interval }> = [];
    // The pointing limit is checked station by station, so a search sure to break it stops at
    // the station where it does instead of finishing first.
    let samples = 0;
    for (const st of prepared.value) {
      for (const iv of searchStation(ctx, st, track, bounds)) {
        found.push({ st, iv });
        if (step !== undefined) samples += Math.ceil((iv.stop - iv.start) / step) + 1;
      }
      if (samples > MAX_POINTING_SAMPLES) {
        return failure('invalid-parameter', `the pointing tracks would hold more than ${MAX_POINTING_SAMPLES} samples (${samples} after ${st.index + 1} of ${stations.length} stations); use a longer pointing step`);
      }
    }
    found.sort((x, y) => x.iv.start - y.iv.start || x.st.index - y.st.index);
    const passes = found.map(({ st, iv }) => describe(ctx, st, track, iv, step));
    return success({ passes, coarseStepS: bounds.stepS, evaluations: ctx.calls });
  } catch (e) {
    if (e instanceof PropagationStopped) return e.failure;
    throw e;
  }
}

