// Hand-written types for the parts of odex 2.0.4 (Hairer & Wanner's ODEX, Gragg-Bulirsch-Stoer
// extrapolation) that src/solver/numerics/ode.ts uses. The package ships raw .ts that does not pass this
// project's strict settings, so it is loaded at run time by src/solver-runtime/odex-loader.ts and
// typed here instead of through its own sources.

/** y' = f(x, y); returns an array of length n. */
export type OdexDerivative = (x: number, y: number[]) => number[];

/** Dense-output interpolant of one accepted step: valid only for x in [xOld, x] and only during the callback. */
export type OdexInterpolant = (component: number, x: number) => number;

/**
 * Called once at the start (step 1, no interpolant) and after every accepted step.
 * Returning false stops the integration (outcome EarlyReturn).
 */
export type OdexObserver = (
  step: number,
  xOld: number,
  x: number,
  y: number[],
  interpolant?: OdexInterpolant | false,
) => boolean | void;

/** 0 converged, 1 maxSteps exceeded (state is from an earlier time!), 2 stopped by the observer. */
export type OdexOutcome = 0 | 1 | 2;

export interface OdexResult {
  y: number[];
  outcome: OdexOutcome;
  nStep: number;
  /** The requested end, echoed back even when the integration stopped earlier. */
  xEnd: number;
  nAccept: number;
  nReject: number;
  nEval: number;
}

export interface OdexSolver {
  readonly n: number;
  maxSteps: number;
  initialStepSize: number;
  maxStepSize: number;
  denseOutput: boolean;
  relativeTolerance: number | number[];
  absoluteTolerance: number | number[];
  solve(f: OdexDerivative, x0: number, y0: number[], xEnd: number, observer?: OdexObserver): OdexResult;
}

export interface OdexModule {
  Solver: new (n: number) => OdexSolver;
}
