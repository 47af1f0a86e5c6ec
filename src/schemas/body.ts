// Central bodies at the API: a built-in name, or a body given by its constants (mapping: src/api/body.ts).
import { z } from 'zod';
import { BODY_NAMES } from '../solver/bodies/bodies.js';

export const BodyName = z.enum(BODY_NAMES).describe('A built-in central body (GET /v1/bodies lists their constants and sources)');

export const CustomBody = z
  .object({
    name: z.string().min(1).max(64).default('custom').describe('A label for the body, echoed in answers'),
    gm: z.number().positive().describe('Gravitational parameter GM, km^3/s^2'),
    radius: z.number().positive().optional().describe('Mean equatorial radius, km (needed for altitudes, impact checks and J2)'),
    j2: z.number().min(-1).max(1).optional().describe('Unnormalised second zonal harmonic J2 (dimensionless)'),
    rotationRateDegPerDay: z.number().optional().describe('Sidereal rotation rate, deg/day (the rate of the prime-meridian angle W, as the IAU WGCCRE tables give it)'),
    flattening: z.number().min(0).lt(1).optional().describe('Flattening f = (a - b)/a'),
  })
  .strict()
  .describe('A central body given by its constants')
  .meta({ id: 'CustomBody' });

export const CentralBodyInput = z
  .union([BodyName, CustomBody])
  .default('earth')
  .describe('The central body: a built-in name (default "earth") or an object with gm and optionally radius, j2, rotationRateDegPerDay, flattening')
  .meta({ id: 'CentralBody' });
export type CentralBodyInput = z.output<typeof CentralBodyInput>;

export const BodySummary = z.object({
  name: z.string(),
  gm: z.number().describe('GM, km^3/s^2'),
  radius: z.number().nullable().describe('Mean equatorial radius, km'),
  j2: z.number().nullable().describe('J2, dimensionless'),
  rotationRateDegPerDay: z.number().nullable().describe('Sidereal rotation rate, deg/day'),
  flattening: z.number().nullable(),
});

export const BodyDescription = BodySummary.extend({
  heliocentricMeanMotionDegPerDay: z.number().nullable().describe('Mean motion about the Sun, deg/day (sun-synchronous test)'),
  sources: z.record(z.string(), z.string()).describe('Published source of each value, by field name (the publication, and its table or constant where it has one; "from memory" marks a value not checked against it)'),
});
export type BodySummary = z.infer<typeof BodySummary>;

export const BodiesAnswer = z.object({ bodies: z.array(BodyDescription) })
  .meta({ id: 'BodiesAnswer' });
export type BodiesAnswer = z.infer<typeof BodiesAnswer>;
