// Eclipse search: when is the spacecraft in the Earth's penumbra and umbra (and, on request, the
// Moon's)? Shadow geometry: light/shadow.ts (Montenbruck & Gill 2000, sec. 3.4.2, conical model,
// spherical Sun, spherical Earth of the equatorial radius). Sun: light/sun.ts (apparent direction,
// annual aberration, no light-time).
//
// 1. Coarse scan. The separation c between the Earth's centre and the Sun's centre seen from the
//    spacecraft is, within the solar parallax (|r| / |s| < 3e-4 rad at GEO), the angle between the
//    direction -r_hat and the Sun's direction; the Sun's direction moves at the Earth's mean
//    motion (2e-7 rad/s). Step: propagation/scan-step.ts with that rate as the reference rate
//    (356 s at 500 km altitude, 10 s to 600 s): each step holds at most one extremum of c, hence
//    of the shadow margins a + b - c (penumbra) and b - a - c (umbra), the factor 8 leaving room
//    for the slower changes of a and b with the distances.
// 2. Crossings. Sign changes of a margin between samples are refined by a bracketed root to
//    0.01 s; a step where the margin stays negative but its rate goes from + to - is searched for
//    its maximum, so an eclipse shorter than a step (a grazing one) is not missed
//    (numerics/positive-intervals.ts).
// 3. Depth: 1 when the umbra is reached, else the largest hidden fraction of the solar disc inside
//    the penumbra interval (golden-section search to 0.01 s).
// 4. Moon (optional): the same with the Moon as occulter, its position taken at the light-time
//    from the Moon to the spacecraft (one iteration; ~1.3 s); its radius 1737.4 km.
// Limits: highly eccentric orbits whose distance changes fast may add extrema of b within a step;
// a grazing eclipse shorter than a step could then be missed. No atmosphere (the Earth's
// atmosphere dims light a few tens of km above the surface), no oblateness (the polar radius is
// 21 km shorter).

import { BODIES } from '../bodies/bodies.js';
import { ephemerisCache } from '../bodies/sun-moon.js';
import { SPEED_OF_LIGHT_KM_S } from '../core/constants.js';
import { failure, success, type Outcome } from '../core/result.js';
import { norm, sub, type Vec3 } from '../core/vec3.js';
import { goldenSectionMax } from '../numerics/golden-section.js';
import { positiveIntervals, type PositiveInterval } from '../numerics/positive-intervals.js';
import { scanStep } from '../propagation/scan-step.js';
import { PropagationStopped, gcrfStateAt, unwrapState, type GcrfState, type StateAt, type StateBatch } from '../propagation/state-source.js';
import { ascendingNodeLocalTime, betaAngle, isSunSynchronousOrbit } from './beta.js';
import { hiddenFraction, penumbraMargin, penumbraMarginRate, shadowGeometry, umbraMargin, umbraMarginRate, type ShadowGeometry } from './shadow.js';
import { apparentSunCache, withVelocity, type BodyStateAt, type SunState } from './sun.js';

/** Longest eclipse-search window, s (31 days). */
export const MAX_ECLIPSE_WINDOW_S = 31 * 86_400;
/** Crossing tolerance, s. */
export const ECLIPSE_ROOT_TOLERANCE_S = 0.01;
/** Mean lunar radius, km: IAU WGCCRE 2015 report (Archinal et al. 2018), 1737.4 km, from memory. */
export const MOON_RADIUS_KM = 1737.4;

/** The Earth's heliocentric mean motion, rad/s (bodies.ts): how fast the Sun's direction moves. */
const SUN_RATE = BODIES.earth.heliocentricMeanMotionRadS ?? 2e-7;

export interface EclipseSearchOptions {
  /** Radius of the Earth's sphere, km (default the WGS-84 equatorial radius 6378.137). */
  readonly earthRadius?: number;
  /** GM used to size the coarse step, km^3/s^2 (default Earth's). */
  readonly gm?: number;
  /** Also search the Moon's shadow (default false). */
  readonly moon?: boolean;
  /** UT1 - UTC, s (default 0): for the local time of the node. */
  readonly dut1?: number;
}

export interface EclipseSearch {
  readonly stateAt: StateAt;
  readonly stateBatch?: StateBatch;
  readonly startTT: number;
  readonly stopTT: number;
  readonly options?: EclipseSearchOptions;
}

export interface Eclipse {
  /** Penumbra entry and exit, TT s (clipped to the window, see the flags). */
  readonly start: number;
  readonly stop: number;
  /** Umbra entry and exit, TT s; null when the eclipse is partial only. */
  readonly umbraStart: number | null;
  readonly umbraStop: number | null;
  readonly durationS: number;
  readonly umbraDurationS: number | null;
  /** Largest fraction of the solar disc hidden, 0 to 1. */
  readonly depth: number;
  readonly startsBeforeWindow: boolean;
  readonly endsAfterWindow: boolean;
}

export interface BetaRange {
  /** Beta angle at the window start, rad (positive: the Sun on the side of the angular momentum). */
  readonly start: number;
  /** Least and greatest beta over the coarse samples of the window, rad. */
  readonly min: number;
  readonly max: number;
}

export interface EclipseSearchResult {
  readonly eclipses: readonly Eclipse[];
  /** The Moon's shadow; present only when asked. */
  readonly moonEclipses?: readonly Eclipse[];
  readonly beta: BetaRange;
  /** At the window start: the osculating orbit's J2 node rate follows the mean Sun (light/beta.ts). */
  readonly sunSynchronous: boolean;
  /** Local mean solar time of the ascending node at the window start, hours [0, 24). */
  readonly nodeLocalTimeH: number;
  readonly coarseStepS: number;
  /** Propagator calls made. */
  readonly evaluations: number;
}

/** Coarse step (s) of the eclipse search from an osculating state (the argument at the top). */
export const eclipseCoarseStep = (r: Vec3, v: Vec3, gm = BODIES.earth.gm): number => scanStep(r, v, gm, SUN_RATE).stepS;

interface Sample {
  readonly earth: ShadowGeometry;
  readonly moon: ShadowGeometry | null;
}

interface Context {
  readonly stateAt: StateAt;
  readonly sun: (tt: number) => SunState;
  readonly moon: BodyStateAt | null;
  readonly earthRadius: number;
  calls: number;
}

function geometryOf(ctx: Context, tt: number, s: GcrfState): Sample {
  const sun = ctx.sun(tt);
  const earth = shadowGeometry(s.r, s.v, sun.r, sun.v, ctx.earthRadius);
  if (!ctx.moon) return { earth, moon: null };
  // The Moon where the light now reaching the spacecraft passed it: one light-time iteration.
  const seen = ctx.moon(tt);
  const m = ctx.moon(tt - norm(sub(seen.r, s.r)) / SPEED_OF_LIGHT_KM_S);
  const moon = shadowGeometry(sub(s.r, m.r), sub(s.v, m.v), sub(sun.r, m.r), sub(sun.v, m.v), MOON_RADIUS_KM);
  return { earth, moon };
}

function sampleAt(ctx: Context, tt: number): Sample {
  ctx.calls++;
  return geometryOf(ctx, tt, gcrfStateAt(ctx.stateAt, tt));
}

/** The eclipses of one occulter from the coarse samples. */
function eclipsesOf(
  ctx: Context,
  times: Float64Array,
  samples: readonly Sample[],
  pick: (s: Sample) => ShadowGeometry,
): Eclipse[] {
  const common = {
    times,
    at: (t: number) => sampleAt(ctx, t),
    edges: { startsBefore: true, endsAfter: true },
    rootTolS: ECLIPSE_ROOT_TOLERANCE_S,
    peakTolS: ECLIPSE_ROOT_TOLERANCE_S,
  };
  const penumbra = positiveIntervals<Sample>({
    ...common,
    sample: (k) => samples[k]!,
    value: (s) => penumbraMargin(pick(s)),
    rate: (s) => penumbraMarginRate(pick(s)),
  });
  if (penumbra.length === 0) return [];
  const umbra = positiveIntervals<Sample>({
    ...common,
    sample: (k) => samples[k]!,
    value: (s) => umbraMargin(pick(s)),
    rate: (s) => umbraMarginRate(pick(s)),
  });
  return penumbra.map((p) => describe(ctx, p, umbra.filter((u) => u.stop >= p.start && u.start <= p.stop), pick));
}

function describe(ctx: Context, p: PositiveInterval, umbra: readonly PositiveInterval[], pick: (s: Sample) => ShadowGeometry): Eclipse {
  // The umbra lies inside the penumbra; clamp against the two searches' independent roundings.
  const first = umbra[0];
  const last = umbra[umbra.length - 1];
  const umbraStart = first ? Math.max(p.start, first.start) : null;
  const umbraStop = last ? Math.min(p.stop, last.stop) : null;
  let depth = 1;
  if (!first) {
    const hidden = (t: number): number => hiddenFraction(pick(sampleAt(ctx, t)));
    const inner = p.stop - p.start > ECLIPSE_ROOT_TOLERANCE_S ? goldenSectionMax(hidden, p.start, p.stop, ECLIPSE_ROOT_TOLERANCE_S).value : 0;
    depth = Math.max(inner, hidden(p.start), hidden(p.stop));
  }
  return {
    start: p.start,
    stop: p.stop,
    umbraStart,
    umbraStop,
    durationS: p.stop - p.start,
    umbraDurationS: umbraStart !== null && umbraStop !== null ? umbraStop - umbraStart : null,
    depth,
    startsBeforeWindow: p.startsBefore,
    endsAfterWindow: p.endsAfter,
  };
}

/** All eclipses of one spacecraft in [startTT, stopTT], in time order, with the beta angle over the window. */
export function findEclipses(search: EclipseSearch): Outcome<EclipseSearchResult> {
  const { startTT, stopTT } = search;
  const options = search.options ?? {};
  if (!Number.isFinite(startTT) || !Number.isFinite(stopTT) || !(stopTT > startTT)) {
    return failure('invalid-parameter', 'the eclipse window needs finite start and stop epochs with stop after start');
  }
  if (stopTT - startTT > MAX_ECLIPSE_WINDOW_S) {
    return failure('window-too-long', `the eclipse window lasts ${((stopTT - startTT) / 86_400).toFixed(3)} days; the limit is ${MAX_ECLIPSE_WINDOW_S / 86_400} days`);
  }
  const earthRadius = options.earthRadius ?? BODIES.earth.radius!;
  if (!(earthRadius > 0 && Number.isFinite(earthRadius))) return failure('invalid-parameter', `earth radius ${earthRadius} km: it must be positive`);
  const ctx: Context = {
    stateAt: search.stateAt,
    sun: apparentSunCache(startTT),
    moon: options.moon ? withVelocity(ephemerisCache('moon', startTT)) : null,
    earthRadius,
    calls: 0,
  };
  try {
    ctx.calls++;
    const first = gcrfStateAt(ctx.stateAt, startTT);
    if (!(norm(first.r) > earthRadius)) return failure('impact', `the spacecraft is ${(norm(first.r) - earthRadius).toFixed(3)} km from the Earth's surface at the window start`);
    const stepS = eclipseCoarseStep(first.r, first.v, options.gm);
    const count = Math.ceil((stopTT - startTT) / stepS) + 1;
    const times = new Float64Array(count);
    for (let k = 0; k < count; k++) times[k] = Math.min(startTT + k * stepS, stopTT);
    const states = coarseStates(ctx, search.stateBatch, times);
    const samples = states.map((s, k) => geometryOf(ctx, times[k]!, s));
    const betas = states.map((s, k) => betaAngle(s.r, s.v, ctx.sun(times[k]!).r));
    const beta: BetaRange = { start: betas[0]!, min: betas.reduce((m, b) => Math.min(m, b)), max: betas.reduce((m, b) => Math.max(m, b)) };
    const eclipses = eclipsesOf(ctx, times, samples, (s) => s.earth);
    const moonEclipses = ctx.moon ? eclipsesOf(ctx, times, samples, (s) => s.moon!) : undefined;
    const frame = { dut1: options.dut1 ?? 0 };
    return success({
      eclipses,
      ...(moonEclipses ? { moonEclipses } : {}),
      beta,
      sunSynchronous: isSunSynchronousOrbit(first.r, first.v),
      nodeLocalTimeH: ascendingNodeLocalTime(startTT, first.r, first.v, frame),
      coarseStepS: stepS,
      evaluations: ctx.calls,
    });
  } catch (e) {
    if (e instanceof PropagationStopped) return e.failure;
    throw e;
  }
}

function coarseStates(ctx: Context, batch: StateBatch | undefined, times: Float64Array): GcrfState[] {
  if (!batch) return Array.from(times, (t) => (ctx.calls++, gcrfStateAt(ctx.stateAt, t)));
  const flat = unwrapState(batch(times), 'the coarse track');
  if (flat.length !== 6 * times.length) throw new TypeError('stateBatch must return 6 numbers per epoch');
  ctx.calls += times.length;
  return Array.from(times, (t, k) => {
    const o = 6 * k;
    const s: GcrfState = { r: [flat[o]!, flat[o + 1]!, flat[o + 2]!], v: [flat[o + 3]!, flat[o + 4]!, flat[o + 5]!] };
    if (![...s.r, ...s.v].every(Number.isFinite)) return gcrfStateAt(() => s, t);
    return s;
  });
}
