import { describe, expect, it } from 'vitest';
import * as solver from '../../src/solver/index.js';
import { expectClose } from '../helpers/approx.js';

describe('the solver as a library (package export "apsides/solver")', () => {
  it('exposes the orbit, propagation, frame and central-force entry points', () => {
    for (const name of ['solveOrbit', 'stateToElements', 'elementsToState', 'propagate', 'propagateGrid', 'statesAt', 'reduceTwoBody',
      'analyseCentralForce', 'radialTrack', 'findPasses', 'gcrfToItrf', 'geodeticToEarthFixed', 'parseUtcIso', 'formatUtcIso']) {
      expect(typeof (solver as Record<string, unknown>)[name], name).toBe('function');
    }
    expect(solver.BODIES.earth.gm).toBeGreaterThan(0);
  });

  it('solves a published example through the entry point alone (Curtis 3rd ed. Example 4.3, from memory: e = 0.1712, i = 153.2 deg)', () => {
    const result = solver.solveOrbit({ name: 'earth', gm: 398_600, sources: {} }, { r: [-6045, -3490, 2500], v: [-3.457, 6.618, 2.533] });
    if (!result.ok) throw new Error(result.message);
    expectClose(result.value.elements.eccentricity, 0.1712, 5e-5, 'e');
    expectClose(result.value.elements.inclination * solver.RAD, 153.2, 0.05, 'i');
  });
});
