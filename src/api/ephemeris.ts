// Ephemeris orbits at the edge: a request's ephemeris.oem -> the solver's Ephemeris (src/formats/oem-read.ts
// reads it; every segment's nodes brought to GCRF with the request's Earth orientation), the file's
// problems -> 422 answers naming the line, and the interpolation report -> the answers' diagnostics.
import { ProblemError } from '../errors.js';
import { BODIES, type CentralBody } from '../solver/bodies/bodies.js';
import type { FrameOptions } from '../solver/earth/frames.js';
import { nodesToGcrf, type NodeFrame } from '../solver/earth/state-frames.js';
import { firstNode, type Ephemeris, type EphemerisSegment, type InterpolationReport } from '../solver/propagation/ephemeris.js';
import { formatUtcIso } from '../solver/time/time.js';
import { readOem, type OemFrame, type OemSegment } from '../formats/oem-read.js';
import type { Vec3 } from '../solver/core/vec3.js';
import type { InterpolationDiagnostics } from '../schemas/ephemeris.js';
import type { OrbitInputFields } from '../schemas/orbit.js';

/** What the answers say of each segment beside the solver's report (plain data: it travels with jobs). */
export interface SegmentInfo {
  readonly refFrame: string;
  readonly timeSystem: string;
  readonly nodes: number;
  readonly degreeFromFile: boolean;
}

export interface EphemerisOrbit {
  readonly ephemeris: Ephemeris;
  readonly info: readonly SegmentInfo[];
}

const NODE_FRAME: Readonly<Record<OemFrame, NodeFrame>> = { GCRF: 'gcrf', ICRF: 'icrf', EME2000: 'eme2000', ITRF: 'itrf', TEME: 'teme' };

const oemProblem = (code: 'oem-malformed' | 'oem-unsupported' | 'limit-exceeded', message: string): ProblemError =>
  new ProblemError(code, `ephemeris.oem ${message}`, { errors: [{ path: 'body.ephemeris.oem', message }] });

function segmentOf(s: OemSegment, frame: FrameOptions): EphemerisSegment {
  const m = s.meta;
  const n = s.epochsTT.length;
  const startTT = Math.max(m.useableStartTT, s.epochsTT[0]!);
  const stopTT = Math.min(m.useableStopTT, s.epochsTT[n - 1]!);
  if (!(stopTT >= startTT)) {
    throw oemProblem('oem-malformed', `line ${s.line}: the segment's useable span (${formatUtcIso(m.useableStartTT)} to ${formatUtcIso(m.useableStopTT)}) holds no part of its data lines (${formatUtcIso(s.epochsTT[0]!)} to ${formatUtcIso(s.epochsTT[n - 1]!)})`);
  }
  const g = nodesToGcrf(NODE_FRAME[m.refFrame], s.epochsTT, s.states, s.accelerations, frame);
  return { epochsTT: s.epochsTT, states: g.states, accelerations: g.accelerations, method: m.interpolation === 'HERMITE' ? 'hermite' : 'lagrange', degree: m.degree, startTT, stopTT };
}

/**
 * The ephemeris of a request (undefined without one), with its model checked: the ephemeris model
 * interpolates an ephemeris orbit and nothing else. A malformed file throws its 422 problem.
 */
export function ephemerisOrbit(req: OrbitInputFields & { model?: string }, body: CentralBody, frame: FrameOptions): EphemerisOrbit | undefined {
  if (!req.ephemeris) {
    if (req.model === 'ephemeris') throw new ProblemError('invalid-parameter', 'model ephemeris interpolates a given ephemeris: give the orbit as ephemeris.oem (or choose another model)');
    return undefined;
  }
  if (req.model !== undefined && req.model !== 'ephemeris') {
    throw new ProblemError('invalid-parameter', `an ephemeris orbit is interpolated (model ephemeris), not propagated: model ${req.model} does not apply to it`);
  }
  if (body !== BODIES.earth) throw new ProblemError('invalid-parameter', 'an ephemeris orbit (OEM, CENTER_NAME EARTH) is about the Earth: centralBody must be the built-in "earth"');
  const read = readOem(req.ephemeris.oem);
  if (!read.ok) throw oemProblem(read.code, read.message);
  const segments = read.value.segments;
  return {
    ephemeris: { segments: segments.map((s) => segmentOf(s, frame)) },
    info: segments.map((s) => ({ refFrame: s.meta.refFrameText, timeSystem: s.meta.timeSystem, nodes: s.epochsTT.length, degreeFromFile: s.meta.degreeGiven })),
  };
}

/** The spans (TT) of the segments whose nodes were Earth-fixed or TEME (they used the Earth orientation). */
export function earthFixedNodeSpans(e: EphemerisOrbit): Array<[number, number]> {
  return e.ephemeris.segments.flatMap((s, i) => (/^(ITRF|TEME)/.test(e.info[i]!.refFrame) ? [[s.epochsTT[0]!, s.epochsTT[s.epochsTT.length - 1]!] as [number, number]] : []));
}

/** The initial state of an ephemeris orbit: its first node (GCRF). */
export const ephemerisInitialState = (e: EphemerisOrbit): { r: Vec3; v: Vec3; epochTT: number } => firstNode(e.ephemeris);

/** The answers' interpolation diagnostics: the solver's report with what the file said of each segment. */
export function interpolationDiagnostics(report: InterpolationReport, info: readonly SegmentInfo[]): InterpolationDiagnostics {
  return {
    segments: report.segments.map((s, i) => ({
      start: formatUtcIso(s.startTT),
      stop: formatUtcIso(s.stopTT),
      refFrame: info[i]!.refFrame,
      timeSystem: info[i]!.timeSystem,
      nodes: info[i]!.nodes,
      method: s.method,
      degreeAsked: s.degreeAsked,
      degreeFromFile: info[i]!.degreeFromFile,
      degree: s.degree,
      nodesPerSample: s.nodesPerSample,
      usesAccelerations: s.usesAccelerations,
    })),
    maxPositionErrorEstimate: report.maxPositionErrorKm,
  };
}
