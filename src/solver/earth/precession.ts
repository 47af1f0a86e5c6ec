// IAU 2006 precession (Capitaine, Wallace & Chapront 2003, "P03"; Hilton et al. 2006) as the
// Fukushima-Williams angles, which include the GCRS frame bias, and the mean obliquity of date.
// Polynomials in t = TT Julian centuries since J2000.0, arcseconds (IERS Conventions 2010 eqs.
// 5.39-5.40; copied from the project's shared reference README, earth-orientation).

import { multiply, rot1, rot3, type Mat3 } from './mat3.js';

export const ARCSEC = Math.PI / 648_000;

const poly = (t: number, c: readonly number[]): number => {
  let s = 0;
  for (let i = c.length - 1; i >= 0; i--) s = s * t + c[i]!;
  return s * ARCSEC;
};

const GAMMA_BAR = [-0.052928, 10.556378, 0.4932044, -0.00031238, -0.000002788, 0.000000026];
const PHI_BAR = [84381.412819, -46.811016, 0.0511268, 0.00053289, -0.00000044, -0.0000000176];
const PSI_BAR = [-0.041775, 5038.481484, 1.5584175, -0.00018522, -0.000026452, -0.0000000148];
const EPS_A = [84381.406, -46.836769, -0.0001831, 0.0020034, -0.000000576, -0.0000000434];

/** Fukushima-Williams angles (rad) of IAU 2006 precession with frame bias; Hilton et al. 2006; IERS Conventions 2010 eq. 5.40. */
export interface FukushimaWilliams {
  readonly gammaBar: number;
  readonly phiBar: number;
  readonly psiBar: number;
  /** Mean obliquity of date, eps_A (IERS Conventions 2010 eq. 5.40). */
  readonly epsA: number;
}

export function fukushimaWilliams(t: number): FukushimaWilliams {
  return { gammaBar: poly(t, GAMMA_BAR), phiBar: poly(t, PHI_BAR), psiBar: poly(t, PSI_BAR), epsA: poly(t, EPS_A) };
}

/** Mean obliquity of the ecliptic of date, rad (IAU 2006; IERS Conventions 2010 eq. 5.40). */
export const meanObliquity = (t: number): number => poly(t, EPS_A);

/**
 * GCRS -> true equator and equinox of date: R1(-(eps_A + deps)) R3(-(psi_bar + dpsi)) R1(phi_bar)
 * R3(gamma_bar) (IERS Conventions 2010 eq. 5.39, bias + precession + nutation in one); with
 * dpsi = deps = 0 it is bias + precession alone (GCRS -> mean equator and equinox of date).
 */
export function biasPrecessionNutation(fw: FukushimaWilliams, dpsi: number, deps: number): Mat3 {
  return multiply(multiply(rot1(-(fw.epsA + deps)), rot3(-(fw.psiBar + dpsi))), multiply(rot1(fw.phiBar), rot3(fw.gammaBar)));
}
