// Look angles from a ground station: the local east-north-up (ENU) frame of the WGS-84 geodetic
// normal, azimuth (from north, clockwise), elevation, range and range rate of an Earth-fixed
// satellite state, and the first-order Doppler factor. Vallado 4th ed. Alg. 27 (RAZEL, there in
// SEZ axes) and Curtis, Orbital Mechanics for Engineering Students, ch. 5 (topocentric frames);
// both from memory. No atmospheric refraction, no light-time.

import { geodeticToEarthFixed } from '../earth/geodetic.js';
import { SPEED_OF_LIGHT_KM_S } from '../core/constants.js';
import { TWO_PI } from '../core/math.js';
import type { Vec3 } from '../core/vec3.js';


/** A station fixed to the Earth, with its ENU axes expressed in the Earth-fixed frame. */
export interface Station {
  readonly latitude: number;
  readonly longitude: number;
  readonly height: number;
  /** Earth-fixed position, km. */
  readonly position: Vec3;
  readonly east: Vec3;
  readonly north: Vec3;
  /** The geodetic normal (local vertical). */
  readonly up: Vec3;
}

export interface LookAngles {
  /** rad, [0, 2pi), from north through east. */
  readonly azimuth: number;
  /** rad, [-pi/2, pi/2]. */
  readonly elevation: number;
  /** km. */
  readonly range: number;
  /** km/s, positive when the distance grows. */
  readonly rangeRate: number;
  /** d(azimuth)/dt, rad/s (unbounded near the zenith). */
  readonly azimuthRate: number;
  /** d(elevation)/dt, rad/s. */
  readonly elevationRate: number;
}

/** Station from geodetic latitude, longitude (rad) and height (km) on WGS-84. */
export function stationFromGeodetic(latitude: number, longitude: number, height: number): Station {
  const sLat = Math.sin(latitude);
  const cLat = Math.cos(latitude);
  const sLon = Math.sin(longitude);
  const cLon = Math.cos(longitude);
  // ENU unit vectors in Earth-fixed axes: the SEZ rotation of Vallado 4th ed. Alg. 27 with S = -N (from memory).
  return {
    latitude,
    longitude,
    height,
    position: geodeticToEarthFixed(latitude, longitude, height),
    east: [-sLon, cLon, 0],
    north: [-sLat * cLon, -sLat * sLon, cLat],
    up: [cLat * cLon, cLat * sLon, sLat],
  };
}

/**
 * Azimuth, elevation, range, range rate and angle rates of a satellite Earth-fixed state
 * (position km, velocity km/s relative to the rotating Earth) seen from a station.
 * Vallado 4th ed. Alg. 27 (from memory). At the zenith the azimuth is 0 by convention.
 */
export function lookAngles(station: Station, r: Vec3, v: Vec3): LookAngles {
  const dx = r[0] - station.position[0];
  const dy = r[1] - station.position[1];
  const dz = r[2] - station.position[2];
  const { east: e, north: n, up: u } = station;
  const pe = dx * e[0] + dy * e[1] + dz * e[2];
  const pn = dx * n[0] + dy * n[1] + dz * n[2];
  const pu = dx * u[0] + dy * u[1] + dz * u[2];
  const ve = v[0] * e[0] + v[1] * e[1] + v[2] * e[2];
  const vn = v[0] * n[0] + v[1] * n[1] + v[2] * n[2];
  const vu = v[0] * u[0] + v[1] * u[1] + v[2] * u[2];
  const horizSq = pe * pe + pn * pn;
  const horiz = Math.sqrt(horizSq);
  const range = Math.sqrt(horizSq + pu * pu);
  const rangeRate = (pe * ve + pn * vn + pu * vu) / range;
  let azimuth = horiz > 0 ? Math.atan2(pe, pn) : 0;
  if (azimuth < 0) azimuth += TWO_PI;
  if (azimuth >= TWO_PI) azimuth = 0;
  // Rates from differentiating az = atan2(e, n) and el = atan2(u, |(e, n)|).
  const horizRate = horiz > 0 ? (pe * ve + pn * vn) / horiz : 0;
  return {
    azimuth,
    elevation: Math.atan2(pu, horiz),
    range,
    rangeRate,
    azimuthRate: horiz > 0 ? (ve * pn - pe * vn) / horizSq : 0,
    elevationRate: (vu * horiz - pu * horizRate) / (range * range),
  };
}

/** Slots of lookAnglesInto's output. */
export const LOOK_AZIMUTH = 0;
export const LOOK_ELEVATION = 1;
export const LOOK_RANGE = 2;
export const LOOK_RANGE_RATE = 3;
export const LOOK_AZIMUTH_RATE = 4;
export const LOOK_ELEVATION_RATE = 5;

/**
 * lookAngles of the Earth-fixed state s[o..o+5] (position, velocity) without a new object: the six
 * values written to out[p + LOOK_*]. The same operations in the same order as lookAngles, so the
 * same bits (test/solver/stations/topocentric-into.test.ts compares them).
 */
export function lookAnglesInto(station: Station, s: ArrayLike<number>, o: number, out: Float64Array, p: number): void {
  const dx = s[o]! - station.position[0];
  const dy = s[o + 1]! - station.position[1];
  const dz = s[o + 2]! - station.position[2];
  const { east: e, north: n, up: u } = station;
  const v0 = s[o + 3]!;
  const v1 = s[o + 4]!;
  const v2 = s[o + 5]!;
  const pe = dx * e[0] + dy * e[1] + dz * e[2];
  const pn = dx * n[0] + dy * n[1] + dz * n[2];
  const pu = dx * u[0] + dy * u[1] + dz * u[2];
  const ve = v0 * e[0] + v1 * e[1] + v2 * e[2];
  const vn = v0 * n[0] + v1 * n[1] + v2 * n[2];
  const vu = v0 * u[0] + v1 * u[1] + v2 * u[2];
  const horizSq = pe * pe + pn * pn;
  const horiz = Math.sqrt(horizSq);
  const range = Math.sqrt(horizSq + pu * pu);
  let azimuth = horiz > 0 ? Math.atan2(pe, pn) : 0;
  if (azimuth < 0) azimuth += TWO_PI;
  if (azimuth >= TWO_PI) azimuth = 0;
  const horizRate = horiz > 0 ? (pe * ve + pn * vn) / horiz : 0;
  out[p + LOOK_AZIMUTH] = azimuth;
  out[p + LOOK_ELEVATION] = Math.atan2(pu, horiz);
  out[p + LOOK_RANGE] = range;
  out[p + LOOK_RANGE_RATE] = (pe * ve + pn * vn + pu * vu) / range;
  out[p + LOOK_AZIMUTH_RATE] = horiz > 0 ? (ve * pn - pe * vn) / horizSq : 0;
  out[p + LOOK_ELEVATION_RATE] = (vu * horiz - pu * horizRate) / (range * range);
}

/** The elevation lookAngles gives for the Earth-fixed position s[o..o+2], computing nothing else (same bits). */
export function elevationOf(station: Station, s: ArrayLike<number>, o: number): number {
  const dx = s[o]! - station.position[0];
  const dy = s[o + 1]! - station.position[1];
  const dz = s[o + 2]! - station.position[2];
  const { east: e, north: n, up: u } = station;
  const pe = dx * e[0] + dy * e[1] + dz * e[2];
  const pn = dx * n[0] + dy * n[1] + dz * n[2];
  const pu = dx * u[0] + dy * u[1] + dz * u[2];
  return Math.atan2(pu, Math.sqrt(pe * pe + pn * pn));
}

/**
 * Received / transmitted frequency ratio for a one-way link, first order in v/c (no relativistic
 * terms, no light-time): 1 - rangeRate / c. Common practice, no source.
 */
export const dopplerFactor = (rangeRateKmS: number): number => 1 - rangeRateKmS / SPEED_OF_LIGHT_KM_S;

/** Doppler shift (received minus transmitted) of a carrier, in the carrier's unit (e.g. Hz); first order. */
export const dopplerShift = (carrierFrequency: number, rangeRateKmS: number): number =>
  (-carrierFrequency * rangeRateKmS) / SPEED_OF_LIGHT_KM_S;
