// Sky plot of one ground station: azimuth clockwise from north at the top, radius 90 - elevation
// (zenith at the centre, the horizon on the 90 deg ring), the horizon mask shaded, each pass drawn
// from its pointing track with AOS, TCA and LOS marked; the passes listed beside it.

import { createHorizonMask, horizonLimit } from '../../solver/stations/horizon-mask.js';
import { esc, formatValue, glyph, heading, INK, legendRow, type Panel, polylinePath, px } from './common.js';

const RAD_PER_DEG = Math.PI / 180;
const WIDTH = 640;
/** Pixels per degree of zenith distance. */
export const SKY_SCALE = 1.5;
export const SKY_LEFT = 40;
const LIST_ROWS = 14;

export interface SkyStation {
  readonly id: string;
  /** deg */
  readonly minElevation: number;
  readonly horizonMask?: readonly { readonly azimuth: number; readonly elevation: number }[];
}

export interface SkyPass {
  readonly aos: string;
  readonly tca: string;
  readonly los: string;
  readonly maxElevation: number;
  readonly azimuthTca: number;
  readonly pointing?: readonly { readonly azimuth: number; readonly elevation: number }[];
}

/** Position in the sky plot of (azimuth, elevation) in degrees, about the centre (cx, cy). */
export function skyPoint(cx: number, cy: number, azimuthDeg: number, elevationDeg: number): [number, number] {
  const rho = (90 - elevationDeg) * SKY_SCALE;
  const a = azimuthDeg * RAD_PER_DEG;
  return [cx + rho * Math.sin(a), cy - rho * Math.cos(a)];
}

/** The elevation limit (deg) at each whole degree of azimuth, as the pass search applies it. */
function limitCurve(station: SkyStation): number[] {
  const mask = createHorizonMask((station.horizonMask ?? []).map((p) => ({ azimuth: p.azimuth * RAD_PER_DEG, elevation: p.elevation * RAD_PER_DEG })), station.minElevation * RAD_PER_DEG);
  if (!mask.ok) return Array.from({ length: 361 }, () => station.minElevation);
  return Array.from({ length: 361 }, (_, az) => horizonLimit(mask.value, az * RAD_PER_DEG) / RAD_PER_DEG);
}

const hhmm = (iso: string): string => `${iso.slice(5, 10)} ${iso.slice(11, 19)}`;

export function skyPlotPanel(station: SkyStation, passes: readonly SkyPass[]): Panel {
  const limits = limitCurve(station);
  // The outer ring is the horizon, or lower when the station looks below it.
  const outer = Math.max(90, 90 - Math.min(0, ...limits, ...passes.flatMap((p) => (p.pointing ?? []).map((s) => s.elevation))));
  const R = outer * SKY_SCALE;
  const legend = legendRow(SKY_LEFT, 46, WIDTH - 20, [
    { glyph: `<rect x="0" y="-6" width="22" height="12" fill="${INK.fill}" stroke="${INK.coast}" stroke-width="0.8"/>`, label: 'below the elevation limit' },
    { glyph: glyph.square(11, 0, 5, INK.accent), label: 'AOS' },
    { glyph: glyph.diamond(11, 0, 6, INK.main), label: 'TCA' },
    { glyph: glyph.triangle(11, 0, 6, INK.accent), label: 'LOS' },
  ]);
  const top = 46 + legend.height + 22;
  const cx = SKY_LEFT + R;
  const cy = top + R;
  const out: string[] = [heading(SKY_LEFT, 26, `Sky plot, station ${station.id}`), legend.markup];

  // Mask: the band between the outer ring and the limit curve.
  const ring = Array.from({ length: 361 }, (_, az) => skyPoint(cx, cy, az, 90 - outer));
  const curve = limits.map((el, az) => skyPoint(cx, cy, az, el));
  out.push(`<path class="mask" d="${polylinePath(ring)}Z${polylinePath([...curve].reverse())}Z" fill="${INK.fill}" fill-rule="evenodd" stroke="none"/>`);
  out.push(`<path class="limit" d="${polylinePath(curve)}" fill="none" stroke="${INK.coast}" stroke-width="1"/>`);

  const grid: string[] = [];
  const rings: string[] = [];
  const labels: string[] = [];
  for (const el of [0, 30, 60]) {
    const r = (90 - el) * SKY_SCALE;
    rings.push(`<circle class="${el === 0 ? 'horizon' : 'ring'}" cx="${px(cx)}" cy="${px(cy)}" r="${px(r)}" stroke="${el === 0 ? INK.axis : '#b8b8b8'}" stroke-width="${el === 0 ? 1.2 : 0.8}" fill="none"/>`);
    labels.push(`<text x="${px(cx + 4)}" y="${px(cy + r - 4)}" font-size="11">${el}</text>`);
  }
  for (let az = 0; az < 360; az += 30) {
    const [x, y] = skyPoint(cx, cy, az, 90 - outer);
    grid.push(`M${px(cx)},${px(cy)}L${px(x)},${px(y)}`);
    const [lx, ly] = skyPoint(cx, cy, az, 90 - outer - 9);
    const name = { 0: 'N', 90: 'E', 180: 'S', 270: 'W' }[az as 0 | 90 | 180 | 270];
    labels.push(`<text x="${px(lx)}" y="${px(ly + 4)}" text-anchor="middle" font-size="11"${name ? ' font-weight="bold"' : ''}>${name ?? az}</text>`);
  }
  out.push(`<path d="${grid.join('')}" stroke="#b8b8b8" stroke-width="0.8" fill="none"/>`, ...rings);
  if (outer > 90) out.push(`<circle cx="${px(cx)}" cy="${px(cy)}" r="${px(R)}" stroke="${INK.axis}" stroke-width="1" fill="none"/>`);
  out.push(`<g>${labels.join('')}</g>`);
  out.push(`<text x="${px(cx)}" y="${px(cy + R + 30)}" text-anchor="middle" font-size="12">azimuth (deg from north), elevation (deg) rings</text>`);

  const traces: string[] = [];
  const marks: string[] = [];
  for (const p of passes) {
    const pts = (p.pointing ?? []).map((s) => skyPoint(cx, cy, s.azimuth, s.elevation));
    if (pts.length > 1) traces.push(`<path class="pass" d="${polylinePath(pts)}" stroke="${INK.main}" stroke-width="1.5" fill="none"/>`);
    const first = pts[0];
    const last = pts.at(-1);
    if (first) marks.push(glyph.square(first[0], first[1], 4, INK.accent, ' class="aos"'));
    marks.push(glyph.diamond(...skyPoint(cx, cy, p.azimuthTca, p.maxElevation), 5, INK.main, ' class="tca"'));
    if (last && pts.length > 1) marks.push(glyph.triangle(last[0], last[1], 4.5, INK.accent, ' class="los"'));
  }
  out.push(`<g class="passes">${traces.join('')}</g>`, `<g>${marks.join('')}</g>`);

  // The pass list.
  const lx = cx + R + 36;
  const rows = [`<text x="${px(lx)}" y="${top}" font-weight="bold" font-size="12">AOS (UTC)</text>`,
    `<text x="${px(lx + 136)}" y="${top}" font-weight="bold" font-size="12">LOS</text>`,
    `<text x="${px(WIDTH - 20)}" y="${top}" font-weight="bold" font-size="12" text-anchor="end">max el (deg)</text>`];
  passes.slice(0, LIST_ROWS).forEach((p, i) => {
    const y = top + 18 * (i + 1);
    rows.push(`<text x="${px(lx)}" y="${y}" font-size="12">${esc(hhmm(p.aos))}</text>`);
    rows.push(`<text x="${px(lx + 136)}" y="${y}" font-size="12">${esc(p.los.slice(11, 19))}</text>`);
    rows.push(`<text x="${px(WIDTH - 20)}" y="${y}" font-size="12" text-anchor="end">${esc(formatValue(p.maxElevation, 3))}</text>`);
  });
  if (passes.length === 0) rows.push(`<text x="${px(lx)}" y="${top + 18}" font-size="12">no pass in the window</text>`);
  if (passes.length > LIST_ROWS) rows.push(`<text x="${px(lx)}" y="${top + 18 * (LIST_ROWS + 1)}" font-size="12">and ${passes.length - LIST_ROWS} more</text>`);
  out.push(`<g>${rows.join('')}</g>`);
  return { height: top + 2 * R + 44, body: out.join('\n') };
}
