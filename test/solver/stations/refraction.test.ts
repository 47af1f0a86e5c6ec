import { describe, expect, it } from 'vitest';
import { bennettRefraction, radioRefraction, refractionOf } from '../../../src/solver/stations/refraction.js';
import { expectClose } from '../../helpers/approx.js';

const DEG = Math.PI / 180;
const ARCMIN = DEG / 60;

describe("bennettRefraction (Bennett, J. Navig. 35 (1982) 255)", () => {
  it('gives the published refraction table values: 34.5 arcmin at the horizon, ~5.3 at 10 deg, ~1.0 at 45 deg (from memory)', () => {
    expectClose(bennettRefraction(0) / ARCMIN, 34.5, 0.1, 'horizon');
    expectClose(bennettRefraction(10 * DEG) / ARCMIN, 5.3, 0.15, '10 deg');
    expectClose(bennettRefraction(45 * DEG) / ARCMIN, 1.0, 0.05, '45 deg');
    expect(bennettRefraction(90 * DEG)).toBe(0);
  });

  it('scales with pressure and inversely with absolute temperature (Meeus, Astronomical Algorithms, 2nd ed., ch. 16, from memory)', () => {
    expectClose(bennettRefraction(5 * DEG, 505, 10) / bennettRefraction(5 * DEG), 0.5, 1e-12, 'half the pressure');
    expectClose(bennettRefraction(5 * DEG, 1010, -10) / bennettRefraction(5 * DEG), 283 / 263, 1e-12, 'colder air');
  });
});

describe('radioRefraction (4/3 effective Earth radius, common practice, no source)', () => {
  it('bends a horizontal ray by 0.7 to 0.9 deg (the order of radio refraction at the horizon, common practice, from memory)', () => {
    expect(radioRefraction(0) / DEG).toBeGreaterThan(0.7);
    expect(radioRefraction(0) / DEG).toBeLessThan(0.9);
  });

  it('tends to the flat-layer limit (k - 1) H / (k R tan h) at higher elevations (H = 315e-6 R / (1 - 1/k))', () => {
    // Derived here: for a thin layer the exit central angle is psi' ~ H / (kR tan h).
    const k = 4 / 3;
    const R = 6371;
    const H = (315e-6 * R) / (1 - 1 / k);
    for (const h of [20, 45, 70]) {
      expectClose(radioRefraction(h * DEG) / ((k - 1) * H / (k * R * Math.tan(h * DEG))), 1, 0.01, `${h} deg`);
    }
  });
});

describe('refractionOf', () => {
  it('is null for "none"', () => {
    expect(refractionOf({ model: 'none' })).toBeNull();
  });

  for (const model of ['optical', 'radio'] as const) {
    it(`${model}: the apparent elevation undoes the refraction (round trip to 1e-12 rad) and rises with the geometric one`, () => {
      const r = refractionOf({ model })!;
      const bend = model === 'optical' ? (h: number) => bennettRefraction(h) : radioRefraction;
      let prev = -Infinity;
      for (let g = -5 * DEG; g <= 90 * DEG; g += 0.25 * DEG) {
        const a = r.apparent(g);
        if (a >= (model === 'optical' ? -1 : 0) * DEG) expectClose(a - bend(a), g, 1e-12, `geometric ${g / DEG} deg`);
        expect(a).toBeGreaterThan(prev);
        expect(r.slope(g)).toBeGreaterThan(0);
        prev = a;
      }
      expect(r.max).toBeGreaterThanOrEqual(bend(0));
    });
  }
});
