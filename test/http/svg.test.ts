// The SVG answers of /v1/orbit, /v1/track, /v1/passes and /v1/central-force, read back with an XML
// parser: marks where the numbers of the JSON answer (or the published formulas) put them.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { FastifyInstance } from 'fastify';
import { postJson, testApp } from '../helpers/app.js';
import { DEMO_ORBIT, DEMO_STATIONS, EPOCH } from '../helpers/demo.js';
import { byClass, markerCentre, parseSvg, pathPoints, type SvgElement } from '../helpers/svg.js';

let app: FastifyInstance;
beforeAll(async () => { app = await testApp(); });
afterAll(async () => { await app.close(); });

const DEG = Math.PI / 180;
const one = (elements: SvgElement[], cls: string): SvgElement => {
  const found = byClass(elements, cls);
  expect(found.length, cls).toBe(1);
  return found[0]!;
};

// An invented eccentric orbit (e = 0.3) so that periapsis and apoapsis are far apart on the plot.
const ECCENTRIC = { centralBody: 'earth', elements: { epoch: EPOCH, semiMajorAxis: 12000, eccentricity: 0.3, inclination: 40, raan: 20, argPeriapsis: 60, trueAnomaly: 135 } };

async function svgOf(url: string, body: object): Promise<{ text: string; elements: SvgElement[]; etag: string }> {
  const res = await postJson(app, url, { ...body, format: 'svg' });
  expect(res.statusCode, res.body.slice(0, 300)).toBe(200);
  expect(res.headers['content-type']).toMatch(/^image\/svg\+xml/);
  return { text: res.body, elements: parseSvg(res.body).elements, etag: String(res.headers.etag) };
}

describe('POST /v1/orbit, format svg', () => {
  it('marks periapsis and apoapsis at r_p = a(1 - e) and r_a = a(1 + e) from the centre, to the scale of the body', async () => {
    const { elements } = await svgOf('/v1/orbit', ECCENTRIC);
    const body = one(elements, 'body');
    const centre = [Number(body.attrs.cx), Number(body.attrs.cy)] as const;
    const kmPerPx = 6378.137 / Number(body.attrs.r); // WGS-84 equatorial radius (NIMA TR8350.2, 3rd ed., table 3.1 — from memory)
    const { semiMajorAxis: a, eccentricity: e } = ECCENTRIC.elements;
    // Conic geometry: r_p = a(1 - e), r_a = a(1 + e) (Vallado, 4th ed., sec. 2.2 — from memory).
    const peri = markerCentre(one(elements, 'periapsis'));
    const apo = markerCentre(one(elements, 'apoapsis'));
    expect(Math.hypot(peri[0] - centre[0], peri[1] - centre[1]) * kmPerPx).toBeCloseTo(a * (1 - e), -1);
    expect(Math.hypot(apo[0] - centre[0], apo[1] - centre[1]) * kmPerPx).toBeCloseTo(a * (1 + e), -1);
    // Opposite sides of the focus along the apse line (the plot's +x).
    expect(Math.abs(peri[1] - centre[1])).toBeLessThan(0.05);
    expect(Math.abs(apo[1] - centre[1])).toBeLessThan(0.05);
    expect(peri[0]).toBeGreaterThan(centre[0]);
    expect(apo[0]).toBeLessThan(centre[0]);
  });

  it('puts the position at the true anomaly, at r = a(1 - e^2) / (1 + e cos nu), and the line of nodes at nu = -argPeriapsis', async () => {
    const { elements } = await svgOf('/v1/orbit', ECCENTRIC);
    const body = one(elements, 'body');
    const centre = [Number(body.attrs.cx), Number(body.attrs.cy)] as const;
    const kmPerPx = 6378.137 / Number(body.attrs.r);
    const { semiMajorAxis: a, eccentricity: e, trueAnomaly, argPeriapsis } = ECCENTRIC.elements;
    const pos = markerCentre(one(elements, 'position'));
    const dx = pos[0] - centre[0];
    const dy = centre[1] - pos[1]; // SVG y runs down
    expect(Math.hypot(dx, dy) * kmPerPx).toBeCloseTo((a * (1 - e * e)) / (1 + e * Math.cos(trueAnomaly * DEG)), -1);
    expect(Math.atan2(dy, dx) / DEG).toBeCloseTo(trueAnomaly, 1);
    const [p0, p1] = pathPoints(one(elements, 'line-of-nodes').attrs.d!)[0]!;
    const angle = Math.atan2(-(p1![1] - p0![1]), p1![0] - p0![0]) / DEG;
    expect(((angle + argPeriapsis) % 180 + 180) % 180).toBeCloseTo(0, 1);
  });

  it('an orbit given at periapsis or apoapsis: the position is a ring around the apsis marker, which stays visible', async () => {
    for (const trueAnomaly of [0, 180]) {
      const { elements } = await svgOf('/v1/orbit', { ...ECCENTRIC, elements: { ...ECCENTRIC.elements, trueAnomaly } });
      const position = one(elements, 'position');
      const apsis = markerCentre(one(elements, trueAnomaly === 0 ? 'periapsis' : 'apoapsis'));
      const at = markerCentre(position);
      expect(Math.hypot(at[0] - apsis[0], at[1] - apsis[1])).toBeLessThan(0.05);
      expect(position.attrs.fill).toBe('none'); // a ring: the marker under it shows
      expect(Number(position.attrs.r)).toBeGreaterThan(8); // wider than the apsis marker (7 px)
    }
    // Away from the apsides the position stays a filled dot.
    expect(one((await svgOf('/v1/orbit', ECCENTRIC)).elements, 'position').attrs.fill).not.toBe('none');
  });

  it('the demo orbit: body to scale, no apsis missing, same scenario same bytes; Accept chooses it too', async () => {
    const first = await svgOf('/v1/orbit', DEMO_ORBIT);
    const byAccept = await postJson(app, '/v1/orbit', DEMO_ORBIT, { accept: 'image/svg+xml' });
    expect(byAccept.body).toBe(first.text);
    expect(byAccept.headers.etag).toBe(first.etag);
    expect(byAccept.headers['x-cache']).toBe('hit');
    const json = await postJson(app, '/v1/orbit', DEMO_ORBIT);
    expect(json.headers['content-type']).toMatch(/^application\/json/);
    expect(json.headers.etag).not.toBe(first.etag);
    expect(byClass(first.elements, 'periapsis').length).toBe(1);
    expect(byClass(first.elements, 'apoapsis').length).toBe(1);
  });

  it('keeps the ascending-node label inside the plot box, off the tick labels, wherever the node points', async () => {
    for (const argPeriapsis of [0, 90, 180, 270, 45]) {
      const { elements } = await svgOf('/v1/orbit', { ...DEMO_ORBIT, elements: { ...DEMO_ORBIT.elements, argPeriapsis } });
      const clipAt = elements.findIndex((e) => e.tag === 'clipPath' && e.attrs.id === 'orbit-area');
      const [bx, by, bw, bh] = ['x', 'y', 'width', 'height'].map((k) => Number(elements[clipAt + 1]!.attrs[k]));
      const label = one(elements, 'node-label').attrs;
      const [x, y] = [Number(label.x), Number(label.y)];
      expect(x >= bx! && x <= bx! + bw!, `argPeriapsis ${argPeriapsis}: x ${x}`).toBe(true);
      expect(y >= by! + 12 && y <= by! + bh!, `argPeriapsis ${argPeriapsis}: y ${y}`).toBe(true);
      // Text of 12 px runs about 90 px: toward the inside of the box when near a side (common practice, no source).
      if (x > bx! + bw! - 110) expect(label['text-anchor']).toBe('end');
      if (x < bx! + 110) expect(label['text-anchor']).toBe('start');
    }
  });
});

describe('POST /v1/track, format svg', () => {
  const grid = { start: EPOCH, stop: '2026-12-01T03:00:00Z', step: 60 };
  it('draws each sample at its projected latitude and longitude, split at the antimeridian, start and end marked', async () => {
    const geo = (await postJson(app, '/v1/track', { ...DEMO_ORBIT, grid, frame: 'geodetic' })).json();
    const { elements } = await svgOf('/v1/track', { ...DEMO_ORBIT, grid });
    const clipAt = elements.findIndex((e) => e.tag === 'clipPath' && e.attrs.id === 'map-area');
    const map = elements[clipAt + 1]!;
    const [mx, my, mw, mh] = ['x', 'y', 'width', 'height'].map((k) => Number(map.attrs[k]));
    // Equirectangular projection: x linear in longitude over 360 deg, y linear in latitude over 180 deg (common practice, no source).
    const project = (s: { latitude: number; longitude: number }) => [mx! + ((s.longitude + 180) / 360) * mw!, my! + ((90 - s.latitude) / 180) * mh!] as const;
    const pieces = pathPoints(one(elements, 'track').attrs.d!);
    expect(pieces.length).toBeGreaterThan(1);
    const drawn = pieces.flat();
    const samples = geo.samples as { latitude: number; longitude: number }[];
    for (const s of samples) {
      const [x, y] = project(s);
      expect(drawn.some(([u, v]) => Math.abs(u - x) < 0.011 && Math.abs(v - y) < 0.011), `sample ${s.latitude},${s.longitude}`).toBe(true);
    }
    // Every other point is a crossing of the map's edge, and no segment jumps across the map.
    for (const [u] of drawn) {
      const isSample = samples.some((s) => Math.abs(project(s)[0] - u) < 0.011);
      expect(isSample || Math.abs(u - mx!) < 0.011 || Math.abs(u - mx! - mw!) < 0.011).toBe(true);
    }
    for (const piece of pieces) for (let i = 1; i < piece.length; i++) expect(Math.abs(piece[i]![0] - piece[i - 1]![0])).toBeLessThan(mw! / 2);
    const start = markerCentre(one(elements, 'start'));
    const [sx, sy] = project(samples[0]!);
    expect(Math.abs(start[0] - sx) + Math.abs(start[1] - sy)).toBeLessThan(0.03);
    expect(byClass(elements, 'end').length).toBe(1);
    expect(byClass(elements, 'land')[0]!.attrs.d!.length).toBeGreaterThan(10_000);
  });

  it('needs the built-in earth', async () => {
    const res = await postJson(app, '/v1/track', { ...DEMO_ORBIT, centralBody: 'mars', elements: { ...DEMO_ORBIT.elements, semiMajorAxis: 4000 }, grid, format: 'svg' });
    expect(res.statusCode).toBe(422);
    expect(res.json().detail).toContain('SVG map');
  });
});

describe('POST /v1/passes, format svg', () => {
  const request = { ...DEMO_ORBIT, window: { start: EPOCH, stop: '2026-12-01T12:00:00Z' }, stations: DEMO_STATIONS, pointing: { step: 15 } };

  it('a sky-plot point lies at radius 90 - elevation and at its azimuth clockwise from north', async () => {
    const json = (await postJson(app, '/v1/passes', request)).json();
    const { elements } = await svgOf('/v1/passes', request);
    const horizons = byClass(elements, 'horizon');
    expect(horizons.length).toBe(DEMO_STATIONS.length);
    const traces = byClass(elements, 'pass');
    expect(traces.length).toBe(json.passes.length);
    let checked = 0;
    // Passes are drawn station by station in the order of the request, each station's in time order.
    const ordered = DEMO_STATIONS.flatMap((s, k) => json.passes.filter((p: { station: string }) => p.station === s.id).map((p: unknown) => [k, p] as const));
    ordered.forEach(([k, pass]: readonly [number, { pointing: { azimuth: number; elevation: number }[] }], i: number) => {
      const h = horizons[k]!;
      const [cx, cy, r0] = [Number(h.attrs.cx), Number(h.attrs.cy), Number(h.attrs.r)];
      const pxPerDeg = r0 / 90; // the horizon ring is elevation 0, radius 90
      const pts = pathPoints(traces[i]!.attrs.d!)[0]!;
      expect(pts.length).toBe(pass.pointing.length);
      pts.forEach(([x, y], j) => {
        const s = pass.pointing[j]!;
        expect(Math.hypot(x - cx, y - cy) / pxPerDeg).toBeCloseTo(90 - s.elevation, 1);
        if (s.elevation < 89) {
          const az = ((Math.atan2(x - cx, cy - y) / DEG) + 360) % 360;
          const diff = Math.abs(((az - s.azimuth + 540) % 360) - 180);
          expect(diff).toBeLessThan(0.2);
        }
        checked++;
      });
    });
    expect(checked).toBeGreaterThan(50);
    expect(byClass(elements, 'aos').length).toBe(json.passes.length);
    expect(byClass(elements, 'tca').length).toBe(json.passes.length);
    expect(byClass(elements, 'los').length).toBe(json.passes.length);
    expect(byClass(elements, 'mask').length).toBe(DEMO_STATIONS.length);
  });

  it('the timeline has one bar per pass, from AOS to LOS on a linear time axis over the window', async () => {
    const json = (await postJson(app, '/v1/passes', request)).json();
    const { elements } = await svgOf('/v1/passes', request);
    const bars = byClass(elements, 'bar');
    expect(bars.length).toBe(json.passes.length);
    const t = (iso: string) => Date.parse(iso);
    const span = t(request.window.stop) - t(request.window.start);
    const x = bars.map((b) => Number(b.attrs.x));
    const w = bars.map((b) => Number(b.attrs.width));
    // Two passes of one row: the ratio of their offsets and lengths follows their times.
    const rows = DEMO_STATIONS.flatMap((s) => json.passes.filter((p: { station: string }) => p.station === s.id));
    const [p0, p1] = [rows[0], rows[1]] as { aos: string; los: string }[];
    const pxPerMs = (x[1]! - x[0]!) / (t(p1!.aos) - t(p0!.aos));
    expect(pxPerMs * span).toBeGreaterThan(400);
    expect(Math.abs(w[0]! - Math.max(1.5, pxPerMs * (t(p0!.los) - t(p0!.aos))))).toBeLessThan(0.05);
  });

  it('without a pointing request the plot still draws the passes; the JSON answer stays without pointing', async () => {
    const { pointing: _p, ...bare } = request;
    const { elements } = await svgOf('/v1/passes', bare);
    expect(byClass(elements, 'pass').length).toBeGreaterThan(0);
    const json = (await postJson(app, '/v1/passes', bare)).json();
    expect(json.passes[0].pointing).toBeUndefined();
  });
});

describe('POST /v1/central-force, format svg', () => {
  it('with a track the document adds the path r(phi); every marker and curve parses', async () => {
    const body = { mass: 1, potential: { terms: [{ kind: 'power', coefficient: -1, exponent: -1 }] }, angularMomentum: 1.2, energy: -0.3, track: { periods: 1, samples: 200 } };
    const { elements } = await svgOf('/v1/central-force', body);
    expect(byClass(elements, 'u-eff').length).toBeGreaterThan(0);
    const path = pathPoints(one(elements, 'path').attrs.d!)[0]!;
    expect(path.length).toBe(200);
    // One radial period of a Kepler ellipse closes on itself (Goldstein, 3rd ed., sec. 3.7 — from memory).
    expect(Math.hypot(path[0]![0] - path[199]![0], path[0]![1] - path[199]![1])).toBeLessThan(0.5);
  });
});
