// Eclipses between the API and the solver: the request -> the worker job, and the solver's
// eclipses (TT seconds, radians) -> the answer (ISO epochs, degrees) and the CSV table.
import type { CentralBody } from '../solver/bodies/bodies.js';
import { RAD } from '../solver/core/math.js';
import type { FrameOptions } from '../solver/earth/frames.js';
import type { Eclipse as SolverEclipse } from '../solver/light/eclipses.js';
import { formatUtcIso } from '../solver/time/time.js';
import type { Eclipse, EclipsesAnswer, EclipsesRequest } from '../schemas/eclipses.js';
import type { EclipsesJob, EclipsesJobResult } from '../workers/jobs.js';
import { epochTT } from './epoch.js';
import { searchWindow } from './search-window.js';
import { searchDiagnostics } from './diagnostics.js';
import { forSpan } from './earth-orientation.js';
import type { EarthOrientationDiagnostics } from '../schemas/diagnostics.js';
import type { InitialState } from './orbit.js';

export const SHADOW_MODEL_TEXT =
  'conical umbra and penumbra of a spherical Earth of the WGS-84 equatorial radius (and of the Moon, mean radius 1737.4 km, when asked) ' +
  'lit by a spherical Sun of radius 695700 km (Montenbruck & Gill 2000, sec. 3.4.2); Sun from astronomy-engine, apparent geocentric direction ' +
  '(annual aberration, no light-time); no atmosphere, no oblateness';

/** The worker job of a validated eclipse request (the window checked by searchWindow). */
export function eclipseSearchJob(req: Omit<EclipsesRequest, 'format'>, body: CentralBody, start: InitialState, frame: FrameOptions): EclipsesJob {
  const { spec, startTT, stopTT } = searchWindow(req, body, start);
  return { kind: 'eclipses', spec, startTT, stopTT, options: { moon: req.moon, ...forSpan(frame, startTT, stopTT), gm: body.gm } };
}

const toEclipse = (e: SolverEclipse): Eclipse => ({
  start: formatUtcIso(e.start),
  stop: formatUtcIso(e.stop),
  umbraStart: e.umbraStart === null ? null : formatUtcIso(e.umbraStart),
  umbraStop: e.umbraStop === null ? null : formatUtcIso(e.umbraStop),
  duration: e.durationS,
  umbraDuration: e.umbraDurationS,
  depth: e.depth,
  startsBeforeWindow: e.startsBeforeWindow,
  endsAfterWindow: e.endsAfterWindow,
});

/** The /v1/eclipses answer for a finished search. */
export function toEclipsesAnswer(req: Omit<EclipsesRequest, 'format'>, hash: string, found: EclipsesJobResult, start: InitialState, earthOrientation?: EarthOrientationDiagnostics): EclipsesAnswer {
  return {
    scenarioHash: hash,
    model: req.model,
    window: { start: formatUtcIso(epochTT(req.window.start)), stop: formatUtcIso(epochTT(req.window.stop)) },
    shadow: SHADOW_MODEL_TEXT,
    coarseStep: found.coarseStepS,
    eclipses: found.eclipses.map(toEclipse),
    moonEclipses: found.moonEclipses ? found.moonEclipses.map(toEclipse) : null,
    beta: { start: found.beta.start * RAD, min: found.beta.min * RAD, max: found.beta.max * RAD },
    sunSynchronous: found.sunSynchronous,
    ascendingNodeLocalTime: found.sunSynchronous ? found.nodeLocalTimeH : null,
    ...(found.stopped ? { propagationStopped: { epoch: formatUtcIso(found.stopped.epochTT), code: found.stopped.code, reason: found.stopped.message } } : {}),
    ...searchDiagnostics(found, start, earthOrientation),
  };
}
