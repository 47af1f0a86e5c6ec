// The path of central-force motion in its plane, x = r cos(phi), y = r sin(phi), from the track
// r(t), phi(t): the centre, the start, and the circles r = periapsis and r = apoapsis that bound it.

import { glyph, heading, INK, legendRow, type Panel, polylinePath, px } from './common.js';
import { planeFrame } from './plane.js';

export interface RadialOrbitInput {
  readonly r: readonly number[];
  /** Polar angle, radians. */
  readonly phi: readonly number[];
  readonly periapsis: number | null;
  readonly apoapsis: number | null;
}

const WIDTH = 640;

export function radialOrbitPanel(track: RadialOrbitInput, opts: { title?: string; radiusUnit: string }): Panel {
  const finite = track.r.filter(Number.isFinite);
  const reach = Math.max(...finite, track.apoapsis ?? 0) * 1.08 || 1;
  const legend = legendRow(84, 46, WIDTH - 20, [
    { glyph: glyph.line(INK.main, 2), label: 'path r(phi)' },
    { glyph: glyph.square(11, 0, 5, INK.accent), label: 'start' },
    { glyph: glyph.triangle(11, 0, 6, INK.main), label: 'end' },
    { glyph: glyph.line(INK.second, 1.2, '4 3'), label: 'r = periapsis, apoapsis' },
  ]);
  const top = 46 + legend.height + 6;
  const size = 400;
  const frame = planeFrame({ left: 84 + (WIDTH - 104 - size) / 2, top, width: size, height: size }, { uMin: -reach, uMax: reach, vMin: -reach, vMax: reach }, { u: 'x', v: 'y', unit: opts.radiusUnit }, 'radial-area');
  const points = track.r.map((r, i): [number, number] => [frame.x(r * Math.cos(track.phi[i]!)), frame.y(r * Math.sin(track.phi[i]!))]);
  const out: string[] = [heading(84, 26, opts.title ?? 'Path in the plane of motion'), legend.markup, frame.markup];
  out.push('<g clip-path="url(#radial-area)" fill="none">');
  for (const bound of [track.periapsis, track.apoapsis]) {
    if (bound !== null && bound > 0) out.push(`<circle class="bound" cx="${px(frame.x(0))}" cy="${px(frame.y(0))}" r="${px(bound * frame.scale)}" stroke="${INK.second}" stroke-width="1.2" stroke-dasharray="4 3"/>`);
  }
  out.push(`<path class="path" d="${polylinePath(points)}" stroke="${INK.main}" stroke-width="2" stroke-linejoin="round"/>`);
  out.push('</g>');
  const c = [frame.x(0), frame.y(0)] as const;
  out.push(`<path class="centre" d="M${px(c[0] - 6)},${px(c[1])}H${px(c[0] + 6)}M${px(c[0])},${px(c[1] - 6)}V${px(c[1] + 6)}" stroke="${INK.axis}" stroke-width="1.6"/>`);
  const first = points[0];
  const last = points.at(-1);
  if (first) out.push(glyph.square(first[0], first[1], 5, INK.accent, ' class="start"'));
  if (last && points.length > 1) out.push(glyph.triangle(last[0], last[1], 6, INK.main, ' class="end"'));
  return { height: top + size + 52, body: out.join('\n') };
}
