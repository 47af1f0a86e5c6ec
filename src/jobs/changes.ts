// What changed between two runs of the same items (POST /v1/jobs with compareTo): item by item,
// matched by item id, for pass items the passes per station that appeared, vanished or moved, and
// for track items the largest position difference at the sample epochs both tracks share.
import type { CompareTo } from './queue.js';

interface PassLike {
  readonly station: string;
  readonly aos: string;
  readonly tca: string;
  readonly los: string;
  readonly maxElevation: number;
}

interface Line {
  readonly index: number;
  readonly id: string | null;
  readonly kind: string;
  readonly status: number;
  readonly answer?: unknown;
}

export interface PassMove {
  readonly before: PassLike;
  readonly after: PassLike;
  /** after - before, s. */
  readonly deltaAosS: number;
  readonly deltaTcaS: number;
  readonly deltaLosS: number;
  /** after - before, deg. */
  readonly deltaMaxElevationDeg: number;
}

export interface StationChanges {
  readonly station: string;
  readonly appeared: PassLike[];
  readonly vanished: PassLike[];
  readonly moved: PassMove[];
}

const summary = (p: PassLike): PassLike => ({ station: p.station, aos: p.aos, tca: p.tca, los: p.los, maxElevation: p.maxElevation });
const ms = (iso: string) => Date.parse(iso);

/**
 * Pairs the passes of one station: each later pass with the earlier pass of nearest TCA whose
 * visibility interval overlaps it (each earlier pass used once); unpaired ones appeared or vanished.
 */
export function stationChanges(station: string, before: readonly PassLike[], after: readonly PassLike[], limits: Pick<CompareTo, 'thresholdSeconds' | 'thresholdDegrees'>): StationChanges {
  const used = new Set<number>();
  const appeared: PassLike[] = [];
  const moved: PassMove[] = [];
  for (const next of after) {
    let best = -1;
    for (let i = 0; i < before.length; i++) {
      const old = before[i]!;
      if (used.has(i) || ms(next.aos) > ms(old.los) || ms(old.aos) > ms(next.los)) continue;
      if (best < 0 || Math.abs(ms(old.tca) - ms(next.tca)) < Math.abs(ms(before[best]!.tca) - ms(next.tca))) best = i;
    }
    if (best < 0) { appeared.push(summary(next)); continue; }
    used.add(best);
    const old = before[best]!;
    const move: PassMove = {
      before: summary(old), after: summary(next),
      deltaAosS: (ms(next.aos) - ms(old.aos)) / 1000,
      deltaTcaS: (ms(next.tca) - ms(old.tca)) / 1000,
      deltaLosS: (ms(next.los) - ms(old.los)) / 1000,
      deltaMaxElevationDeg: next.maxElevation - old.maxElevation,
    };
    const seconds = Math.max(Math.abs(move.deltaAosS), Math.abs(move.deltaTcaS), Math.abs(move.deltaLosS));
    if (seconds > limits.thresholdSeconds || Math.abs(move.deltaMaxElevationDeg) > limits.thresholdDegrees) moved.push(move);
  }
  const vanished = before.filter((_, i) => !used.has(i)).map(summary);
  return { station, appeared, vanished, moved };
}

const passesOf = (answer: unknown): PassLike[] =>
  (answer !== null && typeof answer === 'object' && Array.isArray((answer as { passes?: unknown }).passes) ? (answer as { passes: PassLike[] }).passes : []);

interface SampleLike { readonly epoch: string; readonly position?: readonly number[] }
const samplesOf = (answer: unknown): SampleLike[] =>
  (answer !== null && typeof answer === 'object' && Array.isArray((answer as { samples?: unknown }).samples) ? (answer as { samples: SampleLike[] }).samples : []);

/** The changes line of one item: `before` is the earlier job's line of the same item id (undefined when it had none). */
export function itemChanges(after: Line, before: Line | undefined, limits: CompareTo): Record<string, unknown> {
  const head = { index: after.index, id: after.id, kind: after.kind };
  if (after.id === null) return { ...head, change: 'not-compared', reason: 'the item has no id to match it with the earlier job' };
  if (!before) return { ...head, change: 'new-item', reason: `no item with this id in job ${limits.job}` };
  if (before.kind !== after.kind) return { ...head, change: 'not-compared', reason: `the earlier item is of kind ${before.kind}` };
  if (after.status !== 200 || before.status !== 200) {
    return { ...head, change: after.status === before.status ? 'unchanged' : 'status', before: { status: before.status }, after: { status: after.status } };
  }
  if (after.kind === 'passes') {
    const groups = (passes: PassLike[]) => {
      const by = new Map<string, PassLike[]>();
      for (const p of passes) by.set(p.station, [...(by.get(p.station) ?? []), p]);
      return by;
    };
    const [old, next] = [groups(passesOf(before.answer)), groups(passesOf(after.answer))];
    const stations = [...new Set([...next.keys(), ...old.keys()])]
      .map((s) => stationChanges(s, old.get(s) ?? [], next.get(s) ?? [], limits))
      .filter((c) => c.appeared.length + c.vanished.length + c.moved.length > 0);
    return { ...head, change: stations.length > 0 ? 'passes' : 'unchanged', thresholdSeconds: limits.thresholdSeconds, thresholdDegrees: limits.thresholdDegrees, stations };
  }
  if (after.kind === 'track') {
    const earlier = new Map(samplesOf(before.answer).map((s) => [s.epoch, s.position]));
    let common = 0;
    let largest = 0;
    let at: string | null = null;
    for (const s of samplesOf(after.answer)) {
      const p = earlier.get(s.epoch);
      if (!p || !s.position) continue;
      common++;
      const d = Math.hypot(s.position[0]! - p[0]!, s.position[1]! - p[1]!, s.position[2]! - p[2]!);
      if (at === null || d > largest) { largest = d; at = s.epoch; }
    }
    return { ...head, change: 'track', commonSamples: common, maxPositionDifferenceKm: at === null ? null : largest, atEpoch: at };
  }
  return { ...head, change: 'not-compared', reason: `changes are listed for passes and track items; ${after.kind} items are not compared` };
}

/** The item id of a stored line, read from its head (the line starts {"index":N,"id":...,"kind"). */
export function lineId(line: Buffer): string | null {
  const head = line.subarray(0, Math.min(line.length, 1600)).toString('utf8');
  const match = /^\{"index":\d+,"id":(null|"(?:[^"\\]|\\.)*"),"kind"/.exec(head);
  return match && match[1] !== 'null' ? (JSON.parse(match[1]!) as string) : null;
}
