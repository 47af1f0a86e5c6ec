import { describe, expect, it } from 'vitest';
import { oemChunks, type OemMeta } from '../../src/formats/oem.js';
import type { TrackTable } from '../../src/formats/track-table.js';
import { parseUtcIso } from '../../src/solver/time/time.js';
import { propagateGrid } from '../../src/solver/conic/universal.js';
import { expectClose } from '../helpers/approx.js';
import { parseOemKvn } from '../helpers/oem-kvn.js';

const tt = (iso: string): number => {
  const r = parseUtcIso(iso);
  if (!r.ok) throw new Error(r.message);
  return r.value;
};

/** An invented spacecraft on an invented orbit, one sample a minute for 3 hours. */
function demoTrack(): TrackTable {
  const n = 181;
  const dt = Float64Array.from({ length: n }, (_, i) => 60 * i);
  const states = new Float64Array(6 * n);
  const ok = propagateGrid([6878.137, 0, 0], [0, 5.3, 5.3], 398_600.4418, dt, states);
  if (!ok.ok) throw new Error(ok.message);
  const t0 = tt('2026-12-01T00:00:00Z');
  return { epochsTT: dt.map((d) => t0 + d), states };
}

const META: OemMeta = {
  creationEpochTT: tt('2026-11-30T12:00:00Z'),
  originator: 'APSIDES DEMO',
  objectName: 'EXAMPLE SAT 1',
  objectId: '2099-001A',
  centerName: 'EARTH',
  refFrame: 'GCRF',
  comments: ['invented demo data'],
};

const oemText = (table: TrackTable, meta: OemMeta = META): string => [...oemChunks(table, meta)].join('');

describe('oemChunks(table, meta)', () => {
  it('writes the header and metadata keywords of CCSDS 502.0-B-3 sec. 5.2 in order (from memory)', () => {
    const parsed = parseOemKvn(oemText(demoTrack()));
    expect(parsed.headerOrder).toEqual(['CCSDS_OEM_VERS', 'CREATION_DATE', 'ORIGINATOR']);
    expect(parsed.header).toEqual({ CCSDS_OEM_VERS: '3.0', CREATION_DATE: '2026-11-30T12:00:00.000000', ORIGINATOR: 'APSIDES DEMO' });
    expect(parsed.comments).toEqual(['invented demo data']);
    expect(parsed.segments).toHaveLength(1);
    const seg = parsed.segments[0]!;
    expect(seg.metaOrder).toEqual(['OBJECT_NAME', 'OBJECT_ID', 'CENTER_NAME', 'REF_FRAME', 'TIME_SYSTEM', 'START_TIME', 'STOP_TIME']);
    expect(seg.meta).toEqual({
      OBJECT_NAME: 'EXAMPLE SAT 1',
      OBJECT_ID: '2099-001A',
      CENTER_NAME: 'EARTH',
      REF_FRAME: 'GCRF',
      TIME_SYSTEM: 'UTC',
      START_TIME: '2026-12-01T00:00:00.000000',
      STOP_TIME: '2026-12-01T03:00:00.000000',
    });
  });

  it('round-trips: the parsed data lines give the epochs and states back to the printed precision', () => {
    const table = demoTrack();
    const seg = parseOemKvn(oemText(table)).segments[0]!;
    expect(seg.epochs).toHaveLength(table.epochsTT.length);
    expect(seg.states).toHaveLength(table.states.length);
    seg.epochs.forEach((epoch, i) => {
      expect(epoch).toMatch(/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}\.\d{6}$/);
      expectClose(tt(`${epoch}Z`), table.epochsTT[i]!, 0.0005 + 1e-9, `epoch ${i}`);
    });
    seg.states.forEach((value, k) => {
      const tolerance = (k % 6 < 3 ? 0.5e-6 : 0.5e-9) * (1 + 1e-9); // 6 decimals of km, 9 of km/s
      expectClose(value, table.states[k]!, tolerance, `number ${k}`);
    });
    expect(seg.epochs[0]).toBe(seg.meta.START_TIME);
    expect(seg.epochs.at(-1)).toBe(seg.meta.STOP_TIME);
  });

  it('is deterministic: the same table and meta give the same bytes (no clock read)', async () => {
    const table = demoTrack();
    const before = oemText(table);
    // A clock read would show across a pause longer than the printed resolution (milliseconds and seconds).
    await new Promise((resolve) => setTimeout(resolve, 1100));
    expect(oemText(table)).toBe(before);
    expect(oemText(table)).toBe([...oemChunks(table, { ...META, chunkChars: 500 })].join(''));
  });

  it('writes the optional MESSAGE_ID and INTERPOLATION keywords when given', () => {
    const parsed = parseOemKvn(oemText(demoTrack(), { ...META, messageId: 'DEMO-0001', interpolation: { method: 'LAGRANGE', degree: 7 } }));
    expect(parsed.header.MESSAGE_ID).toBe('DEMO-0001');
    expect(parsed.segments[0]!.meta.INTERPOLATION).toBe('LAGRANGE');
    expect(parsed.segments[0]!.meta.INTERPOLATION_DEGREE).toBe('7');
  });

  it('refuses epochs that do not increase (CCSDS 502.0-B-3: data lines in increasing time order, from memory), empty tables and multi-line values', () => {
    const table = demoTrack();
    const swapped = table.epochsTT.slice();
    [swapped[3], swapped[4]] = [swapped[4]!, swapped[3]!];
    expect(() => oemText({ epochsTT: swapped, states: table.states })).toThrow(/epoch 4/);
    const repeated = table.epochsTT.slice();
    repeated[10] = repeated[9]!;
    expect(() => oemText({ epochsTT: repeated, states: table.states })).toThrow(RangeError);
    expect(() => oemText({ epochsTT: new Float64Array(0), states: new Float64Array(0) })).toThrow(RangeError);
    expect(() => oemText(table, { ...META, objectName: 'TWO\nLINES' })).toThrow(RangeError);
    expect(() => oemText(table, { ...META, originator: '' })).toThrow(RangeError);
  });
});
