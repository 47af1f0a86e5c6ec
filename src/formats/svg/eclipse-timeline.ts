// Timeline of sun and shadow over an eclipse-search window: one row per UTC day (time of day from
// 0 to 24 h across), sunlight left white, the penumbra a mid grey, the umbra near black, so the
// three stay apart in a grey-scale print; hours outside the window are hatched. With the Moon's
// shadow asked, each row holds a second, thinner lane for it below the Earth's.

import { esc, heading, INK, legendRow, type Panel, px, unixSeconds } from './common.js';

const WIDTH = 640;
const LEFT = 70;
const RIGHT = 20;
const ROW = 24;
const DAY_S = 86_400;
const PENUMBRA = '#9b9b9b';
const UMBRA = '#1b1f2a';
const OUTSIDE = '#ededed';

export interface TimelineEclipse {
  readonly start: string;
  readonly stop: string;
  readonly umbraStart: string | null;
  readonly umbraStop: string | null;
}

export interface EclipseTimelineInput {
  readonly window: { readonly start: string; readonly stop: string };
  readonly eclipses: readonly TimelineEclipse[];
  /** null: the Moon's shadow was not searched (no Moon lane). */
  readonly moonEclipses: readonly TimelineEclipse[] | null;
  /** deg: beta at the window start and its range, for the caption. */
  readonly beta: { readonly start: number; readonly min: number; readonly max: number };
}

/** The pieces of [a, b] (Unix s) cut at UTC midnights: [day index from the first day, seconds of day from, to]. */
function byDay(a: number, b: number, firstDay: number): Array<[number, number, number]> {
  const out: Array<[number, number, number]> = [];
  for (let t = a; t < b;) {
    const day = Math.floor(t / DAY_S);
    const end = Math.min(b, (day + 1) * DAY_S);
    out.push([day - firstDay, t - day * DAY_S, end - day * DAY_S]);
    t = end;
  }
  return out;
}

/** The timeline panel: rows per UTC day, bars of penumbra (class "penumbra") and umbra (class "umbra"), Moon lane bars with class "moon" too. */
export function eclipseTimelinePanel(input: EclipseTimelineInput): Panel {
  const t0 = unixSeconds(input.window.start);
  const t1 = unixSeconds(input.window.stop);
  const firstDay = Math.floor(t0 / DAY_S);
  const days = Math.max(1, Math.ceil(t1 / DAY_S) - firstDay);
  const plotW = WIDTH - LEFT - RIGHT;
  const x = (secondsOfDay: number): number => LEFT + (plotW * secondsOfDay) / DAY_S;
  const moonLane = input.moonEclipses !== null;
  const earthH = moonLane ? 12 : 16;
  const swatch = (fill: string) => `<rect x="0" y="-6" width="22" height="12" fill="${fill}" stroke="${INK.axis}" stroke-width="0.8"/>`;
  const entries = [
    { glyph: swatch('#ffffff'), label: 'sunlight' },
    { glyph: swatch(PENUMBRA), label: 'penumbra (Sun partly hidden)' },
    { glyph: swatch(UMBRA), label: 'umbra (Sun hidden)' },
    { glyph: `<rect x="0" y="-6" width="22" height="12" fill="url(#eclipse-outside)" stroke="${INK.axis}" stroke-width="0.8"/>`, label: 'outside the window' },
  ];
  const leg = legendRow(LEFT, 46, WIDTH - RIGHT, entries);
  const top = 46 + leg.height + 6;
  const height = days * ROW;
  const out: string[] = [
    `<defs><pattern id="eclipse-outside" width="6" height="6" patternUnits="userSpaceOnUse" patternTransform="rotate(45)"><rect width="6" height="6" fill="${OUTSIDE}"/><path d="M0,0V6" stroke="#c4c4c4" stroke-width="2"/></pattern></defs>`,
    heading(LEFT, 26, moonLane ? 'Sunlight and shadow (upper lane Earth, lower lane Moon)' : 'Sunlight and shadow of the Earth'),
    leg.markup,
  ];
  // Hours outside the window on the first and last day.
  const outside: string[] = [];
  const before = t0 - firstDay * DAY_S;
  if (before > 0) outside.push(`<rect x="${px(x(0))}" y="${top}" width="${px(x(before) - x(0))}" height="${ROW}" fill="url(#eclipse-outside)"/>`);
  const lastDay = firstDay + days - 1;
  const after = t1 - lastDay * DAY_S;
  if (after < DAY_S) outside.push(`<rect x="${px(x(after))}" y="${top + (days - 1) * ROW}" width="${px(x(DAY_S) - x(after))}" height="${ROW}" fill="url(#eclipse-outside)"/>`);
  out.push(outside.join(''));
  // Hour grid and labels.
  const grid: string[] = [];
  const labels: string[] = [];
  for (let h = 0; h <= 24; h += 3) {
    grid.push(`M${px(x(h * 3600))},${top}V${top + height}`);
    labels.push(`<text x="${px(x(h * 3600))}" y="${top + height + 16}" text-anchor="middle">${String(h).padStart(2, '0')}:00</text>`);
  }
  for (let d = 0; d < days; d++) {
    const iso = new Date((firstDay + d) * DAY_S * 1000).toISOString();
    labels.push(`<text x="${LEFT - 8}" y="${top + d * ROW + ROW / 2 + 4}" text-anchor="end">${esc(iso.slice(5, 10))}</text>`);
  }
  const bars: string[] = [];
  const lane = (list: readonly TimelineEclipse[], y0: number, h: number, extra: string): void => {
    for (const e of list) {
      const penumbra = byDay(unixSeconds(e.start), unixSeconds(e.stop), firstDay);
      for (const [d, a, b] of penumbra) {
        bars.push(`<rect class="penumbra${extra}" x="${px(x(a))}" y="${px(top + d * ROW + y0)}" width="${px(Math.max(1, x(b) - x(a)))}" height="${h}" fill="${PENUMBRA}"/>`);
      }
      if (e.umbraStart === null || e.umbraStop === null) continue;
      for (const [d, a, b] of byDay(unixSeconds(e.umbraStart), unixSeconds(e.umbraStop), firstDay)) {
        bars.push(`<rect class="umbra${extra}" x="${px(x(a))}" y="${px(top + d * ROW + y0)}" width="${px(Math.max(1, x(b) - x(a)))}" height="${h}" fill="${UMBRA}"/>`);
      }
    }
  };
  lane(input.eclipses, 4, earthH, '');
  if (input.moonEclipses) lane(input.moonEclipses, 4 + earthH + 1, ROW - 9 - earthH, ' moon');
  // The grid under the bars, the row lines over them (bars stay inside their rows).
  const rowLines: string[] = [];
  for (let d = 1; d < days; d++) rowLines.push(`M${LEFT},${top + d * ROW}H${LEFT + plotW}`);
  out.push(`<path d="${grid.join('')}" stroke="${INK.grid}" stroke-width="1" fill="none"/>`);
  out.push(`<g>${bars.join('')}</g>`);
  if (rowLines.length > 0) out.push(`<path d="${rowLines.join('')}" stroke="#bdbdbd" stroke-width="0.8" fill="none"/>`);
  out.push(`<rect x="${LEFT}" y="${top}" width="${plotW}" height="${height}" stroke="${INK.axis}" stroke-width="1.2" fill="none"/>`);
  out.push(`<g font-size="12">${labels.join('')}</g>`);
  out.push(`<text x="${LEFT + plotW / 2}" y="${top + height + 36}" text-anchor="middle">time of day (UTC, h); one row per day (month-day)</text>`);
  const longest = Math.max(0, ...input.eclipses.map((e) => (e.umbraStart && e.umbraStop ? unixSeconds(e.umbraStop) - unixSeconds(e.umbraStart) : 0)));
  const b = input.beta;
  const counts = `${input.eclipses.length} eclipse${input.eclipses.length === 1 ? '' : 's'} by the Earth` +
    (input.moonEclipses ? `, ${input.moonEclipses.length} by the Moon` : '') + `; longest umbra ${(longest / 60).toFixed(1)} min`;
  const beta = `beta angle ${b.start.toFixed(1)} deg at the window start, ${b.min.toFixed(1)} to ${b.max.toFixed(1)} deg over the window`;
  out.push(`<text x="${LEFT}" y="${top + height + 58}" font-size="12">${esc(counts)}</text>`);
  out.push(`<text x="${LEFT}" y="${top + height + 74}" font-size="12">${esc(beta)}</text>`);
  return { height: top + height + 86, body: out.join('\n') };
}
