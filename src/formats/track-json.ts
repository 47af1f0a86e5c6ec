// Track as JSON, streamed: the answer's head fields, then "samples": one object per sample,
// {"epoch", "position", "velocity"}, numbers fixed-point like the CSV (6 decimals km, 9 km/s).
import { utcFormatter } from '../solver/time.js';
import { fixed, sampleCount, type TrackTable } from './track-table.js';

export const JSON_MEDIA_TYPE = 'application/json; charset=utf-8';

export interface TrackJsonOptions {
  readonly positionDecimals?: number;
  readonly velocityDecimals?: number;
  readonly chunkChars?: number;
}

/** `head` is a plain JSON object (its keys come first); the samples array is appended as its last key. */
export function* trackJsonChunks(head: Record<string, unknown>, table: TrackTable, opts: TrackJsonOptions = {}): Generator<string> {
  const n = sampleCount(table);
  const pd = opts.positionDecimals ?? 6;
  const vd = opts.velocityDecimals ?? 9;
  const chunkChars = opts.chunkChars ?? 65_536;
  const opening = JSON.stringify(head);
  let chunk = `${opening.slice(0, -1)}${opening.length > 2 ? ',' : ''}"samples":[`;
  const { epochsTT, states } = table;
  const epochText = utcFormatter(3);
  for (let i = 0; i < n; i++) {
    const o = 6 * i;
    chunk += (i === 0 ? '' : ',') +
      '{"epoch":"' + epochText(epochsTT[i]!) +
      '","position":[' + fixed(states[o]!, pd) + ',' + fixed(states[o + 1]!, pd) + ',' + fixed(states[o + 2]!, pd) +
      '],"velocity":[' + fixed(states[o + 3]!, vd) + ',' + fixed(states[o + 4]!, vd) + ',' + fixed(states[o + 5]!, vd) + ']}';
    if (chunk.length >= chunkChars) {
      yield chunk;
      chunk = '';
    }
  }
  yield chunk + ']}';
}
