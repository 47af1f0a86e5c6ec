// Atmospheric refraction: the apparent elevation of a target above the atmosphere from its
// geometric elevation. Both models treat the target as infinitely distant (astronomical
// refraction); for a LEO spacecraft low on the horizon the true offset is a few per cent smaller
// (the ray's bending happens within the first few hundred km of a path of ~2500 km).
// - optical: Bennett's formula, J. Navig. 35 (1982) 255: R = cot(h + 7.31 / (h + 4.4)) arcmin,
//   h the apparent elevation in degrees, at 1010 hPa and 10 deg C; other conditions scale it by
//   (P / 1010) (283 / (273 + T)) (Meeus, Astronomical Algorithms, 2nd ed., ch. 16; from memory).
// - radio: the 4/3 effective Earth radius (common practice, no source): a refractivity gradient of
//   constant -(1 - 1/k) / R (k = 4/3, -39 N-units/km) from the ground up to the height H where the
//   refractivity N_s = 315 (a world-average surface value, from memory) has fallen to 0 (~8 km).
//   In the effective-Earth picture the ray is straight over a sphere of radius kR and leaves the
//   layer after a central angle psi' = acos(kR cos h / (kR + H)) - h; its bending, the integral of
//   the curvature (1 - 1/k) cos(elev) / R along the path, is (k - 1) psi'.
// Below the horizon the models do not hold: the refraction is held at its value at an apparent
// elevation of -1 deg (optical) or 0 deg (radio), so the apparent elevation stays continuous and
// increasing. The correction is clamped at 0 near the zenith (Bennett's formula gives -0.08" there).

import { DEG } from '../core/math.js';

export const REFRACTION_MODELS = ['none', 'radio', 'optical'] as const;
export type RefractionModel = (typeof REFRACTION_MODELS)[number];

/** Bennett's standard conditions: pressure (hPa) and temperature (deg C). */
export const BENNETT_PRESSURE_HPA = 1010;
export const BENNETT_TEMPERATURE_C = 10;

export interface RefractionSpec {
  readonly model: RefractionModel;
  /** Optical only: air pressure at the station, hPa (default 1010). */
  readonly pressureHpa?: number;
  /** Optical only: air temperature at the station, deg C (default 10). */
  readonly temperatureC?: number;
}

const ARCMIN = DEG / 60;
const OPTICAL_FLOOR = -1 * DEG;
const RADIO_FLOOR = 0;
/** Effective Earth radius factor and radius used by the radio model (k = 4/3, R = 6371 km mean radius). */
const K = 4 / 3;
const RADIO_EARTH_RADIUS_KM = 6371;
/** Height where the refractivity reaches 0 with N_s = 315 and the 4/3 gradient, km. */
const RADIO_LAYER_KM = (315e-6 * RADIO_EARTH_RADIUS_KM) / (1 - 1 / K);

/** Bennett's refraction (rad) at an apparent elevation (rad), standard conditions unless given. */
export function bennettRefraction(apparent: number, pressureHpa = BENNETT_PRESSURE_HPA, temperatureC = BENNETT_TEMPERATURE_C): number {
  const h = Math.max(apparent, OPTICAL_FLOOR) / DEG;
  const r = (1 / Math.tan((h + 7.31 / (h + 4.4)) * DEG)) * ARCMIN;
  return Math.max(0, r) * (pressureHpa / BENNETT_PRESSURE_HPA) * (283 / (273 + temperatureC));
}

/** Radio refraction (rad) of the 4/3-Earth layer at an apparent elevation (rad). */
export function radioRefraction(apparent: number): number {
  const h = Math.max(apparent, RADIO_FLOOR);
  const re = K * RADIO_EARTH_RADIUS_KM;
  const psi = Math.acos((re * Math.cos(h)) / (re + RADIO_LAYER_KM)) - h;
  return (K - 1) * psi;
}

/** Apparent elevation as a function of the geometric one, and its slope d(apparent)/d(geometric). */
export interface Refraction {
  readonly apparent: (geometric: number) => number;
  readonly slope: (geometric: number) => number;
  /** Largest correction anywhere, rad (prefilters widen their bounds by it). */
  readonly max: number;
}

/** The refraction of a spec; null for "none". Throws RangeError for non-physical conditions (a programmer error: the edge validates). */
export function refractionOf(spec: RefractionSpec): Refraction | null {
  if (spec.model === 'none') return null;
  const p = spec.pressureHpa ?? BENNETT_PRESSURE_HPA;
  const t = spec.temperatureC ?? BENNETT_TEMPERATURE_C;
  if (!(p >= 0 && t > -273.15 && Number.isFinite(p) && Number.isFinite(t))) throw new RangeError(`refraction needs pressure >= 0 hPa and temperature above -273.15 deg C, got ${p}, ${t}`);
  const bend = spec.model === 'optical' ? (h: number) => bennettRefraction(h, p, t) : radioRefraction;
  const floor = spec.model === 'optical' ? OPTICAL_FLOOR : RADIO_FLOOR;
  const apparent = (geometric: number): number => {
    // Solve h - bend(h) = geometric by fixed-point iteration: |bend'| < 0.3 above the floor, so it contracts.
    const atFloor = bend(floor);
    if (geometric <= floor - atFloor) return geometric + atFloor;
    let h = geometric + bend(geometric);
    for (let i = 0; i < 50; i++) {
      const next = geometric + bend(h);
      if (Math.abs(next - h) < 1e-13) return next;
      h = next;
    }
    return h;
  };
  const slope = (geometric: number): number => {
    const d = 1e-6;
    return (apparent(geometric + d) - apparent(geometric - d)) / (2 * d);
  };
  return { apparent, slope, max: bend(floor) };
}
