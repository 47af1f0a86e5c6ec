// The effective-potential plot of a central-force analysis: U_eff(r), U(r) dashed where it falls in
// view, the energy level with the turning points, and the circular orbits (filled stable, hollow
// unstable). The r range follows the motion (turning points and circular orbits), not the sample
// range of the analysis, and the curves are evaluated afresh on that range.

import { effectivePotential, potential, type PotentialTerm } from '../../solver/central/potential.js';
import type { CentralForceAnalysis } from '../../solver/central/radial.js';
import { esc, formatTick, formatValue, glyph, heading, INK, legendRow, linearTicks, logTicks, type Panel, px } from './common.js';

export interface AxisUnits {
  readonly radius: string;
  readonly energy: string;
}

export interface EffectivePotentialOptions {
  readonly title?: string;
  /** Shown after the axis names: one string for both axes, or one per axis; "consistent units" by default. */
  readonly units?: string | AxisUnits;
}

export const PLOT_WIDTH = 640;
const LEFT = 84;
const RIGHT = 20;
const PLOT_W = PLOT_WIDTH - LEFT - RIGHT;
const PLOT_H = 300;
const CURVE_SAMPLES = 480;
/** Curves are cut this many pixels outside the plot box (the clip path hides the rest). */
const CUT = 4;

export function axisUnits(units: EffectivePotentialOptions['units']): AxisUnits {
  const u = units ?? 'consistent units';
  return typeof u === 'string' ? { radius: u, energy: u } : u;
}

/** The analysed region of motion as a finite interval: periapsis to apoapsis, with a stretch for open ends. */
export function motionRange(a: CentralForceAnalysis): { inner: number; outer: number } | null {
  const tps = a.turningPoints.filter((r) => Number.isFinite(r) && r > 0);
  let inner = a.periapsis;
  let outer = a.apoapsis;
  if (inner === null && outer === null) return null;
  if (inner === null) inner = outer! / 10; // captured: falls to the centre
  if (outer === null) outer = Math.max(inner * 4, ...tps.map((r) => r * 1.5)); // unbound: escapes
  return { inner, outer };
}

/** The radii worth seeing: the region of motion padded, with the turning points and circular orbits near it; log when > 30x. */
export function radiusRange(a: CentralForceAnalysis): { lo: number; hi: number; log: boolean } {
  const motion = motionRange(a);
  const samples = a.effectivePotential;
  if (motion === null) return { lo: samples[0]!.r, hi: samples.at(-1)!.r, log: a.sampleSpacing === 'log' };
  const near = [...a.turningPoints, ...a.circularOrbits.map((c) => c.radius)]
    .filter((r) => Number.isFinite(r) && r >= motion.inner / 3 && r <= motion.outer * 3);
  const lo = Math.min(motion.inner, ...near);
  const hi = Math.max(motion.outer, ...near);
  if (hi / lo > 30) return { lo: lo / 2, hi: hi * 2, log: true };
  if (hi / lo < 1.05) return { lo: lo * 0.5, hi: hi * 1.8, log: false };
  const pad = 0.3 * (hi - lo);
  return { lo: Math.max(lo - pad, lo * 0.25), hi: hi + pad, log: false };
}

/** Liang-Barsky pieces of the polyline that lie inside the band top <= y <= bottom. */
export function clippedPaths(points: readonly [number, number][], top: number, bottom: number): string[] {
  const paths: string[] = [];
  let current: [number, number][] = [];
  const flush = (): void => {
    if (current.length > 1) paths.push('M' + current.map(([x, y]) => `${px(x)},${px(y)}`).join('L'));
    current = [];
  };
  for (let i = 0; i + 1 < points.length; i++) {
    const [x0, y0] = points[i]!;
    const [x1, y1] = points[i + 1]!;
    if (!Number.isFinite(y0) || !Number.isFinite(y1)) {
      flush();
      continue;
    }
    let t0 = 0;
    let t1 = 1;
    const dy = y1 - y0;
    for (const [p, q] of [[-dy, y0 - top], [dy, bottom - y0]] as const) {
      if (p === 0) {
        if (q < 0) t0 = 2;
      } else {
        const t = q / p;
        if (p < 0) t0 = Math.max(t0, t);
        else t1 = Math.min(t1, t);
      }
    }
    if (t0 > t1) {
      flush();
      continue;
    }
    const a: [number, number] = [x0 + (x1 - x0) * t0, y0 + dy * t0];
    const b: [number, number] = [x0 + (x1 - x0) * t1, y0 + dy * t1];
    if (t0 > 0) flush();
    if (current.length === 0) current.push(a);
    current.push(b);
    if (t1 < 1) flush();
  }
  flush();
  return paths;
}

/** The plot as a panel (for stacking); `effectivePotentialSvg` wraps it in a document. */
export function effectivePotentialPanel(terms: readonly PotentialTerm[], a: CentralForceAnalysis, opts: EffectivePotentialOptions = {}): Panel {
  const units = axisUnits(opts.units);
  const title = opts.title ?? 'Effective potential';
  const system = { terms, mass: a.mass, angularMomentum: a.angularMomentum };
  const { lo: rLo, hi: rHi, log } = radiusRange(a);
  const rs = Array.from({ length: CURVE_SAMPLES }, (_, i) => {
    const f = i / (CURVE_SAMPLES - 1);
    return log ? rLo * (rHi / rLo) ** f : rLo + (rHi - rLo) * f;
  });
  const uEff = rs.map((r) => effectivePotential(system, r).value);
  const u = rs.map((r) => potential(terms, r).value);

  // Energy range: E and the bottom of U_eff over the region of motion (or the ends of the view when it
  // is open), then room above E for the walls; circular orbits far off that scale are left to the clip.
  const motion = motionRange(a) ?? { inner: rLo, outer: rHi };
  const inMotion = uEff.filter((v, i) => Number.isFinite(v) && rs[i]! >= motion.inner && rs[i]! <= motion.outer);
  const finite = uEff.filter(Number.isFinite);
  const levels = [a.energy, ...(inMotion.length ? inMotion : finite)];
  let yLo = Math.min(...levels);
  let yHi = Math.max(a.energy, Math.min(...levels) + 1e-300);
  let span = yHi - yLo;
  if (!(span > 1e-9 * Math.max(Math.abs(yLo), Math.abs(yHi)))) {
    const sorted = [...finite].sort((x, y) => x - y);
    span = sorted[Math.floor(0.75 * (sorted.length - 1))]! - sorted[Math.floor(0.25 * (sorted.length - 1))]!;
    if (!(span > 0)) span = Math.abs(yLo) > 0 ? Math.abs(yLo) : 1;
  }
  for (const c of a.circularOrbits) {
    if (c.radius >= rLo && c.radius <= rHi && Math.abs(c.energy - a.energy) <= 2 * span) {
      yLo = Math.min(yLo, c.energy);
      yHi = Math.max(yHi, c.energy);
    }
  }
  span = Math.max(span, yHi - yLo);
  yLo -= 0.2 * span;
  yHi += 0.5 * span;
  const circular = a.circularOrbits.filter((c) => c.radius >= rLo && c.radius <= rHi && c.energy >= yLo && c.energy <= yHi);

  const legendEntries = [{ glyph: glyph.line(INK.main, 2.4), label: 'U_eff(r)' }];
  const sx = (r: number): number => LEFT + PLOT_W * (log ? Math.log(r / rLo) / Math.log(rHi / rLo) : (r - rLo) / (rHi - rLo));
  const uInBand = u.some((v) => v >= yLo && v <= yHi);
  if (uInBand) legendEntries.push({ glyph: glyph.line(INK.second, 1.6, '7 4'), label: 'U(r)' });
  legendEntries.push({ glyph: glyph.line(INK.accent, 1.6), label: 'energy E' });
  const turning = a.turningPoints.filter((r) => r >= rLo && r <= rHi);
  if (turning.length > 0) legendEntries.push({ glyph: glyph.diamond(11, 0, 6, INK.accent), label: 'turning point' });
  if (circular.some((c) => c.stable)) legendEntries.push({ glyph: glyph.dot(11, 0, 5, INK.main), label: 'stable circular orbit' });
  if (circular.some((c) => !c.stable)) legendEntries.push({ glyph: glyph.dot(11, 0, 5, '#ffffff', INK.main), label: 'unstable circular orbit' });
  const legend = legendRow(LEFT, 46, PLOT_WIDTH - RIGHT, legendEntries);
  const plotTop = 46 + legend.height + 6;
  const sy = (v: number): number => plotTop + PLOT_H * (1 - (v - yLo) / (yHi - yLo));

  const out: string[] = [];
  out.push(heading(LEFT, 26, title));
  out.push(legend.markup);
  out.push(`<defs><clipPath id="ueff-area"><rect x="${LEFT}" y="${px(plotTop)}" width="${PLOT_W}" height="${PLOT_H}"/></clipPath></defs>`);

  const grid: string[] = [];
  const labels: string[] = [];
  const xLabel = (r: number, step: number): void => {
    labels.push(`<text x="${px(sx(r))}" y="${px(plotTop + PLOT_H + 18)}" text-anchor="middle">${esc(formatTick(r, step))}</text>`);
  };
  if (log) {
    const t = logTicks(rLo, rHi);
    for (const { value, step } of t.labelled) {
      grid.push(`M${px(sx(value))},${px(plotTop)}V${px(plotTop + PLOT_H)}`);
      xLabel(value, step);
    }
    const minor = t.minor.map((v) => `M${px(sx(v))},${px(plotTop)}V${px(plotTop + PLOT_H)}`).join('');
    if (minor) out.push(`<path d="${minor}" stroke="${INK.grid}" stroke-width="0.6" fill="none"/>`);
  } else {
    const t = linearTicks(rLo, rHi, 7);
    for (const v of t.values) {
      grid.push(`M${px(sx(v))},${px(plotTop)}V${px(plotTop + PLOT_H)}`);
      xLabel(v, t.step);
    }
  }
  const yt = linearTicks(yLo, yHi, 6);
  for (const v of yt.values) {
    grid.push(`M${LEFT},${px(sy(v))}H${LEFT + PLOT_W}`);
    labels.push(`<text x="${LEFT - 8}" y="${px(sy(v) + 4)}" text-anchor="end">${esc(formatTick(v, yt.step))}</text>`);
  }
  out.push(`<path d="${grid.join('')}" stroke="${INK.grid}" stroke-width="1" fill="none"/>`);
  out.push(`<path d="M${LEFT},${px(plotTop)}V${px(plotTop + PLOT_H)}H${LEFT + PLOT_W}" stroke="${INK.axis}" stroke-width="1.2" fill="none"/>`);
  out.push(`<g font-size="12">${labels.join('')}</g>`);
  out.push(`<text x="${LEFT + PLOT_W / 2}" y="${px(plotTop + PLOT_H + 40)}" text-anchor="middle">r (${esc(units.radius)})${log ? ', logarithmic' : ''}</text>`);
  const yMid = px(plotTop + PLOT_H / 2);
  out.push(`<text x="18" y="${yMid}" text-anchor="middle" transform="rotate(-90 18 ${yMid})">energy (${esc(units.energy)})</text>`);

  const band: [number, number] = [plotTop - CUT, plotTop + PLOT_H + CUT];
  const curve = (values: number[]): string[] => clippedPaths(rs.map((r, i): [number, number] => [sx(r), sy(values[i]!)]), ...band);
  out.push('<g clip-path="url(#ueff-area)" fill="none">');
  if (uInBand) for (const d of curve(u)) out.push(`<path class="u" d="${d}" stroke="${INK.second}" stroke-width="1.6" stroke-dasharray="7 4"/>`);
  for (const d of curve(uEff)) out.push(`<path class="u-eff" d="${d}" stroke="${INK.main}" stroke-width="2.4" stroke-linejoin="round"/>`);
  const yE = sy(a.energy);
  out.push(`<path class="energy" d="M${LEFT},${px(yE)}H${LEFT + PLOT_W}" stroke="${INK.accent}" stroke-width="1.6"/>`);
  out.push('</g>');

  const marks: string[] = [];
  for (const r of turning) {
    marks.push(`<path d="M${px(sx(r))},${px(yE + 6)}V${px(plotTop + PLOT_H)}" stroke="${INK.accent}" stroke-width="0.9" stroke-dasharray="2 3"/>`);
    marks.push(glyph.diamond(sx(r), yE, 7, INK.accent, ' class="turning-point"'));
  }
  // The level's label at the right end, else the left, else the middle: away from the turning points.
  const clear = (x: number): boolean => turning.every((r) => Math.abs(sx(r) - x) > 70);
  const [ex, anchor] = clear(LEFT + PLOT_W - 30) ? [LEFT + PLOT_W - 6, 'end'] : clear(LEFT + 30) ? [LEFT + 6, 'start'] : [LEFT + PLOT_W / 2, 'middle'];
  marks.push(`<text x="${px(ex)}" y="${px(yE - 7)}" text-anchor="${anchor}" fill="${INK.accent}">E = ${esc(formatValue(a.energy))}</text>`);
  if (!uInBand) marks.push(`<text x="${LEFT + PLOT_W - 6}" y="${px(plotTop + PLOT_H - 8)}" text-anchor="end" font-size="12" fill="${INK.axis}">U(r) lies off this energy range</text>`);
  for (const c of circular) {
    marks.push(glyph.dot(sx(c.radius), sy(c.energy), 5.5, c.stable ? INK.main : '#ffffff', INK.main, ` class="circular-orbit ${c.stable ? 'stable' : 'unstable'}"`));
  }
  out.push(`<g>${marks.join('')}</g>`);
  return { height: plotTop + PLOT_H + 56, body: out.join('\n') };
}
