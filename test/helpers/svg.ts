// Reading the SVG answers back with a registry XML parser (fast-xml-parser), independently of the
// code that writes them: well-formedness, the viewBox, and elements by class with their geometry.
import { XMLParser, XMLValidator } from 'fast-xml-parser';
import { expect } from 'vitest';

export interface SvgElement { readonly tag: string; readonly attrs: Record<string, string> }

/** Asserts the text is well-formed XML whose root is an <svg> with a viewBox; returns every element. */
export function parseSvg(text: string): { viewBox: number[]; elements: SvgElement[] } {
  const valid = XMLValidator.validate(text);
  expect(valid, JSON.stringify(valid)).toBe(true);
  const doc = new XMLParser({ ignoreAttributes: false, attributeNamePrefix: '@', preserveOrder: true }).parse(text) as unknown[];
  const elements: SvgElement[] = [];
  const walk = (nodes: unknown[]): void => {
    for (const node of nodes as Record<string, unknown>[]) {
      const attrs = (node[':@'] ?? {}) as Record<string, string>;
      for (const [tag, children] of Object.entries(node)) {
        if (tag === ':@' || tag === '#text') continue;
        elements.push({ tag, attrs: Object.fromEntries(Object.entries(attrs).map(([k, v]) => [k.slice(1), String(v)])) });
        if (Array.isArray(children)) walk(children);
      }
    }
  };
  walk(doc);
  const root = elements.find((e) => e.tag === 'svg');
  expect(root, 'an <svg> root').toBeDefined();
  expect(root!.attrs.xmlns).toBe('http://www.w3.org/2000/svg');
  const viewBox = (root!.attrs.viewBox ?? '').split(/\s+/).map(Number);
  expect(viewBox.length).toBe(4);
  expect(viewBox[2]! > 0 && viewBox[3]! > 0).toBe(true);
  expect(text).not.toMatch(/NaN|Infinity|undefined/);
  return { viewBox, elements };
}

export const byClass = (elements: SvgElement[], cls: string): SvgElement[] => elements.filter((e) => (e.attrs.class ?? '').split(' ').includes(cls));

/** The vertices of path data made of M/L/Z commands with absolute coordinates, as subpaths. */
export function pathPoints(d: string): [number, number][][] {
  const subpaths: [number, number][][] = [];
  for (const m of d.matchAll(/([ML])(-?[\d.]+),(-?[\d.]+)/g)) {
    if (m[1] === 'M') subpaths.push([]);
    subpaths.at(-1)!.push([Number(m[2]), Number(m[3])]);
  }
  return subpaths;
}

/** The centre of a marker: a circle's centre, a rect's middle, or the mean of a closed path's vertices. */
export function markerCentre(e: SvgElement): [number, number] {
  if (e.tag === 'circle') return [Number(e.attrs.cx), Number(e.attrs.cy)];
  if (e.tag === 'rect') return [Number(e.attrs.x) + Number(e.attrs.width) / 2, Number(e.attrs.y) + Number(e.attrs.height) / 2];
  const pts = pathPoints(e.attrs.d!).flat();
  return [pts.reduce((s, p) => s + p[0], 0) / pts.length, pts.reduce((s, p) => s + p[1], 0) / pts.length];
}
