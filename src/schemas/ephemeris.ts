// Ephemeris orbit input: an operator's CCSDS OEM (read by src/formats/oem-read.ts; src/api/ephemeris.ts
// turns its problems into 422 answers naming the line and brings the nodes to GCRF).
import { z } from 'zod';
import { DEFAULT_DEGREE, MAX_INTERPOLATION_DEGREE, MAX_OEM_DATA_LINES, MAX_OEM_SEGMENTS } from '../formats/oem-read.js';

/** Longest OEM text accepted in a request, characters (the body limit BODY_LIMIT_BYTES usually binds first). */
export const MAX_OEM_CHARS = 64 * 1024 * 1024;

export const EphemerisInput = z
  .object({
    oem: z.string().min(1).max(MAX_OEM_CHARS).describe(
      'A CCSDS 502.0-B-3 Orbit Ephemeris Message in KVN (the text of the file, versions 1.0 to 3.0): a header, then one or more segments ' +
      '(META_START ... META_STOP, data lines "epoch x y z x_dot y_dot z_dot [x_ddot y_ddot z_ddot]" in km, km/s, km/s**2, optional covariance blocks, which are skipped). ' +
      'CENTER_NAME EARTH; REF_FRAME GCRF, ICRF, EME2000, ITRF (or a realisation such as ITRF2014; Earth-fixed, velocity relative to the rotating Earth, converted with the request\'s Earth orientation) or TEME; ' +
      'TIME_SYSTEM UTC, TAI, TT or GPS; INTERPOLATION LAGRANGE, HERMITE (positions with their velocities, and accelerations where the lines give them) or LINEAR, ' +
      `INTERPOLATION_DEGREE 1 to ${MAX_INTERPOLATION_DEGREE} (default ${DEFAULT_DEGREE.LAGRANGE} for LAGRANGE and when INTERPOLATION is absent, ${DEFAULT_DEGREE.HERMITE} for HERMITE, 1 for LINEAR). ` +
      'Each segment is used over USEABLE_START_TIME .. USEABLE_STOP_TIME (else START_TIME .. STOP_TIME) within its first and last data line; an epoch covered by two segments is taken from the earlier one. ' +
      `At most ${MAX_OEM_SEGMENTS} segments and ${MAX_OEM_DATA_LINES} data lines. A malformed message answers 422 oem-malformed, one the service does not read (another centre, frame, time system or method; XML) 422 oem-unsupported, each naming the line`),
  })
  .strict()
  .describe('An ephemeris to interpolate (model ephemeris, implied): samples and search windows must lie inside its coverage, else 422 outside-coverage naming the coverage; it is never extrapolated')
  .meta({ id: 'EphemerisOrbit' });
export type EphemerisInput = z.output<typeof EphemerisInput>;

export const SegmentInterpolation = z.object({
  start: z.string().describe('Start of the segment\'s coverage, ISO 8601 UTC'),
  stop: z.string().describe('Stop of the segment\'s coverage, ISO 8601 UTC'),
  refFrame: z.string().describe('REF_FRAME as written in the file (its nodes were brought to gcrf)'),
  timeSystem: z.string().describe('TIME_SYSTEM of the file\'s epochs'),
  nodes: z.number().int().describe('Data lines of the segment'),
  method: z.enum(['lagrange', 'hermite']).describe('lagrange: each component through the nearest nodes; hermite: positions matched with their velocities (and accelerations) at the nearest nodes'),
  degreeAsked: z.number().int().describe('INTERPOLATION_DEGREE of the file, or the default when it gives none'),
  degreeFromFile: z.boolean().describe('False when the file named no INTERPOLATION_DEGREE and the default was taken'),
  degree: z.number().int().describe('The degree interpolated with: fewer nodes than asked in a short segment lower it, Hermite rounds it up to whole nodes'),
  nodesPerSample: z.number().int(),
  usesAccelerations: z.boolean(),
}).meta({ id: 'SegmentInterpolation' });

export const InterpolationDiagnostics = z.object({
  segments: z.array(SegmentInterpolation),
  maxPositionErrorEstimate: z.number().describe(
    'km: the largest estimated interpolation error in position over the epochs computed, from the change the farthest node makes (the last term of Newton\'s form: the error of the interpolant one node smaller, so it overstates the error of the one used). ' +
    'It says nothing of the errors already in the file\'s states'),
}).describe('The ephemeris model: how each segment was interpolated and an error estimate').meta({ id: 'InterpolationDiagnostics' });
export type InterpolationDiagnostics = z.infer<typeof InterpolationDiagnostics>;
