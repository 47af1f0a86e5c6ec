// Shared request/answer pieces. Units at the API: km, km/s, s, degrees, kg, km^3/s^2.
import { z } from 'zod';
import { SPEED_OF_LIGHT_KM_S } from '../solver/core/constants.js';
import { parseUtcIso } from '../solver/time/time.js';
import type { ErrorCode } from '../errors.js';
import { TIME_SYSTEMS, type TimeSystem } from '../solver/time/time-systems.js';
import { epochProblem } from '../api/epoch.js';

export const DEMO_EPOCH = '2026-12-01T00:00:00Z';

export const Vec3 = z.tuple([z.number(), z.number(), z.number()]);

/** Largest position component accepted, km (~6700 AU): every propagated number then stays printable (< 1e21) over 1972-2199. */
export const MAX_POSITION_KM = 1e12;
/** Largest velocity component accepted: the speed of light, km/s (SI Brochure, 9th ed.). */
export const MAX_SPEED_KM_S = SPEED_OF_LIGHT_KM_S;
const bounded = (limit: number) => z.number().min(-limit).max(limit);
export const PositionKm = z.tuple([bounded(MAX_POSITION_KM), bounded(MAX_POSITION_KM), bounded(MAX_POSITION_KM)])
  .describe(`Position [x, y, z] in km, each component within +-${MAX_POSITION_KM}`);
export const VelocityKmS = z.tuple([bounded(MAX_SPEED_KM_S), bounded(MAX_SPEED_KM_S), bounded(MAX_SPEED_KM_S)])
  .describe('Velocity [vx, vy, vz] in km/s, each component below the speed of light');

/**
 * A schema issue answered with its own code of the error table rather than validation-failed
 * (src/plugins/problems.ts reads `params.problem`: a body whose every issue carries one code is
 * answered with that code).
 */
export function codedIssue(code: ErrorCode, message: string, path?: (string | number)[]): z.core.$ZodRawIssue {
  return { code: 'custom', message, params: { problem: code }, input: undefined, ...(path ? { path } : {}) };
}

export const Epoch = z
  .string()
  .superRefine((text, ctx) => {
    const problem = epochProblem(text, 'UTC');
    if (problem) ctx.addIssue(codedIssue(problem.code, problem.message));
  })
  .describe('Epoch: ISO 8601 UTC timestamp ending in Z (or a zone offset +hh:mm / -hh:mm), fractional seconds allowed (rounded to the microsecond), years 1972-2199; leap seconds from the built-in table')
  .meta({ example: DEMO_EPOCH });

/** The time system of the epochs of one request part; each part (state, elements, grid, window) names its own. */
export const TimeSystemField = z.enum(TIME_SYSTEMS).optional().describe(
  'Time system of this part\'s epochs: UTC (default; epochs end in Z), TAI, TT or GPS (calendar text without a zone letter, e.g. 2026-12-01T00:01:09.184 TT; ' +
  'the day-of-year form 2026-335T00:00:00 is also read). Converted at the edge: the same instant in any system is the same scenario (one hash, one answer). Answers print UTC');

/** An epoch whose time system is named beside it: checked by refineEpochs on the enclosing object. */
// Alone the text is checked as a date (as UTC when it carries a zone, else as zone-less calendar
// text); refineEpochs then checks it in the part's own time system.
const hasZone = (text: string): boolean => /(?:Z|[+-]\d{2}:\d{2})$/.test(text);
const epochTextProblem = (text: string) => epochProblem(text, hasZone(text) ? 'UTC' : 'TAI');
/** True for a string EpochText accepts (a cheap test for long lists). */
export const isEpochText = (value: unknown): boolean => typeof value === 'string' && value.length <= 64 && epochTextProblem(value) === undefined;
export const EpochText = z.string().max(64)
  .superRefine((text, ctx) => {
    const problem = epochTextProblem(text);
    if (problem) ctx.addIssue(codedIssue(problem.code, problem.message));
  })
  .describe('Epoch as calendar text in the time system of this part (timeSystem; UTC by default: ISO 8601 ending in Z or a zone offset +hh:mm / -hh:mm), rounded to the microsecond, years 1972-2199').meta({ example: DEMO_EPOCH });

/** Check the named epoch fields of an object in its timeSystem; issues carry the field's path. */
export function refineEpochs(keys: readonly string[]) {
  return (obj: Record<string, unknown> & { timeSystem?: TimeSystem | undefined }, ctx: z.RefinementCtx): void => {
    const system = obj.timeSystem ?? 'UTC';
    for (const key of keys) {
      const v = obj[key];
      // Text EpochText refused is reported once (by it); UTC text with its zone it has checked already.
      if (typeof v !== 'string' || (system === 'UTC' && hasZone(v)) || epochTextProblem(v) !== undefined) continue;
      const problem = epochProblem(v, system);
      if (problem) ctx.addIssue(codedIssue(problem.code, problem.message, [key]));
    }
  };
}

/** UT1 - UTC of a request: given, it wins over everything; absent, the EOP_FILE table (when configured and covering the epoch), else 0. */
export const UT1_MINUS_UTC = z.number().min(-0.9).max(0.9).optional();
export const UT1_MINUS_UTC_TEXT = 'UT1 - UTC, s (IERS Bulletin A); when given it wins over the EOP_FILE table, when absent the table gives it (0 without a table; 0 outside the table, with a warning in diagnostics.earthOrientation). Polar motion and dX, dY come from the table whenever it covers the epoch';

/** True for a string the Epoch schema accepts (a cheap test for long lists). */
export const isEpoch = (value: unknown): boolean => typeof value === 'string' && parseUtcIso(value).ok;

/** Epoch as the answers give it: ISO 8601 UTC to the microsecond. */
export const EpochOut = z.string().describe('ISO 8601 UTC timestamp to the microsecond (6 fractional digits); every state, look angle and event of an answer is computed at the epoch printed beside it').meta({ example: '2026-12-01T00:00:00.000000Z' });

export const ScenarioHash = z.string().regex(/^[0-9a-f]{64}$/).describe('SHA-256 (hex) of the normalised scenario and the solver version; also the ETag');

export const FieldIssue = z.object({
  path: z.string().describe('Where the problem is, e.g. body.state.position.0'),
  message: z.string(),
});

export const Problem = z
  .object({
    type: z.string().describe('URI reference of the problem type: /problems/{code}'),
    title: z.string(),
    status: z.number().int().min(100).max(599).describe('The HTTP status code of the answer').meta({ example: 422 }),
    detail: z.string().describe('What went wrong with this request, in words'),
    instance: z.string().describe('The request path'),
    requestId: z.string().describe('Identifies the request in the service logs'),
    errors: z.array(FieldIssue).optional().describe('For validation errors: the offending fields, at most 20 (paths and messages clipped to 200 characters)'),
    errorCount: z.number().int().nonnegative().optional().describe('With errors: how many issues there were in all'),
  })
  .meta({ id: 'Problem', description: 'RFC 9457 problem details (application/problem+json); `type` names the code, whose meaning GET /problems/{code} gives' });

export const PROBLEM_MEDIA_TYPE = 'application/problem+json';

/** A response declared as a problem document, in its own media type. */
export const problemAnswer = (description: string) => ({
  description,
  content: { [PROBLEM_MEDIA_TYPE]: { schema: Problem } },
});

export const problemResponses = {
  400: problemAnswer('validation-failed, malformed-json, json-too-deep: malformed JSON or a body that does not match the schema'),
  422: problemAnswer('Valid JSON describing a physically impossible or unsolvable scenario, or one past a service limit'),
} as const;
