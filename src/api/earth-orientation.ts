// The Earth orientation a request is solved with: its explicit UT1 - UTC wins; otherwise the
// values come from the service's IERS table (EOP_FILE, src/plugins/eop.ts) where it covers the
// epoch, else 0. Polar motion and the celestial pole offsets dX, dY come from the table whenever it
// covers the epoch (a request cannot give them). With a table in force:
// - its digest joins the scenario of every answer about the Earth (so a new table never serves an
//   answer computed with the old one: `withTableDigest`);
// - the answers that used it say so in diagnostics.earthOrientation, with a warning when some epoch
//   lay outside the table (values 0 there), never silently.
// Without EOP_FILE nothing changes: no digest, no diagnostics (UT1 = UTC unless given, no polar motion).
import type { FrameOptions } from '../solver/earth/frames.js';
import { eopCoverage, eopLastMjd, eopSlice, mjdToIsoDate } from '../solver/time/eop.js';
import { formatUtcIso } from '../solver/time/time.js';
import type { EopState } from '../plugins/eop.js';
import type { EarthOrientationDiagnostics } from '../schemas/diagnostics.js';
import { earthFixedNodeSpans } from './ephemeris.js';
import type { InitialState } from './orbit.js';

/** The frame options of a request (plain data: they travel to the worker threads). */
export function frameOptions(ut1MinusUtc: number | undefined, eop?: EopState): FrameOptions {
  return { ...(ut1MinusUtc !== undefined ? { dut1: ut1MinusUtc } : {}), ...(eop ? { eop: eop.table } : {}) };
}

/** The frame options a worker job carries: the table cut to the rows of [startTT, stopTT] (a day of margin each side). */
export function forSpan(frame: FrameOptions, startTT: number, stopTT: number): FrameOptions {
  return frame.eop ? { ...frame, eop: eopSlice(frame.eop, startTT, stopTT) } : frame;
}

/** The scenario hashed: with a table in force, answers about the Earth carry its digest. */
export function withTableDigest<T extends object>(scenario: T, centralBody: unknown, eop: EopState | undefined): T {
  return eop && centralBody === 'earth' ? { ...scenario, earthOrientationTable: eop.digest } : scenario;
}

/** A span of TT epochs that used the Earth orientation, grown one epoch at a time. */
export class Span {
  lo = Infinity;
  hi = -Infinity;
  add(tt: number): this {
    if (tt < this.lo) this.lo = tt;
    if (tt > this.hi) this.hi = tt;
    return this;
  }
  addAll(epochs: ArrayLike<number>): this {
    for (let i = 0; i < epochs.length; i++) this.add(epochs[i]!);
    return this;
  }
  get empty(): boolean { return !(this.hi >= this.lo); }
}

/** The epochs at which an orbit input itself used the Earth orientation: an itrf or teme state's epoch, itrf or teme ephemeris nodes. */
export function inputSpan(req: { readonly state?: { readonly frame: string } | undefined }, start: InitialState, span = new Span()): Span {
  if (req.state?.frame === 'itrf' || req.state?.frame === 'teme') span.add(start.epochTT);
  if (start.ephemeris) for (const [lo, hi] of earthFixedNodeSpans(start.ephemeris)) span.add(lo).add(hi);
  return span;
}

/** diagnostics.earthOrientation of an answer whose epochs `span` used the table (undefined without a table or an empty span). */
export function earthOrientationDiagnostics(eop: EopState | undefined, span: Span, ut1MinusUtc: number | undefined): EarthOrientationDiagnostics | undefined {
  if (!eop || span.empty) return undefined;
  const t = eop.table;
  const c = eopCoverage(t, span.lo, span.hi);
  const lastObserved = Number.isNaN(t.lastObservedMjd) ? null : mjdToIsoDate(t.lastObservedMjd);
  return {
    source: 'EOP_FILE',
    tableDigest: eop.digest,
    firstDate: c.firstDate,
    lastObservedDate: lastObserved,
    lastPredictedDate: mjdToIsoDate(eopLastMjd(t)),
    ut1MinusUtc: ut1MinusUtc !== undefined ? 'request' : 'table',
    predicted: c.predicted,
    outsideTable: c.outside,
    ...(c.outside
      ? { warning: `epochs from ${formatUtcIso(span.lo)} to ${formatUtcIso(span.hi)} reach outside the EOP table (${c.firstDate} to ${c.lastDate}): there polar motion, dX, dY${ut1MinusUtc === undefined ? ' and UT1-UTC' : ''} are taken as 0` }
      : {}),
  };
}
