// Scenario hash: SHA-256 of the canonical JSON (RFC 8785: keys sorted, numbers in their shortest
// JSON form) of { kind, solverVersion, scenario }, where the scenario is the validated request
// with its defaults filled. Same scenario -> same hash, whatever the key order of the request.
import { createHash } from 'node:crypto';
import canonicalize from 'canonicalize';
import { SOLVER_VERSION } from '../solver/core/version.js';

export type ScenarioKind = 'orbit' | 'two-body' | 'central-force' | 'track' | 'passes';

export function canonicalJson(value: unknown): string {
  const text = canonicalize(value);
  if (text === undefined) throw new TypeError('scenario is not JSON-serialisable');
  return text;
}

export function scenarioHash(kind: ScenarioKind, scenario: unknown): string {
  return createHash('sha256').update(canonicalJson({ kind, solverVersion: SOLVER_VERSION, scenario })).digest('hex');
}

export const SCENARIO_HASH_PATTERN = /^[0-9a-f]{64}$/;
