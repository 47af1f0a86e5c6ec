// gcrfToItrfTabledInto is the allocation-free form of gcrfToItrfTabled used by the pass search:
// it must give the same bits, not merely close numbers (pass answers are printed in full and held
// by test/http/answer-bytes.test.ts). gcrfToItrfTabled itself is checked against published
// examples and an independent implementation in frames.test.ts; here only the equality is tested.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { gcrfToItrfTabled, gcrfToItrfTabledInto, orientationTable, type FrameOptions } from '../../../src/solver/earth/frames.js';
import { parseFinals2000A } from '../../../src/solver/time/eop.js';
import { parseUtcIso } from '../../../src/solver/time/time.js';
import type { Vec3 } from '../../../src/solver/core/vec3.js';

const tt = (s: string): number => {
  const r = parseUtcIso(s);
  if (!r.ok) throw new Error(r.message);
  return r.value;
};
const finals = parseFinals2000A(readFileSync(new URL('../../fixtures/finals2000A-2025-2027.txt', import.meta.url), 'utf8'));
if (!finals.ok) throw new Error(finals.message);

const sameBits = (into: Float64Array, o: number, r: Vec3, v: Vec3): void => {
  const got = Array.from(into.subarray(o, o + 6));
  // toEqual uses Object.is per element: -0 and 0 differ, NaN equals NaN.
  expect(got).toEqual([...r, ...v]);
};

// Mostly numbers with all 53 bits in use (fc.double alone favours round values, whose sums are
// exact in any order and would hide a reordered sum), some of fc.double's edge values.
const uniform = (m: number) => fc.integer({ min: -(2 ** 50), max: 2 ** 50 }).map((n) => (n / 2 ** 50) * m * Math.SQRT2);
const mixed = (m: number) => fc.oneof({ arbitrary: uniform(m), weight: 4 }, { arbitrary: fc.double({ min: -m, max: m, noNaN: true }), weight: 1 });
const component = mixed(50_000);
const speed = mixed(12);
const vec = (c: fc.Arbitrary<number>) => fc.tuple(c, c, c);

describe('gcrfToItrfTabledInto', () => {
  const cases: Array<[string, string, string, FrameOptions]> = [
    ['no Earth orientation data', '2026-12-01T00:00:00Z', '2026-12-08T00:00:00Z', {}],
    ['dut1 and polar motion given', '2026-12-01T00:00:00Z', '2026-12-03T00:00:00Z', { dut1: -0.12, polarMotion: { xp: 1.1e-6, yp: 2.3e-6 } }],
    ['the IERS table (polar motion, pole offsets, UT1)', '2026-03-01T00:00:00Z', '2026-03-04T00:00:00Z', { eop: finals.value }],
    // A leap second of UTC with a constant dut1: UT1 - TT jumps by 1 s between two nodes, and
    // such samples take UT1 - TT computed exactly (the UT1_JUMP_S branch).
    ['across the leap second of 2016-12-31 with constant dut1', '2016-12-31T20:00:00Z', '2017-01-01T04:00:00Z', { dut1: 0.4 }],
  ];
  for (const [name, from, to, opts] of cases) {
    it(`writes the bits of gcrfToItrfTabled: ${name}, epochs inside and just outside the table`, () => {
      const [a, b] = [tt(from), tt(to)];
      const table = orientationTable(a, b, opts);
      const out = new Float64Array(9);
      fc.assert(
        fc.property(uniform(1).map((u) => (a + b) / 2 + u * ((b - a) / 2 + 7200)), vec(component), vec(speed), fc.integer({ min: 0, max: 3 }), (t, r, v, o) => {
          gcrfToItrfTabledInto(table, t, r[0], r[1], r[2], v[0], v[1], v[2], out, o);
          const s = gcrfToItrfTabled(table, t, r, v);
          sameBits(out, o, s.r, s.v);
        }),
        { numRuns: 400 },
      );
    });
  }

  it('writes only its six slots', () => {
    const t0 = tt('2026-12-01T00:00:00Z');
    const table = orientationTable(t0, t0 + 86_400);
    const out = new Float64Array(10).fill(7);
    gcrfToItrfTabledInto(table, t0 + 100, 7000, 10, -20, 0.1, 7.5, 0.2, out, 2);
    expect([out[0], out[1], out[8], out[9]]).toEqual([7, 7, 7, 7]);
    expect(out.subarray(2, 8).every((x) => x !== 7)).toBe(true);
  });
});
