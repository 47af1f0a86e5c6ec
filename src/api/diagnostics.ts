// The diagnostics of the search answers (passes, eclipses): the ephemeris model's interpolation.
// Absent when there is nothing to say, so other answers keep their bytes.
import type { InterpolationReport } from '../solver/propagation/ephemeris.js';
import type { EarthOrientationDiagnostics, SearchDiagnostics } from '../schemas/diagnostics.js';
import { interpolationDiagnostics } from './ephemeris.js';
import type { InitialState } from './orbit.js';

export function searchDiagnostics(found: { readonly interpolation?: InterpolationReport | undefined }, start: InitialState, earthOrientation?: EarthOrientationDiagnostics): { diagnostics?: SearchDiagnostics } {
  const d: SearchDiagnostics = {
    ...(earthOrientation ? { earthOrientation } : {}),
    ...(found.interpolation && start.ephemeris ? { interpolation: interpolationDiagnostics(found.interpolation, start.ephemeris.info) } : {}),
  };
  return Object.keys(d).length > 0 ? { diagnostics: d } : {};
}
