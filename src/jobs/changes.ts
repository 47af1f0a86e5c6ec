// What changed between two runs of the same items (POST /v1/jobs with compareTo): item by item,
// matched by item id, for pass items the passes per station that appeared, vanished or moved, for
// eclipse items the eclipses per shadow (Earth, Moon) likewise, and for track items the largest
// position difference at the sample epochs both tracks share.
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

/** An interval of time to pair: [start, stop] and the instant that stands for it, ms. */
interface Span { readonly start: number; readonly stop: number; readonly centre: number }

/**
 * Pairs two lists of intervals: each later interval with the earlier one of nearest centre that
 * overlaps it (each earlier one used once); the unpaired later ones appeared, the earlier vanished.
 */
export function pairIntervals<T>(before: readonly T[], after: readonly T[], span: (t: T) => Span): { pairs: [T, T][]; appeared: T[]; vanished: T[] } {
  const used = new Set<number>();
  const pairs: [T, T][] = [];
  const appeared: T[] = [];
  const old = before.map(span);
  for (const next of after) {
    const n = span(next);
    let best = -1;
    for (let i = 0; i < old.length; i++) {
      const o = old[i]!;
      if (used.has(i) || n.start > o.stop || o.start > n.stop) continue;
      if (best < 0 || Math.abs(o.centre - n.centre) < Math.abs(old[best]!.centre - n.centre)) best = i;
    }
    if (best < 0) { appeared.push(next); continue; }
    used.add(best);
    pairs.push([before[best]!, next]);
  }
  return { pairs, appeared, vanished: before.filter((_, i) => !used.has(i)) };
}

const passSpan = (p: PassLike): Span => ({ start: ms(p.aos), stop: ms(p.los), centre: ms(p.tca) });

/**
 * Pairs the passes of one station: each later pass with the earlier pass of nearest TCA whose
 * visibility interval overlaps it (each earlier pass used once); unpaired ones appeared or vanished.
 */
export function stationChanges(station: string, before: readonly PassLike[], after: readonly PassLike[], limits: Pick<CompareTo, 'thresholdSeconds' | 'thresholdDegrees'>): StationChanges {
  const { pairs, appeared, vanished } = pairIntervals(before, after, passSpan);
  const moved: PassMove[] = [];
  for (const [old, next] of pairs) {
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
  return { station, appeared: appeared.map(summary), vanished: vanished.map(summary), moved };
}

interface EclipseLike {
  readonly start: string;
  readonly stop: string;
  readonly umbraStart: string | null;
  readonly umbraStop: string | null;
  readonly depth: number;
}

export interface EclipseMove {
  readonly before: EclipseLike;
  readonly after: EclipseLike;
  /** after - before, s (penumbra entry and exit; umbra entry and exit, null unless both reach the umbra). */
  readonly deltaStartS: number;
  readonly deltaStopS: number;
  readonly deltaUmbraStartS: number | null;
  readonly deltaUmbraStopS: number | null;
}

export interface ShadowChanges {
  readonly shadow: 'earth' | 'moon';
  readonly appeared: EclipseLike[];
  readonly vanished: EclipseLike[];
  readonly moved: EclipseMove[];
}

const eclipseSummary = (e: EclipseLike): EclipseLike => ({ start: e.start, stop: e.stop, umbraStart: e.umbraStart, umbraStop: e.umbraStop, depth: e.depth });
const eclipseSpan = (e: EclipseLike): Span => ({ start: ms(e.start), stop: ms(e.stop), centre: (ms(e.start) + ms(e.stop)) / 2 });
const delta = (after: string | null, before: string | null) => (after === null || before === null ? null : (ms(after) - ms(before)) / 1000);

/** The eclipses of one shadow paired like passes; moved when an entry or exit moved by more than thresholdSeconds, or one reaches the umbra and the other not. */
export function shadowChanges(shadow: 'earth' | 'moon', before: readonly EclipseLike[], after: readonly EclipseLike[], limits: Pick<CompareTo, 'thresholdSeconds'>): ShadowChanges {
  const { pairs, appeared, vanished } = pairIntervals(before, after, eclipseSpan);
  const moved: EclipseMove[] = [];
  for (const [old, next] of pairs) {
    const move: EclipseMove = {
      before: eclipseSummary(old), after: eclipseSummary(next),
      deltaStartS: (ms(next.start) - ms(old.start)) / 1000,
      deltaStopS: (ms(next.stop) - ms(old.stop)) / 1000,
      deltaUmbraStartS: delta(next.umbraStart, old.umbraStart),
      deltaUmbraStopS: delta(next.umbraStop, old.umbraStop),
    };
    const umbraChanged = (old.umbraStart === null) !== (next.umbraStart === null);
    const seconds = Math.max(...[move.deltaStartS, move.deltaStopS, move.deltaUmbraStartS ?? 0, move.deltaUmbraStopS ?? 0].map(Math.abs));
    if (umbraChanged || seconds > limits.thresholdSeconds) moved.push(move);
  }
  return { shadow, appeared: appeared.map(eclipseSummary), vanished: vanished.map(eclipseSummary), moved };
}

const listOf = <T>(answer: unknown, key: string): T[] => {
  const value = answer !== null && typeof answer === 'object' ? (answer as Record<string, unknown>)[key] : undefined;
  return Array.isArray(value) ? (value as T[]) : [];
};

const passesOf = (answer: unknown): PassLike[] => listOf<PassLike>(answer, 'passes');

interface SampleLike { readonly epoch: string; readonly position?: readonly number[] }
const samplesOf = (answer: unknown): SampleLike[] => listOf<SampleLike>(answer, 'samples');

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
  if (after.kind === 'eclipses') {
    const shadows = (['earth', 'moon'] as const)
      .map((shadow) => {
        const key = shadow === 'earth' ? 'eclipses' : 'moonEclipses';
        return shadowChanges(shadow, listOf<EclipseLike>(before.answer, key), listOf<EclipseLike>(after.answer, key), limits);
      })
      .filter((c) => c.appeared.length + c.vanished.length + c.moved.length > 0);
    return { ...head, change: shadows.length > 0 ? 'eclipses' : 'unchanged', thresholdSeconds: limits.thresholdSeconds, shadows };
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
  return { ...head, change: 'not-compared', reason: `changes are listed for passes, eclipses and track items; ${after.kind} items are not compared` };
}

/** The item id of a stored line, read from its head (the line starts {"index":N,"id":...,"kind"). */
export function lineId(line: Buffer): string | null {
  const head = line.subarray(0, Math.min(line.length, 1600)).toString('utf8');
  const match = /^\{"index":\d+,"id":(null|"(?:[^"\\]|\\.)*"),"kind"/.exec(head);
  return match && match[1] !== 'null' ? (JSON.parse(match[1]!) as string) : null;
}
