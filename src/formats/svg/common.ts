// Pieces shared by the SVG plots: escaping, fixed number formatting, ticks, the document frame and
// the palette. Every plot is deterministic: same numbers, same bytes (fixed layout and formatting,
// ids derived from the plot's name, never from counters or clocks).

export const SVG_MEDIA_TYPE = 'image/svg+xml; charset=utf-8';

/**
 * The palette: hues far apart in lightness so that a grey-scale print keeps them apart, with a line
 * style or a marker shape beside every colour so that nothing depends on hue alone.
 */
export const INK = {
  text: '#1a1a1a',
  axis: '#333333',
  grid: '#e2e2e2',
  /** The main curve or trace: near black. */
  main: '#14315a',
  /** A second quantity: mid grey-blue, drawn dashed. */
  second: '#7f9bb8',
  /** Levels and markers of events: a mid orange-brown. */
  accent: '#b4561c',
  /** Light fills (a body, a mask, bars' backgrounds). */
  fill: '#d9dee5',
  /** Dark fills (land on the map is light; water is white). */
  land: '#d5d5cf',
  coast: '#8c8c84',
} as const;

export const FONT = 'font-family="Helvetica, Arial, sans-serif"';

export const esc = (s: string): string =>
  s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;').replace(/'/g, '&#39;');

/** A coordinate with two decimals; never "-0.00". */
export const px = (v: number): string => {
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
export function formatValue(v: number, digits = 6): string {
  if (v === 0) return '0';
  const a = Math.abs(v);
  if (a >= 1e-3 && a < 1e5) return String(Number(v.toPrecision(digits)));
  const [mant, exp] = v.toExponential(digits - 1).split('e');
  return `${mant!.replace(/\.?0+$/, '')}e${exp!.replace('+', '')}`;
}

/** Round step 1, 2 or 5 x 10^k near span / count. */
export function niceStep(span: number, count: number): number {
  const raw = span / count;
  const p = 10 ** Math.floor(Math.log10(raw));
  const f = raw / p;
  return (f < 1.5 ? 1 : f < 3.5 ? 2 : f < 7.5 ? 5 : 10) * p;
}

export interface Ticks { readonly values: number[]; readonly step: number }

export function linearTicks(lo: number, hi: number, count: number): Ticks {
  const step = niceStep(hi - lo, count);
  const values: number[] = [];
  for (let i = Math.ceil(lo / step - 1e-9); i * step <= hi + step * 1e-9; i++) values.push(i * step);
  return { values, step };
}

/**
 * Ticks of a logarithmic axis: labelled at 1, 2 and 5 per decade up to four decades, at 1 and 3 up to
 * eight, at every decade up to twelve, every few decades beyond; unlabelled grid lines at 2..9 while decades <= 6.
 */
export function logTicks(lo: number, hi: number): { labelled: { value: number; step: number }[]; minor: number[] } {
  const decades = Math.log10(hi / lo);
  const mult = decades <= 4 ? [1, 2, 5] : decades <= 8 ? [1, 3] : [1];
  const skip = decades > 12 ? Math.ceil(decades / 8) : 1;
  const labelled: { value: number; step: number }[] = [];
  const minor: number[] = [];
  const inside = (v: number): boolean => v >= lo * (1 - 1e-12) && v <= hi * (1 + 1e-12);
  for (let k = Math.floor(Math.log10(lo)); k <= Math.ceil(Math.log10(hi)); k++) {
    for (let m = 1; m <= 9; m++) {
      const v = m * 10 ** k;
      if (!inside(v)) continue;
      if (mult.includes(m) && (m !== 1 || k % skip === 0)) labelled.push({ value: v, step: 10 ** k });
      else if (decades <= 6) minor.push(v);
    }
  }
  return { labelled, minor };
}

/** The opening of a standalone document: size, viewBox, title (for screen readers too) and a white ground. */
export function openDocument(width: number, height: number, title: string): string {
  return `<svg xmlns="http://www.w3.org/2000/svg" width="${width}" height="${height}" viewBox="0 0 ${width} ${height}" ${FONT} font-size="13" fill="${INK.text}">\n` +
    `<title>${esc(title)}</title>\n<rect x="0" y="0" width="${width}" height="${height}" fill="#ffffff"/>`;
}

/** A plot title at the top left. */
export const heading = (x: number, y: number, text: string): string => `<text x="${px(x)}" y="${px(y)}" font-size="16" font-weight="bold">${esc(text)}</text>`;

/** A part of a document to stack with others: its height and its markup drawn from y = 0. */
export interface Panel { readonly height: number; readonly body: string }

/** Panels one under the other in one document of the given width. */
export function stackPanels(width: number, title: string, panels: readonly Panel[]): string {
  let y = 0;
  const parts: string[] = [];
  for (const p of panels) {
    parts.push(`<g transform="translate(0 ${px(y)})">\n${p.body}\n</g>`);
    y += p.height;
  }
  return `${openDocument(width, Math.ceil(y), title)}\n${parts.join('\n')}\n</svg>\n`;
}

/** A legend row: glyph + label pairs laid left to right from (x, y), wrapping at maxX. */
export function legendRow(x: number, y: number, maxX: number, entries: readonly { glyph: string; label: string }[]): { markup: string; height: number } {
  const out: string[] = [];
  let cx = x;
  let cy = y;
  for (const e of entries) {
    const w = 34 + 6.3 * e.label.length;
    if (cx + w > maxX && cx > x) {
      cx = x;
      cy += 20;
    }
    out.push(`<g transform="translate(${px(cx)} ${px(cy)})">${e.glyph}<text x="28" y="4.5">${esc(e.label)}</text></g>`);
    cx += w + 12;
  }
  return { markup: `<g font-size="12">${out.join('')}</g>`, height: cy - y + 20 };
}

/** Glyphs for legends and markers, centred on (0, 0). */
export const glyph = {
  line: (stroke: string, width: number, dash?: string): string =>
    `<path d="M0,0H22" stroke="${stroke}" stroke-width="${width}"${dash ? ` stroke-dasharray="${dash}"` : ''} fill="none"/>`,
  diamond: (x: number, y: number, size: number, fill: string, extra = ''): string =>
    `<path${extra} d="M${px(x)},${px(y - size)}L${px(x + size * 0.85)},${px(y)}L${px(x)},${px(y + size)}L${px(x - size * 0.85)},${px(y)}Z" fill="${fill}" stroke="#ffffff" stroke-width="0.8"/>`,
  square: (x: number, y: number, size: number, fill: string, extra = ''): string =>
    `<rect${extra} x="${px(x - size)}" y="${px(y - size)}" width="${px(2 * size)}" height="${px(2 * size)}" fill="${fill}" stroke="#ffffff" stroke-width="0.8"/>`,
  triangle: (x: number, y: number, size: number, fill: string, extra = ''): string =>
    `<path${extra} d="M${px(x)},${px(y - size)}L${px(x + size)},${px(y + size * 0.8)}L${px(x - size)},${px(y + size * 0.8)}Z" fill="${fill}" stroke="#ffffff" stroke-width="0.8"/>`,
  dot: (x: number, y: number, r: number, fill: string, stroke = fill, extra = ''): string =>
    `<circle${extra} cx="${px(x)}" cy="${px(y)}" r="${px(r)}" fill="${fill}" stroke="${stroke}" stroke-width="1.6"/>`,
};

/** Path data of a polyline, broken where a point is not finite. */
export function polylinePath(points: readonly (readonly [number, number])[]): string {
  let d = '';
  let pen = false;
  for (const [x, y] of points) {
    if (!Number.isFinite(x) || !Number.isFinite(y)) {
      pen = false;
      continue;
    }
    d += `${pen ? 'L' : 'M'}${px(x)},${px(y)}`;
    pen = true;
  }
  return d;
}

const MS_PER_S = 1000;

/** UTC time axis ticks over [t0, t1] (Unix seconds): a round step from 1 min to 1 day, at most `count` labels. */
export function timeTicks(t0: number, t1: number, count: number): { values: number[]; label: (t: number) => string } {
  const steps = [60, 120, 300, 600, 900, 1800, 3600, 7200, 10_800, 21_600, 43_200, 86_400, 172_800];
  const span = t1 - t0;
  const step = steps.find((s) => span / s <= count) ?? 86_400 * Math.ceil(span / count / 86_400);
  const values: number[] = [];
  for (let t = Math.ceil(t0 / step) * step; t <= t1; t += step) values.push(t);
  const label = (t: number): string => {
    const iso = new Date(t * MS_PER_S).toISOString();
    if (step >= 86_400) return iso.slice(5, 10);
    return iso.slice(11, 16) === '00:00' ? `${iso.slice(5, 10)} 00:00` : iso.slice(11, 16);
  };
  return { values, label };
}

/** Unix seconds of an ISO 8601 UTC epoch string (plot positions only; leap seconds do not matter at this scale). */
export const unixSeconds = (iso: string): number => Date.parse(iso) / MS_PER_S;
