// Track as CSV per RFC 4180: a header row naming each column with its unit, one record per
// sample, CRLF after every record (the last included), no quoting needed (no field holds a comma,
// quote or line break). Epochs are ISO 8601 UTC; numbers are fixed-point: by default 6 decimals
// for km (1 mm) and 9 for km/s (1 micrometre/s), epochs to the microsecond.

import { EPOCH_FRACTION_DIGITS } from '../solver/time/time.js';
import { AsciiWriter } from './ascii-writer.js';
import { checkDigits, sampleCount, type TrackTable } from './track-table.js';

export const CSV_HEADER = 'epoch_utc,x_km,y_km,z_km,vx_km_s,vy_km_s,vz_km_s';
/** Media type to answer with (RFC 4180 sec. 3, with the optional header parameter). */
export const CSV_MEDIA_TYPE = 'text/csv; charset=utf-8; header=present';

export interface CsvOptions {
  /** Fractional-second digits of the epochs, 0-9 (default 6, the microsecond). */
  readonly epochDigits?: number;
  /** Decimals of positions in km (default 6). */
  readonly positionDecimals?: number;
  /** Decimals of velocities in km/s (default 9). */
  readonly velocityDecimals?: number;
  /** A chunk is yielded once it reaches this many characters (default 65536; ASCII, so bytes). */
  readonly chunkChars?: number;
  /** Memory for the first chunk (its length is then the chunk size). */
  readonly first?: Buffer;
}

const CRLF = '\r\n';

/** A numeric column: its header name (with unit) and decimals. */
export interface CsvColumn {
  readonly header: string;
  readonly decimals: number;
}

/** The table as CSV text in chunks of about chunkChars characters; every number is formatted once. */
export function* csvChunks(table: TrackTable, opts: CsvOptions = {}): Generator<Buffer> {
  sampleCount(table);
  const pd = opts.positionDecimals ?? 6;
  const vd = opts.velocityDecimals ?? 9;
  checkDigits('positionDecimals', pd, 20);
  checkDigits('velocityDecimals', vd, 20);
  yield* columnCsvChunks(table.epochsTT, table.states, stateCsvColumns(pd, vd), opts);
}

/** The state columns of CSV_HEADER: positions with pd decimals (km), velocities with vd (km/s). */
export const stateCsvColumns = (pd = 6, vd = 9): CsvColumn[] => CSV_HEADER.split(',').slice(1).map((header, i) => ({ header, decimals: i < 3 ? pd : vd }));

/** Any table of numbers per epoch (values holds columns.length numbers per sample) as RFC 4180 CSV, in byte chunks. */
export function* columnCsvChunks(epochsTT: Float64Array, values: Float64Array, columns: readonly CsvColumn[], opts: Pick<CsvOptions, 'epochDigits' | 'chunkChars'> = {}): Generator<Buffer> {
  yield csvHeader(columns);
  yield* csvRecords(epochsTT, values, columns.map((c) => c.decimals), 0, epochsTT.length, opts);
}

/** The header row of a CSV table with these columns. */
export const csvHeader = (columns: readonly CsvColumn[]): Buffer => Buffer.from(['epoch_utc', ...columns.map((c) => c.header)].join(',') + CRLF, 'latin1');

/**
 * The records of samples from..to-1 (values holds decimals.length numbers per sample): the same
 * bytes whoever writes them, so a long table can be written in parts (src/formats/track-output.ts).
 */
export function* csvRecords(epochsTT: Float64Array, values: Float64Array, decimals: readonly number[], from: number, to: number, opts: Pick<CsvOptions, 'epochDigits' | 'chunkChars' | 'first'> = {}): Generator<Buffer> {
  const width = decimals.length;
  const n = epochsTT.length;
  if (values.length !== width * n) throw new RangeError(`table holds ${values.length} numbers for ${n} epochs of ${width} columns`);
  if (!(0 <= from && from <= to && to <= n)) throw new RangeError(`records ${from}..${to} of ${n}`);
  const epochDigits = opts.epochDigits ?? EPOCH_FRACTION_DIGITS;
  checkDigits('epochDigits', epochDigits, 9);
  const out = new AsciiWriter(epochDigits, opts.chunkChars ?? 65_536, opts.first);
  for (let i = from; i < to; i++) {
    out.utc(epochsTT[i]!).fixedRun(values, width * i, width, decimals, 44, true);
    out.char(13).char(10);
    if (out.full) yield out.take();
  }
  if (out.size > 0) yield out.take();
}
