// Brent's method for a bracketed zero: inverse quadratic interpolation and secant steps, with
// bisection whenever they do not shrink the bracket fast enough.

const EPS = Number.EPSILON;

/**
 * Zero of f in [a, b] where f(a) and f(b) have opposite signs: Brent's method (R. P. Brent,
 * Algorithms for Minimization without Derivatives, 1973, ch. 4), to a few ulps of the root.
 */
export function brentRoot(f: (x: number) => number, a: number, b: number, fa = f(a), fb = f(b)): number {
  let c = a;
  let fc = fa;
  let d = b - a;
  let e = d;
  for (let i = 0; i < 300; i++) {
    if ((fb > 0 && fc > 0) || (fb < 0 && fc < 0)) {
      c = a;
      fc = fa;
      d = b - a;
      e = d;
    }
    if (Math.abs(fc) < Math.abs(fb)) {
      [a, b, c] = [b, c, b];
      [fa, fb, fc] = [fb, fc, fb];
    }
    const tol = 2 * EPS * Math.abs(b);
    const half = (c - b) / 2;
    if (Math.abs(half) <= tol || fb === 0) return b;
    if (Math.abs(e) >= tol && Math.abs(fa) > Math.abs(fb)) {
      const s = fb / fa;
      let p: number;
      let q: number;
      if (a === c) {
        p = 2 * half * s; // secant
        q = 1 - s;
      } else {
        const qa = fa / fc; // inverse quadratic interpolation
        const rb = fb / fc;
        p = s * (2 * half * qa * (qa - rb) - (b - a) * (rb - 1));
        q = (qa - 1) * (rb - 1) * (s - 1);
      }
      if (p > 0) q = -q;
      else p = -p;
      if (2 * p < Math.min(3 * half * q - Math.abs(tol * q), Math.abs(e * q))) {
        e = d;
        d = p / q;
      } else {
        d = half;
        e = d;
      }
    } else {
      d = half;
      e = d;
    }
    a = b;
    fa = fb;
    b += Math.abs(d) > tol ? d : half > 0 ? tol : -tol;
    fb = f(b);
  }
  return b;
}
