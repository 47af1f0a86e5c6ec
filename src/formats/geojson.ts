// Ground track as GeoJSON (RFC 7946): one Feature in a FeatureCollection, coordinates
// [longitude, latitude] in degrees on WGS-84, optionally the height above the ellipsoid in metres
// as the third coordinate (RFC 7946 sec. 3.1.1). A track that crosses the antimeridian is cut
// there (sec. 3.1.9) into a MultiLineString; the crossing point is interpolated linearly in
// longitude and latitude and repeated at +180 and -180. Output is a generator of string chunks,
// byte-for-byte deterministic for a given input.

import { formatUtcIso } from '../solver/time/time.js';

export const GEOJSON_MEDIA_TYPE = 'application/geo+json; charset=utf-8';

export interface GroundTrackSample {
  /** TT seconds since J2000. */
  readonly tt: number;
  readonly latitudeDeg: number;
  readonly longitudeDeg: number;
  readonly heightKm: number;
}

export interface GroundTrackOptions {
  /** Object name, written to the feature's properties. */
  readonly name: string;
  /** Write the height (metres) as a third coordinate. Default false. */
  readonly includeHeight?: boolean;
  /** Decimal places of the angles (default 6, ~0.1 m); heights get 3 (mm). */
  readonly decimals?: number;
}

/** Positions per emitted chunk. */
const CHUNK_POSITIONS = 512;

type Position = readonly [lon: number, lat: number, heightKm: number];

/** Longitude reduced to [-180, 180). */
const normalizeLon = (lon: number): number => {
  const x = (((lon + 180) % 360) + 360) % 360 - 180;
  return x === 180 ? -180 : x;
};

/**
 * Lines of [lon, lat, heightKm] positions, cut where consecutive samples are more than 180 deg
 * apart in longitude (the shorter way round crosses the antimeridian). Lines of one position
 * (a sample exactly on the antimeridian) are dropped.
 */
export function splitAtAntimeridian(samples: readonly GroundTrackSample[]): Position[][] {
  const lines: Position[][] = [];
  let line: Position[] = [];
  let prev: Position | undefined;
  for (const s of samples) {
    if (!Number.isFinite(s.latitudeDeg) || !Number.isFinite(s.longitudeDeg) || !Number.isFinite(s.heightKm)) {
      throw new RangeError(`ground-track sample at TT ${s.tt} has a non-finite coordinate`);
    }
    const cur: Position = [normalizeLon(s.longitudeDeg), s.latitudeDeg, s.heightKm];
    if (prev && Math.abs(cur[0] - prev[0]) > 180) {
      const east = prev[0] > 0; // crossing eastward through +180, else westward through -180
      const edge = east ? 180 : -180;
      const lon2 = east ? cur[0] + 360 : cur[0] - 360;
      const f = (edge - prev[0]) / (lon2 - prev[0]);
      const lat = prev[1] + f * (cur[1] - prev[1]);
      const h = prev[2] + f * (cur[2] - prev[2]);
      if (prev[0] !== edge) line.push([edge, lat, h]);
      if (line.length > 1) lines.push(line);
      line = [[-edge, lat, h]];
      if (cur[0] === -edge && cur[1] === lat) line = [];
    }
    line.push(cur);
    prev = cur;
  }
  if (line.length > 1) lines.push(line);
  return lines;
}

const num = (x: number, decimals: number): string => JSON.stringify(Number(x.toFixed(decimals)));

function position(p: Position, decimals: number, withHeight: boolean): string {
  const lonLat = `${num(p[0], decimals)},${num(p[1], decimals)}`;
  return withHeight ? `[${lonLat},${num(p[2] * 1000, 3)}]` : `[${lonLat}]`;
}

function* positions(line: readonly Position[], decimals: number, withHeight: boolean): Generator<string> {
  for (let i = 0; i < line.length; i += CHUNK_POSITIONS) {
    const part = line.slice(i, i + CHUNK_POSITIONS).map((p) => position(p, decimals, withHeight));
    yield (i === 0 ? '[' : ',') + part.join(',');
  }
  yield ']';
}

/** The ground track as a GeoJSON FeatureCollection, in string chunks. */
export function* groundTrackGeoJson(samples: readonly GroundTrackSample[], options: GroundTrackOptions): Generator<string> {
  const decimals = options.decimals ?? 6;
  const withHeight = options.includeHeight ?? false;
  const first = samples[0];
  const last = samples[samples.length - 1];
  yield '{"type":"FeatureCollection","features":[';
  if (first && last) {
    const properties = {
      name: options.name,
      start: formatUtcIso(first.tt),
      stop: formatUtcIso(last.tt),
      samples: samples.length,
    };
    yield `{"type":"Feature","properties":${JSON.stringify(properties)},"geometry":`;
    const lines = splitAtAntimeridian(samples);
    if (lines.length === 0) {
      // One sample (or all on one point of the antimeridian): a Point (RFC 7946 sec. 3.1.2).
      yield `{"type":"Point","coordinates":${position([normalizeLon(first.longitudeDeg), first.latitudeDeg, first.heightKm], decimals, withHeight)}}`;
    } else if (lines.length === 1) {
      yield '{"type":"LineString","coordinates":';
      yield* positions(lines[0]!, decimals, withHeight);
      yield '}';
    } else {
      yield '{"type":"MultiLineString","coordinates":[';
      for (const [i, line] of lines.entries()) {
        if (i > 0) yield ',';
        yield* positions(line, decimals, withHeight);
      }
      yield ']}';
    }
    yield '}';
  }
  yield ']}';
}
