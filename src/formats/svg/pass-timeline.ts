// Timeline of a pass search: one row per station, one bar per pass from AOS to LOS with a tick at
// TCA, over a UTC time axis spanning the window.

import { esc, heading, INK, legendRow, type Panel, px, timeTicks, unixSeconds } from './common.js';

const WIDTH = 640;
const LEFT = 120;
const RIGHT = 20;
const ROW = 26;

export interface TimelinePass { readonly station: string; readonly aos: string; readonly tca: string; readonly los: string }

export interface TimelineRow {
  /** The row's label. */
  readonly label: string;
  readonly bars: readonly { readonly start: string; readonly stop: string; readonly mark?: string }[];
}

/**
 * A timeline panel: rows of bars over [start, stop] (ISO UTC), for the pass timeline; `barLabel` and `markLabel` name the bar and its tick in the legend.
 */
export function timelinePanel(title: string, window: { start: string; stop: string }, rows: readonly TimelineRow[], legend: { bar: string; mark?: string }): Panel {
  const t0 = unixSeconds(window.start);
  const t1 = unixSeconds(window.stop);
  const plotW = WIDTH - LEFT - RIGHT;
  const x = (iso: string): number => LEFT + (plotW * (unixSeconds(iso) - t0)) / (t1 - t0);
  const entries = [{ glyph: `<rect x="0" y="-6" width="22" height="12" fill="${INK.main}"/>`, label: legend.bar }];
  if (legend.mark) entries.push({ glyph: `<path d="M11,-8V8" stroke="${INK.accent}" stroke-width="2.5"/>`, label: legend.mark });
  const leg = legendRow(LEFT, 46, WIDTH - RIGHT, entries);
  const top = 46 + leg.height + 6;
  const height = Math.max(1, rows.length) * ROW;
  const out: string[] = [heading(LEFT, 26, title), leg.markup];
  const ticks = timeTicks(t0, t1, 7);
  const grid: string[] = [];
  const labels: string[] = [];
  for (const t of ticks.values) {
    const gx = LEFT + (plotW * (t - t0)) / (t1 - t0);
    grid.push(`M${px(gx)},${top}V${top + height}`);
    const anchor = gx > WIDTH - RIGHT - 30 ? 'end' : 'middle';
    labels.push(`<text x="${px(anchor === 'end' ? WIDTH - RIGHT : gx)}" y="${top + height + 16}" text-anchor="${anchor}">${esc(ticks.label(t))}</text>`);
  }
  rows.forEach((row, i) => {
    const y = top + i * ROW;
    if (i % 2 === 1) out.push(`<rect x="${LEFT}" y="${y}" width="${plotW}" height="${ROW}" fill="#f3f3f3"/>`);
    labels.push(`<text x="${LEFT - 8}" y="${y + ROW / 2 + 4}" text-anchor="end">${esc(row.label.length > 16 ? row.label.slice(0, 15) + '…' : row.label)}</text>`);
  });
  out.push(`<path d="${grid.join('')}" stroke="${INK.grid}" stroke-width="1" fill="none"/>`);
  const bars: string[] = [];
  rows.forEach((row, i) => {
    const y = top + i * ROW + 5;
    for (const b of row.bars) {
      const xa = x(b.start);
      const w = Math.max(1.5, x(b.stop) - xa);
      bars.push(`<rect class="bar" x="${px(xa)}" y="${y}" width="${px(w)}" height="${ROW - 10}" fill="${INK.main}"/>`);
      // The mark only where the bar is wide enough to be seen around it.
      if (b.mark && w >= 8) bars.push(`<path class="mark" d="M${px(x(b.mark))},${y - 3}v${ROW - 4}" stroke="${INK.accent}" stroke-width="2"/>`);
    }
  });
  out.push(`<g>${bars.join('')}</g>`);
  out.push(`<rect x="${LEFT}" y="${top}" width="${plotW}" height="${height}" stroke="${INK.axis}" stroke-width="1.2" fill="none"/>`);
  out.push(`<g font-size="12">${labels.join('')}</g>`);
  const day = (iso: string): string => iso.slice(0, 10);
  const span = day(window.start) === day(window.stop) ? day(window.start) : `${day(window.start)} to ${day(window.stop)}`;
  out.push(`<text x="${LEFT + plotW / 2}" y="${top + height + 36}" text-anchor="middle">time (UTC, ${esc(span)})</text>`);
  return { height: top + height + 50, body: out.join('\n') };
}

/** The passes of each station (in the order of `stations`) as timeline rows. */
export function passTimelinePanel(window: { start: string; stop: string }, stations: readonly string[], passes: readonly TimelinePass[]): Panel {
  const rows = stations.map((id) => ({
    label: id,
    bars: passes.filter((p) => p.station === id).map((p) => ({ start: p.aos, stop: p.los, mark: p.tca })),
  }));
  return timelinePanel('Passes over the window', window, rows, { bar: 'pass, AOS to LOS', mark: 'TCA' });
}
