import { readdirSync, readFileSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { BODIES } from '../../src/solver/bodies/bodies.js';
import { gcrfToItrfBatch } from '../../src/solver/earth/frames.js';
import { geodeticBatch } from '../../src/solver/earth/geodetic.js';
import { findPasses, type PassStation } from '../../src/solver/stations/passes.js';
import { radialTrack } from '../../src/solver/central/radial-track.js';
import { analyseCentralForce, type CentralForceProblem } from '../../src/solver/central/radial.js';
import { parseUtcIso } from '../../src/solver/time/time.js';
import { propagateTrack } from '../../src/solver/propagation/track.js';
import { propagate } from '../../src/solver/conic/universal.js';
import type { Vec3 } from '../../src/solver/core/vec3.js';
import {
  INLINE_WORK_UNITS,
  refusedBeforeWork,
  runJob,
  runsInline,
  workEstimate,
  type CentralForceJob,
  type PassesJob,
  type TrackJob,
} from '../../src/workers/jobs.js';
import { DeadlineExceededError, PoolOverloadedError, SolverPool, WorkerFailedError } from '../../src/workers/pool.js';

// The pool must give bit-for-bit the numbers of the solver called directly on this thread:
// toEqual compares numbers with Object.is and typed arrays element by element.

const DEG = Math.PI / 180;
const EARTH = BODIES.earth;
const T0 = (() => {
  const r = parseUtcIso('2026-12-01T00:00:00Z');
  if (!r.ok) throw new Error(r.message);
  return r.value;
})();
// Invented spacecraft on a 550 km, 97.6 deg circular orbit, as a GCRF state at T0.
const A = 6928.137;
const SPEED = Math.sqrt(EARTH.gm / A);
const R0: Vec3 = [A, 0, 0];
const V0: Vec3 = [0, SPEED * Math.cos(97.6 * DEG), SPEED * Math.sin(97.6 * DEG)];

const grid = (count: number, step: number): Float64Array => Float64Array.from({ length: count }, (_, i) => T0 + step * i);
const trackJob = (count: number, extra: Partial<TrackJob> = {}, input: Partial<TrackJob['input']> = {}): TrackJob => ({
  kind: 'track',
  input: { body: EARTH, model: 'two-body', r0: R0, v0: V0, epochTT: T0, epochsTT: grid(count, 10), ...input },
  earthFixed: { dut1: 0.2 },
  geodetic: true,
  ...extra,
});

// Six invented stations, one with a horizon mask.
const STATIONS: PassStation[] = Array.from({ length: 6 }, (_, i) => ({
  id: `site-${i}`,
  latitude: (-60 + 24 * i) * DEG,
  longitude: (-170 + 61 * i) * DEG,
  height: 0.1 * i,
  minElevation: 5 * (i % 2) * DEG,
  ...(i === 3 ? { mask: [{ azimuth: 0, elevation: 3 * DEG }, { azimuth: 120 * DEG, elevation: 12 * DEG }, { azimuth: 240 * DEG, elevation: 3 * DEG }] } : {}),
}));
const passesJob = (days: number, stations: readonly PassStation[], pointingStepS?: number): PassesJob => ({
  kind: 'passes', spec: { body: EARTH, model: 'two-body', r0: R0, v0: V0, epochTT: T0 }, startTT: T0, stopTT: T0 + days * 86_400, stations,
  options: { dut1: 0.1, gm: EARTH.gm, ...(pointingStepS !== undefined ? { pointingStepS } : {}) },
});

// Invented Kepler well with a small r^-3 correction, in arbitrary consistent units.
const WELL: CentralForceProblem = {
  mass: 1,
  terms: [{ kind: 'power', coefficient: -1, exponent: -1 }, { kind: 'power', coefficient: -0.002, exponent: -3 }],
  angularMomentum: 1.2,
  energy: -0.3,
};
const cfJob = (track: CentralForceJob['track'], problem = WELL): CentralForceJob => ({ kind: 'central-force', problem, options: { samples: 2000 }, track });

let pool: SolverPool;
beforeAll(() => { pool = new SolverPool({ threads: 1, queueLimit: 8 }); });
afterAll(async () => { await pool.close(); });

describe('SolverPool.inWorker gives the numbers of the inline solver', () => {
  it('track: two-body states, drift, ITRF and geodetic coordinates of 5000 samples', async () => {
    const direct = propagateTrack({ body: EARTH, model: 'two-body', r0: R0, v0: V0, epochTT: T0, epochsTT: grid(5000, 10) });
    if (!direct.ok) throw new Error(direct.message);
    const itrf = gcrfToItrfBatch(direct.value.epochsTT, direct.value.states, { dut1: 0.2 });
    const job = trackJob(5000);
    const pooled = await pool.inWorker(job);
    if (!pooled.ok) throw new Error(pooled.message);
    // The grid's buffer went to the worker and came back in the result.
    expect(job.input.epochsTT.length).toBe(0);
    expect(pooled.value.track.epochsTT).toEqual(grid(5000, 10));
    expect(pooled.value.track.states).toEqual(direct.value.states);
    expect(pooled.value.track.conservation).toEqual(direct.value.conservation);
    expect(pooled.value.earthFixed).toEqual(itrf);
    expect(pooled.value.geodetic).toEqual(geodeticBatch(itrf));
  });

  it('track: an inertial-only job returns no Earth-fixed arrays, and an impact comes back as the same failure', async () => {
    const inertial = await pool.inWorker(trackJob(2500, { earthFixed: null, geodetic: false }));
    expect(inertial.ok && inertial.value.earthFixed === null && inertial.value.geodetic === null).toBe(true);
    // Periapsis 100 km below the surface (invented): refused as an impact.
    const rp = EARTH.radius! - 100;
    const ra = 2 * A - rp;
    const vp = Math.sqrt(EARTH.gm * (2 / rp - 2 / (rp + ra))); // vis-viva (Vallado 4th ed. eq. 1-31, from memory)
    const low = { r0: [rp, 0, 0] as Vec3, v0: [0, vp, 0] as Vec3 };
    const direct = propagateTrack({ body: EARTH, model: 'two-body', ...low, epochTT: T0, epochsTT: grid(3000, 10) });
    expect(direct.ok).toBe(false);
    expect(await pool.inWorker(trackJob(3000, {}, low))).toEqual(direct);
  });

  it('passes: a two-day search over six stations with a pointing track', async () => {
    const direct = findPasses({
      stateAt: (tt) => propagate(R0, V0, EARTH.gm, tt - T0),
      startTT: T0,
      stopTT: T0 + 2 * 86_400,
      stations: STATIONS,
      options: { dut1: 0.1, gm: EARTH.gm, pointingStepS: 10 },
    });
    if (!direct.ok) throw new Error(direct.message);
    expect(direct.value.passes.length).toBeGreaterThan(10);
    expect(direct.value.passes.every((p) => p.pointing !== undefined && p.pointing.length > 1)).toBe(true);
    const viaWorker = await pool.inWorker(passesJob(2, STATIONS, 10));
    if (!viaWorker.ok) throw new Error(viaWorker.message);
    const { light, ...search } = viaWorker.value;
    expect(search).toEqual(direct.value);
    // The light on each pass (with its pointing samples, packed for the trip) as the inline job gives it.
    const inline = runJob(passesJob(2, STATIONS, 10));
    expect(inline.ok && inline.value.light).toEqual(light);
    expect(light.every((l, i) => l.pointing!.length === direct.value.passes[i]!.pointing!.length)).toBe(true);
  });

  it('passes: without pointing the passes carry no pointing key; an over-long window is the same failure', async () => {
    const pooled = await pool.inWorker(passesJob(2, STATIONS));
    if (!pooled.ok) throw new Error(pooled.message);
    expect(pooled.value.passes.every((p) => !('pointing' in p))).toBe(true);
    const direct = findPasses({ stateAt: (tt) => propagate(R0, V0, EARTH.gm, tt - T0), startTT: T0, stopTT: T0 + 40 * 86_400, stations: STATIONS });
    expect(direct.ok).toBe(false);
    expect(await pool.inWorker({ ...passesJob(40, STATIONS), options: {} })).toEqual(direct);
  });

  it('central-force: analysis and a 3000-sample track over three radial periods', async () => {
    const analysis = analyseCentralForce(WELL, { samples: 2000 });
    if (!analysis.ok) throw new Error(analysis.message);
    const track = radialTrack(WELL, analysis.value, { samples: 3000, periods: 3, start: 'periapsis' });
    expect(track.ok).toBe(true);
    expect(await pool.inWorker(cfJob({ samples: 3000, periods: 3, start: 'periapsis' }))).toEqual({ analysis, track });
  });

  it('central-force: failures of the analysis and of the track come back as the same values', async () => {
    const unbound = { ...WELL, energy: 0.5 };
    const analysis = analyseCentralForce(unbound, { samples: 2000 });
    if (!analysis.ok) throw new Error(analysis.message);
    const track = radialTrack(unbound, analysis.value, { samples: 10, periods: 1 });
    expect(track.ok ? '' : track.code).toBe('no-radial-period');
    expect(await pool.inWorker(cfJob({ samples: 10, periods: 1 }, unbound))).toEqual({ analysis, track });

    // A pure Kepler well: U_eff >= -m k^2 / (2 l^2) = -0.35 (Goldstein 3rd ed. sec. 3.7, from memory), so E = -100 is impossible.
    const impossible = { ...WELL, terms: WELL.terms.slice(0, 1), energy: -100 };
    const refused = analyseCentralForce(impossible, { samples: 2000 });
    expect(refused.ok ? '' : refused.code).toBe('energy-below-minimum');
    expect(await pool.inWorker(cfJob({ samples: 10, periods: 1 }, impossible))).toEqual({ analysis: refused, track: null });
  });
});

describe('SolverPool: inline jobs, failures and the bounded queue', () => {
  it('runsInline(job) keeps jobs estimated under INLINE_WORK_UNITS on the main thread', () => {
    // Inertial two-body samples cost one unit each; Earth-fixed and geodetic output cost more per sample.
    expect(runsInline(trackJob(INLINE_WORK_UNITS - 1, { earthFixed: null, geodetic: false }))).toBe(true);
    expect(runsInline(trackJob(INLINE_WORK_UNITS, { earthFixed: null, geodetic: false }))).toBe(false);
    expect(runsInline(trackJob(100_000, { earthFixed: null, geodetic: false }))).toBe(false);
    expect(workEstimate(trackJob(1000))).toBeGreaterThan(workEstimate(trackJob(1000, { earthFixed: null, geodetic: false })));
    expect(runsInline(trackJob(500))).toBe(true);
    expect(runsInline(trackJob(5000))).toBe(false);
    // A numerical track's cost follows its span, not its sample count: 100 samples over 30 days go to a thread.
    expect(runsInline(trackJob(100, { earthFixed: null, geodetic: false }, { model: 'numerical', epochsTT: grid(100, 30 * 864) }))).toBe(false);
    const few = STATIONS.slice(0, 4);
    expect(runsInline(passesJob(0.9, few))).toBe(true);
    expect(runsInline(passesJob(1.1, few))).toBe(false);
    expect(runsInline(passesJob(1, STATIONS.slice(0, 5)))).toBe(false);
    expect(runsInline(passesJob(0.5, few, 30))).toBe(false);
    expect(runsInline(cfJob(null))).toBe(true);
    expect(runsInline(cfJob({ samples: 2, duration: 1 }))).toBe(false);
  });

  it('refusedBeforeWork(job) refuses a numerical span sure to exceed the step limit, before any work', () => {
    // 100 samples over 99 years of a 95-minute orbit: ~550 000 orbits.
    const long = trackJob(100, { earthFixed: null, geodetic: false }, { model: 'numerical', epochsTT: grid(100, 99 * 365.25 * 864) });
    const refused = refusedBeforeWork(long);
    expect(refused?.code).toBe('integration-failed');
    expect(refused?.message).toMatch(/orbits/);
    expect(refusedBeforeWork(trackJob(100, { earthFixed: null, geodetic: false }, { model: 'numerical', epochsTT: grid(100, 864) }))).toBeUndefined();
    expect(refusedBeforeWork(trackJob(100, {}, { epochsTT: grid(100, 99 * 365.25 * 864) }))).toBeUndefined(); // analytic: no steps
  });

  it('solve(job) answers a small job without starting a thread', async () => {
    const idle = new SolverPool({ threads: 1, queueLimit: 0 });
    const job = trackJob(100);
    const answer = await idle.solve(job);
    expect(answer.ok).toBe(true);
    expect(job.input.epochsTT.length).toBe(100); // not transferred anywhere
    expect(idle.stats()).toEqual({ threads: 1, active: 0, queued: 0, completed: 0 });
    await idle.close();
  });

  it('a throw in the worker rejects the job with WorkerFailedError, and the pool keeps working', async () => {
    // geodetic without earthFixed is a programmer error: runJob throws a TypeError in the worker.
    await expect(pool.inWorker(trackJob(10, { earthFixed: null, geodetic: true }))).rejects.toBeInstanceOf(WorkerFailedError);
    const after = await pool.inWorker(trackJob(10));
    expect(after.ok).toBe(true);
  });

  it('with one thread and a queue of one, a third concurrent job is refused with PoolOverloadedError', async () => {
    const small = new SolverPool({ threads: 1, queueLimit: 1 });
    // Each job integrates 1000 radial periods (hundreds of ms): the first still runs when the third arrives.
    const heavy = () => small.inWorker(cfJob({ samples: 1000, periods: 1000 }));
    const first = heavy();
    const second = heavy();
    await expect(heavy()).rejects.toBeInstanceOf(PoolOverloadedError);
    expect(small.stats()).toMatchObject({ threads: 1, active: 2 });
    const settled = await Promise.all([first, second]);
    expect(settled.every((r) => r.analysis.ok && r.track?.ok)).toBe(true);
    expect(small.stats()).toMatchObject({ active: 0, completed: 2 });
    await small.close();
    await expect(small.inWorker(cfJob(null))).rejects.toBeInstanceOf(PoolOverloadedError);
  });

  it('a job past its deadline is stopped with DeadlineExceededError; its thread is replaced and the next job is answered', async () => {
    const timed = new SolverPool({ threads: 1, queueLimit: 2 });
    // Warm the thread first, so the deadline is spent computing rather than starting a thread.
    expect((await timed.inWorker(cfJob({ samples: 2, duration: 1 }))).analysis.ok).toBe(true);
    // 200 000 radial periods: far longer than 300 ms on any machine.
    await expect(timed.inWorker(cfJob({ samples: 1000, periods: 200_000 }), { deadlineMs: 300 })).rejects.toBeInstanceOf(DeadlineExceededError);
    const after = await timed.inWorker(cfJob({ samples: 2, duration: 1 }));
    expect(after.analysis.ok).toBe(true);
    expect(timed.stats()).toMatchObject({ threads: 1, active: 0 });
    await timed.close();
  });
});

/** Nice value of each thread (task) of this process, by task id: field 19 of /proc/self/task/<tid>/stat (proc(5)). */
function threadNiceValues(): Map<number, number> {
  const nice = new Map<number, number>();
  for (const tid of readdirSync('/proc/self/task')) {
    const stat = readFileSync(`/proc/self/task/${tid}/stat`, 'utf8');
    // Fields after the command name (in parentheses, which may hold spaces): state is field 3, nice field 19.
    const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
    nice.set(Number(tid), Number(fields[19 - 3]));
  }
  return nice;
}

describe.skipIf(process.platform !== 'linux')('solver threads run at a lower priority than the thread answering requests (Linux)', () => {
  it('a pool with nice 7 starts its thread 7 below the process priority; this thread keeps its own', async () => {
    const before = threadNiceValues();
    const own = before.get(process.pid)!;
    const expected = Math.min(19, own + 7);
    const lowered = new SolverPool({ threads: 1, queueLimit: 1, nice: 7 });
    try {
      expect((await lowered.inWorker(trackJob(10))).ok).toBe(true);
      const after = threadNiceValues();
      const newThreads = [...after].filter(([tid]) => !before.has(tid));
      // The worker thread and, from Node, a few helper threads may be new; the worker is among them at the lowered priority.
      expect(newThreads.some(([, nice]) => nice === expected)).toBe(true);
      expect(after.get(process.pid)).toBe(own);
    } finally {
      await lowered.close();
    }
  });

  it('nice outside 0-19 is refused when the pool is made', () => {
    expect(() => new SolverPool({ threads: 1, queueLimit: 1, nice: 20 })).toThrow(RangeError);
    expect(() => new SolverPool({ threads: 1, queueLimit: 1, nice: -1 })).toThrow(RangeError);
  });
});
