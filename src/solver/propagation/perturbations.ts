// Perturbing accelerations (km/s^2) on a spacecraft about a central body, in an inertial frame:
// the body's J2, atmospheric drag, point-mass third bodies and solar radiation pressure. Each is a
// pure function of the geometry; numerical.ts sums them with two-body gravity.

import type { CentralBody } from '../bodies/bodies.js';
import { failure, type Failure } from '../core/result.js';
import type { Vec3 } from '../core/vec3.js';

export type Force =
  /** Central body J2 about its spin axis (needs body.j2 and body.radius). */
  | { readonly kind: 'j2' }
  /** Drag in the exponential atmosphere co-rotating with the Earth; m / (Cd A) in kg/m^2. Earth only. */
  | { readonly kind: 'drag'; readonly ballisticCoefficient: number }
  /** Point-mass Sun or Moon (Earth-centred orbits only). */
  | { readonly kind: 'third-body'; readonly body: 'sun' | 'moon' }
  /** Cannonball radiation pressure, A/m in m^2/kg, reflectivity eps in [0, 1] (C_R = 1 + eps), cylindrical shadow. Earth only. */
  | { readonly kind: 'srp'; readonly areaToMass: number; readonly reflectivity: number };

export type ForceKind = Force['kind'];

/**
 * Solar radiation pressure at 1 AU, N/m^2 (a solar flux of ~1367 W/m^2 over c); Montenbruck & Gill,
 * Satellite Orbits, 2000, sec. 3.4 (from memory).
 */
export const SOLAR_PRESSURE_1AU_N_M2 = 4.56e-6;

const positiveFinite = (x: number): boolean => Number.isFinite(x) && x > 0;

/**
 * Is this list of forces usable about this body? A failure ('invalid-parameter') names the force
 * and what it lacks; undefined when all is well. Each force may appear once (each third body once).
 */
export function checkForces(body: CentralBody, forces: readonly Force[]): Failure | undefined {
  const seen = new Set<string>();
  const earthOnly = (what: string): Failure | undefined =>
    body.name === 'earth' ? undefined : failure('invalid-parameter', `force '${what}' is modelled for Earth-centred orbits only; the central body is ${body.name}`);
  for (const force of forces) {
    const key = force.kind === 'third-body' ? `third-body ${String(force.body)}` : String(force.kind);
    if (seen.has(key)) return failure('invalid-parameter', `force '${key}' is listed twice`);
    seen.add(key);
    const radiusOk = body.radius !== undefined && positiveFinite(body.radius);
    switch (force.kind) {
      case 'j2':
        if (body.j2 === undefined || !Number.isFinite(body.j2) || !radiusOk) {
          return failure('invalid-parameter', `force 'j2' needs the central body's j2 and radius; ${body.name} lacks ${body.j2 === undefined ? 'j2' : 'a usable j2 or radius'}`);
        }
        break;
      case 'drag': {
        const bad = earthOnly('drag');
        if (bad) return bad;
        if (!radiusOk || body.rotationRateRadS === undefined || !Number.isFinite(body.rotationRateRadS)) {
          return failure('invalid-parameter', `force 'drag' needs the body's radius and rotation rate`);
        }
        if (!positiveFinite(force.ballisticCoefficient)) {
          return failure('invalid-parameter', `drag ballisticCoefficient must be a positive number of kg/m^2, got ${force.ballisticCoefficient}`);
        }
        break;
      }
      case 'third-body': {
        const bad = earthOnly('third-body');
        if (bad) return bad;
        if (force.body !== 'sun' && force.body !== 'moon') return failure('invalid-parameter', `third body must be 'sun' or 'moon', got ${String(force.body)}`);
        break;
      }
      case 'srp': {
        const bad = earthOnly('srp');
        if (bad) return bad;
        if (!radiusOk) return failure('invalid-parameter', `force 'srp' needs the body's radius for the shadow`);
        if (!(Number.isFinite(force.areaToMass) && force.areaToMass >= 0)) {
          return failure('invalid-parameter', `srp areaToMass must be a non-negative number of m^2/kg, got ${force.areaToMass}`);
        }
        if (!(force.reflectivity >= 0 && force.reflectivity <= 1)) {
          return failure('invalid-parameter', `srp reflectivity must lie in [0, 1] (0 absorbs, 1 reflects all), got ${force.reflectivity}`);
        }
        break;
      }
      default:
        return failure('invalid-parameter', `unknown force kind '${String((force as { kind: unknown }).kind)}'`);
    }
  }
  return undefined;
}

/**
 * J2 acceleration about the unit spin axis k: with z = r.k,
 *   a = -3/2 J2 mu R^2 / r^5 [ (1 - 5 z^2/r^2) r + 2 z k ]
 * which for k = (0, 0, 1) is Vallado 4th ed. eq. 8-30 / Curtis 3rd ed. eq. 12.30 (from memory).
 */
export function j2Acceleration(r: Vec3, k: Vec3, mu: number, j2: number, radius: number): Vec3 {
  const r2 = r[0] * r[0] + r[1] * r[1] + r[2] * r[2];
  const z = r[0] * k[0] + r[1] * k[1] + r[2] * k[2];
  const c = (-1.5 * j2 * mu * radius * radius) / (r2 * r2 * Math.sqrt(r2));
  const radial = c * (1 - (5 * z * z) / r2);
  const axial = 2 * c * z;
  return [radial * r[0] + axial * k[0], radial * r[1] + axial * k[1], radial * r[2] + axial * k[2]];
}

/**
 * Height (km) above an ellipsoid of equatorial radius R and flattening f about the axis k, to
 * first order in f: h = |r| - R (1 - f sin^2 phi), sin phi = r.k / |r| (the geocentric latitude;
 * the O(f^2) remainder is ~50 m for the Earth). Common practice, no source.
 */
export function ellipsoidHeight(r: Vec3, k: Vec3, radius: number, flattening: number): number {
  const rn = Math.sqrt(r[0] * r[0] + r[1] * r[1] + r[2] * r[2]);
  const sinLat = (r[0] * k[0] + r[1] * k[1] + r[2] * k[2]) / rn;
  return rn - radius * (1 - flattening * sinLat * sinLat);
}

/**
 * Drag in an atmosphere co-rotating with the body: v_rel = v - omega k x r,
 * a = -1/2 (rho / B) |v_rel| v_rel (Vallado 4th ed. sec. 8.6.2; from memory).
 * rho in kg/m^3 and B = m / (Cd A) in kg/m^2, so rho/B is per metre: x 1000 for per km.
 */
export function dragAcceleration(r: Vec3, v: Vec3, k: Vec3, rotationRateRadS: number, densityKgM3: number, ballisticCoefficient: number): Vec3 {
  // omega x r with omega = rotationRateRadS k.
  const wx = rotationRateRadS * (k[1] * r[2] - k[2] * r[1]);
  const wy = rotationRateRadS * (k[2] * r[0] - k[0] * r[2]);
  const wz = rotationRateRadS * (k[0] * r[1] - k[1] * r[0]);
  const ux = v[0] - wx;
  const uy = v[1] - wy;
  const uz = v[2] - wz;
  const c = (-0.5 * 1000 * densityKgM3 * Math.sqrt(ux * ux + uy * uy + uz * uz)) / ballisticCoefficient;
  return [c * ux, c * uy, c * uz];
}

/**
 * Point-mass third body at s (both vectors from the central body): the direct minus the indirect
 * term, a = -GM [ d/|d|^3 + s/|s|^3 ] with d = r - s (Montenbruck & Gill 2000 eq. 3.37, number from memory), written as
 * a = -GM / |d|^3 [ r + f(q) s ], q = r.(r - 2s) / s.s, f(q) = q (3 + 3q + q^2) / (1 + (1 + q)^(3/2))
 * so that the two nearly equal terms never cancel (Battin, rev. ed., sec. 8.4; from memory).
 */
export function thirdBodyAcceleration(r: Vec3, s: Vec3, gm: number): Vec3 {
  const s2 = s[0] * s[0] + s[1] * s[1] + s[2] * s[2];
  const q = (r[0] * (r[0] - 2 * s[0]) + r[1] * (r[1] - 2 * s[1]) + r[2] * (r[2] - 2 * s[2])) / s2;
  const onePlusQ = 1 + q;
  const f = (q * (3 + q * (3 + q))) / (1 + onePlusQ * Math.sqrt(onePlusQ));
  const d3 = (s2 * onePlusQ) ** 1.5; // |d|^2 = s^2 (1 + q)
  const c = -gm / d3;
  return [c * (r[0] + f * s[0]), c * (r[1] + f * s[1]), c * (r[2] + f * s[2])];
}

/**
 * Cylindrical shadow: the spacecraft is dark when it is on the night side (r.s < 0) and within
 * the body radius of the Earth-Sun line (Vallado 4th ed., the SHADOW algorithm, cylindrical case; from memory).
 */
export function inCylindricalShadow(r: Vec3, sun: Vec3, radius: number): boolean {
  const sn = Math.sqrt(sun[0] * sun[0] + sun[1] * sun[1] + sun[2] * sun[2]);
  const along = (r[0] * sun[0] + r[1] * sun[1] + r[2] * sun[2]) / sn;
  if (along >= 0) return false;
  const r2 = r[0] * r[0] + r[1] * r[1] + r[2] * r[2];
  return r2 - along * along < radius * radius;
}

/**
 * Cannonball radiation pressure, away from the Sun: a = P (1 + eps) (A/m) (AU / |d|)^2 d/|d|, d = r - sun,
 * P = 4.56e-6 N/m^2 at 1 AU (Montenbruck & Gill 2000 sec. 3.4, from memory). A/m in m^2/kg gives
 * m/s^2: x 1e-3 for km/s^2. No shadow here: the caller applies one.
 */
export function srpAcceleration(r: Vec3, sun: Vec3, areaToMass: number, reflectivity: number, auKm: number): Vec3 {
  const dx = r[0] - sun[0];
  const dy = r[1] - sun[1];
  const dz = r[2] - sun[2];
  const d2 = dx * dx + dy * dy + dz * dz;
  const c = (1e-3 * SOLAR_PRESSURE_1AU_N_M2 * (1 + reflectivity) * areaToMass * auKm * auKm) / (d2 * Math.sqrt(d2));
  return [c * dx, c * dy, c * dz];
}
