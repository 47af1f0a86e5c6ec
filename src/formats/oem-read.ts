// Reading a CCSDS Orbit Ephemeris Message in KVN (CCSDS 502.0-B-3, Orbit Data Messages, sec. 5 for
// the OEM and sec. 7 for the KVN rules; section numbers from memory): the header, then one or more
// segments of a metadata block (META_START ... META_STOP), ephemeris data lines
// "epoch x y z x_dot y_dot z_dot [x_ddot y_ddot z_ddot]" in km, km/s (and km/s**2), and an optional
// covariance block (COVARIANCE_START ... COVARIANCE_STOP, skipped: the service does not use it).
//
// What is accepted (anything else is refused with the line number):
// - CCSDS_OEM_VERS 1.0, 2.0 or 3.0 as the first line; CREATION_DATE and ORIGINATOR in the header;
//   COMMENT lines where the standard allows them (header, start of metadata and data, covariance).
// - Per segment: OBJECT_NAME, OBJECT_ID, CENTER_NAME (EARTH only), REF_FRAME (GCRF, ICRF, EME2000,
//   ITRF or a named ITRF realisation such as ITRF2014, TEME), TIME_SYSTEM (UTC, TAI, TT, GPS),
//   START_TIME and STOP_TIME, optional USEABLE_START_TIME / USEABLE_STOP_TIME (within START..STOP),
//   INTERPOLATION (LAGRANGE, HERMITE, LINEAR = Lagrange of degree 1; default LAGRANGE) and
//   INTERPOLATION_DEGREE (1 to MAX_INTERPOLATION_DEGREE; default DEFAULT_DEGREE of the method).
//   REF_FRAME_EPOCH is ignored (none of the frames above needs it).
// - Data lines: an epoch in the segment's time system (calendar or day-of-year form) and 6 or 9
//   numbers; one segment's lines all have 6 or all have 9; epochs strictly increasing, within
//   START_TIME..STOP_TIME.
// Epochs are read to TT seconds since J2000; states stay in the file's frame (the caller converts).

import { parseEpochIn, TIME_SYSTEMS, type TimeSystem } from '../solver/time/time-systems.js';

export const OEM_FRAMES = ['GCRF', 'ICRF', 'EME2000', 'ITRF', 'TEME'] as const;
export type OemFrame = (typeof OEM_FRAMES)[number];
export const OEM_INTERPOLATIONS = ['LAGRANGE', 'HERMITE'] as const;
export type OemInterpolation = (typeof OEM_INTERPOLATIONS)[number];

/** Highest INTERPOLATION_DEGREE accepted (equally spaced nodes beyond it gain nothing and lose stability; common practice, no source). */
export const MAX_INTERPOLATION_DEGREE = 15;
/** Degree used when a segment names none (common practice, no source). */
export const DEFAULT_DEGREE: Readonly<Record<OemInterpolation, number>> = { LAGRANGE: 7, HERMITE: 5 };
/** Most data lines in one message, all segments together. */
export const MAX_OEM_DATA_LINES = 500_000;
/** Most segments in one message. */
export const MAX_OEM_SEGMENTS = 1000;
/** Slack allowed when comparing data epochs with START_TIME / STOP_TIME, s (printing rounds epochs). */
const BOUND_SLACK_S = 1e-6;

export interface OemSegmentMeta {
  readonly objectName: string;
  readonly objectId: string;
  readonly centerName: string;
  readonly refFrame: OemFrame;
  /** REF_FRAME as written (e.g. ITRF2014 for refFrame ITRF). */
  readonly refFrameText: string;
  readonly timeSystem: TimeSystem;
  readonly startTT: number;
  readonly stopTT: number;
  /** USEABLE_START_TIME / USEABLE_STOP_TIME, or START_TIME / STOP_TIME when absent. */
  readonly useableStartTT: number;
  readonly useableStopTT: number;
  readonly interpolation: OemInterpolation;
  readonly degree: number;
  /** False when the file named no INTERPOLATION_DEGREE (or no INTERPOLATION) and the default was taken. */
  readonly degreeGiven: boolean;
}

export interface OemSegment {
  readonly meta: OemSegmentMeta;
  /** Line of META_START (1-based). */
  readonly line: number;
  /** TT seconds since J2000, strictly increasing. */
  readonly epochsTT: Float64Array;
  /** x, y, z (km), vx, vy, vz (km/s) per line, in the segment's frame. */
  readonly states: Float64Array;
  /** ax, ay, az (km/s^2) per line, or null when the lines carry none. */
  readonly accelerations: Float64Array | null;
  readonly comments: readonly string[];
}

export interface OemMessage {
  readonly version: string;
  readonly creationDate: string;
  readonly originator: string;
  readonly messageId: string | null;
  readonly comments: readonly string[];
  readonly segments: readonly OemSegment[];
}

export type OemReadCode = 'oem-malformed' | 'oem-unsupported' | 'limit-exceeded';
export type OemReadResult =
  | { readonly ok: true; readonly value: OemMessage }
  | { readonly ok: false; readonly code: OemReadCode; readonly line: number; readonly message: string };

/** Signals a refusal from deep in the reader; caught once in readOem. */
class Refusal {
  constructor(readonly code: OemReadCode, readonly line: number, readonly message: string) {}
}
const malformed = (line: number, message: string): never => { throw new Refusal('oem-malformed', line, message); };
const unsupported = (line: number, message: string): never => { throw new Refusal('oem-unsupported', line, message); };

const KEY_VALUE = /^([A-Z][A-Z0-9_]*)\s*=\s*(.*?)\s*$/;
const NUMBER = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/;
const META_KEYS = new Set([
  'OBJECT_NAME', 'OBJECT_ID', 'CENTER_NAME', 'REF_FRAME', 'REF_FRAME_EPOCH', 'TIME_SYSTEM', 'START_TIME',
  'USEABLE_START_TIME', 'USEABLE_STOP_TIME', 'STOP_TIME', 'INTERPOLATION', 'INTERPOLATION_DEGREE',
]);
const REQUIRED_META = ['OBJECT_NAME', 'OBJECT_ID', 'CENTER_NAME', 'REF_FRAME', 'TIME_SYSTEM', 'START_TIME', 'STOP_TIME'] as const;
const HEADER_KEYS = new Set(['CREATION_DATE', 'ORIGINATOR', 'MESSAGE_ID', 'CLASSIFICATION']);
/** Named ITRF realisations read as ITRF (they differ by millimetres to centimetres). */
const ITRF_NAME = /^ITRF(?:-?\d{2}|\d{4})?$/;

function frameOf(text: string, line: number): OemFrame {
  if (ITRF_NAME.test(text)) return 'ITRF';
  if ((OEM_FRAMES as readonly string[]).includes(text)) return text as OemFrame;
  return unsupported(line, `REF_FRAME ${text} is not read here: use GCRF, ICRF, EME2000, ITRF (or a named realisation such as ITRF2014) or TEME`);
}

interface Entry { readonly value: string; readonly line: number }

function segmentMeta(meta: Map<string, Entry>, stopLine: number): OemSegmentMeta {
  for (const key of REQUIRED_META) if (!meta.has(key)) malformed(stopLine, `the metadata block ending here has no ${key}`);
  const get = (key: string): Entry => meta.get(key)!;
  const center = get('CENTER_NAME');
  if (center.value.toUpperCase() !== 'EARTH') unsupported(center.line, `CENTER_NAME ${center.value}: only EARTH-centred ephemerides are read`);
  const ts = get('TIME_SYSTEM');
  if (!(TIME_SYSTEMS as readonly string[]).includes(ts.value)) unsupported(ts.line, `TIME_SYSTEM ${ts.value} is not read here: use ${TIME_SYSTEMS.join(', ')}`);
  const timeSystem = ts.value as TimeSystem;
  const epoch = (key: string, fallback?: number): number => {
    const e = meta.get(key);
    if (!e) return fallback!;
    const tt = parseEpochIn(e.value, timeSystem);
    return tt.ok ? tt.value : malformed(e.line, `${key}: ${tt.message}`);
  };
  const startTT = epoch('START_TIME');
  const stopTT = epoch('STOP_TIME');
  if (!(stopTT >= startTT)) malformed(get('STOP_TIME').line, 'STOP_TIME is before START_TIME');
  const useableStartTT = epoch('USEABLE_START_TIME', startTT);
  const useableStopTT = epoch('USEABLE_STOP_TIME', stopTT);
  if (useableStartTT < startTT - BOUND_SLACK_S || useableStopTT > stopTT + BOUND_SLACK_S || !(useableStopTT >= useableStartTT)) {
    malformed((meta.get('USEABLE_START_TIME') ?? meta.get('USEABLE_STOP_TIME'))!.line, 'USEABLE_START_TIME .. USEABLE_STOP_TIME must be an interval within START_TIME .. STOP_TIME');
  }
  const method = meta.get('INTERPOLATION');
  let interpolation: OemInterpolation = 'LAGRANGE';
  let linear = false;
  if (method) {
    if (method.value === 'LINEAR') linear = true;
    else if ((OEM_INTERPOLATIONS as readonly string[]).includes(method.value)) interpolation = method.value as OemInterpolation;
    else unsupported(method.line, `INTERPOLATION ${method.value} is not available: use LAGRANGE, HERMITE or LINEAR`);
  }
  const degreeEntry = meta.get('INTERPOLATION_DEGREE');
  let degree = linear ? 1 : DEFAULT_DEGREE[interpolation];
  if (degreeEntry) {
    const d = Number(degreeEntry.value);
    if (!/^\d+$/.test(degreeEntry.value) || d < 1 || d > MAX_INTERPOLATION_DEGREE) {
      malformed(degreeEntry.line, `INTERPOLATION_DEGREE must be an integer from 1 to ${MAX_INTERPOLATION_DEGREE}, got "${degreeEntry.value}"`);
    }
    if (linear && d !== 1) malformed(degreeEntry.line, 'INTERPOLATION LINEAR has degree 1');
    degree = d;
  }
  const frame = get('REF_FRAME');
  return {
    objectName: get('OBJECT_NAME').value,
    objectId: get('OBJECT_ID').value,
    centerName: center.value,
    refFrame: frameOf(frame.value, frame.line),
    refFrameText: frame.value,
    timeSystem,
    startTT,
    stopTT,
    useableStartTT,
    useableStopTT,
    interpolation,
    degree,
    degreeGiven: degreeEntry !== undefined,
  };
}

/** Growable store of one segment's data lines. */
class DataLines {
  epochs: number[] = [];
  values: number[] = [];
  width = 0;
}

function finishSegment(meta: OemSegmentMeta, line: number, data: DataLines, comments: string[], endLine: number): OemSegment {
  const n = data.epochs.length;
  if (n === 0) malformed(endLine, 'the segment has no ephemeris data lines');
  const states = new Float64Array(6 * n);
  const accelerations = data.width === 9 ? new Float64Array(3 * n) : null;
  for (let i = 0; i < n; i++) {
    for (let c = 0; c < 6; c++) states[6 * i + c] = data.values[data.width * i + c]!;
    if (accelerations) for (let c = 0; c < 3; c++) accelerations[3 * i + c] = data.values[9 * i + 6 + c]!;
  }
  return { meta, line, epochsTT: Float64Array.from(data.epochs), states, accelerations, comments };
}

/** Read an OEM in KVN; every refusal names the line (1-based) and says what is wrong. */
export function readOem(text: string): OemReadResult {
  try {
    return { ok: true, value: read(text) };
  } catch (e) {
    if (e instanceof Refusal) return { ok: false, code: e.code, line: e.line, message: `line ${e.line}: ${e.message}` };
    throw e;
  }
}

function read(text: string): OemMessage {
  if (text.trimStart().startsWith('<')) unsupported(1, 'this is an XML message: send the OEM in KVN (key = value lines)');
  const lines = text.split(/\r\n|\n|\r/);
  const header = new Map<string, Entry>();
  const headerComments: string[] = [];
  const segments: OemSegment[] = [];
  let version: string | null = null;
  let state: 'header' | 'meta' | 'data' | 'covariance' = 'header';
  let meta = new Map<string, Entry>();
  let segMeta: OemSegmentMeta | null = null;
  let segLine = 0;
  let segComments: string[] = [];
  let data = new DataLines();
  let dataSeen = false;
  let totalLines = 0;
  let lastTT = -Infinity;

  const close = (endLine: number): void => {
    if (segMeta) segments.push(finishSegment(segMeta, segLine, data, segComments, endLine));
    segMeta = null;
  };

  for (let i = 0; i < lines.length; i++) {
    const no = i + 1;
    const line = lines[i]!.trim();
    if (line === '') continue;
    if (version === null) {
      const kv = KEY_VALUE.exec(line);
      if (!kv || kv[1] !== 'CCSDS_OEM_VERS') malformed(no, 'an OEM starts with CCSDS_OEM_VERS = 3.0 (or 2.0, 1.0)');
      if (!['1.0', '2.0', '3.0'].includes(kv![2]!)) unsupported(no, `CCSDS_OEM_VERS ${kv![2]} is not read here: versions 1.0, 2.0 and 3.0 are`);
      version = kv![2]!;
      continue;
    }
    const comment = line === 'COMMENT' || line.startsWith('COMMENT ') || line.startsWith('COMMENT\t');
    if (comment) {
      const body = line.slice(7).trim();
      if (state === 'header') headerComments.push(body);
      else if (state === 'meta') {
        if (meta.size > 0) malformed(no, 'COMMENT lines belong at the start of the metadata block');
        segComments.push(body);
      } else if (state === 'data') {
        if (dataSeen) malformed(no, 'COMMENT lines belong before the first data line of a segment');
        segComments.push(body);
      }
      continue;
    }
    if (state === 'covariance') {
      if (line === 'COVARIANCE_STOP') state = 'data';
      else if (line === 'META_START' || line === 'COVARIANCE_START') malformed(no, `${line} inside a covariance block: COVARIANCE_STOP is missing`);
      continue;
    }
    if (line === 'META_START') {
      if (state === 'meta') malformed(no, 'META_START inside a metadata block: META_STOP is missing');
      if (state === 'header') {
        for (const key of ['CREATION_DATE', 'ORIGINATOR']) if (!header.has(key)) malformed(no, `the header has no ${key}`);
      }
      close(no);
      if (segments.length >= MAX_OEM_SEGMENTS) throw new Refusal('limit-exceeded', no, `more than ${MAX_OEM_SEGMENTS} segments`);
      state = 'meta';
      meta = new Map();
      segLine = no;
      segComments = [];
      continue;
    }
    if (line === 'META_STOP') {
      if (state !== 'meta') malformed(no, 'META_STOP without META_START');
      segMeta = segmentMeta(meta, no);
      data = new DataLines();
      dataSeen = false;
      lastTT = -Infinity;
      state = 'data';
      continue;
    }
    if (state === 'header') {
      const kv = KEY_VALUE.exec(line);
      if (!kv) malformed(no, `"${clip(line)}" is not a header keyword line; metadata starts with META_START`);
      if (!HEADER_KEYS.has(kv![1]!)) malformed(no, `${kv![1]} is not an OEM header keyword`);
      if (header.has(kv![1]!)) malformed(no, `${kv![1]} is repeated`);
      if (kv![2] === '') malformed(no, `${kv![1]} has no value`);
      header.set(kv![1]!, { value: kv![2]!, line: no });
      continue;
    }
    if (state === 'meta') {
      const kv = KEY_VALUE.exec(line);
      if (!kv) malformed(no, `"${clip(line)}" inside a metadata block: META_STOP is missing or the line is not a keyword = value line`);
      if (!META_KEYS.has(kv![1]!)) malformed(no, `${kv![1]} is not an OEM metadata keyword`);
      if (meta.has(kv![1]!)) malformed(no, `${kv![1]} is repeated`);
      if (kv![2] === '') malformed(no, `${kv![1]} has no value`);
      meta.set(kv![1]!, { value: kv![2]!, line: no });
      continue;
    }
    // state === 'data'
    if (line === 'COVARIANCE_START') {
      if (!dataSeen) malformed(no, 'a covariance block must follow the data lines');
      state = 'covariance';
      continue;
    }
    if (line === 'COVARIANCE_STOP') malformed(no, 'COVARIANCE_STOP without COVARIANCE_START');
    if (KEY_VALUE.test(line)) malformed(no, `"${clip(line)}" among the data lines: a metadata block starts with META_START`);
    const fields = line.split(/\s+/);
    const numbers = fields.length - 1;
    if (numbers !== 6 && numbers !== 9) malformed(no, `a data line has an epoch and 6 numbers (or 9 with accelerations), this one has ${numbers} number${numbers === 1 ? '' : 's'}`);
    if (dataSeen && numbers !== data.width) malformed(no, `this data line has ${numbers} numbers, the segment's earlier lines ${data.width}`);
    const tt = parseEpochIn(fields[0]!, segMeta!.timeSystem);
    if (!tt.ok) malformed(no, `epoch: ${tt.message}`);
    const t = (tt as { value: number }).value;
    if (!(t > lastTT)) malformed(no, `epoch ${fields[0]} is not after the previous data line's: epochs must increase strictly within a segment`);
    if (t < segMeta!.startTT - BOUND_SLACK_S || t > segMeta!.stopTT + BOUND_SLACK_S) malformed(no, `epoch ${fields[0]} is outside the segment's START_TIME .. STOP_TIME`);
    for (let f = 1; f < fields.length; f++) {
      const v = fields[f]!;
      if (!NUMBER.test(v)) malformed(no, `"${clip(v)}" is not a number`);
      const x = Number(v);
      if (!Number.isFinite(x)) malformed(no, `${clip(v)} is out of range`);
      data.values.push(x);
    }
    if (++totalLines > MAX_OEM_DATA_LINES) throw new Refusal('limit-exceeded', no, `more than ${MAX_OEM_DATA_LINES} data lines`);
    data.epochs.push(t);
    data.width = numbers;
    dataSeen = true;
    lastTT = t;
  }
  const end = lines.length;
  if (version === null) malformed(1, 'the message is empty');
  if (state === 'meta') malformed(end, 'the last metadata block has no META_STOP');
  if (state === 'covariance') malformed(end, 'the last covariance block has no COVARIANCE_STOP');
  if (state === 'header') malformed(end, 'the message has no segment (META_START ... META_STOP and data lines)');
  close(end);
  return {
    version: version!,
    creationDate: header.get('CREATION_DATE')!.value,
    originator: header.get('ORIGINATOR')!.value,
    messageId: header.get('MESSAGE_ID')?.value ?? null,
    comments: headerComments,
    segments,
  };
}

const clip = (s: string): string => (s.length > 40 ? `${s.slice(0, 40)}...` : s);
