// An equal-aspect plot of a plane (an orbit in its plane): one scale for both axes, centred on the
// extent asked, with a labelled grid in the length unit. Used by the orbit and r(phi) plots.

import { esc, formatTick, INK, linearTicks, px } from './common.js';

export interface PlaneFrame {
  /** Pixels per length unit, the same on both axes. */
  readonly scale: number;
  readonly x: (u: number) => number;
  /** Up is +y. */
  readonly y: (v: number) => number;
  /** Grid, axes, tick labels and axis names. */
  readonly markup: string;
}

export interface PlaneBox { readonly left: number; readonly top: number; readonly width: number; readonly height: number }

/**
 * Fit [uMin, uMax] x [vMin, vMax] into the box with one scale, grid lines at round values, the axis
 * names `uName (unit)` below and `vName (unit)` at the left.
 */
export function planeFrame(box: PlaneBox, ext: { uMin: number; uMax: number; vMin: number; vMax: number }, names: { u: string; v: string; unit: string }, clipId: string): PlaneFrame {
  const uSpan = Math.max(ext.uMax - ext.uMin, 1e-300);
  const vSpan = Math.max(ext.vMax - ext.vMin, 1e-300);
  const scale = Math.min(box.width / uSpan, box.height / vSpan);
  const uMid = (ext.uMin + ext.uMax) / 2;
  const vMid = (ext.vMin + ext.vMax) / 2;
  const cx = box.left + box.width / 2;
  const cy = box.top + box.height / 2;
  const x = (u: number): number => cx + (u - uMid) * scale;
  const y = (v: number): number => cy - (v - vMid) * scale;
  // Visible ranges of the box in world units (wider than the extent along one axis).
  const u0 = uMid - box.width / 2 / scale;
  const u1 = uMid + box.width / 2 / scale;
  const v0 = vMid - box.height / 2 / scale;
  const v1 = vMid + box.height / 2 / scale;
  const count = Math.max(3, Math.round(Math.max(box.width, box.height) / 70));
  const step = linearTicks(Math.min(u0, v0), Math.max(u1, v1), count).step;
  const grid: string[] = [];
  const labels: string[] = [];
  const right = box.left + box.width;
  const bottom = box.top + box.height;
  for (let k = Math.ceil(u0 / step - 1e-9); k * step <= u1 + 1e-9 * step; k++) {
    const gx = x(k * step);
    grid.push(`M${px(gx)},${px(box.top)}V${px(bottom)}`);
    labels.push(`<text x="${px(gx)}" y="${px(bottom + 17)}" text-anchor="middle">${esc(formatTick(k * step, step))}</text>`);
  }
  for (let k = Math.ceil(v0 / step - 1e-9); k * step <= v1 + 1e-9 * step; k++) {
    const gy = y(k * step);
    grid.push(`M${px(box.left)},${px(gy)}H${px(right)}`);
    labels.push(`<text x="${px(box.left - 7)}" y="${px(gy + 4)}" text-anchor="end">${esc(formatTick(k * step, step))}</text>`);
  }
  const midY = px(box.top + box.height / 2);
  const markup = [
    `<defs><clipPath id="${clipId}"><rect x="${px(box.left)}" y="${px(box.top)}" width="${px(box.width)}" height="${px(box.height)}"/></clipPath></defs>`,
    `<path d="${grid.join('')}" stroke="${INK.grid}" stroke-width="1" fill="none"/>`,
    `<rect x="${px(box.left)}" y="${px(box.top)}" width="${px(box.width)}" height="${px(box.height)}" stroke="${INK.axis}" stroke-width="1.2" fill="none"/>`,
    `<g font-size="12">${labels.join('')}</g>`,
    `<text x="${px(box.left + box.width / 2)}" y="${px(bottom + 38)}" text-anchor="middle">${esc(names.u)} (${esc(names.unit)})</text>`,
    `<text x="${px(box.left - 58)}" y="${midY}" text-anchor="middle" transform="rotate(-90 ${px(box.left - 58)} ${midY})">${esc(names.v)} (${esc(names.unit)})</text>`,
  ].join('\n');
  return { scale, x, y, markup };
}
