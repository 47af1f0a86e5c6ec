// POST /v1/orbit: request and answer schemas (the mapping to and from the solver is in src/api/orbit.ts).
import { z } from 'zod';
import { CentralBodyInput, BodySummary } from './body.js';
import { STATE_FRAMES } from '../solver/earth/state-frames.js';
import { codedIssue, DEMO_EPOCH, Epoch, EpochOut, EpochText, MAX_POSITION_KM, PositionKm, refineEpochs, ScenarioHash, TimeSystemField, UT1_MINUS_UTC, UT1_MINUS_UTC_TEXT, Vec3, VelocityKmS } from './common.js';
import { OmmInput, TleInput } from './catalog.js';
import { EphemerisInput } from './ephemeris.js';
import { SearchDiagnostics } from './diagnostics.js';

export const StateInput = z
  .object({
    epoch: EpochText,
    timeSystem: TimeSystemField,
    frame: z.enum(STATE_FRAMES).default('gcrf').describe(
      'Frame of the state: gcrf or icrf (inertial, the service\'s frame: ICRF axes, origin the centre of the body); ' +
      'eme2000 (J2000 mean equator and equinox: the IAU 2006 frame bias is applied, 23 mas); ' +
      'itrf (Earth-fixed, velocity relative to the rotating Earth as GNSS receivers give it; converted at the state\'s epoch with IAU 2006/2000B precession-nutation, UT1-UTC and, with EOP_FILE, polar motion; centralBody earth only); ' +
      'teme (true equator, mean equinox: the frame of SGP4 output; to PEF by GMST 1982, then as itrf; centralBody earth only)'),
    position: PositionKm,
    velocity: VelocityKmS,
  })
  .strict()
  .superRefine(refineEpochs(['epoch']))
  .describe('A Cartesian state at an epoch')
  .meta({ id: 'InitialState' });

export const ElementsInput = z
  .object({
    epoch: EpochText,
    timeSystem: TimeSystemField,
    semiMajorAxis: z.number().min(-MAX_POSITION_KM).max(MAX_POSITION_KM).optional().describe(`Semi-major axis a, km: positive for ellipses, negative for hyperbolas, |a| <= ${MAX_POSITION_KM}; omit for a parabola (give semiLatusRectum)`),
    semiLatusRectum: z.number().positive().max(MAX_POSITION_KM).optional().describe('Semi-latus rectum p, km: instead of semiMajorAxis, required when eccentricity = 1'),
    // Refused as eccentricity-out-of-range (the solver's own code for it), not validation-failed; the document still says minimum 0.
    eccentricity: z.number().superRefine((e, ctx) => {
      if (!(e >= 0)) ctx.addIssue(codedIssue('eccentricity-out-of-range', `eccentricity must be >= 0, got ${e}`));
    }).meta({ minimum: 0 }).describe('Eccentricity e >= 0 (0 circular, < 1 elliptic, 1 parabolic, > 1 hyperbolic)'),
    inclination: z.number().min(0).max(180).describe('Inclination, degrees [0, 180]'),
    raan: z.number().describe('Right ascension of the ascending node, degrees (ignored when equatorial)'),
    argPeriapsis: z.number().describe('Argument of periapsis, degrees (ignored when circular)'),
    trueAnomaly: z.number().optional().describe('True anomaly, degrees (give this or meanAnomaly)'),
    meanAnomaly: z.number().optional().describe('Mean anomaly, degrees; for a hyperbola the hyperbolic mean anomaly e sinh H - H expressed in degrees; for a parabola (e = 1) M_p = B + B^3/3 with B = tan(nu/2), dimensionless'),
  })
  .strict()
  .superRefine(refineEpochs(['epoch']))
  .superRefine((el, ctx) => {
    if ((el.trueAnomaly === undefined) === (el.meanAnomaly === undefined)) {
      ctx.addIssue({ code: 'custom', path: ['trueAnomaly'], message: 'give exactly one of trueAnomaly and meanAnomaly' });
    }
    if ((el.semiMajorAxis === undefined) === (el.semiLatusRectum === undefined)) {
      ctx.addIssue({ code: 'custom', path: ['semiMajorAxis'], message: 'give exactly one of semiMajorAxis and semiLatusRectum' });
    }
  })
  .describe('Classical orbital elements at an epoch (angles in degrees, distances in km)')
  .meta({ id: 'InitialElements' });

/** The orbit part shared by every request that takes an orbit: a body and a state or elements. */
export const orbitFields = {
  centralBody: CentralBodyInput,
  state: StateInput.optional(),
  elements: ElementsInput.optional(),
  tle: TleInput.optional(),
  omm: OmmInput.optional(),
  ephemeris: EphemerisInput.optional(),
};

/** The orbit fields of a validated request, as the edge layer (src/api/orbit.ts) reads them. */
export interface OrbitInputFields {
  readonly state?: z.output<typeof StateInput> | undefined;
  readonly elements?: z.output<typeof ElementsInput> | undefined;
  readonly tle?: z.output<typeof TleInput> | undefined;
  readonly omm?: z.output<typeof OmmInput> | undefined;
  readonly ephemeris?: z.output<typeof EphemerisInput> | undefined;
}

export function requireOneOrbitInput(req: { state?: unknown; elements?: unknown; tle?: unknown; omm?: unknown; ephemeris?: unknown }, ctx: z.RefinementCtx): void {
  if ([req.state, req.elements, req.tle, req.omm, req.ephemeris].filter((x) => x !== undefined).length !== 1) {
    ctx.addIssue({ code: 'custom', path: ['state'], message: 'give exactly one of state, elements, tle, omm and ephemeris' });
  }
}

export const DEMO_ELEMENTS = { epoch: DEMO_EPOCH, semiMajorAxis: 6928.137, eccentricity: 0.0012, inclination: 97.6, raan: 40, argPeriapsis: 90, trueAnomaly: 10 };

/** Answer formats of /v1/orbit and /v1/passes: the numbers, or their plots. */
export const PLOT_FORMATS = [
  ['json', 'application/json'],
  ['svg', 'image/svg+xml'],
] as const;
export type PlotFormat = (typeof PLOT_FORMATS)[number][0];
export const plotFormatField = (plots: string) => z.enum(['json', 'svg']).optional()
  .describe(`json (the numbers) | svg (${plots}). Without it the Accept header chooses (application/json, image/svg+xml); default json`);

export const OrbitRequest = z
  .object({
    ...orbitFields,
    ut1MinusUtc: UT1_MINUS_UTC.describe(`${UT1_MINUS_UTC_TEXT}; used only to bring an itrf state (or itrf ephemeris nodes) to gcrf`),
    ageAt: Epoch.optional().describe('tle or omm only: the epoch (UTC) at which to state the age of the element set (elementSetAge); SGP4 errors grow with it (about a kilometre at the element epoch, kilometres more each day; common practice, no source)'),
    format: plotFormatField('the orbit in its plane, to scale with the body: periapsis, apoapsis, line of nodes, position at the epoch') })
  .strict()
  .superRefine(requireOneOrbitInput)
  .superRefine((req, ctx) => {
    if (req.ageAt !== undefined && req.tle === undefined && req.omm === undefined) ctx.addIssue({ code: 'custom', path: ['ageAt'], message: 'ageAt applies to tle and omm orbits only' });
  })
  .meta({
    description: 'An orbit about a central body, by state vector, by elements, by a catalogue element set (tle, omm), or by an ephemeris (the osculating orbit of its first node)',
    examples: [{ centralBody: 'earth', elements: DEMO_ELEMENTS }],
  })
  .meta({ id: 'OrbitRequest' });
export type OrbitRequest = z.output<typeof OrbitRequest>;

const Apsis = z.object({
  radius: z.number().describe('km from the centre of the body'),
  altitude: z.number().nullable().describe('km above the body radius (null when the body has no radius)'),
  speed: z.number().describe('km/s'),
  nextPassage: EpochOut.nullable().describe('Next passage at or after the epoch (null when it lies in the past on an unbound trajectory, when the orbit is circular, or when it falls after 2199)'),
});

export const Elements = z.object({
  semiMajorAxis: z.number().nullable().describe('km; negative for hyperbolas, null for a parabola'),
  eccentricity: z.number(),
  inclination: z.number().describe('deg'),
  raan: z.number().describe('deg; 0 by convention when equatorial (raanDefined false)'),
  argPeriapsis: z.number().describe('deg; 0 by convention when circular (argPeriapsisDefined false); measured from the x axis when equatorial'),
  trueAnomaly: z.number().describe('deg; the argument of latitude when circular inclined, the true longitude when circular equatorial'),
  eccentricAnomaly: z.number().describe('Eccentric anomaly E in deg (ellipse); hyperbolic anomaly H expressed in deg (hyperbola); for a parabola the parabolic anomaly B = tan(nu/2), dimensionless (Vallado 4th ed. sec. 2.2)'),
  meanAnomaly: z.number().describe('Mean anomaly M in deg (ellipse); hyperbolic mean anomaly M_h = e sinh H - H expressed in deg (hyperbola); for a parabola M_p = B + B^3/3, dimensionless'),
  semiLatusRectum: z.number().describe('km, p = h^2/mu'),
  argumentOfLatitude: z.number().describe('deg, u = argPeriapsis + trueAnomaly'),
  trueLongitude: z.number().describe('deg, raan + argPeriapsis + trueAnomaly'),
  longitudeOfPeriapsis: z.number().describe('deg, raan + argPeriapsis'),
  raanDefined: z.boolean(),
  argPeriapsisDefined: z.boolean(),
})
  .meta({ id: 'Elements' });

export const J2Rates = z.object({
  raanRate: z.number().describe('Secular RAAN rate from J2, deg/day'),
  argPeriapsisRate: z.number().describe('Secular argument-of-periapsis rate from J2, deg/day'),
  meanAnomalyRate: z.number().describe('J2 correction to the mean motion, deg/day (added to the Keplerian mean motion)'),
  sunSynchronous: z.boolean().describe('RAAN rate within the tolerance of the body\'s mean motion about the Sun'),
  sunSynchronousInclination: z.number().nullable().describe('deg: the inclination that would make this a, e sun-synchronous (null when none does)'),
})
  .meta({ id: 'J2Rates' });

export const MeanElementsAnswer = z.object({
  format: z.enum(['tle', 'omm']),
  theory: z.literal('SGP4').describe('The mean-element theory: SGP4 (Vallado et al. 2006, WGS-72 constants)'),
  name: z.string().nullable(),
  catalogNumber: z.number().int().describe('Catalogue number (Alpha-5 decoded: A = 10 ... Z = 33)'),
  catalogId: z.string().describe('Catalogue number as written'),
  internationalDesignator: z.string().nullable(),
  classification: z.string().nullable(),
  epoch: EpochOut.describe('Element epoch, UTC'),
  meanMotion: z.number().describe('Kozai mean motion as given, deg/s'),
  revolutionsPerDay: z.number().describe('The same mean motion in rev/day, as the formats give it'),
  eccentricity: z.number(),
  inclination: z.number().describe('deg, TEME'),
  raan: z.number().describe('deg, TEME'),
  argPeriapsis: z.number().describe('deg'),
  meanAnomaly: z.number().describe('deg'),
  bstar: z.number().describe('B* drag term, 1/earth radii'),
  meanMotionDot: z.number().describe('first derivative of the mean motion divided by 2, rev/day^2 (as given; SGP4 does not use it)'),
  meanMotionDdot: z.number().describe('second derivative of the mean motion divided by 6, rev/day^3 (as given; SGP4 does not use it)'),
  elementSetNumber: z.number().int().nullable(),
  revolutionNumber: z.number().int().nullable().describe('revolution number at epoch'),
  semiMajorAxis: z.number().describe('Brouwer mean semi-major axis, km (WGS-72 earth radii x 6378.135), as the method derives it: not osculating'),
  regime: z.enum(['near-earth', 'deep-space']).describe('near-earth (SGP4, period under 225 min) or deep-space (SDP4, with lunar-solar terms and resonances)'),
})
  .meta({ id: 'CatalogueMeanElements' });

export const OrbitAnswer = z.object({
  scenarioHash: ScenarioHash,
  centralBody: BodySummary,
  epoch: EpochOut,
  orbitType: z.enum(['circular', 'elliptic', 'parabolic', 'hyperbolic']),
  state: z.object({ frame: z.literal('gcrf'), position: Vec3.describe('km'), velocity: Vec3.describe('km/s') }),
  elements: Elements,
  apsides: z.object({ periapsis: Apsis, apoapsis: Apsis.nullable().describe('null when unbound') }),
  period: z.number().nullable().describe('s; null when unbound'),
  meanMotion: z.number().describe('deg/s: mean motion (ellipse), sqrt(mu/-a^3) expressed in deg/s (hyperbola); for a parabola 2 sqrt(mu/p^3) in 1/s, the rate of the dimensionless M_p'),
  specificEnergy: z.number().describe('km^2/s^2, vis-viva v^2/2 - mu/r'),
  specificAngularMomentum: z.object({ vector: Vec3.describe('km^2/s'), magnitude: z.number().describe('km^2/s') }),
  eccentricityVector: Vec3.describe('dimensionless, points to periapsis'),
  flightPathAngle: z.number().describe('deg, angle of the velocity above the local horizontal'),
  radius: z.number().describe('km at epoch'),
  speed: z.number().describe('km/s at epoch'),
  intersectsBody: z.boolean().nullable().describe('true when the periapsis radius is below the body radius (null without a radius)'),
  j2: J2Rates.nullable().describe('J2 secular rates (null when the body has no J2 or the orbit is unbound)'),
  meanElements: MeanElementsAnswer.optional().describe('tle or omm only: the catalogue mean elements as given (units converted). The rest of the answer is osculating, from the SGP4 state at the element epoch rotated to gcrf'),
  elementSetAge: z.object({ at: EpochOut, days: z.number().describe('days from the element epoch to `at` (negative before it)') }).optional()
    .describe('tle or omm with ageAt: the age of the element set at that epoch'),
  diagnostics: SearchDiagnostics.optional().describe('With EOP_FILE set and an Earth-fixed input (itrf state, itrf or teme ephemeris nodes): the Earth orientation used'),
})
  .meta({ id: 'OrbitAnswer' });
export type OrbitAnswer = z.infer<typeof OrbitAnswer>;
export type MeanElementsAnswer = z.infer<typeof MeanElementsAnswer>;
