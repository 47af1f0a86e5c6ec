// Orbits between the API and the solver: a request's state or elements -> the solver's input
// (degrees -> radians, ISO -> TT), and the solver's solution -> the /v1/orbit answer.
import { BODIES, type CentralBody } from '../solver/bodies/bodies.js';
import { elementsToState, orbitTypeOf, type ElementsInput as SolverElementsInput } from '../solver/conic/elements.js';
import type { OrbitSolution } from '../solver/conic/orbit.js';
import { DEG, RAD, SECONDS_PER_DAY } from '../solver/core/math.js';
import { failure, success, type Outcome } from '../solver/core/result.js';
import type { Vec3 } from '../solver/core/vec3.js';
import { END_OF_SUPPORTED_RANGE_TT, formatUtcIso } from '../solver/time/time.js';
import type { OrbitAnswer, OrbitInputFields } from '../schemas/orbit.js';
import type { OrbitPlaneInput } from '../formats/svg/orbit-plane.js';
import { ProblemError } from '../errors.js';
import type { FrameOptions } from '../solver/earth/frames.js';
import { stateToGcrf } from '../solver/earth/state-frames.js';
import type { Sgp4ElementSet } from '../solver/propagation/sgp4.js';
import { describeBody } from './body.js';
import { catalogInitialState } from './catalog.js';
import { ephemerisInitialState, ephemerisOrbit, type EphemerisOrbit } from './ephemeris.js';
import { epochTT } from './epoch.js';

export type SolverOrbitInput = { r: Vec3; v: Vec3 } | { elements: SolverElementsInput };

/**
 * The solver's input for a validated request whose epochs are already in UTC (utcScenario):
 * degrees -> radians, and a state in another frame brought to GCRF at its epoch (Earth-fixed
 * states with the Earth orientation of `frame`).
 */
export function orbitSolverInput(req: OrbitInputFields, body: CentralBody, frame: FrameOptions = {}): { epochTT: number; input: SolverOrbitInput } {
  if (req.state) {
    const s = req.state;
    const t = epochTT(s.epoch);
    if ((s.frame === 'itrf' || s.frame === 'teme') && body !== BODIES.earth) throw new ProblemError('unsupported-frame', `an ${s.frame} state (${s.frame === 'itrf' ? 'Earth-fixed' : 'an Earth frame'}) needs the built-in centralBody "earth"`);
    const g = stateToGcrf(s.frame, t, s.position, s.velocity, frame);
    return { epochTT: t, input: { r: g.r, v: g.v } };
  }
  const el = req.elements!;
  return {
    epochTT: epochTT(el.epoch),
    input: {
      elements: {
        ...(el.semiMajorAxis !== undefined ? { semiMajorAxis: el.semiMajorAxis } : {}),
        ...(el.semiLatusRectum !== undefined ? { semiLatusRectum: el.semiLatusRectum } : {}),
        eccentricity: el.eccentricity,
        inclination: el.inclination * DEG,
        raan: el.raan * DEG,
        argPeriapsis: el.argPeriapsis * DEG,
        ...(el.trueAnomaly !== undefined ? { trueAnomaly: el.trueAnomaly * DEG } : {}),
        // The parabolic mean anomaly is dimensionless: no degree conversion.
        ...(el.meanAnomaly !== undefined ? { meanAnomaly: orbitTypeOf(el.eccentricity) === 'parabolic' ? el.meanAnomaly : el.meanAnomaly * DEG } : {}),
      },
    },
  };
}

/** The initial state of an orbit and what its model runs from besides (catalogue set, ephemeris). */
export interface InitialState {
  readonly r: Vec3;
  readonly v: Vec3;
  readonly epochTT: number;
  readonly sgp4?: Sgp4ElementSet | undefined;
  readonly ephemeris?: EphemerisOrbit | undefined;
}

/**
 * The initial Cartesian state of a request's orbit (state given, elements converted, a
 * catalogue element set run through SGP4 to its epoch, then `sgp4` carries the set, or an
 * ephemeris's first node, then `ephemeris` carries it).
 */
export function initialState(body: CentralBody, req: OrbitInputFields & { model?: string }, frame: FrameOptions = {}): Outcome<InitialState> {
  const eph = ephemerisOrbit(req, body, frame);
  if (eph) return success({ ...ephemerisInitialState(eph), ephemeris: eph });
  const catalog = catalogInitialState(body, req, req.model ?? '');
  if (catalog) return catalog;
  const { epochTT: epoch, input } = orbitSolverInput(req, body, frame);
  if ('r' in input) {
    if (input.r.every((x) => x === 0)) return failure('zero-position', 'the position vector is zero');
    return success({ r: input.r, v: input.v, epochTT: epoch });
  }
  const state = elementsToState(input.elements, body.gm);
  return state.ok ? success({ r: state.value.r, v: state.value.v, epochTT: epoch }) : state;
}

const deg = (rad: number): number => rad * RAD;
const degPerDay = (radPerS: number): number => radPerS * RAD * SECONDS_PER_DAY;

/** Solver solution -> API answer (radians -> degrees, seconds-after-epoch -> ISO epochs). */
export function toOrbitAnswer(s: OrbitSolution, body: CentralBody, epoch: number, scenarioHash: string): OrbitAnswer {
  // A passage beyond the supported calendar (after 2199) is reported as null, like one that does not exist.
  const passage = (seconds: number | null): string | null =>
    seconds === null || !(epoch + seconds < END_OF_SUPPORTED_RANGE_TT) ? null : formatUtcIso(epoch + seconds);
  const apsis = (a: OrbitSolution['apsides']['periapsis']) => ({
    radius: a.radius,
    altitude: a.altitude,
    speed: a.speed,
    nextPassage: passage(a.secondsToNextPassage),
  });
  const e = s.elements;
  // Parabolic anomalies and mean motion are dimensionless (per second): reported as they are.
  const parabolic = e.orbitType === 'parabolic';
  const anomaly = (x: number): number => (parabolic ? x : deg(x));
  return {
    scenarioHash,
    centralBody: describeBody(body),
    epoch: formatUtcIso(epoch),
    orbitType: e.orbitType,
    state: { frame: 'gcrf', position: [...s.position], velocity: [...s.velocity] },
    elements: {
      semiMajorAxis: e.semiMajorAxis,
      eccentricity: e.eccentricity,
      inclination: deg(e.inclination),
      raan: deg(e.raan),
      argPeriapsis: deg(e.argPeriapsis),
      trueAnomaly: deg(e.trueAnomaly),
      eccentricAnomaly: anomaly(e.eccentricAnomaly),
      meanAnomaly: anomaly(e.meanAnomaly),
      semiLatusRectum: e.semiLatusRectum,
      argumentOfLatitude: deg(e.argLatitude),
      trueLongitude: deg(e.trueLongitude),
      longitudeOfPeriapsis: deg(e.longitudeOfPeriapsis),
      raanDefined: e.raanDefined,
      argPeriapsisDefined: e.argPeriapsisDefined,
    },
    apsides: { periapsis: apsis(s.apsides.periapsis), apoapsis: s.apsides.apoapsis ? apsis(s.apsides.apoapsis) : null },
    period: s.periodS,
    meanMotion: anomaly(s.meanMotion),
    specificEnergy: s.specificEnergy,
    specificAngularMomentum: { vector: [...s.specificAngularMomentum], magnitude: s.specificAngularMomentumMagnitude },
    eccentricityVector: [...s.eccentricityVector],
    flightPathAngle: deg(s.flightPathAngle),
    radius: s.radius,
    speed: s.speed,
    intersectsBody: body.radius === undefined ? null : s.apsides.periapsis.radius < body.radius,
    j2: s.j2
      ? {
        raanRate: degPerDay(s.j2.raanRateRadS),
        argPeriapsisRate: degPerDay(s.j2.argPeriapsisRateRadS),
        meanAnomalyRate: degPerDay(s.j2.meanAnomalyRateRadS),
        sunSynchronous: s.j2.sunSynchronous,
        sunSynchronousInclination: s.j2.sunSynchronousInclination === null ? null : deg(s.j2.sunSynchronousInclination),
      }
      : null,
  };
}

/** What the orbit plot draws, from the answer (API units: km, degrees). */
export function orbitPlotInput(answer: OrbitAnswer): OrbitPlaneInput {
  const el = answer.elements;
  return {
    bodyName: answer.centralBody.name,
    bodyRadius: answer.centralBody.radius,
    orbitType: answer.orbitType,
    eccentricity: el.eccentricity,
    semiLatusRectum: el.semiLatusRectum,
    argPeriapsis: el.argPeriapsis,
    trueAnomaly: el.trueAnomaly,
    inclination: el.inclination,
    raanDefined: el.raanDefined,
    periapsisRadius: answer.apsides.periapsis.radius,
    apoapsisRadius: answer.apsides.apoapsis?.radius ?? null,
  };
}
