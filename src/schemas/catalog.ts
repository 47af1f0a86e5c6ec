// Catalogue orbit inputs: a two-line element set or a CCSDS OMM (read by src/formats/tle.ts and
// omm.ts; src/api/catalog.ts turns their problems into 422 answers naming line, columns or keyword).
import { z } from 'zod';
import { EpochOut } from './common.js';

export const TleInput = z
  .object({
    line1: z.string().max(200).describe('Line 1 of the two-line set: exactly 69 characters, columns as in Spacetrack Report No. 3 (epoch, mean motion derivatives, BSTAR), checksum in column 69'),
    line2: z.string().max(200).describe('Line 2: exactly 69 characters (inclination, RAAN, eccentricity, argument of perigee, mean anomaly in deg; mean motion in rev/day), checksum in column 69'),
    name: z.string().min(1).max(80).regex(/^[\x20-\x7e]+$/, 'printable ASCII only').optional().describe('Object name (line 0 of a three-line set)'),
  })
  .strict()
  .describe('A two-line element set (SGP4 mean elements, TEME, epoch UTC). Checksums are verified; Alpha-5 catalogue numbers are accepted; two-digit years 57-99 are 1957-1999, 00-56 are 2000-2056. A malformed field answers 422 tle-malformed naming the line, the columns and what was expected')
  .meta({ id: 'TwoLineElementSet' });

const OmmKeyword = z.string().regex(/^[A-Z][A-Z0-9_]*$/, 'a CCSDS keyword (capitals, digits, underscores)').max(64);

export const OmmInput = z
  .union([
    z.string().min(1).max(65_536).describe('The OMM as CCSDS 502.0-B-3 KVN text ("KEYWORD = value" lines) or NDM/XML text'),
    z.record(OmmKeyword, z.union([z.string().max(200), z.number()]))
      .refine((o) => Object.keys(o).length <= 200, 'at most 200 keywords')
      .describe('The OMM as a JSON object whose keys are the keywords of CCSDS 502.0-B-3 (OBJECT_NAME, EPOCH, MEAN_MOTION, ECCENTRICITY, INCLINATION, RA_OF_ASC_NODE, ARG_OF_PERICENTER, MEAN_ANOMALY, BSTAR, MEAN_MOTION_DOT, MEAN_MOTION_DDOT, ...), values as numbers or strings'),
  ])
  .describe('A CCSDS Orbit Mean-elements Message (one segment). Only MEAN_ELEMENT_THEORY SGP4 is propagated (absent is taken as SGP4); SGP, SGP4-XP and others answer 422 omm-unsupported. EPOCH is UTC; MEAN_MOTION in rev/day, angles in deg, BSTAR in 1/earth radii')
  .meta({ id: 'OrbitMeanElementsMessage' });

/** Where a search's propagation stopped inside its window (the sgp4 model's errors): the answer covers the window up to there. */
export const PropagationStopped = z.object({
  epoch: EpochOut.describe('The first epoch (to 1 ms) where the propagation failed'),
  code: z.string().describe('The problem code the failure has elsewhere (sgp4-failed)'),
  reason: z.string().describe('What the method reported, with the epoch'),
}).describe('Present only when the propagation stopped inside the window: what was found lies before `epoch`')
  .meta({ id: 'PropagationStopped' });
