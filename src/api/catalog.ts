// Catalogue orbits at the edge: a request's tle or omm -> the mean element set (src/formats/tle.ts,
// omm.ts), its problems -> 422 answers that name the line and columns or the keyword, and the
// SGP4 state at the element epoch where the other models start.
import { ProblemError } from '../errors.js';
import { BODIES, type CentralBody } from '../solver/bodies/bodies.js';
import { failure, success, type Outcome } from '../solver/core/result.js';
import type { Vec3 } from '../solver/core/vec3.js';
import { sgp4EpochState, sgp4MeanOrbit, type Sgp4ElementSet } from '../solver/propagation/sgp4.js';
import { SECONDS_PER_DAY } from '../solver/core/math.js';
import { formatUtcIso } from '../solver/time/time.js';
import type { MeanElementSet } from '../formats/mean-elements.js';
import { readOmm } from '../formats/omm.js';
import { readTle } from '../formats/tle.js';
import type { MeanElementsAnswer, OrbitInputFields } from '../schemas/orbit.js';

/** True when the request's orbit is a catalogue element set. */
export const isCatalogOrbit = (req: OrbitInputFields): boolean => req.tle !== undefined || req.omm !== undefined;

/** The element set of a request's tle or omm (undefined for the other inputs); a malformed one throws its 422 problem. */
export function catalogElements(req: OrbitInputFields): MeanElementSet | undefined {
  if (req.tle) {
    const r = readTle(req.tle.line1, req.tle.line2, req.tle.name);
    if (r.ok) return r.value;
    throw new ProblemError('tle-malformed', r.issues.map((i) => i.message).join('; '), {
      errors: r.issues.slice(0, 20).map((i) => ({ path: `body.tle.${i.path}`, message: i.message })),
      errorCount: r.issues.length,
    });
  }
  if (req.omm !== undefined) {
    const r = readOmm(req.omm);
    if (r.ok) return r.value;
    throw new ProblemError(r.unsupported ? 'omm-unsupported' : 'omm-malformed', r.issues.map((i) => i.message).join('; '), {
      errors: r.issues.slice(0, 20).map((i) => ({ path: `body.omm${i.path ? `.${i.path}` : ''}`, message: i.message })),
      errorCount: r.issues.length,
    });
  }
  return undefined;
}

/** The initial state of a catalogue orbit: SGP4 at the element epoch, in GCRF, and the set the sgp4 model runs from. */
export function catalogInitialState(body: CentralBody, req: OrbitInputFields, model: string): Outcome<{ r: Vec3; v: Vec3; epochTT: number; sgp4?: Sgp4ElementSet; set?: MeanElementSet }> | undefined {
  const set = catalogElements(req);
  if (!set) {
    if (model === 'sgp4') throw new ProblemError('invalid-parameter', 'model sgp4 propagates catalogue mean elements: give the orbit as tle or omm (or choose another model)');
    return undefined;
  }
  if (body !== BODIES.earth) throw new ProblemError('invalid-parameter', 'a tle or omm orbit is about the Earth: centralBody must be the built-in "earth"');
  const s = sgp4EpochState(set.sgp4);
  if (!s.ok) return s;
  if (![...s.value.r, ...s.value.v].every(Number.isFinite)) return failure('sgp4-failed', 'SGP4 gave no finite state at the element epoch');
  return success({ r: s.value.r, v: s.value.v, epochTT: set.epochTT, sgp4: set.sgp4, set });
}

/** The mean elements as given, in API units (deg, deg/s), with what the method derives from them. */
export function meanElementsAnswer(set: MeanElementSet): MeanElementsAnswer {
  const derived = sgp4MeanOrbit(set.sgp4);
  return {
    format: set.format,
    theory: 'SGP4',
    name: set.name,
    catalogNumber: set.catalogNumber,
    catalogId: set.catalogId,
    internationalDesignator: set.internationalDesignator,
    classification: set.classification,
    epoch: formatUtcIso(set.epochTT),
    meanMotion: (set.meanMotion * 360) / SECONDS_PER_DAY,
    revolutionsPerDay: set.meanMotion,
    eccentricity: set.eccentricity,
    inclination: set.inclination,
    raan: set.raan,
    argPeriapsis: set.argPerigee,
    meanAnomaly: set.meanAnomaly,
    bstar: set.bstar,
    meanMotionDot: set.meanMotionDot,
    meanMotionDdot: set.meanMotionDdot,
    elementSetNumber: set.elementSetNumber,
    revolutionNumber: set.revolutionNumber,
    semiMajorAxis: derived.semiMajorAxisKm,
    regime: derived.regime,
  };
}

/** The age of the element set at an epoch (TT), in days. */
export const elementSetAge = (set: MeanElementSet, atTT: number): { at: string; days: number } => ({ at: formatUtcIso(atTT), days: (atTT - set.epochTT) / SECONDS_PER_DAY });
