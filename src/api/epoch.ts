// Epochs at the edge: the API's calendar text (UTC by default, or TAI, TT, GPS where a request
// names its timeSystem) <-> the solver's TT seconds since J2000.
//
// canonicalEpoch is the one spelling of an instant: UTC text ending in Z, rounded to the
// microsecond (the service's time resolution: answers print epochs to it), with the fraction's
// trailing zeros dropped (time-systems.ts epochAsUtc). Routes rewrite every input epoch to it
// (utcScenario) before the scenario is hashed, so the same instant in any time system and any
// spelling gives one scenario, one hash and one answer.
import { epochAsUtc, parseEpochIn, type TimeSystem } from '../solver/time/time-systems.js';
import { EPOCH_FRACTION_DIGITS, parseUtcIso } from '../solver/time/time.js';
import { roundToMicrosecond } from '../solver/core/math.js';
import type { SolverFailureCode } from '../solver/core/result.js';

/** Text already in the canonical spelling (a validated UTC epoch: no test of the date needed). */
const CANONICAL = /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}(?:\.\d{0,5}[1-9])?Z$/;

/** The canonical UTC spelling of a validated epoch given in `system`. */
export function canonicalEpoch(text: string, system: TimeSystem = 'UTC'): string {
  if (system === 'UTC' && CANONICAL.test(text)) return text;
  const utc = epochAsUtc(text, system, EPOCH_FRACTION_DIGITS);
  if (!utc.ok) throw new Error(`epoch "${text}" (${system}) passed the schema but does not convert: ${utc.message}`); // programmer error
  return utc.value;
}

/** Why `text` is not an epoch in `system` (code invalid-epoch or epoch-out-of-range, and the reason), or undefined when it is one (schemas use this). */
export function epochProblem(text: string, system: TimeSystem = 'UTC'): EpochProblem | undefined {
  const parsed = system === 'UTC' ? parseUtcIso(text) : parseEpochIn(text, system);
  if (!parsed.ok) return { code: epochCode(parsed.code), message: parsed.message };
  // The instant must also be writable as UTC within the supported years (a TT epoch on the last day of 2199...).
  if (system !== 'UTC') {
    const utc = epochAsUtc(text, system);
    if (!utc.ok) return { code: epochCode(utc.code), message: utc.message };
  }
  return undefined;
}

export interface EpochProblem {
  readonly code: 'invalid-epoch' | 'epoch-out-of-range';
  readonly message: string;
}

const epochCode = (code: SolverFailureCode): EpochProblem['code'] => (code === 'epoch-out-of-range' ? 'epoch-out-of-range' : 'invalid-epoch');

/** TT seconds since J2000 of an epoch the schema has already validated, on the microsecond (roundToMicrosecond). */
export function epochTT(text: string, system: TimeSystem = 'UTC'): number {
  const parsed = system === 'UTC' ? parseUtcIso(text) : parseEpochIn(text, system);
  if (!parsed.ok) throw new Error(`epoch "${text}" passed the schema but does not parse`); // programmer error
  return roundToMicrosecond(parsed.value);
}

interface WithEpochs {
  readonly timeSystem?: TimeSystem | undefined;
  readonly epoch?: string;
  readonly start?: string;
  readonly stop?: string;
  readonly times?: readonly string[];
}

/** An epoch-bearing object of a request with its epochs in canonical UTC and no timeSystem. */
export function utcEpochs<T extends WithEpochs>(part: T): Omit<T, 'timeSystem'> {
  const { timeSystem, ...rest } = part;
  const system = timeSystem ?? 'UTC';
  const out: Record<string, unknown> = { ...rest };
  for (const key of ['epoch', 'start', 'stop'] as const) {
    const v = part[key];
    if (typeof v === 'string') out[key] = canonicalEpoch(v, system);
  }
  if (part.times) out.times = part.times.map((t) => canonicalEpoch(t, system));
  return out as Omit<T, 'timeSystem'>;
}

type Part = WithEpochs | undefined;
interface EpochBearing {
  readonly state?: Part;
  readonly elements?: Part;
  readonly grid?: Part;
  readonly window?: Part;
}

/** The parts of a request rewritten in canonical UTC: state, elements, grid and window (each with its own timeSystem), and the UTC epochs ageAt and creationDate. */
export function utcScenario<T extends EpochBearing>(req: T): T {
  const out: Record<string, unknown> = { ...(req as object) };
  for (const key of ['ageAt', 'creationDate'] as const) {
    const v = (req as Record<string, unknown>)[key];
    if (typeof v === 'string') out[key] = canonicalEpoch(v);
  }
  for (const key of ['state', 'elements', 'grid', 'window'] as const) {
    const part = req[key];
    if (part !== undefined) out[key] = utcEpochs(part);
  }
  return out as T;
}
