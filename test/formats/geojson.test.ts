import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { groundTrackGeoJson, splitAtAntimeridian, type GroundTrackSample } from '../../src/formats/geojson.js';
import { parseUtcIso } from '../../src/solver/time/time.js';

const T0 = (() => {
  const r = parseUtcIso('2026-12-01T00:00:00Z');
  if (!r.ok) throw new Error(r.message);
  return r.value;
})();
const samples = (...p: Array<[lon: number, lat: number, hKm?: number]>): GroundTrackSample[] =>
  p.map(([lon, lat, h], i) => ({ tt: T0 + 60 * i, longitudeDeg: lon, latitudeDeg: lat, heightKm: h ?? 500 }));
interface Doc {
  type: string;
  features: Array<{ type: string; properties: unknown; geometry: { type: string; coordinates: unknown } }>;
}
const render = (s: GroundTrackSample[], includeHeight = false): { text: string; doc: Doc } => {
  const text = [...groundTrackGeoJson(s, { name: 'Kestrel-7 (demo)', includeHeight })].join('');
  return { text, doc: JSON.parse(text) as Doc };
};

describe('ground track GeoJSON (RFC 7946)', () => {
  it('writes a FeatureCollection with one LineString of [lon, lat] and the name and time span as properties', () => {
    const { doc } = render(samples([10, 20], [12, 25], [14, 30]));
    expect(doc.type).toBe('FeatureCollection');
    expect(doc.features).toHaveLength(1);
    const f = doc.features[0]!;
    expect(f.type).toBe('Feature');
    expect(f.properties).toEqual({ name: 'Kestrel-7 (demo)', start: '2026-12-01T00:00:00.000000Z', stop: '2026-12-01T00:02:00.000000Z', samples: 3 });
    expect(f.geometry).toEqual({ type: 'LineString', coordinates: [[10, 20], [12, 25], [14, 30]] });
  });

  it('cuts at the antimeridian like the example of RFC 7946 sec. 3.1.9: [[170,45],[180,45]] and [[-180,45],[-170,45]]', () => {
    const { doc } = render(samples([170, 45], [-170, 45]));
    expect(doc.features[0]!.geometry).toEqual({ type: 'MultiLineString', coordinates: [[[170, 45], [180, 45]], [[-180, 45], [-170, 45]]] });
  });

  it('interpolates the crossing latitude on both sides, eastward and westward', () => {
    const east = splitAtAntimeridian(samples([178, 10], [-179, 16]));
    expect(east).toEqual([[[178, 10, 500], [180, 14, 500]], [[-180, 14, 500], [-179, 16, 500]]]);
    const west = splitAtAntimeridian(samples([-178, -10], [179, -16]));
    expect(west).toEqual([[[-178, -10, 500], [-180, -14, 500]], [[180, -14, 500], [179, -16, 500]]]);
  });

  it('writes the height above the ellipsoid in metres as the third coordinate (RFC 7946 sec. 3.1.1)', () => {
    const { doc } = render(samples([0, 0, 412.3456], [1, 1, 413]), true);
    expect(doc.features[0]!.geometry.coordinates).toEqual([[0, 0, 412_345.6], [1, 1, 413_000]]);
  });

  it('reduces longitudes to [-180, 180) and handles a sample exactly on the antimeridian', () => {
    expect(splitAtAntimeridian(samples([179, 0], [180, 1], [-179, 2]))).toEqual([
      [[179, 0, 500], [180, 1, 500]],
      [[-180, 1, 500], [-179, 2, 500]],
    ]);
    expect(splitAtAntimeridian(samples([350, 5], [355, 6]))).toEqual([[[-10, 5, 500], [-5, 6, 500]]]);
  });

  it('no line ever spans more than 180 deg of longitude between neighbours, and every sample appears (property)', () => {
    fc.assert(
      fc.property(fc.array(fc.tuple(fc.double({ min: -540, max: 540, noNaN: true }), fc.double({ min: -90, max: 90, noNaN: true })), { minLength: 2, maxLength: 60 }), (pts) => {
        const lines = splitAtAntimeridian(samples(...pts));
        let count = 0;
        for (const line of lines) {
          expect(line.length).toBeGreaterThanOrEqual(2);
          for (let i = 1; i < line.length; i++) expect(Math.abs(line[i]![0] - line[i - 1]![0])).toBeLessThanOrEqual(180);
          for (const p of line) {
            expect(p[0]).toBeGreaterThanOrEqual(-180);
            expect(p[0]).toBeLessThanOrEqual(180);
            if (Math.abs(p[0]) !== 180) count++;
          }
        }
        const inside = pts.filter(([lon]) => Math.abs(((((lon + 180) % 360) + 360) % 360) - 180) !== 180).length;
        expect(count).toBeLessThanOrEqual(pts.length);
        expect(count).toBeGreaterThanOrEqual(inside - 1); // only a lone first point can be dropped
      }),
    );
  });

  it('is deterministic, emits several chunks for long tracks, and handles one sample (Point) and none', () => {
    const long = samples(...Array.from({ length: 2000 }, (_, i): [number, number] => [((i * 0.37) % 360) - 180, 50 * Math.sin(i / 100)]));
    const a = [...groundTrackGeoJson(long, { name: 'x' })];
    const b = [...groundTrackGeoJson(long, { name: 'x' })];
    expect(a.join('')).toBe(b.join(''));
    expect(a.length).toBeGreaterThan(4);
    expect(() => JSON.parse(a.join(''))).not.toThrow();
    expect(render(samples([5, 6])).doc.features[0]!.geometry).toEqual({ type: 'Point', coordinates: [5, 6] });
    expect(render([]).doc).toEqual({ type: 'FeatureCollection', features: [] });
  });

  it('refuses non-finite coordinates', () => {
    expect(() => splitAtAntimeridian(samples([Number.NaN, 0], [1, 1]))).toThrow(RangeError);
  });
});
