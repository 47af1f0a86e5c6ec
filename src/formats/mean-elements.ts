// A catalogue element set as read from a two-line set (tle.ts) or a CCSDS OMM (omm.ts): the mean
// elements as given, in the units of their formats (rev/day, deg, 1/earth radii), and the plain
// data the SGP4 propagator is built from.

import type { Sgp4ElementSet } from '../solver/propagation/sgp4.js';

export interface MeanElementSet {
  readonly format: 'tle' | 'omm';
  readonly name: string | null;
  /** Catalogue number as a number (Alpha-5 letters decoded: A = 10 ... Z = 33, I and O skipped). */
  readonly catalogNumber: number;
  /** Catalogue number as written (Alpha-5 kept). */
  readonly catalogId: string;
  /** International designator (launch year, number, piece) as written, or null when blank. */
  readonly internationalDesignator: string | null;
  readonly classification: string | null;
  /** Element epoch, TT seconds since J2000 (the set's epoch is UTC). */
  readonly epochTT: number;
  readonly meanMotion: number;
  readonly eccentricity: number;
  readonly inclination: number;
  readonly raan: number;
  readonly argPerigee: number;
  readonly meanAnomaly: number;
  /** B*, 1/earth radii. */
  readonly bstar: number;
  /** First derivative of the mean motion divided by 2, rev/day^2 (as the formats give it). */
  readonly meanMotionDot: number;
  /** Second derivative of the mean motion divided by 6, rev/day^3. */
  readonly meanMotionDdot: number;
  readonly elementSetNumber: number | null;
  readonly revolutionNumber: number | null;
  /** The plain data the SGP4 propagator is built from. */
  readonly sgp4: Sgp4ElementSet;
}

export interface ElementIssue {
  /** Where: 'line1', 'line2', a keyword, or '' for the whole message. */
  readonly path: string;
  readonly message: string;
}

export type ElementsRead =
  | { readonly ok: true; readonly value: MeanElementSet }
  | { readonly ok: false; readonly unsupported: boolean; readonly issues: readonly ElementIssue[] };

/** Alpha-5 letters (A = 10 ... Z = 33, I and O not used); common practice of catalogue numbers beyond 99999, no source. */
export const ALPHA5 = 'ABCDEFGHJKLMNPQRSTUVWXYZ';
