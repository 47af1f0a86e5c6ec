// Central bodies between the API (degrees, deg/day for every angular rate) and the solver (radians, rad/s).
import { BODIES, BODY_NAMES, type CentralBody } from '../solver/bodies/bodies.js';
import { DEG, RAD, SECONDS_PER_DAY } from '../solver/core/math.js';
import type { BodiesAnswer, BodySummary, CentralBodyInput } from '../schemas/body.js';

/** A rate converted from rad/s, printed to 15 significant digits (the published digits, without the conversion's last-bit noise). */
const converted = (x: number): number => Number(x.toPrecision(15));

/** The solver's body for a request's centralBody (degrees -> radians at the edge). */
export function resolveBody(input: CentralBodyInput): CentralBody {
  if (typeof input === 'string') return BODIES[input];
  return {
    name: input.name,
    gm: input.gm,
    ...(input.radius !== undefined ? { radius: input.radius } : {}),
    ...(input.j2 !== undefined ? { j2: input.j2 } : {}),
    ...(input.rotationRateDegPerDay !== undefined ? { rotationRateRadS: (input.rotationRateDegPerDay * DEG) / SECONDS_PER_DAY } : {}),
    ...(input.flattening !== undefined ? { flattening: input.flattening } : {}),
    sources: { gm: 'given in the request' },
  };
}

/** A solver body as the answers describe it (rad/s -> deg/day). */
export function describeBody(body: CentralBody): BodySummary {
  return {
    name: body.name,
    gm: body.gm,
    radius: body.radius ?? null,
    j2: body.j2 ?? null,
    rotationRateDegPerDay: body.rotationRateRadS !== undefined ? converted(body.rotationRateRadS * RAD * SECONDS_PER_DAY) : null,
    flattening: body.flattening ?? null,
  };
}

/** GET /v1/bodies: every built-in body with its sources (heliocentric mean motion rad/s -> deg/day). */
export function bodiesAnswer(): BodiesAnswer {
  return {
    bodies: BODY_NAMES.map((name) => {
      const body = BODIES[name];
      return {
        ...describeBody(body),
        heliocentricMeanMotionDegPerDay: body.heliocentricMeanMotionRadS !== undefined ? converted(body.heliocentricMeanMotionRadS * RAD * SECONDS_PER_DAY) : null,
        sources: { ...body.sources },
      };
    }),
  };
}
