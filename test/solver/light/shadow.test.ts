import { AstroTime, Body, GeoVector } from 'astronomy-engine';
import { describe, expect, it } from 'vitest';
import { thirdBodyState } from '../../../src/solver/bodies/sun-moon.js';
import { hiddenFraction, shadowGeometry, SUN_RADIUS_KM } from '../../../src/solver/light/shadow.js';
import { aberrated, apparentSunCache } from '../../../src/solver/light/sun.js';
import { parseUtcIso } from '../../../src/solver/time/time.js';
import { norm, type Vec3 } from '../../../src/solver/core/vec3.js';
import { expectClose } from '../../helpers/approx.js';

const AU_KM = 149_597_870.7; // IAU 2012 Resolution B2
const ARCSEC = Math.PI / 648_000;
const tt = (s: string): number => {
  const r = parseUtcIso(s);
  if (!r.ok) throw new Error(r.message);
  return r.value;
};
const angle = (u: Vec3, w: Vec3): number => Math.acos(Math.min(1, (u[0] * w[0] + u[1] * w[1] + u[2] * w[2]) / (norm(u) * norm(w))));

/** Overlap of two flat discs by counting points of a fine grid over the first disc (independent of the closed form). */
function gridOverlap(a: number, b: number, c: number): number {
  const n = 1200;
  let inside = 0;
  let hidden = 0;
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      const x = -a + (2 * a * (i + 0.5)) / n;
      const y = -a + (2 * a * (j + 0.5)) / n;
      if (x * x + y * y > a * a) continue;
      inside++;
      if ((x - c) ** 2 + y * y <= b * b) hidden++;
    }
  }
  return hidden / inside;
}

describe('hiddenFraction (Montenbruck & Gill 2000, sec. 3.4.2)', () => {
  it('is 0 outside the penumbra, 1 inside the umbra, b^2/a^2 in the annular phase', () => {
    expect(hiddenFraction({ a: 0.01, b: 0.2, c: 0.21 })).toBe(0);
    expect(hiddenFraction({ a: 0.01, b: 0.2, c: 0.19 })).toBe(1);
    expect(hiddenFraction({ a: 0.01, b: 0.005, c: 0.002 })).toBeCloseTo(0.25, 12);
  });

  it('matches a grid count of the overlapping discs in the partial phase to 1e-3', () => {
    for (const [a, b, c] of [[1, 1, 1], [1, 3, 3.5], [1, 0.6, 1.2], [0.5, 40, 40.2]] as const) {
      expectClose(hiddenFraction({ a, b, c }), gridOverlap(a, b, c), 1e-3, `a=${a} b=${b} c=${c}`);
    }
  });
});

describe('shadowGeometry rates', () => {
  it('equal central differences of the angles (1e-9 rad/s)', () => {
    const s: Vec3 = [AU_KM, 0, 0];
    const vs: Vec3 = [0, 29.8, 0];
    const at = (t: number) => {
      const r: Vec3 = [-7000 * Math.cos(0.001 * t), 7000 * Math.sin(0.001 * t) * 0.9, 300 + 0.5 * t];
      const v: Vec3 = [7 * Math.sin(0.001 * t), 6.3 * Math.cos(0.001 * t), 0.5];
      return shadowGeometry(r, v, [s[0] + vs[0] * t, s[1] + vs[1] * t, s[2]], vs, 6378.137);
    };
    const g = at(200);
    const h = 0.01;
    const [p, m] = [at(200 + h), at(200 - h)];
    expectClose(g.aRate, (p.a - m.a) / (2 * h), 1e-9, 'a rate');
    expectClose(g.bRate, (p.b - m.b) / (2 * h), 1e-9, 'b rate');
    expectClose(g.cRate, (p.c - m.c) / (2 * h), 1e-9, 'c rate');
  });
});

describe('the apparent Sun', () => {
  it("agrees with astronomy-engine's GeoVector(Sun, aberration = true) to 0.05 arcsec through a year", () => {
    const t0 = tt('2026-01-01T00:00:00Z');
    const cache = apparentSunCache(t0);
    for (let day = 0; day < 365; day += 17) {
      const t = t0 + day * 86_400 + 3_333;
      const ref = GeoVector(Body.Sun, AstroTime.FromTerrestrialTime(t / 86_400), true);
      const refKm: Vec3 = [ref.x * AU_KM, ref.y * AU_KM, ref.z * AU_KM];
      expect(angle(cache(t).r, refKm) / ARCSEC, `day ${day}`).toBeLessThan(0.05);
      expect(angle(aberrated(thirdBodyState('sun', t)).r, refKm) / ARCSEC).toBeLessThan(0.05);
      // ...and the aberration itself is there: ~20.5" from the geometric Sun (the constant of aberration, from memory).
      const shift = angle(thirdBodyState('sun', t).r, refKm) / ARCSEC;
      expect(shift).toBeGreaterThan(20);
      expect(shift).toBeLessThan(21);
    }
  });

  it('gives the Sun an apparent radius near 16 arcmin (the solar semi-diameter, 15.8 to 16.3 arcmin through the year, from memory)', () => {
    const t = tt('2026-07-04T00:00:00Z');
    const g = shadowGeometry([7000, 0, 0], [0, 7.5, 0], thirdBodyState('sun', t).r, [0, 0, 0], 6378.137, SUN_RADIUS_KM);
    expect((g.a * 180 * 60) / Math.PI).toBeGreaterThan(15.7);
    expect((g.a * 180 * 60) / Math.PI).toBeLessThan(15.9); // aphelion, early July
  });
});
