import type { FastifyInstance } from 'fastify';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { EclipsesAnswer } from '../../src/schemas/eclipses.js';
import { Problem } from '../../src/schemas/common.js';
import { propagate } from '../../src/solver/conic/universal.js';
import { cross, dot, norm, sub, type Vec3 } from '../../src/solver/core/vec3.js';
import { formatUtcIso, parseUtcIso } from '../../src/solver/time/time.js';
import { postJson, testApp } from '../helpers/app.js';
import { expectClose } from '../helpers/approx.js';
import { parseLines, until } from '../helpers/batch.js';
import { byClass, parseSvg } from '../helpers/svg.js';
import { MU_EARTH, R_EARTH, behindTheMoon, betaZeroDurations, earthShadowChanges, moonShadowRegion, regionChanges, reportedChanges, sunAt, unit } from '../helpers/cone-shadow.js';

let app: FastifyInstance;
beforeAll(async () => { app = await testApp(); });
afterAll(async () => { await app.close(); });

const DAY = 86_400;
const DEG = Math.PI / 180;
const tt = (iso: string): number => {
  const r = parseUtcIso(iso);
  if (!r.ok) throw new Error(r.message);
  return r.value;
};
const scale = (k: number, a: Vec3): Vec3 => [k * a[0], k * a[1], k * a[2]];
const stateInput = (t: number, r: Vec3, v: Vec3) => ({ centralBody: 'earth', state: { epoch: formatUtcIso(t), position: r, velocity: v } });
const window = (start: number, stop: number) => ({ start: formatUtcIso(start), stop: formatUtcIso(stop) });

async function eclipses(body: unknown): Promise<EclipsesAnswer> {
  const res = await postJson(app, '/v1/eclipses', body);
  expect(res.statusCode, res.body).toBe(200);
  return EclipsesAnswer.parse(res.json());
}
/** An answer's eclipses with TT seconds in place of ISO epochs. */
const inTT = (list: EclipsesAnswer['eclipses']) => list.map((e) => ({
  start: tt(e.start), stop: tt(e.stop), umbraStart: e.umbraStart === null ? null : tt(e.umbraStart), umbraStop: e.umbraStop === null ? null : tt(e.umbraStop),
}));

describe('POST /v1/eclipses', () => {
  it('a circular orbit with the Sun in its plane (beta 0): umbra and penumbra last as the closed form of the cone says (0.2 s)', async () => {
    // Closed form: test/helpers/cone-shadow.ts betaZeroDurations (the cylindrical shadow corrected for the cone, derived there).
    const t0 = tt('2026-10-05T00:00:00Z');
    const [s0, s1] = [sunAt(t0), sunAt(t0 + 60)];
    const normal = unit(cross(s0, sub(s1, s0))); // the plane holding the Sun and its motion
    const p = unit(s0); // start under the Sun: the eclipse falls mid-window
    const q = cross(normal, p);
    const a = R_EARTH + 700;
    const n = Math.sqrt(MU_EARTH / a ** 3);
    const period = (2 * Math.PI) / n;
    const answer = await eclipses({ ...stateInput(t0, scale(a, p), scale(a * n, q)), window: window(t0, t0 + period) });
    expect(answer.eclipses).toHaveLength(1);
    const e = answer.eclipses[0]!;
    const mid = (tt(e.start) + tt(e.stop)) / 2;
    const omegaSun = norm(cross(unit(sunAt(mid - 30)), unit(sunAt(mid + 30)))) / 60;
    const closed = betaZeroDurations(a, norm(sunAt(mid)), omegaSun);
    expectClose(e.umbraDuration!, closed.umbraS, 0.2, 'umbra duration');
    expectClose(e.duration, closed.penumbraS, 0.2, 'penumbra duration');
    // The cone shortens the umbra and lengthens the penumbra against the cylinder by ~9 s each way at 700 km.
    expect(closed.cylinderS - e.umbraDuration!).toBeGreaterThan(5);
    expect(e.duration - closed.cylinderS).toBeGreaterThan(5);
    expect(e.depth).toBe(1);
    expectClose(answer.beta.start, 0, 1e-3, 'beta deg');
    expect(answer.moonEclipses).toBeNull();
  });

  it('an invented LEO over 2 days: every penumbra and umbra entry and exit within 1 s of an independent cone computation (Sun from astronomy-engine)', async () => {
    // Invented spacecraft: 600 km x 800 km, 65 deg, given as a GCRF state at perigee; two-body motion.
    const t0 = tt('2026-12-03T06:00:00Z');
    const [inc, raan] = [65 * DEG, 200 * DEG];
    const p: Vec3 = [Math.cos(raan), Math.sin(raan), 0];
    const q: Vec3 = [-Math.sin(raan) * Math.cos(inc), Math.cos(raan) * Math.cos(inc), Math.sin(inc)];
    const [rp, ra] = [R_EARTH + 600, R_EARTH + 800];
    const sma = (rp + ra) / 2;
    const r0 = scale(rp, p);
    const v0 = scale(Math.sqrt(MU_EARTH * (2 / rp - 1 / sma)), q); // vis-viva
    const stop = t0 + 2 * DAY;
    const answer = await eclipses({ ...stateInput(t0, r0, v0), window: window(t0, stop) });
    const positionAt = (t: number): Vec3 => {
      const s = propagate(r0, v0, MU_EARTH, t - t0);
      if (!s.ok) throw new Error(s.message);
      return s.value.r;
    };
    const expected = earthShadowChanges(positionAt, t0, stop, 10);
    const found = reportedChanges(inTT(answer.eclipses)).filter((c) => c.t > t0 && c.t < stop);
    expect(answer.eclipses.length).toBeGreaterThan(25); // ~14.5 revolutions a day, most of them eclipsed
    expect(found.map((c) => [c.from, c.to])).toEqual(expected.map((c) => [c.from, c.to]));
    const worst = Math.max(...found.map((c, i) => Math.abs(c.t - expected[i]!.t)));
    expect(worst).toBeLessThan(1);
    // beta from its definition asin(h . s / |h| |s|) with the library's Sun.
    const h = cross(r0, v0);
    expectClose(answer.beta.start, Math.asin(dot(h, sunAt(t0)) / (norm(h) * norm(sunAt(t0)))) / DEG, 1e-4, 'beta deg');
    expect(answer.beta.min).toBeLessThanOrEqual(answer.beta.start);
    expect(answer.beta.max).toBeGreaterThanOrEqual(answer.beta.start);
    expect(answer.sunSynchronous).toBe(false);
    expect(answer.ascendingNodeLocalTime).toBeNull();
  });

  const geostationary = (t0: number) => {
    const a = 42_164.17; // geostationary radius, km (common practice, no source)
    return stateInput(t0, [a, 0, 0], [0, Math.sqrt(MU_EARTH / a), 0]);
  };

  it('a geostationary orbit near the September equinox: one eclipse a day, at most about 70 min with the penumbra (~72 min, common practice, from memory)', async () => {
    const t0 = tt('2026-09-21T00:00:00Z'); // equinox 2026-09-23 (from memory)
    const answer = await eclipses({ ...geostationary(t0), window: window(t0, t0 + 4 * DAY) });
    // One a solar day: 4 or 5 in 4 days, depending on where the window cuts them.
    expect(answer.eclipses.length).toBeGreaterThanOrEqual(4);
    expect(answer.eclipses.length).toBeLessThanOrEqual(5);
    const whole = answer.eclipses.filter((e) => !e.startsBeforeWindow && !e.endsAfterWindow);
    expect(whole.length).toBeGreaterThanOrEqual(3);
    const mid = (e: EclipsesAnswer['eclipses'][number]) => (tt(e.start) + tt(e.stop)) / 2;
    for (let i = 1; i < whole.length; i++) expectClose(mid(whole[i]!) - mid(whole[i - 1]!), DAY, 120, 'eclipse spacing (one solar day), s');
    const longest = Math.max(...answer.eclipses.map((e) => e.duration));
    expect(longest / 60).toBeGreaterThan(68);
    expect(longest / 60).toBeLessThan(73);
    for (const e of answer.eclipses) expect(e.umbraDuration! / 60).toBeLessThan(69);
  });

  it('a geostationary orbit near the December solstice: no eclipse; beta is minus the Sun\'s declination there (~-23.4 deg)', async () => {
    const t0 = tt('2026-12-19T00:00:00Z');
    const answer = await eclipses({ ...geostationary(t0), window: window(t0, t0 + 4 * DAY) });
    expect(answer.eclipses).toHaveLength(0);
    expectClose(answer.beta.start, Math.asin(unit(sunAt(t0))[2]) / DEG, 1e-4, 'beta = declination for an equatorial prograde orbit');
    expect(answer.beta.start).toBeLessThan(-23.3);
  });

  it('a dawn-dusk sun-synchronous orbit near the December solstice: no eclipse, flagged sun-synchronous, its node near 18:00 local time', async () => {
    const t0 = tt('2026-12-20T00:00:00Z');
    const a = R_EARTH + 750;
    // Sun-synchronous inclination: cos i = -n_sun / (3/2 n J2 (R/a)^2) (Vallado 4th ed. eq. 9-41 with the node rate set to
    // 360 deg / 365.2422 d; from memory); J2 = 1.08262668e-3 (EGM-96, from memory).
    const nSun = (2 * Math.PI) / (365.2422 * DAY);
    const inclination = Math.acos(-nSun / (1.5 * Math.sqrt(MU_EARTH / a ** 3) * 1.082_626_68e-3 * (R_EARTH / a) ** 2)) / DEG;
    const s = unit(sunAt(t0));
    const raan = Math.atan2(s[1], s[0]) / DEG + 90; // node 90 deg east of the Sun: 18:00 local apparent time
    const answer = await eclipses({
      centralBody: 'earth',
      elements: { epoch: formatUtcIso(t0), semiMajorAxis: a, eccentricity: 0, inclination, raan, argPeriapsis: 0, trueAnomaly: 0 },
      window: window(t0, t0 + 2 * DAY),
    });
    expect(answer.eclipses).toHaveLength(0);
    // |beta| beyond asin(R / r) ~ 61 deg leaves no shadow; here about 90 - 23.4 - (98.4 - 90) ~ 58 deg plus the node geometry.
    expect(Math.min(Math.abs(answer.beta.min), Math.abs(answer.beta.max))).toBeGreaterThan(Math.asin(R_EARTH / a) / DEG);
    expect(answer.sunSynchronous).toBe(true);
    // Mean vs apparent time: the equation of time near 20 December is about +2 min (from memory): 4 min tolerance.
    expectClose(answer.ascendingNodeLocalTime!, 18, 4 / 60, 'local time of the ascending node, h');
  });

  it("the Moon's shadow, asked for, is listed apart: a spacecraft crossing the lunar umbra of the 2026-08-12 solar eclipse, within 1 s of an independent cone", async () => {
    // An invented spacecraft 250 000 km behind the Moon on the Sun-Moon axis at the 2026-08-12 solar eclipse, on a
    // circular-speed two-body orbit (test/helpers/cone-shadow.ts behindTheMoon).
    const tm = tt('2026-08-12T17:46:00Z');
    const r0 = behindTheMoon(tm);
    const v0 = scale(Math.sqrt(MU_EARTH / norm(r0)), unit(cross([0, 0, 1], r0)));
    const [start, stop] = [tm - 3 * 3600, tm + 3 * 3600];
    const body = { ...stateInput(tm, r0, v0), window: window(start, stop), moon: true };
    const answer = await eclipses(body);
    expect(answer.eclipses).toHaveLength(0); // the Earth lies sunward of the spacecraft: no Earth shadow
    expect(answer.moonEclipses).toHaveLength(1);
    const positionAt = (t: number): Vec3 => {
      const s = propagate(r0, v0, MU_EARTH, t - tm);
      if (!s.ok) throw new Error(s.message);
      return s.value.r;
    };
    const region = (t: number): number => moonShadowRegion(positionAt(t), t);
    const expected = regionChanges(region, start, stop, 10);
    const found = reportedChanges(inTT(answer.moonEclipses!));
    expect(found.map((c) => [c.from, c.to])).toEqual(expected.map((c) => [c.from, c.to]));
    expect(expected.length).toBe(4); // penumbra, umbra, and out again
    for (const [i, c] of found.entries()) expectClose(c.t, expected[i]!.t, 1, `crossing ${i}`);
    expect(answer.moonEclipses![0]!.depth).toBe(1);

    // CSV: the same eclipse in one row, flagged with its occulter.
    const csv = await postJson(app, '/v1/eclipses', { ...body, format: 'csv' });
    expect(csv.statusCode).toBe(200);
    expect(csv.headers['content-type']).toMatch(/^text\/csv/);
    const rows = csv.body.split('\r\n');
    expect(rows[0]).toBe('start_utc,stop_utc,umbra_start_utc,umbra_stop_utc,duration_s,umbra_duration_s,depth,occulter,starts_before_window,ends_after_window');
    expect(rows.slice(1)).toEqual([expect.any(String), '']);
    const cells = rows[1]!.split(',');
    const e = answer.moonEclipses![0]!;
    expect(cells).toEqual([e.start, e.stop, e.umbraStart, e.umbraStop, e.duration.toFixed(3), e.umbraDuration!.toFixed(3), '1.000000', 'moon', 'false', 'false']);
  });

  it('is cached like the other endpoints, answers in batches and jobs with the same bytes, and picks CSV from the Accept header', async () => {
    const t0 = tt('2026-12-01T00:00:00Z');
    const request = { ...geostationary(t0), window: window(t0, t0 + DAY / 2) };
    const first = await postJson(app, '/v1/eclipses', request);
    const again = await postJson(app, '/v1/eclipses', { ...request, format: 'json' });
    expect(first.statusCode).toBe(200);
    expect(again.headers['x-cache']).toBe('hit');
    expect(again.headers.etag).toBe(first.headers.etag);
    expect(again.body).toBe(first.body);
    const csv = await postJson(app, '/v1/eclipses', request, { accept: 'text/csv' });
    expect(csv.body.startsWith('start_utc,stop_utc,')).toBe(true);

    const batch = await postJson(app, '/v1/batch', { items: [{ id: 'geo', kind: 'eclipses', request }] });
    const [line] = parseLines(batch.rawPayload);
    expect(line!.status).toBe(200);
    expect(JSON.stringify(line!.answer)).toBe(first.body);

    const job = await postJson(app, '/v1/jobs', { items: [{ id: 'geo', kind: 'eclipses', request }] });
    expect(job.statusCode).toBe(202);
    const id = (job.json() as { id: string }).id;
    await until('job done', async () => (await app.inject({ url: `/v1/jobs/${id}` })).json().status === 'done');
    const [jobLine] = parseLines((await app.inject({ url: `/v1/jobs/${id}/results` })).rawPayload);
    expect(JSON.stringify(jobLine!.answer)).toBe(first.body);
  });

  it('format svg: a timeline with one row per UTC day whose umbra bars start at the answer\'s umbra entries (time of day across 520 px)', async () => {
    const t0 = tt('2026-09-30T12:00:00Z');
    const request = { ...geostationary(t0), window: window(t0, t0 + 3 * DAY) };
    const json = EclipsesAnswer.parse((await postJson(app, '/v1/eclipses', request)).json());
    const res = await postJson(app, '/v1/eclipses', { ...request, format: 'svg' });
    expect(res.statusCode).toBe(200);
    expect(res.headers['content-type']).toMatch(/^image\/svg\+xml/);
    const { elements } = parseSvg(res.body);
    // The layout of src/formats/svg/eclipse-timeline.ts: the plot runs from x = 70 to 620 over 24 h.
    const xOf = (iso: string): number => 70 + (550 * ((Date.parse(iso) / 1000) % DAY)) / DAY;
    const umbraStarts = byClass(elements, 'umbra').map((e) => Number(e.attrs.x));
    const entries = json.eclipses.filter((e) => !e.startsBeforeWindow).map((e) => xOf(e.umbraStart!));
    expect(json.eclipses.length).toBeGreaterThanOrEqual(3);
    for (const x of entries) expect(umbraStarts.some((u) => Math.abs(u - x) < 0.01), `an umbra bar at x = ${x}`).toBe(true);
    // Four rows (09-30 to 10-03 UTC); no Moon lane unless asked.
    const labels = elements.filter((e) => e.tag === 'text').length;
    expect(labels).toBeGreaterThan(4);
    expect(byClass(elements, 'moon')).toHaveLength(0);
    expect(res.body).toContain('>09-30<');
    expect(res.body).toContain('>10-03<');
    expect(res.body).not.toContain('>10-04<');
  });

  it('refuses a window over 31 days (422), a reversed window (400), a body other than the Earth (422) and unknown fields (400)', async () => {
    const t0 = tt('2026-12-01T00:00:00Z');
    const base = geostationary(t0);
    const cases: Array<[unknown, number, string]> = [
      [{ ...base, window: window(t0, t0 + 31 * DAY + 1) }, 422, 'window-too-long'],
      [{ ...base, window: window(t0 + DAY, t0) }, 400, 'validation-failed'],
      [{ ...base, centralBody: 'moon', window: window(t0, t0 + DAY) }, 422, 'unsupported-frame'],
      [{ ...base, window: window(t0, t0 + DAY), lamp: true }, 400, 'validation-failed'],
    ];
    for (const [body, status, code] of cases) {
      const res = await postJson(app, '/v1/eclipses', body);
      expect(res.statusCode, res.body).toBe(status);
      expect(res.headers['content-type']).toMatch(/^application\/problem\+json/);
      expect(Problem.parse(res.json()).type).toBe(`/problems/${code}`);
    }
  });
});
