// Track as a CCSDS Orbit Ephemeris Message in KVN (CCSDS 502.0-B-3, Orbit Data Messages, sec. 5
// for the OEM and the KVN syntax rules; section numbers from memory): a header, one metadata block
// and one ephemeris data line per sample, "epoch x y z x_dot y_dot z_dot" in km and km/s.
//
// Conventions chosen here:
// - TIME_SYSTEM = UTC; epochs as YYYY-MM-DDThh:mm:ss.ffffff (the microsecond) without a zone letter (the time system is
//   stated in the metadata); START_TIME and STOP_TIME are the first and last data epochs as printed.
// - CREATION_DATE comes from the caller (meta.creationEpochTT), never the clock, so equal inputs
//   give equal bytes.
// - Data lines must be in increasing time order: a table whose epochs do not strictly increase
//   throws a RangeError naming the first offending sample (the caller sorts before formatting).
// - Lines end with LF; fixed-point numbers, by default 6 decimals for km and 9 for km/s.

import { EPOCH_FRACTION_DIGITS, utcFormatter } from '../solver/time/time.js';
import { AsciiWriter } from './ascii-writer.js';
import { checkDigits, firstNonIncreasing, sampleCount, type TrackTable } from './track-table.js';

export const OEM_VERSION = '3.0';
export const OEM_MEDIA_TYPE = 'text/plain; charset=utf-8';

export interface OemMeta {
  /** CREATION_DATE, TT seconds since J2000 (the scenario's own creation time, for deterministic output). */
  readonly creationEpochTT: number;
  readonly originator: string;
  readonly objectName: string;
  readonly objectId: string;
  /** Origin of the frame, e.g. EARTH. */
  readonly centerName: string;
  /** GCRF for the service's inertial frame (ITRF for Earth-fixed tracks). */
  readonly refFrame: string;
  /** Optional MESSAGE_ID of the header. */
  readonly messageId?: string;
  /** COMMENT lines written at the top of the header, after the version line. */
  readonly comments?: readonly string[];
  /** Optional INTERPOLATION and INTERPOLATION_DEGREE hints for readers. */
  readonly interpolation?: { readonly method: string; readonly degree: number };
  /** Fractional-second digits of all epochs, 0-9 (default 6, the microsecond). */
  readonly epochDigits?: number;
  /** Decimals of km (default 6) and of km/s (default 9). */
  readonly positionDecimals?: number;
  readonly velocityDecimals?: number;
  /** A chunk is yielded once it reaches this many characters (default 65536). */
  readonly chunkChars?: number;
}

/** Longest KVN line the standard allows (from memory). */
const MAX_LINE = 254;

/** CCSDS ASCII time code A: the ISO form without the trailing Z. */
const oemEpochFormatter = (digits: number): ((tt: number) => string) => {
  const iso = utcFormatter(digits);
  return (tt) => iso(tt).slice(0, -1);
};

function keyValue(key: string, value: string): string {
  if (value.length === 0 || !/^[\x20-\x7e]+$/.test(value) || value.trim() !== value) {
    throw new RangeError(`OEM ${key} must be a non-empty single line without surrounding blanks, got ${JSON.stringify(value)}`);
  }
  const line = `${key.padEnd(20)} = ${value}`;
  if (line.length > MAX_LINE) throw new RangeError(`OEM ${key} line is longer than ${MAX_LINE} characters`);
  return line + '\n';
}

function comment(text: string): string {
  if (/[\r\n]/.test(text) || text.length + 8 > MAX_LINE) throw new RangeError(`OEM comment must be one line of at most ${MAX_LINE - 8} characters`);
  return `COMMENT ${text}\n`;
}

/** The table as an OEM (KVN) in chunks of about meta.chunkChars characters. */
export function* oemChunks(table: TrackTable, meta: OemMeta): Generator<Buffer> {
  const n = sampleCount(table);
  if (n === 0) throw new RangeError('an OEM needs at least one ephemeris data line');
  const bad = firstNonIncreasing(table.epochsTT);
  if (bad >= 0) throw new RangeError(`OEM data lines must be in increasing time order: epoch ${bad} is not after epoch ${bad - 1}`);
  const digits = meta.epochDigits ?? EPOCH_FRACTION_DIGITS;
  const pd = meta.positionDecimals ?? 6;
  const vd = meta.velocityDecimals ?? 9;
  const chunkChars = meta.chunkChars ?? 65_536;
  checkDigits('epochDigits', digits, 9);
  checkDigits('positionDecimals', pd, 20);
  checkDigits('velocityDecimals', vd, 20);
  const { epochsTT, states } = table;
  const oemEpoch = oemEpochFormatter(digits);

  let chunk = keyValue('CCSDS_OEM_VERS', OEM_VERSION);
  for (const text of meta.comments ?? []) chunk += comment(text);
  chunk += keyValue('CREATION_DATE', oemEpoch(meta.creationEpochTT));
  chunk += keyValue('ORIGINATOR', meta.originator);
  if (meta.messageId !== undefined) chunk += keyValue('MESSAGE_ID', meta.messageId);
  chunk += '\nMETA_START\n';
  chunk += keyValue('OBJECT_NAME', meta.objectName);
  chunk += keyValue('OBJECT_ID', meta.objectId);
  chunk += keyValue('CENTER_NAME', meta.centerName);
  chunk += keyValue('REF_FRAME', meta.refFrame);
  chunk += keyValue('TIME_SYSTEM', 'UTC');
  chunk += keyValue('START_TIME', oemEpoch(epochsTT[0]!));
  chunk += keyValue('STOP_TIME', oemEpoch(epochsTT[n - 1]!));
  if (meta.interpolation) {
    checkDigits('interpolation degree', meta.interpolation.degree, 99);
    chunk += keyValue('INTERPOLATION', meta.interpolation.method);
    chunk += keyValue('INTERPOLATION_DEGREE', String(meta.interpolation.degree));
  }
  chunk += 'META_STOP\n\n';
  yield Buffer.from(chunk, 'latin1');

  const out = new AsciiWriter(digits, chunkChars);
  const decimals = [pd, pd, pd, vd, vd, vd];
  for (let i = 0; i < n; i++) {
    out.utc(epochsTT[i]!, false);
    // Each number after a space; the writer reads them from the table (no number boxed a sample).
    out.fixedRun(states, 6 * i, 6, decimals, 32, true);
    out.char(10);
    if (out.full) yield out.take();
  }
  if (out.size > 0) yield out.take();
}
