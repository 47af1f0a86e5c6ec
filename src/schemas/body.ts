// Central bodies at the API: a built-in name, or a body given by its constants.
import { z } from 'zod';
import { BODIES, BODY_NAMES, type CentralBody } from '../solver/bodies/bodies.js';
import { DEG_PER_RAD, RAD_PER_DEG } from './common.js';

export const BodyName = z.enum(BODY_NAMES).describe('A built-in central body (GET /v1/bodies lists their constants and sources)');

export const CustomBody = z
  .object({
    name: z.string().min(1).max(64).default('custom').describe('A label for the body, echoed in answers'),
    gm: z.number().positive().describe('Gravitational parameter GM, km^3/s^2'),
    radius: z.number().positive().optional().describe('Mean equatorial radius, km (needed for altitudes, impact checks and J2)'),
    j2: z.number().min(-1).max(1).optional().describe('Unnormalised second zonal harmonic J2 (dimensionless)'),
    rotationRate: z.number().optional().describe('Sidereal rotation rate, deg/s'),
    flattening: z.number().min(0).lt(1).optional().describe('Flattening f = (a - b)/a'),
  })
  .strict()
  .describe('A central body given by its constants');

export const CentralBodyInput = z
  .union([BodyName, CustomBody])
  .default('earth')
  .describe('The central body: a built-in name (default "earth") or an object with gm and optionally radius, j2, rotationRate, flattening');
export type CentralBodyInput = z.output<typeof CentralBodyInput>;

/** The solver's body for a request's centralBody (degrees -> radians at the edge). */
export function resolveBody(input: CentralBodyInput): CentralBody {
  if (typeof input === 'string') return BODIES[input];
  return {
    name: input.name,
    gm: input.gm,
    ...(input.radius !== undefined ? { radius: input.radius } : {}),
    ...(input.j2 !== undefined ? { j2: input.j2 } : {}),
    ...(input.rotationRate !== undefined ? { rotationRate: input.rotationRate * RAD_PER_DEG } : {}),
    ...(input.flattening !== undefined ? { flattening: input.flattening } : {}),
    sources: { gm: 'given in the request' },
  };
}

export const BodySummary = z.object({
  name: z.string(),
  gm: z.number().describe('GM, km^3/s^2'),
  radius: z.number().nullable().describe('Mean equatorial radius, km'),
  j2: z.number().nullable().describe('J2, dimensionless'),
  rotationRate: z.number().nullable().describe('Sidereal rotation rate, deg/s'),
  flattening: z.number().nullable(),
});

export const BodyDescription = BodySummary.extend({
  heliocentricMeanMotion: z.number().nullable().describe('Mean motion about the Sun, deg/day (sun-synchronous test)'),
  sources: z.record(z.string(), z.string()).describe('Published source of each value, by field name'),
});

export function describeBody(body: CentralBody): z.infer<typeof BodySummary> {
  return {
    name: body.name,
    gm: body.gm,
    radius: body.radius ?? null,
    j2: body.j2 ?? null,
    rotationRate: body.rotationRate !== undefined ? body.rotationRate * DEG_PER_RAD : null,
    flattening: body.flattening ?? null,
  };
}
