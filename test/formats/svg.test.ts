import { describe, expect, it } from 'vitest';
import { analyseCentralForce, type CentralForceAnalysis } from '../../src/solver/central/radial.js';
import type { PotentialTerm } from '../../src/solver/central/potential.js';
import { centralForceSvg, formatTick, formatValue } from '../../src/formats/svg/index.js';
import { splitAtAntimeridian } from '../../src/formats/svg/ground-track.js';
import { byClass, markerCentre, parseSvg, pathPoints } from '../helpers/svg.js';

function analysis(terms: PotentialTerm[], angularMomentum: number, energy: number, opts = {}): CentralForceAnalysis {
  const r = analyseCentralForce({ mass: 1, terms, angularMomentum, energy }, opts);
  if (!r.ok) throw new Error(r.message);
  return r.value;
}

// Invented demo potentials: a Kepler well; with an r^-3 core and a harmonic wall.
const kepler: PotentialTerm[] = [{ kind: 'power', coefficient: -1, exponent: -1 }];
const threeTerms: PotentialTerm[] = [...kepler, { kind: 'power', coefficient: -0.05, exponent: -3 }, { kind: 'power', coefficient: 0.5, exponent: 2 }];
const keplerCore: PotentialTerm[] = [...kepler, { kind: 'power', coefficient: -0.002, exponent: -3 }];

/** The plot box of the effective-potential panel (its clip rectangle). */
function plotBox(elements: ReturnType<typeof parseSvg>['elements']): { x: number; y: number; w: number; h: number } {
  const i = elements.findIndex((e) => e.tag === 'clipPath' && e.attrs.id === 'ueff-area');
  const r = elements[i + 1]!;
  return { x: Number(r.attrs.x), y: Number(r.attrs.y), w: Number(r.attrs.width), h: Number(r.attrs.height) };
}

const legendTexts = (svg: string): string[] => [...svg.matchAll(/<text x="28" y="4.5">([^<]*)<\/text>/g)].map((m) => m[1]!);

describe('centralForceSvg(terms, analysis, track, options)', () => {
  it('is deterministic and well-formed, with axis names in the caller\'s units, escaped', () => {
    const a = analysis(threeTerms, 1, 0.5);
    const svg = centralForceSvg(threeTerms, a, null, { title: 'Probe <A> & "B"', units: { radius: 'km', energy: 'J' } });
    expect(centralForceSvg(threeTerms, analysis(threeTerms, 1, 0.5), null, { title: 'Probe <A> & "B"', units: { radius: 'km', energy: 'J' } })).toBe(svg);
    parseSvg(svg);
    expect(svg).toContain('Probe &lt;A&gt; &amp; &quot;B&quot;');
    expect(svg).toContain('>r (km)</text>');
    expect(svg).toContain('>energy (J)</text>');
    expect(centralForceSvg(kepler, analysis(kepler, 1.2, -0.3), null)).toContain('>r (consistent units)</text>');
  });

  it('puts each turning point on the energy line, and the r range follows the motion', () => {
    // Kepler, l = 1.2, E = -0.3: bound between two turning points.
    const a = analysis(keplerCore, 1.2, -0.3);
    const { elements } = parseSvg(centralForceSvg(keplerCore, a, null));
    const box = plotBox(elements);
    const marks = byClass(elements, 'turning-point').map(markerCentre);
    expect(marks.length).toBe(2);
    const energy = pathPoints(byClass(elements, 'energy')[0]!.attrs.d!.replace('H', 'L0,'))[0]![0]!;
    for (const [, y] of marks) expect(Math.abs(y - energy[1])).toBeLessThan(0.02);
    // The motion fills the middle of the plot instead of a corner of it.
    const spread = Math.abs(marks[1]![0] - marks[0]![0]);
    expect(spread).toBeGreaterThan(0.5 * box.w);
    for (const [x] of marks) {
      expect(x).toBeGreaterThan(box.x + 0.05 * box.w);
      expect(x).toBeLessThan(box.x + 0.95 * box.w);
    }
  });

  it('lists in the legend only what is drawn', () => {
    // Kepler with an r^-3 core: an unstable circular orbit at a far higher energy than the motion.
    const a = analysis(keplerCore, 1.2, -0.3);
    expect(a.circularOrbits.some((c) => !c.stable)).toBe(true);
    const svg = centralForceSvg(keplerCore, a, null);
    const { elements } = parseSvg(svg);
    const legend = legendTexts(svg);
    expect(legend.includes('unstable circular orbit')).toBe(byClass(elements, 'unstable').length > 0);
    expect(legend.includes('stable circular orbit')).toBe(byClass(elements, 'stable').length > 0);
    expect(legend.includes('U(r)')).toBe(byClass(elements, 'u').length > 0);
    expect(legend.includes('turning point')).toBe(true);
    // Three terms: both kinds of circular orbit and U(r) are in view.
    const b = centralForceSvg(threeTerms, analysis(threeTerms, 1, 0.5), null);
    const be = parseSvg(b).elements;
    expect(byClass(be, 'unstable').length).toBe(1);
    expect(byClass(be, 'stable').length).toBe(1);
    expect(legendTexts(b)).toEqual(expect.arrayContaining(['U(r)', 'stable circular orbit', 'unstable circular orbit']));
  });

  it('draws U(r) as a curve, never as a lone steep stroke at the edge of the energy range', () => {
    const { elements } = parseSvg(centralForceSvg(threeTerms, analysis(threeTerms, 1, 0.5), null));
    const box = plotBox(elements);
    const pieces = byClass(elements, 'u').flatMap((e) => pathPoints(e.attrs.d!));
    const widest = Math.max(...pieces.map((p) => Math.max(...p.map((q) => q[0])) - Math.min(...p.map((q) => q[0]))));
    expect(widest).toBeGreaterThan(0.3 * box.w);
  });

  it('labels a logarithmic radius axis at 1, 2 and 5 per decade over a few decades', () => {
    // Kepler with E just below 0: turning points about 0.33 and 100 apart.
    const svg = centralForceSvg(kepler, analysis(kepler, 0.8, -0.01), null);
    parseSvg(svg);
    expect(svg).toContain('logarithmic');
    for (const label of ['0.5', '1', '2', '5', '10', '20', '50', '100']) expect(svg).toContain(`text-anchor="middle">${label}</text>`);
  });

  it('adds the path in the plane when a track is given: x = r cos(phi), y = r sin(phi) about the centre', () => {
    const a = analysis(kepler, 1.2, -0.3);
    const phi = Array.from({ length: 50 }, (_, i) => (i / 49) * 2 * Math.PI);
    const r = phi.map((f) => 1.44 / (1 + 0.3 * Math.cos(f))); // a conic, for the geometry only
    const { elements } = parseSvg(centralForceSvg(kepler, a, { r, phi, periapsis: a.periapsis, apoapsis: a.apoapsis }));
    const c = pathPoints(byClass(elements, 'centre')[0]!.attrs.d!.replace(/H[^M]*/, ''))[0]![0]!;
    const centre = [c[0] + 6, c[1]];
    const bound = byClass(elements, 'bound').map((e) => Number(e.attrs.r));
    const scale = bound[0]! / a.periapsis!;
    const pts = pathPoints(byClass(elements, 'path')[0]!.attrs.d!)[0]!;
    expect(pts.length).toBe(50);
    pts.forEach(([x, y], i) => {
      expect(Math.abs(x - (centre[0]! + r[i]! * Math.cos(phi[i]!) * scale))).toBeLessThan(0.02);
      expect(Math.abs(y - (centre[1]! - r[i]! * Math.sin(phi[i]!) * scale))).toBeLessThan(0.02);
    });
  });
});

describe('splitAtAntimeridian(samples)', () => {
  it('cuts at +-180 deg with the crossing latitude interpolated, and keeps every sample', () => {
    const pieces = splitAtAntimeridian([
      { latitudeDeg: 10, longitudeDeg: 170 },
      { latitudeDeg: 20, longitudeDeg: -170 },
      { latitudeDeg: 30, longitudeDeg: -150 },
    ]);
    expect(pieces).toEqual([[[170, 10], [180, 15]], [[-180, 15], [-170, 20], [-150, 30]]]);
    const west = splitAtAntimeridian([{ latitudeDeg: 0, longitudeDeg: -175 }, { latitudeDeg: -9, longitudeDeg: 170 }]);
    expect(west).toEqual([[[-175, 0], [-180, -3]], [[180, -3], [170, -9]]]);
  });
});

describe('number formatting', () => {
  it('formatTick uses the step\'s decimals in fixed range and mantissa-exponent outside it', () => {
    expect(formatTick(0.5, 0.5)).toBe('0.5');
    expect(formatTick(1, 0.5)).toBe('1.0');
    expect(formatTick(20, 10)).toBe('20');
    expect(formatTick(0, 0.2)).toBe('0');
    expect(formatTick(1e-17, 0.2)).toBe('0');
    expect(formatTick(5e10, 1e10)).toBe('5e10');
    expect(formatTick(1.5e-7, 5e-8)).toBe('1.5e-7');
    expect(formatTick(-2.5e-4, 5e-5)).toBe('-2.5e-4');
  });

  it('formatValue keeps six significant digits and drops trailing zeros', () => {
    expect(formatValue(0.5)).toBe('0.5');
    expect(formatValue(-1.23456789)).toBe('-1.23457');
    expect(formatValue(-2.6493e33)).toBe('-2.6493e33');
    expect(formatValue(1e-9)).toBe('1e-9');
    expect(formatValue(0)).toBe('0');
  });
});
