// lookAnglesInto and elevationOf are the allocation-free forms of lookAngles used by the pass
// search: they must give the same bits (pass answers are printed in full and held by
// test/http/answer-bytes.test.ts). lookAngles itself is checked against published geometry in
// topocentric.test.ts; here only the equality is tested.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  LOOK_AZIMUTH, LOOK_AZIMUTH_RATE, LOOK_ELEVATION, LOOK_ELEVATION_RATE, LOOK_RANGE, LOOK_RANGE_RATE,
  elevationOf, lookAngles, lookAnglesInto, stationFromGeodetic,
} from '../../../src/solver/stations/topocentric.js';

const DEG = Math.PI / 180;

// Mostly numbers with all 53 bits in use (fc.double alone favours round values, whose sums are
// exact in any order and would hide a reordered sum), some of fc.double's edge values.
const uniform = (m: number) => fc.integer({ min: -(2 ** 50), max: 2 ** 50 }).map((n) => (n / 2 ** 50) * m);
const mixed = (m: number) => fc.oneof({ arbitrary: uniform(m), weight: 4 }, { arbitrary: fc.double({ min: -m, max: m, noNaN: true }), weight: 1 });

describe('lookAnglesInto and elevationOf', () => {
  const station = fc.record({
    latitude: mixed(90 * DEG),
    longitude: mixed(180 * DEG),
    height: mixed(5),
  });
  const position = fc.tuple(mixed(45_000), mixed(45_000), mixed(45_000));
  const velocity = fc.tuple(mixed(10), mixed(10), mixed(10));

  it('write the bits of lookAngles for any station and state', () => {
    const out = new Float64Array(8);
    fc.assert(
      fc.property(station, position, velocity, fc.integer({ min: 0, max: 2 }), (s, r, v, p) => {
        const st = stationFromGeodetic(s.latitude, s.longitude, s.height);
        const state = new Float64Array([0, ...r, ...v]);
        lookAnglesInto(st, state, 1, out, p);
        const l = lookAngles(st, r, v);
        expect([out[p + LOOK_AZIMUTH], out[p + LOOK_ELEVATION], out[p + LOOK_RANGE], out[p + LOOK_RANGE_RATE], out[p + LOOK_AZIMUTH_RATE], out[p + LOOK_ELEVATION_RATE]])
          .toEqual([l.azimuth, l.elevation, l.range, l.rangeRate, l.azimuthRate, l.elevationRate]);
        expect(elevationOf(st, state, 1)).toBe(l.elevation);
      }),
      { numRuns: 1000 },
    );
  });

  it('agree at the zenith, where azimuth and its rate are 0 by convention', () => {
    const st = stationFromGeodetic(90 * DEG, 0, 0);
    const r = [st.position[0], st.position[1], st.position[2] + 600] as const;
    const v = [7.5, 0.1, 0] as const;
    const out = new Float64Array(6);
    lookAnglesInto(st, [...r, ...v], 0, out, 0);
    const l = lookAngles(st, r, v);
    expect(l.azimuth).toBe(0);
    expect(Array.from(out)).toEqual([l.azimuth, l.elevation, l.range, l.rangeRate, l.azimuthRate, l.elevationRate]);
    expect(elevationOf(st, r, 0)).toBe(l.elevation);
  });
});
