// POST /v1/two-body: request and answer schemas (the mapping to and from the solver is in src/api/two-body.ts).
import { TrackDiagnostics } from './track.js';
import { z } from 'zod';
import { SPEED_OF_LIGHT_KM_S } from '../solver/core/constants.js';
import { DEMO_EPOCH, EpochOut, EpochText, refineEpochs, ScenarioHash, TimeSystemField, Vec3 } from './common.js';
import { TimeGrid } from './grid.js';
import { OrbitAnswer } from './orbit.js';

// Input limits: wide enough for a dust grain to a galaxy, narrow enough that every product the
// answer needs (G m1 m2 / r, m v^2, m r v) stays a finite double.
export const MASS_MIN_KG = 1e-30;
export const MASS_MAX_KG = 1e50;
export const GM_MIN_KM3_S2 = 1e-49;
export const GM_MAX_KM3_S2 = 1e30;
export const POSITION_LIMIT_KM = 1e18;
/** Speed of light, km/s (exact by the definition of the metre; SI Brochure, 9th ed., 2019): a Newtonian model is meaningless beyond it. */
export const VELOCITY_LIMIT_KM_S = SPEED_OF_LIGHT_KM_S;

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
  .describe('One body: a point mass with its state in the request frame')
  .meta({ id: 'TwoBodyMember' });
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
    epoch: EpochText.describe('Epoch of both states, in timeSystem (UTC by default: ISO 8601 ending in Z), years 1972-2199'),
    timeSystem: TimeSystemField,
    frame: z.enum(['gcrf']).default('gcrf').describe('Inertial frame of both states: gcrf (J2000 equator and equinox)'),
    bodies: z.tuple([TwoBodyMember, TwoBodyMember]).describe('Exactly two bodies; the relative state is body 2 seen from body 1'),
    track: z
      .object({ grid: TimeGrid })
      .strict()
      .optional()
      .describe('Ask for both bodies\' tracks about the barycentre on this time grid (same grid options and MAX_TRACK_SAMPLES limit as /v1/track)'),
  })
  .strict()
  .superRefine(refineEpochs(['epoch']))
  .meta({
    description: 'Two point masses (mass in kg or GM in km^3/s^2, position km, velocity km/s) in one inertial frame at one epoch',
    examples: [DEMO_TWO_BODY],
  })
  .meta({ id: 'TwoBodyRequest' });
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
  totalMass: z.number().describe('M = m1 + m2, kg (each mass as given, or GM / G), printed to 15 significant digits'),
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
})
  .meta({ id: 'TwoBodyAnswer' });
export type TwoBodyAnswer = z.infer<typeof TwoBodyAnswer>;
export type TwoBodyTracks = z.infer<typeof TwoBodyTracks>;
