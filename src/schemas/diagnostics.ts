// Diagnostics of the search answers (passes, eclipses): present only when there is something to say,
// so answers of other scenarios keep their bytes.
import { z } from 'zod';
import { InterpolationDiagnostics } from './ephemeris.js';

export const SearchDiagnostics = z.object({
  interpolation: InterpolationDiagnostics.optional().describe('Model ephemeris only: how each segment was interpolated and the largest position error estimate over the epochs the search evaluated'),
}).describe('What the answer rests on, when it is worth saying (absent otherwise)').meta({ id: 'SearchDiagnostics' });
export type SearchDiagnostics = z.infer<typeof SearchDiagnostics>;
