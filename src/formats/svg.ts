// Standalone SVG plot of an effective-potential analysis: U_eff(r) with U(r) fainter, the energy
// level, turning points and circular orbits. Deterministic: same analysis, same bytes (fixed
// layout, fixed number formatting, no ids from counters or clocks).

import type { CentralForceAnalysis } from '../solver/central/radial.js';

export interface SvgPlotOptions {
  readonly title?: string;
  /** Shown after the axis names: one string for both axes, or one per axis; "consistent units" by default. */
  readonly units?: string | { readonly radius: string; readonly energy: string };
}

const WIDTH = 720;
const HEIGHT = 460;
const LEFT = 86;
const RIGHT = 24;
const TOP = 52;
const BOTTOM = 62;
const PLOT_W = WIDTH - LEFT - RIGHT;
const PLOT_H = HEIGHT - TOP - BOTTOM;
/** Curves are cut this many pixels outside the plot box (the clip path hides the rest). */
const CUT = 6;

const COLOURS = {
  uEff: '#1d3f6e',
  u: '#8fb0cc',
  energy: '#b5562b',
  circular: '#2b7a4b',
  grid: '#e4e7eb',
  axis: '#333333',
  text: '#222222',
};

const esc = (s: string): string =>
  s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;').replace(/'/g, '&#39;');
const px = (v: number): string => {
  const s = v.toFixed(2);
  return s === '-0.00' ? '0.00' : s;
};

/** Tick label: fixed notation between 1e-3 and 1e5, else mantissa-exponent; digits follow the tick step. */
export function formatTick(v: number, step: number): string {
  if (v === 0 || Math.abs(v) < Math.abs(step) * 1e-9) return '0';
  const a = Math.abs(v);
  if (a >= 1e-3 && a < 1e5) {
    const digits = Math.min(10, Math.max(0, -Math.floor(Math.log10(Math.abs(step)) + 1e-9)));
    return v.toFixed(digits);
  }
  const digits = Math.min(10, Math.max(0, Math.floor(Math.log10(a)) - Math.floor(Math.log10(Math.abs(step)) + 1e-9)));
  const [mant, exp] = v.toExponential(digits).split('e');
  const m = mant!.includes('.') ? mant!.replace(/\.?0+$/, '') : mant!;
  return `${m}e${exp!.replace('+', '')}`;
}

/** A value with up to six significant digits, trailing zeros dropped (fixed between 1e-3 and 1e5). */
export function formatValue(v: number): string {
  if (v === 0) return '0';
  const a = Math.abs(v);
  if (a >= 1e-3 && a < 1e5) return String(Number(v.toPrecision(6)));
  const [mant, exp] = v.toExponential(5).split('e');
  return `${mant!.replace(/\.?0+$/, '')}e${exp!.replace('+', '')}`;
}

/** Round step 1, 2 or 5 x 10^k near span / count. */
function niceStep(span: number, count: number): number {
  const raw = span / count;
  const p = 10 ** Math.floor(Math.log10(raw));
  const f = raw / p;
  return (f < 1.5 ? 1 : f < 3.5 ? 2 : f < 7.5 ? 5 : 10) * p;
}

function linearTicks(lo: number, hi: number, count: number): { values: number[]; step: number } {
  const step = niceStep(hi - lo, count);
  const values: number[] = [];
  for (let i = Math.ceil(lo / step - 1e-9); i * step <= hi + step * 1e-9; i++) values.push(i * step);
  return { values, step };
}

function logTicks(lo: number, hi: number): { values: number[]; step: number }[] {
  const out: { values: number[]; step: number }[] = [];
  const decades = Math.log10(hi / lo);
  const mult = decades > 6 ? [1] : decades > 2 ? [1] : [1, 2, 5];
  const skip = decades > 12 ? Math.ceil(decades / 8) : 1;
  for (let k = Math.floor(Math.log10(lo)); k <= Math.ceil(Math.log10(hi)); k++) {
    if (k % skip !== 0) continue;
    for (const m of mult) {
      const v = m * 10 ** k;
      if (v >= lo * (1 - 1e-12) && v <= hi * (1 + 1e-12)) out.push({ values: [v], step: 10 ** k });
    }
  }
  return out;
}

/** Pieces of the polyline through (x, y) that lie inside the band [top, bottom]; segments crossing it are cut at the band edge. */
function clippedPaths(points: readonly [number, number][], top: number, bottom: number): string[] {
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
    // Liang-Barsky clipping of the segment to top <= y <= bottom.
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

/**
 * Vertical range: the energy, the circular-orbit energies on the plot and, when below E, the far
 * end of U_eff; a deep inner well (r -> 0) is left to the clip. With margins.
 */
function energyRange(a: CentralForceAnalysis, rLo: number, rHi: number): [number, number] {
  const uEffs = a.effectivePotential.map((s) => s.uEff);
  const levels = [a.energy];
  for (const c of a.circularOrbits) if (c.radius >= rLo && c.radius <= rHi) levels.push(c.energy);
  const farEnd = uEffs[uEffs.length - 1]!;
  if (farEnd < a.energy) levels.push(farEnd);
  const lo = Math.min(...levels);
  const hi = Math.max(...levels);
  let span = hi - lo;
  if (!(span > 1e-9 * Math.max(Math.abs(lo), Math.abs(hi)))) {
    // One level only: use the spread of the middle half of the curve.
    const sorted = [...uEffs].sort((x, y) => x - y);
    const q = (f: number): number => sorted[Math.floor(f * (sorted.length - 1))]!;
    const spread = q(0.75) - q(0.25);
    span = spread > 0 ? spread : Math.abs(lo) > 0 ? Math.abs(lo) : 1;
  }
  return [lo - 0.25 * span, hi + 0.35 * span];
}

/** A standalone SVG document plotting the effective potential of an analysis. */
export function effectivePotentialSvg(analysis: CentralForceAnalysis, opts: SvgPlotOptions = {}): string {
  const units = opts.units ?? 'consistent units';
  const radiusUnits = typeof units === 'string' ? units : units.radius;
  const energyUnits = typeof units === 'string' ? units : units.energy;
  const title = opts.title ?? 'Effective potential';
  const samples = analysis.effectivePotential;
  if (samples.length < 2) throw new Error('effectivePotentialSvg needs at least two samples');
  const rLo = samples[0]!.r;
  const rHi = samples[samples.length - 1]!.r;
  const log = analysis.sampleSpacing === 'log';
  const [yLo, yHi] = energyRange(analysis, rLo, rHi);
  const sx = (r: number): number => LEFT + PLOT_W * (log ? Math.log(r / rLo) / Math.log(rHi / rLo) : (r - rLo) / (rHi - rLo));
  const sy = (u: number): number => TOP + PLOT_H * (1 - (u - yLo) / (yHi - yLo));
  const inX = (r: number): boolean => r >= rLo && r <= rHi;
  const inY = (u: number): boolean => u >= yLo && u <= yHi;

  const out: string[] = [];
  out.push(`<svg xmlns="http://www.w3.org/2000/svg" width="${WIDTH}" height="${HEIGHT}" viewBox="0 0 ${WIDTH} ${HEIGHT}" font-family="Helvetica, Arial, sans-serif" font-size="12" fill="${COLOURS.text}">`);
  out.push(`<title>${esc(title)}</title>`);
  out.push(`<defs><clipPath id="ueff-plot-area"><rect x="${LEFT}" y="${TOP}" width="${PLOT_W}" height="${PLOT_H}"/></clipPath></defs>`);
  out.push(`<rect x="0" y="0" width="${WIDTH}" height="${HEIGHT}" fill="#ffffff"/>`);
  out.push(`<text x="${LEFT}" y="${TOP - 22}" font-size="15" font-weight="bold">${esc(title)}</text>`);

  // Grid and ticks.
  const xTicks = log ? logTicks(rLo, rHi) : [linearTicks(rLo, rHi, 6)];
  const grid: string[] = [];
  const labels: string[] = [];
  for (const group of xTicks) {
    for (const v of group.values) {
      const x = px(sx(v));
      grid.push(`M${x},${TOP}V${TOP + PLOT_H}`);
      labels.push(`<text x="${x}" y="${TOP + PLOT_H + 18}" text-anchor="middle">${esc(formatTick(v, group.step))}</text>`);
    }
  }
  const yTicks = linearTicks(yLo, yHi, 6);
  for (const v of yTicks.values) {
    const y = px(sy(v));
    grid.push(`M${LEFT},${y}H${LEFT + PLOT_W}`);
    labels.push(`<text x="${LEFT - 8}" y="${y}" text-anchor="end" dominant-baseline="middle">${esc(formatTick(v, yTicks.step))}</text>`);
  }
  out.push(`<path d="${grid.join('')}" stroke="${COLOURS.grid}" stroke-width="1" fill="none"/>`);
  out.push(`<path d="M${LEFT},${TOP}V${TOP + PLOT_H}H${LEFT + PLOT_W}" stroke="${COLOURS.axis}" stroke-width="1.2" fill="none"/>`);
  out.push(`<g font-size="11">${labels.join('')}</g>`);
  out.push(`<text x="${LEFT + PLOT_W / 2}" y="${HEIGHT - 16}" text-anchor="middle">r (${esc(radiusUnits)})</text>`);
  out.push(`<text x="18" y="${TOP + PLOT_H / 2}" text-anchor="middle" transform="rotate(-90 18 ${TOP + PLOT_H / 2})">U_eff (${esc(energyUnits)})</text>`);

  // Curves, cut a little outside the plot box and clipped to it.
  const band: [number, number] = [TOP - CUT, TOP + PLOT_H + CUT];
  const curve = (pick: (s: (typeof samples)[number]) => number): string[] => clippedPaths(samples.map((s): [number, number] => [sx(s.r), sy(pick(s))]), ...band);
  out.push(`<g clip-path="url(#ueff-plot-area)" fill="none">`);
  for (const d of curve((s) => s.u)) out.push(`<path d="${d}" stroke="${COLOURS.u}" stroke-width="1.3" stroke-dasharray="6 4"/>`);
  for (const d of curve((s) => s.uEff)) out.push(`<path d="${d}" stroke="${COLOURS.uEff}" stroke-width="2.2" stroke-linejoin="round"/>`);
  if (inY(analysis.energy)) {
    const y = px(sy(analysis.energy));
    out.push(`<path d="M${LEFT},${y}H${LEFT + PLOT_W}" stroke="${COLOURS.energy}" stroke-width="1.5"/>`);
  }
  out.push('</g>');

  // Markers.
  const marks: string[] = [];
  if (inY(analysis.energy)) {
    for (const r of analysis.turningPoints) {
      if (!inX(r)) continue;
      const x = sx(r);
      const y = sy(analysis.energy);
      marks.push(`<path d="M${px(x)},${px(y - 6)}L${px(x + 5)},${px(y)}L${px(x)},${px(y + 6)}L${px(x - 5)},${px(y)}Z" fill="${COLOURS.energy}"/>`);
      marks.push(`<path d="M${px(x)},${px(y + 6)}V${TOP + PLOT_H}" stroke="${COLOURS.energy}" stroke-width="0.8" stroke-dasharray="2 3"/>`);
    }
    marks.push(`<text x="${LEFT + 6}" y="${px(sy(analysis.energy) - 6)}" text-anchor="start" fill="${COLOURS.energy}">E = ${esc(formatValue(analysis.energy))}</text>`);
  }
  for (const c of analysis.circularOrbits) {
    if (!inX(c.radius) || !inY(c.energy)) continue;
    marks.push(`<circle cx="${px(sx(c.radius))}" cy="${px(sy(c.energy))}" r="5" stroke="${COLOURS.circular}" stroke-width="1.8" fill="${c.stable ? COLOURS.circular : '#ffffff'}"/>`);
  }
  out.push(`<g>${marks.join('')}</g>`);

  // Legend.
  const lx = LEFT + PLOT_W - 168;
  const ly = TOP + 10;
  const entry = (i: number, glyph: string, text: string): string => `<g transform="translate(${lx + 10} ${ly + 14 + i * 17})">${glyph}<text x="30" y="4">${text}</text></g>`;
  out.push(`<g font-size="11"><rect x="${lx}" y="${ly}" width="160" height="112" fill="#ffffff" fill-opacity="0.92" stroke="#c9ced6"/>`);
  out.push(entry(0, `<path d="M0,0H22" stroke="${COLOURS.uEff}" stroke-width="2.2"/>`, 'U_eff(r)'));
  out.push(entry(1, `<path d="M0,0H22" stroke="${COLOURS.u}" stroke-width="1.3" stroke-dasharray="6 4"/>`, 'U(r)'));
  out.push(entry(2, `<path d="M0,0H22" stroke="${COLOURS.energy}" stroke-width="1.5"/>`, 'energy E'));
  out.push(entry(3, `<path d="M11,-6L16,0L11,6L6,0Z" fill="${COLOURS.energy}"/>`, 'turning point'));
  out.push(entry(4, `<circle cx="11" cy="0" r="5" stroke="${COLOURS.circular}" stroke-width="1.8" fill="${COLOURS.circular}"/>`, 'stable circular orbit'));
  out.push(entry(5, `<circle cx="11" cy="0" r="5" stroke="${COLOURS.circular}" stroke-width="1.8" fill="#ffffff"/>`, 'unstable circular orbit'));
  out.push('</g>');
  out.push('</svg>');
  return out.join('\n') + '\n';
}
