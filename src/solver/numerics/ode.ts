// Numerical integration of y' = f(t, y): the one wrapper around odex (Gragg-Bulirsch-Stoer
// extrapolation with dense output; Hairer, Norsett & Wanner, Solving ODEs I, 2nd ed., sec. II.9).
// It guards the library's silent failure modes: a step limit that returns an old state, NaN that
// is accepted as a step, and a dense interpolant that is valid only inside the step callback.

import { odex } from '../../solver-runtime/odex-loader.js';
import { failure, success, type Outcome } from '../core/result.js';

export interface IntegrateOptions {
  /** Absolute tolerance, one value or one per component, positive (default 1e-10). */
  readonly absTol?: number | readonly number[];
  /** Relative tolerance, one value or one per component, 0 allowed (default 1e-10). Error test: |err_i| <= absTol_i + relTol_i |y_i|. */
  readonly relTol?: number | readonly number[];
  /** Limit on integration steps, accepted and rejected (default 50 000, at most 1 000 000). */
  readonly maxSteps?: number;
  /**
   * Checked at every output sample (before it is kept) and after every accepted step; true ends
   * the integration: the samples before that point are returned and `stopped` is set.
   */
  readonly stop?: (t: number, y: readonly number[]) => boolean;
}

export interface Trajectory {
  /** The requested times reached, in the order given. */
  readonly t: number[];
  /** State at each time in t. */
  readonly y: number[][];
  /** True when `stop` ended the integration before the last requested time. */
  readonly stopped: boolean;
  /** Time of the last accepted step (the stop time when stopped). */
  readonly tReached: number;
  readonly steps: number;
  readonly evaluations: number;
}

export const DEFAULT_TOLERANCE = 1e-10;
export const DEFAULT_MAX_STEPS = 50_000;
export const MAX_STEPS_LIMIT = 1_000_000;

/** Thrown from inside odex to abandon a step whose derivative is not finite. */
class NonFiniteDerivative extends Error {
  constructor(readonly t: number) {
    super(`derivative not finite at t = ${t}`);
  }
}

const allFinite = (v: readonly number[]): boolean => v.every(Number.isFinite);

function checkTolerance(tol: number | readonly number[], n: number, name: string, zeroAllowed: boolean): string | null {
  const values = typeof tol === 'number' ? [tol] : tol;
  if (typeof tol !== 'number' && tol.length !== n) return `${name} has ${tol.length} entries for ${n} components`;
  const ok = values.every((v) => Number.isFinite(v) && (v > 0 || (zeroAllowed && v === 0)));
  return ok ? null : `${name} must be finite and ${zeroAllowed ? 'non-negative' : 'positive'}`;
}

/** The checks of integrate's inputs; a message when one fails, else null. */
function invalidInputs(y0: readonly number[], t0: number, times: readonly number[], absTol: number | readonly number[], relTol: number | readonly number[], maxSteps: number): string | null {
  const n = y0.length;
  if (n === 0 || !allFinite(y0) || !Number.isFinite(t0)) return 'initial state and time must be finite, with at least one component';
  if (times.length === 0 || !allFinite(times)) return 'give at least one finite output time';
  const direction = times[times.length - 1]! >= t0 ? 1 : -1;
  for (let i = 0; i < times.length; i++) {
    const previous = i === 0 ? t0 : times[i - 1]!;
    if ((times[i]! - previous) * direction < 0) return 'output times must run one way from the start time (sorted, all after it or all before it)';
  }
  const tolProblem = checkTolerance(absTol, n, 'absTol', false) ?? checkTolerance(relTol, n, 'relTol', true);
  if (tolProblem) return tolProblem;
  if (!Number.isInteger(maxSteps) || maxSteps < 1 || maxSteps > MAX_STEPS_LIMIT) return `maxSteps must be an integer in 1..${MAX_STEPS_LIMIT}`;
  return null;
}

/** What the step observer collects: the samples taken so far and why the integration ended early. */
interface Collected {
  readonly t: number[];
  readonly y: number[][];
  next: number;
  tReached: number;
  stopped: boolean;
  nonFinite: number | null;
}

/** odex's step observer: samples every requested time inside the step from its dense output; false ends the integration. */
function stepObserver(times: readonly number[], n: number, direction: number, stop: IntegrateOptions['stop'], out: Collected) {
  return (step: number, tOld: number, t: number, y: number[], dense?: ((c: number, x: number) => number) | false): boolean => {
    if (step === 1 || !dense) return true; // the call at the start carries no interpolant
    if (!allFinite(y)) {
      out.nonFinite = t;
      return false;
    }
    out.tReached = t;
    // odex lands on the end only to within a few ulps: a sample a rounding away from t belongs here.
    const slack = 8 * Number.EPSILON * Math.max(Math.abs(t), Math.abs(t - tOld));
    while (out.next < times.length && (times[out.next]! - t) * direction <= slack) {
      const ts = times[out.next]!;
      const ys = Array.from({ length: n }, (_, c) => dense(c, ts));
      if (!allFinite(ys)) {
        out.nonFinite = ts;
        return false;
      }
      if (stop?.(ts, ys)) {
        out.stopped = true;
        return false;
      }
      out.t.push(ts);
      out.y.push(ys);
      out.next++;
    }
    if (out.next < times.length && stop?.(t, y)) {
      out.stopped = true;
      return false;
    }
    return true;
  };
}

/**
 * Integrate y' = f(t, y) from (t0, y0) and return the state at each requested time.
 * `times` run one way from t0 (all >= t0, non-decreasing, or all <= t0, non-increasing: backward).
 * Samples come from the dense-output interpolant of the step that contains them.
 * Failures: 'invalid-parameter' (bad inputs), 'integration-failed' (step limit reached,
 * derivative not finite).
 */
export function integrate(
  f: (t: number, y: readonly number[]) => number[],
  y0: readonly number[],
  t0: number,
  times: readonly number[],
  opts: IntegrateOptions = {},
): Outcome<Trajectory> {
  const n = y0.length;
  const absTol = opts.absTol ?? DEFAULT_TOLERANCE;
  const relTol = opts.relTol ?? DEFAULT_TOLERANCE;
  const maxSteps = opts.maxSteps ?? DEFAULT_MAX_STEPS;
  const invalid = invalidInputs(y0, t0, times, absTol, relTol, maxSteps);
  if (invalid) return failure('invalid-parameter', invalid);
  const tEnd = times[times.length - 1]!;
  const direction = tEnd >= t0 ? 1 : -1;

  const out: Collected = { t: [], y: [], next: 0, tReached: t0, stopped: false, nonFinite: null };
  while (out.next < times.length && times[out.next] === t0) {
    out.t.push(t0);
    out.y.push([...y0]);
    out.next++;
  }
  if (out.next === times.length) return success({ t: out.t, y: out.y, stopped: false, tReached: t0, steps: 0, evaluations: 0 });

  const derivative = (t: number, y: number[]): number[] => {
    const dy = f(t, y);
    if (dy.length !== n) throw new Error(`right-hand side returned ${dy.length} components, expected ${n}`);
    if (!allFinite(dy) || !allFinite(y)) throw new NonFiniteDerivative(t);
    return dy;
  };

  const solver = new odex.Solver(n);
  solver.denseOutput = true;
  solver.absoluteTolerance = typeof absTol === 'number' ? absTol : [...absTol];
  solver.relativeTolerance = typeof relTol === 'number' ? relTol : [...relTol];
  solver.maxSteps = maxSteps;
  let result;
  try {
    result = solver.solve(derivative, t0, [...y0], tEnd, stepObserver(times, n, direction, opts.stop, out));
  } catch (error) {
    if (error instanceof NonFiniteDerivative) out.nonFinite = error.t;
    else throw error;
  }
  if (out.nonFinite !== null) {
    return failure('integration-failed', `the state or its derivative is not finite at t = ${out.nonFinite} (after t = ${out.tReached}); the motion likely reaches a singularity`);
  }
  if (!result) throw new Error('odex returned no result');
  if (result.outcome === 1) {
    return failure('integration-failed', `step limit of ${maxSteps} reached at t = ${out.tReached} before t = ${tEnd}; shorten the span or raise maxSteps`);
  }
  if (!out.stopped && out.next < times.length) {
    return failure('integration-failed', `integration ended at t = ${out.tReached} before the requested time ${times[out.next]}`);
  }
  return success({ t: out.t, y: out.y, stopped: out.stopped, tReached: out.tReached, steps: result.nStep, evaluations: result.nEval });
}
