// Diagnostics of the search answers (passes, eclipses): present only when there is something to say,
// so answers of other scenarios keep their bytes.
import { z } from 'zod';
import { InterpolationDiagnostics } from './ephemeris.js';

export const EarthOrientationDiagnostics = z.object({
  source: z.literal('EOP_FILE').describe('The IERS finals2000A table of the service (EOP_FILE)'),
  tableDigest: z.string().describe('SHA-256 of the table\'s rows: part of the scenario hash, so an answer of another table is never served'),
  firstDate: z.string().describe('First day of the table (UTC date)'),
  lastObservedDate: z.string().nullable().describe('Last day whose polar motion and UT1-UTC are observed (IERS flag I); later rows are predictions'),
  lastPredictedDate: z.string().describe('Last day of the table'),
  ut1MinusUtc: z.enum(['request', 'table']).describe('Where UT1-UTC came from: the request\'s ut1MinusUtc, or the table'),
  predicted: z.boolean().describe('Some epoch of the answer used predicted rows'),
  outsideTable: z.boolean().describe('Some epoch of the answer lies outside the table: there polar motion, dX, dY (and UT1-UTC unless given) are 0'),
  warning: z.string().optional().describe('With outsideTable: which epochs, and what was taken there'),
}).describe('With EOP_FILE set, on answers whose computation used the Earth orientation: the table used').meta({ id: 'EarthOrientationDiagnostics' });
export type EarthOrientationDiagnostics = z.infer<typeof EarthOrientationDiagnostics>;

export const SearchDiagnostics = z.object({
  earthOrientation: EarthOrientationDiagnostics.optional(),
  interpolation: InterpolationDiagnostics.optional().describe('Model ephemeris only: how each segment was interpolated and the largest position error estimate over the epochs the search evaluated'),
}).describe('What the answer rests on, when it is worth saying: the ephemeris interpolation, the EOP table (absent otherwise)').meta({ id: 'SearchDiagnostics' });
export type SearchDiagnostics = z.infer<typeof SearchDiagnostics>;
