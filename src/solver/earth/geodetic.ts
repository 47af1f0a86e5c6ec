// WGS-84 geodetic coordinates (latitude, longitude in rad, ellipsoidal height in km) and
// Earth-fixed Cartesian positions (km). Ellipsoid: NIMA TR8350.2, 3rd ed., Table 3.1.
// Earth-fixed -> geodetic uses the closed form of H. Vermeille, "Direct transformation from
// geocentric coordinates to geodetic coordinates", J. Geodesy 76 (2002) 451-454: exact, no
// iteration; tested to well under a millimetre from -10 km to 40000 km height, poles included.

import type { Vec3 } from '../core/vec3.js';

/** WGS-84 semi-major axis, km (NIMA TR8350.2, Table 3.1). */
export const WGS84_A_KM = 6378.137;
/** WGS-84 inverse flattening (NIMA TR8350.2, Table 3.1). */
export const WGS84_INV_F = 298.257223563;
/** WGS-84 flattening. */
export const WGS84_F = 1 / WGS84_INV_F;
/** WGS-84 first eccentricity squared, e^2 = f (2 - f). */
export const WGS84_E2 = WGS84_F * (2 - WGS84_F);

export interface Geodetic {
  /** Geodetic latitude, rad, [-pi/2, pi/2]. */
  readonly latitude: number;
  /** Longitude east of Greenwich, rad, (-pi, pi]. */
  readonly longitude: number;
  /** Height above the ellipsoid, km. */
  readonly height: number;
}

/** Earth-fixed position (km) of a geodetic point; NIMA TR8350.2 eq. 4-14, Vallado 4th ed. eq. 3-7. */
export function geodeticToEarthFixed(latitude: number, longitude: number, height: number): Vec3 {
  const sinLat = Math.sin(latitude);
  const cosLat = Math.cos(latitude);
  const n = WGS84_A_KM / Math.sqrt(1 - WGS84_E2 * sinLat * sinLat); // prime-vertical radius of curvature
  const rho = (n + height) * cosLat;
  return [rho * Math.cos(longitude), rho * Math.sin(longitude), (n * (1 - WGS84_E2) + height) * sinLat];
}

/**
 * Geodetic coordinates of an Earth-fixed position (km); Vermeille (2002) eqs. 1-12.
 * The closed form needs the point outside the evolute of the meridian ellipse, a region within
 * e^2 a (about 43 km) of the Earth's centre; there the geocentric latitude and an approximate
 * height (distance minus the ellipsoid radius near that direction) are returned instead: finite,
 * but with no geodetic meaning so deep inside the Earth.
 */
export function earthFixedToGeodetic(r: Vec3): Geodetic {
  const [x, y, z] = r;
  const a2 = WGS84_A_KM * WGS84_A_KM;
  const e4 = WGS84_E2 * WGS84_E2;
  const rhoSq = x * x + y * y;
  const rho = Math.sqrt(rhoSq);
  const longitude = Math.atan2(y, x);
  const p = rhoSq / a2;
  const q = ((1 - WGS84_E2) / a2) * z * z;
  const rr = (p + q - e4) / 6;
  if (rr <= 0) return nearCentre(rho, z, longitude);
  const s = (e4 * p * q) / (4 * rr * rr * rr);
  const t = Math.cbrt(1 + s + Math.sqrt(s * (2 + s)));
  const u = rr * (1 + t + 1 / t);
  const v = Math.sqrt(u * u + e4 * q);
  const w = (WGS84_E2 * (u + v - q)) / (2 * v);
  const k = Math.sqrt(u + v + w * w) - w;
  const d = (k * rho) / (k + WGS84_E2);
  const dz = Math.hypot(d, z);
  return {
    latitude: Math.atan2(z, d),
    longitude,
    height: ((k + WGS84_E2 - 1) / k) * dz,
  };
}

/** Within ~43 km of the centre: geocentric latitude and an approximate height (see above). */
function nearCentre(rho: number, z: number, longitude: number): Geodetic {
  const latitude = Math.atan2(z, rho);
  const surface = geodeticToEarthFixed(latitude, 0, 0);
  return { latitude, longitude, height: Math.hypot(rho, z) - Math.hypot(surface[0], surface[2]) };
}

/** Earth-fixed states (6 numbers per sample) -> latitude, longitude (rad) and height (km), 3 per sample. */
export function geodeticBatch(itrfStates: Float64Array): Float64Array {
  const n = itrfStates.length / 6;
  const out = new Float64Array(3 * n);
  for (let k = 0; k < n; k++) {
    const g = earthFixedToGeodetic([itrfStates[6 * k]!, itrfStates[6 * k + 1]!, itrfStates[6 * k + 2]!]);
    out[3 * k] = g.latitude;
    out[3 * k + 1] = g.longitude;
    out[3 * k + 2] = g.height;
  }
  return out;
}
