// Every number an answer carries must be finite: JSON prints NaN and Infinity as null, and the
// fixed-point writers of CSV, OEM and GeoJSON cannot print them at all. One check, run on every
// answer (its JSON value, or the sample tables of a streamed product) before anything is sent.
import { ProblemError } from '../errors.js';

/** The path of the first non-finite number in a JSON-bound value (dotted like the request paths of validation problems, e.g. `answer.passes.0.pointing.3.dopplerShift`), or null. */
export function firstNonFinite(value: unknown, path = 'answer'): string | null {
  if (typeof value === 'number') return Number.isFinite(value) ? null : path;
  if (ArrayBuffer.isView(value) && !(value instanceof DataView)) {
    const numbers = value as unknown as ArrayLike<number | bigint>;
    for (let i = 0; i < numbers.length; i++) {
      const x = numbers[i]!;
      if (typeof x === 'number' && !Number.isFinite(x)) return `${path}.${i}`;
    }
    return null;
  }
  if (Array.isArray(value)) {
    for (let i = 0; i < value.length; i++) {
      const hit = firstNonFinite(value[i], `${path}.${i}`);
      if (hit !== null) return hit;
    }
    return null;
  }
  if (value !== null && typeof value === 'object') {
    for (const [k, v] of Object.entries(value)) {
      const hit = firstNonFinite(v, `${path}.${k}`);
      if (hit !== null) return hit;
    }
  }
  return null;
}

/** The coded 422 for a non-finite number at `path` of the answer. */
export function nonFiniteProblem(path: string): ProblemError {
  return new ProblemError('non-finite-result',
    `${path} is not a finite number: the scenario overflows (or underflows) double-precision arithmetic; bring its numbers into a physical range`,
    { errors: [{ path, message: 'not a finite number' }] });
}

/** Refuses (422 non-finite-result, naming the field) a JSON-bound value holding NaN or an infinity. */
export function assertFinite(value: unknown, path = 'answer'): void {
  const bad = firstNonFinite(value, path);
  if (bad !== null) throw nonFiniteProblem(bad);
}

/**
 * Refuses (422 non-finite-result) a sample table with a non-finite number: `values` holds
 * `columns.length` numbers per sample; the problem names `${path}.<sample>.<column>`.
 */
export function assertFiniteTable(values: Float64Array, columns: readonly string[], path = 'answer.samples'): void {
  for (let i = 0; i < values.length; i++) {
    if (!Number.isFinite(values[i]!)) {
      const k = columns.length;
      throw nonFiniteProblem(`${path}.${Math.floor(i / k)}.${columns[i % k]}`);
    }
  }
}
