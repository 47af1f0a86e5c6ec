import { AstroTime, Body, DeltaT_EspenakMeeus, Equator, Horizon, Observer, SetDeltaTFunction } from 'astronomy-engine';
import { afterAll, describe, expect, it } from 'vitest';
import { propagate } from '../../../src/solver/conic/universal.js';
import { dot, norm, sub, type Vec3 } from '../../../src/solver/core/vec3.js';
import { DEFAULT_TWILIGHT_LIMIT, lightPasses, lightingOver } from '../../../src/solver/light/pass-light.js';
import type { StateAt } from '../../../src/solver/propagation/state-source.js';
import { findPasses } from '../../../src/solver/stations/passes.js';
import { parseUtcIso } from '../../../src/solver/time/time.js';
import { expectClose } from '../../helpers/approx.js';
import { MU_EARTH, R_EARTH, sunAt } from '../../helpers/cone-shadow.js';

const DEG = Math.PI / 180;
const DAY = 86_400;
const tt = (s: string): number => {
  const r = parseUtcIso(s);
  if (!r.ok) throw new Error(r.message);
  return r.value;
};
// UT1 = UTC as the solver takes it without EOP: astronomy-engine then needs TT - UT1 = TT - UTC,
// 69.184 s in 2026 (32.184 s + 37 leap seconds; IERS Bulletin C, from memory).
SetDeltaTFunction(() => 69.184);
afterAll(() => { SetDeltaTFunction(DeltaT_EspenakMeeus); }); // the library's default

// An invented station (Harrow Moor) and an invented LEO: 560 km circular at 53 deg.
const station = { id: 'harrow-moor', latitude: 47.3 * DEG, longitude: -2.1 * DEG, height: 0.12, minElevation: 0 };
const t0 = tt('2026-11-02T00:00:00Z');
const a = R_EARTH + 560;
const inc = 53 * DEG;
const r0: Vec3 = [a, 0, 0];
const v0: Vec3 = [0, Math.sqrt(MU_EARTH / a) * Math.cos(inc), Math.sqrt(MU_EARTH / a) * Math.sin(inc)];
const stateAt: StateAt = (t) => propagate(r0, v0, MU_EARTH, t - t0);
const positionAt = (t: number): Vec3 => {
  const s = propagate(r0, v0, MU_EARTH, t - t0);
  if (!s.ok) throw new Error(s.message);
  return s.value.r;
};

/**
 * Independent test of "the centre of the solar disc is in view": the segment from the spacecraft
 * toward the Sun's centre misses the Earth's sphere (ray-sphere intersection; common practice, no
 * source): the closest approach of the ray r + u d (u >= 0) to the centre is above R.
 */
function sunCentreInView(r: Vec3, s: Vec3): boolean {
  const d = sub(s, r);
  const u = Math.max(0, -dot(r, d) / dot(d, d));
  return norm([r[0] + u * d[0], r[1] + u * d[1], r[2] + u * d[2]]) > R_EARTH;
}

/** The Sun's geometric elevation at the station from astronomy-engine (its Earth rotation, nutation and aberration; no refraction), deg. */
function sunElevationDeg(t: number): number {
  const time = AstroTime.FromTerrestrialTime(t / DAY);
  const observer = new Observer(station.latitude / DEG, station.longitude / DEG, station.height * 1000);
  const eq = Equator(Body.Sun, time, observer, true, true);
  return Horizon(time, observer, eq.ra, eq.dec).altitude;
}

describe('lightingOver: sunlight on the spacecraft and the Sun at the station', () => {
  const light = lightingOver(stateAt, t0, t0 + DAY)(station);

  it('the Sun\'s elevation at the station matches astronomy-engine\'s horizontal coordinates within 0.01 deg through a day', () => {
    let worst = 0;
    for (let t = t0; t <= t0 + DAY; t += 1800) worst = Math.max(worst, Math.abs(light(t).sunElevation / DEG - sunElevationDeg(t)));
    expect(worst).toBeLessThan(0.01);
  });

  it('sunlit agrees with a ray-sphere test toward the Sun\'s centre (astronomy-engine\'s Sun) at every minute of a day, away from the 0.1 s around each switch', () => {
    let switches = 0;
    let prev: boolean | undefined;
    for (let t = t0; t <= t0 + DAY; t += 60) {
      const expected = sunCentreInView(positionAt(t), sunAt(t));
      // The aberration moves the Sun's direction by ~20": at 7.6 km/s that is at most ~0.3 s of shadow edge.
      const near = [-0.5, 0.5].some((dt) => sunCentreInView(positionAt(t + dt), sunAt(t + dt)) !== expected);
      if (!near) expect(light(t).sunlit, `at ${t - t0} s`).toBe(expected);
      if (prev !== undefined && prev !== expected) switches++;
      prev = expected;
    }
    expect(switches).toBeGreaterThan(20); // into and out of the shadow on most of ~15 revolutions
  });

  it('visible is sunlit with the Sun below the twilight limit (default -6 deg)', () => {
    expect(DEFAULT_TWILIGHT_LIMIT / DEG).toBe(-6);
    const seen = new Set<string>();
    for (let t = t0; t <= t0 + DAY; t += 120) {
      const l = light(t);
      expect(l.visible).toBe(l.sunlit && l.sunElevation < -6 * DEG);
      seen.add(`${l.sunlit}/${l.sunElevation < -6 * DEG}`);
    }
    expect(seen.size).toBe(4); // every combination occurs over a day
  });
});

describe('lightPasses', () => {
  it('gives the light at AOS, TCA, LOS and each pointing sample of every pass, with a twilight limit of choice', () => {
    const search = findPasses({ stateAt, startTT: t0, stopTT: t0 + DAY, stations: [station], options: { pointingStepS: 30 } });
    if (!search.ok) throw new Error(search.message);
    const passes = search.value.passes;
    expect(passes.length).toBeGreaterThan(3);
    const lit = lightPasses(passes, [station], stateAt, t0, t0 + DAY, { twilightLimit: 10 * DEG });
    if (!lit.ok) throw new Error(lit.message);
    const single = lightingOver(stateAt, t0, t0 + DAY, { twilightLimit: 10 * DEG })(station);
    for (const [i, p] of passes.entries()) {
      const l = lit.value[i]!;
      expect(l.aos).toEqual(single(p.aos));
      expect(l.tca).toEqual(single(p.tca));
      expect(l.los).toEqual(single(p.los));
      expect(l.pointing!.length).toBe(p.pointing!.length);
      for (const [k, s] of p.pointing!.entries()) expect(l.pointing![k]).toEqual(single(s.tt));
      expectClose(l.tca.sunElevation / DEG, sunElevationDeg(p.tca), 0.01, 'Sun elevation at TCA');
    }
  });
});
