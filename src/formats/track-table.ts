// A propagated track as the formatters read it: epochs and Cartesian states in flat typed arrays
// (no per-sample objects). Structurally the same as StateTable in src/solver/conic/two-body.ts.
import { ProblemError } from '../errors.js';

/** epochsTT[i]: TT seconds since J2000.0; states[6i..6i+5]: x, y, z (km), vx, vy, vz (km/s). */
export interface TrackTable {
  readonly epochsTT: Float64Array;
  readonly states: Float64Array;
}

export interface TrackColumn {
  /** Name of the component: x, y, z, vx, vy, vz. */
  readonly name: string;
  readonly unit: 'km' | 'km/s';
}

/** The six numbers of each sample, in order. */
export const STATE_COLUMNS: readonly TrackColumn[] = [
  { name: 'x', unit: 'km' },
  { name: 'y', unit: 'km' },
  { name: 'z', unit: 'km' },
  { name: 'vx', unit: 'km/s' },
  { name: 'vy', unit: 'km/s' },
  { name: 'vz', unit: 'km/s' },
];

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
const SCALES = Array.from({ length: 21 }, (_, i) => 10 ** i);

/**
 * A number in fixed notation with `decimals` digits; a value that rounds to zero prints without a
 * minus sign ("0.000000", not "-0.000000"). Non-finite values and |value| >= 1e21 throw.
 * Integer arithmetic while |value| * 10^decimals < 9e15 (exact in a double) and not within 1e-6 of
 * a rounding tie; toFixed (exact decimal rounding) otherwise. Same text as toFixed.
 */
export function fixed(value: number, decimals: number): string {
  const scale = SCALES[decimals]!;
  const magnitude = Math.abs(value) * scale;
  // Near a tie the product magnitude may have rounded across it: let toFixed decide from the exact value.
  if (magnitude < 9e15 && Math.abs(magnitude - Math.floor(magnitude) - 0.5) > 1e-6) {
    const scaled = Math.round(magnitude);
    if (decimals === 0) return (value < 0 && scaled !== 0 ? '-' : '') + scaled;
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
