// POST /v1/central-force: request and answer schemas (the mapping to and from the solver is in
// src/api/central-force.ts). Lengths, energies, masses and times are passed through unchanged:
// the endpoint works in any consistent unit system.
import { z } from 'zod';
import { MAX_ABS_EXPONENT, MAX_TERMS } from '../solver/central/potential.js';
import { DEFAULT_SAMPLES, MAX_SAMPLES } from '../solver/central/radial.js';
import { MAX_TRACK_SAMPLES } from '../solver/central/radial-track.js';
import { ScenarioHash } from './common.js';

const UNITS_NOTE = 'Any consistent unit system: the numbers are used as given (no km or degree conversion), so lengths, masses, times and energies must all come from one system.';

export const CENTRAL_FORCE_FORMATS = [
  ['json', 'application/json'],
  ['svg', 'image/svg+xml'],
] as const;
export type CentralForceFormat = (typeof CENTRAL_FORCE_FORMATS)[number][0];

export { SVG_MEDIA_TYPE } from '../formats/svg/common.js';
export const DEFAULT_TRACK_SAMPLES = 201;
export const DEFAULT_UNIT_LABEL = 'consistent units';

const Length = (what: string) => z.number().positive().describe(`${what}, length unit (> 0)`);

const PowerTerm = z
  .object({
    kind: z.literal('power'),
    coefficient: z.number().describe('k in U = k r^n, energy unit x length^-n. Exactly k r^n, no sign flip: k < 0 with n = -1 is an attractive Kepler/Coulomb term (k = -G M m), k > 0 with n = 2 a harmonic well (k = spring constant / 2)'),
    exponent: z.number().min(-MAX_ABS_EXPONENT).max(MAX_ABS_EXPONENT).describe(`n in U = k r^n, |n| <= ${MAX_ABS_EXPONENT}; n = 0 is a constant that shifts energies and exerts no force`),
  })
  .strict()
  .describe('Power law U = k r^n');

const YukawaTerm = z
  .object({
    kind: z.literal('yukawa'),
    coefficient: z.number().describe('k in U = -k exp(-r/a) / r, energy unit x length; k > 0 attractive'),
    range: Length('a, the screening length'),
  })
  .strict()
  .describe('Yukawa (screened Coulomb) U = -k exp(-r/a) / r; k > 0 attractive');

const GaussianTerm = z
  .object({
    kind: z.literal('gaussian'),
    depth: z.number().describe('V0 in U = -V0 exp(-(r - r0)^2 / (2 s^2)), energy unit; V0 > 0 a well, V0 < 0 a bump'),
    center: z.number().default(0).describe('r0, length unit (default 0)'),
    width: Length('s, the standard width'),
  })
  .strict()
  .describe('Gaussian well or bump U = -V0 exp(-(r - r0)^2 / (2 s^2)); V0 > 0 attractive');

const ExponentialTerm = z
  .object({
    kind: z.literal('exponential'),
    depth: z.number().describe('V0 in U = -V0 exp(-r/a), energy unit; V0 > 0 attractive'),
    range: Length('a, the decay length'),
  })
  .strict()
  .describe('Exponential U = -V0 exp(-r/a); V0 > 0 attractive');

const LogarithmicTerm = z
  .object({
    kind: z.literal('logarithmic'),
    coefficient: z.number().describe('k in U = k ln(r / r0), energy unit; k > 0 attractive (force -k/r)'),
    scale: Length('r0, where the term is zero'),
  })
  .strict()
  .describe('Logarithmic U = k ln(r / r0)');

export const PotentialTermInput = z
  .discriminatedUnion('kind', [PowerTerm, YukawaTerm, GaussianTerm, ExponentialTerm, LogarithmicTerm])
  .meta({ discriminator: { propertyName: 'kind' } })
  .describe('One term of the potential energy U(r), chosen by kind')
  .meta({ id: 'PotentialTerm' });

export const InitialRadialState = z
  .object({
    radius: Length('Initial distance r from the centre'),
    radialVelocity: z.number().describe('dr/dt at the start, length / time unit; negative moves inward'),
    tangentialVelocity: z.number().describe('r dphi/dt at the start, length / time unit; its sign is the sense of rotation'),
  })
  .strict()
  .describe('Instead of angularMomentum and energy: a state, giving l = m r v_t and E = m (v_r^2 + v_t^2) / 2 + U(r). It also chooses the allowed region analysed (the one holding this radius) and the start of the track');

export const RadialTrackInput = z
  .object({
    periods: z.number().positive().optional().describe('Length of the track in radial periods (> 0; only for bound or circular motion, else 422 no-radial-period). Give this or duration'),
    duration: z.number().refine((d) => d !== 0, 'duration must not be zero').optional().describe('Length of the track, time unit; negative integrates backward. Give this or periods'),
    samples: z.number().int().min(2).max(MAX_TRACK_SAMPLES).default(DEFAULT_TRACK_SAMPLES).describe(`Equally spaced samples including both ends, 2 to ${MAX_TRACK_SAMPLES} (default ${DEFAULT_TRACK_SAMPLES}; the service limit MAX_TRACK_SAMPLES also applies)`),
    start: z.enum(['initial', 'periapsis', 'apoapsis']).optional().describe('Where the track starts (t = 0, phi = 0): the initial state (default when given; needs initial), else the periapsis (default) or apoapsis of the analysed region'),
  })
  .strict()
  .superRefine((t, ctx) => {
    if ((t.periods === undefined) === (t.duration === undefined)) ctx.addIssue({ code: 'custom', path: ['periods'], message: 'give exactly one of periods and duration' });
  })
  .describe('Ask for r(t), phi(t) integrated from the radial equation m r\'\' = -dU_eff/dr with phi\' = l / (m r^2); the JSON answer then carries it, the SVG answer adds the path r(phi) in the plane');

export const UnitLabels = z
  .object({
    radius: z.string().min(1).max(60).regex(/^[^\r\n]+$/).default(DEFAULT_UNIT_LABEL).describe('Label of the length unit on the plot\'s r axis'),
    energy: z.string().min(1).max(60).regex(/^[^\r\n]+$/).default(DEFAULT_UNIT_LABEL).describe('Label of the energy unit on the plot\'s U_eff axis'),
  })
  .strict()
  .default({ radius: DEFAULT_UNIT_LABEL, energy: DEFAULT_UNIT_LABEL })
  .describe('Labels only, for the SVG axes and echoed in the JSON answer; no conversion is made');

/** Invented demo: a Kepler well with a small attractive r^-3 correction (units of the caller's choosing). */
const DEMO_REQUEST = {
  mass: 1,
  potential: { terms: [{ kind: 'power', coefficient: -1, exponent: -1 }, { kind: 'power', coefficient: -0.002, exponent: -3 }] },
  angularMomentum: 1.2,
  energy: -0.3,
  track: { periods: 2, samples: 101 },
};

export const CentralForceRequest = z
  .object({
    mass: z.number().positive().describe('m, mass unit (> 0): the moving mass, or the reduced mass m1 m2 / (m1 + m2) of a two-body system'),
    potential: z
      .object({ terms: z.array(PotentialTermInput).min(1).max(MAX_TERMS).describe(`U(r) is the sum of these terms (1 to ${MAX_TERMS}), energy unit`) })
      .strict()
      .describe('The potential energy U(r) of the central force F = -dU/dr'),
    angularMomentum: z.number().optional().describe('l = m r^2 dphi/dt, mass x length^2 / time; its sign is the sense of rotation; 0 is motion on a line through the centre. Give with energy, or give initial'),
    energy: z.number().optional().describe('E = m (dr/dt)^2 / 2 + U_eff(r), energy unit. Give with angularMomentum, or give initial'),
    initial: InitialRadialState.optional(),
    samples: z.number().int().min(2).max(MAX_SAMPLES).default(DEFAULT_SAMPLES).describe(`Number of effective-potential samples, 2 to ${MAX_SAMPLES} (default ${DEFAULT_SAMPLES}); samples where U is not finite are left out`),
    rMin: z.number().positive().optional().describe('Smallest sampled radius, length unit (default: chosen around the turning points and circular orbits)'),
    rMax: z.number().positive().optional().describe('Largest sampled radius, length unit (default: chosen around the turning points and circular orbits)'),
    track: RadialTrackInput.optional(),
    format: z.enum(CENTRAL_FORCE_FORMATS.map(([f]) => f) as [CentralForceFormat, ...CentralForceFormat[]]).optional()
      .describe('json (the analysis) | svg (a plot of U_eff, U, the energy level, turning points and circular orbits; with a track, the path r(phi)). Without it the Accept header chooses (application/json, image/svg+xml); default json'),
    units: UnitLabels,
  })
  .strict()
  .superRefine((req, ctx) => {
    const byConstants = req.angularMomentum !== undefined || req.energy !== undefined;
    if (byConstants === (req.initial !== undefined)) {
      ctx.addIssue({ code: 'custom', path: ['initial'], message: 'give exactly one of (angularMomentum and energy) or initial' });
    } else if (byConstants && (req.angularMomentum === undefined || req.energy === undefined)) {
      ctx.addIssue({ code: 'custom', path: [req.angularMomentum === undefined ? 'angularMomentum' : 'energy'], message: 'angularMomentum and energy go together' });
    }
    if (req.rMin !== undefined && req.rMax !== undefined && !(req.rMax > req.rMin)) {
      ctx.addIssue({ code: 'custom', path: ['rMax'], message: 'rMax must exceed rMin' });
    }
    if (req.track?.start === 'initial' && req.initial === undefined) {
      ctx.addIssue({ code: 'custom', path: ['track', 'start'], message: 'start "initial" needs initial' });
    }
  })
  .meta({
    description: `Motion of a mass in a central potential U(r) built from terms, analysed through the effective potential U_eff = U + l^2 / (2 m r^2). ${UNITS_NOTE} Angles in the answer are degrees.`,
    examples: [DEMO_REQUEST],
  })
  .meta({ id: 'CentralForceRequest' });
export type CentralForceRequest = z.output<typeof CentralForceRequest>;

const Motion = z.enum(['bound', 'unbound', 'captured', 'circular'])
  .describe('bound: between two turning points (or a turning point and an unstable circular orbit); unbound: reaches infinity; captured: reaches r = 0 (with l = 0 a fall along a line through the centre); circular: E equals the energy of a stable circular orbit');
const RegionEnd = z.enum(['centre', 'turning-point', 'unstable-circular-orbit', 'infinity'])
  .describe('What ends the region: r = 0, a turning point E = U_eff, an unstable circular orbit approached only asymptotically (E at the top of a barrier), or infinity');

export const EffectivePotentialSample = z.object({
  r: z.number().describe('Radius, length unit'),
  u: z.number().describe('U(r), energy unit'),
  uEff: z.number().describe('U_eff(r) = U(r) + l^2 / (2 m r^2), energy unit'),
});

export const CircularOrbitOut = z.object({
  radius: z.number().describe('Radius where dU_eff/dr = 0, length unit'),
  energy: z.number().describe('U_eff at that radius: the energy of the circular orbit with this l, energy unit'),
  stable: z.boolean().describe('d2U_eff/dr2 > 0 (a minimum of U_eff)'),
  radialFrequency: z.number().nullable().describe('Small-oscillation radial angular frequency sqrt(U_eff\'\' / m), radians per time unit; null when unstable'),
  angularFrequency: z.number().describe('|l| / (m r^2), radians per time unit'),
  frequencyRatio: z.number().nullable().describe('radialFrequency / angularFrequency; null when unstable or l = 0'),
  apsidalAngle: z.number().nullable().describe('Apsidal angle of near-circular orbits about this one, 180 / frequencyRatio, degrees; null when unstable or l = 0'),
});

export const AllowedRegionOut = z.object({
  inner: z.number().describe('Inner end, length unit (0 at the centre)'),
  outer: z.number().nullable().describe('Outer end, length unit; null when the region extends to infinity'),
  innerEnd: RegionEnd,
  outerEnd: RegionEnd,
  motion: Motion,
});

export const RadialTrackSample = z.object({
  t: z.number().describe('Time from the start, time unit'),
  r: z.number().describe('Radius, length unit'),
  rDot: z.number().describe('dr/dt, length / time unit'),
  phi: z.number().describe('Polar angle from the start, degrees, unwrapped (grows with the sense of l)'),
});

export const RadialTrackOut = z.object({
  start: z.enum(['initial', 'periapsis', 'apoapsis']).describe('Where the track starts'),
  sampleCount: z.number().int().describe('Number of samples (fewer than asked when the motion reached the centre)'),
  energy: z.number().describe('m rDot^2 / 2 + U_eff(r) of the start state, energy unit'),
  energyDrift: z.number().describe('Largest |E(t_i) - E(t_0)| over the samples, energy unit (integration error)'),
  energyDriftRelative: z.number().describe('energyDrift over the energy scale at the start (|E| plus the magnitudes of all parts of U_eff), dimensionless'),
  reachedCentre: z.boolean().describe('The motion fell to the centre (r below 1e-6 of the start radius) and the track ends there, with fewer samples than asked'),
  samples: z.array(RadialTrackSample),
});

export const CentralForceAnswer = z.object({
  scenarioHash: ScenarioHash,
  mass: z.number().describe('m as given, mass unit'),
  angularMomentum: z.number().describe('l, as given or m r v_t from initial; mass x length^2 / time'),
  energy: z.number().describe('E, as given or from initial; energy unit'),
  units: z.object({ radius: z.string(), energy: z.string() }).describe('The unit labels of the request (no conversion is made)'),
  effectivePotential: z.array(EffectivePotentialSample).describe('Samples around the analysed region, ascending in r'),
  sampleSpacing: z.enum(['linear', 'log']).describe('How the sample radii are spaced (log when they span more than a factor 20)'),
  turningPoints: z.array(z.number()).describe('Every radius where E = U_eff, ascending, in all regions; length unit'),
  circularOrbits: z.array(CircularOrbitOut).describe('Every radius where dU_eff/dr = 0, ascending'),
  allowedRegions: z.array(AllowedRegionOut).describe('Every interval of r where E >= U_eff, ascending'),
  analysedRegion: z.number().int().describe('Index in allowedRegions of the region described below: the one holding initial.radius, else the outermost'),
  motion: Motion,
  rectilinear: z.boolean().describe('l = 0: motion along a line through the centre (no apsidal angle)'),
  periapsis: z.number().nullable().describe('Inner end of the analysed region, length unit; null when the motion reaches the centre'),
  apoapsis: z.number().nullable().describe('Outer end of the analysed region, length unit; null when the motion reaches infinity'),
  radialPeriod: z.number().nullable().describe('Time from periapsis to apoapsis and back, time unit (circular: 2 pi / radialFrequency); null when the radial motion is not periodic (unbound, captured, or a region ending at an unstable circular orbit, approached only asymptotically)'),
  apsidalAngle: z.number().nullable().describe('Angle swept from periapsis to apoapsis, degrees (180 for a Kepler ellipse, 90 for the isotropic oscillator; circular: the near-circular limit); null when radialPeriod is null or the motion is rectilinear'),
  precessionPerOrbit: z.number().nullable().describe('2 apsidalAngle - 360: advance of the periapsis per radial period, degrees (0 for a closed Kepler ellipse; negative: the periapsis regresses); null when apsidalAngle is null'),
  track: RadialTrackOut.nullable().describe('r(t), phi(t) when the request asked for a track, else null'),
})
  .meta({ id: 'CentralForceAnswer' });
export type CentralForceAnswer = z.infer<typeof CentralForceAnswer>;
