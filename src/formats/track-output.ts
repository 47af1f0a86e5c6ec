// The choice (format, frame) -> a track product: which coordinates a format needs, the sample
// order it needs, and the formatter with its columns. Routes call this and nothing else to format.
import { assertFinite, assertFiniteTable } from '../api/finite.js';
import { ProblemError } from '../errors.js';
import { csvHeader, CSV_MEDIA_TYPE, stateCsvColumns, type CsvColumn } from './csv.js';
import { GEOJSON_MEDIA_TYPE, groundTrackGeoJson } from './geojson.js';
import { groundTrackSvg, SVG_MEDIA_TYPE } from './svg/index.js';
import { formatUtcIso } from '../solver/time/time.js';
import { oemChunks, OEM_MEDIA_TYPE } from './oem.js';
import type { Product } from './product.js';
import { JSON_MEDIA_TYPE, STATE_COLUMNS, STATE_FIELDS, TRACK_JSON_END, trackJsonHead } from './track-json.js';
import { assertPrintable, firstUnprintable } from './track-table.js';
import { trackRecords, type RecordsSpec } from './track-records.js';
import type { TrackTail } from '../workers/jobs.js';
import type { ChunkPool } from './chunk-pool.js';

export const TRACK_FORMATS = [
  ['json', 'application/json'],
  ['csv', 'text/csv'],
  ['oem', 'text/plain'],
  ['geojson', 'application/geo+json'],
  ['svg', 'image/svg+xml'],
] as const;
export type TrackFormat = (typeof TRACK_FORMATS)[number][0];
export const TRACK_FRAMES = ['gcrf', 'itrf', 'geodetic', 'teme'] as const;
export type TrackFrame = (typeof TRACK_FRAMES)[number];

/** What the states must be converted to before formatting. */
export interface TrackNeeds {
  /** Earth-fixed (ITRF) states: frame itrf or geodetic, or a ground track (GeoJSON, SVG map). */
  readonly earthFixed: boolean;
  /** WGS-84 latitude, longitude, height: frame geodetic, or a ground track (GeoJSON, SVG map). */
  readonly geodetic: boolean;
  /** TEME states (frame teme). */
  readonly teme: boolean;
}

/** Formats that carry the ground track (latitude, longitude) whatever the frame. */
const isGroundTrack = (format: TrackFormat): boolean => format === 'geojson' || format === 'svg';

/** The conversions a (format, frame) needs; refuses the combinations no format can carry. */
export function trackNeeds(format: TrackFormat, frame: TrackFrame, builtInEarth: boolean): TrackNeeds {
  const ground = isGroundTrack(format);
  const needs = { earthFixed: frame === 'itrf' || frame === 'geodetic' || ground, geodetic: frame === 'geodetic' || ground, teme: frame === 'teme' };
  if (needs.teme && !builtInEarth) throw new ProblemError('unsupported-frame', 'frame teme (true equator, mean equinox of the Earth) needs the built-in centralBody "earth"');
  if (needs.earthFixed && !builtInEarth) {
    throw new ProblemError('unsupported-frame', `frame ${frame}${ground ? ` and ${format === 'svg' ? 'the SVG map' : 'GeoJSON'}` : ''} need the built-in centralBody "earth"`);
  }
  if (format === 'oem' && frame === 'geodetic') {
    throw new ProblemError('unsupported-frame', 'an OEM carries Cartesian states: choose frame gcrf, itrf or teme');
  }
  return needs;
}

/** The sample epochs a format can carry: an OEM needs strictly increasing epochs (sorted, repeats dropped). */
export function epochsForFormat(format: TrackFormat, epochsTT: Float64Array): Float64Array {
  if (format !== 'oem') return epochsTT;
  const sorted = Float64Array.from(epochsTT).sort();
  let n = 0;
  for (let i = 0; i < sorted.length; i++) if (i === 0 || sorted[i]! > sorted[n - 1]!) sorted[n++] = sorted[i]!;
  return sorted.subarray(0, n);
}

const GEODETIC_COLUMNS = ['latitude', 'longitude', 'height'] as const;
const GEODETIC_CSV = [
  { header: 'latitude_deg', decimals: 7 },
  { header: 'longitude_deg', decimals: 7 },
  { header: 'height_km', decimals: 6 },
];
const GEODETIC_FIELDS = [
  { key: 'latitude', from: 0, count: 1, decimals: 7 },
  { key: 'longitude', from: 1, count: 1, decimals: 7 },
  { key: 'height', from: 2, count: 1, decimals: 6 },
];

export interface TrackProductInput {
  readonly format: TrackFormat;
  readonly frame: TrackFrame;
  readonly epochsTT: Float64Array;
  /** Cartesian states in the output frame (gcrf, itrf or teme), 6 per sample. */
  readonly states: Float64Array;
  /** Latitude and longitude in degrees, height in km, 3 per sample, when the needs asked for them. */
  readonly geodeticDeg: Float64Array | null;
  /** The JSON answer's fields before its samples. */
  readonly head: Record<string, unknown>;
  readonly object: { readonly name: string; readonly id: string };
  /** OEM header and metadata that only the caller knows. */
  readonly oem: { readonly creationEpochTT: number; readonly centerName: string; readonly comments: readonly string[] };
}

/** Tracks of at least this many samples are written in two parts, the last records by a solver thread. */
export const SPLIT_MIN_SAMPLES = 20_000;
/** The share of the samples this thread writes (it also checks them and writes the answer to the socket). */
const MAIN_SHARE = 0.45;

const csvSpec = (columns: readonly CsvColumn[]): RecordsSpec => ({ format: 'csv', decimals: columns.map((c) => c.decimals) });
const STATE_CSV: readonly CsvColumn[] = stateCsvColumns();

/** The records of a CSV or JSON track in a frame (geodetic: latitude, longitude, height); null for the other formats. */
function recordsSpec(format: TrackFormat, frame: TrackFrame): RecordsSpec | null {
  if (format === 'csv') return csvSpec(frame === 'geodetic' ? GEODETIC_CSV : STATE_CSV);
  if (format === 'json') return { format: 'json', fields: frame === 'geodetic' ? GEODETIC_FIELDS : STATE_FIELDS };
  return null;
}

/** The last records (from..n-1) of a long CSV or JSON track of n samples, which a solver thread can write; null when the track is written in one piece. */
export function trackTail(format: TrackFormat, frame: TrackFrame, n: number): TrackTail | null {
  const spec = recordsSpec(format, frame);
  if (spec === null || n < SPLIT_MIN_SAMPLES) return null;
  return { spec, from: Math.floor(n * MAIN_SHARE), geodetic: frame === 'geodetic' };
}

/**
 * The last records of one computed track, written by a solver thread (`bytes`), shared by every
 * answer formatted from the track; `arena`, when the thread wrote them into the main thread's
 * shared memory, goes back to `arenas` once every answer that took the bytes has been delivered
 * (finished on a socket) and the thread ended normally. From then on an answer that asks gets
 * null and writes the records itself; an answer not delivered, or a thread that failed (it may
 * still be writing), keeps the arena out of the pool for good. When the track's grid or states are
 * in the arena too (holds), no answer may be made from them once it has gone back: take() then
 * throws instead (a programmer error: every answer of one computation takes its bytes before any
 * of them can finish, src/plugins/answers.ts).
 */
export class TailBytes {
  #users = 0;
  #open = true;
  #spoilt = false;
  #arraysHere = false;

  constructor(readonly bytes: Promise<readonly Buffer[]>, readonly arena: Buffer | null = null, readonly arenas: ChunkPool | null = null) {
    bytes.catch(() => { this.#spoilt = true; });
  }

  /**
   * The track's arrays (its grid, its states) that are in shared memory are in the arena (the only
   * shared memory a track job is lent: the route wrote the grid there, the thread the states), and
   * go back with it.
   */
  holds(...arrays: readonly Float64Array[]): void {
    if (arrays.some((a) => a.buffer instanceof SharedArrayBuffer)) this.#arraysHere = true;
  }

  /** The bytes for one more answer, or null once the arena has gone back. */
  take(): Promise<readonly Buffer[]> | null {
    if (!this.#open) {
      if (this.#arraysHere) throw new Error('the track\'s grid or states were in an arena given back: no answer can be made from them');
      return null;
    }
    this.#users++;
    return this.bytes;
  }

  /** An answer that took the bytes has ended: delivered, or not (cut short, an error, no socket). */
  settled(delivered: boolean): void {
    if (!delivered) this.#spoilt = true;
    if (--this.#users > 0 || !this.#open) return;
    this.#open = false;
    if (!this.#spoilt && this.arena && this.arenas) this.arenas.release([this.arena]);
  }
}

/** Header, records and closing of a CSV or JSON track: the last records from `tail` when the track is long and they are given (if they fail, written here). */
function splitChunks(head: Buffer, t: TrackProductInput, values: Float64Array, end: Buffer | null, tail: TailBytes | undefined): Pick<Product, 'chunks' | 'settled'> {
  const n = t.epochsTT.length;
  const spec = recordsSpec(t.format, t.frame)!;
  const plan = trackTail(t.format, t.frame, n);
  const bytes = plan ? tail?.take() ?? null : null;
  if (!bytes || !plan) {
    return {
      chunks: (function* () {
        yield head;
        yield* trackRecords(spec, t.epochsTT, values, 0, n);
        if (end) yield end;
      })(),
    };
  }
  const rest = bytes.catch(() => [...trackRecords(spec, t.epochsTT, values, plan.from, n)]);
  return {
    chunks: (async function* () {
      yield head;
      yield* trackRecords(spec, t.epochsTT, values, 0, plan.from);
      yield* await rest;
      if (end) yield end;
    })(),
    settled: (delivered) => tail!.settled(delivered),
  };
}

/**
 * The track in its format; refuses (422) states that cannot be printed before anything is
 * streamed. A long CSV or JSON track takes its last records (trackTail's) from `tail` when given
 * (and it still has them): the same bytes as written here.
 */
export function trackProduct(t: TrackProductInput, tail?: TailBytes): Product {
  assertFinite(t.head);
  const geodetic = t.frame === 'geodetic' || isGroundTrack(t.format);
  // The numbers printed, checked before anything streams (a formatter that throws mid-answer can only cut it short).
  if (geodetic) {
    if (t.geodeticDeg === null) throw new Error('a geodetic track product needs geodetic coordinates'); // programmer error
    assertFiniteTable(t.geodeticDeg, GEODETIC_COLUMNS);
    assertPrintable(t.states);
  } else if (firstUnprintable(t.states) >= 0) {
    // One pass when the states pass (a printable number is finite); else the refusal in its order.
    assertFiniteTable(t.states, STATE_COLUMNS);
    assertPrintable(t.states);
  }
  if (geodetic) {
    const g = t.geodeticDeg!;
    if (isGroundTrack(t.format)) {
      const samples = Array.from(t.epochsTT, (tt, i) => ({ tt, latitudeDeg: g[3 * i]!, longitudeDeg: g[3 * i + 1]!, heightKm: g[3 * i + 2]! }));
      if (t.format === 'geojson') return { contentType: GEOJSON_MEDIA_TYPE, chunks: groundTrackGeoJson(samples, { name: t.object.name, includeHeight: true }) };
      const label = (tt: number): string => `${formatUtcIso(tt).slice(0, 16).replace('T', ' ')}Z`;
      const n = t.epochsTT.length;
      return { contentType: SVG_MEDIA_TYPE, chunks: [groundTrackSvg(samples, { name: t.object.name, startLabel: label(t.epochsTT[0]!), endLabel: label(t.epochsTT[n - 1]!) })] };
    }
    if (t.format === 'csv') return { contentType: CSV_MEDIA_TYPE, ...splitChunks(csvHeader(GEODETIC_CSV), t, g, null, tail) };
    return { contentType: JSON_MEDIA_TYPE, ...splitChunks(trackJsonHead(t.head), t, g, TRACK_JSON_END, tail) };
  }
  const table = { epochsTT: t.epochsTT, states: t.states };
  if (t.format === 'csv') return { contentType: CSV_MEDIA_TYPE, ...splitChunks(csvHeader(STATE_CSV), t, t.states, null, tail) };
  if (t.format === 'oem') {
    return {
      contentType: OEM_MEDIA_TYPE,
      chunks: oemChunks(table, {
        creationEpochTT: t.oem.creationEpochTT,
        originator: 'apsides',
        objectName: t.object.name,
        objectId: t.object.id,
        centerName: t.oem.centerName,
        refFrame: t.frame === 'itrf' ? 'ITRF' : t.frame === 'teme' ? 'TEME' : 'GCRF',
        comments: t.oem.comments,
      }),
    };
  }
  return { contentType: JSON_MEDIA_TYPE, ...splitChunks(trackJsonHead(t.head), t, t.states, TRACK_JSON_END, tail) };
}
