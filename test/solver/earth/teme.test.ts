import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { gcrfToTeme, gcrfToTemeBatch, gmst1982, itrfToTeme, temeToGcrf, temeToGcrfBatch, temeToItrf } from '../../../src/solver/earth/teme.js';
import { ARCSEC } from '../../../src/solver/earth/precession.js';
import type { FrameOptions } from '../../../src/solver/earth/frames.js';
import { parseUtcIso, ut1DaysSinceJ2000 } from '../../../src/solver/time/time.js';
import { norm, sub, type Vec3 } from '../../../src/solver/core/vec3.js';

const tt = (s: string): number => {
  const r = parseUtcIso(s);
  if (!r.ok) throw new Error(r.message);
  return r.value;
};

// Vallado, Fundamentals of Astrodynamics and Applications, 4th ed., Example 3-15 (from memory):
// the TEME state of Vallado et al. 2006 (AIAA 2006-6753, sec. on TEME) at 2004-04-06
// 07:51:28.386009 UTC with dUT1 = -0.4399619 s, xp = -0.140682", yp = 0.333309".
const EPOCH = tt('2004-04-06T07:51:28.386009Z');
const OPTS: FrameOptions = { dut1: -0.439_961_9, polarMotion: { xp: -0.140_682 * ARCSEC, yp: 0.333_309 * ARCSEC } };
const R_TEME: Vec3 = [5094.180_162_10, 6127.644_659_50, 6380.344_532_70];
const V_TEME: Vec3 = [-4.746_131_487, 0.785_818_041, 5.531_931_288];

describe('GMST 1982', () => {
  it('is 280.46061837 deg at J2000.0 UT1 and advances 360.98564736629 deg a day (Vallado 4th ed. eq. 3-45/3-47, from memory)', () => {
    expect(gmst1982(0) / (Math.PI / 180)).toBeCloseTo(280.460_618_37, 6);
    const d = gmst1982(10_001) - gmst1982(10_000);
    expect(((d + 2 * Math.PI) % (2 * Math.PI)) / (Math.PI / 180)).toBeCloseTo(0.985_647_366, 5);
  });
});

describe('TEME conversions', () => {
  it('TEME -> ITRF reproduces Vallado 4th ed. Ex. 3-15 (from memory) to 1 cm and 0.02 mm/s (measured 0.0135 mm/s)', () => {
    const e = temeToItrf(EPOCH, R_TEME, V_TEME, OPTS);
    const rRef: Vec3 = [-1033.479_383_0, 7901.295_275_4, 6380.356_595_8];
    const vRef: Vec3 = [-3.225_636_520, -2.872_451_450, 5.531_924_446];
    expect(norm(sub(e.r, rRef))).toBeLessThan(1e-5);
    expect(norm(sub(e.v, vRef))).toBeLessThan(2e-8);
    const back = itrfToTeme(EPOCH, e.r, e.v, OPTS);
    expect(norm(sub(back.r, R_TEME))).toBeLessThan(1e-9);
  });

  it('TEME -> GCRF reproduces the book GCRF (IAU-76/FK5 there, IAU 2006/2000B here) to 0.2 m and 1 mm/s (from memory; measured 2 mm and 0.45 mm/s)', () => {
    const g = temeToGcrf(EPOCH, R_TEME, V_TEME, OPTS);
    // Vallado 4th ed. Ex. 3-15 GCRF (from memory). The two nutation theories and the book's
    // frame offsets differ by a few mas here; measured in this test: see the printed difference.
    const rRef: Vec3 = [5102.508_958, 6123.011_401, 6378.136_928];
    const vRef: Vec3 = [-4.743_220_16, 0.790_536_50, 5.533_755_28];
    const dr = norm(sub(g.r, rRef));
    const dv = norm(sub(g.v, vRef));
    console.log(`TEME -> GCRF vs Vallado Ex. 3-15: ${(dr * 1e3).toFixed(3)} m, ${(dv * 1e6).toFixed(3)} mm/s`);
    expect(dr).toBeLessThan(0.2e-3);
    expect(dv).toBeLessThan(1e-6);
  });

  it('round trip TEME -> GCRF -> TEME to 1e-9 relative, single and batch (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: -8.5e8, max: 6.2e9, noNaN: true }),
        fc.tuple(fc.double({ min: 6500, max: 50_000, noNaN: true }), fc.double({ min: 0, max: 2 * Math.PI, noNaN: true }), fc.double({ min: -1.5, max: 1.5, noNaN: true })),
        fc.tuple(fc.double({ min: -8, max: 8, noNaN: true }), fc.double({ min: -8, max: 8, noNaN: true }), fc.double({ min: -8, max: 8, noNaN: true })),
        fc.boolean(),
        (t, [rad, lon, lat], v, pm) => {
          const r: Vec3 = [rad * Math.cos(lat) * Math.cos(lon), rad * Math.cos(lat) * Math.sin(lon), rad * Math.sin(lat)];
          const opts: FrameOptions = pm ? OPTS : {};
          const g = temeToGcrf(t, r, v, opts);
          const back = gcrfToTeme(t, g.r, g.v, opts);
          expect(norm(sub(back.r, r)) / rad).toBeLessThan(1e-9);
          expect(norm(sub(back.v, v)) / Math.max(norm(v), 1e-3)).toBeLessThan(1e-9);
          const states = Float64Array.of(...r, ...v, ...g.r, ...g.v);
          const epochs = Float64Array.of(t, t + 600);
          const b = gcrfToTemeBatch(epochs, temeToGcrfBatch(epochs, states, opts), opts);
          for (let i = 0; i < 12; i++) expect(Math.abs(b[i]! - states[i]!)).toBeLessThan(1e-9 * rad);
        },
      ),
      { numRuns: 100 },
    );
  });

  it('the batch path (orientation table) agrees with the direct one to 1 mm over a day', () => {
    const t0 = tt('2026-12-01T00:00:00Z');
    const epochs = Float64Array.from({ length: 25 }, (_, k) => t0 + k * 3600 + 17);
    const states = new Float64Array(6 * epochs.length);
    for (let k = 0; k < epochs.length; k++) states.set([...R_TEME, ...V_TEME], 6 * k);
    const b = temeToGcrfBatch(epochs, states);
    for (let k = 0; k < epochs.length; k++) {
      const g = temeToGcrf(epochs[k]!, R_TEME, V_TEME);
      expect(norm(sub([b[6 * k]!, b[6 * k + 1]!, b[6 * k + 2]!], g.r))).toBeLessThan(1e-6);
    }
  });

  it('UT1 nearly cancels between GMST 1982 and the Earth rotation angle: TEME -> GCRF moves < 1 mm for 0.9 s of UT1 - UTC', () => {
    const a = temeToGcrf(EPOCH, R_TEME, V_TEME, { dut1: 0.9 });
    const b = temeToGcrf(EPOCH, R_TEME, V_TEME, { dut1: -0.9 });
    expect(norm(sub(a.r, b.r))).toBeLessThan(1e-6);
    expect(ut1DaysSinceJ2000(EPOCH)).toBeGreaterThan(0);
  });
});
