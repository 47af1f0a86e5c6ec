// The scenario hash: SHA-256 (FIPS 180-4) of the RFC 8785 canonical JSON of { kind, solverVersion, scenario }.
import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { canonicalJson, scenarioHash } from '../../src/scenario/hash.js';
import { SOLVER_VERSION } from '../../src/solver/core/version.js';

describe('canonicalJson', () => {
  it('sorts keys and prints numbers in their shortest form (RFC 8785 sec. 3.2.2.3 and 3.2.3)', () => {
    expect(canonicalJson({ b: 1, a: [2.5, 1e21, 1e-7], c: { z: 'x', y: null } })).toBe('{"a":[2.5,1e+21,1e-7],"b":1,"c":{"y":null,"z":"x"}}');
    expect(canonicalJson(JSON.parse('{"x":2500.0,"y":1.50}'))).toBe('{"x":2500,"y":1.5}');
  });

  it('refuses a value JSON cannot carry', () => {
    expect(() => canonicalJson(undefined)).toThrow(TypeError);
  });
});

describe('scenarioHash', () => {
  it('is the SHA-256 of the canonical wrapper, computed independently here', () => {
    const scenario = { centralBody: 'earth', elements: { eccentricity: 0.1 } };
    const wrapper = `{"kind":"orbit","scenario":{"centralBody":"earth","elements":{"eccentricity":0.1}},"solverVersion":${JSON.stringify(SOLVER_VERSION)}}`;
    expect(scenarioHash('orbit', scenario)).toBe(createHash('sha256').update(wrapper).digest('hex'));
  });

  it('does not depend on key order, and differs between kinds and between scenarios', () => {
    fc.assert(fc.property(fc.dictionary(fc.string({ minLength: 1, maxLength: 8 }), fc.double({ noNaN: true, noDefaultInfinity: true })), (d) => {
      const reversed = Object.fromEntries(Object.entries(d).reverse());
      return scenarioHash('track', d) === scenarioHash('track', reversed) && scenarioHash('track', d) !== scenarioHash('passes', d);
    }));
    expect(scenarioHash('orbit', { a: 1 })).not.toBe(scenarioHash('orbit', { a: 2 }));
  });
});
