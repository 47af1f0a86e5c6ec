import { describe, expect, it } from 'vitest';
import { propagate } from '../../../src/solver/conic/universal.js';
import { cross, dot, norm, sub, type Vec3 } from '../../../src/solver/core/vec3.js';
import { ascendingNodeLocalTime, isSunSynchronousOrbit } from '../../../src/solver/light/beta.js';
import { MAX_ECLIPSE_WINDOW_S, findEclipses, type EclipseSearchResult } from '../../../src/solver/light/eclipses.js';
import type { GcrfState, StateAt } from '../../../src/solver/propagation/state-source.js';
import { parseUtcIso } from '../../../src/solver/time/time.js';
import { expectClose } from '../../helpers/approx.js';
import { MU_EARTH, R_EARTH, behindTheMoon, betaZeroDurations, earthShadowChanges, moonShadowRegion, reportedChanges, sunAt, unit } from '../../helpers/cone-shadow.js';

const DEG = Math.PI / 180;
const MU = MU_EARTH;
const J2 = 1.082_626_68e-3; // EGM-96 (from memory)
const DAY = 86_400;
const tt = (s: string): number => {
  const r = parseUtcIso(s);
  if (!r.ok) throw new Error(r.message);
  return r.value;
};
/** Circular orbit of radius a in the plane with unit axes p (position at t0) and q (velocity direction). */
function circularIn(a: number, p: Vec3, q: Vec3, t0: number): StateAt {
  const n = Math.sqrt(MU / a ** 3);
  return (t) => {
    const u = n * (t - t0);
    const [c, s] = [Math.cos(u), Math.sin(u)];
    return {
      r: [a * (c * p[0] + s * q[0]), a * (c * p[1] + s * q[1]), a * (c * p[2] + s * q[2])],
      v: [a * n * (-s * p[0] + c * q[0]), a * n * (-s * p[1] + c * q[1]), a * n * (-s * p[2] + c * q[2])],
    };
  };
}

/** Orbit plane axes from inclination and RAAN (GCRF), argument of latitude 0 at t0. */
function axes(inclination: number, raan: number): [Vec3, Vec3] {
  const [cO, sO, ci, si] = [Math.cos(raan), Math.sin(raan), Math.cos(inclination), Math.sin(inclination)];
  return [[cO, sO, 0], [-sO * ci, cO * ci, si]];
}

function search(stateAt: StateAt, start: number, stop: number): EclipseSearchResult {
  const r = findEclipses({ stateAt, startTT: start, stopTT: stop });
  if (!r.ok) throw new Error(r.message);
  return r.value;
}

describe('findEclipses: a circular orbit with the Sun in its plane (beta 0)', () => {
  it('umbra and penumbra last as long as the closed form of the conical shadow says (0.2 s)', () => {
    // Closed form derived in test/helpers/cone-shadow.ts (betaZeroDurations).
    const t0 = tt('2026-09-01T00:00:00Z');
    const s0 = sunAt(t0);
    const s1 = sunAt(t0 + 60);
    const normal = unit(cross(s0, sub(s1, s0))); // the plane that holds the Sun and its motion
    const p = unit(s0); // start under the Sun: the eclipse falls mid-window
    const q = cross(normal, p);
    const a = R_EARTH + 500;
    const stateAt = circularIn(a, p, q, t0);
    const n = Math.sqrt(MU / a ** 3);
    const period = (2 * Math.PI) / n;
    const result = search(stateAt, t0, t0 + period);
    expect(result.eclipses).toHaveLength(1);
    const e = result.eclipses[0]!;
    const mid = (e.start + e.stop) / 2;
    const d = norm(sunAt(mid));
    const omegaSun = norm(cross(unit(sunAt(mid - 30)), unit(sunAt(mid + 30)))) / 60;
    const { umbraS: umbra, penumbraS: penumbra } = betaZeroDurations(a, d, omegaSun);
    expectClose(e.umbraDurationS!, umbra, 0.2, 'umbra duration');
    expectClose(e.durationS, penumbra, 0.2, 'penumbra duration');
    expect(e.depth).toBe(1);
    expectClose(result.beta.start / DEG, 0, 1e-3, 'beta');
  });
});

describe('findEclipses: an invented LEO over 2 days', () => {
  // Invented spacecraft: 620 km x 760 km, 51.6 deg; two-body motion (conic/universal.ts).
  const t0 = tt('2026-12-02T00:00:00Z');
  const [p, q] = axes(51.6 * DEG, 40 * DEG);
  const rp = R_EARTH + 620;
  const ra = R_EARTH + 760;
  const a = (rp + ra) / 2;
  const vp = Math.sqrt(MU * (2 / rp - 1 / a));
  const r0: Vec3 = [rp * p[0], rp * p[1], rp * p[2]];
  const v0: Vec3 = [vp * q[0], vp * q[1], vp * q[2]];
  const stateAt: StateAt = (t) => propagate(r0, v0, MU, t - t0);
  const plain = (t: number): GcrfState => {
    const s = propagate(r0, v0, MU, t - t0);
    if (!s.ok) throw new Error(s.message);
    return s.value;
  };

  it('every penumbra and umbra entry and exit within 1 s of an independent cone computation (Sun from astronomy-engine)', () => {
    const stop = t0 + 2 * DAY;
    const result = search(stateAt, t0, stop);
    const events = earthShadowChanges((t) => plain(t).r, t0, stop, 10);
    // Every crossing the search reports, less the window's own ends of clipped eclipses.
    const found = reportedChanges(result.eclipses).filter((ev) => ev.t > t0 && ev.t < stop);
    expect(result.eclipses.length).toBeGreaterThan(25); // ~15 revolutions a day, eclipsed each one
    const inner = events;
    expect(found.length).toBe(inner.length);
    let worst = 0;
    for (const [i, ev] of inner.entries()) {
      expect([found[i]!.from, found[i]!.to]).toEqual([ev.from, ev.to]);
      worst = Math.max(worst, Math.abs(found[i]!.t - ev.t));
    }
    expect(worst).toBeLessThan(1); // seen: 3 ms
    // The beta angle at the start, from its definition asin(h . s / |h| |s|) with the library's Sun.
    const h = cross(r0, v0);
    expectClose(result.beta.start, Math.asin(dot(h, sunAt(t0)) / (norm(h) * norm(sunAt(t0)))), 1e-6, 'beta');
    expect(result.beta.min).toBeLessThanOrEqual(result.beta.start);
    expect(result.beta.max).toBeGreaterThanOrEqual(result.beta.start);
    for (const e of result.eclipses) {
      expect(e.depth).toBe(1);
      expect(e.umbraStart! >= e.start && e.umbraStop! <= e.stop).toBe(true);
      if (!e.startsBeforeWindow && !e.endsAfterWindow) expect(e.umbraStart! > e.start && e.umbraStop! < e.stop).toBe(true);
    }
  });

  it('refuses a window over 31 days and an orbit that starts inside the Earth', () => {
    const long = findEclipses({ stateAt, startTT: t0, stopTT: t0 + MAX_ECLIPSE_WINDOW_S + 1 });
    expect(long.ok ? '' : long.code).toBe('window-too-long');
    const inside = findEclipses({ stateAt: () => ({ r: [6000, 0, 0], v: [0, 7, 0] }), startTT: t0, stopTT: t0 + DAY });
    expect(inside.ok ? '' : inside.code).toBe('impact');
  });
});

describe('findEclipses: a geostationary orbit', () => {
  const geo = (t0: number): StateAt => circularIn(42_164.17, [1, 0, 0], [0, 1, 0], t0);

  it('near the March equinox: one eclipse a day, about 70 min with the penumbra (at most ~72 min, common practice, from memory)', () => {
    const t0 = tt('2026-03-19T00:00:00Z'); // equinox 2026-03-20 ~14:46 UTC (from memory)
    const result = search(geo(t0), t0, t0 + 3 * DAY);
    expect(result.eclipses).toHaveLength(3);
    for (const e of result.eclipses) {
      expect(e.durationS / 60).toBeGreaterThan(68);
      expect(e.durationS / 60).toBeLessThan(73);
      expect(e.umbraDurationS! / 60).toBeGreaterThan(64);
      expect(e.umbraDurationS! / 60).toBeLessThan(69);
    }
  });

  it('near the June solstice: none, and beta is the Sun\'s declination (~23.4 deg)', () => {
    const t0 = tt('2026-06-19T00:00:00Z');
    const result = search(geo(t0), t0, t0 + 3 * DAY);
    expect(result.eclipses).toHaveLength(0);
    const s = unit(sunAt(t0));
    expectClose(result.beta.start / DEG, Math.asin(s[2]) / DEG, 1e-6, 'beta = declination for an equatorial orbit');
    expect(result.beta.start / DEG).toBeGreaterThan(23.3);
  });
});

describe('findEclipses: a dawn-dusk sun-synchronous orbit near the June solstice', () => {
  it('has no eclipse (|beta| > 70 deg, beyond asin(R / r) ~ 62.7 deg), is sun-synchronous, its node near 06:00 local time', () => {
    const t0 = tt('2026-06-20T00:00:00Z');
    const a = R_EARTH + 800;
    // Sun-synchronous inclination: cos i = -n_sun / (3/2 n J2 (R/a)^2) (Vallado 4th ed. eq. 9-41 with
    // the node rate set to 360 deg / 365.2422 d; from memory).
    const nSun = (2 * Math.PI) / (365.2422 * DAY);
    const inclination = Math.acos(-nSun / (1.5 * Math.sqrt(MU / a ** 3) * J2 * (R_EARTH / a) ** 2));
    const s = unit(sunAt(t0));
    const sunRa = Math.atan2(s[1], s[0]);
    const raan = sunRa - Math.PI / 2; // node 90 deg west of the Sun: 06:00 local apparent time
    const [p, q] = axes(inclination, raan);
    const stateAt = circularIn(a, p, q, t0);
    const result = search(stateAt, t0, t0 + 2 * DAY);
    expect(result.eclipses).toHaveLength(0);
    const h = cross(p, q);
    expect(Math.abs(Math.asin(dot(h, s))) / DEG).toBeGreaterThan(70);
    expect(Math.abs(result.beta.start) / DEG).toBeGreaterThan(70);
    const first = stateAt(t0) as GcrfState;
    expect(isSunSynchronousOrbit(first.r, first.v)).toBe(true);
    // Local apparent time 06:00 at the node by construction; the mean time differs by the equation
    // of time (about -1.5 min near the June solstice, from memory): 3 min tolerance.
    expectClose(ascendingNodeLocalTime(t0, first.r, first.v), 6, 3 / 60, 'LTAN h');
    // A 51.6 deg orbit is not sun-synchronous.
    const [p2, q2] = axes(51.6 * DEG, 0);
    const other = circularIn(a, p2, q2, t0)(t0) as GcrfState;
    expect(isSunSynchronousOrbit(other.r, other.v)).toBe(false);
  });
});

describe("findEclipses: the Moon's shadow (flagged separately)", () => {
  it('finds a point on the Sun-Moon axis at the 2026-08-12 solar eclipse in the lunar umbra, entries and exits within 1 s of an independent cone computation', () => {
    // A point held fixed in GCRF 250 000 km behind the Moon on the Sun-Moon axis at 17:46 UTC
    // (test/helpers/cone-shadow.ts behindTheMoon).
    const tm = tt('2026-08-12T17:46:00Z');
    const point = behindTheMoon(tm);
    const fixed: StateAt = () => ({ r: point, v: [0, 0, 0] });
    const r = findEclipses({ stateAt: fixed, startTT: tm - 3 * 3600, stopTT: tm + 3 * 3600, options: { moon: true } });
    if (!r.ok) throw new Error(r.message);
    expect(r.value.eclipses).toHaveLength(0); // far from the Earth's shadow (the Earth is sunward)
    const moonEclipses = r.value.moonEclipses!;
    expect(moonEclipses).toHaveLength(1);
    const e = moonEclipses[0]!;
    expect(e.depth).toBe(1);
    // Independent: the Moon's cones as coneRegion builds the Earth's (moonShadowRegion).
    const region = (t: number): number => moonShadowRegion(point, t);
    const crossing = (lo: number, hi: number, level: number): number => {
      const was = region(lo) >= level;
      while (hi - lo > 1e-3) {
        const mid = (lo + hi) / 2;
        if (region(mid) >= level === was) lo = mid;
        else hi = mid;
      }
      return (lo + hi) / 2;
    };
    expect(region(tm)).toBe(2);
    expectClose(e.start, crossing(tm - 3 * 3600, tm, 1), 1, 'penumbra entry');
    expectClose(e.umbraStart!, crossing(tm - 3 * 3600, tm, 2), 1, 'umbra entry');
    expectClose(e.umbraStop!, crossing(tm, tm + 3 * 3600, 2), 1, 'umbra exit');
    expectClose(e.stop, crossing(tm, tm + 3 * 3600, 1), 1, 'penumbra exit');
  });
});
