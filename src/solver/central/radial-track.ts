// The track r(t), phi(t) of central-force motion from the radial equation m r'' = -dU_eff/dr and
// phi' = l / (m r^2) (Goldstein, Classical Mechanics, 3rd ed., sec. 3.2–3.3 — from memory),
// integrated as the first-order system y = [r, rdot, phi] with src/solver/numerics/ode.ts. The second-order
// form stays regular at turning points, where rdot = +-sqrt(2 (E - U_eff)/m) is not.
// l is carried exactly by phi' = l/(m r^2), so only the energy can drift.

import { integrate } from '../numerics/ode.js';
import { effectivePotential, energyScale, type RadialSystem } from './potential.js';
import type { CentralForceAnalysis, CentralForceProblem } from './radial.js';
import { failure, success, type Outcome } from '../core/result.js';

export interface TrackRequest {
  /** Start: the problem's initial state (default when it has one), the periapsis (default otherwise) or the apoapsis of the analysed region. */
  readonly start?: 'initial' | 'periapsis' | 'apoapsis';
  /** Time span from the start; negative integrates backward. Give this or `periods`. */
  readonly duration?: number;
  /** Number of radial periods (bound or circular motion only). */
  readonly periods?: number;
  /** Number of equally spaced samples including both ends (2 to 100 000). */
  readonly samples: number;
  /** Relative tolerance of the integration (default 1e-13; r and rdot relative, phi absolute in radians). */
  readonly relTol?: number;
  /** Integration step limit (default 200 000). */
  readonly maxSteps?: number;
}

export interface RadialTrack {
  readonly t: number[];
  readonly r: number[];
  readonly rDot: number[];
  /** Polar angle from the start, radians, unwrapped (grows with the sense of l). */
  readonly phi: number[];
  /** Energy m rdot^2/2 + U_eff(r) of the start state. */
  readonly energy: number;
  /** Largest |E(t_i) - E(t_0)| over the samples. */
  readonly energyDrift: number;
  /** energyDrift over the energy scale at the start (|E| plus the magnitudes of all parts of U_eff). */
  readonly energyDriftRelative: number;
  readonly angularMomentum: number;
  /** 0 by construction: l enters only through phi' = l/(m r^2). */
  readonly angularMomentumDrift: number;
  /** The motion reached the centre (r below 1e-6 of the start radius) and the track ends there. */
  readonly reachedCentre: boolean;
}

export const MAX_TRACK_SAMPLES = 100_000;
export const DEFAULT_TRACK_TOLERANCE = 1e-13;
export const DEFAULT_TRACK_MAX_STEPS = 200_000;
/** The track stops when r falls below this fraction of the start radius. */
export const CENTRE_FRACTION = 1e-6;

function startState(p: CentralForceProblem, a: CentralForceAnalysis, start: TrackRequest['start']): Outcome<{ r: number; v: number }> {
  const choice = start ?? (p.initial ? 'initial' : 'periapsis');
  if (choice === 'initial') {
    if (!p.initial) return failure('invalid-parameter', 'start "initial" needs a problem built from an initial state');
    return success({ r: p.initial.radius, v: p.initial.radialVelocity });
  }
  const region = a.allowedRegions[a.regionIndex]!;
  const inner = region.inner > 0 ? region.inner : null;
  const r = choice === 'periapsis' ? (inner ?? region.outer) : (region.outer ?? inner);
  if (r === null) return failure('invalid-parameter', 'the motion has no turning point to start from (it reaches both the centre and infinity): give an initial state');
  return success({ r, v: 0 });
}

/**
 * Sample r(t), phi(t) at `samples` equally spaced times over a duration or a number of radial
 * periods, starting from the initial state or a turning point (phi = 0 at the start).
 * Failures: 'invalid-parameter', 'no-radial-period' (periods asked for motion without one),
 * 'integration-failed' (from the integrator).
 */
export function radialTrack(p: CentralForceProblem, a: CentralForceAnalysis, req: TrackRequest): Outcome<RadialTrack> {
  const { samples } = req;
  if (!Number.isInteger(samples) || samples < 2 || samples > MAX_TRACK_SAMPLES) return failure('invalid-parameter', `samples must be an integer in 2..${MAX_TRACK_SAMPLES}`);
  if ((req.duration === undefined) === (req.periods === undefined)) return failure('invalid-parameter', 'give exactly one of duration and periods');
  let duration: number;
  if (req.periods !== undefined) {
    if (!(req.periods > 0) || !Number.isFinite(req.periods)) return failure('invalid-parameter', 'periods must be positive and finite');
    if (a.radialPeriod === null) return failure('no-radial-period', `the motion is ${a.motion} and has no radial period: give a duration instead`);
    duration = req.periods * a.radialPeriod;
  } else {
    duration = req.duration!;
    if (!Number.isFinite(duration) || duration === 0) return failure('invalid-parameter', 'duration must be finite and non-zero');
  }
  const relTol = req.relTol ?? DEFAULT_TRACK_TOLERANCE;
  if (!(relTol >= 1e-14 && relTol <= 1e-3)) return failure('invalid-parameter', 'relTol must lie in [1e-14, 1e-3]');

  const s0 = startState(p, a, req.start);
  if (!s0.ok) return s0;
  const sys: RadialSystem = { terms: p.terms, mass: p.mass, angularMomentum: p.angularMomentum };
  const m = p.mass;
  const l = p.angularMomentum;
  const energyAt = (r: number, v: number): number => (m * v * v) / 2 + effectivePotential(sys, r).value;
  const energy = energyAt(s0.value.r, s0.value.v);
  const scale = energyScale(sys, s0.value.r) + Math.abs(energy);
  const speedScale = Math.sqrt((2 * scale) / m);
  const rStop = CENTRE_FRACTION * s0.value.r;

  // y = [r, rdot, phi]; m r'' = -dU_eff/dr, phi' = l/(m r^2).
  const rhs = (_t: number, y: readonly number[]): number[] => {
    const r = y[0]!;
    return [y[1]!, -effectivePotential(sys, r).first / m, l / (m * r * r)];
  };
  const times = Array.from({ length: samples }, (_, i) => (duration * i) / (samples - 1));
  times[samples - 1] = duration;
  const run = integrate(rhs, [s0.value.r, s0.value.v, 0], 0, times, {
    // phi is an angle: its error is held absolute (a relative test would loosen as phi grows).
    relTol: [relTol, relTol, 0],
    absTol: [relTol * s0.value.r, relTol * speedScale, relTol],
    maxSteps: req.maxSteps ?? DEFAULT_TRACK_MAX_STEPS,
    stop: (_t, y) => y[0]! <= rStop,
  });
  if (!run.ok) return run;

  const { y } = run.value;
  let drift = 0;
  for (const state of y) drift = Math.max(drift, Math.abs(energyAt(state[0]!, state[1]!) - energy));
  return success({
    t: run.value.t,
    r: y.map((s) => s[0]!),
    rDot: y.map((s) => s[1]!),
    phi: y.map((s) => s[2]!),
    energy,
    energyDrift: drift,
    energyDriftRelative: drift / scale,
    angularMomentum: l,
    angularMomentumDrift: 0,
    reachedCentre: run.value.stopped,
  });
}
