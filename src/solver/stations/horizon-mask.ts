// Azimuth-dependent elevation limit of a station (terrain, buildings, antenna keyhole).
// A mask is a list of (azimuth, minimum elevation) points; between points the limit is linear in
// azimuth, wrapping through north (360 -> 0); it never falls below the station's minElevation.
// Common practice, no source.

import { TWO_PI, wrapTwoPi } from '../core/math.js';
import { failure, success, type Outcome } from '../core/result.js';

export interface MaskPoint {
  /** rad, [0, 2pi). */
  readonly azimuth: number;
  /** rad, [-pi/2, pi/2]. */
  readonly elevation: number;
}

export interface HorizonMask {
  /** Azimuths in increasing order, rad. */
  readonly azimuths: readonly number[];
  /** Elevation limits matching `azimuths`, rad. */
  readonly elevations: readonly number[];
  /** The station's minElevation: the limit is never below it. */
  readonly floor: number;
  /** The lowest limit over all azimuths. */
  readonly lowest: number;
  /** The highest limit over all azimuths. */
  readonly highest: number;
}

const HALF_PI = Math.PI / 2;
const inElevationRange = (x: number): boolean => Number.isFinite(x) && x >= -HALF_PI && x <= HALF_PI;

/** Validates and sorts mask points; an empty list gives the constant limit minElevation. */
export function createHorizonMask(points: readonly MaskPoint[], minElevation: number): Outcome<HorizonMask> {
  if (!inElevationRange(minElevation)) {
    return failure('invalid-horizon-mask', `minimum elevation ${minElevation} rad is outside [-pi/2, pi/2]`);
  }
  for (const [i, p] of points.entries()) {
    if (!Number.isFinite(p.azimuth) || p.azimuth < 0 || p.azimuth >= TWO_PI) {
      return failure('invalid-horizon-mask', `mask point ${i}: azimuth ${p.azimuth} rad is outside [0, 2pi)`);
    }
    if (!inElevationRange(p.elevation)) {
      return failure('invalid-horizon-mask', `mask point ${i}: elevation ${p.elevation} rad is outside [-pi/2, pi/2]`);
    }
  }
  const sorted = [...points].sort((a, b) => a.azimuth - b.azimuth);
  for (let i = 1; i < sorted.length; i++) {
    if (sorted[i]!.azimuth === sorted[i - 1]!.azimuth) {
      return failure('invalid-horizon-mask', `two mask points share the azimuth ${sorted[i]!.azimuth} rad`);
    }
  }
  const elevations = sorted.map((p) => p.elevation);
  return success({
    azimuths: sorted.map((p) => p.azimuth),
    elevations,
    floor: minElevation,
    lowest: elevations.length === 0 ? minElevation : Math.max(minElevation, Math.min(...elevations)),
    highest: Math.max(minElevation, ...elevations),
  });
}

/** Index i of the segment [az_i, az_{i+1}] holding `azimuth`; the wrap segment (last -> first) is n - 1. */
function segmentIndex(azimuths: readonly number[], azimuth: number): number {
  const n = azimuths.length;
  if (azimuth < azimuths[0]! || azimuth >= azimuths[n - 1]!) return n - 1;
  let lo = 0;
  let hi = n - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (azimuths[mid]! <= azimuth) lo = mid;
    else hi = mid;
  }
  return lo;
}

/** Interpolated mask value and its slope d(limit)/d(azimuth) at an azimuth in [0, 2pi), before the floor. */
function interpolate(mask: HorizonMask, azimuth: number): { value: number; slope: number } {
  const { azimuths, elevations } = mask;
  const n = azimuths.length;
  if (n === 1) return { value: elevations[0]!, slope: 0 };
  const i = segmentIndex(azimuths, azimuth);
  const j = (i + 1) % n;
  const az0 = azimuths[i]!;
  let az1 = azimuths[j]!;
  if (az1 <= az0) az1 += TWO_PI; // wrap segment
  let az = azimuth;
  if (az < az0) az += TWO_PI;
  const slope = (elevations[j]! - elevations[i]!) / (az1 - az0);
  return { value: elevations[i]! + slope * (az - az0), slope };
}

/** Elevation limit (rad) at an azimuth (rad, any value; reduced to [0, 2pi)). */
export function horizonLimit(mask: HorizonMask, azimuth: number): number {
  if (mask.azimuths.length === 0) return mask.floor;
  return Math.max(mask.floor, interpolate(mask, reduceAzimuth(azimuth)).value);
}

/** d(limit)/d(azimuth) at an azimuth: 0 where the floor holds; one-sided at mask points. */
export function horizonLimitSlope(mask: HorizonMask, azimuth: number): number {
  if (mask.azimuths.length === 0) return 0;
  const { value, slope } = interpolate(mask, reduceAzimuth(azimuth));
  return value > mask.floor ? slope : 0;
}

/** True when the limit is the same at every azimuth (no points above the floor). */
export const isFlatMask = (mask: HorizonMask): boolean => mask.highest === mask.lowest;

function reduceAzimuth(azimuth: number): number {
  const a = wrapTwoPi(azimuth);
  return a >= TWO_PI ? 0 : a; // -1e-17 wraps to 2pi in floating point
}
