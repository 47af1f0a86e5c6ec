// Tracks between the API and the solver: the request -> the worker job, and the job's result ->
// the product's inputs (the answer head, degrees for geodetic coordinates, OEM metadata).
import type { CentralBody } from '../solver/bodies/bodies.js';
import type { Conservation } from '../solver/propagation/track.js';
import type { FrameOptions } from '../solver/earth/frames.js';
import { epochTT } from './epoch.js';
import type { Track } from '../solver/propagation/track.js';
import type { InitialState } from './orbit.js';
import { interpolationDiagnostics } from './ephemeris.js';
import type { TrackDiagnostics, TrackRequest } from '../schemas/track.js';
import type { TrackNeeds, TrackFormat, TrackProductInput } from '../formats/track-output.js';
import { geodeticDegrees, printedStates, type TrackJob, type TrackJobResult } from '../workers/jobs.js';

/** The answer's diagnostics from a track's conservation report (and, for the ephemeris model, its interpolation). */
export function trackDiagnostics(c: Conservation, interpolation?: TrackDiagnostics['interpolation'], earthOrientation?: TrackDiagnostics['earthOrientation']): TrackDiagnostics {
  return {
    conservedQuantity: c.quantity,
    meaning: c.meaning,
    energyRelativeDrift: c.drift ? c.drift.energy : null,
    energyDriftVsPotential: c.drift ? c.drift.energyVsPotential : null,
    angularMomentumRelativeDrift: c.drift ? c.drift.angularMomentumVector : null,
    ...(interpolation ? { interpolation } : {}),
    ...(earthOrientation ? { earthOrientation } : {}),
  };
}

/** The worker job of a validated track request (its grid buffer moves to the worker). */
export function trackJob(req: TrackRequest, body: CentralBody, start: InitialState, epochsTT: Float64Array, needs: TrackNeeds, frame: FrameOptions): TrackJob {
  return {
    kind: 'track',
    input: {
      body, model: req.model, forces: req.forces, r0: start.r, v0: start.v, epochTT: start.epochTT, epochsTT, passThroughBody: req.passThroughBody,
      ...(req.model === 'sgp4' && start.sgp4 ? { sgp4: start.sgp4 } : {}),
      ...(req.model === 'ephemeris' && start.ephemeris ? { ephemeris: start.ephemeris.ephemeris } : {}),
    },
    teme: needs.teme,
    earthFixed: needs.earthFixed ? frame : null,
    ...(needs.teme ? { temeFrame: frame } : {}),
    geodetic: needs.geodetic,
  };
}

/** The product's inputs for a solved track job. */
export function trackProductInput(req: TrackRequest, format: TrackFormat, hash: string, body: CentralBody, start: InitialState, result: TrackJobResult, earthOrientation?: TrackDiagnostics['earthOrientation']): TrackProductInput {
  const initialEpochTT = start.epochTT;
  const inertial: Track = result.track;
  const interpolation = inertial.interpolation && start.ephemeris ? interpolationDiagnostics(inertial.interpolation, start.ephemeris.info) : undefined;
  return {
    format,
    frame: req.frame,
    epochsTT: inertial.epochsTT,
    states: printedStates(result, req.frame === 'teme'),
    geodeticDeg: result.geodetic ? geodeticDegrees(result.geodetic) : null,
    head: {
      scenarioHash: hash,
      model: req.model,
      forces: req.forces,
      frame: req.frame,
      centralBody: { name: body.name, gm: body.gm, radius: body.radius ?? null },
      object: req.object,
      sampleCount: inertial.epochsTT.length,
      // Conservation is checked on the inertial states, whatever the output frame.
      diagnostics: trackDiagnostics(inertial.conservation, interpolation, earthOrientation),
    },
    object: req.object,
    oem: {
      creationEpochTT: req.creationDate !== undefined ? epochTT(req.creationDate) : initialEpochTT,
      centerName: body.name.toUpperCase(),
      comments: [
        `model ${req.model}, GM ${body.gm} km**3/s**2; scenario ${hash}`,
        ...(interpolation ? [`interpolated from the given ephemeris (${interpolation.segments.map((s) => `${s.method} degree ${s.degree}`).join(', ')}); largest position error estimate ${interpolation.maxPositionErrorEstimate.toExponential(2)} km`] : []),
        ...(req.frame === 'teme' ? ['TEME: true equator, mean equinox, rotated from PEF by GMST 1982 (Vallado et al. 2006); the frame of SGP4'] : []),
        ...(req.frame === 'itrf' && !earthOrientation ? [`Earth-fixed: IAU 2006 precession, IAU 2000B nutation, Earth rotation angle; polar motion neglected; UT1-UTC ${req.ut1MinusUtc ?? 0} s`] : []),
        ...(req.frame === 'itrf' && earthOrientation
          ? [`Earth-fixed: IAU 2006 precession, IAU 2000B nutation, Earth rotation angle; polar motion, dX, dY${req.ut1MinusUtc === undefined ? ' and UT1-UTC' : ''} from the IERS finals2000A table ${earthOrientation.firstDate} to ${earthOrientation.lastPredictedDate} (SHA-256 ${earthOrientation.tableDigest.slice(0, 16)}...)${req.ut1MinusUtc === undefined ? '' : `; UT1-UTC ${req.ut1MinusUtc} s`}`,
            ...(earthOrientation.warning ? [`WARNING ${earthOrientation.warning}`] : [])]
          : []),
        ...(req.creationDate !== undefined ? [] : ['CREATION_DATE is the epoch of the initial state (no creationDate in the request), so that one scenario always gives the same bytes']),
      ],
    },
  };
}
