// The window of a search (passes, eclipses) and the propagation it runs on: ISO epochs -> TT,
// a reversed window refused, and (analytic models) a trajectory that meets the body within the
// window refused as /v1/track would (the numerical model checks while it integrates).
import { ProblemError, solverProblem } from '../errors.js';
import type { CentralBody } from '../solver/bodies/bodies.js';
import type { PropagationSpec } from '../solver/propagation/propagator.js';
import type { Force } from '../solver/propagation/perturbations.js';
import { propagateTrack } from '../solver/propagation/track.js';
import { checkCoverage } from '../solver/propagation/ephemeris.js';
import { epochTT } from './epoch.js';
import type { InitialState } from './orbit.js';

export interface SearchRequest {
  readonly window: { readonly start: string; readonly stop: string };
  readonly model: PropagationSpec['model'];
  readonly forces: readonly Force[];
}

/** The propagation and the TT window of a validated search request. */
export function searchWindow(req: SearchRequest, body: CentralBody, start: InitialState): { spec: PropagationSpec; startTT: number; stopTT: number } {
  const [startTT, stopTT] = [epochTT(req.window.start), epochTT(req.window.stop)];
  if (!(stopTT > startTT)) throw new ProblemError('validation-failed', 'the window stop must be after its start', { errors: [{ path: 'body.window.stop', message: 'must be after start' }] });
  const spec: PropagationSpec = {
    body, model: req.model, forces: req.forces, r0: start.r, v0: start.v, epochTT: start.epochTT,
    ...(req.model === 'sgp4' && start.sgp4 ? { sgp4: start.sgp4 } : {}),
    ...(req.model === 'ephemeris' && start.ephemeris ? { ephemeris: start.ephemeris.ephemeris } : {}),
  };
  // An ephemeris is interpolated, never extrapolated: the whole window must lie in its coverage.
  if (spec.ephemeris) {
    const covered = checkCoverage(spec.ephemeris, startTT, stopTT);
    if (!covered.ok) throw solverProblem(covered);
  }
  // sgp4 reports where the method stops inside the search (the answer keeps what came before).
  if (req.model !== 'numerical' && req.model !== 'sgp4' && req.model !== 'ephemeris') {
    const surface = propagateTrack({ ...spec, epochsTT: Float64Array.of(startTT, stopTT) });
    if (!surface.ok) throw solverProblem(surface);
  }
  return { spec, startTT, stopTT };
}
