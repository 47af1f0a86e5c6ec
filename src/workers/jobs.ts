// The heavy work of the service as jobs: a payload in, a result out. The same runJob() answers a
// small job inline on the main thread and a heavy one in a worker thread (src/workers/worker.ts),
// so both paths give the same numbers. Payloads and results are structured-clone friendly
// (plain objects, numbers, strings, Float64Array): closures cannot cross threads, so a job
// carries the data a propagator is rebuilt from. Between threads, results travel in a wire form
// whose bulk is Float64Array buffers that are transferred, not copied (toWire / fromWire).
// Imports the solver only.

import { gcrfToItrfBatch, type FrameOptions } from '../solver/earth/frames.js';
import { gcrfToTemeBatch } from '../solver/earth/teme.js';
import { geodeticBatch } from '../solver/earth/geodetic.js';
import { eclipseCoarseStep, findEclipses, type EclipseSearchOptions, type EclipseSearchResult } from '../solver/light/eclipses.js';
import { sunAvoidance, type SunAvoidance } from '../solver/light/sun-avoidance.js';
import { lightPasses, type LightAt, type LightingOptions, type PassLight } from '../solver/light/pass-light.js';
import { findPasses, type Pass, type PassSearchOptions, type PassSearchResult, type PassStation, type PointingSample } from '../solver/stations/passes.js';
import { radialTrack, type RadialTrack, type TrackRequest as RadialTrackRequest } from '../solver/central/radial-track.js';
import { analyseCentralForce, type AnalysisOptions, type CentralForceAnalysis, type CentralForceProblem, type PotentialSample } from '../solver/central/radial.js';
import { RAD, SECONDS_PER_DAY } from '../solver/core/math.js';
import { failure, success, type Failure, type Outcome } from '../solver/core/result.js';
import { DEFAULT_MAX_STEPS } from '../solver/numerics/ode.js';
import { propagateTrack, type Track, type TrackInput } from '../solver/propagation/track.js';
import { stateFunction, type PropagationSpec, type StateFunction } from '../solver/propagation/propagator.js';
import { ephemerisStateFunction, type InterpolationReport } from '../solver/propagation/ephemeris.js';
import { sgp4FirstStop } from '../solver/propagation/sgp4.js';
import { recordsBytesEstimate, trackRecords, type RecordsSpec } from '../formats/track-records.js';
import { TAIL_ARENA_STATES_MAX } from '../formats/chunk-pool.js';

// Inline or worker thread is decided by an estimate of the work, in units of about one inertial
// two-body grid sample (~50 ns on the two-core development machine): a job estimated under
// INLINE_WORK_UNITS runs on the main thread (about a millisecond), anything more in a worker
// thread, behind the bounded queue. The costs per unit of size were measured on that machine.
/** Jobs estimated under this many work units run inline (~1 ms). */
export const INLINE_WORK_UNITS = 20_000;
/** Work units per sample: inertial two-body (the grid kernel), j2-secular (elements + Kepler), j2-analytic (two Kepler solves and the short-period terms: ~1.5 x j2-secular, measured), ephemeris (interpolation; about 1 us a sample at degree 7), sgp4 (the method, ~1.5 us, and TEME -> GCRF). */
const UNITS_PER_SAMPLE = { 'two-body': 1, 'j2-secular': 2, 'j2-analytic': 3, numerical: 2, ephemeris: 20, sgp4: 40 } as const satisfies Record<TrackInput['model'], number>;
/**
 * Set-up of the J2 models, once per job: j2-secular integrates three to five revolutions for its
 * mean elements (4 to 20 ms, measured on the shared machine: always a worker), j2-analytic inverts
 * its theory (about 1 ms).
 */
const MODEL_SETUP_UNITS: Partial<Record<TrackInput['model'], number>> = { 'j2-secular': 5 * INLINE_WORK_UNITS, 'j2-analytic': INLINE_WORK_UNITS / 2 };
/** Added per sample for the ITRF rotation (~0.5 us a sample) and again for geodetic coordinates. */
const UNITS_PER_EARTH_FIXED_SAMPLE = 10;
const UNITS_PER_GEODETIC_SAMPLE = 2;
/** Work units per step of the numerical integrator with the force models (~75 us a step). */
const UNITS_PER_INTEGRATOR_STEP = 1500;
/** Integrator steps per orbit at the default tolerance: about 5 for a near-circular orbit (measured) ... */
const STEPS_PER_ORBIT = 5;
/** ... and never fewer than 2: a span needing more than DEFAULT_MAX_STEPS at this rate is refused before it starts. */
const MIN_STEPS_PER_ORBIT = 2;
/** Pass searches: work units per station-day without a pointing track (1 day x 4 stations ~ 20-35 ms was measured). */
const UNITS_PER_STATION_DAY = 5000;
/**
 * Eclipse searches: work units per coarse step of the scan with the Earth's shadow (its sample and
 * its share of the crossings; a 500 km LEO, 242 steps a day, took ~1.2 ms a day warm), and the
 * factor when the Moon's shadow is searched too (measured ~2).
 */
const UNITS_PER_ECLIPSE_STEP = 100;
const MOON_SHADOW_FACTOR = 2;

/** Orbits covered by a numerical span (the integration runs from the epoch to each side's farthest sample). */
function orbitsCovered(spec: PropagationSpec, epochsTT: ArrayLike<number>): number {
  let lo = spec.epochTT;
  let hi = spec.epochTT;
  for (let i = 0; i < epochsTT.length; i++) {
    lo = Math.min(lo, epochsTT[i]!);
    hi = Math.max(hi, epochsTT[i]!);
  }
  const r = Math.hypot(...spec.r0);
  const v = Math.hypot(...spec.v0);
  const a = 1 / (2 / r - (v * v) / spec.body.gm);
  // Bound orbits: the period (vis-viva, Vallado 4th ed. eq. 2-47 and 2-82). Unbound: the time to
  // cross the starting radius at the starting speed stands for it (common practice, no source).
  const timescaleS = a > 0 ? 2 * Math.PI * Math.sqrt((a * a * a) / spec.body.gm) : r / Math.max(v, 1e-12);
  return (hi - lo) / timescaleS;
}

/** Estimated work of a job, in work units (see INLINE_WORK_UNITS). */
export function workEstimate(job: Job): number {
  switch (job.kind) {
    case 'track': {
      const n = job.input.epochsTT.length;
      let units = n * UNITS_PER_SAMPLE[job.input.model] + (MODEL_SETUP_UNITS[job.input.model] ?? 0);
      if (job.earthFixed) units += n * UNITS_PER_EARTH_FIXED_SAMPLE;
      if (job.geodetic) units += n * UNITS_PER_GEODETIC_SAMPLE;
      if (job.teme) units += n * UNITS_PER_EARTH_FIXED_SAMPLE;
      if (job.input.model === 'numerical') units += orbitsCovered(job.input, job.input.epochsTT) * STEPS_PER_ORBIT * UNITS_PER_INTEGRATOR_STEP;
      return units;
    }
    case 'passes': {
      const stationDays = ((job.stopTT - job.startTT) / SECONDS_PER_DAY) * job.stations.length;
      let units = stationDays * UNITS_PER_STATION_DAY + (MODEL_SETUP_UNITS[job.spec.model] ?? 0);
      if (job.spec.model === 'numerical') units += orbitsCovered(job.spec, [job.startTT, job.stopTT]) * STEPS_PER_ORBIT * UNITS_PER_INTEGRATOR_STEP;
      // A pointing track's cost follows the pass time, known only after the search: never inline.
      if (job.options.pointingStepS !== undefined) units += INLINE_WORK_UNITS;
      // Likewise the Sun-avoidance scan (a sample every few seconds of pass time).
      if (job.sunAvoidance) units += INLINE_WORK_UNITS;
      return units;
    }
    case 'eclipses': {
      const steps = (job.stopTT - job.startTT) / eclipseCoarseStep(job.spec.r0, job.spec.v0, job.spec.body.gm);
      let units = steps * UNITS_PER_ECLIPSE_STEP * (job.options.moon ? MOON_SHADOW_FACTOR : 1) + (MODEL_SETUP_UNITS[job.spec.model] ?? 0);
      if (job.spec.model === 'numerical') units += orbitsCovered(job.spec, [job.startTT, job.stopTT]) * STEPS_PER_ORBIT * UNITS_PER_INTEGRATOR_STEP;
      return units;
    }
    case 'central-force':
      // The analysis alone (10 000 potential samples, ~10 ms) stays inline; a track's cost follows
      // its integrated span (up to 200 000 steps): always a worker.
      return job.track === null ? 0 : INLINE_WORK_UNITS;
  }
}

/** True when the job is small enough to run on the main thread. */
export const runsInline = (job: Job): boolean => workEstimate(job) < INLINE_WORK_UNITS;

/**
 * A limit the job is sure to break, found before any work: a numerical span that needs more
 * integrator steps than DEFAULT_MAX_STEPS even at the lowest rate (e.g. 100 samples over 99 years).
 */
export function refusedBeforeWork(job: Job): Failure | undefined {
  let orbits: number;
  if (job.kind === 'track' && job.input.model === 'numerical') orbits = orbitsCovered(job.input, job.input.epochsTT);
  else if ((job.kind === 'passes' || job.kind === 'eclipses') && job.spec.model === 'numerical') orbits = orbitsCovered(job.spec, [job.startTT, job.stopTT]);
  else return undefined;
  const steps = Math.ceil(orbits * MIN_STEPS_PER_ORBIT);
  if (!(steps > DEFAULT_MAX_STEPS)) return undefined;
  return failure('integration-failed', `the span covers about ${Math.round(orbits)} orbits: the numerical model would need at least ${steps} integrator steps, more than its limit of ${DEFAULT_MAX_STEPS}; shorten the span or use an analytic model`);
}

/**
 * Propagate a track and, when asked, convert it to Earth-fixed and geodetic coordinates. The
 * input is propagateTrack's own (plain data); its epochsTT buffer is transferred to the worker,
 * so the sender's array is empty afterwards (the result carries it back).
 */
export interface TrackJob {
  readonly kind: 'track';
  readonly input: TrackInput;
  /** Also rotate the states to ITRF with this Earth orientation (plain data: UT1 - UTC, an EOP table); null: inertial only. */
  readonly earthFixed: FrameOptions | null;
  /** Also WGS-84 latitude, longitude (rad) and height (km) of the ITRF states; needs earthFixed. */
  readonly geodetic: boolean;
  /** Also TEME states (the sgp4 model's own; the other models' rotated from GCRF). */
  readonly teme?: boolean;
  /** The Earth orientation of the TEME rotation (UT1, the EOP table); default earthFixed's, else none. */
  readonly temeFrame?: FrameOptions;
}

export interface TrackJobResult {
  /** The inertial track (its epochsTT is the job's array, returned). */
  readonly track: Track;
  /** ITRF states, 6 per sample; null unless asked. */
  readonly earthFixed: Float64Array | null;
  /** Latitude, longitude (rad), height (km), 3 per sample; null unless asked. */
  readonly geodetic: Float64Array | null;
  /** TEME states, 6 per sample; null unless asked. */
  readonly teme: Float64Array | null;
}

/** A whole pass search; the propagator is rebuilt in the worker from the propagation spec (plain data). */
export interface PassesJob {
  readonly kind: 'passes';
  readonly spec: PropagationSpec;
  readonly startTT: number;
  readonly stopTT: number;
  readonly stations: readonly PassStation[];
  readonly options: PassSearchOptions;
  /** The twilight limit of `visible` (rad; default -6 deg); the frame options come from `options`. */
  readonly lighting?: Pick<LightingOptions, 'twilightLimit'>;
  /** Flag where the boresight-Sun angle falls below this limit (rad); none when absent. */
  readonly sunAvoidance?: { readonly angle: number };
}

/** Where a search's propagation stopped (an SGP4 error), when it did: the search covers the window up to there. */
export interface PropagationStop {
  readonly epochTT: number;
  readonly code: Failure['code'];
  readonly message: string;
}

/** A pass search and the light on each pass (same order). */
export interface PassesJobResult extends PassSearchResult {
  /** Present when the propagation stopped inside the window (passes are those before it). */
  readonly stopped?: PropagationStop;
  /** The ephemeris model: how it interpolated the epochs the search asked for. */
  readonly interpolation?: InterpolationReport;
  readonly light: readonly PassLight[];
  /** With job.sunAvoidance: per pass (same order). */
  readonly sunAvoidance?: readonly SunAvoidance[];
}

/** A whole eclipse search; the propagator is rebuilt in the worker from the propagation spec (plain data). */
export interface EclipsesJob {
  readonly kind: 'eclipses';
  readonly spec: PropagationSpec;
  readonly startTT: number;
  readonly stopTT: number;
  readonly options: EclipseSearchOptions;
}

/** An eclipse search, where its propagation stopped (sgp4) and how the ephemeris model interpolated. */
export type EclipsesJobResult = EclipseSearchResult & { readonly stopped?: PropagationStop; readonly interpolation?: InterpolationReport };

/** Effective-potential analysis and, when asked, the track r(t), phi(t). */
export interface CentralForceJob {
  readonly kind: 'central-force';
  readonly problem: CentralForceProblem;
  readonly options: AnalysisOptions;
  /** null: no track (it is then not computed even when the analysis succeeds). */
  readonly track: RadialTrackRequest | null;
}

export interface CentralForceJobResult {
  readonly analysis: Outcome<CentralForceAnalysis>;
  /** null when no track was asked or the analysis failed. */
  readonly track: Outcome<RadialTrack> | null;
}

/**
 * The last records (from..n-1) of a long CSV or JSON track, written by the thread that computed
 * the track once it has sent the states on, while the main thread writes the first ones
 * (src/formats/track-output.ts, SolverPool.trackWithTail).
 */
export interface TrackTail {
  readonly spec: RecordsSpec;
  readonly from: number;
  /** The records print geodetic coordinates (degrees); else the states of the output frame. */
  readonly geodetic: boolean;
}

interface JobTypes {
  track: { job: TrackJob; result: Outcome<TrackJobResult> };
  passes: { job: PassesJob; result: Outcome<PassesJobResult> };
  eclipses: { job: EclipsesJob; result: Outcome<EclipsesJobResult> };
  'central-force': { job: CentralForceJob; result: CentralForceJobResult };
}
export type JobKind = keyof JobTypes;
export type Job = JobTypes[JobKind]['job'];
export type JobResult<J extends Job> = JobTypes[J['kind']]['result'];

/** Run a job here and now. Expected failures are Outcome values; programmer errors throw. */
export function runJob<J extends Job>(job: J): JobResult<J> {
  const j: Job = job;
  switch (j.kind) {
    case 'track':
      return runTrack(j) as JobResult<J>;
    case 'passes':
      return runPasses(j) as JobResult<J>;
    case 'eclipses':
      return runEclipses(j) as JobResult<J>;
    case 'central-force':
      return runCentralForce(j) as JobResult<J>;
    default:
      throw new TypeError(`unknown job kind ${(j as { kind: unknown }).kind}`);
  }
}

function runTrack(job: TrackJob, into?: Float64Array): Outcome<TrackJobResult> {
  if (job.geodetic && !job.earthFixed) throw new TypeError('a geodetic track needs earthFixed');
  const run = propagateTrack(job.input, into);
  if (!run.ok) return run;
  const earthFixed = job.earthFixed ? gcrfToItrfBatch(run.value.epochsTT, run.value.states, job.earthFixed) : null;
  const geodetic = job.geodetic && earthFixed ? geodeticBatch(earthFixed) : null;
  const teme = job.teme ? run.value.teme ?? gcrfToTemeBatch(run.value.epochsTT, run.value.states, job.temeFrame ?? job.earthFixed ?? {}) : null;
  return success({ track: run.value, earthFixed, geodetic, teme });
}

/** The search window a job can run: to the epoch where SGP4 stops, when it does (a search then reports what it found before). */
function searchSpan(job: PassesJob | EclipsesJob): { stopTT: number; stopped?: PropagationStop } {
  if (job.spec.model !== 'sgp4' || !job.spec.sgp4) return { stopTT: job.stopTT };
  const s = sgp4FirstStop(job.spec.sgp4, job.startTT, job.stopTT);
  return s ? { stopTT: s.goodUntilTT, stopped: { epochTT: s.failedTT, code: s.failure.code, message: s.failure.message } } : { stopTT: job.stopTT };
}

function runPasses(whole: PassesJob): Outcome<PassesJobResult> {
  const span = searchSpan(whole);
  if (span.stopped && !(span.stopTT > whole.startTT)) return success({ passes: [], coarseStepS: 0, evaluations: 0, light: [], ...(whole.sunAvoidance ? { sunAvoidance: [] } : {}), stopped: span.stopped } as PassesJobResult);
  const job = { ...whole, stopTT: span.stopTT };
  const done = runPassesIn(job);
  return done.ok && span.stopped ? success({ ...done.value, stopped: span.stopped }) : done;
}

/** The state function of a search, and for the ephemeris model the report of what it interpolated. */
function searchStates(spec: PropagationSpec, startTT: number, stopTT: number): Outcome<StateFunction> & { report?: () => InterpolationReport } {
  if (spec.model === 'ephemeris' && spec.ephemeris) {
    const f = ephemerisStateFunction(spec.ephemeris, startTT, stopTT);
    return f.ok ? { ...success(f.value.at), report: f.value.report } : f;
  }
  return stateFunction(spec, startTT, stopTT);
}

const withReport = <T extends object>(found: Outcome<T>, report: (() => InterpolationReport) | undefined): Outcome<T & { interpolation?: InterpolationReport }> =>
  found.ok && report ? success({ ...found.value, interpolation: report() }) : found;

function runPassesIn(job: PassesJob): Outcome<PassesJobResult> {
  const stateAt = searchStates(job.spec, job.startTT, job.stopTT);
  if (!stateAt.ok) return stateAt;
  return withReport(passesAndLight(job, stateAt.value), stateAt.report);
}

function passesAndLight(job: PassesJob, stateAt: StateFunction): Outcome<PassesJobResult> {
  const found = findPasses({
    stateAt,
    startTT: job.startTT,
    stopTT: job.stopTT,
    stations: job.stations,
    options: job.options,
  });
  if (!found.ok) return found;
  // The pass search's frame options (UT1 - UTC, EOP) serve the Sun's elevation too.
  const light = lightPasses(found.value.passes, job.stations, stateAt, job.startTT, job.stopTT, { ...job.options, ...job.lighting });
  if (!light.ok) return light;
  if (!job.sunAvoidance) return success({ ...found.value, light: light.value });
  const avoid = sunAvoidance(found.value.passes, job.stations, stateAt, job.startTT, job.stopTT, job.sunAvoidance.angle, job.options);
  return avoid.ok ? success({ ...found.value, light: light.value, sunAvoidance: avoid.value }) : avoid;
}

function runEclipses(whole: EclipsesJob): Outcome<EclipsesJobResult> {
  const span = searchSpan(whole);
  // A search needs some span: an SGP4 failure at the window start is the answer itself.
  if (span.stopped && !(span.stopTT > whole.startTT + 1)) return failure('sgp4-failed', span.stopped.message);
  const stateAt = searchStates(whole.spec, whole.startTT, span.stopTT);
  if (!stateAt.ok) return stateAt;
  const found = withReport(findEclipses({ stateAt: stateAt.value, startTT: whole.startTT, stopTT: span.stopTT, options: whole.options }), stateAt.report);
  return found.ok && span.stopped ? success({ ...found.value, stopped: span.stopped }) : found;
}

function runCentralForce(job: CentralForceJob): CentralForceJobResult {
  const analysis = analyseCentralForce(job.problem, job.options);
  if (!analysis.ok || job.track === null) return { analysis, track: null };
  return { analysis, track: radialTrack(job.problem, analysis.value, job.track) };
}

// ---- Between threads ------------------------------------------------------------------------
// Arrays of many small objects are slow to clone (each object is serialised field by field), so
// the wire form packs them into Float64Array buffers; numbers pass bit for bit, so the unpacked
// result equals the one runJob returned in the worker.

/** A result in its wire form, with the buffers to transfer. */
export interface Wire {
  readonly value: unknown;
  readonly transfer: ArrayBuffer[];
}

const POINTING_FIELDS = 6;
const POTENTIAL_FIELDS = 3;
/** Light per pointing sample: sunlit (0/1), Sun elevation, visible (0/1). */
const LIGHT_FIELDS = 3;

type WirePass = Omit<Pass, 'pointing'> & { readonly pointing: Float64Array | null };
type WirePassLight = Omit<PassLight, 'pointing'> & { readonly pointing: Float64Array | null };
type WireAnalysis = Omit<CentralForceAnalysis, 'effectivePotential'> & { readonly effectivePotential: Float64Array };
type WireRadialTrack = Omit<RadialTrack, 't' | 'r' | 'rDot' | 'phi'> & {
  readonly t: Float64Array; readonly r: Float64Array; readonly rDot: Float64Array; readonly phi: Float64Array;
};

/** The states a track prints in its output frame: TEME, else Earth-fixed when computed, else inertial. */
export function printedStates(result: TrackJobResult, teme: boolean): Float64Array {
  return teme ? result.teme! : result.earthFixed ?? result.track.states;
}

/** Latitude and longitude (rad -> deg, in place) and height (km) of geodetic coordinates: radians to degrees at the edge. */
export function geodeticDegrees(g: Float64Array): Float64Array {
  for (let i = 0; i < g.length; i += 3) {
    g[i] = g[i]! * RAD;
    g[i + 1] = g[i + 1]! * RAD;
  }
  return g;
}

/** The scratch of this thread's long-track copies: kept up to this many numbers (64 MiB), a larger need gets an array of its own. */
const TAIL_SCRATCH_MAX = 8 * 2 ** 20;
let scratchKept = new Float64Array(0);

/** At least `size` numbers of scratch, reused from job to job (a thread runs one job at a time, and no job keeps it). */
function tailScratch(size: number): Float64Array {
  if (size <= scratchKept.length) return scratchKept;
  const fresh = new Float64Array(size);
  if (size <= TAIL_SCRATCH_MAX) scratchKept = fresh;
  return fresh;
}

/**
 * A track job, then the records tail.from..n-1 of its answer: the track's outcome goes to send
 * (in its wire form) as soon as it is computed; the records' bytes, in order, are the return
 * value (null when the track failed), written into `arena` (the main thread's shared memory) when
 * they fit, else into buffers of their own. Samples in the arena are read where they are (the
 * main thread only reads them too); the others are copied into the thread's scratch first, so
 * that their arrays can move to the main thread.
 */
export function runTrackWithTail(job: TrackJob, tail: TrackTail, send: (wire: Wire) => void, arena?: SharedArrayBuffer): Uint8Array[] | null {
  // The arena's layout: the grid when the route wrote it there (the only shared memory a track job
  // is lent), the states (the two-body and J2 models write them there), then the records. The main
  // thread reads them where they are and gives the arena back once every answer made from them has
  // been delivered (TailBytes in src/formats/track-output.ts).
  const n = job.input.epochsTT.length;
  const statesAt = job.input.epochsTT.buffer instanceof SharedArrayBuffer ? 8 * n : 0;
  const into = arena && n <= TAIL_ARENA_STATES_MAX ? new Float64Array(arena, statesAt, 6 * n) : undefined;
  const result = runTrack(job, into);
  if (!result.ok) {
    send(toWire('track', result));
    return null;
  }
  const r = result.value;
  const source = tail.geodetic ? r.geodetic! : printedStates(r, job.teme === true);
  const width = tail.geodetic ? 3 : 6;
  const count = r.track.epochsTT.length - tail.from;
  const inArena = (a: Float64Array): boolean => a.buffer instanceof SharedArrayBuffer;
  let epochsTT: Float64Array;
  let values: Float64Array;
  if (!tail.geodetic && inArena(r.track.epochsTT) && inArena(source)) {
    epochsTT = r.track.epochsTT.subarray(tail.from);
    values = source.subarray(width * tail.from);
  } else {
    // Copies in this thread's scratch (reused from job to job), made before the arrays move (and
    // converted to degrees here: the main thread converts its own).
    const scratch = tailScratch((1 + width) * count);
    epochsTT = scratch.subarray(0, count);
    epochsTT.set(r.track.epochsTT.subarray(tail.from));
    values = scratch.subarray(count, (1 + width) * count);
    values.set(source.subarray(width * tail.from));
    if (tail.geodetic) geodeticDegrees(values);
  }
  send(toWire('track', result));
  // Into the main thread's arena when they fit, else one buffer sized for them: written once,
  // then shared or moved as they are (buffers of their own: Buffer's shared pool, which must never
  // move, holds only small ones, and the estimate is far above its size).
  const room = recordsBytesEstimate(tail.spec, epochsTT, values, 0, epochsTT.length);
  const at = r.track.states.buffer === arena ? statesAt + 48 * n : statesAt;
  const first = arena && at + room <= arena.byteLength ? Buffer.from(arena, at) : undefined;
  return [...trackRecords(tail.spec, epochsTT, values, 0, epochsTT.length, true, room, first)];
}

/** The result of a job of this kind in its wire form (worker side). */
export function toWire(kind: JobKind, result: JobResult<Job>): Wire {
  const transfer = new Set<ArrayBuffer>();
  // Shared memory (states in a lent arena) is shared as it is: only the thread's own buffers move.
  const keep = (a: Float64Array): Float64Array => {
    if (a.buffer instanceof ArrayBuffer) transfer.add(a.buffer);
    return a;
  };
  let value: unknown;
  switch (kind) {
    case 'eclipses':
      value = result; // small plain objects: cloned as they are
      break;
    case 'track': {
      const r = result as Outcome<TrackJobResult>;
      if (r.ok) {
        const { track, earthFixed, geodetic, teme } = r.value;
        keep(track.epochsTT);
        keep(track.states);
        if (track.teme) keep(track.teme);
        if (teme) keep(teme);
        if (earthFixed) keep(earthFixed);
        if (geodetic) keep(geodetic);
      }
      value = r;
      break;
    }
    case 'passes': {
      const r = result as Outcome<PassesJobResult>;
      if (r.ok) for (const a of r.value.sunAvoidance ?? []) if (a.pointingAngles) keep(a.pointingAngles);
      value = r.ok ? success({ ...r.value, passes: r.value.passes.map((p) => packPass(p, keep)), light: r.value.light.map((l) => packLight(l, keep)) }) : r;
      break;
    }
    case 'central-force': {
      const r = result as CentralForceJobResult;
      value = {
        analysis: r.analysis.ok ? success(packAnalysis(r.analysis.value, keep)) : r.analysis,
        track: r.track?.ok ? success(packRadialTrack(r.track.value, keep)) : r.track,
      };
      break;
    }
  }
  return { value, transfer: [...transfer] };
}

/** The result of a job of this kind from its wire form (main-thread side). */
export function fromWire<J extends Job>(kind: J['kind'], value: unknown): JobResult<J> {
  switch (kind) {
    case 'track':
    case 'eclipses':
      return value as JobResult<J>;
    case 'passes': {
      const r = value as Outcome<PassSearchResult & { passes: WirePass[]; light: WirePassLight[] }>;
      return (r.ok ? success({ ...r.value, passes: r.value.passes.map(unpackPass), light: r.value.light.map(unpackLight) }) : r) as JobResult<J>;
    }
    case 'central-force': {
      const r = value as { analysis: Outcome<WireAnalysis>; track: Outcome<WireRadialTrack> | null };
      return {
        analysis: r.analysis.ok ? success(unpackAnalysis(r.analysis.value)) : r.analysis,
        track: r.track?.ok ? success(unpackRadialTrack(r.track.value)) : r.track,
      } as JobResult<J>;
    }
    default:
      throw new TypeError(`unknown job kind ${String(kind)}`);
  }
}

/** Buffers a job's payload can give away to the worker. */
export function payloadTransfer(job: Job): ArrayBuffer[] {
  // A grid in shared memory (a long track's arena) is shared, not moved.
  const grid = job.kind === 'track' ? job.input.epochsTT.buffer : null;
  return grid instanceof ArrayBuffer ? [grid] : [];
}

function packPass(p: Pass, keep: (a: Float64Array) => Float64Array): WirePass {
  const { pointing, ...rest } = p;
  if (!pointing) return { ...rest, pointing: null };
  const out = new Float64Array(POINTING_FIELDS * pointing.length);
  pointing.forEach((s, i) => {
    const o = POINTING_FIELDS * i;
    out[o] = s.tt;
    out[o + 1] = s.azimuth;
    out[o + 2] = s.elevation;
    out[o + 3] = s.range;
    out[o + 4] = s.rangeRate;
    out[o + 5] = s.dopplerFactor;
  });
  return { ...rest, pointing: keep(out) };
}

function unpackPass(p: WirePass): Pass {
  const { pointing: packed, ...rest } = p;
  if (!packed) return rest;
  const pointing: PointingSample[] = new Array(packed.length / POINTING_FIELDS);
  for (let i = 0, o = 0; i < pointing.length; i++, o += POINTING_FIELDS) {
    pointing[i] = { tt: packed[o]!, azimuth: packed[o + 1]!, elevation: packed[o + 2]!, range: packed[o + 3]!, rangeRate: packed[o + 4]!, dopplerFactor: packed[o + 5]! };
  }
  return { ...rest, pointing };
}

function packLight(l: PassLight, keep: (a: Float64Array) => Float64Array): WirePassLight {
  const { pointing, ...rest } = l;
  if (!pointing) return { ...rest, pointing: null };
  const out = new Float64Array(LIGHT_FIELDS * pointing.length);
  pointing.forEach((s, i) => {
    const o = LIGHT_FIELDS * i;
    out[o] = s.sunlit ? 1 : 0;
    out[o + 1] = s.sunElevation;
    out[o + 2] = s.visible ? 1 : 0;
  });
  return { ...rest, pointing: keep(out) };
}

function unpackLight(l: WirePassLight): PassLight {
  const { pointing: packed, ...rest } = l;
  if (!packed) return rest;
  const pointing: LightAt[] = new Array(packed.length / LIGHT_FIELDS);
  for (let i = 0, o = 0; i < pointing.length; i++, o += LIGHT_FIELDS) {
    pointing[i] = { sunlit: packed[o] === 1, sunElevation: packed[o + 1]!, visible: packed[o + 2] === 1 };
  }
  return { ...rest, pointing };
}

function packAnalysis(a: CentralForceAnalysis, keep: (a: Float64Array) => Float64Array): WireAnalysis {
  const out = new Float64Array(POTENTIAL_FIELDS * a.effectivePotential.length);
  a.effectivePotential.forEach((s, i) => {
    const o = POTENTIAL_FIELDS * i;
    out[o] = s.r;
    out[o + 1] = s.u;
    out[o + 2] = s.uEff;
  });
  return { ...a, effectivePotential: keep(out) };
}

function unpackAnalysis(a: WireAnalysis): CentralForceAnalysis {
  const packed = a.effectivePotential;
  const samples: PotentialSample[] = new Array(packed.length / POTENTIAL_FIELDS);
  for (let i = 0, o = 0; i < samples.length; i++, o += POTENTIAL_FIELDS) samples[i] = { r: packed[o]!, u: packed[o + 1]!, uEff: packed[o + 2]! };
  return { ...a, effectivePotential: samples };
}

function packRadialTrack(t: RadialTrack, keep: (a: Float64Array) => Float64Array): WireRadialTrack {
  return { ...t, t: keep(Float64Array.from(t.t)), r: keep(Float64Array.from(t.r)), rDot: keep(Float64Array.from(t.rDot)), phi: keep(Float64Array.from(t.phi)) };
}

function unpackRadialTrack(t: WireRadialTrack): RadialTrack {
  return { ...t, t: toArray(t.t), r: toArray(t.r), rDot: toArray(t.rDot), phi: toArray(t.phi) };
}

/** Float64Array -> number[] (a plain loop: several times faster than Array.from here). */
function toArray(a: Float64Array): number[] {
  const out: number[] = new Array(a.length);
  for (let i = 0; i < a.length; i++) out[i] = a[i]!;
  return out;
}
