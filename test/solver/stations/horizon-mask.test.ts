import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { createHorizonMask, horizonLimit, horizonLimitSlope, type HorizonMask, type MaskPoint } from '../../../src/solver/stations/horizon-mask.js';
import { expectClose } from '../../helpers/approx.js';

const DEG = Math.PI / 180;
const pts = (...p: Array<[number, number]>): MaskPoint[] => p.map(([az, el]) => ({ azimuth: az * DEG, elevation: el * DEG }));
const make = (points: MaskPoint[], minEl: number): HorizonMask => {
  const m = createHorizonMask(points, minEl * DEG);
  if (!m.ok) throw new Error(m.message);
  return m.value;
};
const limitDeg = (m: HorizonMask, azDeg: number): number => horizonLimit(m, azDeg * DEG) / DEG;

describe('horizon mask (linear in azimuth between points, wrapping at 360 deg; common practice, no source)', () => {
  it('interpolates linearly between points', () => {
    const m = make(pts([90, 10], [180, 30]), 0);
    expectClose(limitDeg(m, 135), 20, 1e-12, 'midway');
    expectClose(limitDeg(m, 90), 10, 1e-12, 'at a point');
    expectClose(horizonLimitSlope(m, 135 * DEG), 20 / 90, 1e-12, 'slope');
  });

  it('wraps through north: points at 350 deg (10) and 10 deg (20) give 15 at 0 deg', () => {
    const m = make(pts([350, 10], [10, 20], [180, 5]), 0);
    expectClose(limitDeg(m, 0), 15, 1e-12, 'north');
    expectClose(limitDeg(m, 355), 12.5, 1e-12, '355');
    expectClose(limitDeg(m, 5), 17.5, 1e-12, '5');
    expectClose(limitDeg(m, 360), 15, 1e-12, '360 is north');
    expectClose(limitDeg(m, -5), 12.5, 1e-12, '-5 is 355');
  });

  it('never goes below the station minElevation', () => {
    const m = make(pts([0, -2], [180, 8]), 3);
    expectClose(limitDeg(m, 0), 3, 1e-12, 'floor');
    expect(horizonLimitSlope(m, 10 * DEG)).toBe(0);
    expectClose(limitDeg(m, 180), 8, 1e-12, 'above the floor');
    expectClose(m.lowest / DEG, 3, 1e-12, 'lowest');
    expectClose(m.highest / DEG, 8, 1e-12, 'highest');
  });

  it('sorts unsorted points, and a single point or none gives a constant limit', () => {
    const a = make(pts([180, 30], [90, 10]), 0);
    expectClose(limitDeg(a, 135), 20, 1e-12, 'sorted');
    expectClose(limitDeg(make(pts([42, 7]), 0), 300), 7, 1e-12, 'one point');
    expectClose(limitDeg(make([], 4), 300), 4, 1e-12, 'no points');
    expectClose(make([], 4).lowest / DEG, 4, 1e-12, 'lowest without points');
  });

  it('stays between the lowest and highest limit at every azimuth (property)', () => {
    fc.assert(
      fc.property(
        fc.uniqueArray(fc.integer({ min: 0, max: 3599 }), { minLength: 1, maxLength: 12 }),
        fc.array(fc.double({ min: -5, max: 60, noNaN: true }), { minLength: 12, maxLength: 12 }),
        fc.double({ min: 0, max: 360, noNaN: true }),
        (azTenths, els, az) => {
          const m = make(azTenths.map((a, i) => ({ azimuth: (a / 10) * DEG, elevation: els[i]! * DEG })), 0);
          const l = horizonLimit(m, az * DEG);
          expect(l).toBeGreaterThanOrEqual(m.lowest - 1e-15);
          expect(l).toBeLessThanOrEqual(m.highest + 1e-15);
        },
      ),
    );
  });

  it('refuses azimuths outside [0, 360), elevations outside [-90, 90], repeated azimuths and bad minElevation', () => {
    const bad: Array<[MaskPoint[], number]> = [
      [pts([360, 5]), 0],
      [pts([-1, 5]), 0],
      [pts([10, 91]), 0],
      [[{ azimuth: Number.NaN, elevation: 0 }], 0],
      [pts([10, 5], [10, 6]), 0],
      [[], 95],
    ];
    for (const [points, minEl] of bad) {
      const r = createHorizonMask(points, minEl * DEG);
      expect(r.ok).toBe(false);
      if (!r.ok) expect(r.code).toBe('invalid-horizon-mask');
    }
  });
});
