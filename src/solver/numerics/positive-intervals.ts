// Where is a smooth function of time positive? Sampled on a grid whose steps each hold at most one
// extremum of the function (the caller argues its step), with the function's rate at the samples:
// - a sign change between two samples is a crossing, refined by a bracketed root;
// - no sign change but the rate going from + to - is a maximum inside the step: it is found by
//   golden-section search, and when it is positive the short interval around it is kept, so an
//   interval shorter than a step is not missed.
// Used by the pass search (above the horizon mask) and the eclipse search (inside the shadow).

import { goldenSectionMax } from './golden-section.js';
import { illinoisRoot } from './illinois.js';

/** An interval where the function is positive; the flags say it is clipped at the grid's ends. */
export interface PositiveInterval {
  readonly start: number;
  readonly stop: number;
  readonly startsBefore: boolean;
  readonly endsAfter: boolean;
}

export interface PositiveIntervalSearch<T> {
  /** Sample times, increasing. */
  readonly times: ArrayLike<number>;
  /** The evaluation at sample k (callers cache it). */
  readonly sample: (k: number) => T;
  /** True when step k (times k to k+1) cannot hold a positive value; skipped unless an interval is open. */
  readonly ruledOut?: (k: number) => boolean;
  /** The evaluation at any time of the grid's span (refinement); needed unless valueAt is given. */
  readonly at?: (t: number) => T;
  /** value(at(t)), the same number, computed directly where that is cheaper; wins over `at`. */
  readonly valueAt?: (t: number) => number;
  readonly value: (x: T) => number;
  readonly rate: (x: T) => number;
  /** Flags given to intervals positive at the first or the last sample. */
  readonly edges: { readonly startsBefore: boolean; readonly endsAfter: boolean };
  /** Crossing tolerance, s. */
  readonly rootTolS: number;
  /** Tolerance of the maximum search inside a step, s. */
  readonly peakTolS: number;
}

/** The positive intervals of the function, in time order. */
export function positiveIntervals<T>(s: PositiveIntervalSearch<T>): PositiveInterval[] {
  const { times, sample, value, rate } = s;
  const out: PositiveInterval[] = [];
  const at = s.at;
  const fn = s.valueAt ?? (at ? (t: number): number => value(at(t)) : undefined);
  if (!fn) throw new TypeError('positiveIntervals needs at or valueAt');
  const count = times.length;
  let open: { start: number; startsBefore: boolean } | undefined;
  for (let k = 0; k + 1 < count; k++) {
    if (!open && s.ruledOut?.(k)) continue;
    const xa = sample(k);
    const xb = sample(k + 1);
    const ta = times[k]!;
    const tb = times[k + 1]!;
    const fa = value(xa);
    const fb = value(xb);
    if (k === 0 && fa > 0) open = { start: ta, startsBefore: s.edges.startsBefore };
    if (fa > 0 && fb <= 0) {
      const stop = illinoisRoot(fn, ta, tb, fa, fb, s.rootTolS);
      out.push({ start: open?.start ?? ta, stop, startsBefore: open?.startsBefore ?? false, endsAfter: false });
      open = undefined;
    } else if (fa <= 0 && fb > 0) {
      open = { start: illinoisRoot(fn, ta, tb, fa, fb, s.rootTolS), startsBefore: false };
    } else if (fa <= 0 && fb <= 0 && rate(xa) > 0 && rate(xb) < 0) {
      const peak = goldenSectionMax(fn, ta, tb, s.peakTolS); // a maximum between two samples
      if (peak.value > 0) {
        const start = illinoisRoot(fn, ta, peak.t, fa, peak.value, s.rootTolS);
        out.push({ start, stop: illinoisRoot(fn, peak.t, tb, peak.value, fb, s.rootTolS), startsBefore: false, endsAfter: false });
      }
    }
  }
  if (open) out.push({ start: open.start, stop: times[count - 1]!, startsBefore: open.startsBefore, endsAfter: s.edges.endsAfter });
  return out;
}
