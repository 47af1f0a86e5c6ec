import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { AstroTime, KM_PER_AU, Observer, ObserverVector, SiderealTime, Vector, VectorObserver } from 'astronomy-engine';
import { WGS84_A_KM, WGS84_E2, WGS84_F, earthFixedToGeodetic, geodeticToEarthFixed } from '../../../src/solver/earth/geodetic.js';
import { norm, sub, type Vec3 } from '../../../src/solver/core/vec3.js';
import { expectClose } from '../../helpers/approx.js';

const DEG = Math.PI / 180;

describe('WGS-84 ellipsoid', () => {
  it('has a = 6378.137 km, 1/f = 298.257223563 and e^2 = 0.00669437999014 (NIMA TR8350.2, Tables 3.1 and 3.3, from memory)', () => {
    expect(WGS84_A_KM).toBe(6378.137);
    expectClose(1 / WGS84_F, 298.257_223_563, 1e-9, '1/f');
    expectClose(WGS84_E2, 0.006_694_379_990_14, 1e-14, 'e^2');
  });
});

describe('earthFixedToGeodetic', () => {
  it('matches Vallado 4th ed. Example 3-3: r = (6524.834, 6862.875, 6448.296) km -> 34.352496 deg, 46.4464 deg, 5085.22 km (from memory)', () => {
    const g = earthFixedToGeodetic([6524.834, 6862.875, 6448.296]);
    // The book's ellipsoid has a = 6378.1363 km (0.7 m smaller): tolerances cover that.
    expectClose(g.latitude / DEG, 34.352_496, 1e-5, 'latitude deg');
    expectClose(g.longitude / DEG, 46.4464, 1e-4, 'longitude deg');
    expectClose(g.height, 5085.22, 0.005, 'height km');
  });

  it('inverts geodeticToEarthFixed to 1 mm over the whole globe, heights -10 km to 40000 km (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: -Math.PI / 2, max: Math.PI / 2, noNaN: true }),
        fc.double({ min: -Math.PI, max: Math.PI, noNaN: true }),
        fc.double({ min: -10, max: 40_000, noNaN: true }),
        (lat, lon, h) => {
          const r = geodeticToEarthFixed(lat, lon, h);
          const g = earthFixedToGeodetic(r);
          const back = geodeticToEarthFixed(g.latitude, g.longitude, g.height);
          expect(norm(sub(back, r))).toBeLessThan(1e-6);
          expectClose(g.height, h, 1e-6, 'height');
          expectClose(g.latitude, lat, 1e-6 / 6378, 'latitude'); // 1 mm on the surface
        },
      ),
      { numRuns: 2000 },
    );
  });

  it('handles the poles, the equator and the antimeridian exactly', () => {
    for (const h of [-10, 0, 0.001, 400, 35_786, 40_000]) {
      for (const [lat, lon] of [[90, 0], [-90, 0], [0, 0], [0, 180], [0, -90], [45, 180]] as const) {
        const g = earthFixedToGeodetic(geodeticToEarthFixed(lat * DEG, lon * DEG, h));
        expectClose(g.latitude / DEG, lat, 1e-10, `lat at ${lat},${lon},${h}`);
        expectClose(g.height, h, 1e-6, `height at ${lat},${lon},${h}`);
        if (Math.abs(lat) < 90) expectClose(Math.abs(g.longitude / DEG), Math.abs(lon), 1e-10, `lon at ${lat},${lon},${h}`);
      }
    }
  });

  it('returns finite values near the centre of the Earth, where the closed form does not apply', () => {
    const g = earthFixedToGeodetic([3, -4, 12]);
    expect([g.latitude, g.longitude, g.height].every(Number.isFinite)).toBe(true);
    expectClose(g.height, 13 - 6370, 15, 'height km, roughly minus the radius');
  });

  it('agrees with the independent observer geometry of astronomy-engine to 1 m (its ellipsoid is a = 6378.1366 km, 1/f = 298.25642)', () => {
    const time = new AstroTime(9000.25);
    const gast = (SiderealTime(time) * Math.PI) / 12;
    const toEarthFixed = (v: { x: number; y: number; z: number }): Vec3 => [
      (Math.cos(gast) * v.x + Math.sin(gast) * v.y) * KM_PER_AU,
      (-Math.sin(gast) * v.x + Math.cos(gast) * v.y) * KM_PER_AU,
      v.z * KM_PER_AU,
    ];
    fc.assert(
      fc.property(fc.double({ min: -89.9, max: 89.9, noNaN: true }), fc.double({ min: -179.9, max: 179.9, noNaN: true }), fc.double({ min: -0.4, max: 9, noNaN: true }), (lat, lon, hKm) => {
        const theirs = toEarthFixed(ObserverVector(time, new Observer(lat, lon, hKm * 1000), true));
        const ours = geodeticToEarthFixed(lat * DEG, lon * DEG, hKm);
        expect(norm(sub(ours, theirs))).toBeLessThan(1e-3);
        // And their inverse applied to our position gives our latitude back (to ~1 m).
        const c = Math.cos(gast);
        const s = Math.sin(gast);
        const eqd = new Vector((c * ours[0] - s * ours[1]) / KM_PER_AU, (s * ours[0] + c * ours[1]) / KM_PER_AU, ours[2] / KM_PER_AU, time);
        expectClose(VectorObserver(eqd, true).latitude, lat, 1e-5, 'latitude deg');
      }),
      { numRuns: 300 },
    );
  });
});
