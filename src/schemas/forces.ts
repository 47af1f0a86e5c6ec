// Propagation model and forces at the API (shared by /v1/track and /v1/passes).
import { z } from 'zod';
import { STATE_MODELS } from '../solver/propagation/propagator.js';

/** Models of the API: the state models, sgp4 for catalogue orbits (tle, omm) and ephemeris for ephemeris orbits. */
export const API_MODELS = [...STATE_MODELS, 'sgp4', 'ephemeris'] as const;
export type ApiModel = (typeof API_MODELS)[number];

/**
 * The model a request runs when it names none: sgp4 for a catalogue orbit (tle, omm), ephemeris
 * for an ephemeris, two-body otherwise. Applied as the last step of the request schemas, so the
 * scenario (and its hash) always holds the model run; requests with a state or elements hash as before.
 */
export const withDefaultModel = <T extends { model?: ApiModel | undefined; tle?: unknown; omm?: unknown; ephemeris?: unknown }>(req: T): Omit<T, 'model'> & { model: ApiModel } => ({
  ...req,
  model: req.model ?? (req.ephemeris !== undefined ? 'ephemeris' : req.tle !== undefined || req.omm !== undefined ? 'sgp4' : 'two-body'),
});

export const Force = z
  .discriminatedUnion('kind', [
    z.object({ kind: z.literal('j2') }).strict().describe('The central body\'s J2 about its spin axis (needs j2 and radius)'),
    z.object({ kind: z.literal('drag'), ballisticCoefficient: z.number().positive().max(1e6).describe('m / (Cd A), kg/m^2') }).strict()
      .describe('Drag in an exponential atmosphere co-rotating with the Earth (Vallado 4th ed. Table 8-4); Earth only'),
    z.object({ kind: z.literal('third-body'), body: z.enum(['sun', 'moon']) }).strict()
      .describe('Point-mass Sun or Moon (positions from astronomy-engine); Earth-centred orbits only'),
    z.object({
      kind: z.literal('srp'),
      areaToMass: z.number().positive().max(1e3).describe('A/m, m^2/kg'),
      reflectivity: z.number().min(0).max(1).describe('epsilon in [0, 1]; C_R = 1 + epsilon'),
    }).strict().describe('Solar radiation pressure on a sphere, cylindrical Earth shadow; Earth only'),
  ])
  .meta({ discriminator: { propertyName: 'kind' } })
  .meta({ id: 'Force' });

export const modelFields = {
  model: z.enum(API_MODELS).optional().describe(
    'Default: sgp4 for a tle or omm orbit, ephemeris for an ephemeris orbit, two-body otherwise. ' +
    'ephemeris: the given OEM interpolated (the only model of an ephemeris orbit, and only for one; see ephemeris.oem); never extrapolated. ' +
    'sgp4: the SGP4/SDP4 method (Vallado et al. 2006, WGS-72) from the catalogue mean elements, for tle and omm orbits only; the other models start from the SGP4 state at the element epoch (mean elements are not osculating: they are converted by SGP4 first). ' +
    'two-body: exact Keplerian motion (universal variables), no perturbations. ' +
    'j2-secular: Keplerian motion in mean elements (averaged over one revolution of the mean orbit) whose node, periapsis and mean anomaly drift at the first-order secular J2 rates, J2 about the frame z axis; bound orbits about a body with J2; short-period J2 terms left out (bounded error of 1 to 9 km at the first sample, up to ~25 km over a day, measured; see docs/accuracy.md). ' +
    'j2-analytic: Brouwer (1959) J2 theory with the short-period terms in Lyddane\'s (1963) form: mean elements (the given state inverted, so the first sample is the given state) drifting at the secular J2 rates to second order, plus the first-order short-period terms, J2 about the same axis as numerical; bound orbits with e < 0.95 about a body with J2; within 0.1 km of numerical J2 over 7 days in LEO and 1.5 km for Molniya and GTO orbits (measured; long-period terms left out, see docs/accuracy.md). ' +
    'numerical: two-body gravity plus `forces`, integrated (extrapolation method, relative tolerance 1e-13)'),
  forces: z.array(Force).max(5).default([]).describe('Forces of the numerical model, each kind at most once (ignored by the analytic models)'),
};
