// Passes between the API and the solver: stations (degrees) -> the solver's stations (radians),
// and the solver's passes (TT seconds, radians) -> the answer (ISO epochs, degrees).
import type { CentralBody } from '../solver/bodies/bodies.js';
import { DEG, RAD } from '../solver/core/math.js';
import type { FrameOptions } from '../solver/earth/frames.js';
import type { Pass, PassStation } from '../solver/stations/passes.js';
import { dopplerShift } from '../solver/stations/topocentric.js';
import { formatUtcIso } from '../solver/time/time.js';
import { SVG_POINTING_BUDGET_S, SVG_POINTING_STEP_S, type GroundStation, type PassesAnswer, type PassesRequest } from '../schemas/passes.js';
import type { PassesJob, PassesJobResult } from '../workers/jobs.js';
import type { LightAt, PassLight } from '../solver/light/pass-light.js';
import type { SunAvoidance } from '../solver/light/sun-avoidance.js';
import { BENNETT_PRESSURE_HPA, BENNETT_TEMPERATURE_C, type RefractionSpec } from '../solver/stations/refraction.js';
import { epochTT } from './epoch.js';
import { searchWindow } from './search-window.js';
import { searchDiagnostics } from './diagnostics.js';
import { forSpan } from './earth-orientation.js';
import type { EarthOrientationDiagnostics } from '../schemas/diagnostics.js';
import type { InitialState } from './orbit.js';

/** A request's station for the pass search (degrees -> radians). */
export const stationForSearch = (s: GroundStation): PassStation => ({
  id: s.id,
  latitude: s.latitude * DEG,
  longitude: s.longitude * DEG,
  height: s.altitude,
  minElevation: s.minElevation * DEG,
  ...(s.horizonMask ? { mask: s.horizonMask.map((p) => ({ azimuth: p.azimuth * DEG, elevation: p.elevation * DEG })) } : {}),
});

/** The light at one instant (radians -> degrees). */
const lightAnswer = (l: LightAt) => ({ sunlit: l.sunlit, sunElevation: l.sunElevation * RAD, visible: l.visible });

/** Solver pass and its light (TT seconds, radians) -> API pass (ISO epochs, degrees). */
export function toPassAnswer(p: Pass, light: PassLight, carrierFrequencyHz: number | undefined, avoid?: { readonly result: SunAvoidance; readonly limit: number }): PassesAnswer['passes'][number] {
  const deg = (rad: number) => rad * RAD;
  return {
    station: p.station,
    aos: formatUtcIso(p.aos),
    tca: formatUtcIso(p.tca),
    los: formatUtcIso(p.los),
    duration: p.durationS,
    maxElevation: deg(p.maxElevation),
    azimuthAos: deg(p.azimuthAos),
    azimuthTca: deg(p.azimuthTca),
    azimuthLos: deg(p.azimuthLos),
    rangeTca: p.rangeTca,
    startsBeforeWindow: p.startsBeforeWindow,
    endsAfterWindow: p.endsAfterWindow,
    light: { aos: lightAnswer(light.aos), tca: lightAnswer(light.tca), los: lightAnswer(light.los) },
    ...(avoid
      ? {
        sunAvoidance: {
          sunInBeam: avoid.result.intervals.length > 0,
          minAngle: deg(avoid.result.minAngle),
          minAngleAt: formatUtcIso(avoid.result.minAt),
          intervals: avoid.result.intervals.map((i) => ({ start: formatUtcIso(i.start), stop: formatUtcIso(i.stop), duration: i.stop - i.start })),
        },
      }
      : {}),
    ...(p.pointing
      ? {
        pointing: p.pointing.map((s, i) => ({
          epoch: formatUtcIso(s.tt),
          azimuth: deg(s.azimuth),
          elevation: deg(s.elevation),
          range: s.range,
          rangeRate: s.rangeRate,
          dopplerFactor: s.dopplerFactor,
          dopplerShift: carrierFrequencyHz === undefined ? null : dopplerShift(carrierFrequencyHz, s.rangeRate),
          ...lightAnswer(light.pointing![i]!),
          ...(avoid?.result.pointingAngles
            ? { sunAngle: deg(avoid.result.pointingAngles[i]!), sunInBeam: avoid.result.pointingAngles[i]! < avoid.limit }
            : {}),
        })),
      }
      : {}),
  };
}

/** The worker job of a validated pass request (the window checked by searchWindow). */
export function passSearchJob(req: Omit<PassesRequest, 'format'>, body: CentralBody, start: InitialState, frame: FrameOptions, forPlots = false): PassesJob {
  const { spec, startTT, stopTT } = searchWindow(req, body, start);
  // The sky plots need a pointing track: without one asked they use their own step, longer for long searches.
  const plotStepS = SVG_POINTING_STEP_S * Math.max(1, Math.ceil(((stopTT - startTT) * req.stations.length) / SVG_POINTING_BUDGET_S));
  const pointingStepS = req.pointing?.step ?? (forPlots ? plotStepS : undefined);
  return {
    kind: 'passes',
    spec,
    startTT,
    stopTT,
    stations: req.stations.map(stationForSearch),
    lighting: { twilightLimit: req.twilightLimit * DEG },
    ...(req.sunAvoidance ? { sunAvoidance: { angle: req.sunAvoidance.angle * DEG } } : {}),
    // The EOP table cut to the window's rows (plain data to the worker thread).
    options: { ...forSpan(frame, startTT, stopTT), gm: body.gm, ...refractionOption(req), ...(pointingStepS !== undefined ? { pointingStepS } : {}) },
  };
}

/** The refraction of a request as the search takes it (nothing for none). */
function refractionOption(req: Omit<PassesRequest, 'format'>): { refraction?: RefractionSpec } {
  if (req.refraction === undefined || req.refraction === 'none') return {};
  if (req.refraction === 'radio') return { refraction: { model: 'radio' } };
  const air = req.atmosphere ?? { pressure: BENNETT_PRESSURE_HPA, temperature: BENNETT_TEMPERATURE_C };
  return { refraction: { model: 'optical', pressureHpa: air.pressure, temperatureC: air.temperature } };
}

/** The /v1/passes answer for a finished search, in parts: its fields (passes empty, in its place) and pass i built on demand. */
export function passesAnswerParts(req: Omit<PassesRequest, 'format'>, hash: string, found: PassesJobResult, start: InitialState, earthOrientation?: EarthOrientationDiagnostics): { head: PassesAnswer; count: number; pass: (i: number) => PassesAnswer['passes'][number] } {
  const head: PassesAnswer = {
    scenarioHash: hash,
    model: req.model,
    window: { start: formatUtcIso(epochTT(req.window.start)), stop: formatUtcIso(epochTT(req.window.stop)) },
    coarseStep: found.coarseStepS,
    ...(req.refraction === 'radio' ? { refraction: { model: 'radio' as const } } : {}),
    ...(req.refraction === 'optical'
      ? { refraction: { model: 'optical' as const, pressure: req.atmosphere?.pressure ?? BENNETT_PRESSURE_HPA, temperature: req.atmosphere?.temperature ?? BENNETT_TEMPERATURE_C } }
      : {}),
    passes: [],
    ...(found.stopped ? { propagationStopped: { epoch: formatUtcIso(found.stopped.epochTT), code: found.stopped.code, reason: found.stopped.message } } : {}),
    ...searchDiagnostics(found, start, earthOrientation),
  };
  const pass = (i: number): PassesAnswer['passes'][number] => toPassAnswer(found.passes[i]!, found.light[i]!, req.pointing?.carrierFrequency,
    found.sunAvoidance && req.sunAvoidance ? { result: found.sunAvoidance[i]!, limit: req.sunAvoidance.angle * DEG } : undefined);
  return { head, count: found.passes.length, pass };
}

/** The /v1/passes answer for a finished search, whole. */
export function toPassesAnswer(req: Omit<PassesRequest, 'format'>, hash: string, found: PassesJobResult, start: InitialState, earthOrientation?: EarthOrientationDiagnostics): PassesAnswer {
  const { head, count, pass } = passesAnswerParts(req, hash, found, start, earthOrientation);
  // The spread keeps the key order: passes stays where the head has it.
  return { ...head, passes: Array.from({ length: count }, (_, i) => pass(i)) };
}
