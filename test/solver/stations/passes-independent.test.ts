// The pass search checked once against a computation that shares none of its frame or look-angle
// code: astronomy-engine 2.1.19 (a general astronomy library from the registry) gives the
// observer's position of date (ObserverVector), the rotation J2000 -> true equator of date
// (Rotation_EQJ_EQD) and the horizontal coordinates of an RA/Dec of date (Horizon, no refraction).
// Times go to it as JavaScript Dates parsed from the ISO text, not through our time scales.
import { AstroTime, Horizon, Observer, ObserverVector, RotateVector, Rotation_EQJ_EQD, Vector } from 'astronomy-engine';
import { describe, expect, it } from 'vitest';
import { propagate } from '../../../src/solver/conic/universal.js';
import { findPasses, type PassStation } from '../../../src/solver/stations/passes.js';
import { formatUtcIso, parseUtcIso } from '../../../src/solver/time/time.js';
import { expectClose } from '../../helpers/approx.js';

const DEG = Math.PI / 180;
const AU_KM = 149_597_870.7; // IAU 2012 Resolution B2
const MU = 398_600.4418; // km^3/s^2, WGS-84 (NIMA TR8350.2 Table 3.1, from memory)
const t0 = (() => { const r = parseUtcIso('2026-06-10T00:00:00Z'); if (!r.ok) throw new Error(r.message); return r.value; })();

// An invented LEO (600 km, 70 deg) and an invented station on an invented hill.
const r0 = [6978.137, 0, 0] as const;
const speed = Math.sqrt(MU / 6978.137);
const v0 = [0, speed * Math.cos(70 * DEG), speed * Math.sin(70 * DEG)] as const;
const STATION: PassStation = { id: 'brannock-hill', latitude: 52.4 * DEG, longitude: -4.1 * DEG, height: 0.12, minElevation: 5 * DEG };

/** Altitude (deg) of the spacecraft seen from the station at a TT epoch, by astronomy-engine alone. */
function theirAltitude(tt: number): number {
  const time = new AstroTime(new Date(formatUtcIso(tt, 3)));
  const observer = new Observer(STATION.latitude / DEG, STATION.longitude / DEG, STATION.height * 1000);
  const s = propagate([...r0], [...v0], MU, tt - t0);
  if (!s.ok) throw new Error(s.message);
  // GCRF ~ J2000 (EQJ) to 23 mas, about 0.2 m at these ranges: negligible in angle.
  const ofDate = RotateVector(Rotation_EQJ_EQD(time), new Vector(s.value.r[0] / AU_KM, s.value.r[1] / AU_KM, s.value.r[2] / AU_KM, time));
  const obs = ObserverVector(time, observer, true);
  const [x, y, z] = [ofDate.x - obs.x, ofDate.y - obs.y, ofDate.z - obs.z];
  const raHours = ((Math.atan2(y, x) / DEG + 360) % 360) / 15;
  const decDeg = Math.atan2(z, Math.hypot(x, y)) / DEG;
  return Horizon(time, observer, raHours, decDeg).altitude;
}

describe('findPasses against an independent look-angle chain', () => {
  it('AOS and LOS lie on the 5 deg limit and TCA is the highest point, by astronomy-engine (within 0.01 deg)', () => {
    const found = findPasses({
      stateAt: (tt) => propagate([...r0], [...v0], MU, tt - t0),
      startTT: t0,
      stopTT: t0 + 86_400,
      stations: [STATION],
      options: {},
    });
    if (!found.ok) throw new Error(found.message);
    const passes = found.value.passes.filter((p) => !p.startsBeforeWindow && !p.endsAfterWindow);
    expect(passes.length).toBeGreaterThan(2);
    for (const p of passes) {
      expectClose(theirAltitude(p.aos), 5, 0.01, 'altitude at AOS, deg');
      expectClose(theirAltitude(p.los), 5, 0.01, 'altitude at LOS, deg');
      const top = theirAltitude(p.tca);
      expectClose(top, p.maxElevation / DEG, 0.01, 'altitude at TCA, deg');
      for (const dt of [-5, 5]) expect(theirAltitude(p.tca + dt)).toBeLessThan(top + 1e-6);
    }
  });
});
