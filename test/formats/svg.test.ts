import { describe, expect, it } from 'vitest';
import { analyseCentralForce, type CentralForceAnalysis } from '../../src/solver/central/radial.js';
import { effectivePotentialSvg, formatTick, formatValue } from '../../src/formats/svg.js';
import type { PotentialTerm } from '../../src/solver/central/potential.js';

function analysis(terms: PotentialTerm[], angularMomentum: number, energy: number): CentralForceAnalysis {
  const r = analyseCentralForce({ mass: 1, terms, angularMomentum, energy });
  if (!r.ok) throw new Error(r.message);
  return r.value;
}

// Invented demo potential: Kepler-like well, an r^-3 core and a harmonic wall.
const threeTerms: PotentialTerm[] = [
  { kind: 'power', coefficient: -1, exponent: -1 },
  { kind: 'power', coefficient: -0.05, exponent: -3 },
  { kind: 'power', coefficient: 0.5, exponent: 2 },
];

/** Every number in the path data of the curve paths (the ones inside the clip group). */
function curveYs(svg: string): number[] {
  const group = svg.slice(svg.indexOf('<g clip-path'), svg.indexOf('</g>', svg.indexOf('<g clip-path')));
  const ys: number[] = [];
  for (const m of group.matchAll(/d="([^"]+)"/g)) {
    for (const pair of m[1]!.matchAll(/(-?\d+\.\d+),(-?\d+\.\d+)/g)) ys.push(Number(pair[2]));
  }
  return ys;
}

describe('effectivePotentialSvg(analysis, options)', () => {
  const a = analysis(threeTerms, 1, 0.5);

  it('is deterministic: the same analysis gives the same bytes', () => {
    const again = analysis(threeTerms, 1, 0.5);
    expect(effectivePotentialSvg(again, { title: 'x' })).toBe(effectivePotentialSvg(a, { title: 'x' }));
  });

  it('is a standalone SVG document with axis labels in the default units and no stray values', () => {
    const svg = effectivePotentialSvg(a);
    expect(svg.startsWith('<svg xmlns="http://www.w3.org/2000/svg"')).toBe(true);
    expect(svg.trimEnd().endsWith('</svg>')).toBe(true);
    expect(svg).toContain('>r (consistent units)</text>');
    expect(svg).toContain('>U_eff (consistent units)</text>');
    expect(svg).not.toMatch(/NaN|Infinity|undefined/);
    const opens = (svg.match(/<g[ >]/g) ?? []).length;
    expect((svg.match(/<\/g>/g) ?? []).length).toBe(opens);
  });

  it('escapes the title and shows the caller\'s units, one string or one per axis', () => {
    const svg = effectivePotentialSvg(a, { title: 'Probe <A> & "B"', units: 'km, km^2/s^2' });
    expect(svg).toContain('Probe &lt;A&gt; &amp; &quot;B&quot;');
    expect(svg).not.toContain('<A>');
    expect(svg).toContain('>r (km, km^2/s^2)</text>');
    const split = effectivePotentialSvg(a, { units: { radius: 'km', energy: 'J' } });
    expect(split).toContain('>r (km)</text>');
    expect(split).toContain('>U_eff (J)</text>');
  });

  it('marks every turning point on the energy line and fills stable, hollows unstable circular orbits', () => {
    const svg = effectivePotentialSvg(a);
    const lo = a.effectivePotential[0]!.r;
    const hi = a.effectivePotential.at(-1)!.r;
    const shown = a.turningPoints.filter((r) => r >= lo && r <= hi).length;
    expect(shown).toBe(3);
    // Diamonds in the marker group (the legend has one more).
    expect((svg.match(/<path d="M[\d.]+,[\d.]+L[\d.]+,[\d.]+L[\d.]+,[\d.]+L[\d.]+,[\d.]+Z" fill="#b5562b"\/>/g) ?? []).length).toBe(shown);
    const circles = [...svg.matchAll(/<circle cx="([\d.]+)" cy="([\d.]+)" r="5"[^>]*fill="(#[0-9a-f]+)"/g)].filter((m) => Number(m[1]) > 100);
    const stable = a.circularOrbits.filter((c) => c.stable).length;
    const unstable = a.circularOrbits.length - stable;
    expect(circles.filter((m) => m[3] !== '#ffffff').length).toBe(stable);
    expect(circles.filter((m) => m[3] === '#ffffff').length).toBe(unstable);
  });

  it('clips the curves where U_eff runs far off scale near r -> 0', () => {
    // r^-3 core: U_eff -> -infinity at the centre.
    const svg = effectivePotentialSvg(analysis(threeTerms, 1, 0.5));
    const ys = curveYs(svg);
    expect(ys.length).toBeGreaterThan(100);
    expect(ys.some((y) => Math.abs(y - (460 - 62 + 6)) < 1e-9), 'a curve is cut at the lower edge').toBe(true);
    for (const y of ys) {
      expect(y).toBeGreaterThanOrEqual(52 - 6 - 1e-9);
      expect(y).toBeLessThanOrEqual(460 - 62 + 6 + 1e-9);
    }
    // Kepler: U_eff -> +infinity at the centre.
    const kepler = effectivePotentialSvg(analysis([{ kind: 'power', coefficient: -1, exponent: -1 }], 0.8, -0.3));
    const keplerYs = curveYs(kepler);
    for (const y of keplerYs) expect(y).toBeGreaterThanOrEqual(46 - 1e-9);
    expect(keplerYs.some((y) => Math.abs(y - 46) < 1e-9), 'a curve is cut at the upper edge').toBe(true);
  });

  it('labels a logarithmic radius axis at powers of ten when the samples are log-spaced', () => {
    const wide = analyseCentralForce({ mass: 1, terms: [{ kind: 'power', coefficient: -1, exponent: -1 }], angularMomentum: 0.8, energy: -0.3 }, { rMin: 0.01, rMax: 100 });
    if (!wide.ok) throw new Error(wide.message);
    expect(wide.value.sampleSpacing).toBe('log');
    const svg = effectivePotentialSvg(wide.value);
    for (const label of ['0.01', '0.1', '1', '10', '100']) expect(svg).toContain(`text-anchor="middle">${label}</text>`);
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
