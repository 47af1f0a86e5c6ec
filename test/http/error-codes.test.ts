import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { connect } from 'node:net';
import type { Worker } from 'node:worker_threads';
import type { FastifyInstance } from 'fastify';
import { ERRORS, errorCodes, type ErrorCode } from '../../src/errors.js';
import { Problem } from '../../src/schemas/common.js';
import { BODY_NAMES } from '../../src/solver/bodies/bodies.js';
import { postJson, testApp } from '../helpers/app.js';
import { GOOD, until } from '../helpers/batch.js';
import { DEMO_ORBIT, DEMO_STATIONS, EPOCH } from '../helpers/demo.js';
import { PLOVER_TLE, withChecksum } from '../helpers/tle.js';

// Every code of the error table (src/errors.ts, docs/errors.md) is one a client can meet: each is
// produced here by a request over HTTP (app.inject, or a real socket where the fault is below
// HTTP), or by the HTTP test named in ELSEWHERE; a code in neither list fails the first test.
// Expected behaviour: RFC 9457 problem documents, statuses per RFC 9110 sec. 15.

/** Codes produced by another HTTP test file (which asserts the problem type): file -> why it lives there. */
const ELSEWHERE: Partial<Record<ErrorCode, string>> = {
  'request-timeout': 'test/http/slow-clients.test.ts', // a client that stalls its headers or body (seconds of waiting)
  'shutting-down': 'test/http/slow-clients.test.ts', // a batch cut short by close()
  'rate-limited': 'test/http/limits.test.ts',
  'overloaded': 'test/http/overload.test.ts', // a full worker queue
  'internal': 'test/http/overload.test.ts', // a throw inside a worker thread
  'unauthorized': 'test/http/auth.test.ts', // API_KEYS with salted hashes
  'queue-unavailable': 'test/http/jobs.test.ts',
  'job-not-done': 'test/http/jobs.test.ts',
  'job-finished': 'test/http/jobs-control.test.ts',
  'idempotency-conflict': 'test/http/jobs-control.test.ts',
  'job-not-comparable': 'test/http/jobs-control.test.ts',
  'callback-not-allowed': 'test/http/job-callbacks.test.ts',
  'oem-malformed': 'test/http/ephemeris-input.test.ts', // each malformed OEM names its line
  'oem-unsupported': 'test/http/ephemeris-input.test.ts',
  'outside-coverage': 'test/http/ephemeris-input.test.ts',
};

/**
 * Codes no request can produce today, each with the reason; kept in the table because the code
 * that answers them is in place. The list is asserted exactly, so a code that becomes reachable
 * must move to a case.
 */
const NOT_YET_REACHABLE: Partial<Record<ErrorCode, string>> = {
  // Kepler's equation (elliptic, hyperbolic, universal) and the radial quadrature return it; no body
  // was found that makes them fail (random searches near barrier tops and at extreme anomalies and spans).
  'no-convergence': 'no request found that makes an iteration fail',
};

let app: FastifyInstance;
beforeAll(async () => { app = await testApp({ config: { WORKER_THREADS: 1 } }); });
afterAll(async () => { await app.close(); });

interface Reply { statusCode: number; headers: Record<string, unknown>; body: string }
const problemOf = (res: Reply, code: ErrorCode) => {
  expect(res.statusCode, res.body.slice(0, 400)).toBe(ERRORS[code].status);
  expect(res.headers['content-type']).toMatch(/^application\/problem\+json/);
  const problem = Problem.parse(JSON.parse(res.body));
  expect(problem.type).toBe(`/problems/${code}`);
  expect(problem.status).toBe(ERRORS[code].status);
  return problem;
};

const state = (position: number[], velocity: number[]) => ({ centralBody: 'earth', state: { epoch: EPOCH, position, velocity } });
const elements = (el: Record<string, unknown>) => ({ centralBody: 'earth', elements: { ...DEMO_ORBIT.elements, ...el } });
const day = { start: EPOCH, stop: '2026-12-02T00:00:00Z' };
const fixture = (name: string): string => readFileSync(new URL(`../fixtures/sgp4/${name}`, import.meta.url), 'utf8');
const VER = fixture('SGP4-VER.TLE').split('\n');
const line = (start: string) => VER.find((l) => l.startsWith(start))!.slice(0, 69);
const OMM = {
  OBJECT_NAME: 'PLOVER-7', OBJECT_ID: '2026-900A', CENTER_NAME: 'EARTH', REF_FRAME: 'TEME', TIME_SYSTEM: 'UTC', MEAN_ELEMENT_THEORY: 'SGP4',
  EPOCH: '2026-12-01T00:00:00', MEAN_MOTION: 15.2, ECCENTRICITY: 0.0012, INCLINATION: 97.6, RA_OF_ASC_NODE: 40, ARG_OF_PERICENTER: 90, MEAN_ANOMALY: 10,
  EPHEMERIS_TYPE: 0, NORAD_CAT_ID: 99901, BSTAR: 0.0001,
};

/** Cases sent through app.inject: code -> [method, url, body or raw text, extra headers, optional field path the problem must name]. */
type Case = { url: string; method?: 'GET' | 'POST' | 'DELETE'; body?: unknown; raw?: string; headers?: Record<string, string>; path?: string };
const CASES: Partial<Record<ErrorCode, Case>> = {
  'validation-failed': { url: '/v1/orbit', body: { centralBody: 'earth' } },
  'malformed-json': { url: '/v1/orbit', raw: '{"centralBody": ' },
  'json-too-deep': { url: '/v1/orbit', raw: `{"centralBody":${'['.repeat(5000)}${']'.repeat(5000)}}` },
  'malformed-url': { url: '/v1/results/%', method: 'GET' },
  'uri-too-long': { url: `/v1/results/${'a'.repeat(5000)}`, method: 'GET' },
  'unsupported-media-type': { url: '/v1/orbit', raw: JSON.stringify(GOOD.orbit), headers: { 'content-type': 'text/plain' } },
  'not-acceptable': { url: '/v1/orbit', body: GOOD.orbit, headers: { accept: 'application/xml' } },
  'not-found': { url: '/v1/nothing-here', method: 'GET' },
  'result-not-cached': { url: `/v1/results/${'0'.repeat(64)}`, method: 'GET' },
  'problem-type-unknown': { url: '/problems/no-such-code', method: 'GET' },
  'unsupported-frame': { url: '/v1/track', body: { centralBody: { gm: 398600.4418 }, elements: DEMO_ORBIT.elements, grid: { times: [EPOCH] }, frame: 'itrf' } },
  'too-many-samples': { url: '/v1/track', body: { ...DEMO_ORBIT, grid: { start: EPOCH, stop: '2026-12-01T00:10:00Z', step: 5e-324 } }, path: 'body.grid.step' },
  'non-finite-result': { url: '/v1/orbit', body: elements({ semiMajorAxis: 5e-324 }), path: 'answer.state.velocity.0' },
  'tle-malformed': { url: '/v1/orbit', body: { tle: { line1: PLOVER_TLE.line1, line2: withChecksum(`2 99902${PLOVER_TLE.line2.slice(7)}`) } } },
  'omm-malformed': { url: '/v1/orbit', body: { omm: { ...OMM, EPOCH: '2026-13-01T00:00:00' } } },
  'omm-unsupported': { url: '/v1/orbit', body: { omm: { ...OMM, MEAN_ELEMENT_THEORY: 'SGP4-XP' } } },
  // Solver codes.
  'invalid-epoch': { url: '/v1/orbit', body: elements({ epoch: '2026-02-30T00:00:00Z' }), path: 'body.elements.epoch' },
  'epoch-out-of-range': { url: '/v1/track', body: { ...DEMO_ORBIT, grid: { times: [EPOCH, '2200-01-01T00:00:00Z'] } }, path: 'body.grid.times.1' },
  'zero-position': { url: '/v1/orbit', body: state([0, 0, 0], [0, 7.5, 0]) },
  'rectilinear-motion': { url: '/v1/orbit', body: state([7000, 0, 0], [3, 0, 0]) },
  'eccentricity-out-of-range': { url: '/v1/orbit', body: elements({ eccentricity: -0.1 }), path: 'body.elements.eccentricity' },
  'semi-major-axis-sign': { url: '/v1/orbit', body: elements({ semiMajorAxis: 7000, eccentricity: 1.5 }) },
  'anomaly-beyond-asymptote': { url: '/v1/orbit', body: elements({ semiMajorAxis: -7000, eccentricity: 1.5, trueAnomaly: 150 }) },
  // Periapsis 5850 km, below the Earth's radius (6378 km).
  'impact': { url: '/v1/passes', body: { ...elements({ semiMajorAxis: 6500, eccentricity: 0.1 }), window: day, stations: [DEMO_STATIONS[0]] } },
  'invalid-parameter': { url: '/v1/passes', body: { ...GOOD.passes, stations: [DEMO_STATIONS[0], DEMO_STATIONS[0]] } },
  'invalid-horizon-mask': { url: '/v1/passes', body: { ...GOOD.passes, stations: [{ ...DEMO_STATIONS[0], horizonMask: [{ azimuth: 10, elevation: 5 }, { azimuth: 10, elevation: 8 }] }] } },
  'window-too-long': { url: '/v1/passes', body: { ...GOOD.passes, window: { start: EPOCH, stop: '2027-01-15T00:00:00Z' } } },
  'too-many-stations': { url: '/v1/passes', body: { ...GOOD.passes, stations: Array.from({ length: 101 }, (_, i) => ({ ...DEMO_STATIONS[0], id: `s${i}` })) }, path: 'body.stations' },
  // A numerical track of 100 samples over 99 years: refused before integrating (the step limit).
  'integration-failed': { url: '/v1/track', body: { ...DEMO_ORBIT, model: 'numerical', forces: [{ kind: 'j2' }], grid: { start: EPOCH, stop: '2125-12-01T00:00:00Z', step: 99 * 365.25 * 864 } } },
  // Kepler U_eff = -k/r + l^2/(2 m r^2) has its minimum -m k^2 / (2 l^2) = -0.617 for l = 0.9 (Goldstein 3rd ed. sec. 3.3, from memory).
  'energy-below-minimum': { url: '/v1/central-force', body: { mass: 1, potential: { terms: [{ kind: 'power', coefficient: -1, exponent: -1 }] }, angularMomentum: 0.9, energy: -0.7 } },
  // E > 0 in a Kepler well escapes: no radial period for a track of periods.
  'no-radial-period': { url: '/v1/central-force', body: { mass: 1, potential: { terms: [{ kind: 'power', coefficient: -1, exponent: -1 }] }, angularMomentum: 0.9, energy: 0.5, track: { periods: 2 } } },
  // Spacetrack Report No. 3 verification case 28872 decays about 50 min after its epoch.
  'sgp4-failed': { url: '/v1/track', body: { tle: { line1: line('1 28872'), line2: line('2 28872') }, grid: { start: '2005-11-29T00:30:00Z', stop: '2005-11-29T01:30:00Z', step: 60 } } },
};

/** Codes that need their own app or a socket (the tests below). */
const OWN_TESTS: readonly ErrorCode[] = ['malformed-request', 'header-too-large', 'body-too-large', 'limit-exceeded', 'deadline-exceeded', 'worker-failed', 'item-not-written', 'job-not-found'];

describe('the error table holds only codes a request can meet', () => {
  it('every code has a case here, a test elsewhere, or a stated reason', () => {
    const covered = [...Object.keys(CASES), ...OWN_TESTS, ...Object.keys(ELSEWHERE), ...Object.keys(NOT_YET_REACHABLE)];
    expect(covered.slice().sort()).toEqual(errorCodes().slice().sort());
    expect(new Set(covered).size).toBe(covered.length);
  });

  it('each code left to another file is asserted there', () => {
    for (const [code, file] of Object.entries(ELSEWHERE)) expect(readFileSync(file!, 'utf8'), `${code} in ${file}`).toContain(`/problems/${code}`);
  });

  for (const [code, c] of Object.entries(CASES) as [ErrorCode, Case][]) {
    it(`${code}: ${c.method ?? 'POST'} ${c.url.slice(0, 40)}`, async () => {
      const method = c.method ?? 'POST';
      const res = method === 'GET' || c.raw === undefined && c.body === undefined
        ? await app.inject({ method, url: c.url, headers: c.headers ?? {} })
        : c.raw !== undefined
          ? await app.inject({ method, url: c.url, payload: c.raw, headers: { 'content-type': 'application/json', ...c.headers } })
          : await postJson(app, c.url, c.body, c.headers);
      const problem = problemOf(res, code);
      if (c.path !== undefined) expect(problem.errors?.map((e) => e.path)).toContain(c.path);
    });
  }
});

describe('codes with their own set-up', () => {
  it('body-too-large: a body over BODY_LIMIT_BYTES', async () => {
    const small = await testApp({ config: { BODY_LIMIT_BYTES: 1024 } });
    try {
      problemOf(await postJson(small, '/v1/orbit', { ...GOOD.orbit, pad: 'x'.repeat(2000) }), 'body-too-large');
    } finally { await small.close(); }
  });

  it('limit-exceeded: a batch over BATCH_MAX_ITEMS', async () => {
    const small = await testApp({ config: { BATCH_MAX_ITEMS: 1 } });
    try {
      problemOf(await postJson(small, '/v1/batch', { items: [{ kind: 'orbit', request: GOOD.orbit }, { kind: 'orbit', request: GOOD.orbit }] }), 'limit-exceeded');
    } finally { await small.close(); }
  });

  it('job-not-found and item-not-written: an unknown job, and an index past a finished job', async () => {
    problemOf(await app.inject({ url: '/v1/jobs/00000000-0000-4000-8000-000000000000' }), 'job-not-found');
    const submitted = await postJson(app, '/v1/jobs', { items: [{ kind: 'orbit', request: GOOD.orbit }] });
    expect(submitted.statusCode, submitted.body).toBe(202);
    const id = submitted.json().id as string;
    await until('job done', async () => (await app.inject({ url: `/v1/jobs/${id}` })).json().status === 'done');
    problemOf(await app.inject({ url: `/v1/jobs/${id}/results/5` }), 'item-not-written');
  });

  it('deadline-exceeded: heavy work past REQUEST_DEADLINE_S', async () => {
    const quick = await testApp({ config: { REQUEST_DEADLINE_S: 0.05, WORKER_THREADS: 1 } });
    try {
      const body = { ...DEMO_ORBIT, model: 'numerical', forces: [{ kind: 'j2' }, { kind: 'third-body', body: 'moon' }], grid: { start: EPOCH, stop: '2026-12-20T00:00:00Z', step: 600 } };
      problemOf(await postJson(quick, '/v1/track', body), 'deadline-exceeded');
    } finally { await quick.close(); }
  });

  it('worker-failed: the thread computing the answer dies under its task (as an out-of-memory thread would)', async () => {
    const one = await testApp({ config: { WORKER_THREADS: 1 } });
    // Every solver thread started while the request runs is stopped a little after it comes online;
    // whichever one holds the task dies under it. Node emits 'worker' for each new thread.
    const stop = (w: Worker) => { w.once('online', () => setTimeout(() => void w.terminate(), 300)); };
    process.on('worker', stop);
    try {
      const body = { ...DEMO_ORBIT, model: 'numerical', forces: [{ kind: 'j2' }, { kind: 'third-body', body: 'moon' }, { kind: 'third-body', body: 'sun' }], grid: { start: EPOCH, stop: '2026-12-31T00:00:00Z', step: 60 } };
      const res = await postJson(one, '/v1/track', body);
      problemOf(res, 'worker-failed');
      expect(res.headers['retry-after']).toBeDefined();
    } finally {
      process.off('worker', stop);
      await one.close();
    }
  }, 60_000);

  describe('below HTTP: a real socket', () => {
    let server: FastifyInstance;
    let port: number;
    beforeAll(async () => {
      server = await testApp({ config: { WORKER_THREADS: 1 } });
      await server.listen({ port: 0, host: '127.0.0.1' });
      port = (server.server.address() as { port: number }).port;
    });
    afterAll(async () => { await server.close(); });

    const exchange = (bytes: string): Promise<string> => new Promise((resolve, reject) => {
      const socket = connect(port, '127.0.0.1');
      let text = '';
      socket.on('data', (d) => { text += d.toString('latin1'); });
      socket.on('close', () => resolve(text));
      socket.on('error', reject);
      socket.write(bytes);
    });
    const statusAndProblem = (text: string, code: ErrorCode) => {
      const [head, body] = text.split('\r\n\r\n');
      expect(head).toMatch(new RegExp(`^HTTP/1.1 ${ERRORS[code].status} `));
      expect(head!.toLowerCase()).toContain('content-type: application/problem+json');
      expect(Problem.parse(JSON.parse(body!)).type).toBe(`/problems/${code}`);
    };

    it('malformed-request: bytes that are not HTTP', async () => {
      statusAndProblem(await exchange('HELLO THERE\r\n\r\n'), 'malformed-request');
    });

    it('header-too-large: headers over Node\'s 16 KiB limit', async () => {
      statusAndProblem(await exchange(`GET /healthz HTTP/1.1\r\nHost: x\r\nX-Pad: ${'p'.repeat(20_000)}\r\n\r\n`), 'header-too-large');
    });
  });
});

describe('enum errors list the names allowed', () => {
  it('centralBody "pluto" is refused with every built-in name (or an object)', async () => {
    const problem = problemOf(await postJson(app, '/v1/orbit', { ...GOOD.orbit, centralBody: 'pluto' }), 'validation-failed');
    const issue = problem.errors!.find((e) => e.path === 'body.centralBody')!;
    for (const name of BODY_NAMES) expect(issue.message).toContain(`"${name}"`);
    expect(issue.message).toMatch(/or an object/);
  });

  it('a custom body object with a bad field names that field, not the list of names', async () => {
    const problem = problemOf(await postJson(app, '/v1/orbit', { ...GOOD.orbit, centralBody: { gm: 'heavy' } }), 'validation-failed');
    expect(problem.errors!.map((e) => e.path)).toEqual(['body.centralBody.gm']);
  });

  it('model, frame and force kinds list theirs', async () => {
    const model = problemOf(await postJson(app, '/v1/track', { ...GOOD.track, model: 'warp' }), 'validation-failed');
    expect(model.errors![0]!.message).toMatch(/"two-body".*"j2-secular".*"numerical"/);
    const frame = problemOf(await postJson(app, '/v1/track', { ...GOOD.track, frame: 'icrs' }), 'validation-failed');
    expect(frame.errors![0]!.message).toMatch(/"gcrf".*"itrf".*"geodetic"/);
    const force = problemOf(await postJson(app, '/v1/track', { ...GOOD.track, model: 'numerical', forces: [{ kind: 'gravity-waves' }] }), 'validation-failed');
    expect(force.errors![0]!.message).toMatch(/'j2'.*'drag'.*'third-body'.*'srp'/);
  });

  it('a body with epoch problems and other problems is validation-failed listing them all', async () => {
    const problem = problemOf(await postJson(app, '/v1/orbit', { centralBody: 'pluto', elements: { ...DEMO_ORBIT.elements, epoch: '2026-02-30T00:00:00Z' } }), 'validation-failed');
    expect(problem.errors!.map((e) => e.path).sort()).toEqual(['body.centralBody', 'body.elements.epoch']);
  });

  it('an epoch in another time system keeps its code (TT text past 2199 in UTC)', async () => {
    const res = await postJson(app, '/v1/orbit', { ...GOOD.orbit, elements: { ...DEMO_ORBIT.elements, epoch: '2199-12-31T23:59:59', timeSystem: 'TT' } });
    // 2199-12-31T23:59:59 TT is 2199-12-31T23:58:49.816 UTC (TT - UTC = 69.184 s with the table's last entry): inside the range.
    expect(res.statusCode, res.body).toBe(200);
    const bad = await postJson(app, '/v1/orbit', { ...GOOD.orbit, elements: { ...DEMO_ORBIT.elements, epoch: '1972-01-01T00:00:05', timeSystem: 'TT' } });
    // 1972-01-01T00:00:05 TT is 1971-12-31T23:59:22.816 UTC (TT - UTC = 42.184 s then): before the range.
    problemOf(bad, 'epoch-out-of-range');
  });
});
