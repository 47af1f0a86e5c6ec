// The records (one per sample) of CSV and JSON tracks, from any sample to any other: the same
// bytes whoever writes them, so a long track can be written in two parts at once, the last
// records by the worker thread that computed the track (src/workers/jobs.ts, runTrackWithTail)
// while the main thread writes the first. Imports the two formatters only (the worker thread loads this module).
import { csvRecords } from './csv.js';
import { trackJsonRecords, type JsonField } from './track-json.js';

/** The records of a CSV or JSON track, as plain data a worker thread can take. */
export type RecordsSpec =
  | { readonly format: 'csv'; readonly decimals: readonly number[] }
  | { readonly format: 'json'; readonly fields: readonly JsonField[] };

/** Records from..to-1 of a CSV or JSON track; afterFirst: they follow records written elsewhere (JSON: a comma before the first); in chunks of about chunkBytes. */
export function trackRecords(spec: RecordsSpec, epochsTT: Float64Array, values: Float64Array, from: number, to: number, afterFirst = false, chunkBytes = 65_536): Generator<Buffer> {
  return spec.format === 'csv'
    ? csvRecords(epochsTT, values, spec.decimals, from, to, { chunkChars: chunkBytes })
    : trackJsonRecords(epochsTT, values, spec.fields, from, to, chunkBytes, afterFirst);
}

/**
 * Room enough, in practice, for `count` records of `width` numbers (an epoch and its separators,
 * up to 24 bytes a number with its key or separator: a track's numbers print in 11 to 14): the
 * records then fit in one buffer, written once, with no concatenation. Larger numbers only cost
 * a second buffer. Pages of the part left unwritten are never touched.
 */
export const recordsBytesBound = (count: number, width: number): number => count * (64 + 24 * width);
