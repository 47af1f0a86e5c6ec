// Scenario hash: SHA-256 of the canonical JSON (RFC 8785: keys sorted, numbers in their shortest
// JSON form) of { kind, solverVersion, scenario }, where the scenario is the validated request
// with its defaults filled. Same scenario -> same hash, whatever the key order of the request.
import { createHash } from 'node:crypto';
import canonicalize from 'canonicalize';
import { SOLVER_VERSION } from '../solver/core/version.js';

/** Every kind of scenario the service solves: one per solving endpoint (POST /v1/<kind>), also the kinds of batch items. */
export const SCENARIO_KINDS = ['orbit', 'two-body', 'central-force', 'track', 'passes', 'eclipses'] as const;
export type ScenarioKind = (typeof SCENARIO_KINDS)[number];

export function canonicalJson(value: unknown): string {
  const text = canonicalize(value);
  if (text === undefined) throw new TypeError('scenario is not JSON-serialisable');
  return text;
}

export function scenarioHash(kind: ScenarioKind, scenario: unknown): string {
  return createHash('sha256').update(canonicalJson({ kind, solverVersion: SOLVER_VERSION, scenario })).digest('hex');
}

