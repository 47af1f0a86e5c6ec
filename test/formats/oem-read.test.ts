// The OEM reader against messages written here by hand (invented spacecraft, layout per CCSDS
// 502.0-B-3 sec. 5 and the KVN rules of sec. 7, from memory) and against our own writer.
import { describe, expect, it } from 'vitest';
import { oemChunks } from '../../src/formats/oem.js';
import { DEFAULT_DEGREE, readOem, type OemMessage } from '../../src/formats/oem-read.js';
import { parseUtcIso } from '../../src/solver/time/time.js';
import { expectClose } from '../helpers/approx.js';

const tt = (iso: string): number => {
  const r = parseUtcIso(iso);
  if (!r.ok) throw new Error(r.message);
  return r.value;
};

const HEADER = ['CCSDS_OEM_VERS = 3.0', 'COMMENT invented test message', 'CREATION_DATE = 2026-11-30T12:00:00', 'ORIGINATOR = TEST DESK', ''];
const meta = (extra: string[] = [], frame = 'GCRF', system = 'UTC', start = '2026-12-01T00:00:00', stop = '2026-12-01T00:03:00'): string[] => [
  'META_START',
  'COMMENT first segment',
  'OBJECT_NAME = KESTREL-4',
  'OBJECT_ID = 2099-042B',
  'CENTER_NAME = EARTH',
  `REF_FRAME = ${frame}`,
  `TIME_SYSTEM = ${system}`,
  `START_TIME = ${start}`,
  `STOP_TIME = ${stop}`,
  ...extra,
  'META_STOP',
  '',
];
const LINES = [
  '2026-12-01T00:00:00.000 6878.137 0.0 0.0 0.0 5.3 5.3',
  '2026-12-01T00:01:00.000 6868.5 318.0 318.0 -0.32 5.29 5.29',
  '2026-12-01T00:02:00.000 6839.7 635.1 635.1 -0.64 5.27 5.27',
  '2026-12-01T00:03:00.000 6791.9 950.2 950.2 -0.95 5.23 5.23',
];
const message = (...parts: string[][]): string => [...HEADER, ...parts.flat()].join('\n');
const read = (text: string): OemMessage => {
  const r = readOem(text);
  if (!r.ok) throw new Error(r.message);
  return r.value;
};
/** The refusal: code and line. */
const refusal = (text: string) => {
  const r = readOem(text);
  if (r.ok) throw new Error('expected a refusal');
  return r;
};

describe('readOem(text)', () => {
  it('reads the header, one segment with comments, its metadata defaults and data lines', () => {
    const m = read(message(meta(), LINES));
    expect(m).toMatchObject({ version: '3.0', creationDate: '2026-11-30T12:00:00', originator: 'TEST DESK', messageId: null, comments: ['invented test message'] });
    expect(m.segments).toHaveLength(1);
    const s = m.segments[0]!;
    expect(s.meta).toMatchObject({ objectName: 'KESTREL-4', objectId: '2099-042B', refFrame: 'GCRF', timeSystem: 'UTC', interpolation: 'LAGRANGE', degree: DEFAULT_DEGREE.LAGRANGE, degreeGiven: false });
    expect(s.comments).toEqual(['first segment']);
    expect(s.line).toBe(6);
    expect(Array.from(s.epochsTT)).toEqual([0, 60, 120, 180].map((d) => tt('2026-12-01T00:00:00Z') + d));
    expect(Array.from(s.states.subarray(6, 12))).toEqual([6868.5, 318, 318, -0.32, 5.29, 5.29]);
    expect(s.accelerations).toBeNull();
    expect(s.meta.useableStartTT).toBe(s.meta.startTT);
  });

  it('reads several segments, TAI epochs in day-of-year form, accelerations, HERMITE with its degree, USEABLE times, and skips covariance', () => {
    const second = [
      'META_START', 'OBJECT_NAME = KESTREL-4', 'OBJECT_ID = 2099-042B', 'CENTER_NAME = EARTH', 'REF_FRAME = ITRF2014', 'TIME_SYSTEM = TAI',
      'START_TIME = 2026-335T01:00:37', 'USEABLE_START_TIME = 2026-335T01:00:37', 'USEABLE_STOP_TIME = 2026-335T01:01:07', 'STOP_TIME = 2026-335T01:01:37',
      'INTERPOLATION = HERMITE', 'INTERPOLATION_DEGREE = 3', 'META_STOP',
      'COMMENT accelerations follow the velocities',
      '2026-335T01:00:37 -1000.0 6000.0 2000.0 -6.0 -1.0 3.0 0.001 -0.006 -0.002',
      '2026-335T01:01:37 -1360.0 5920.0 2170.0 -5.9 -1.3 2.9 0.0014 -0.0059 -0.0022',
      'COVARIANCE_START', 'EPOCH = 2026-335T01:00:37', 'COV_REF_FRAME = ITRF', '1.0e-3', '1.0e-5 1.0e-3', 'COVARIANCE_STOP',
    ];
    const m = read(message(meta(), LINES, [''], second));
    expect(m.segments).toHaveLength(2);
    const s = m.segments[1]!;
    expect(s.meta).toMatchObject({ refFrame: 'ITRF', refFrameText: 'ITRF2014', timeSystem: 'TAI', interpolation: 'HERMITE', degree: 3, degreeGiven: true });
    // TAI 01:00:37 is UTC 01:00:00 in December 2026 (TAI - UTC = 37 s, IERS Bulletin C 52).
    expectClose(s.epochsTT[0]!, tt('2026-12-01T01:00:00Z'), 1e-6, 'first epoch');
    expectClose(s.meta.useableStopTT, tt('2026-12-01T01:00:30Z'), 1e-6, 'useable stop');
    expect(Array.from(s.accelerations!)).toEqual([0.001, -0.006, -0.002, 0.0014, -0.0059, -0.0022]);
    expect(s.comments).toEqual(['accelerations follow the velocities']);
  });

  it('reads back what our own writer produced', () => {
    const t0 = tt('2026-12-01T00:00:00Z');
    const epochsTT = Float64Array.from([0, 60, 120.5], (d) => t0 + d);
    const states = Float64Array.from([7000, 1, -2, 0.1, 7.5, 0.2, 6990.123456, 450.5, 3, -0.9, 7.4, 0.25, 6950, 900, 8.25, -1.5, 7.3, 0.3]);
    const text = [...oemChunks({ epochsTT, states }, {
      creationEpochTT: t0, originator: 'apsides', objectName: 'KESTREL-4', objectId: '2099-042B', centerName: 'EARTH', refFrame: 'GCRF',
      comments: ['written by the test'], interpolation: { method: 'LAGRANGE', degree: 5 },
    })].join('');
    const m = read(text);
    expect(m.segments).toHaveLength(1);
    const s = m.segments[0]!;
    expect(s.meta).toMatchObject({ objectName: 'KESTREL-4', refFrame: 'GCRF', timeSystem: 'UTC', interpolation: 'LAGRANGE', degree: 5 });
    s.epochsTT.forEach((t, i) => expectClose(t, epochsTT[i]!, 1e-6, `epoch ${i}`));
    s.states.forEach((x, i) => expectClose(x, states[i]!, 1e-9, `state ${i}`));
  });

  it('accepts CRLF line ends and blank lines anywhere', () => {
    const m = read(message(meta(), ['', ...LINES, '']).replace(/\n/g, '\r\n'));
    expect(m.segments[0]!.epochsTT).toHaveLength(4);
  });
});

describe('readOem refuses malformed messages with the line number', () => {
  // Lines: 1-5 header, 6-16 metadata (META_STOP on 15, blank 16), data from 17.
  const cases: ReadonlyArray<readonly [string, string, number, string]> = [
    ['missing META_STOP', message(meta().filter((l) => l !== 'META_STOP'), LINES), 16, 'META_STOP is missing'],
    ['non-increasing epochs', message(meta(), [LINES[0]!, LINES[2]!, LINES[1]!, LINES[3]!]), 19, 'increase strictly'],
    ['a repeated epoch', message(meta(), [LINES[0]!, LINES[0]!]), 18, 'increase strictly'],
    ['unknown frame', message(meta([], 'SOMEFRAME'), LINES), 11, 'REF_FRAME SOMEFRAME'],
    ['7 numbers on a line', message(meta(), [LINES[0]!, `${LINES[1]!} 0.5`]), 18, 'this one has 7 numbers'],
    ['5 numbers on a line', message(meta(), [LINES[0]!.split(' ').slice(0, 6).join(' ')]), 17, 'this one has 5 numbers'],
    ['a word for a number', message(meta(), [LINES[0]!.replace('5.3 5.3', '5.3 fast')]), 17, '"fast" is not a number'],
    ['a bad epoch', message(meta(), [LINES[0]!.replace('2026-12-01T00:00:00.000', '2026-13-01T00:00:00')]), 17, 'month 13'],
    ['an epoch outside START..STOP', message(meta(), [...LINES, '2026-12-01T00:04:00 1 2 3 4 5 6']), 21, 'outside the segment'],
    ['mixed 6 and 9 numbers', message(meta(), [LINES[0]!, `${LINES[1]!} 0 0 0`]), 18, 'earlier lines 6'],
    ['no version line', message(meta(), LINES).replace('CCSDS_OEM_VERS = 3.0', 'CCSDS_VERSION = 3.0'), 1, 'starts with CCSDS_OEM_VERS'],
    ['a missing OBJECT_ID', message(meta().filter((l) => !l.startsWith('OBJECT_ID')), LINES), 14, 'no OBJECT_ID'],
    ['a repeated keyword', message(meta(['OBJECT_NAME = OTHER']), LINES), 15, 'OBJECT_NAME is repeated'],
    ['an unknown metadata keyword', message(meta(['COLOUR = BLUE']), LINES), 15, 'COLOUR is not an OEM metadata keyword'],
    ['a segment without data', message(meta(), meta(), LINES), 17, 'no ephemeris data lines'],
    ['a degree out of range', message(meta(['INTERPOLATION_DEGREE = 40']), LINES), 15, 'from 1 to 15'],
    ['STOP before START', message(meta([], 'GCRF', 'UTC', '2026-12-01T00:03:00', '2026-12-01T00:00:00'), LINES), 14, 'before START_TIME'],
    ['no CREATION_DATE', message(meta(), LINES).replace('CREATION_DATE = 2026-11-30T12:00:00\n', ''), 5, 'no CREATION_DATE'],
    ['covariance not closed', message(meta(), LINES, ['COVARIANCE_START', 'EPOCH = 2026-12-01T00:00:00', '1.0']), 23, 'no COVARIANCE_STOP'],
    ['a Z on a TAI epoch', message(meta([], 'GCRF', 'TAI'), [LINES[0]!.replace('.000 ', 'Z ')]), 17, 'zone letter'],
  ];
  for (const [what, text, line, words] of cases) {
    it(`${what}: refused at line ${line}`, () => {
      const r = refusal(text);
      expect(r.code).toBe(what === 'unknown frame' ? 'oem-unsupported' : 'oem-malformed');
      expect(r.line).toBe(line);
      expect(r.message).toContain(`line ${line}:`);
      expect(r.message).toContain(words);
    });
  }

  it('tells what is valid but not read here apart (oem-unsupported): other centres, time systems, methods, XML', () => {
    expect(refusal(message(meta().map((l) => l.replace('CENTER_NAME = EARTH', 'CENTER_NAME = MARS')), LINES))).toMatchObject({ code: 'oem-unsupported', line: 10 });
    expect(refusal(message(meta([], 'GCRF', 'TDB'), LINES))).toMatchObject({ code: 'oem-unsupported', line: 12 });
    expect(refusal(message(meta(['INTERPOLATION = SPLINE']), LINES))).toMatchObject({ code: 'oem-unsupported', line: 15 });
    expect(refusal(message(meta([], 'TOD'), LINES))).toMatchObject({ code: 'oem-unsupported', line: 11 });
    expect(refusal('<?xml version="1.0"?><oem/>')).toMatchObject({ code: 'oem-unsupported', line: 1 });
    expect(refusal(message(meta([], 'SOMEFRAME'), LINES)).code).toBe('oem-unsupported');
  });
});
