import { Body, DeltaT_EspenakMeeus, Equator, GeoVector, Horizon, MakeTime, Observer, ObserverVector, SetDeltaTFunction } from 'astronomy-engine';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { FastifyInstance } from 'fastify';
import { PassesAnswer } from '../../src/schemas/passes.js';
import { postJson, testApp } from '../helpers/app.js';
import { expectClose } from '../helpers/approx.js';
import { DEMO_ORBIT, DEMO_STATIONS, EPOCH } from '../helpers/demo.js';

let app: FastifyInstance;
beforeAll(async () => { app = await testApp(); });
afterAll(async () => { await app.close(); });

const demo = { ...DEMO_ORBIT, window: { start: EPOCH, stop: '2026-12-02T00:00:00Z' }, stations: DEMO_STATIONS };
const ms = (iso: string) => Date.parse(iso);

describe('POST /v1/passes', () => {
  it('answers passes in AOS order with AOS < TCA < LOS, durations that match, and elevations above the limit', async () => {
    const res = await postJson(app, '/v1/passes', demo);
    expect(res.statusCode, res.body).toBe(200);
    const answer = PassesAnswer.parse(res.json());
    // A 97.6 deg sun-synchronous orbit passes a 78 deg N station on most of its ~15 revolutions a day
    // and a 61 deg N station several times (common practice, no source).
    const count = (id: string) => answer.passes.filter((p) => p.station === id).length;
    expect(count('oskel-fjord')).toBeGreaterThanOrEqual(10);
    expect(count('korrin-hill')).toBeGreaterThanOrEqual(3);
    for (let i = 0; i < answer.passes.length; i++) {
      const p = answer.passes[i]!;
      if (i > 0) expect(ms(p.aos)).toBeGreaterThanOrEqual(ms(answer.passes[i - 1]!.aos));
      expect(ms(p.aos)).toBeLessThanOrEqual(ms(p.tca));
      expect(ms(p.tca)).toBeLessThanOrEqual(ms(p.los));
      expectClose(p.duration * 1000, ms(p.los) - ms(p.aos), 2, 'duration');
      expect(p.maxElevation).toBeGreaterThan(p.station === 'korrin-hill' ? 5 : 0);
      // At 550 km the horizon is ~2700 km away (sqrt((R+h)^2 - R^2); common practice, no source).
      expect(p.rangeTca).toBeLessThan(2800);
      expect(p.rangeTca).toBeGreaterThan(540);
    }
  });

  it('the pointing track starts and ends on the elevation limit and carries the Doppler shift of the carrier', async () => {
    const carrier = 2.2e9;
    const res = await postJson(app, '/v1/passes', { ...demo, stations: [demo.stations[0]], pointing: { step: 5, carrierFrequency: carrier } });
    const answer = PassesAnswer.parse(res.json());
    const full = answer.passes.filter((p) => !p.startsBeforeWindow && !p.endsAfterWindow);
    expect(full.length).toBeGreaterThan(0);
    for (const p of full) {
      const track = p.pointing!;
      expectClose(track[0]!.elevation, 5, 0.01, 'elevation at AOS');
      expectClose(track[track.length - 1]!.elevation, 5, 0.01, 'elevation at LOS');
      expect(Math.max(...track.map((s) => s.elevation))).toBeLessThanOrEqual(p.maxElevation + 1e-6);
      for (const s of track) {
        // Doppler to first order: f_r = f (1 - rdot / c), c = 299792.458 km/s (SI definition of the metre).
        expectClose(s.dopplerFactor, 1 - s.rangeRate / 299_792.458, 1e-15, 'factor');
        expectClose(s.dopplerShift!, carrier * (s.dopplerFactor - 1), 1e-3, 'shift');
      }
      // Approaching before TCA, receding after (common practice, no source).
      expect(track[0]!.rangeRate).toBeLessThan(0);
      expect(track[track.length - 1]!.rangeRate).toBeGreaterThan(0);
    }
  });

  it('a geostationary spacecraft is visible all window long from below it and never from the far side', async () => {
    // a = 42164.17 km circular equatorial (from GM and the sidereal day; common practice, no source).
    const geo = {
      ...demo,
      elements: { epoch: EPOCH, semiMajorAxis: 42164.17, eccentricity: 0, inclination: 0, raan: 0, argPeriapsis: 0, trueAnomaly: 0 },
      window: { start: EPOCH, stop: '2026-12-01T12:00:00Z' },
    };
    const probe = await postJson(app, '/v1/track', { centralBody: 'earth', elements: geo.elements, grid: { times: [EPOCH] }, frame: 'geodetic' });
    const subLongitude = probe.json().samples[0].longitude as number;
    const res = await postJson(app, '/v1/passes', {
      ...geo,
      stations: [
        { id: 'below', latitude: 0, longitude: subLongitude, altitude: 0, minElevation: 10 },
        { id: 'far-side', latitude: 0, longitude: subLongitude + 180, altitude: 0, minElevation: 0 },
      ],
    });
    const answer = PassesAnswer.parse(res.json());
    expect(answer.passes.map((p) => p.station)).toEqual(['below']);
    expect(answer.passes[0]).toMatchObject({ startsBeforeWindow: true, endsAfterWindow: true });
    expectClose(answer.passes[0]!.maxElevation, 90, 0.5, 'zenith');
  });

  it('each pass and pointing sample says whether the spacecraft is sunlit, how high the Sun is at the station, and whether it is visible', async () => {
    // The Sun's elevation from astronomy-engine at the station (UT1 = UTC: TT - UT1 = 69.184 s in 2026,
    // 32.184 s + 37 leap seconds; from memory), geometric (no refraction).
    SetDeltaTFunction(() => 69.184);
    const sunElevation = (iso: string, st: { latitude: number; longitude: number; altitude: number }): number => {
      const time = MakeTime(new Date(iso));
      const observer = new Observer(st.latitude, st.longitude, st.altitude * 1000);
      const eq = Equator(Body.Sun, time, observer, true, true);
      return Horizon(time, observer, eq.ra, eq.dec).altitude;
    };
    try {
      const body = { ...demo, stations: [demo.stations[1]], pointing: { step: 60 } };
      const answer = PassesAnswer.parse((await postJson(app, '/v1/passes', body)).json());
      const combos = new Set<string>();
      for (const p of answer.passes) {
        for (const [epoch, l] of [[p.aos, p.light.aos], [p.tca, p.light.tca], [p.los, p.light.los]] as const) {
          expectClose(l.sunElevation, sunElevation(epoch, demo.stations[1]!), 0.01, 'Sun elevation, deg');
          expect(l.visible).toBe(l.sunlit && l.sunElevation < -6);
          combos.add(`${l.sunlit}/${l.sunElevation < -6}`);
        }
        const first = p.pointing![0]!;
        expect({ sunlit: first.sunlit, sunElevation: first.sunElevation, visible: first.visible }).toEqual(p.light.aos);
        for (const s of p.pointing!) expect(s.visible).toBe(s.sunlit && s.sunElevation < -6);
      }
      // A 78 deg N station in the polar night: the spacecraft rises in the Earth's shadow and comes into sunlight over it.
      expect(combos.has('true/true')).toBe(true);
      expect(combos.has('false/true')).toBe(true);
      // A twilight limit of 90 deg makes every sunlit point visible.
      const any = PassesAnswer.parse((await postJson(app, '/v1/passes', { ...body, twilightLimit: 90 })).json());
      for (const p of any.passes) expect(p.light.tca.visible).toBe(p.light.tca.sunlit);
    } finally {
      SetDeltaTFunction(DeltaT_EspenakMeeus); // the library's default
    }
  });

  describe('refraction', () => {
    // An invented spacecraft on a circular equatorial orbit over an invented station on the equator: every pass is
    // overhead, the station's vertical is radial (the ellipsoid's equator is a circle) and the direction to the
    // spacecraft turns against the station at exactly n - omega_E in the equatorial plane.
    const a = 6378.137 + 550;
    const equatorial = {
      centralBody: 'earth',
      elements: { epoch: EPOCH, semiMajorAxis: a, eccentricity: 0, inclination: 0, raan: 0, argPeriapsis: 0, trueAnomaly: 0 },
      window: { start: EPOCH, stop: '2026-12-01T06:00:00Z' },
      stations: [{ id: 'marren-quay', latitude: 0, longitude: 31.4, altitude: 0, minElevation: 0 }],
    };
    const passes = async (extra: object) => PassesAnswer.parse((await postJson(app, '/v1/passes', { ...equatorial, ...extra })).json());

    it('optical: AOS earlier and LOS later than the geometric ones by the seconds the horizon refraction takes to cross (0.05 s)', async () => {
      // Expected, derived here: a point at central angle psi from the station, at radius r, has the geometric
      // elevation e with r cos(e + psi) = R cos e (plane triangle centre-station-spacecraft; common practice, no
      // source). The geometric AOS is at e = 0: psi_g = acos(R / r). The apparent AOS (apparent elevation 0) is at the
      // geometric elevation -R0, R0 = Bennett's refraction at apparent 0, cot(7.31 / 4.4 deg) arcmin (J. Navig. 35
      // (1982) 255): psi_a = acos(R cos R0 / r) + R0. psi changes at n - omega_E, so AOS comes
      // (psi_a - psi_g) / (n - omega_E) earlier, LOS as much later.
      const R = 6378.137; // WGS-84 equatorial radius, km
      const MU = 398_600.4418; // km^3/s^2 (NIMA TR8350.2, from memory)
      const OMEGA_E = 7.292_115e-5; // rad/s, Earth rotation rate (IERS Conventions 2010, from memory)
      const R0 = (1 / Math.tan((7.31 / 4.4) * (Math.PI / 180))) * (Math.PI / 180 / 60);
      const psiG = Math.acos(R / a);
      const psiA = Math.acos((R * Math.cos(R0)) / a) + R0;
      const expected = (psiA - psiG) / (Math.sqrt(MU / a ** 3) - OMEGA_E);
      expect(expected).toBeGreaterThan(8); // about 9.7 s at 550 km
      const geometric = await passes({});
      const optical = await passes({ refraction: 'optical' });
      expect(geometric.refraction).toBeUndefined();
      expect(optical.refraction).toEqual({ model: 'optical', pressure: 1010, temperature: 10 });
      const whole = (x: PassesAnswer) => x.passes.filter((p) => !p.startsBeforeWindow && !p.endsAfterWindow);
      expect(whole(optical).length).toBe(whole(geometric).length);
      expect(whole(geometric).length).toBeGreaterThanOrEqual(2);
      for (const [i, g] of whole(geometric).entries()) {
        const o = whole(optical)[i]!;
        expectClose((ms(g.aos) - ms(o.aos)) / 1000, expected, 0.05, `AOS earlier, s (pass ${i})`);
        expectClose((ms(o.los) - ms(g.los)) / 1000, expected, 0.05, `LOS later, s (pass ${i})`);
        expect(o.maxElevation).toBeGreaterThanOrEqual(g.maxElevation); // apparent >= geometric
      }
      // Colder, denser air bends more: P / 1010 * 283 / (273 + T) (Meeus, 2nd ed. ch. 16, from memory).
      const cold = await passes({ refraction: 'optical', atmosphere: { pressure: 1030, temperature: -20 } });
      expect(ms(whole(geometric)[0]!.aos) - ms(whole(cold)[0]!.aos)).toBeGreaterThan(1000 * expected * 1.05);
    });

    it('radio: AOS earlier still (the 4/3-Earth bending at the horizon exceeds the optical one); "none" answers the bytes of a request without the field', async () => {
      const geometric = await postJson(app, '/v1/passes', equatorial);
      const none = await postJson(app, '/v1/passes', { ...equatorial, refraction: 'none' });
      expect(none.body).toBe(geometric.body);
      expect(none.headers.etag).toBe(geometric.headers.etag);
      const radio = await passes({ refraction: 'radio' });
      const optical = await passes({ refraction: 'optical' });
      expect(radio.refraction).toEqual({ model: 'radio' });
      const g = PassesAnswer.parse(geometric.json()).passes.find((p) => !p.startsBeforeWindow)!;
      const r = radio.passes.find((p) => !p.startsBeforeWindow)!;
      const o = optical.passes.find((p) => !p.startsBeforeWindow)!;
      expect(ms(r.aos)).toBeLessThan(ms(o.aos));
      expect(ms(o.aos)).toBeLessThan(ms(g.aos));
      const bad = await postJson(app, '/v1/passes', { ...equatorial, refraction: 'radio', atmosphere: { pressure: 1000 } });
      expect(bad.statusCode).toBe(400);
    });
  });

  it('sunAvoidance: a geostationary spacecraft seen from a station below it at the March equinox, when the Sun passes behind it; intervals within 1 s of an independent computation', async () => {
    // Independent: astronomy-engine's station position (ObserverVector, J2000 equator), its apparent Sun, and the
    // spacecraft on its closed-form circular orbit; UT1 = UTC (TT - UT1 = 69.184 s in 2026, from memory).
    SetDeltaTFunction(() => 69.184);
    try {
      const AU = 149_597_870.7; // km, IAU 2012 Resolution B2
      const a = 42_164.17; // geostationary radius, km (common practice, no source)
      const n = Math.sqrt(398_600.4418 / a ** 3); // GM: NIMA TR8350.2, from memory
      const noon = '2026-03-20T14:46:00Z'; // the equinox, 2026-03-20 ~14:46 UTC (from memory); the station's local noon
      const time0 = MakeTime(new Date(noon));
      const lon = -(14 + 46 / 60 - 12) * 15; // the Sun on the station's meridian at that time (within the equation of time)
      const observer = new Observer(0, lon, 0);
      const station0 = ObserverVector(time0, observer, false);
      const ra0 = Math.atan2(station0.y, station0.x); // the spacecraft straight above at `noon`
      const t0 = Date.parse(noon) / 1000;
      const scAt = (unix: number): [number, number, number] => {
        const u = ra0 + n * (unix - t0);
        return [a * Math.cos(u), a * Math.sin(u), 0];
      };
      const angleAt = (unix: number): number => {
        const time = MakeTime(new Date(unix * 1000));
        const o = ObserverVector(time, observer, false);
        const s = GeoVector(Body.Sun, time, true);
        const st: [number, number, number] = [o.x * AU, o.y * AU, o.z * AU];
        const toSc = scAt(unix).map((x, i) => x - st[i]!);
        const toSun = [s.x * AU - st[0], s.y * AU - st[1], s.z * AU - st[2]];
        const d = toSc[0]! * toSun[0]! + toSc[1]! * toSun[1]! + toSc[2]! * toSun[2]!;
        return (Math.acos(Math.min(1, d / (Math.hypot(...toSc) * Math.hypot(...toSun)))) * 180) / Math.PI;
      };
      const [r0, v0] = [scAt(t0), [-a * n * Math.sin(ra0), a * n * Math.cos(ra0), 0]];
      const body = {
        centralBody: 'earth',
        state: { epoch: noon, position: r0, velocity: v0 },
        window: { start: '2026-03-20T12:00:00Z', stop: '2026-03-20T17:30:00Z' },
        stations: [{ id: 'tellin-atoll', latitude: 0, longitude: lon, altitude: 0, minElevation: 5 }],
        sunAvoidance: { angle: 3 },
        pointing: { step: 60 },
      };
      const answer = PassesAnswer.parse((await postJson(app, '/v1/passes', body)).json());
      expect(answer.passes).toHaveLength(1);
      const p = answer.passes[0]!;
      const avoid = p.sunAvoidance!;
      expect(avoid.sunInBeam).toBe(true);
      expect(avoid.intervals).toHaveLength(1);
      // Crossings of the 3 deg circle by bisection of the independent angle to 1 ms.
      const crossing = (lo: number, hi: number): number => {
        const inside = angleAt(lo) < 3;
        while (hi - lo > 1e-3) {
          const mid = (lo + hi) / 2;
          if ((angleAt(mid) < 3) === inside) lo = mid;
          else hi = mid;
        }
        return (lo + hi) / 2;
      };
      let tMin = t0;
      for (let t = t0 - 3600; t <= t0 + 3600; t += 10) if (angleAt(t) < angleAt(tMin)) tMin = t;
      const start = crossing(tMin - 3 * 3600 + 3600, tMin);
      const stop = crossing(tMin, tMin + 2 * 3600);
      expectClose(ms(avoid.intervals[0]!.start) / 1000, start, 1, 'entry into the 3 deg circle, s');
      expectClose(ms(avoid.intervals[0]!.stop) / 1000, stop, 1, 'exit, s');
      expect((stop - start) / 60).toBeGreaterThan(20); // the Sun moves 0.25 deg/min: about 24 min across 6 deg
      expectClose(avoid.minAngle, angleAt(ms(avoid.minAngleAt) / 1000), 0.01, 'least angle, deg');
      expect(avoid.minAngle).toBeLessThan(1);
      for (const s of p.pointing!) {
        expectClose(s.sunAngle!, angleAt(ms(s.epoch) / 1000), 0.01, `sun angle at ${s.epoch}`);
        expect(s.sunInBeam).toBe(s.sunAngle! < 3);
      }
      expect(p.pointing!.some((s) => s.sunInBeam)).toBe(true);
      // Without sunAvoidance the answer carries none of it.
      const plain = PassesAnswer.parse((await postJson(app, '/v1/passes', { ...body, sunAvoidance: undefined })).json());
      expect(plain.passes[0]!.sunAvoidance).toBeUndefined();
      expect(plain.passes[0]!.pointing![0]!.sunAngle).toBeUndefined();
    } finally {
      SetDeltaTFunction(DeltaT_EspenakMeeus);
    }
  });

  it('refuses bad requests with problems naming the reason', async () => {
    const cases: Array<[unknown, number, string]> = [
      [{ ...demo, window: { start: EPOCH, stop: '2027-01-15T00:00:00Z' } }, 422, '/problems/window-too-long'],
      [{ ...demo, window: { start: '2026-12-02T00:00:00Z', stop: EPOCH } }, 400, '/problems/validation-failed'],
      [{ ...demo, stations: [demo.stations[0], demo.stations[0]] }, 422, '/problems/invalid-parameter'],
      [{ ...demo, stations: Array.from({ length: 101 }, (_, i) => ({ ...demo.stations[0], id: `s${i}` })) }, 422, '/problems/too-many-stations'],
      [{ ...demo, stations: [{ ...demo.stations[0], horizonMask: [{ azimuth: 360, elevation: 5 }] }] }, 400, '/problems/validation-failed'],
      [{ ...demo, centralBody: 'moon', elements: { ...demo.elements, semiMajorAxis: 2000 } }, 422, '/problems/unsupported-frame'],
      [{ ...demo, elements: { ...demo.elements, semiMajorAxis: 6500, eccentricity: 0.1 } }, 422, '/problems/impact'],
    ];
    for (const [body, status, type] of cases) {
      const res = await postJson(app, '/v1/passes', body);
      expect(res.statusCode, type).toBe(status);
      expect(res.json().type, JSON.stringify(res.json())).toBe(type);
    }
  });

  it('caches by scenario: same bytes, 304 on If-None-Match', async () => {
    const first = await postJson(app, '/v1/passes', demo);
    const second = await postJson(app, '/v1/passes', demo);
    expect(second.headers['x-cache']).toBe('hit');
    expect(second.rawPayload.equals(first.rawPayload)).toBe(true);
    expect((await postJson(app, '/v1/passes', demo, { 'if-none-match': String(first.headers.etag) })).statusCode).toBe(304);
  });
});
