// The ephemeris model against an analytic two-body orbit computed in the test (Kepler's equation by
// bisection, test/helpers/two-body-reference.ts), sampled at 60 s nodes.
import { describe, expect, it } from 'vitest';
import { checkCoverage, ephemerisStates, type Ephemeris, type EphemerisSegment, type InterpolationMethod } from '../../../src/solver/propagation/ephemeris.js';
import { BODIES } from '../../../src/solver/bodies/bodies.js';
import { ellipseReference } from '../../helpers/two-body-reference.js';

const MU = 398_600.4418; // km^3/s^2, EGM-96/WGS-84 value (common practice)
// An invented orbit: 500 x 1500 km, 63 deg (the eccentricity makes the curvature vary along track).
const R0 = [7378.137 - 500, 0, 0];
const V0 = [0, 7.95 * Math.cos(1.1), 7.95 * Math.sin(1.1)];
const T0 = 850_000_000; // TT s since J2000 (late 2026)

const truth = (tt: number) => ellipseReference(R0, V0, MU, tt - T0);
const accel = (r: readonly number[]): number[] => {
  const k = -MU / Math.hypot(r[0]!, r[1]!, r[2]!) ** 3;
  return r.map((x) => k * x);
};

function segment(from: number, count: number, method: InterpolationMethod, degree: number, withAccel = false, spacing = 60): EphemerisSegment {
  const epochsTT = Float64Array.from({ length: count }, (_, i) => T0 + from + spacing * i);
  const states = new Float64Array(6 * count);
  const accelerations = withAccel ? new Float64Array(3 * count) : null;
  epochsTT.forEach((t, i) => {
    const s = truth(t);
    states.set([...s.r, ...s.v], 6 * i);
    accelerations?.set(accel(s.r), 3 * i);
  });
  return { epochsTT, states, accelerations, method, degree, startTT: epochsTT[0]!, stopTT: epochsTT[count - 1]! };
}

/** Largest position (km) and velocity (km/s) error at the midpoints and quarter points of every node interval. */
function worst(e: Ephemeris, from: number, to: number) {
  const epochs = Float64Array.from({ length: Math.round((to - from) / 15) }, (_, i) => T0 + from + 15 * i + 7.5);
  const run = ephemerisStates(e, epochs);
  if (!run.ok) throw new Error(run.message);
  let dr = 0;
  let dv = 0;
  epochs.forEach((t, i) => {
    const s = truth(t);
    const x = run.value.states.subarray(6 * i, 6 * i + 6);
    dr = Math.max(dr, Math.hypot(x[0]! - s.r[0], x[1]! - s.r[1], x[2]! - s.r[2]));
    dv = Math.max(dv, Math.hypot(x[3]! - s.v[0], x[4]! - s.v[1], x[5]! - s.v[2]));
  });
  return { dr, dv, report: run.value.interpolation };
}

describe('ephemeris model (60 s nodes of a two-body orbit)', () => {
  it('Lagrange degree 7 between the nodes is within 0.5 m and 0.5 mm/s, and its error estimate bounds the error', () => {
    const w = worst({ segments: [segment(0, 200, 'lagrange', 7)] }, 0, 199 * 60);
    expect(w.dr).toBeLessThan(0.5e-3);
    expect(w.dv).toBeLessThan(0.5e-6);
    expect(w.report.segments[0]).toMatchObject({ method: 'lagrange', degree: 7, nodesPerSample: 8 });
    expect(w.report.maxPositionErrorKm).toBeGreaterThanOrEqual(w.dr * 0.5);
    expect(w.report.maxPositionErrorKm).toBeLessThan(0.5e-3 * 100);
  });

  it('Hermite degree 5 (3 nodes with velocities) is within 0.5 m, and with accelerations degree 5 uses 2 nodes', () => {
    const h = worst({ segments: [segment(0, 200, 'hermite', 5)] }, 0, 199 * 60);
    expect(h.dr).toBeLessThan(0.5e-3);
    expect(h.report.segments[0]).toMatchObject({ method: 'hermite', degree: 5, nodesPerSample: 3, usesAccelerations: false });
    const a = worst({ segments: [segment(0, 200, 'hermite', 5, true)] }, 0, 199 * 60);
    expect(a.dr).toBeLessThan(0.5e-3);
    expect(a.report.segments[0]).toMatchObject({ degree: 5, nodesPerSample: 2, usesAccelerations: true });
  });

  it('a lower degree is worse, and its estimate says so (degree 3 vs degree 9)', () => {
    const low = worst({ segments: [segment(0, 100, 'lagrange', 3)] }, 0, 99 * 60);
    const high = worst({ segments: [segment(0, 100, 'lagrange', 9)] }, 0, 99 * 60);
    expect(low.dr).toBeGreaterThan(20 * high.dr);
    expect(low.report.maxPositionErrorKm).toBeGreaterThan(20 * high.report.maxPositionErrorKm);
  });

  it('gives the nodes back at the node epochs', () => {
    const seg = segment(0, 20, 'lagrange', 7);
    const run = ephemerisStates({ segments: [seg] }, seg.epochsTT);
    if (!run.ok) throw new Error(run.message);
    run.value.states.forEach((x, i) => expect(Math.abs(x - seg.states[i]!)).toBeLessThan(1e-9 * Math.max(1, Math.abs(x))));
  });

  it('uses fewer nodes than asked when a segment is short', () => {
    const run = ephemerisStates({ segments: [segment(0, 4, 'lagrange', 7)] }, Float64Array.of(T0 + 90));
    if (!run.ok) throw new Error(run.message);
    expect(run.value.interpolation.segments[0]).toMatchObject({ degreeAsked: 7, degree: 3, nodesPerSample: 4 });
  });

  it('refuses epochs before, after and between segments with outside-coverage naming the coverage', () => {
    const e: Ephemeris = { segments: [segment(0, 11, 'lagrange', 5), segment(1200, 11, 'lagrange', 5)] };
    for (const dt of [-1, 601, 900, 1801]) {
      const r = ephemerisStates(e, Float64Array.of(T0 + 300, T0 + dt));
      expect(r.ok, `dt ${dt}`).toBe(false);
      if (r.ok) continue;
      expect(r.code).toBe('outside-coverage');
      expect(r.message).toMatch(/coverage \(\d{4}-\d\d-\d\dT[\d:.]+Z to [\d\-T:.]+Z, [\d\-T:.]+Z to [\d\-T:.]+Z\)/);
    }
    expect(ephemerisStates(e, Float64Array.of(T0, T0 + 600, T0 + 1200, T0 + 1800)).ok).toBe(true);
  });

  it('checks a whole window: covered when segments chain, refused across a gap', () => {
    const chained: Ephemeris = { segments: [segment(0, 11, 'lagrange', 5), segment(600, 11, 'lagrange', 5)] };
    expect(checkCoverage(chained, T0 + 10, T0 + 1100).ok).toBe(true);
    const gap: Ephemeris = { segments: [segment(0, 11, 'lagrange', 5), segment(1200, 11, 'lagrange', 5)] };
    const r = checkCoverage(gap, T0 + 10, T0 + 1300);
    expect(r).toMatchObject({ ok: false, code: 'outside-coverage' });
    expect(checkCoverage(gap, T0 - 5, T0 + 100)).toMatchObject({ ok: false, code: 'outside-coverage' });
  });

  it('takes an epoch covered by two overlapping segments from the first', () => {
    const a = segment(0, 11, 'lagrange', 5);
    const b = segment(300, 11, 'lagrange', 5);
    const shifted = { ...b, states: b.states.map((x, i) => (i % 6 === 0 ? x + 1 : x)) };
    const r = ephemerisStates({ segments: [a, shifted] }, Float64Array.of(T0 + 450, T0 + 700));
    if (!r.ok) throw new Error(r.message);
    expect(Math.abs(r.value.states[0]! - truth(T0 + 450).r[0])).toBeLessThan(1e-3);
    expect(Math.abs(r.value.states[6]! - truth(T0 + 700).r[0] - 1)).toBeLessThan(1e-3);
  });
});

describe('the ephemeris model through the propagator entries', () => {
  const e: Ephemeris = { segments: [segment(0, 61, 'lagrange', 7)] };
  const spec = { body: BODIES.earth, model: 'ephemeris' as const, r0: [0, 0, 0] as const, v0: [0, 0, 0] as const, epochTT: T0, ephemeris: e };

  it('propagateTrack reports the interpolation used', async () => {
    const { propagateTrack } = await import('../../../src/solver/propagation/track.js');
    const run = propagateTrack({ ...spec, epochsTT: Float64Array.of(T0 + 30, T0 + 1000) });
    if (!run.ok) throw new Error(run.message);
    expect(run.value.interpolation?.segments[0]).toMatchObject({ method: 'lagrange', degree: 7 });
    expect(Math.abs(run.value.states[0]! - truth(T0 + 30).r[0])).toBeLessThan(1e-3);
  });

  it('stateFunction refuses a window the ephemeris does not cover, and answers inside one it does', async () => {
    const { stateFunction } = await import('../../../src/solver/propagation/propagator.js');
    expect(stateFunction(spec, T0 - 60, T0 + 600)).toMatchObject({ ok: false, code: 'outside-coverage' });
    const f = stateFunction(spec, T0, T0 + 3600);
    if (!f.ok) throw new Error(f.message);
    const s = f.value(T0 + 1234.5);
    if (!s.ok) throw new Error(s.message);
    expect(Math.hypot(s.value.r[0] - truth(T0 + 1234.5).r[0], s.value.r[1] - truth(T0 + 1234.5).r[1], s.value.r[2] - truth(T0 + 1234.5).r[2])).toBeLessThan(0.5e-3);
  });
});
