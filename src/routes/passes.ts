// POST /v1/passes: when a spacecraft rises and sets over each ground station, and where to point.
import type { FastifyPluginAsyncZod } from 'fastify-type-provider-zod';
import { ProblemError, solverProblem } from '../errors.js';
import { jsonAnswer } from '../plugins/answers.js';
import { DEG_PER_RAD, RAD_PER_DEG, epochTT, problemResponses } from '../schemas/common.js';
import { resolveBody } from '../schemas/body.js';
import { initialState } from '../schemas/initial-state.js';
import { PassesAnswer, PassesRequest } from '../schemas/passes.js';
import type { Pass } from '../solver/stations/passes.js';
import { formatUtcIso } from '../solver/time/time.js';
import { dopplerShift } from '../solver/stations/topocentric.js';
import { propagateTrack } from '../solver/propagation/track.js';

const passes: FastifyPluginAsyncZod = async (app) => {
  app.post('/v1/passes', {
    schema: {
      tags: ['orbits'],
      summary: 'Ground-station passes: AOS, TCA, LOS, maximum elevation, azimuths, optional pointing and Doppler',
      description: 'Searches the window for every interval in which the spacecraft is above each station\'s elevation limit and horizon mask. ' +
        'AOS/LOS are refined to better than 0.1 s and TCA by maximisation. Geometric elevation (no refraction). ' +
        'Pass predictions do not grant a licence to transmit: radio transmission needs licensing and frequency coordination.',
      body: PassesRequest,
      response: { 200: PassesAnswer, ...problemResponses },
    },
  }, async (request, reply) => {
    const req = request.body;
    if (req.centralBody !== 'earth') throw new ProblemError('unsupported-frame', 'ground-station passes need the built-in centralBody "earth"');
    return app.answers.respond(request, reply, 'passes', req, async (hash) => {
      const body = resolveBody(req.centralBody);
      const start = initialState(body, req);
      if (!start.ok) throw solverProblem(start);
      const { r: r0, v: v0, epochTT: orbitEpochTT } = start.value;
      const [startTT, stopTT] = [epochTT(req.window.start), epochTT(req.window.stop)];
      if (!(stopTT > startTT)) throw new ProblemError('validation-failed', 'the window stop must be after its start', { errors: [{ path: 'body.window.stop', message: 'must be after start' }] });
      const spec = { body, model: req.model, forces: req.forces, r0, v0, epochTT: orbitEpochTT };
      // The same surface check as /v1/track over the whole window (the numerical model checks while it integrates).
      if (req.model !== 'numerical') {
        const surface = propagateTrack({ ...spec, epochsTT: Float64Array.of(startTT, stopTT) });
        if (!surface.ok) throw solverProblem(surface);
      }
      // The search runs on a worker thread unless the window and station list are small; the
      // two-body propagator is rebuilt there from this state.
      const found = await app.pool.solve({
        kind: 'passes',
        spec,
        startTT,
        stopTT,
        stations: req.stations.map((s) => ({
          id: s.id,
          latitude: s.latitude * RAD_PER_DEG,
          longitude: s.longitude * RAD_PER_DEG,
          height: s.altitude,
          minElevation: s.minElevation * RAD_PER_DEG,
          ...(s.horizonMask ? { mask: s.horizonMask.map((p) => ({ azimuth: p.azimuth * RAD_PER_DEG, elevation: p.elevation * RAD_PER_DEG })) } : {}),
        })),
        options: { dut1: req.ut1MinusUtc, gm: body.gm, ...(req.pointing ? { pointingStepS: req.pointing.step } : {}) },
      });
      if (!found.ok) throw solverProblem(found);
      const answer: PassesAnswer = {
        scenarioHash: hash,
        model: req.model,
        window: { start: formatUtcIso(startTT), stop: formatUtcIso(stopTT) },
        coarseStep: found.value.coarseStepS,
        passes: found.value.passes.map((p) => toPassAnswer(p, req.pointing?.carrierFrequency)),
      };
      return jsonAnswer(answer);
    });
  });
};

/** Solver pass (TT seconds, radians) -> API pass (ISO epochs, degrees). */
function toPassAnswer(p: Pass, carrierFrequency: number | undefined): PassesAnswer['passes'][number] {
  const deg = (rad: number) => rad * DEG_PER_RAD;
  return {
    station: p.station,
    aos: formatUtcIso(p.aos),
    tca: formatUtcIso(p.tca),
    los: formatUtcIso(p.los),
    duration: p.duration,
    maxElevation: deg(p.maxElevation),
    azimuthAos: deg(p.azimuthAos),
    azimuthTca: deg(p.azimuthTca),
    azimuthLos: deg(p.azimuthLos),
    rangeTca: p.rangeTca,
    startsBeforeWindow: p.startsBeforeWindow,
    endsAfterWindow: p.endsAfterWindow,
    ...(p.pointing
      ? {
        pointing: p.pointing.map((s) => ({
          epoch: formatUtcIso(s.tt),
          azimuth: deg(s.azimuth),
          elevation: deg(s.elevation),
          range: s.range,
          rangeRate: s.rangeRate,
          dopplerFactor: s.dopplerFactor,
          dopplerShift: carrierFrequency === undefined ? null : dopplerShift(carrierFrequency, s.rangeRate),
        })),
      }
      : {}),
  };
}

export default passes;
