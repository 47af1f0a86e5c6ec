// Vector algebra against identities that hold for every vector (common practice, no source):
// a x b is perpendicular to a and b, |a x b|^2 + (a.b)^2 = |a|^2 |b|^2 (Lagrange's identity),
// the right-handed basis i x j = k.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { add, combine, cross, dot, isFiniteVec, norm, scale, sub, unit, vec3, type Vec3 } from '../../../src/solver/core/vec3.js';
import { expectClose } from '../../helpers/approx.js';

const component = fc.double({ min: -1e6, max: 1e6, noNaN: true });
const vector = fc.tuple(component, component, component) as fc.Arbitrary<Vec3>;

describe('vec3', () => {
  it('i x j = k, j x k = i, k x i = j (right-handed axes)', () => {
    const [i, j, k] = [vec3(1, 0, 0), vec3(0, 1, 0), vec3(0, 0, 1)];
    expect(cross(i, j)).toEqual(k);
    expect(cross(j, k)).toEqual(i);
    expect(cross(k, i)).toEqual(j);
  });

  it('a x b is perpendicular to both and obeys Lagrange\'s identity', () => {
    fc.assert(fc.property(vector, vector, (a, b) => {
      const c = cross(a, b);
      const scaleAB = norm(a) * norm(b);
      const tolerance = 1e-9 * scaleAB * scaleAB + 1e-300;
      return Math.abs(dot(c, a)) <= 1e-9 * norm(c) * norm(a) + 1e-300
        && Math.abs(dot(c, b)) <= 1e-9 * norm(c) * norm(b) + 1e-300
        && Math.abs(dot(c, c) + dot(a, b) ** 2 - scaleAB ** 2) <= tolerance;
    }));
  });

  it('add, sub, scale and combine agree with each other', () => {
    fc.assert(fc.property(vector, vector, component, component, (a, b, s, t) => {
      const viaParts = add(scale(a, s), scale(b, t));
      const combined = combine(a, s, b, t);
      return combined.every((x, n) => Math.abs(x - viaParts[n]!) <= 1e-9 * (Math.abs(x) + 1)) && sub(add(a, b), b).every((x, n) => Math.abs(x - a[n]!) <= 1e-9 * (Math.abs(a[n]!) + Math.abs(b[n]!) + 1));
    }));
  });

  it('norm is the Euclidean length (3-4-12 gives 13) and unit has length 1', () => {
    expect(norm([3, 4, 12])).toBe(13);
    expectClose(norm(unit([1e-200, 2e-200, -2e-200])), 1, 1e-15, 'unit of a tiny vector');
  });

  it('isFiniteVec refuses NaN and infinities', () => {
    expect(isFiniteVec([1, 2, 3])).toBe(true);
    expect(isFiniteVec([1, Number.NaN, 3])).toBe(false);
    expect(isFiniteVec([Number.POSITIVE_INFINITY, 0, 0])).toBe(false);
  });
});
