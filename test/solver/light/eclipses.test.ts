import { AstroTime, Body, GeoMoon, GeoVector } from 'astronomy-engine';
import { describe, expect, it } from 'vitest';
import { propagate } from '../../../src/solver/conic/universal.js';
import { cross, dot, norm, sub, type Vec3 } from '../../../src/solver/core/vec3.js';
import { ascendingNodeLocalTime, isSunSynchronousOrbit } from '../../../src/solver/light/beta.js';
import { MAX_ECLIPSE_WINDOW_S, findEclipses, type Eclipse, type EclipseSearchResult } from '../../../src/solver/light/eclipses.js';
import type { GcrfState, StateAt } from '../../../src/solver/propagation/state-source.js';
import { parseUtcIso } from '../../../src/solver/time/time.js';
import { expectClose } from '../../helpers/approx.js';

const DEG = Math.PI / 180;
const MU = 398_600.4418; // Earth GM, km^3/s^2 (NIMA TR8350.2 Table 3.1, from memory)
const R_EARTH = 6378.137; // WGS-84 semi-major axis, km (NIMA TR8350.2 defining parameters)
const R_SUN = 695_700; // IAU 2015 Resolution B3 nominal solar radius, km
const AU_KM = 149_597_870.7; // IAU 2012 Resolution B2
const J2 = 1.082_626_68e-3; // EGM-96 (from memory)
const DAY = 86_400;
const tt = (s: string): number => {
  const r = parseUtcIso(s);
  if (!r.ok) throw new Error(r.message);
  return r.value;
};
const unit = (a: Vec3): Vec3 => [a[0] / norm(a), a[1] / norm(a), a[2] / norm(a)];

/** The apparent geocentric Sun (light-time and aberration) straight from astronomy-engine, km. */
function sunAt(t: number): Vec3 {
  const v = GeoVector(Body.Sun, AstroTime.FromTerrestrialTime(t / DAY), true);
  return [v.x * AU_KM, v.y * AU_KM, v.z * AU_KM];
}

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

/**
 * Independent shadow test written from the cone geometry (not the apparent-disc angles of the
 * code): the penumbra cone has its apex toward the Sun at L_p = R D / (R_sun + R) from the
 * Earth's centre and half-angle asin((R_sun + R) / D); the umbra cone its apex behind the Earth
 * at L_u = R D / (R_sun - R) and half-angle asin((R_sun - R) / D). Returns 2 (umbra), 1
 * (penumbra) or 0 (lit). Both regions lie behind the Earth (x > 0 along the anti-Sun axis): the
 * cones touch the Earth within 30 km of its terminator plane, where a spacecraft above 100 km is
 * farther from the axis than either cone.
 */
function coneRegion(r: Vec3, s: Vec3): number {
  const d = norm(s);
  const toSun = unit(s);
  const x = -dot(r, toSun); // along the anti-Sun axis
  const y = norm(sub(r, [-x * toSun[0], -x * toSun[1], -x * toSun[2]])); // distance from the axis
  const lp = (R_EARTH * d) / (R_SUN + R_EARTH);
  const alphaP = Math.asin((R_SUN + R_EARTH) / d);
  if (!(x > 0 && y < (x + lp) * Math.tan(alphaP))) return 0;
  const lu = (R_EARTH * d) / (R_SUN - R_EARTH);
  const alphaU = Math.asin((R_SUN - R_EARTH) / d);
  return y < (lu - x) * Math.tan(alphaU) ? 2 : 1;
}

/** Brute force: region every `step` s; each change of "region >= 1" and of "region = 2" bisected to 1 ms. */
function bruteForce(stateAt: (t: number) => GcrfState, start: number, stop: number, step: number): Array<{ t: number; from: number; to: number }> {
  const region = (t: number): number => coneRegion(stateAt(t).r, sunAt(t));
  const out: Array<{ t: number; from: number; to: number }> = [];
  let prev = region(start);
  for (let t = start + step; t <= stop; t += step) {
    const now = region(t);
    for (const level of [1, 2]) {
      const was = prev >= level;
      if (was === now >= level) continue;
      let [lo, hi] = [t - step, t];
      while (hi - lo > 1e-3) {
        const mid = (lo + hi) / 2;
        if (region(mid) >= level === was) lo = mid;
        else hi = mid;
      }
      out.push({ t: (lo + hi) / 2, from: was ? level : level - 1, to: was ? level - 1 : level });
    }
    prev = now;
  }
  return out.sort((x, y) => x.t - y.t);
}

describe('findEclipses: a circular orbit with the Sun in its plane (beta 0)', () => {
  it('umbra and penumbra last as long as the closed form of the conical shadow says (0.2 s)', () => {
    // Closed form, derived here (plane geometry of the tangent cones; common practice, no source):
    // in the orbit plane through the shadow axis, the umbra boundary is the line from the cone's
    // apex at L_u = R D / (R_sun - R) behind the Earth, at half-angle alpha_u with sin alpha_u =
    // (R_sun - R) / D. A point at radius r and angle theta from the anti-Sun axis lies on it when
    // r sin(theta + alpha_u) = L_u sin alpha_u = R, so theta_u = asin(R / r) - alpha_u: the
    // cylindrical half-angle asin(R / r) shortened by the cone. The penumbra likewise gives
    // theta_p = asin(R / r) + alpha_p, sin alpha_p = (R_sun + R) / D. The orbit turns against the
    // Sun's direction at n - omega_sun, so the umbra lasts 2 theta_u / (n - omega_sun).
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
    const alphaU = Math.asin((R_SUN - R_EARTH) / d);
    const alphaP = Math.asin((R_SUN + R_EARTH) / d);
    const umbra = (2 * (Math.asin(R_EARTH / a) - alphaU)) / (n - omegaSun);
    const penumbra = (2 * (Math.asin(R_EARTH / a) + alphaP)) / (n - omegaSun);
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
    const events = bruteForce(plain, t0, stop, 10);
    const ordered = (x: Eclipse) => x.umbraStart === null
      ? [{ t: x.start, from: 0, to: 1 }, { t: x.stop, from: 1, to: 0 }]
      : [{ t: x.start, from: 0, to: 1 }, { t: x.umbraStart, from: 1, to: 2 }, { t: x.umbraStop!, from: 2, to: 1 }, { t: x.stop, from: 1, to: 0 }];
    // Every crossing the search reports, less the window's own ends of clipped eclipses.
    const found = result.eclipses.flatMap(ordered).filter((ev) => ev.t > t0 && ev.t < stop);
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
    // Total solar eclipse of 2026-08-12, greatest eclipse near 17:46 UTC (from memory). A point
    // held fixed in GCRF 250 000 km behind the Moon on the Sun-Moon axis at 17:46 UTC.
    const C_KM_S = 299_792.458; // SI definition of the metre
    const R_MOON = 1737.4; // IAU WGCCRE 2015 mean radius, from memory
    const tm = tt('2026-08-12T17:46:00Z');
    const moonAt = (t: number): Vec3 => {
      const v = GeoMoon(AstroTime.FromTerrestrialTime(t / DAY));
      return [v.x * AU_KM, v.y * AU_KM, v.z * AU_KM];
    };
    const m = moonAt(tm);
    const axis = unit(sub(m, sunAt(tm)));
    const point: Vec3 = [m[0] + 250_000 * axis[0], m[1] + 250_000 * axis[1], m[2] + 250_000 * axis[2]];
    const fixed: StateAt = () => ({ r: point, v: [0, 0, 0] });
    const r = findEclipses({ stateAt: fixed, startTT: tm - 3 * 3600, stopTT: tm + 3 * 3600, options: { moon: true } });
    if (!r.ok) throw new Error(r.message);
    expect(r.value.eclipses).toHaveLength(0); // far from the Earth's shadow (the Earth is sunward)
    const moonEclipses = r.value.moonEclipses!;
    expect(moonEclipses).toHaveLength(1);
    const e = moonEclipses[0]!;
    expect(e.depth).toBe(1);
    // Independent: the Moon's cones as coneRegion builds the Earth's, the Moon taken where the
    // light reaching the point passed it (one light-time iteration), the Sun relative to it.
    const region = (t: number): number => {
      const seen = moonAt(t);
      const mt = moonAt(t - norm(sub(seen, point)) / C_KM_S);
      const rel = sub(point, mt);
      const s = sub(sunAt(t), mt);
      const d = norm(s);
      const toSun = unit(s);
      const x = -dot(rel, toSun);
      const y = norm(sub(rel, [-x * toSun[0], -x * toSun[1], -x * toSun[2]]));
      if (!(x > 0 && y < (x + (R_MOON * d) / (R_SUN + R_MOON)) * Math.tan(Math.asin((R_SUN + R_MOON) / d)))) return 0;
      return y < ((R_MOON * d) / (R_SUN - R_MOON) - x) * Math.tan(Math.asin((R_SUN - R_MOON) / d)) ? 2 : 1;
    };
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
