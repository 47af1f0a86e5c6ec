import { describe, expect, it } from 'vitest';
import { CSV_HEADER, csvChunks } from '../../src/formats/csv.js';
import { fixed, type TrackTable } from '../../src/formats/track-table.js';
import { parseUtcIso } from '../../src/solver/time/time.js';
import { expectClose } from '../helpers/approx.js';

/** An invented track: n samples a minute apart from 2026-12-01T00:00:00Z, smooth made-up numbers. */
function demoTable(n: number): TrackTable {
  const start = parseUtcIso('2026-12-01T00:00:00Z');
  if (!start.ok) throw new Error(start.message);
  const epochsTT = Float64Array.from({ length: n }, (_, i) => start.value + 60 * i + 0.0004 * i);
  const states = new Float64Array(6 * n);
  for (let i = 0; i < n; i++) {
    const a = i * 0.011;
    states.set([7000.123_456_7 * Math.cos(a), -7000 * Math.sin(a), 1234.5 * Math.sin(3 * a), -7.5 * Math.sin(a), 7.5 * Math.cos(a), 0.001_234_567_89 * i], 6 * i);
  }
  return { epochsTT, states };
}

const text = (table: TrackTable, opts = {}): string => [...csvChunks(table, opts)].join('');

describe('csvChunks(table, opts)', () => {
  it('starts with a header row naming the units and ends every record with CRLF (RFC 4180 sec. 2, rules 1-3)', () => {
    const csv = text(demoTable(5));
    expect(csv.startsWith('epoch_utc,x_km,y_km,z_km,vx_km_s,vy_km_s,vz_km_s\r\n')).toBe(true);
    expect(CSV_HEADER.split(',')).toHaveLength(7);
    expect(csv.endsWith('\r\n')).toBe(true);
    expect(csv.replaceAll('\r\n', '')).not.toMatch(/[\r\n]/); // no bare CR or LF anywhere
    const records = csv.split('\r\n').slice(0, -1);
    expect(records).toHaveLength(6);
    for (const record of records) expect(record.split(','), record).toHaveLength(7); // same field count on every line (rule 4)
    expect(csv).not.toMatch(/"/); // nothing needs quoting (rules 5-7)
  });

  it('prints ISO 8601 UTC epochs, 6 decimals of km and 9 of km/s, and reads back to the printed precision', () => {
    const table = demoTable(300);
    const rows = text(table).split('\r\n').slice(1, -1);
    expect(rows).toHaveLength(300);
    rows.forEach((row, i) => {
      const [epoch, ...numbers] = row.split(',');
      expect(epoch).toMatch(/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}\.\d{6}Z$/);
      const tt = parseUtcIso(epoch!);
      expect(tt.ok).toBe(true);
      if (tt.ok) expectClose(tt.value, table.epochsTT[i]!, 0.0005 + 1e-9, `epoch ${i}`);
      numbers.forEach((field, c) => {
        expect(field).toMatch(c < 3 ? /^-?\d+\.\d{6}$/ : /^-?\d+\.\d{9}$/);
        expectClose(Number(field), table.states[6 * i + c]!, (c < 3 ? 0.5e-6 : 0.5e-9) * (1 + 1e-9), `row ${i} col ${c}`);
      });
    });
  });

  it('yields chunks of about 64 kB, and the same text whatever the chunk size', () => {
    const table = demoTable(5000);
    const chunks = [...csvChunks(table)];
    expect(chunks.length).toBeGreaterThan(3);
    // The header row is a chunk of its own; the records follow in chunks of about 64 kB.
    expect(chunks[0]!.toString()).toBe('epoch_utc,x_km,y_km,z_km,vx_km_s,vy_km_s,vz_km_s\r\n');
    for (const chunk of chunks.slice(1, -1)) {
      // Chunks are cut once they are within 1 kB of 64 kB (room for one more line).
      expect(chunk.length).toBeGreaterThanOrEqual(65_536 - 1024);
      expect(chunk.length).toBeLessThan(65_536 + 200);
    }
    expect(chunks.join('')).toBe(text(table, { chunkChars: 1000 }));
  });

  it('honours other precisions and prints values that round to zero without a minus sign', () => {
    const table: TrackTable = { epochsTT: Float64Array.from([0]), states: Float64Array.from([-1e-7, 1.25, -0.0000004, -1e-10, 2, -3]) };
    const row = text(table, { epochDigits: 0, positionDecimals: 3, velocityDecimals: 4 }).split('\r\n')[1];
    expect(row).toBe('2000-01-01T11:58:56Z,0.000,1.250,0.000,0.0000,2.0000,-3.0000');
    expect(fixed(-0.0000006, 6)).toBe('-0.000001'); // rounds to a non-zero digit: keeps its sign
    expect(fixed(-0, 2)).toBe('0.00');
  });

  it('throws on a malformed table or option (programmer errors)', () => {
    expect(() => text({ epochsTT: new Float64Array(2), states: new Float64Array(6) })).toThrow(RangeError);
    expect(() => text({ epochsTT: new Float64Array(1), states: Float64Array.from([Number.NaN, 0, 0, 0, 0, 0]) })).toThrow(RangeError);
    expect(() => text(demoTable(1), { epochDigits: 12 })).toThrow(RangeError);
  });
});
