// Expected numerical failures come back as values with a code; programmer errors throw.
// Every code here is mapped to an HTTP problem in src/errors.ts (a test checks the mapping is total).

export const SOLVER_FAILURE_CODES = [
  'invalid-epoch',
  'epoch-out-of-range',
  'zero-position',
  'rectilinear-motion',
  'eccentricity-out-of-range',
  'semi-major-axis-sign',
  'anomaly-beyond-asymptote',
  'no-convergence',
  'impact',
  'invalid-parameter',
  'invalid-horizon-mask',
  'window-too-long',
  'too-many-stations',
  'integration-failed',
  'energy-below-minimum',
  'no-radial-period',
  'outside-coverage',
  'sgp4-failed',
] as const;

export type SolverFailureCode = (typeof SOLVER_FAILURE_CODES)[number];

export interface Failure {
  readonly ok: false;
  readonly code: SolverFailureCode;
  readonly message: string;
}
export interface Success<T> {
  readonly ok: true;
  readonly value: T;
}
export type Outcome<T> = Success<T> | Failure;

export const success = <T>(value: T): Success<T> => ({ ok: true, value });
export const failure = (code: SolverFailureCode, message: string): Failure => ({ ok: false, code, message });
