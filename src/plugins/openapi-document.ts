// The answers every operation shares, added to the generated OpenAPI document in one place, so a
// client generated from it knows them: the service-wide problems (API keys, rate limits, overload,
// shutdown, body limits) and, for the computed answers, 304, 406 and 504. Each is a problem
// document (application/problem+json) with the Problem component schema; route-specific problems
// stay declared beside their routes.
import { PROBLEM_MEDIA_TYPE } from '../schemas/common.js';

type JsonObject = Record<string, unknown>;

/** The Problem component, as the document references it. */
const PROBLEM_REF = { $ref: '#/components/schemas/Problem' };

const retryAfter = { 'retry-after': { type: 'integer', minimum: 1, description: 'Seconds to wait before retrying' } };

const problem = (description: string, headers?: JsonObject): JsonObject => ({
  description,
  ...(headers ? { headers } : {}),
  content: { [PROBLEM_MEDIA_TYPE]: { schema: PROBLEM_REF } },
});

/** Operations whose answer is computed, cached under its scenario hash and negotiated by Accept. */
export const COMPUTED_ANSWERS: ReadonlySet<string> = new Set([
  'solveOrbit', 'propagateTrack', 'findPasses', 'findEclipses', 'reduceTwoBody', 'solveCentralForce',
]);

/** Responses to add to one operation (never replacing one its route declares). */
export function sharedResponses(method: string, url: string, operationId: string | undefined): Record<string, JsonObject> {
  const out: Record<string, JsonObject> = {};
  const guarded = url.startsWith('/v1/') || url === '/metrics';
  if (guarded) {
    out['401'] = problem('unauthorized: API keys are configured and the Authorization: Bearer key is missing or not valid (see WWW-Authenticate)', {
      'www-authenticate': { type: 'string', description: 'Bearer realm, with error="invalid_token" when a key was given but is not valid (RFC 6750)' },
    });
  }
  if (url.startsWith('/v1/')) {
    out['429'] = problem('rate-limited: this key (or address) spent its budget for the minute', {
      ...retryAfter,
      'ratelimit-limit': { type: 'integer', description: 'Requests allowed per window' },
      'ratelimit-remaining': { type: 'integer', description: 'Requests left in this window' },
      'ratelimit-reset': { type: 'integer', description: 'Seconds until the window resets' },
    });
    out['503'] = problem('overloaded, shutting-down, worker-failed or queue-unavailable: retry after the seconds in Retry-After', retryAfter);
  }
  if (method === 'POST') {
    out['408'] = problem('request-timeout: the body did not arrive within BODY_TIMEOUT_S');
    out['413'] = problem('body-too-large: the body exceeds BODY_LIMIT_BYTES');
    out['415'] = problem('unsupported-media-type: bodies are application/json');
  }
  if (operationId !== undefined && (COMPUTED_ANSWERS.has(operationId) || operationId === 'getResult')) {
    out['304'] = { type: 'null', description: 'Not modified: If-None-Match holds this answer\'s ETag (its scenario hash); no body' };
    out['406'] = problem('not-acceptable: Accept admits none of the formats this operation produces');
  }
  if (operationId !== undefined && COMPUTED_ANSWERS.has(operationId)) {
    out['504'] = problem('deadline-exceeded: the computation ran past REQUEST_DEADLINE_S and was stopped; nothing was stored');
  }
  return out;
}

interface TransformedRoute { schema: JsonObject & { response?: Record<string, unknown>; operationId?: string; hide?: boolean }; url: string }

/** Wraps the Zod transform of each route: adds the shared responses after the route's own. */
export function withSharedResponses<T extends { url: string; route?: { method?: string | string[] } }>(
  transform: (doc: T) => unknown,
) {
  return (doc: T): TransformedRoute => {
    const result = transform(doc) as TransformedRoute;
    const { schema } = result;
    if (!schema || schema.hide) return result;
    const method = String(Array.isArray(doc.route?.method) ? doc.route.method[0] : doc.route?.method ?? 'GET').toUpperCase();
    const own = schema.response ?? {};
    const shared = sharedResponses(method, doc.url, schema.operationId);
    const response: Record<string, unknown> = {};
    for (const code of [...new Set([...Object.keys(own), ...Object.keys(shared)])].sort()) response[code] = own[code] ?? shared[code];
    return { ...result, schema: { ...schema, response } };
  };
}

const REF_PREFIX = '#/components/schemas/';
const INPUT_SUFFIX = 'Input';

/** Every $ref name under value, with its count. */
function countRefs(value: unknown, counts: Map<string, number>): void {
  if (Array.isArray(value)) { for (const v of value) countRefs(v, counts); return; }
  if (value === null || typeof value !== 'object') return;
  for (const [k, v] of Object.entries(value)) {
    if (k === '$ref' && typeof v === 'string' && v.startsWith(REF_PREFIX)) {
      const name = v.slice(REF_PREFIX.length);
      counts.set(name, (counts.get(name) ?? 0) + 1);
    } else countRefs(v, counts);
  }
}

/** A copy of value with the $refs renamed by rename. */
function renameRefs(value: unknown, rename: (name: string) => string): unknown {
  if (Array.isArray(value)) return value.map((v) => renameRefs(v, rename));
  if (value === null || typeof value !== 'object') return value;
  const out: JsonObject = {};
  for (const [k, v] of Object.entries(value)) {
    out[k] = k === '$ref' && typeof v === 'string' && v.startsWith(REF_PREFIX)
      ? REF_PREFIX + rename(v.slice(REF_PREFIX.length))
      : renameRefs(v, rename);
  }
  return out;
}

/**
 * The Zod transform names the request-side variant of every registered schema `<id>Input` beside
 * the answer-side `<id>`. Clients should see one name per type: where only one variant is used it
 * takes the plain name, where both are used and say the same they become one, and components
 * nothing refers to are dropped. Only names differ: no schema is changed.
 */
export function tidyComponents<T extends JsonObject>(document: T): T {
  let doc = document as JsonObject;
  for (;;) {
    const schemas = ((doc.components as JsonObject | undefined)?.schemas ?? {}) as Record<string, unknown>;
    const counts = new Map<string, number>();
    countRefs({ ...doc, components: { ...(doc.components as JsonObject), schemas: {} } }, counts);
    for (const def of Object.values(schemas)) countRefs(def, counts);
    const plain = (name: string) => (name.endsWith(INPUT_SUFFIX) && name.slice(0, -INPUT_SUFFIX.length) in schemas ? name.slice(0, -INPUT_SUFFIX.length) : name);
    const renames = new Map<string, string>();
    const drop = new Set<string>();
    for (const name of Object.keys(schemas)) {
      if ((counts.get(name) ?? 0) === 0) { drop.add(name); continue; }
      const base = plain(name);
      if (base === name) continue;
      const baseUsed = (counts.get(base) ?? 0) > 0;
      const same = JSON.stringify(renameRefs(schemas[name], plain)) === JSON.stringify(renameRefs(schemas[base], plain));
      if (!baseUsed || same) renames.set(name, base);
    }
    if (renames.size === 0 && drop.size === 0) return doc as T;
    const kept: Record<string, unknown> = {};
    for (const [name, def] of Object.entries(schemas)) {
      if (drop.has(name) || renames.has(name)) continue;
      kept[name] = def;
    }
    for (const [from, to] of renames) if (!(to in kept)) kept[to] = schemas[from];
    const rename = (name: string) => renames.get(name) ?? name;
    doc = renameRefs({ ...doc, components: { ...(doc.components as JsonObject), schemas: kept } }, rename) as JsonObject;
  }
}
