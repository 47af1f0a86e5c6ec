// Epochs at the edge: the API's ISO 8601 UTC text <-> the solver's TT seconds since J2000.
import { parseUtcIso } from '../solver/time/time.js';

/** TT seconds since J2000 of an epoch the Epoch schema has already validated. */
export function epochTT(iso: string): number {
  const parsed = parseUtcIso(iso);
  if (!parsed.ok) throw new Error(`epoch "${iso}" passed the schema but does not parse`); // programmer error
  return parsed.value;
}
