import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import fc from 'fast-check';
import type { FastifyInstance } from 'fastify';
import { postJson, testApp } from '../helpers/app.js';
import { DEMO_STATIONS } from '../helpers/demo.js';

// One scenario, one hash, one answer: a request written in any of the spellings the API accepts
// (key order, epoch spelling and zone, time system, defaults given or left out) is the same
// scenario. The re-spellings are built here from the instant with their own arithmetic:
// TAI - UTC = 37 s since 2017-01-01 (IERS Bulletin C 52), TT = TAI + 32.184 s (IAU 1991
// Resolution A4), GPS = TAI - 19 s (IS-GPS-200, from memory); a zone offset +hh:mm is a local
// clock that far ahead of UTC (ISO 8601, RFC 3339 sec. 5.6).
let app: FastifyInstance;
beforeAll(async () => { app = await testApp(); });
afterAll(async () => { await app.close(); });

type System = 'UTC' | 'TAI' | 'TT' | 'GPS';
const AHEAD_OF_UTC_MS: Record<System, number> = { UTC: 0, TAI: 37_000, TT: 69_184, GPS: 18_000 };

/** A spelling of the UTC instant `utcMs` (whole milliseconds) in `system`. */
interface Spelling { readonly digits: 0 | 3 | 6 | 9; readonly zone: 'Z' | '+00:00' | '-00:00' | number; readonly dayOfYear: boolean }
function spell(utcMs: number, system: System, s: Spelling): string {
  const offsetMin = system === 'UTC' && typeof s.zone === 'number' ? s.zone : 0;
  const clock = new Date(utcMs + AHEAD_OF_UTC_MS[system] + offsetMin * 60_000);
  const two = (n: number) => String(n).padStart(2, '0');
  const ms = clock.getUTCMilliseconds();
  const date = s.dayOfYear && system !== 'UTC'
    ? `${clock.getUTCFullYear()}-${String(Math.round((Date.UTC(clock.getUTCFullYear(), clock.getUTCMonth(), clock.getUTCDate()) - Date.UTC(clock.getUTCFullYear(), 0, 1)) / 86_400_000) + 1).padStart(3, '0')}`
    : `${clock.getUTCFullYear()}-${two(clock.getUTCMonth() + 1)}-${two(clock.getUTCDate())}`;
  const digits = ms !== 0 && s.digits === 0 ? 3 : s.digits;
  const fraction = digits === 0 ? '' : `.${String(ms).padStart(3, '0').padEnd(digits, '0')}`;
  const text = `${date}T${two(clock.getUTCHours())}:${two(clock.getUTCMinutes())}:${two(clock.getUTCSeconds())}${fraction}`;
  if (system !== 'UTC') return text;
  if (typeof s.zone !== 'number') return text + s.zone;
  const a = Math.abs(s.zone);
  return `${text}${s.zone < 0 ? '-' : '+'}${two(Math.floor(a / 60))}:${two(a % 60)}`;
}

const spelling: fc.Arbitrary<Spelling> = fc.record({
  digits: fc.constantFrom(0 as const, 3 as const, 6 as const, 9 as const),
  zone: fc.oneof(fc.constantFrom('Z' as const, '+00:00' as const, '-00:00' as const), fc.integer({ min: -14 * 60, max: 14 * 60 })),
  dayOfYear: fc.boolean(),
});
/** One epoch-bearing part: its time system (given or left out when UTC) and a spelling per epoch. */
const part = (epochs: number) => fc.record({
  system: fc.constantFrom<System>('UTC', 'TAI', 'TT', 'GPS'),
  sayUtc: fc.boolean(),
  spellings: fc.array(spelling, { minLength: epochs, maxLength: epochs }),
});
type Part = { system: System; sayUtc: boolean; spellings: Spelling[] };
/** The part's epochs spelt, and its timeSystem field (left out for UTC unless sayUtc). */
function spelt(p: Part, keys: readonly string[], utcMs: readonly number[]): Record<string, unknown> {
  const out: Record<string, unknown> = Object.fromEntries(keys.map((k, i) => [k, spell(utcMs[i]!, p.system, p.spellings[i]!)]));
  if (p.system !== 'UTC' || p.sayUtc) out.timeSystem = p.system;
  return out;
}

/** The same object with its keys (at every level) in the order `order` picks. */
function shuffled(value: unknown, order: number[]): unknown {
  if (Array.isArray(value)) return value.map((v) => shuffled(v, order));
  if (value === null || typeof value !== 'object') return value;
  const keys = Object.keys(value);
  const picked: string[] = [];
  const left = [...keys];
  for (let i = 0; left.length > 0; i++) picked.push(left.splice((order[i % order.length] ?? 0) % left.length, 1)[0]!);
  return Object.fromEntries(picked.map((k) => [k, shuffled((value as Record<string, unknown>)[k], order)]));
}
const keyOrder = fc.array(fc.nat({ max: 30 }), { minLength: 1, maxLength: 12 });
/** Defaults given or left out: each key of `defaults` is written with its default value when its flag is set. */
const withDefaults = (body: Record<string, unknown>, defaults: Record<string, unknown>, flags: boolean[]) =>
  ({ ...body, ...Object.fromEntries(Object.entries(defaults).filter((_, i) => flags[i])) });

const T0 = Date.UTC(2026, 11, 1, 6, 30, 15, 250);
const T1 = Date.UTC(2026, 11, 1, 7, 0, 0);
const T2 = Date.UTC(2026, 11, 1, 7, 20, 0);
const R = [6_878.137, 0, 0];
const V = [0, 4.8, 6.0];

async function answerOf(url: string, body: unknown): Promise<{ etag: string; body: string }> {
  const res = await postJson(app, url, body);
  expect(res.statusCode, `${JSON.stringify(body)}: ${res.body.slice(0, 300)}`).toBe(200);
  return { etag: String(res.headers.etag), body: res.body };
}

describe('random re-spellings of one scenario give one scenario hash and byte-identical answers', () => {
  it('/v1/track: state epoch and grid, time systems, zones, key order, defaults', async () => {
    const plain = { state: { epoch: spell(T0, 'UTC', { digits: 0, zone: 'Z', dayOfYear: false }), position: R, velocity: V }, grid: { start: spell(T1, 'UTC', { digits: 0, zone: 'Z', dayOfYear: false }), stop: spell(T2, 'UTC', { digits: 0, zone: 'Z', dayOfYear: false }), step: 120 } };
    const base = await answerOf('/v1/track', plain);
    await fc.assert(fc.asyncProperty(part(1), part(2), keyOrder, fc.array(fc.boolean(), { minLength: 6, maxLength: 6 }), async (st, gr, order, flags) => {
      const state = withDefaults({ ...spelt(st, ['epoch'], [T0]), position: R, velocity: V }, { frame: 'gcrf' }, flags.slice(0, 1));
      const grid = { ...spelt(gr, ['start', 'stop'], [T1, T2]), step: flags[1] ? 120.0 : 1.2e2 };
      const body = withDefaults({ state, grid }, { centralBody: 'earth', model: 'two-body', frame: 'gcrf', passThroughBody: false, format: 'json' }, flags.slice(1));
      const again = await answerOf('/v1/track', shuffled(body, order));
      expect(again.etag).toBe(base.etag);
      expect(again.body).toBe(base.body);
    }), { numRuns: 40, seed: 20_261_211 });
  });

  it('/v1/orbit: elements epoch', async () => {
    const elements = { semiMajorAxis: 6_928.137, eccentricity: 0.0012, inclination: 97.6, raan: 40, argPeriapsis: 90, trueAnomaly: 10 };
    const base = await answerOf('/v1/orbit', { elements: { ...elements, epoch: spell(T0, 'UTC', { digits: 0, zone: 'Z', dayOfYear: false }) } });
    await fc.assert(fc.asyncProperty(part(1), keyOrder, fc.array(fc.boolean(), { minLength: 2, maxLength: 2 }), async (el, order, flags) => {
      const body = withDefaults({ elements: { ...elements, ...spelt(el, ['epoch'], [T0]) } }, { centralBody: 'earth', format: 'json' }, flags);
      const again = await answerOf('/v1/orbit', shuffled(body, order));
      expect(again.etag).toBe(base.etag);
      expect(again.body).toBe(base.body);
    }), { numRuns: 40, seed: 20_261_212 });
  });

  it('/v1/passes: the window', async () => {
    const orbit = { elements: { epoch: '2026-12-01T00:00:00Z', semiMajorAxis: 6_928.137, eccentricity: 0.0012, inclination: 97.6, raan: 40, argPeriapsis: 90, trueAnomaly: 10 }, stations: [DEMO_STATIONS[0]] };
    const [w0, w1] = [Date.UTC(2026, 11, 1, 0, 0, 0), Date.UTC(2026, 11, 1, 8, 0, 0)];
    const base = await answerOf('/v1/passes', { ...orbit, window: { start: spell(w0, 'UTC', { digits: 0, zone: 'Z', dayOfYear: false }), stop: spell(w1, 'UTC', { digits: 0, zone: 'Z', dayOfYear: false }) } });
    await fc.assert(fc.asyncProperty(part(2), keyOrder, async (w, order) => {
      const again = await answerOf('/v1/passes', shuffled({ ...orbit, window: spelt(w, ['start', 'stop'], [w0, w1]) }, order));
      expect(again.etag).toBe(base.etag);
      expect(again.body).toBe(base.body);
    }), { numRuns: 25, seed: 20_261_213 });
  }, 60_000);

  it('a zone offset is a clock that far ahead of UTC: 2026-12-01T08:00:00+02:00 is 06:00 UTC, and an offset past 23:59 is refused', async () => {
    const el = { semiMajorAxis: 7000, eccentricity: 0.001, inclination: 51.6, raan: 0, argPeriapsis: 0, trueAnomaly: 0 };
    const a = await answerOf('/v1/orbit', { elements: { ...el, epoch: '2026-12-01T08:00:00+02:00' } });
    const b = await answerOf('/v1/orbit', { elements: { ...el, epoch: '2026-12-01T06:00:00Z' } });
    expect(a.body).toBe(b.body);
    expect(JSON.parse(a.body).epoch).toBe('2026-12-01T06:00:00.000000Z');
    // Across the day and the year: 2027-01-01T01:30:00+05:30 is 2026-12-31T20:00:00 UTC.
    const c = await answerOf('/v1/orbit', { elements: { ...el, epoch: '2027-01-01T01:30:00+05:30' } });
    expect(JSON.parse(c.body).epoch).toBe('2026-12-31T20:00:00.000000Z');
    const bad = await postJson(app, '/v1/orbit', { elements: { ...el, epoch: '2026-12-01T08:00:00+24:00' } });
    expect(bad.statusCode).toBe(400);
    expect(bad.json().type).toBe('/problems/invalid-epoch');
    // The leap second 2016-12-31T23:59:60 UTC (IERS Bulletin C 52) is 2017-01-01T00:59:60 at +01:00; 00:59:60 a day later is not one.
    const leap = await answerOf('/v1/orbit', { elements: { ...el, epoch: '2017-01-01T00:59:60.5+01:00' } });
    expect(JSON.parse(leap.body).epoch).toBe('2016-12-31T23:59:60.500000Z');
    const notLeap = await postJson(app, '/v1/orbit', { elements: { ...el, epoch: '2017-01-02T00:59:60+01:00' } });
    expect(notLeap.json().type).toBe('/problems/invalid-epoch');
  });
});
