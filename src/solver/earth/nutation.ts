// IAU 2000B nutation (McCarthy & Luzum 2003; IERS Conventions 2003 sec. 5.5.2): 77 luni-solar
// terms (iau2000b-terms.ts, generated from the published table) plus fixed offsets that stand
// for the planetary terms; about 1 mas of the full IAU 2000A model between 1995 and 2050.

import { ARCSEC } from './precession.js';
import { IAU2000B_TERMS, IAU2000B_TERM_COUNT, IAU2000B_TERM_WIDTH } from './iau2000b-terms.js';

const ARCSEC_PER_TURN = 1_296_000;
/** 0.1 microarcsecond, rad: the unit of the table. */
const UNIT = ARCSEC * 1e-7;
/** Planetary offsets for IAU 2000B with bias and precession applied separately (Luzum 2001; McCarthy & Luzum 2003). */
const DPSI_PLANETARY = -0.135e-3 * ARCSEC;
const DEPS_PLANETARY = 0.388e-3 * ARCSEC;

/** Fundamental (Delaunay) arguments, rad, as used with IAU 2000B: Simon et al., A&A 282, 663 (1994), linear part. */
export interface Delaunay {
  readonly l: number;
  readonly lp: number;
  readonly f: number;
  readonly d: number;
  readonly om: number;
}

const arg = (c0: number, c1: number, t: number): number => ((c0 + c1 * t) % ARCSEC_PER_TURN) * ARCSEC;

export function delaunayArguments(t: number): Delaunay {
  return {
    l: arg(485_868.249036, 1_717_915_923.2178, t),
    lp: arg(1_287_104.79305, 129_596_581.0481, t),
    f: arg(335_779.526232, 1_739_527_262.8478, t),
    d: arg(1_072_260.70369, 1_602_961_601.209, t),
    om: arg(450_160.398036, -6_962_890.5431, t),
  };
}

/** Nutation in longitude and obliquity, rad. */
export interface Nutation {
  readonly dpsi: number;
  readonly deps: number;
}

/** IAU 2000B nutation at t (TT Julian centuries since J2000.0), smallest terms summed first. */
export function nutation2000B(t: number, a: Delaunay = delaunayArguments(t)): Nutation {
  let dpsi = 0;
  let deps = 0;
  for (let k = IAU2000B_TERM_COUNT - 1; k >= 0; k--) {
    const o = k * IAU2000B_TERM_WIDTH;
    const c = IAU2000B_TERMS;
    const x = c[o]! * a.l + c[o + 1]! * a.lp + c[o + 2]! * a.f + c[o + 3]! * a.d + c[o + 4]! * a.om;
    const s = Math.sin(x);
    const co = Math.cos(x);
    dpsi += (c[o + 5]! + c[o + 6]! * t) * s + c[o + 7]! * co;
    deps += (c[o + 8]! + c[o + 9]! * t) * co + c[o + 10]! * s;
  }
  return { dpsi: dpsi * UNIT + DPSI_PLANETARY, deps: deps * UNIT + DEPS_PLANETARY };
}

/**
 * IAU 2000 nutation adjusted to IAU 2006 precession (IERS Conventions 2010 sec. 5.6.3): dpsi
 * times (1 + 0.4697e-6 - 2.7774e-6 t), deps times (1 - 2.7774e-6 t); a microarcsecond effect.
 */
export function nutationFor2006(t: number, a: Delaunay = delaunayArguments(t)): Nutation {
  const n = nutation2000B(t, a);
  const f = -2.7774e-6 * t;
  return { dpsi: n.dpsi * (1 + 0.4697e-6 + f), deps: n.deps * (1 + f) };
}
