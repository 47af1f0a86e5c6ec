// POST /v1/track: an orbit propagated over a time grid, in JSON, CSV, CCSDS OEM, GeoJSON or an SVG map (mapping: src/api/track.ts).
import { z } from 'zod';
import { TRACK_FORMATS, TRACK_FRAMES, type TrackFormat } from '../formats/track-output.js';
import { TRACK_MODELS } from '../solver/propagation/track.js';
import { DEMO_EPOCH, Epoch, UT1_MINUS_UTC, UT1_MINUS_UTC_TEXT } from './common.js';
import { Force, modelFields, withDefaultModel } from './forces.js';
import { TimeGrid } from './grid.js';
import { InterpolationDiagnostics } from './ephemeris.js';
import { EarthOrientationDiagnostics } from './diagnostics.js';
import { DEMO_ELEMENTS, orbitFields, requireOneOrbitInput } from './orbit.js';


export const ObjectLabel = z
  .object({
    name: z.string().min(1).max(80).regex(/^[\x20-\x7e]+$/, 'printable ASCII only (a CCSDS KVN value)').default('UNNAMED').describe('Object name (OEM OBJECT_NAME), printable ASCII'),
    id: z.string().min(1).max(80).regex(/^[\x20-\x7e]+$/, 'printable ASCII only (a CCSDS KVN value)').default('UNKNOWN').describe('Object identifier (OEM OBJECT_ID), printable ASCII'),
  })
  .strict()
  .default({ name: 'UNNAMED', id: 'UNKNOWN' });

export const TrackRequest = z
  .object({
    ...orbitFields,
    grid: TimeGrid,
    ...modelFields,
    frame: z.enum(TRACK_FRAMES).default('gcrf').describe(
      'Output frame: gcrf (inertial, J2000 equator and equinox); itrf (Earth-fixed: IAU 2006 precession, IAU 2000B nutation, Earth rotation angle; polar motion and the pole offsets dX, dY from the EOP_FILE table when the service has one, else neglected: ~10 m at LEO); ' +
      'geodetic (WGS-84 latitude and longitude in deg, height in km); ' +
      'teme (true equator, mean equinox: the frame of SGP4; from PEF by GMST 1982, Vallado et al. 2006; for the sgp4 model the method\'s own states, for the others rotated from gcrf through PEF). itrf, geodetic and teme need centralBody earth'),
    ut1MinusUtc: UT1_MINUS_UTC.describe(`${UT1_MINUS_UTC_TEXT}; without either, 0 costs up to ~0.4 km along-track in Earth-fixed frames`),
    format: z.enum(TRACK_FORMATS.map(([f]) => f) as [TrackFormat, ...TrackFormat[]]).optional()
      .describe('json | csv (RFC 4180, header row with units) | oem (CCSDS 502.0-B-3 KVN; gcrf, itrf or teme) | geojson (RFC 7946 ground track on WGS-84, split at the antimeridian; earth only, whatever the frame) | svg (the ground track on a world map; earth only, whatever the frame). ' +
        'Without it the Accept header chooses (application/json, text/csv, text/plain for OEM, application/geo+json, image/svg+xml); default json'),
    object: ObjectLabel.describe('Labels for the exported track'),
    creationDate: Epoch.optional().describe('CCSDS OEM only: the CREATION_DATE written in the message header (UTC; part of the scenario, so it changes the hash). Absent: the epoch of the initial state is written, so that one scenario always gives the same bytes; other formats ignore it'),
    passThroughBody: z.boolean().default(false).describe('Propagate as a point mass even below the body radius; by default a track that meets the body is refused (422 impact)'),
  })
  .strict()
  .superRefine(requireOneOrbitInput)
  .transform(withDefaultModel)
  .meta({
    description: 'An orbit and a time grid',
    examples: [{
      centralBody: 'earth',
      elements: DEMO_ELEMENTS,
      grid: { start: DEMO_EPOCH, stop: '2026-12-01T01:36:00Z', step: 60 },
      format: 'json',
      object: { name: 'PLOVER-7', id: '2026-900A' },
    }],
  })
  .meta({ id: 'TrackRequest' });
export type TrackRequest = z.output<typeof TrackRequest>;

export const StateSample = z.object({
  epoch: z.string().describe('ISO 8601 UTC'),
  position: z.tuple([z.number(), z.number(), z.number()]).describe('km, 6 decimals (gcrf, itrf or teme)'),
  velocity: z.tuple([z.number(), z.number(), z.number()]).describe('km/s, 9 decimals (gcrf, itrf or teme)'),
})
  .meta({ id: 'StateSample' });

export const GeodeticSample = z.object({
  epoch: z.string().describe('ISO 8601 UTC'),
  latitude: z.number().describe('Geodetic latitude, deg (WGS-84), 7 decimals'),
  longitude: z.number().describe('Longitude east, deg (-180, 180], 7 decimals'),
  height: z.number().describe('Height above the WGS-84 ellipsoid, km, 6 decimals'),
})
  .meta({ id: 'GeodeticSample' });

/** Drift of the model's conserved quantities across a track's inertial samples (GCRF, whatever the output frame). */
export const TrackDiagnostics = z.object({
  conservedQuantity: z.enum(['two-body', 'j2', 'none']).describe(
    'What the model\'s dynamics conserve. two-body (models two-body, numerical without forces): the specific energy E = v^2/2 - mu/r and the angular momentum vector h = r x v. ' +
    'j2 (numerical with J2 only, j2-secular, j2-analytic): the J2 energy integral E = v^2/2 - mu/r + mu J2 R^2 (3 z^2/r^2 - 1) / (2 r^3) and the angular momentum about the spin axis, h.k (z = r.k, k the axis J2 acts about in that model). ' +
    'none (numerical with drag, a third body or radiation pressure, which change energy and angular momentum; ephemeris): nothing is checked and the drifts are null'),
  meaning: z.string().describe('One sentence: what the drifts measure for this model (rounding, integration error, or the terms an analytic model leaves out), or why there are none'),
  energyRelativeDrift: z.number().nullable().describe('max |E_k - E_0| / |E_0| of the conserved energy of conservedQuantity across the samples; null when none'),
  energyDriftVsPotential: z.number().nullable().describe('max |E_k - E_0| / (mu / r_0): meaningful near parabolic where E_0 ~ 0; null when none'),
  angularMomentumRelativeDrift: z.number().nullable().describe('max |h_k - h_0| / |h_0|: the vector for two-body, the axial component h.k (over |h_0|) for j2; null when none'),
  interpolation: InterpolationDiagnostics.optional().describe('Model ephemeris only: how each segment was interpolated and the largest position error estimate over the samples'),
  earthOrientation: EarthOrientationDiagnostics.optional(),
})
  .meta({ id: 'TrackDiagnostics' });

export type TrackDiagnostics = z.infer<typeof TrackDiagnostics>;

export const TrackSample = z.union([StateSample, GeodeticSample])
  .meta({ id: 'TrackSample' });

export const TrackAnswer = z.object({
  scenarioHash: z.string(),
  model: z.enum(TRACK_MODELS),
  forces: z.array(Force).describe('Forces of the numerical model (empty for the analytic models)'),
  frame: z.enum(TRACK_FRAMES),
  centralBody: z.object({ name: z.string(), gm: z.number().describe('km^3/s^2 used'), radius: z.number().nullable() }),
  object: z.object({ name: z.string(), id: z.string() }),
  sampleCount: z.number().int(),
  diagnostics: TrackDiagnostics,
  samples: z.array(TrackSample),
})
  .meta({ id: 'TrackAnswer' });
