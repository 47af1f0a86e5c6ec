// Helpers for the batch and job tests: the invented demo items, NDJSON reading, bounded polling.
import { setTimeout as sleep } from 'node:timers/promises';
import { expect } from 'vitest';
import { BatchLine } from '../../src/schemas/batch.js';
import { DEMO_ORBIT, DEMO_STATIONS, EPOCH } from './demo.js';

/** One good item of every kind (invented demo scenarios), keyed by kind. */
export const GOOD = {
  orbit: { centralBody: 'earth', elements: DEMO_ORBIT.elements },
  track: { ...DEMO_ORBIT, grid: { start: EPOCH, stop: '2026-12-01T00:30:00Z', step: 60 }, object: { name: 'PLOVER-7', id: '2026-900A' } },
  passes: { ...DEMO_ORBIT, window: { start: EPOCH, stop: '2026-12-01T06:00:00Z' }, stations: [DEMO_STATIONS[0]] },
  eclipses: { ...DEMO_ORBIT, window: { start: EPOCH, stop: '2026-12-01T06:00:00Z' } },
  'two-body': {
    epoch: EPOCH,
    bodies: [
      { name: 'Tamsin', mass: 5.2e11, position: [0, 0, 0], velocity: [0, 0, 0] },
      { name: 'Tamsin I', mass: 3.1e9, position: [1.2, 0, 0], velocity: [0, 0.00017, 0] },
    ],
  },
  'central-force': {
    mass: 1,
    potential: { terms: [{ kind: 'power', coefficient: -1, exponent: -1 }, { kind: 'power', coefficient: -0.001, exponent: -3 }] },
    angularMomentum: 0.9,
    energy: -0.6,
  },
} as const;

export type Kind = keyof typeof GOOD;

/** The NDJSON lines of an answer as raw bytes (without their newline); every line must end with one. */
export function rawLines(payload: Buffer): Buffer[] {
  expect(payload.length).toBeGreaterThan(0);
  expect(payload[payload.length - 1]).toBe(0x0a);
  const lines: Buffer[] = [];
  let start = 0;
  for (let i = payload.indexOf(0x0a); i >= 0; i = payload.indexOf(0x0a, start)) {
    lines.push(payload.subarray(start, i));
    start = i + 1;
  }
  return lines;
}

/** Each line parsed with the line schema (proving the schema describes it). */
export const parseLines = (payload: Buffer): BatchLine[] => rawLines(payload).map((line) => BatchLine.parse(JSON.parse(line.toString('utf8'))));

/** The bytes of a line's answer, exactly as spliced in (the line ends with the answer and one closing brace). */
export function answerBytes(line: Buffer): Buffer {
  const key = Buffer.from(',"answer":');
  const at = line.indexOf(key);
  expect(at, 'line has an answer').toBeGreaterThan(0);
  expect(line[line.length - 1]).toBe(0x7d);
  return line.subarray(at + key.length, line.length - 1);
}

/** Poll until `done()` resolves true; fails after `cap` tries (a bound on work, not a timed assertion). */
export async function until(what: string, done: () => Promise<boolean>, cap = 2000): Promise<void> {
  for (let i = 0; i < cap; i++) {
    if (await done()) return;
    await sleep(10);
  }
  expect.fail(`${what}: not reached after ${cap} polls`);
}
