// Request bodies and ids before any route sees them:
// - JSON bodies are scanned before parsing: nesting deeper than MAX_JSON_DEPTH answers 400
//   json-too-deep (deep nesting overflows the stack of recursive code further on); after parsing,
//   any string (or key) holding a lone UTF-16 surrogate answers 400 validation-failed with its
//   path: such text has no UTF-8 form, cannot be canonicalised for the scenario hash and would
//   reach every free-text field (names, ids, labels, unit labels, batch items).
// - A body not received within BODY_TIMEOUT_S answers 408 request-timeout and the connection closes
//   (no timer when the whole body is already in memory: it cannot stall).
// - A shortcut (app.bodyShortcut: the request memo, src/plugins/memo.ts) may take the body text
//   before it is scanned and parsed: a request whose exact bytes were answered before skips both.
// - Request ids: a client's x-request-id is kept when it is short and plain, else replaced.
import { randomBytes } from 'node:crypto';
import type { IncomingMessage } from 'node:http';
import fp from 'fastify-plugin';
import type { FastifyInstance, FastifyRequest } from 'fastify';
import { ProblemError, type FieldIssue } from '../errors.js';
import { MAX_LISTED_ISSUES } from '../schemas/list.js';

const OPEN_BRACE = 0x7b;
const OPEN_BRACKET = 0x5b;
const CLOSE_BRACE = 0x7d;
const CLOSE_BRACKET = 0x5d;
const QUOTE = 0x22;
const BACKSLASH = 0x5c;

/** The deepest nesting of objects and arrays in JSON text (strings skipped); stops counting past `limit`. */
export function jsonDepth(text: string, limit: number): number {
  let depth = 0;
  let deepest = 0;
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (c === QUOTE) {
      for (i++; i < text.length; i++) {
        const d = text.charCodeAt(i);
        if (d === BACKSLASH) i++;
        else if (d === QUOTE) break;
      }
    } else if (c === OPEN_BRACE || c === OPEN_BRACKET) {
      if (++depth > deepest) {
        deepest = depth;
        if (deepest > limit) return deepest;
      }
    } else if (c === CLOSE_BRACE || c === CLOSE_BRACKET) {
      depth--;
    }
  }
  return deepest;
}

/** A \uD800-\uDFFF escape in JSON text: the only way a lone surrogate gets into a parsed string. */
const SURROGATE_ESCAPE = /\\u[dD][89a-fA-F]/;

/** A high surrogate not followed by a low one, or a low one not preceded by a high one. */
const LONE_SURROGATE = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;
/** True when the text is well-formed UTF-16 (String.prototype.isWellFormed, ES2024). */
export const wellFormed = (text: string): boolean => !LONE_SURROGATE.test(text);

/** Paths (body.a.0.b) of strings and keys holding a lone surrogate, at most MAX_LISTED_ISSUES. */
export function illFormedStrings(value: unknown, root = 'body'): FieldIssue[] {
  const found: FieldIssue[] = [];
  const stack: [unknown, string][] = [[value, root]];
  const message = 'text holds a lone UTF-16 surrogate (not valid Unicode); send well-formed text';
  while (stack.length > 0 && found.length < MAX_LISTED_ISSUES) {
    const [v, path] = stack.pop()!;
    if (typeof v === 'string') {
      if (!wellFormed(v)) found.push({ path, message });
    } else if (Array.isArray(v)) {
      for (let i = v.length - 1; i >= 0; i--) stack.push([v[i], `${path}.${i}`]);
    } else if (v !== null && typeof v === 'object') {
      for (const [k, inner] of Object.entries(v)) {
        if (!wellFormed(k)) found.push({ path: `${path}.${k.replace(LONE_SURROGATE, '\uFFFD')}`, message });
        stack.push([inner, `${path}.${k}`]);
      }
    }
  }
  return found;
}

/** Client request ids are kept when 1-128 characters of letters, digits and . _ : / -; anything else is replaced. */
const REQUEST_ID = /^[A-Za-z0-9._:/-]{1,128}$/;

/**
 * Fastify's genReqId: ids made here are `<boot>-<n>` (the boot tag differs per process start, so
 * ids from different runs never meet); a client's own id is kept when it is plain and short.
 */
export function requestIds(): (req: IncomingMessage) => string {
  const boot = randomBytes(4).toString('hex');
  let n = 0;
  return (req) => {
    const given = req.headers['x-request-id'];
    if (typeof given === 'string' && REQUEST_ID.test(given)) return given;
    return `${boot}-${(++n).toString(36)}`;
  };
}

/**
 * Takes a JSON body's text before it is scanned and parsed: resolves true when it has answered for
 * the request (the request then carries what to send, and the body given to the route is
 * SHORTCUT_BODY, never validated), false to let the body be parsed as usual.
 */
export type BodyShortcut = (request: FastifyRequest, text: string) => Promise<boolean>;

/** The parsed body of a request a BodyShortcut took: the hook that answers it runs before validation. */
export const SHORTCUT_BODY: unique symbol = Symbol('body taken by a shortcut');

/** True when the whole body (a Content-Length body) is already in the request stream's buffer. */
function bodyInMemory(raw: IncomingMessage): boolean {
  const length = raw.headers['content-length'];
  return length !== undefined && raw.headers['transfer-encoding'] === undefined && raw.readableLength >= Number(length);
}

export default fp(async function body(app: FastifyInstance) {
  const maxDepth = app.config.MAX_JSON_DEPTH;
  const bodyTimeoutMs = app.config.BODY_TIMEOUT_S * 1000;
  const parseJson = app.getDefaultJsonParser('error', 'error');

  app.decorate('bodyShortcut', null);
  // JSON only: fastify's own text/plain parser would hand a string to the schema (a 400 "expected
  // object"); without it a text body is 415 unsupported-media-type like any other type.
  app.removeContentTypeParser('text/plain');
  app.removeContentTypeParser('application/json');
  app.addContentTypeParser('application/json', { parseAs: 'string' }, (request, text, done) => {
    const json = text as string;
    const shortcut = app.bodyShortcut;
    if (shortcut === null) return parse(request, json, done);
    shortcut(request, json).then(
      (taken) => (taken ? done(null, SHORTCUT_BODY) : parse(request, json, done)),
      (error: unknown) => done(error instanceof Error ? error : new Error(String(error)), undefined),
    );
  });

  /** The depth scan, the parse and the surrogate check of a JSON body. */
  function parse(request: FastifyRequest, json: string, done: (error: Error | null, value?: unknown) => void): void {
    if (jsonDepth(json, maxDepth) > maxDepth) {
      done(new ProblemError('json-too-deep', `objects and arrays are nested deeper than ${maxDepth} levels (MAX_JSON_DEPTH)`), undefined);
      return;
    }
    parseJson(request, json, (error, value) => {
      if (error) return done(error, undefined);
      if (SURROGATE_ESCAPE.test(json)) {
        const errors = illFormedStrings(value);
        if (errors.length > 0) {
          const summary = errors.slice(0, 3).map((e) => e.path).join(', ');
          return done(new ProblemError('validation-failed', `The request does not match the schema: text with a lone UTF-16 surrogate at ${summary}`, { errors }), undefined);
        }
      }
      done(null, value);
    });
  }

  // A body that stalls is cut off: the stream ends in a 408 problem and the connection closes.
  app.addHook('preParsing', async (request, _reply, payload) => {
    if (payload === request.raw && bodyInMemory(request.raw)) return payload;
    // The reader (fastify's body collector) is told by an 'error' event, not by destroying the
    // stream: destroying it would close the socket before the 408 is written. The answer then
    // carries `connection: close`.
    const timer = setTimeout(() => {
      const error = new ProblemError('request-timeout', `the body was not received within ${app.config.BODY_TIMEOUT_S} s (BODY_TIMEOUT_S); the connection is closed`);
      if (payload.listenerCount('error') > 0) payload.emit('error', error);
      else payload.destroy(error);
    }, bodyTimeoutMs);
    timer.unref();
    const clear = () => clearTimeout(timer);
    payload.once('end', clear);
    payload.once('close', clear);
    payload.once('error', clear);
    request.raw.once('close', clear);
    return payload;
  });
}, { name: 'body' });

declare module 'fastify' {
  interface FastifyInstance {
    /** Set by the request memo when it is on; null otherwise. */
    bodyShortcut: BodyShortcut | null;
  }
}
