// One entry to every propagation model: states at many epochs, or a state function for searches.
//   two-body    exact Keplerian motion (universal variables)
//   j2-secular  Keplerian motion with the secular J2 drift of node, periapsis and mean anomaly
//   j2-analytic Brouwer-Lyddane J2 theory: secular drift plus the short-period terms (j2-analytic.ts)
//   numerical   integrated two-body gravity plus chosen forces (J2, drag, Sun, Moon, radiation pressure)
//   ephemeris   states interpolated from given nodes (ephemeris.ts); r0, v0, epochTT are its first node
//   sgp4        the SGP4/SDP4 method from catalogue mean elements (sgp4.ts); r0, v0, epochTT are its
//               GCRF state at the element epoch

import type { CentralBody } from '../bodies/bodies.js';
import { ephemerisStateFunction, ephemerisStates, type Ephemeris } from './ephemeris.js';
import { j2AnalyticPropagator } from './j2-analytic.js';
import { j2SecularPropagator } from './j2-secular.js';
import { bodySpinAxis, propagateNumerical, spanMiddle } from './numerical.js';
import type { Force } from './perturbations.js';
import { failure, success, type Outcome } from '../core/result.js';
import { propagate, propagateGrid } from '../conic/universal.js';
import type { Vec3 } from '../core/vec3.js';
import { cubicHermiteWeights } from '../numerics/hermite.js';
import { sgp4StateFunction, sgp4StatesGcrf, type Sgp4ElementSet } from './sgp4.js';

/** The models that propagate an initial state. */
export const STATE_MODELS = ['two-body', 'j2-secular', 'j2-analytic', 'numerical'] as const;
export const MODELS = [...STATE_MODELS, 'ephemeris', 'sgp4'] as const;
export type Model = (typeof MODELS)[number];

export interface PropagationSpec {
  readonly body: CentralBody;
  readonly model: Model;
  /** Forces of the numerical model (ignored by the others). */
  readonly forces?: readonly Force[];
  /** Initial state (GCRF, km, km/s) at epochTT. */
  readonly r0: Vec3;
  readonly v0: Vec3;
  readonly epochTT: number;
  /** numerical: propagate below the body radius instead of failing with 'impact'. */
  readonly passThroughBody?: boolean;
  /** The nodes of the ephemeris model (required by it, ignored by the others). */
  readonly ephemeris?: Ephemeris;
  /** The element set of the sgp4 model (required by it, ignored by the others). */
  readonly sgp4?: Sgp4ElementSet;
}

const sgp4Of = (spec: PropagationSpec): Sgp4ElementSet => {
  if (!spec.sgp4) throw new TypeError('the sgp4 model needs spec.sgp4');
  return spec.sgp4;
};

const ephemerisOf = (spec: PropagationSpec): Ephemeris => {
  if (!spec.ephemeris) throw new TypeError('the ephemeris model needs spec.ephemeris');
  return spec.ephemeris;
};

/** 6 numbers for each of n epochs: the first 6n of `into` when it holds them, else a new array. */
function statesArray(n: number, into: Float64Array | undefined): Float64Array {
  return into && into.length >= 6 * n ? into.subarray(0, 6 * n) : new Float64Array(6 * n);
}

export type StateFunction = (tt: number) => Outcome<{ r: Vec3; v: Vec3 }>;

/**
 * States (x, y, z, vx, vy, vz per sample) at the epochs, in their order. `into`: memory for them
 * (6 numbers an epoch, or more), used by the two-body and J2 models (the others make their own
 * array); the result is then a view of it.
 */
export function statesAt(spec: PropagationSpec, epochsTT: Float64Array, into?: Float64Array): Outcome<Float64Array> {
  const { body, r0, v0, epochTT } = spec;
  switch (spec.model) {
    case 'two-body': {
      const dt = new Float64Array(epochsTT.length); // a plain loop: TypedArray.map is several times slower here
      for (let k = 0; k < dt.length; k++) dt[k] = epochsTT[k]! - epochTT;
      const out = statesArray(epochsTT.length, into);
      const done = propagateGrid(r0, v0, body.gm, dt, out);
      return done.ok ? success(out) : done;
    }
    case 'j2-secular':
    case 'j2-analytic': {
      const at = spec.model === 'j2-secular'
        ? j2SecularPropagator(body, r0, v0, epochTT)
        : j2AnalyticPropagator(body, r0, v0, epochTT, bodySpinAxis(body, spanMiddle(epochTT, epochsTT)));
      if (!at.ok) return at;
      const out = statesArray(epochsTT.length, into);
      for (let k = 0; k < epochsTT.length; k++) {
        const s = at.value(epochsTT[k]!);
        if (!s.ok) return s;
        out.set(s.value.r, 6 * k);
        out.set(s.value.v, 6 * k + 3);
      }
      return success(out);
    }
    case 'ephemeris': {
      const run = ephemerisStates(ephemerisOf(spec), epochsTT);
      return run.ok ? success(run.value.states) : run;
    }
    case 'sgp4':
      return sgp4StatesGcrf(sgp4Of(spec), epochsTT);
    case 'numerical': {
      const run = propagateNumerical({ body, forces: spec.forces ?? [], r0, v0, epochTT, epochsTT, passThroughBody: spec.passThroughBody ?? false });
      return run.ok ? success(run.value.states) : run;
    }
  }
}

/** Spacing of the numerical model's interpolation nodes, s: cubic Hermite error below 1 m for Earth orbits (h^4/384 |x''''|; common practice, no source). */
export const INTERPOLATION_NODE_SPACING_S = 30;

/**
 * A state at any epoch of [startTT, stopTT], for searches that ask many times (pass search).
 * Analytic models answer directly; the numerical model is integrated once onto nodes every
 * INTERPOLATION_NODE_SPACING_S and interpolated by cubic Hermite polynomials in position and velocity.
 */
export function stateFunction(spec: PropagationSpec, startTT: number, stopTT: number): Outcome<StateFunction> {
  const { body, r0, v0, epochTT } = spec;
  if (spec.model === 'two-body') return success((tt) => propagate(r0, v0, body.gm, tt - epochTT));
  if (spec.model === 'j2-secular') return j2SecularPropagator(body, r0, v0, epochTT);
  // The same spin axis as the numerical model over this span (its nodes run from startTT to stopTT).
  if (spec.model === 'j2-analytic') return j2AnalyticPropagator(body, r0, v0, epochTT, bodySpinAxis(body, spanMiddle(epochTT, [startTT, stopTT])));
  if (spec.model === 'sgp4') return success(sgp4StateFunction(sgp4Of(spec), startTT, stopTT));
  if (spec.model === 'ephemeris') {
    const f = ephemerisStateFunction(ephemerisOf(spec), startTT, stopTT);
    return f.ok ? success(f.value.at) : f;
  }
  const count = Math.max(2, Math.ceil((stopTT - startTT) / INTERPOLATION_NODE_SPACING_S) + 1);
  const h = (stopTT - startTT) / (count - 1);
  const nodes = Float64Array.from({ length: count }, (_, k) => startTT + k * h);
  const states = statesAt(spec, nodes);
  if (!states.ok) return states;
  const s = states.value;
  return success((tt) => {
    if (!(tt >= startTT - 1e-6 && tt <= stopTT + 1e-6)) return failure('invalid-parameter', `epoch outside the interpolated span [${startTT}, ${stopTT}] TT s`);
    const k = Math.min(count - 2, Math.max(0, Math.floor((tt - startTT) / h)));
    return success(hermite(s, k, (tt - nodes[k]!) / h, h));
  });
}

/** Cubic Hermite interpolation of position and velocity between nodes k and k+1 at fraction u of a step h. */
function hermite(s: Float64Array, k: number, u: number, h: number): { r: Vec3; v: Vec3 } {
  const w = new Float64Array(8);
  cubicHermiteWeights(u, h, w);
  const a = 6 * k;
  const b = 6 * (k + 1);
  const r = [0, 0, 0];
  const v = [0, 0, 0];
  for (let c = 0; c < 3; c++) {
    const p0 = s[a + c]!;
    const m0 = s[a + 3 + c]!;
    const p1 = s[b + c]!;
    const m1 = s[b + 3 + c]!;
    r[c] = w[0]! * p0 + w[1]! * m0 + w[2]! * p1 + w[3]! * m1;
    v[c] = w[4]! * p0 + w[5]! * m0 + w[6]! * p1 + w[7]! * m1;
  }
  return { r: r as unknown as Vec3, v: v as unknown as Vec3 };
}
