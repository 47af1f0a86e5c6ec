// The orbit drawn in its own plane (perifocal axes: x toward periapsis, y along the motion at
// periapsis), to scale with the central body: periapsis, apoapsis, the line of nodes and the
// position at the epoch. Conic r = p / (1 + e cos nu) (Vallado, 4th ed., eq. 2-42 — from memory).

import { esc, formatValue, glyph, heading, INK, legendRow, type Panel, polylinePath, px } from './common.js';
import { planeFrame } from './plane.js';

const RAD_PER_DEG = Math.PI / 180;
const WIDTH = 640;
const SIZE = 440;
const SAMPLES = 721;
/** Closer than this (px) to an apsis marker, the position is drawn as a ring around it. */
const ON_APSIS_PX = 10;

export interface OrbitPlaneInput {
  /** The central body's name. */
  readonly bodyName: string;
  /** km; null when the body has no radius. */
  readonly bodyRadius: number | null;
  readonly orbitType: 'circular' | 'elliptic' | 'parabolic' | 'hyperbolic';
  readonly eccentricity: number;
  /** Semi-latus rectum p, km. */
  readonly semiLatusRectum: number;
  /** Degrees, as the API gives them. */
  readonly argPeriapsis: number;
  readonly trueAnomaly: number;
  readonly inclination: number;
  /** False when the orbit is equatorial: no line of nodes. */
  readonly raanDefined: boolean;
  readonly periapsisRadius: number;
  readonly apoapsisRadius: number | null;
}

/** Perifocal coordinates (km) of true anomaly nu (rad). */
export function perifocal(p: number, e: number, nu: number): [number, number] {
  const r = p / (1 + e * Math.cos(nu));
  return [r * Math.cos(nu), r * Math.sin(nu)];
}

/** The true-anomaly range drawn: the whole ellipse, or the part of an open conic within rMax of the focus. */
function anomalyLimit(o: OrbitPlaneInput, rNow: number): { limit: number; rMax: number } {
  if (o.eccentricity < 1) return { limit: Math.PI, rMax: o.apoapsisRadius ?? o.semiLatusRectum / (1 - o.eccentricity) };
  const rMax = Math.max(4 * o.periapsisRadius, 1.3 * rNow, 3 * (o.bodyRadius ?? 0));
  const cosNu = Math.min(1, Math.max(-1, (o.semiLatusRectum / rMax - 1) / o.eccentricity));
  return { limit: Math.acos(cosNu), rMax };
}

export function orbitPlanePanel(o: OrbitPlaneInput): Panel {
  const e = o.eccentricity;
  const p = o.semiLatusRectum;
  const nuNow = o.trueAnomaly * RAD_PER_DEG;
  const now = perifocal(p, e, nuNow);
  const rNow = Math.hypot(now[0], now[1]);
  const { limit } = anomalyLimit(o, rNow);
  const closed = e < 1;
  const path: [number, number][] = [];
  for (let i = 0; i < SAMPLES; i++) {
    const nu = closed ? -Math.PI + (2 * Math.PI * i) / (SAMPLES - 1) : -limit + (2 * limit * i) / (SAMPLES - 1);
    path.push(perifocal(p, e, nu));
  }
  const radius = o.bodyRadius ?? 0;
  const us = [...path.map((q) => q[0]), now[0], radius, -radius];
  const vs = [...path.map((q) => q[1]), now[1], radius, -radius];
  const pad = 0.06 * Math.max(Math.max(...us) - Math.min(...us), Math.max(...vs) - Math.min(...vs));
  const ext = { uMin: Math.min(...us) - pad, uMax: Math.max(...us) + pad, vMin: Math.min(...vs) - pad, vMax: Math.max(...vs) + pad };

  const showApsides = o.orbitType !== 'circular';
  // A position on an apsis (an orbit given at periapsis, the common case) would hide the apsis
  // marker under its dot: it is then drawn as a ring around the marker, and the legend says so.
  const scale = Math.min(SIZE / (ext.uMax - ext.uMin), SIZE / (ext.vMax - ext.vMin));
  const apsisPoints = showApsides ? [[o.periapsisRadius, 0], ...(o.apoapsisRadius !== null ? [[-o.apoapsisRadius, 0]] : [])] : [];
  const onApsis = apsisPoints.some(([u, v]) => Math.hypot(now[0] - u!, now[1] - v!) * scale < ON_APSIS_PX);
  const ring = (x: number, y: number, r: number, extra = ''): string =>
    `<circle${extra} cx="${px(x)}" cy="${px(y)}" r="${px(r)}" fill="none" stroke="${INK.main}" stroke-width="2"/>`;
  const entries = [
    { glyph: glyph.line(INK.main, 2.2), label: 'orbit' },
    ...(showApsides ? [{ glyph: glyph.diamond(11, 0, 6, INK.accent), label: 'periapsis' }] : []),
    ...(showApsides && o.apoapsisRadius !== null ? [{ glyph: glyph.square(11, 0, 5, INK.accent), label: 'apoapsis' }] : []),
    ...(o.raanDefined ? [{ glyph: glyph.line(INK.axis, 1.2, '8 3 2 3'), label: 'line of nodes' }] : []),
    onApsis
      ? { glyph: ring(11, 0, 6), label: 'position at epoch (ringed: on an apsis)' }
      : { glyph: glyph.dot(11, 0, 5, INK.main, '#ffffff'), label: 'position at epoch' },
  ];
  const legend = legendRow(84, 84, WIDTH - 20, entries);
  const top = 84 + legend.height + 8;
  const box = { left: 84 + (WIDTH - 104 - SIZE) / 2, top, width: SIZE, height: SIZE };
  const frame = planeFrame(box, ext, { u: 'x toward periapsis', v: 'y', unit: 'km' }, 'orbit-area');
  const X = (q: readonly [number, number]): number => frame.x(q[0]);
  const Y = (q: readonly [number, number]): number => frame.y(q[1]);

  const out: string[] = [heading(84, 26, `Orbit about ${o.bodyName.charAt(0).toUpperCase()}${o.bodyName.slice(1)}, in its plane`)];
  const apsides = `periapsis radius ${formatValue(o.periapsisRadius, 6)} km` + (o.apoapsisRadius !== null ? `, apoapsis radius ${formatValue(o.apoapsisRadius, 6)} km` : '');
  const caption = `${o.orbitType}, e = ${formatValue(e, 5)}, p = ${formatValue(p, 6)} km, i = ${formatValue(o.inclination, 5)} deg; drawn to scale`;
  out.push(`<text x="84" y="46" font-size="12">${esc(caption)}</text>`, `<text x="84" y="62" font-size="12">${esc(apsides)}</text>`);
  out.push(legend.markup, frame.markup);
  out.push('<g clip-path="url(#orbit-area)">');
  if (o.bodyRadius !== null) {
    out.push(`<circle class="body" cx="${px(frame.x(0))}" cy="${px(frame.y(0))}" r="${px(radius * frame.scale)}" fill="${INK.fill}" stroke="${INK.axis}" stroke-width="1"/>`);
  }
  if (o.raanDefined) {
    // The ascending node lies at argument of latitude 0, i.e. nu = -argPeriapsis.
    const nodeAngle = -o.argPeriapsis * RAD_PER_DEG;
    const far = 2 * Math.max(ext.uMax - ext.uMin, ext.vMax - ext.vMin);
    const a = [far * Math.cos(nodeAngle), far * Math.sin(nodeAngle)] as const;
    out.push(`<path class="line-of-nodes" d="M${px(frame.x(-a[0]))},${px(frame.y(-a[1]))}L${px(frame.x(a[0]))},${px(frame.y(a[1]))}" stroke="${INK.axis}" stroke-width="1.2" stroke-dasharray="8 3 2 3" fill="none"/>`);
  }
  out.push(`<path class="orbit" d="${polylinePath(path.map((q) => [X(q), Y(q)]))}${closed ? 'Z' : ''}" stroke="${INK.main}" stroke-width="2.2" fill="none"/>`);
  out.push('</g>');
  if (o.raanDefined) {
    // Label the ascending node where its ray leaves the orbit's neighbourhood.
    const nodeAngle = -o.argPeriapsis * RAD_PER_DEG;
    const rn = closed || Math.cos(nodeAngle) > -1 / e ? Math.min(p / (1 + e * Math.cos(nodeAngle)), 1e300) : NaN;
    if (Number.isFinite(rn)) {
      const q = [rn * 1.12 * Math.cos(nodeAngle), rn * 1.12 * Math.sin(nodeAngle)] as const;
      const c = Math.cos(nodeAngle);
      const anchor = c > 0.3 ? 'start' : c < -0.3 ? 'end' : 'middle';
      // Pulled back along the node's ray into the plot box, so the label never sits on the tick labels.
      const cx = frame.x(0);
      const cy = frame.y(0);
      const dx = X(q) - cx;
      const dy = Y(q) + (Math.sin(nodeAngle) < 0 ? 12 : -4) - cy;
      const room = (d: number, low: number, high: number, from: number) => (d === 0 ? 1 : Math.max(0, ((d > 0 ? high : low) - from) / d));
      const pull = Math.min(1, room(dx, box.left + 4, box.left + box.width - 4, cx), room(dy, box.top + 14, box.top + box.height - 6, cy));
      const x = cx + dx * pull;
      // Near a side of the box the text runs inward.
      const inward = x > box.left + box.width - 110 ? 'end' : x < box.left + 110 ? 'start' : anchor;
      out.push(`<text class="node-label" x="${px(x)}" y="${px(cy + dy * pull)}" font-size="12" text-anchor="${inward}">ascending node</text>`);
    }
  }
  const marks: string[] = [];
  if (o.bodyRadius === null) marks.push(`<path class="focus" d="M${px(frame.x(0) - 6)},${px(frame.y(0))}h12M${px(frame.x(0))},${px(frame.y(0) - 6)}v12" stroke="${INK.axis}" stroke-width="1.6"/>`);
  if (showApsides) {
    const peri = [o.periapsisRadius, 0] as const;
    marks.push(glyph.diamond(X(peri), Y(peri), 7, INK.accent, ' class="periapsis"'));
    if (o.apoapsisRadius !== null) {
      const apo = [-o.apoapsisRadius, 0] as const;
      marks.push(glyph.square(X(apo), Y(apo), 5.5, INK.accent, ' class="apoapsis"'));
    }
  }
  marks.push(onApsis ? ring(X(now), Y(now), 11, ' class="position"') : glyph.dot(X(now), Y(now), 5.5, INK.main, '#ffffff', ' class="position"'));
  out.push(`<g>${marks.join('')}</g>`);
  return { height: top + SIZE + 52, body: out.join('\n') };
}
