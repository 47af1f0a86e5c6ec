// POST /v1/two-body: request and answer schemas, and the mapping from the solver's reduction
// (masses as GM = G m, integrals times G) to the API (kg, kg km^2/s^2, kg km^2/s, degrees, ISO epochs).
import { TrackDiagnostics } from './track.js';
import { z } from 'zod';
import type { CentralBody } from '../solver/bodies/bodies.js';
import {
  GRAVITATIONAL_CONSTANT_KM3_PER_KG_S2,
  GRAVITATIONAL_CONSTANT_RELATIVE_UNCERTAINTY,
  GRAVITATIONAL_CONSTANT_SOURCE,
  gmFromMass,
  massFromGm,
} from '../solver/core/constants.js';
import { relativeDifference } from '../solver/core/math.js';
import type { OrbitSolution } from '../solver/conic/orbit.js';
import type { BodyState, TwoBodyReduction } from '../solver/conic/two-body.js';
import { formatUtcIso } from '../solver/time/time.js';
import { norm, sub, type Vec3 as SolverVec3 } from '../solver/core/vec3.js';
import { DEMO_EPOCH, Epoch, EpochOut, ScenarioHash, Vec3 } from './common.js';
import { TimeGrid } from './grid.js';
import { OrbitAnswer, toOrbitAnswer } from './orbit.js';

// Input limits: wide enough for a dust grain to a galaxy, narrow enough that every product the
// answer needs (G m1 m2 / r, m v^2, m r v) stays a finite double.
export const MASS_MIN_KG = 1e-30;
export const MASS_MAX_KG = 1e50;
export const GM_MIN_KM3_S2 = 1e-49;
export const GM_MAX_KM3_S2 = 1e30;
export const POSITION_LIMIT_KM = 1e18;
/** Speed of light, km/s (exact by the definition of the metre; SI Brochure, 9th ed., 2019): a Newtonian model is meaningless beyond it. */
export const VELOCITY_LIMIT_KM_S = 299_792.458;

const coordinate = z.number().min(-POSITION_LIMIT_KM).max(POSITION_LIMIT_KM);
const velocityComponent = z.number().min(-VELOCITY_LIMIT_KM_S).max(VELOCITY_LIMIT_KM_S);

export const TwoBodyMember = z
  .object({
    name: z.string().min(1).max(64).optional().describe('A label for the body, echoed in the answer'),
    mass: z.number().min(MASS_MIN_KG).max(MASS_MAX_KG).optional()
      .describe(`Mass, kg, ${MASS_MIN_KG} to ${MASS_MAX_KG} (give mass or gm, not both); used as GM = G m`),
    gm: z.number().min(GM_MIN_KM3_S2).max(GM_MAX_KM3_S2).optional()
      .describe(`Gravitational parameter GM = G m, km^3/s^2, ${GM_MIN_KM3_S2} to ${GM_MAX_KM3_S2} (give mass or gm, not both); the mass is then reported as GM / G`),
    position: z.tuple([coordinate, coordinate, coordinate]).describe('Position [x, y, z], km, each within +-1e18'),
    velocity: z.tuple([velocityComponent, velocityComponent, velocityComponent]).describe(`Velocity [vx, vy, vz], km/s, each within +-${VELOCITY_LIMIT_KM_S} (the speed of light)`),
  })
  .strict()
  .superRefine((b, ctx) => {
    if ((b.mass === undefined) === (b.gm === undefined)) {
      ctx.addIssue({ code: 'custom', path: ['mass'], message: 'give exactly one of mass (kg) and gm (km^3/s^2)' });
    }
  })
  .describe('One body: a point mass with its state in the request frame');
export type TwoBodyMember = z.output<typeof TwoBodyMember>;

/** Invented demo pair: a planet-sized primary at rest and a companion on a nearly circular orbit. */
export const DEMO_TWO_BODY = {
  epoch: DEMO_EPOCH,
  bodies: [
    { name: 'primary', mass: 3.1e24, position: [0, 0, 0], velocity: [0, 0, 0] },
    { name: 'companion', gm: 1300, position: [250_000, 0, 0], velocity: [0, 0.9, 0.05] },
  ],
};

export const TwoBodyRequest = z
  .object({
    epoch: Epoch.describe('Epoch of both states: ISO 8601 UTC timestamp ending in Z, years 1972-2199'),
    frame: z.enum(['gcrf']).default('gcrf').describe('Inertial frame of both states: gcrf (J2000 equator and equinox)'),
    bodies: z.tuple([TwoBodyMember, TwoBodyMember]).describe('Exactly two bodies; the relative state is body 2 seen from body 1'),
    track: z
      .object({ grid: TimeGrid })
      .strict()
      .optional()
      .describe('Ask for both bodies\' tracks about the barycentre on this time grid (same grid options and MAX_TRACK_SAMPLES limit as /v1/track)'),
  })
  .strict()
  .meta({
    description: 'Two point masses (mass in kg or GM in km^3/s^2, position km, velocity km/s) in one inertial frame at one epoch',
    examples: [DEMO_TWO_BODY],
  });
export type TwoBodyRequest = z.output<typeof TwoBodyRequest>;

export const GravitationalConstant = z
  .object({
    value: z.number().describe('G, km^3 kg^-1 s^-2 (= 1e-9 times the SI value in m^3 kg^-1 s^-2)'),
    unit: z.literal('km^3 kg^-1 s^-2'),
    relativeUncertainty: z.number().describe('Relative standard uncertainty of G: every mass derived from a GM (kg = GM / G) carries it'),
    source: z.string(),
  })
  .describe('The Newtonian constant of gravitation used to convert between mass (kg) and GM (km^3/s^2)');

const StateAbout = z.object({
  position: Vec3.describe('km'),
  velocity: Vec3.describe('km/s'),
});

export const BodyAboutBarycenter = z
  .object({
    name: z.string().nullable().describe('The label given in the request (null without one)'),
    mass: z.number().describe('kg: as given, or GM / G'),
    gm: z.number().describe('km^3/s^2: as given, or G m'),
    massFraction: z.number().describe('m_i / (m1 + m2), dimensionless'),
    position: Vec3.describe('km from the barycentre at the epoch: r1 = -(m2/M) r, r2 = (m1/M) r'),
    velocity: Vec3.describe('km/s relative to the barycentre: v1 = -(m2/M) v, v2 = (m1/M) v'),
    semiMajorAxis: z.number().nullable().describe('km of this body\'s ellipse about the barycentre, a1 = a m2/M, a2 = a m1/M (null when unbound)'),
    period: z.number().nullable().describe('s, the same as the relative orbit\'s (null when unbound)'),
  })
  .describe('One body\'s orbit about the barycentre: a conic of the same eccentricity as the relative orbit, scaled by the other body\'s mass fraction (body 1 on the opposite side)');

const Energy = z
  .object({
    unit: z.literal('kg km^2/s^2'),
    fromBodies: z.number().describe('kg km^2/s^2 (= MJ): sum of m_i |v_i|^2 / 2 about the barycentre minus G m1 m2 / |r|'),
    fromRelativeMotion: z.number().describe('kg km^2/s^2 (= MJ): reduced mass times the relative orbit\'s specific energy'),
    relativeDifference: z.number().describe('|fromBodies - fromRelativeMotion| / max(|fromBodies|, |fromRelativeMotion|); 0 when both are 0'),
  })
  .describe('Total energy in the barycentre frame, kg km^2/s^2 (1 kg km^2/s^2 = 1e6 J = 1 MJ)');

const AngularMomentum = z
  .object({
    unit: z.literal('kg km^2/s'),
    fromBodies: Vec3.describe('kg km^2/s (= 1e6 kg m^2/s): sum of m_i r_i x v_i about the barycentre'),
    fromRelativeMotion: Vec3.describe('kg km^2/s: reduced mass times r x v of the relative motion'),
    relativeDifference: z.number().describe('|fromBodies - fromRelativeMotion| / max of their magnitudes (vector difference)'),
  })
  .describe('Total angular momentum about the barycentre, kg km^2/s (1 kg km^2/s = 1e6 kg m^2/s)');


export const BarycentricSample = z.object({
  epoch: EpochOut,
  position: Vec3.describe('km from the barycentre, 6 decimals'),
  velocity: Vec3.describe('km/s relative to the barycentre, 9 decimals'),
});

export const BodyTrack = z.object({
  name: z.string().nullable().describe('The label given in the request (null without one)'),
  samples: z.array(BarycentricSample),
});

export const TwoBodyTracks = z
  .object({
    origin: z.literal('barycenter'),
    frame: z.literal('gcrf').describe('Axes of the request frame; the origin moves with the barycentre (add r_cm0 + v_cm (t - epoch) for inertial positions)'),
    sampleCount: z.number().int(),
    diagnostics: TrackDiagnostics,
    bodies: z.tuple([BodyTrack, BodyTrack]),
  })
  .describe('Both bodies\' tracks about the barycentre, from the relative motion propagated as a two-body orbit (universal variables); m1 r1 + m2 r2 = 0 at every sample');

export const TwoBodyAnswer = z.object({
  scenarioHash: ScenarioHash,
  epoch: EpochOut,
  frame: z.literal('gcrf'),
  gravitationalConstant: GravitationalConstant,
  totalMass: z.number().describe('M = m1 + m2, kg (GM / G)'),
  totalGm: z.number().describe('mu = G (m1 + m2), km^3/s^2: the gravitational parameter of the relative orbit'),
  reducedMass: z.number().describe('m1 m2 / (m1 + m2), kg'),
  barycenter: StateAbout.describe(
    'Barycentre (centre of mass) at the epoch, km and km/s in the request frame. With no external force it moves uniformly: r_cm(t) = r_cm0 + v_cm (t - epoch)',
  ),
  relativeState: StateAbout.describe('Body 2 seen from body 1 at the epoch: r = r2 - r1 (km), v = v2 - v1 (km/s)'),
  relativeOrbit: OrbitAnswer.describe(
    'The relative orbit as POST /v1/orbit answers it, with mu = G (m1 + m2) and the same scenarioHash; its centralBody is named "<name1>+<name2>" and has no radius (point masses), so altitudes and intersectsBody are null',
  ),
  bodies: z.tuple([BodyAboutBarycenter, BodyAboutBarycenter]),
  conserved: z
    .object({ energy: Energy, angularMomentum: AngularMomentum })
    .describe('The integrals of the pair computed two independent ways; their relative difference shows the rounding (it grows for extreme mass ratios, where the barycentre velocity cancels)'),
  tracks: TwoBodyTracks.nullable().describe('null unless the request asked for a track'),
});
export type TwoBodyAnswer = z.infer<typeof TwoBodyAnswer>;
export type TwoBodyTracks = z.infer<typeof TwoBodyTracks>;

const gmOf = (b: TwoBodyMember): number => b.gm ?? gmFromMass(b.mass!);
const massOf = (b: TwoBodyMember): number => b.mass ?? massFromGm(b.gm!);
const label = (b: TwoBodyMember, fallback: string): string => b.name ?? fallback;

/** The solver's bodies for a validated request (mass -> GM = G m). */
export function twoBodySolverInput(req: TwoBodyRequest): [BodyState, BodyState] {
  const [b1, b2] = req.bodies;
  return [
    { gm: gmOf(b1), r: b1.position, v: b1.velocity },
    { gm: gmOf(b2), r: b2.position, v: b2.velocity },
  ];
}

/** The "central body" of the relative orbit: body 1 with mu = G (m1 + m2), no radius. */
export function relativeCentralBody(req: TwoBodyRequest, reduction: TwoBodyReduction): CentralBody {
  const [b1, b2] = req.bodies;
  return {
    name: `${label(b1, 'body1')}+${label(b2, 'body2')}`,
    gm: reduction.totalGm,
    sources: { gm: 'G (m1 + m2) of the two bodies in the request' },
  };
}

/** |a - b| / max(|a|, |b|) for vectors; 0 when both are zero. */
function vectorRelativeDifference(a: SolverVec3, b: SolverVec3): number {
  const scale = Math.max(norm(a), norm(b));
  return scale === 0 ? 0 : norm(sub(a, b)) / scale;
}

/** Solver reduction and relative orbit -> API answer without the tracks (GM units -> kg via G). */
export function toTwoBodyAnswer(
  req: TwoBodyRequest,
  red: TwoBodyReduction,
  orbit: OrbitSolution,
  relativeBody: CentralBody,
  epochTT: number,
  scenarioHash: string,
): Omit<TwoBodyAnswer, 'tracks'> {
  const G = GRAVITATIONAL_CONSTANT_KM3_PER_KG_S2;
  const [b1, b2] = req.bodies;
  const axes = red.semiMajorAxes;
  const member = (b: TwoBodyMember, fraction: number, about: { r: SolverVec3; v: SolverVec3 }, a: number | null) => ({
    name: b.name ?? null,
    mass: massOf(b),
    gm: gmOf(b),
    massFraction: fraction,
    position: [...about.r] as [number, number, number],
    velocity: [...about.v] as [number, number, number],
    semiMajorAxis: a,
    period: red.periodS,
  });
  // The solver's integrals are G E (km^5/s^4) and G L (km^5/s^3): divide by G for kg km^2/s^2 and kg km^2/s.
  const energyDirect = red.energyTimesG.direct / G;
  const energyRelative = red.energyTimesG.fromRelative / G;
  const momentumDirect = red.angularMomentumTimesG.direct.map((x) => x / G) as [number, number, number];
  const momentumRelative = red.angularMomentumTimesG.fromRelative.map((x) => x / G) as [number, number, number];
  return {
    scenarioHash,
    epoch: formatUtcIso(epochTT),
    frame: req.frame,
    gravitationalConstant: {
      value: G,
      unit: 'km^3 kg^-1 s^-2',
      relativeUncertainty: GRAVITATIONAL_CONSTANT_RELATIVE_UNCERTAINTY,
      source: GRAVITATIONAL_CONSTANT_SOURCE,
    },
    totalMass: massFromGm(red.totalGm),
    totalGm: red.totalGm,
    reducedMass: massFromGm(red.reducedGm),
    barycenter: { position: [...red.barycentre.r], velocity: [...red.barycentre.v] },
    relativeState: { position: [...red.relative.r], velocity: [...red.relative.v] },
    relativeOrbit: toOrbitAnswer(orbit, relativeBody, epochTT, scenarioHash),
    bodies: [
      member(b1, red.massFraction1, red.body1, axes ? axes.body1 : null),
      member(b2, red.massFraction2, red.body2, axes ? axes.body2 : null),
    ],
    conserved: {
      energy: {
        unit: 'kg km^2/s^2',
        fromBodies: energyDirect,
        fromRelativeMotion: energyRelative,
        relativeDifference: relativeDifference(energyDirect, energyRelative),
      },
      angularMomentum: {
        unit: 'kg km^2/s',
        fromBodies: momentumDirect,
        fromRelativeMotion: momentumRelative,
        relativeDifference: vectorRelativeDifference(momentumDirect, momentumRelative),
      },
    },
  };
}

/** The name of each body's track (the request's label, or null). */
export const trackNames = (req: TwoBodyRequest): [string | null, string | null] => [req.bodies[0].name ?? null, req.bodies[1].name ?? null];
