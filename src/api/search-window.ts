// The window of a search (passes, eclipses) and the propagation it runs on: ISO epochs -> TT,
// a reversed window refused, and (analytic models) a trajectory that meets the body within the
// window refused as /v1/track would (the numerical model checks while it integrates).
import { ProblemError, solverProblem } from '../errors.js';
import type { CentralBody } from '../solver/bodies/bodies.js';
import type { Vec3 } from '../solver/core/vec3.js';
import type { PropagationSpec } from '../solver/propagation/propagator.js';
import type { Force } from '../solver/propagation/perturbations.js';
import { propagateTrack } from '../solver/propagation/track.js';
import type { Sgp4ElementSet } from '../solver/propagation/sgp4.js';
import { epochTT } from './epoch.js';

export interface SearchRequest {
  readonly window: { readonly start: string; readonly stop: string };
  readonly model: PropagationSpec['model'];
  readonly forces: readonly Force[];
}

/** The propagation and the TT window of a validated search request. */
export function searchWindow(req: SearchRequest, body: CentralBody, start: { r: Vec3; v: Vec3; epochTT: number; sgp4?: Sgp4ElementSet | undefined }): { spec: PropagationSpec; startTT: number; stopTT: number } {
  const [startTT, stopTT] = [epochTT(req.window.start), epochTT(req.window.stop)];
  if (!(stopTT > startTT)) throw new ProblemError('validation-failed', 'the window stop must be after its start', { errors: [{ path: 'body.window.stop', message: 'must be after start' }] });
  const spec: PropagationSpec = { body, model: req.model, forces: req.forces, r0: start.r, v0: start.v, epochTT: start.epochTT, ...(req.model === 'sgp4' && start.sgp4 ? { sgp4: start.sgp4 } : {}) };
  // sgp4 reports where the method stops inside the search (the answer keeps what came before).
  if (req.model !== 'numerical' && req.model !== 'sgp4') {
    const surface = propagateTrack({ ...spec, epochsTT: Float64Array.of(startTT, stopTT) });
    if (!surface.ok) throw solverProblem(surface);
  }
  return { spec, startTT, stopTT };
}
