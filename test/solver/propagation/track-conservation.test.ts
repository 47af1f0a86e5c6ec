import { describe, expect, it } from 'vitest';
import { conservationDrift } from '../../../src/solver/conic/universal.js';
import { bodySpinAxis, spanMiddle } from '../../../src/solver/propagation/numerical.js';
import { propagateTrack, type TrackInput } from '../../../src/solver/propagation/track.js';
import { DAY, earth, EPOCH_TT, J2_ORBITS, startState } from './j2-orbits.js';

const s = startState(J2_ORBITS.sso);
const epochsTT = Float64Array.from({ length: 289 }, (_, k) => EPOCH_TT + (k * DAY) / 288);
const base: Omit<TrackInput, 'model'> = { body: earth, r0: s.r, v0: s.v, epochTT: EPOCH_TT, epochsTT };
const track = (extra: Partial<TrackInput> & Pick<TrackInput, 'model'>) => {
  const t = propagateTrack({ ...base, ...extra });
  if (!t.ok) throw new Error(t.message);
  return t.value;
};

/** The J2 energy integral, v^2/2 - mu/r + mu J2 R^2 (3 z^2/r^2 - 1) / (2 r^3), z along k (Vallado 4th ed. sec. 8.6.1 potential, from memory), written here apart from the code. */
function j2EnergyDrift(states: Float64Array, k: readonly number[]): number {
  const mu = earth.gm;
  const c = mu * earth.j2! * earth.radius! ** 2;
  const at = (o: number) => {
    const r = Math.hypot(states[o]!, states[o + 1]!, states[o + 2]!);
    const z = states[o]! * k[0]! + states[o + 1]! * k[1]! + states[o + 2]! * k[2]!;
    return Math.hypot(states[o + 3]!, states[o + 4]!, states[o + 5]!) ** 2 / 2 - mu / r + (c * (3 * (z / r) ** 2 - 1)) / (2 * r ** 3);
  };
  let worst = 0;
  for (let o = 6; o < states.length; o += 6) worst = Math.max(worst, Math.abs(at(o) - at(0)));
  return worst / Math.abs(at(0));
}

describe('track conservation: the integrals of each model\'s own dynamics', () => {
  it('numerical with J2 only reports the J2 energy integral, conserved to integration error, where the two-body energy swings by ~1e-3', () => {
    const t = track({ model: 'numerical', forces: [{ kind: 'j2' }] });
    expect(t.conservation.quantity).toBe('j2');
    const drift = t.conservation.drift!;
    const k = bodySpinAxis(earth, spanMiddle(EPOCH_TT, epochsTT));
    expect(drift.energy).toBeLessThan(1e-10);
    expect(drift.energy).toBeCloseTo(j2EnergyDrift(t.states, k), 12);
    expect(drift.angularMomentum).toBeLessThan(1e-10);
    // What the diagnostics printed before: the two-body energy, which J2 changes every revolution.
    expect(conservationDrift({ states: t.states }, earth.gm).energy).toBeGreaterThan(1e-4);
  });

  it('analytic J2 models report the same integral: its drift is the size of the terms they leave out (j2-analytic far below j2-secular)', () => {
    const analytic = track({ model: 'j2-analytic' });
    const secular = track({ model: 'j2-secular' });
    expect(analytic.conservation.quantity).toBe('j2');
    expect(secular.conservation.quantity).toBe('j2');
    expect(analytic.conservation.meaning).toMatch(/leaves out/);
    expect(analytic.conservation.drift!.energy).toBeCloseTo(j2EnergyDrift(analytic.states, bodySpinAxis(earth, spanMiddle(EPOCH_TT, epochsTT))), 12);
    expect(secular.conservation.drift!.energy).toBeCloseTo(j2EnergyDrift(secular.states, [0, 0, 1]), 12);
    expect(analytic.conservation.drift!.energy).toBeLessThan(1e-5);
    expect(secular.conservation.drift!.energy).toBeGreaterThan(10 * analytic.conservation.drift!.energy);
  });

  it('two-body and force-free numerical tracks report the two-body integrals; drag, third bodies and radiation pressure report none', () => {
    const kepler = track({ model: 'two-body' });
    expect(kepler.conservation.quantity).toBe('two-body');
    expect(kepler.conservation.drift!.energy).toBeLessThan(1e-12);
    expect(track({ model: 'numerical', forces: [] }).conservation.quantity).toBe('two-body');
    for (const forces of [[{ kind: 'j2' }, { kind: 'drag', ballisticCoefficient: 100 }], [{ kind: 'third-body', body: 'moon' }], [{ kind: 'srp', areaToMass: 0.01, reflectivity: 0.3 }]] as const) {
      const t = track({ model: 'numerical', forces });
      expect(t.conservation.quantity).toBe('none');
      expect(t.conservation.drift).toBeNull();
      expect(t.conservation.meaning).toMatch(forces[forces.length - 1]!.kind);
    }
  });
});
