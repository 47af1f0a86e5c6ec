// The ground track on an equirectangular world map (longitude and latitude linear in x and y):
// coastlines from Natural Earth 1:110m land (public domain, the world-atlas package) drawn with
// d3-geo, which cuts polygons at the antimeridian; the track itself is split at +-180 deg with the
// crossing latitude interpolated linearly in longitude; start and end marked.

import { createRequire } from 'node:module';
import { geoEquirectangular, geoPath } from 'd3-geo';
import { feature } from 'topojson-client';
import type { GeometryCollection, Topology } from 'topojson-specification';
import { esc, glyph, heading, INK, legendRow, type Panel, px } from './common.js';

export interface GroundSample {
  readonly latitudeDeg: number;
  readonly longitudeDeg: number;
}

export const MAP = { left: 58, width: 560, height: 280 } as const;
const WIDTH = 640;
const MIN_GAP_PX = 0.5;

/** Pixel position of (latitude, longitude) in the map box whose top edge is at `top`. */
export function mapPoint(top: number, latitudeDeg: number, longitudeDeg: number): [number, number] {
  return [MAP.left + ((longitudeDeg + 180) / 360) * MAP.width, top + ((90 - latitudeDeg) / 180) * MAP.height];
}

let landCache: { top: number; d: string } | undefined;

/** Land outlines as path data for a map box at `top` (computed once per top). */
function landPath(top: number): string {
  if (landCache?.top === top) return landCache.d;
  const require = createRequire(import.meta.url);
  const topology = require('world-atlas/land-110m.json') as Topology<{ land: GeometryCollection }>;
  const land = feature(topology, topology.objects.land);
  const projection = geoEquirectangular()
    .scale(MAP.width / (2 * Math.PI))
    .translate([MAP.left + MAP.width / 2, top + MAP.height / 2])
    .precision(0);
  const d = geoPath(projection).digits(1)(land) ?? '';
  landCache = { top, d };
  return d;
}

/** The track as polylines in longitude/latitude, cut at the antimeridian (each piece stays within [-180, 180]). */
export function splitAtAntimeridian(samples: readonly GroundSample[]): [number, number][][] {
  const pieces: [number, number][][] = [];
  let piece: [number, number][] = [];
  let prev: GroundSample | undefined;
  for (const s of samples) {
    if (!Number.isFinite(s.latitudeDeg) || !Number.isFinite(s.longitudeDeg)) {
      if (piece.length) pieces.push(piece);
      piece = [];
      prev = undefined;
      continue;
    }
    if (prev) {
      const dLon = s.longitudeDeg - prev.longitudeDeg;
      if (Math.abs(dLon) > 180) {
        const edge = dLon < 0 ? 180 : -180; // eastward across +180 when the longitude drops
        const unwrapped = s.longitudeDeg + (dLon < 0 ? 360 : -360);
        const f = (edge - prev.longitudeDeg) / (unwrapped - prev.longitudeDeg);
        const lat = prev.latitudeDeg + f * (s.latitudeDeg - prev.latitudeDeg);
        piece.push([edge, lat]);
        pieces.push(piece);
        piece = [[-edge, lat]];
      }
    }
    piece.push([s.longitudeDeg, s.latitudeDeg]);
    prev = s;
  }
  if (piece.length) pieces.push(piece);
  return pieces;
}

export interface GroundTrackOptions {
  readonly name: string;
  readonly startLabel: string;
  readonly endLabel: string;
}

export function groundTrackPanel(samples: readonly GroundSample[], opts: GroundTrackOptions): Panel {
  const legend = legendRow(MAP.left, 46, WIDTH - 20, [
    { glyph: glyph.line(INK.main, 1.8), label: 'ground track' },
    { glyph: glyph.square(11, 0, 5, INK.accent), label: `start ${opts.startLabel}` },
    { glyph: glyph.triangle(11, 0, 6, INK.accent), label: `end ${opts.endLabel}` },
  ]);
  const top = 46 + legend.height + 6;
  const out: string[] = [heading(MAP.left, 26, `Ground track of ${opts.name}`), legend.markup];
  out.push(`<defs><clipPath id="map-area"><rect x="${MAP.left}" y="${top}" width="${MAP.width}" height="${MAP.height}"/></clipPath></defs>`);
  out.push(`<rect x="${MAP.left}" y="${top}" width="${MAP.width}" height="${MAP.height}" fill="#ffffff"/>`);
  out.push(`<path class="land" d="${landPath(top)}" fill="${INK.land}" stroke="${INK.coast}" stroke-width="0.5"/>`);

  const grid: string[] = [];
  const labels: string[] = [];
  for (let lon = -180; lon <= 180; lon += 30) {
    const [x] = mapPoint(top, 0, lon);
    grid.push(`M${px(x)},${top}V${top + MAP.height}`);
    if (lon % 60 === 0) labels.push(`<text x="${px(x)}" y="${top + MAP.height + 16}" text-anchor="middle">${lon}</text>`);
  }
  for (let lat = -90; lat <= 90; lat += 30) {
    const [, y] = mapPoint(top, lat, 0);
    grid.push(`M${MAP.left},${px(y)}H${MAP.left + MAP.width}`);
    labels.push(`<text x="${MAP.left - 6}" y="${px(y + 4)}" text-anchor="end">${lat}</text>`);
  }
  out.push(`<path d="${grid.join('')}" stroke="#9a9a9a" stroke-width="0.5" stroke-opacity="0.7" fill="none"/>`);
  out.push(`<rect x="${MAP.left}" y="${top}" width="${MAP.width}" height="${MAP.height}" stroke="${INK.axis}" stroke-width="1.2" fill="none"/>`);
  out.push(`<g font-size="12">${labels.join('')}</g>`);
  out.push(`<text x="${MAP.left + MAP.width / 2}" y="${top + MAP.height + 36}" text-anchor="middle">longitude (deg, east positive)</text>`);
  const midY = px(top + MAP.height / 2);
  out.push(`<text x="16" y="${midY}" text-anchor="middle" transform="rotate(-90 16 ${midY})">latitude (deg)</text>`);

  // Points closer than MIN_GAP_PX to the last one drawn are left out (long tracks stay small); each piece keeps its ends.
  const paths = splitAtAntimeridian(samples).map((piece) => {
    let d = '';
    let last: [number, number] | undefined;
    piece.forEach(([lon, lat], i) => {
      const q = mapPoint(top, lat, lon);
      if (last && i < piece.length - 1 && Math.hypot(q[0] - last[0], q[1] - last[1]) < MIN_GAP_PX) return;
      d += `${last ? 'L' : 'M'}${px(q[0])},${px(q[1])}`;
      last = q;
    });
    return d;
  });
  out.push(`<g clip-path="url(#map-area)"><path class="track" d="${paths.join('')}" stroke="${INK.main}" stroke-width="1.8" stroke-linejoin="round" fill="none"/></g>`);
  const finite = samples.filter((s) => Number.isFinite(s.latitudeDeg) && Number.isFinite(s.longitudeDeg));
  const first = finite[0];
  const last = finite.at(-1);
  if (first) out.push(glyph.square(...mapPoint(top, first.latitudeDeg, first.longitudeDeg), 5.5, INK.accent, ' class="start"'));
  if (last && finite.length > 1) out.push(glyph.triangle(...mapPoint(top, last.latitudeDeg, last.longitudeDeg), 6.5, INK.accent, ' class="end"'));
  out.push(`<text x="${WIDTH - 20}" y="${top + MAP.height + 36}" font-size="10" text-anchor="end" fill="#555555">${esc('coastlines: Natural Earth 1:110m')}</text>`);
  return { height: top + MAP.height + 48, body: out.join('\n') };
}
