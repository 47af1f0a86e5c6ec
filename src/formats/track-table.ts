// A propagated track as the formatters read it: epochs and Cartesian states in flat typed arrays
// (no per-sample objects). Structurally the same as StateTable in src/solver/conic/two-body.ts.
import { ProblemError } from '../errors.js';

/** epochsTT[i]: TT seconds since J2000.0; states[6i..6i+5]: x, y, z (km), vx, vy, vz (km/s). */
export interface TrackTable {
  readonly epochsTT: Float64Array;
  readonly states: Float64Array;
}

/** Number of samples; throws when the states array does not hold exactly 6 numbers per epoch. */
export function sampleCount(table: TrackTable): number {
  const n = table.epochsTT.length;
  if (table.states.length !== 6 * n) {
    throw new RangeError(`track table holds ${table.states.length} state numbers for ${n} epochs (need ${6 * n})`);
  }
  return n;
}

/** Index of the first epoch not after its predecessor, or -1 when the epochs strictly increase. */
export function firstNonIncreasing(epochsTT: Float64Array): number {
  for (let i = 1; i < epochsTT.length; i++) if (!(epochsTT[i]! > epochsTT[i - 1]!)) return i;
  return -1;
}

const ZEROS = Array.from({ length: 21 }, (_, i) => '0'.repeat(i));
/** 10^0 .. 10^20. */
export const SCALES = Array.from({ length: 21 }, (_, i) => 10 ** i);

/**
 * |value| * 10^decimals rounded to an integer, when integer arithmetic gives the exact fixed-point
 * digits: the product is below 9e15 (exact in a double) and not within 1e-6 of a rounding tie
 * (where the product may have rounded across it). Otherwise -1: let toFixed decide from the exact value.
 */
export function scaledForFixed(value: number, decimals: number): number {
  const magnitude = Math.abs(value) * SCALES[decimals]!;
  return magnitude < 9e15 && Math.abs(magnitude - Math.floor(magnitude) - 0.5) > 1e-6 ? Math.round(magnitude) : -1;
}

/**
 * A number in fixed notation with `decimals` digits; a value that rounds to zero prints without a
 * minus sign ("0.000000", not "-0.000000"). Non-finite values and |value| >= 1e21 throw.
 * Integer arithmetic where scaledForFixed allows it, toFixed (exact decimal rounding) otherwise.
 * Same text as toFixed.
 */
export function fixed(value: number, decimals: number): string {
  const scaled = scaledForFixed(value, decimals);
  if (scaled >= 0) {
    if (decimals === 0) return (value < 0 && scaled !== 0 ? '-' : '') + scaled;
    const scale = SCALES[decimals]!;
    const whole = Math.floor(scaled / scale);
    const fraction = String(scaled - whole * scale);
    return (value < 0 && scaled !== 0 ? '-' : '') + whole + '.' + ZEROS[decimals - fraction.length] + fraction;
  }
  // toFixed switches to exponent notation from 1e21 on; no track number comes near that.
  if (!(Math.abs(value) < 1e21)) throw new RangeError(`cannot format ${value} as a fixed-point track number`);
  return value.toFixed(decimals);
}

/** Throws unless digits is an integer in [0, max] (an option of a formatter). */
export function checkDigits(name: string, digits: number, max: number): void {
  if (!(Number.isInteger(digits) && digits >= 0 && digits <= max)) throw new RangeError(`${name} must be an integer 0-${max}, got ${digits}`);
}

/** Magnitude from which fixed() refuses a number (toFixed would switch to exponent notation). */
export const PRINTABLE_LIMIT = 1e21;

/** Index of the first value that is not finite or not printable in fixed notation, or -1. Check before streaming: a formatter that throws mid-answer can only cut the answer short. */
export function firstUnprintable(values: Float64Array): number {
  for (let i = 0; i < values.length; i++) if (!(Math.abs(values[i]!) < PRINTABLE_LIMIT)) return i;
  return -1;
}

/** Refuses (422 limit-exceeded) a table with a value fixed notation cannot print; call before streaming. */
export function assertPrintable(values: Float64Array): void {
  const bad = firstUnprintable(values);
  if (bad >= 0) {
    throw new ProblemError('limit-exceeded', `sample ${Math.floor(bad / 6)} reaches ${values[bad]} km or km/s; tracks print values below ${PRINTABLE_LIMIT} in magnitude`);
  }
}
