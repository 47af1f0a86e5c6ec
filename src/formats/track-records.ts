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

/** Records from..to-1 of a CSV or JSON track; afterFirst: they follow records written elsewhere (JSON: a comma before the first); in chunks of about chunkBytes, the first in `first` when given. */
export function trackRecords(spec: RecordsSpec, epochsTT: Float64Array, values: Float64Array, from: number, to: number, afterFirst = false, chunkBytes = 65_536, first?: Buffer): Generator<Buffer> {
  return spec.format === 'csv'
    ? csvRecords(epochsTT, values, spec.decimals, from, to, { chunkChars: chunkBytes, ...(first ? { first } : {}) })
    : trackJsonRecords(epochsTT, values, spec.fields, from, to, chunkBytes, afterFirst, first);
}

/** Room for the one record recordsBytesEstimate writes to measure it (a longer record grows the chunk). */
const PROBE_BYTES = 2048;

/**
 * Room for records from..to-1 in one buffer, in practice: the first record's length, plus two
 * bytes a number (a sign, one more whole digit) for each record, plus the writer's margin. Larger
 * records only cost a second buffer; pages left unwritten are never touched.
 */
export function recordsBytesEstimate(spec: RecordsSpec, epochsTT: Float64Array, values: Float64Array, from: number, to: number): number {
  if (to <= from) return 1024;
  // The probe in a small chunk (Buffer's shared pool): not one of OUTPUT_CHUNKS, which it would never give back.
  const first = [...trackRecords(spec, epochsTT, values, from, from + 1, true, PROBE_BYTES)].reduce((n, c) => n + c.length, 0);
  const width = values.length / epochsTT.length;
  return (to - from) * (first + 2 * width) + 2048;
}
