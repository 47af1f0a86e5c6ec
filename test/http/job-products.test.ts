// Products per item in batches and jobs (CSV, CCSDS OEM, GeoJSON, SVG), one item in its own media
// type (GET /v1/jobs/{id}/results/{index}) and the .tar.gz archive of a job. The reference for
// every product is the endpoint's own answer to the same request sent alone (the contract: "byte
// for byte what the endpoint answers alone"); the archive's OEMs are read back by the test's own
// OEM reader (test/helpers/oem-kvn.ts, CCSDS 502.0-B-3 KVN) and compared with the JSON track.
import { Readable } from 'node:stream';
import { createGunzip } from 'node:zlib';
import type { FastifyInstance } from 'fastify';
import { extract } from 'tar-stream';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { JobAnswer } from '../../src/schemas/batch.js';
import { postJson, testApp } from '../helpers/app.js';
import { GOOD, parseLines, rawLines, until } from '../helpers/batch.js';
import { parseOemKvn } from '../helpers/oem-kvn.js';

const ITEMS = [
  { id: 'plover-7 csv', kind: 'track', request: { ...GOOD.track, format: 'csv' } },
  { id: 'plover-7/oem', kind: 'track', request: { ...GOOD.track, format: 'oem' } },
  { id: 'plover-7-geo', kind: 'track', request: { ...GOOD.track, format: 'geojson' } },
  { id: 'plover-7-plot', kind: 'orbit', request: { ...GOOD.orbit, format: 'svg' } },
  { id: 'plover-7-json', kind: 'track', request: GOOD.track },
  { id: 'broken', kind: 'track', request: { ...GOOD.track, format: 'png' } },
  { kind: 'passes', request: { ...GOOD.passes, format: 'svg' } },
] as const;

/** The endpoint's own answer to the item sent alone. */
async function alone(app: FastifyInstance, item: (typeof ITEMS)[number]) {
  return postJson(app, `/v1/${item.kind}`, item.request);
}

/** The files of a .tar.gz, by name. */
async function untar(bytes: Buffer): Promise<Map<string, Buffer>> {
  const files = new Map<string, Buffer>();
  const ex = extract();
  const done = new Promise<void>((resolve, reject) => {
    ex.on('entry', (header, stream, next) => {
      const parts: Buffer[] = [];
      stream.on('data', (c: unknown) => parts.push(c as Buffer));
      stream.on('end', () => { files.set(header.name, Buffer.concat(parts)); next(); });
      stream.on('error', reject);
    });
    ex.on('finish', resolve);
    ex.on('error', reject);
  });
  Readable.from([bytes]).pipe(createGunzip()).pipe(ex);
  await done;
  return files;
}

let app: FastifyInstance;
beforeAll(async () => { app = await testApp(); });
afterAll(async () => { await app.close(); });

async function doneJob(items: readonly unknown[], target = app): Promise<string> {
  const res = await postJson(target, '/v1/jobs', { items });
  expect(res.statusCode).toBe(202);
  const id = res.json().id as string;
  await until('job done', async () => JobAnswer.parse((await target.inject({ url: `/v1/jobs/${id}` })).json()).status === 'done');
  return id;
}

describe('products per item', () => {
  it('a batch line carries any format of its endpoint, the same bytes and media type as the endpoint alone', async () => {
    const res = await postJson(app, '/v1/batch', { items: ITEMS });
    expect(res.statusCode).toBe(200);
    const lines = parseLines(res.rawPayload);
    for (const [i, item] of ITEMS.entries()) {
      const own = await alone(app, item);
      const line = lines[i]!;
      expect(line.status, `${i}: ${JSON.stringify(line.problem)}`).toBe(own.statusCode);
      if (own.statusCode !== 200) continue;
      expect(line.scenarioHash).toBe(String(own.headers.etag).replaceAll('"', ''));
      const format = 'format' in item.request ? item.request.format : undefined;
      if (format === undefined) {
        expect(line.format).toBeUndefined();
        expect(line.answer).toEqual(own.json());
      } else {
        expect(line.format).toBe(format);
        expect(line.mediaType).toBe(own.headers['content-type']);
        if (format === 'geojson') expect(JSON.stringify(line.answer)).toBe(JSON.stringify(own.json()));
        else expect(line.product).toBe(own.payload);
      }
    }
    expect(lines[5]!.status).toBe(400); // "png" is not a format of /v1/track: the endpoint's own validation
  });

  it('GET /v1/jobs/{id}/results/{index}: the product in its own media type, the line on Accept: application/json', async () => {
    const id = await doneJob(ITEMS);
    const all = rawLines((await app.inject({ url: `/v1/jobs/${id}/results` })).rawPayload);
    for (const [i, item] of ITEMS.entries()) {
      const own = await alone(app, item);
      const one = await app.inject({ url: `/v1/jobs/${id}/results/${i}` });
      expect(one.statusCode).toBe(200);
      const format = 'format' in item.request ? item.request.format : undefined;
      if (own.statusCode === 200 && format !== undefined) {
        expect(one.headers['content-type']).toBe(own.headers['content-type']);
        expect(one.rawPayload.equals(own.rawPayload), `item ${i} bytes`).toBe(true);
        expect(one.headers.etag).toBe(own.headers.etag);
        const asLine = await app.inject({ url: `/v1/jobs/${id}/results/${i}`, headers: { accept: 'application/json' } });
        expect(asLine.rawPayload.equals(all[i]!)).toBe(true);
        expect((await app.inject({ url: `/v1/jobs/${id}/results/${i}`, headers: { accept: 'image/png' } })).statusCode).toBe(406);
      } else {
        expect(one.headers['content-type']).toMatch(/^application\/json/);
        expect(one.rawPayload.equals(all[i]!)).toBe(true);
      }
    }
  });
});

describe('GET /v1/jobs/{id}/archive', () => {
  it('a tar.gz with a manifest and every item\'s product; the OEM reads back and matches the JSON track', async () => {
    const id = await doneJob(ITEMS);
    const res = await app.inject({ url: `/v1/jobs/${id}/archive` });
    expect(res.statusCode).toBe(200);
    expect(res.headers['content-type']).toBe('application/gzip');
    expect(res.headers['content-disposition']).toBe(`attachment; filename="job-${id}.tar.gz"`);
    const files = await untar(res.rawPayload);
    const dir = `job-${id}`;
    const manifest = JSON.parse(files.get(`${dir}/manifest.json`)!.toString('utf8'));
    expect(manifest.job).toMatchObject({ id, status: 'done', items: ITEMS.length });
    expect(manifest.files.map((f: { file: string }) => f.file)).toEqual([
      '0-plover-7_csv.csv', '1-plover-7_oem.oem', '2-plover-7-geo.geojson', '3-plover-7-plot.svg', '4-plover-7-json.json', '5-broken.problem.json', '6-passes.svg',
    ]);
    expect([...files.keys()]).toEqual([`${dir}/manifest.json`, ...manifest.files.map((f: { file: string }) => `${dir}/${f.file}`)]);
    for (const [i, item] of ITEMS.entries()) {
      const entry = manifest.files[i];
      const body = files.get(`${dir}/${entry.file}`)!;
      expect(entry.bytes).toBe(body.length);
      const own = await alone(app, item);
      expect(entry.status).toBe(own.statusCode);
      if (own.statusCode === 200) {
        expect(entry.scenarioHash).toBe(String(own.headers.etag).replaceAll('"', ''));
        if (entry.format === 'json') expect(JSON.parse(body.toString('utf8'))).toEqual(own.json());
        else expect(body.equals(own.rawPayload), `file ${entry.file}`).toBe(true);
      } else {
        expect(JSON.parse(body.toString('utf8')).status).toBe(own.statusCode);
      }
    }
    // The OEM, read by the independent reader, holds the states of the JSON track of the same scenario.
    const oem = parseOemKvn(files.get(`${dir}/1-plover-7_oem.oem`)!.toString('utf8'));
    const track = (await postJson(app, '/v1/track', { ...GOOD.track, format: 'json' })).json();
    const states = oem.segments.flatMap((s) => s.states);
    expect(states.length).toBe(track.samples.length * 6);
    track.samples.forEach((s: { position: number[]; velocity: number[] }, k: number) => {
      [...s.position, ...s.velocity].forEach((v, j) => expect(Math.abs(states[k * 6 + j]! - v)).toBeLessThan(1e-6 * Math.max(1, Math.abs(v))));
    });
    // One job gives the same archive bytes every time.
    expect((await app.inject({ url: `/v1/jobs/${id}/archive` })).rawPayload.equals(res.rawPayload)).toBe(true);
  });

  it('bounded by JOB_ARCHIVE_MAX_BYTES (422), unknown jobs 404', async () => {
    const small = await testApp({ config: { JOB_ARCHIVE_MAX_BYTES: 1024 } });
    try {
      const id = await doneJob([ITEMS[0]], small);
      const res = await small.inject({ url: `/v1/jobs/${id}/archive` });
      expect(res.statusCode).toBe(422);
      expect(res.json().detail).toMatch(/JOB_ARCHIVE_MAX_BYTES/);
    } finally {
      await small.close();
    }
    expect((await app.inject({ url: '/v1/jobs/00000000-0000-4000-8000-000000000000/archive' })).statusCode).toBe(404);
  });
});
