// IAU 2006 precession + IAU 2000B nutation + ERA/GMST 2006 against ERFA's IAU 2006/2000A
// transformation (test/fixtures/erfa-gcrs-itrs.json: ERFA 2.0.0 via pyerfa 2.0.0.1, written by
// scripts/erfa-reference.py; CIO based: X, Y series, s, ERA, polar motion with s'), an independent
// implementation of the published formulas (IERS Conventions 2010 ch. 5).
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { gcrfToItrf, gcrfToItrfBatch, type FrameOptions } from '../../../src/solver/earth/frames.js';
import { nutation2000B } from '../../../src/solver/earth/nutation.js';
import { meanObliquity } from '../../../src/solver/earth/precession.js';
import { earthRotationAngle, gmst2006 } from '../../../src/solver/earth/rotation.js';
import { ut1Days } from '../../../src/solver/earth/frames.js';
import { parseFinals2000A } from '../../../src/solver/time/eop.js';
import { julianCenturiesTT, parseUtcIso } from '../../../src/solver/time/time.js';
import { norm, sub, type Vec3 } from '../../../src/solver/core/vec3.js';
import { wrapPi } from '../../../src/solver/core/math.js';

interface Case {
  utc: string; eop: boolean; ut1MinusUtc: number; xpArcsec: number; ypArcsec: number; dXMas: number; dYMas: number;
  gcrsToItrs: number[]; nut00bDpsiRad: number; nut00bDepsRad: number; obl06Rad: number; era00Rad: number; gmst06Rad: number;
}
const fixture = (name: string): string => readFileSync(new URL(`../../fixtures/${name}`, import.meta.url), 'utf8');
const CASES = (JSON.parse(fixture('erfa-gcrs-itrs.json')) as { cases: Case[] }).cases;
const EOP = (() => {
  const r = parseFinals2000A(fixture('finals2000A-2025-2027.txt'));
  if (!r.ok) throw new Error(r.message);
  return r.value;
})();

const ARCSEC = Math.PI / 648_000;
const UAS = ARCSEC * 1e-6;
const LEO_KM = 7000;
const GEO_KM = 42_164;
const tt = (s: string): number => {
  const r = parseUtcIso(s);
  if (!r.ok) throw new Error(r.message);
  return r.value;
};

/** Largest displacement (km per km of radius) between our GCRF -> ITRF rotation and the reference matrix. */
function worstAngle(c: Case, opts: FrameOptions): number {
  const t = tt(c.utc);
  const m = c.gcrsToItrs;
  let worst = 0;
  for (const d of [[1, 0, 0], [0, 1, 0], [0, 0, 1], [0.6, -0.48, 0.64]] as Vec3[]) {
    const ours = gcrfToItrf(t, d, [0, 0, 0], opts).r;
    const ref: Vec3 = [0, 1, 2].map((i) => m[3 * i]! * d[0] + m[3 * i + 1]! * d[1] + m[3 * i + 2]! * d[2]) as unknown as Vec3;
    worst = Math.max(worst, norm(sub(ours, ref)) / norm(d));
  }
  return worst;
}

const explicit = (c: Case): FrameOptions => ({
  dut1: c.ut1MinusUtc,
  ...(c.eop ? {
    polarMotion: { xp: c.xpArcsec * ARCSEC, yp: c.ypArcsec * ARCSEC },
    poleOffsets: { dX: c.dXMas * ARCSEC * 1e-3, dY: c.dYMas * ARCSEC * 1e-3 },
  } : {}),
});

describe('the pieces against ERFA', () => {
  it.each(CASES.filter((c) => !c.eop))('IAU 2000B nutation, IAU 2006 obliquity, ERA and GMST 2006 at $utc (ERFA nut00b, obl06, era00, gmst06)', (c) => {
    const t = tt(c.utc);
    const T = julianCenturiesTT(t);
    const n = nutation2000B(T);
    expect(Math.abs(n.dpsi - c.nut00bDpsiRad) / UAS).toBeLessThan(1);
    expect(Math.abs(n.deps - c.nut00bDepsRad) / UAS).toBeLessThan(1);
    expect(Math.abs(meanObliquity(T) - c.obl06Rad) / UAS).toBeLessThan(1);
    const d = ut1Days(t, { dut1: 0 });
    // ERA and GMST to 20 uas (a double of JD splits coarser than ERFA's two-part dates: ~1e-11 rad).
    expect(Math.abs(wrapPi(earthRotationAngle(d) - c.era00Rad)) / UAS).toBeLessThan(20);
    expect(Math.abs(wrapPi(gmst2006(d, T) - c.gmst06Rad)) / UAS).toBeLessThan(20);
  });
});

describe('GCRF -> ITRF against the IAU 2006/2000A transformation (ERFA)', () => {
  it.each(CASES.filter((c) => !c.eop))('without Earth orientation data at $utc: within 0.1 m at LEO and 0.5 m at GEO (measured <= 0.07 m at GEO, 1996-2049)', (c) => {
    const a = worstAngle(c, {});
    expect(a * LEO_KM * 1000).toBeLessThan(0.1);
    expect(a * GEO_KM * 1000).toBeLessThan(0.5);
    // IAU 2000B is within ~1 mas of IAU 2000A for 1995-2050 (McCarthy & Luzum 2003).
    expect(a / ARCSEC).toBeLessThan(1e-3);
  });

  it.each(CASES.filter((c) => c.eop))('with the finals2000A excerpt at $utc, given explicitly and through the table: within 0.1 m at LEO and 0.5 m at GEO', (c) => {
    for (const opts of [explicit(c), { eop: EOP }]) {
      const a = worstAngle(c, opts);
      expect(a * LEO_KM * 1000).toBeLessThan(0.1);
      expect(a * GEO_KM * 1000).toBeLessThan(0.5);
      expect(a / ARCSEC).toBeLessThan(1e-3);
    }
  });

  it('the Earth orientation data matter: leaving them out moves a GEO point by more than 5 m (polar motion ~0.1-0.4")', () => {
    const c = CASES.find((x) => x.eop)!;
    expect(worstAngle(c, {}) * GEO_KM * 1000).toBeGreaterThan(5);
  });
});

describe('tabled form with an EOP table', () => {
  it('interpolating Q, W and UT1 between hourly nodes costs under 1 mm at LEO over 3 days, across an observed/predicted boundary', () => {
    const t0 = tt('2026-09-16T00:00:00Z');
    const n = 3 * 24 * 30;
    const epochs = new Float64Array(n);
    const states = new Float64Array(6 * n);
    for (let k = 0; k < n; k++) {
      epochs[k] = t0 + 120 * k + 7.1;
      const u = k * 0.07;
      states.set([LEO_KM * Math.cos(u), LEO_KM * Math.sin(u) * 0.6, LEO_KM * Math.sin(u) * 0.8, -7.5 * Math.sin(u), 4.5 * Math.cos(u), 6 * Math.cos(u)], 6 * k);
    }
    const out = gcrfToItrfBatch(epochs, states, { eop: EOP });
    let worst = 0;
    for (let k = 0; k < n; k += 7) {
      const o = 6 * k;
      const exact = gcrfToItrf(epochs[k]!, [states[o]!, states[o + 1]!, states[o + 2]!], [states[o + 3]!, states[o + 4]!, states[o + 5]!], { eop: EOP });
      worst = Math.max(worst, norm(sub(exact.r, [out[o]!, out[o + 1]!, out[o + 2]!])));
    }
    expect(worst).toBeLessThan(1e-6);
  });
});
