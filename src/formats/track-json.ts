// Track as JSON, streamed: the answer's head fields, then "samples": one object per sample,
// e.g. {"epoch", "position", "velocity"}; numbers fixed-point like the CSV (6 decimals km, 9 km/s).
import { AsciiWriter } from './ascii-writer.js';

export const JSON_MEDIA_TYPE = 'application/json; charset=utf-8';

/** One key of a sample object: `count` numbers from column `from` (an array when count > 1). */
export interface JsonField {
  readonly key: string;
  readonly from: number;
  readonly count: number;
  readonly decimals: number;
}

/** The JSON name of each state column, as a non-finite problem names it. */
export const STATE_COLUMNS = ['position.0', 'position.1', 'position.2', 'velocity.0', 'velocity.1', 'velocity.2'] as const;

export const STATE_FIELDS: readonly JsonField[] = [
  { key: 'position', from: 0, count: 3, decimals: 6 },
  { key: 'velocity', from: 3, count: 3, decimals: 9 },
];

/** `head` is a plain JSON object (its keys come first); the samples array is appended as its last key. values holds `width` numbers per epoch. */
export function* trackJsonChunks(head: Record<string, unknown>, epochsTT: Float64Array, values: Float64Array, fields: readonly JsonField[], chunkBytes = 65_536): Generator<Buffer> {
  yield trackJsonHead(head);
  yield* trackJsonRecords(epochsTT, values, fields, 0, epochsTT.length, chunkBytes);
  yield TRACK_JSON_END;
}

/** The answer's opening: the head's fields and the opening of "samples". */
export function trackJsonHead(head: Record<string, unknown>): Buffer {
  // The head may hold non-ASCII text (object names): UTF-8 bytes, outside the ASCII writer.
  const opening = JSON.stringify(head);
  return Buffer.from(`${opening.slice(0, -1)}${opening.length > 2 ? ',' : ''}"samples":[`, 'utf8');
}

/** The answer's closing, after the last sample. */
export const TRACK_JSON_END = Buffer.from(']}', 'latin1');

/** Numbers per sample the fields read. */
const fieldsWidth = (fields: readonly JsonField[]): number => fields.reduce((w, f) => Math.max(w, f.from + f.count), 0);

/**
 * The sample objects of samples from..to-1, each after a comma but the answer's first (sample 0,
 * unless afterFirst says these samples follow others written elsewhere): the same
 * bytes whoever writes them, so a long track can be written in parts (src/formats/track-output.ts).
 */
export function* trackJsonRecords(epochsTT: Float64Array, values: Float64Array, fields: readonly JsonField[], from: number, to: number, chunkBytes = 65_536, afterFirst = false, first?: Buffer): Generator<Buffer> {
  const width = fieldsWidth(fields);
  const n = epochsTT.length;
  if (values.length !== width * n) throw new RangeError(`table holds ${values.length} numbers for ${n} epochs of ${width} columns`);
  if (!(0 <= from && from <= to && to <= n)) throw new RangeError(`records ${from}..${to} of ${n}`);
  const out = new AsciiWriter(undefined, chunkBytes, first);
  const prefixes = fields.map((f) => Buffer.from(`,"${f.key}":${f.count > 1 ? '[' : ''}`, 'latin1'));
  const decimals = fields.map((f) => Array.from({ length: f.count }, () => f.decimals));
  const firstOpen = Buffer.from('{"epoch":"', 'latin1');
  const nextOpen = Buffer.from(',{"epoch":"', 'latin1');
  for (let i = from; i < to; i++) {
    const o = width * i;
    out.bytes(i === 0 && !afterFirst ? firstOpen : nextOpen).utc(epochsTT[i]!).char(34);
    for (let k = 0; k < fields.length; k++) {
      const f = fields[k]!;
      out.bytes(prefixes[k]!).fixedRun(values, o + f.from, f.count, decimals[k]!, 44, false);
      if (f.count > 1) out.char(93);
    }
    out.char(125);
    if (out.full) yield out.take();
  }
  if (out.size > 0) yield out.take();
}
