import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { gcrfToItrf } from '../../../src/solver/earth/frames.js';
import { createHorizonMask, horizonLimit, type MaskPoint } from '../../../src/solver/stations/horizon-mask.js';
import {
  MAX_PASS_STATIONS,
  MAX_PASS_WINDOW_S,
  MAX_POINTING_SAMPLES,
  findPasses,
  type GcrfState,
  type Pass,
  type PassStation,
  type StateAt,
} from '../../../src/solver/stations/passes.js';
import { failure, success } from '../../../src/solver/core/result.js';
import { parseUtcIso } from '../../../src/solver/time/time.js';
import { lookAngles, stationFromGeodetic, type LookAngles } from '../../../src/solver/stations/topocentric.js';
import { propagate } from '../../../src/solver/conic/universal.js';
import type { Vec3 } from '../../../src/solver/core/vec3.js';
import { expectClose } from '../../helpers/approx.js';

const DEG = Math.PI / 180;
const MU = 398_600.4418; // Earth GM, km^3/s^2 (NIMA TR8350.2 Table 3.1, from memory)
const DAY = 86_400;
const tt = (s: string): number => {
  const r = parseUtcIso(s);
  if (!r.ok) throw new Error(r.message);
  return r.value;
};
const T0 = tt('2026-03-01T00:00:00Z');

/** Circular orbit in GCRF, closed form: radius a, inclination, RAAN, argument of latitude u0 at T0. */
function circular(a: number, inclination: number, raan: number, u0: number): StateAt {
  const n = Math.sqrt(MU / a ** 3);
  const speed = n * a;
  const [cO, sO, ci, si] = [Math.cos(raan), Math.sin(raan), Math.cos(inclination), Math.sin(inclination)];
  const p: Vec3 = [cO, sO, 0];
  const q: Vec3 = [-sO * ci, cO * ci, si];
  return (t) => {
    const u = u0 + n * (t - T0);
    const [cu, su] = [Math.cos(u), Math.sin(u)];
    return {
      r: [a * (cu * p[0] + su * q[0]), a * (cu * p[1] + su * q[1]), a * (cu * p[2] + su * q[2])],
      v: [speed * (-su * p[0] + cu * q[0]), speed * (-su * p[1] + cu * q[1]), speed * (-su * p[2] + cu * q[2])],
    };
  };
}

/** Look angles by the direct (untabled) frame transformation: the reference for the checks. */
function lookAt(stateAt: StateAt, station: PassStation, t: number): LookAngles {
  const s = stateAt(t) as GcrfState;
  const e = gcrfToItrf(t, s.r, s.v);
  return lookAngles(stationFromGeodetic(station.latitude, station.longitude, station.height), e.r, e.v);
}

function limitOf(station: PassStation): (azimuth: number) => number {
  const m = createHorizonMask(station.mask ?? [], station.minElevation);
  if (!m.ok) throw new Error(m.message);
  return (az) => horizonLimit(m.value, az);
}

function search(stateAt: StateAt, stations: PassStation[], start: number, stop: number, pointingStepS?: number): readonly Pass[] {
  const r = findPasses({ stateAt, startTT: start, stopTT: stop, stations, options: pointingStepS === undefined ? {} : { pointingStepS } });
  if (!r.ok) throw new Error(r.message);
  return r.value.passes;
}

/**
 * Brute-force check (common practice, no source): every sample (step s) above the limit lies in a
 * reported pass of its station, every reported pass is above the limit at its TCA, and AOS/LOS
 * inside the window lie on the limit within 0.01 deg.
 */
function checkAgainstBruteForce(stateAt: StateAt, stations: PassStation[], start: number, stop: number, passes: readonly Pass[], step: number): void {
  for (const st of stations) {
    const limit = limitOf(st);
    const mine = passes.filter((p) => p.station === st.id);
    for (let t = start; t <= stop; t += step) {
      const l = lookAt(stateAt, st, t);
      if (l.elevation - limit(l.azimuth) > 1e-6) {
        const covered = mine.some((p) => p.aos <= t + 2e-3 && p.los >= t - 2e-3);
        if (!covered) expect.fail(`${st.id}: visible at TT ${t} (el ${(l.elevation / DEG).toFixed(4)} deg) but in no pass`);
      }
    }
    for (const p of mine) {
      const top = lookAt(stateAt, st, p.tca);
      expect(top.elevation, `${st.id} at TCA`).toBeGreaterThanOrEqual(limit(top.azimuth) - 1e-9);
      for (const [edge, clipped] of [[p.aos, p.startsBeforeWindow], [p.los, p.endsAfterWindow]] as const) {
        if (clipped) continue;
        const l = lookAt(stateAt, st, edge);
        expectClose(l.elevation / DEG, limit(l.azimuth) / DEG, 0.01, `${st.id} elevation at AOS/LOS, deg`);
      }
    }
  }
}

const station = (id: string, latDeg: number, lonDeg: number, minElDeg: number, mask?: MaskPoint[]): PassStation => ({
  id,
  latitude: latDeg * DEG,
  longitude: lonDeg * DEG,
  height: 0.3,
  minElevation: minElDeg * DEG,
  ...(mask ? { mask } : {}),
});

// Invented stations at invented sites.
const RIDGE_MASK: MaskPoint[] = [
  { azimuth: 0, elevation: 4 * DEG },
  { azimuth: 60 * DEG, elevation: 14 * DEG },
  { azimuth: 75 * DEG, elevation: 2 * DEG },
  { azimuth: 200 * DEG, elevation: 9 * DEG },
  { azimuth: 300 * DEG, elevation: 1 * DEG },
];
const STATIONS: PassStation[] = [
  station('north-fell', 64.1, -21.9, 5),
  station('salt-flat', -23.5, -68.2, 10),
  station('ridge', 47.3, 11.4, 0, RIDGE_MASK),
  station('harbour', 1.3, 103.8, 0),
];

describe('findPasses', () => {
  it('finds every pass of a LEO spacecraft that a 2 s brute-force scan sees; AOS/LOS lie on the mask within 0.01 deg', () => {
    const orbit = circular(6378.137 + 550, 53 * DEG, 1.1, 0.4);
    const passes = search(orbit, STATIONS, T0, T0 + DAY);
    expect(passes.length).toBeGreaterThan(10);
    checkAgainstBruteForce(orbit, STATIONS, T0, T0 + DAY, passes, 2);
    for (let i = 1; i < passes.length; i++) expect(passes[i]!.aos).toBeGreaterThanOrEqual(passes[i - 1]!.aos); // time order
    for (const p of passes) {
      expectClose(p.durationS, p.los - p.aos, 1e-9, 'duration');
      expect(p.tca).toBeGreaterThanOrEqual(p.aos);
      expect(p.tca).toBeLessThanOrEqual(p.los);
    }
  });

  it('finds the short passes above a high elevation limit (each shorter than one coarse step)', () => {
    const orbit = circular(6378.137 + 500, 97.4 * DEG, 2.0, 1.0);
    const stations = [station('steep-1', 35, 139, 45), station('steep-2', -12, 20, 60), station('steep-3', 70, -40, 50)];
    const passes = search(orbit, stations, T0, T0 + DAY);
    expect(passes.length).toBeGreaterThanOrEqual(3);
    for (const p of passes) expect(p.durationS).toBeLessThan(240);
    checkAgainstBruteForce(orbit, stations, T0, T0 + DAY, passes, 2);
  });

  it('a polar orbit passes a station at the North Pole on every revolution', () => {
    const a = 6378.137 + 700;
    const period = 2 * Math.PI * Math.sqrt(a ** 3 / MU);
    const orbit = circular(a, 90 * DEG, 0.3, 0); // ascending node at T0: over the pole at T0 + P/4 + k P
    const revolutions = 14;
    const passes = search(orbit, [station('pole', 90, 0, 10)], T0, T0 + revolutions * period);
    expect(passes).toHaveLength(revolutions);
    passes.forEach((p, k) => {
      // The GCRF pole and the ITRF pole differ by ~0.15 deg (precession since 2000): TCA within 60 s.
      expectClose(p.tca, T0 + period / 4 + k * period, 60, `TCA of revolution ${k}`);
      expect(p.maxElevation).toBeGreaterThan(80 * DEG);
    });
  });

  it('a geostationary spacecraft is either always or never visible', () => {
    const a = Math.cbrt(MU / 7.292_115_146_706_979e-5 ** 2); // synchronous radius, 42164.17 km
    // Start over longitude ~0 deg: place it along the Greenwich meridian's GCRF direction at T0.
    const e = gcrfToItrf(T0, [a, 0, 0], [0, 0, 0]);
    const lon = Math.atan2(e.r[1], e.r[0]);
    const orbit = circular(a, 0, 0, 0);
    const under = station('under', 0, lon / DEG, 5);
    const opposite = station('opposite', 0, lon / DEG + 180, 5);
    const passes = search(orbit, [under, opposite], T0, T0 + 3 * DAY);
    expect(passes).toHaveLength(1);
    const [p] = passes as [Pass];
    expect(p.station).toBe('under');
    expect(p.startsBeforeWindow).toBe(true);
    expect(p.endsAfterWindow).toBe(true);
    expect(p.aos).toBe(T0);
    expect(p.los).toBe(T0 + 3 * DAY);
    expect(p.maxElevation).toBeGreaterThan(85 * DEG);
    // Its elevation wobbles daily (GCRF vs true equator): the reported maximum is the highest one.
    let highest = -Infinity;
    for (let t = T0; t <= T0 + 3 * DAY; t += 60) highest = Math.max(highest, lookAt(orbit, under, t).elevation);
    expect(p.maxElevation).toBeGreaterThanOrEqual(highest - 1e-9);
  });

  it("does not miss a grazing pass whose maximum is 0.002 deg above the limit, and reports none when the limit is 0.002 deg above the maximum", () => {
    const orbit = circular(6378.137 + 500, 97.4 * DEG, 2.0, 1.0);
    const base = station('grazing', 35, 139, 0);
    // Independent reference: scan elevation every 1 s for 12 h, take a low pass (peak 1-8 deg),
    // then sample its top every 0.01 s.
    let best = { t: 0, el: -Infinity };
    let prev = -Infinity;
    let rising = false;
    let peak: { t: number; el: number } | undefined;
    for (let t = T0; t < T0 + DAY / 2 && !peak; t += 1) {
      const el = lookAt(orbit, base, t).elevation;
      if (el > best.el) best = { t, el };
      if (rising && el < prev && prev > 1 * DEG && prev < 8 * DEG) peak = { t: t - 1, el: prev };
      rising = el > prev;
      prev = el;
      if (el < 0) best = { t: 0, el: -Infinity };
    }
    expect(peak, 'a low pass in the first 12 h').toBeDefined();
    let top = -Infinity;
    for (let t = peak!.t - 2; t <= peak!.t + 2; t += 0.01) top = Math.max(top, lookAt(orbit, base, t).elevation);
    const near = (ps: readonly Pass[]): Pass[] => ps.filter((p) => Math.abs(p.tca - peak!.t) < 300);

    const justBelow = near(search(orbit, [{ ...base, minElevation: top - 0.002 * DEG }], T0, T0 + DAY / 2));
    expect(justBelow).toHaveLength(1);
    expectClose(justBelow[0]!.maxElevation / DEG, top / DEG, 1e-4, 'max elevation deg');
    expect(justBelow[0]!.durationS).toBeLessThan(60);

    const justAbove = near(search(orbit, [{ ...base, minElevation: top + 0.002 * DEG }], T0, T0 + DAY / 2));
    expect(justAbove).toHaveLength(0);
  });

  it('agrees with brute force on eccentric Keplerian orbits (universal-variable propagator, property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 7000, max: 27_000, noNaN: true }),
        fc.double({ min: 0, max: 0.7, noNaN: true }),
        fc.double({ min: 0, max: 110, noNaN: true }),
        fc.double({ min: -80, max: 80, noNaN: true }),
        fc.double({ min: -180, max: 180, noNaN: true }),
        (a, ecc, incDeg, lat, lon) => {
          const rp = a * (1 - ecc);
          fc.pre(rp > 6378.137 + 300);
          const vp = Math.sqrt((MU * (1 + ecc)) / rp);
          const inc = incDeg * DEG;
          const r0: Vec3 = [rp, 0, 0];
          const v0: Vec3 = [0, vp * Math.cos(inc), vp * Math.sin(inc)];
          const orbit: StateAt = (t) => propagate(r0, v0, MU, t - T0);
          const unwrapped: StateAt = (t) => {
            const s = propagate(r0, v0, MU, t - T0);
            if (!s.ok) throw new Error(s.message);
            return s.value;
          };
          const stations = [station('a', lat, lon, 5), station('b', -lat / 2, lon + 100, 0, RIDGE_MASK)];
          const r = findPasses({ stateAt: orbit, startTT: T0, stopTT: T0 + DAY / 2, stations });
          if (!r.ok) throw new Error(r.message);
          checkAgainstBruteForce(unwrapped, stations, T0, T0 + DAY / 2, r.value.passes, 5);
        },
      ),
      { numRuns: 4, seed: 20_260_301 },
    );
  });

  it('flags a pass in progress at the window start and one still up at its end, clipping them to the window', () => {
    const orbit = circular(6378.137 + 550, 53 * DEG, 1.1, 0.4);
    const st = STATIONS[3]!;
    const full = search(orbit, [st], T0, T0 + DAY);
    const p = full[1]!;
    const mid = (p.aos + p.los) / 2;
    const head = search(orbit, [st], mid, mid + 3 * 3600);
    expect(head[0]!.startsBeforeWindow).toBe(true);
    expect(head[0]!.aos).toBe(mid);
    expectClose(head[0]!.los, p.los, 1e-2, 'same LOS');
    const tail = search(orbit, [st], mid - 3 * 3600, mid);
    const last = tail[tail.length - 1]!;
    expect(last.endsAfterWindow).toBe(true);
    expect(last.los).toBe(mid);
    expectClose(last.aos, p.aos, 1e-2, 'same AOS');
  });

  it('returns a pointing track from AOS to LOS with the Doppler factor 1 - rangeRate/c', () => {
    const orbit = circular(6378.137 + 550, 53 * DEG, 1.1, 0.4);
    const st = STATIONS[2]!;
    const limit = limitOf(st);
    const passes = search(orbit, [st], T0, T0 + DAY, 10);
    expect(passes.length).toBeGreaterThan(0);
    for (const p of passes) {
      const track = p.pointing!;
      expect(track[0]!.tt).toBe(p.aos);
      expect(track[track.length - 1]!.tt).toBe(p.los);
      expect(track.length).toBe(Math.ceil(p.durationS / 10) + 1);
      for (const s of track) {
        expect(s.elevation).toBeGreaterThanOrEqual(limit(s.azimuth) - 0.01 * DEG);
        expectClose(s.dopplerFactor, 1 - s.rangeRate / 299_792.458, 1e-15, 'Doppler factor');
        const ref = lookAt(orbit, st, s.tt);
        expectClose(s.range, ref.range, 1e-6, 'range km');
        expectClose(s.rangeRate, ref.rangeRate, 1e-9, 'range rate km/s');
      }
    }
  });

  it('gives the same passes with a batch propagator', () => {
    const orbit = circular(6378.137 + 550, 53 * DEG, 1.1, 0.4);
    const stateBatch = (epochs: Float64Array): Float64Array => {
      const out = new Float64Array(6 * epochs.length);
      epochs.forEach((t, k) => {
        const s = orbit(t) as GcrfState;
        out.set([...s.r, ...s.v], 6 * k);
      });
      return out;
    };
    const one = findPasses({ stateAt: orbit, startTT: T0, stopTT: T0 + DAY, stations: STATIONS });
    const many = findPasses({ stateAt: orbit, stateBatch, startTT: T0, stopTT: T0 + DAY, stations: STATIONS });
    expect(many).toEqual(one);
  });

  it('refuses pointing tracks over MAX_POINTING_SAMPLES at the station where the count crosses it, before searching the others', () => {
    // A 550 km polar orbit over 100 stations for 7 days, a sample every second: each station sees
    // it for about 40 minutes a day, so the count passes 500 000 after some 30 stations.
    const orbit = circular(6378.137 + 550, 97.6 * DEG, 0.3, 0);
    const crowd = Array.from({ length: MAX_PASS_STATIONS }, (_, i) => station(`s${i}`, -70 + (140 * i) / 99, -180 + ((i * 137) % 360), 0));
    let calls = 0;
    const counted: StateAt = (t) => { calls++; return orbit(t); };
    const full = findPasses({ stateAt: counted, startTT: T0, stopTT: T0 + 7 * DAY, stations: crowd });
    if (!full.ok) throw new Error(full.message);
    const searchCalls = calls;
    // The samples the pointing tracks would hold, counted from the passes found (AOS, every step, LOS).
    const asked = full.value.passes.reduce((n, p) => n + Math.ceil((p.los - p.aos) / 1) + 1, 0);
    expect(asked).toBeGreaterThan(2 * MAX_POINTING_SAMPLES);
    calls = 0;
    const refused = findPasses({ stateAt: counted, startTT: T0, stopTT: T0 + 7 * DAY, stations: crowd, options: { pointingStepS: 1 } });
    expect(!refused.ok && refused.code).toBe('invalid-parameter');
    const at = /after (\d+) of 100 stations/.exec(refused.ok ? '' : refused.message);
    expect(at).not.toBeNull();
    expect(Number(at![1])).toBeLessThan(MAX_PASS_STATIONS / 2);
    // The stations after it were never searched: fewer than half the propagator calls of the whole search.
    expect(calls).toBeLessThan(searchCalls / 2);
    // Under the limit (a 10 s step here) the same search answers, with every pointing track.
    const tenSeconds = findPasses({ stateAt: orbit, startTT: T0, stopTT: T0 + DAY, stations: crowd.slice(0, 10), options: { pointingStepS: 10 } });
    expect(tenSeconds.ok && tenSeconds.value.passes.every((p) => p.pointing!.length >= 2)).toBe(true);
  });

  it('refuses windows over 31 days, more than 100 stations, bad masks and reversed windows', () => {
    const orbit = circular(7000, 0.9, 0, 0);
    const long = findPasses({ stateAt: orbit, startTT: T0, stopTT: T0 + MAX_PASS_WINDOW_S + 1, stations: STATIONS });
    expect(!long.ok && long.code).toBe('window-too-long');
    const crowd = Array.from({ length: MAX_PASS_STATIONS + 1 }, (_, i) => station(`s${i}`, 0, i, 0));
    const many = findPasses({ stateAt: orbit, startTT: T0, stopTT: T0 + DAY, stations: crowd });
    expect(!many.ok && many.code).toBe('too-many-stations');
    const masked = findPasses({ stateAt: orbit, startTT: T0, stopTT: T0 + DAY, stations: [station('m', 0, 0, 0, [{ azimuth: 7, elevation: 0 }])] });
    expect(!masked.ok && masked.code).toBe('invalid-horizon-mask');
    const reversed = findPasses({ stateAt: orbit, startTT: T0 + DAY, stopTT: T0, stations: STATIONS });
    expect(!reversed.ok && reversed.code).toBe('invalid-parameter');
    const twice = findPasses({ stateAt: orbit, startTT: T0, stopTT: T0 + DAY, stations: [STATIONS[0]!, STATIONS[0]!] });
    expect(!twice.ok && twice.code).toBe('invalid-parameter');
  });

  it("passes the propagator's own failure through (e.g. an impact mid-window)", () => {
    const orbit = circular(6378.137 + 550, 53 * DEG, 1.1, 0.4);
    const failing: StateAt = (t) => (t > T0 + 5000 ? failure('impact', 'the trajectory meets the Earth') : success(orbit(t) as GcrfState));
    const r = findPasses({ stateAt: failing, startTT: T0, stopTT: T0 + DAY, stations: STATIONS });
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.code).toBe('impact');
  });
});
