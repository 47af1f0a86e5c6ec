// The fast path of repeated requests. A POST to a solving endpoint whose exact bytes were answered
// before (route, body text, and the headers an answer depends on) is answered from the cache under
// the scenario hash remembered for them, before the body is validated, canonicalised and hashed.
// The key check, rate limits and overload refusals run first (onRequest hooks): the memo is looked
// up when the body's text has arrived, before it is scanned for depth and parsed (app.bodyShortcut,
// src/plugins/body.ts), and a hit is answered in preValidation. The key holds the caller's key id,
// the media types asked and the encodings accepted, so a memo entry serves only the request that
// made it. Only 200 answers of the answer pipeline (their ETag is the scenario hash) are
// remembered, under the solver version in force (src/cache/request-memo.ts); a remembered hash
// whose answer is no longer cached falls through to the full path (the body is then parsed).
// If-None-Match is honoured on the fast path as on the full one.
import fp from 'fastify-plugin';
import type { FastifyInstance, FastifyReply, FastifyRequest } from 'fastify';
import { memoKey, RequestMemo } from '../cache/request-memo.js';
import { SOLVER_VERSION } from '../solver/core/version.js';
import { etagOf, ifNoneMatchHits } from './answers.js';
import type { CachedAnswer } from '../cache/types.js';

/** The routes answered through app.answers (their 200 answers carry the scenario hash as ETag). */
export const MEMO_ROUTES = new Set(['/v1/orbit', '/v1/track', '/v1/passes', '/v1/eclipses', '/v1/two-body', '/v1/central-force']);
const SCENARIO_ETAG = /^"([0-9a-f]{64})"$/;
/** Most entries of the memo. */
const MEMO_MAX_ENTRIES = 10_000;

const header = (request: FastifyRequest, name: string): string => {
  const v = request.headers[name];
  return v === undefined ? '' : Array.isArray(v) ? v.join('\n') : v;
};

/** Everything a solving route's answer depends on, in a fixed order. */
function requestKey(request: FastifyRequest, body: string): string {
  return memoKey([
    request.method,
    request.routeOptions.url ?? '',
    header(request, 'content-type'),
    header(request, 'accept'),
    header(request, 'accept-encoding'),
    request.callerId ?? '',
    body,
  ]);
}

export interface MemoOptions {
  /** Bytes the memo may hold (keys and entries); 0 turns it off. */
  maxBytes: number;
}

export default fp(async function memo(app: FastifyInstance, opts: MemoOptions) {
  if (opts.maxBytes <= 0) return;
  const memo = new RequestMemo({ maxEntries: MEMO_MAX_ENTRIES, maxBytes: opts.maxBytes, solverVersion: () => {
    // A new EOP table makes the remembered hashes of the old one stale (they carry its digest).
    const digest = app.eop.current()?.digest;
    return digest ? `${SOLVER_VERSION}+eop:${digest}` : SOLVER_VERSION;
  } });
  app.decorate('requestMemo', memo);
  app.decorateRequest('memoKey', null);
  app.decorateRequest('memoAnswer', null);

  // The body's text, before it is parsed: a remembered request takes its answer here (or its 304).
  app.bodyShortcut = async (request: FastifyRequest, body: string): Promise<boolean> => {
    if (request.method !== 'POST' || !MEMO_ROUTES.has(request.routeOptions.url ?? '') || !memo.fits(body.length + 1024)) return false;
    const key = requestKey(request, body);
    request.memoKey = key;
    const hash = memo.get(key);
    if (hash === undefined) return false;
    if (ifNoneMatchHits(request.headers['if-none-match'], hash)) {
      request.memoAnswer = { hash, stored: null };
      return true;
    }
    const stored = await app.answers.cache.get(hash);
    if (!stored) return false; // evicted: the body is parsed and the full path solves and stores it again
    request.memoAnswer = { hash, stored };
    return true;
  };

  // Before validation: the body of a request taken above is not a scenario (SHORTCUT_BODY).
  app.addHook('preValidation', async (request: FastifyRequest, reply: FastifyReply) => {
    const hit = request.memoAnswer;
    if (!hit) return; // null, or undefined on routes registered before this plugin (/docs)
    if (hit.stored === null) reply.code(304).header('etag', etagOf(hit.hash)).send();
    else app.answers.sendStored(request, reply, hit.hash, hit.stored, 'hit');
    return reply;
  });

  app.addHook('onSend', async (request: FastifyRequest, reply: FastifyReply, payload: unknown) => {
    if (request.memoKey === null || reply.statusCode !== 200 || reply.getHeader('x-cache') === undefined) return payload;
    const etag = SCENARIO_ETAG.exec(String(reply.getHeader('etag') ?? ''));
    if (etag) memo.set(request.memoKey, etag[1]!);
    return payload;
  });

  app.addHook('onClose', async () => memo.clear());
}, { name: 'memo', dependencies: ['answers', 'auth', 'body'] });

declare module 'fastify' {
  interface FastifyInstance {
    /** The request memo; absent when REQUEST_MEMO_MAX_BYTES is 0. */
    requestMemo?: RequestMemo;
  }
  interface FastifyRequest {
    /** This request's memo key, when it was looked up. */
    memoKey: string | null;
    /** The answer the memo found for this request (stored null: a 304), when it found one. */
    memoAnswer: { readonly hash: string; readonly stored: CachedAnswer | null } | null;
  }
}
