// Independent two-body references for the tests, built from classical elements rather than the
// universal variable: Kepler's equation solved by bisection (ellipse: E - e sin E = M; hyperbola:
// e sinh F - F = M) and Barker's equation for the parabola. Formulas: Curtis, Orbital Mechanics for
// Engineering Students, 3rd ed., ch. 3 (eqs. 3.14, 3.30-3.32, 3.40-3.44) and Vallado, Fundamentals
// of Astrodynamics and Applications, 4th ed., sec. 2.2-2.3; equation numbers from memory.

type V3 = [number, number, number];

const dot = (a: readonly number[], b: readonly number[]): number => a[0]! * b[0]! + a[1]! * b[1]! + a[2]! * b[2]!;
const cross = (a: readonly number[], b: readonly number[]): V3 => [
  a[1]! * b[2]! - a[2]! * b[1]!,
  a[2]! * b[0]! - a[0]! * b[2]!,
  a[0]! * b[1]! - a[1]! * b[0]!,
];
const norm = (a: readonly number[]): number => Math.sqrt(dot(a, a));
const lin = (p: readonly number[], s: number, q: readonly number[], t: number): V3 => [p[0]! * s + q[0]! * t, p[1]! * s + q[1]! * t, p[2]! * s + q[2]! * t];

/** Root of an increasing function on [lo, hi] by plain bisection down to adjacent doubles. */
function bisect(fn: (x: number) => number, lo: number, hi: number): number {
  for (let i = 0; i < 2000; i++) {
    const mid = 0.5 * (lo + hi);
    if (mid <= lo || mid >= hi) break;
    if (fn(mid) < 0) lo = mid;
    else hi = mid;
  }
  return 0.5 * (lo + hi);
}

/** Perifocal unit vectors P (to periapsis) and Q, and the orbit constants, from a state (needs e > ~1e-6). */
function orbitFrame(r0: readonly number[], v0: readonly number[], mu: number) {
  const r = norm(r0);
  const h = cross(r0, v0);
  const ev = lin(r0, dot(v0, v0) / mu - 1 / r, v0, -dot(r0, v0) / mu); // eccentricity vector (Curtis 3rd ed. ch. 2, from memory)
  const e = norm(ev);
  const P = lin(ev, 1 / e, ev, 0);
  const Q = cross(h, P).map((c) => c / norm(h)) as V3;
  const a = 1 / (2 / r - dot(v0, v0) / mu);
  return { r, h: norm(h), e, P, Q, a, sigma: dot(r0, v0) };
}

/** State after dt on an ellipse (0 < e < 1), from the eccentric anomaly. */
export function ellipseReference(r0: readonly number[], v0: readonly number[], mu: number, dt: number): { r: V3; v: V3 } {
  const { r, e, P, Q, a, sigma } = orbitFrame(r0, v0, mu);
  const n = Math.sqrt(mu / (a * a * a));
  const E0 = Math.atan2(sigma / Math.sqrt(mu * a), 1 - r / a); // e sin E0, e cos E0
  const M = E0 - e * Math.sin(E0) + n * dt;
  const E = bisect((x) => x - e * Math.sin(x) - M, M - e - 1e-9, M + e + 1e-9);
  const b = a * Math.sqrt(1 - e * e);
  const rNow = a * (1 - e * Math.cos(E));
  const rate = Math.sqrt(mu * a) / rNow;
  return {
    r: lin(P, a * (Math.cos(E) - e), Q, b * Math.sin(E)),
    v: lin(P, -rate * Math.sin(E), Q, rate * Math.sqrt(1 - e * e) * Math.cos(E)),
  };
}

/** State after dt on a hyperbola (e > 1), from the hyperbolic anomaly. */
export function hyperbolaReference(r0: readonly number[], v0: readonly number[], mu: number, dt: number): { r: V3; v: V3 } {
  const { e, P, Q, a, sigma } = orbitFrame(r0, v0, mu); // a < 0
  const n = Math.sqrt(mu / -(a * a * a));
  const F0 = Math.asinh(sigma / (e * Math.sqrt(-mu * a)));
  const M = e * Math.sinh(F0) - F0 + n * dt;
  const span = Math.asinh(Math.abs(M) / e) + Math.abs(M) + 1;
  const F = bisect((x) => e * Math.sinh(x) - x - M, -span, span);
  const fDot = n / (e * Math.cosh(F) - 1);
  const k = Math.sqrt(e * e - 1);
  return {
    r: lin(P, a * (Math.cosh(F) - e), Q, -a * k * Math.sinh(F)),
    v: lin(P, a * Math.sinh(F) * fDot, Q, -a * k * Math.cosh(F) * fDot),
  };
}

/**
 * Parabola through periapsis radius rp at t = 0 in the x-y plane (periapsis on +x): Barker's
 * equation solved in closed form, tan(theta/2) = c - 1/c, c = cbrt(3 Mp + sqrt((3 Mp)^2 + 1)),
 * Mp = mu^2 t / h^3 (Curtis 3rd ed. eqs. 3.30-3.32, from memory).
 */
export function parabolaReference(rp: number, mu: number, t: number): { r: V3; v: V3 } {
  const h = Math.sqrt(2 * mu * rp);
  const mp = (mu * mu * t) / (h * h * h);
  const c = Math.cbrt(3 * mp + Math.sqrt(9 * mp * mp + 1));
  const half = Math.atan(c - 1 / c);
  const theta = 2 * half;
  const r = (h * h) / mu / (1 + Math.cos(theta));
  return { r: [r * Math.cos(theta), r * Math.sin(theta), 0], v: [(-mu / h) * Math.sin(theta), (mu / h) * (1 + Math.cos(theta)), 0] };
}

/** Inertial state from classical elements via the perifocal frame and the 3-1-3 rotation (Curtis 3rd ed. Alg. 4.5, from memory). */
export function stateFromElements(rp: number, e: number, inc: number, raan: number, argp: number, nu: number, mu: number): { r: V3; v: V3 } {
  const p = rp * (1 + e);
  const h = Math.sqrt(mu * p);
  const r = p / (1 + e * Math.cos(nu));
  const rpf = [r * Math.cos(nu), r * Math.sin(nu), 0];
  const vpf = [(-mu / h) * Math.sin(nu), (mu / h) * (e + Math.cos(nu)), 0];
  const [cO, sO, ci, si, cw, sw] = [Math.cos(raan), Math.sin(raan), Math.cos(inc), Math.sin(inc), Math.cos(argp), Math.sin(argp)];
  const rot = (x: readonly number[]): V3 => [
    (cO * cw - sO * sw * ci) * x[0]! + (-cO * sw - sO * cw * ci) * x[1]!,
    (sO * cw + cO * sw * ci) * x[0]! + (-sO * sw + cO * cw * ci) * x[1]!,
    sw * si * x[0]! + cw * si * x[1]!,
  ];
  return { r: rot(rpf), v: rot(vpf) };
}
