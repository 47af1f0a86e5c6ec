// The scenario -> cache -> solve pipeline shared by every solving route.
// Hash the normalised scenario; If-None-Match -> 304; cache hit -> stored bytes; miss -> produce, store, send.
// Single flight: requests for a scenario whose computation is already running wait for it instead
// of starting their own (100 identical requests cost one computation and one place in the pool's
// queue). The computation belongs to the flight, not to the request that started it: a client that
// goes away stops nothing, and every waiter gets the same answer, or the same failure.
import { Socket } from 'node:net';
import { Readable } from 'node:stream';
import { setImmediate as nextTurn } from 'node:timers/promises';
import fp from 'fastify-plugin';
import type { FastifyInstance, FastifyReply, FastifyRequest } from 'fastify';
import type { AnswerCache, CachedAnswer } from '../cache/types.js';
import type { Product } from '../formats/product.js';
import { OUTPUT_CHUNKS } from '../formats/chunk-pool.js';
import { JSON_MEDIA_TYPE } from '../formats/track-json.js';
import { scenarioHash, type ScenarioKind } from '../scenario/hash.js';
import { assertFinite } from '../api/finite.js';

export interface AnswerService {
  readonly cache: AnswerCache;
  respond(
    request: FastifyRequest,
    reply: FastifyReply,
    kind: ScenarioKind,
    scenario: unknown,
    produce: (hash: string) => CachedAnswer | Promise<CachedAnswer>,
  ): Promise<FastifyReply>;
  /**
   * Like respond, for big answers: the text is streamed chunk by chunk as it is formatted (never
   * held whole unless it is small enough to cache) and stored when complete. produce solves and
   * returns the formatter: each request sharing the computation calls it for its own chunks. The
   * formatter must do all checks that can fail before it returns: once streaming starts the status is 200.
   */
  respondStream(
    request: FastifyRequest,
    reply: FastifyReply,
    kind: ScenarioKind,
    scenario: unknown,
    produce: (hash: string) => Formatter | Promise<Formatter>,
  ): Promise<FastifyReply>;
  /** Computations running now, by scenario hash (each shared by every request that waits for it). */
  inFlight(): number;
  sendStored(request: FastifyRequest, reply: FastifyReply, hash: string, answer: CachedAnswer, cacheState: 'hit' | 'miss'): FastifyReply;
}

/** A streamed answer is a formatter's product: a media type and its chunks. */
export type StreamedAnswer = Product;
/** Gives a fresh streamed answer (its own chunks) from a finished computation, each time it is called. */
export type Formatter = () => StreamedAnswer;

declare module 'fastify' {
  interface FastifyInstance {
    answers: AnswerService;
  }
}

/** Pooled chunks an answer gives back at most (8 MiB): the rest of a longer answer is left to the garbage collector, so that answers in flight do not hold all their written chunks. */
const RETURNED_CHUNKS = 128;

/** Milliseconds of formatting a streamed answer does before it lets the event loop turn. */
export const SLICE_MS = 2;

/**
 * The chunks as bytes, read (and so formatted: the formatters are generators) in slices of about
 * sliceMs: after each slice the reading waits one turn of the event loop (setImmediate), so that
 * health checks and small requests are answered in between. Without it a socket that takes every
 * chunk at once (loopback, a fast client: the writes complete synchronously) lets a
 * 100,000-sample answer hold the loop for the whole of its formatting.
 */
export async function* inTurns(chunks: Iterable<string | Buffer> | AsyncIterable<string | Buffer>, sliceMs = SLICE_MS, now: () => number = () => performance.now()): AsyncGenerator<Buffer> {
  const slices = new Slices(sliceMs, now);
  for await (const chunk of chunks) {
    yield typeof chunk === 'string' ? Buffer.from(chunk) : chunk;
    if (slices.due()) await slices.turn();
  }
}

/** Buffer.concat(chunks, size) in slices (Slices): the copy of a 14 MB answer kept for the cache takes several ms, most of it first touches of the new pages. */
export async function concatInTurns(chunks: readonly Buffer[], size: number, slices = new Slices()): Promise<Buffer> {
  const out = Buffer.allocUnsafe(size);
  let offset = 0;
  for (const chunk of chunks) {
    offset += chunk.copy(out, offset);
    if (slices.due()) await slices.turn();
  }
  if (offset !== size) throw new RangeError(`the chunks hold ${offset} bytes, not ${size}`); // programmer error
  return out;
}

/** Main-thread work cut into slices of about sliceMs, with one turn of the event loop between them. */
export class Slices {
  #start: number;
  constructor(readonly sliceMs = SLICE_MS, readonly now: () => number = () => performance.now()) {
    this.#start = now();
  }

  /** True once the current slice has lasted sliceMs. */
  due(): boolean {
    return this.now() - this.#start >= this.sliceMs;
  }

  /** Wait one turn of the event loop (setImmediate); a new slice starts. */
  async turn(): Promise<void> {
    await nextTurn();
    this.#start = this.now();
  }
}

/**
 * jsonAnswer for an answer with one long list: head holds every field (the list empty, in its
 * place) and item(i) builds the list's items. The items are built, checked and written in slices
 * (Slices), so a large answer (a month of passes over a hundred stations: 7.6 MB) never holds the
 * event loop for its whole making. The same bytes as jsonAnswer({ ...head, [key]: items }), and the
 * same 422 naming the same first non-finite number.
 */
export async function jsonAnswerInTurns<T>(head: object, key: string, count: number, item: (i: number) => T, slices = new Slices()): Promise<CachedAnswer> {
  // JSON.stringify leaves out fields that are undefined; so does this.
  const entries = Object.entries(head).filter(([, v]) => v !== undefined);
  if (!entries.some(([k]) => k === key)) throw new TypeError(`the answer's head has no field ${key}`); // programmer error
  const parts: Buffer[] = [];
  let text = '{';
  for (let n = 0; n < entries.length; n++) {
    const [k, v] = entries[n]!;
    text += `${n > 0 ? ',' : ''}${JSON.stringify(k)}:`;
    if (k !== key) {
      assertFinite(v, `answer.${k}`);
      text += JSON.stringify(v);
      continue;
    }
    text += '[';
    for (let i = 0; i < count; i++) {
      const value = item(i);
      assertFinite(value, `answer.${key}.${i}`);
      text += (i > 0 ? ',' : '') + JSON.stringify(value);
      if (slices.due()) {
        parts.push(Buffer.from(text));
        text = '';
        await slices.turn();
      }
    }
    text += ']';
  }
  parts.push(Buffer.from(`${text}}`));
  return { body: Buffer.concat(parts), contentType: JSON_MEDIA_TYPE };
}

export const etagOf = (hash: string): string => `"${hash}"`;

/** RFC 9110 sec. 13.1.2: If-None-Match matches on `*` or any listed entity tag (weak comparison). */
export function ifNoneMatchHits(header: string | undefined, hash: string): boolean {
  if (!header) return false;
  if (header.trim() === '*') return true;
  return header.split(',').some((tag) => tag.trim().replace(/^W\//, '') === etagOf(hash));
}

/** A JSON answer's bytes; refuses (422 non-finite-result, naming the field) a value JSON would print as null. */
export function jsonAnswer(value: unknown): CachedAnswer {
  assertFinite(value);
  return { body: Buffer.from(JSON.stringify(value)), contentType: JSON_MEDIA_TYPE };
}

export interface AnswersOptions {
  cache: AnswerCache;
  /** Streamed answers longer than this are sent but not stored. */
  maxStoredBytes: number;
}

export default fp(async function answers(app: FastifyInstance, opts: AnswersOptions) {
  const { cache, maxStoredBytes } = opts;
  // Running computations by scenario hash; an entry leaves when its computation settles.
  const flights = new Map<string, Promise<CachedAnswer>>();
  const streamFlights = new Map<string, Promise<Formatter>>();

  /** The running computation of hash, or a new one started with start. */
  function shared<T>(table: Map<string, Promise<T>>, hash: string, start: () => Promise<T>): Promise<T> {
    const running = table.get(hash);
    if (running) return running;
    const flight = start();
    table.set(hash, flight);
    const leave = () => { table.delete(hash); };
    flight.then(leave, leave);
    return flight;
  }

  const headers = (reply: FastifyReply, hash: string, cacheState: 'hit' | 'miss', contentType: string): FastifyReply =>
    reply
      .header('etag', etagOf(hash))
      .header('content-location', `/v1/results/${hash}`)
      .header('x-cache', cacheState)
      .type(contentType);

  const sendStored: AnswerService['sendStored'] = (_request, reply, hash, answer, cacheState) =>
    headers(reply, hash, cacheState, answer.contentType).send(answer.body);

  /**
   * Stream the chunks (in turns of the event loop: inTurns); keep a copy while it stays under
   * maxStoredBytes and store it at the end. The writer's pooled chunks (OUTPUT_CHUNKS) go back to
   * the pool once the response has finished on a real socket (its last byte handed to the
   * operating system, the stored copy made): up to RETURNED_CHUNKS of them an answer. The
   * answer is told how it ended (settled): delivered on a socket, or not.
   */
  function streamAndStore(reply: FastifyReply, hash: string, answer: StreamedAnswer): Readable {
    const sent: Buffer[] = [];
    const onSocket = reply.raw.socket instanceof Socket;
    let told = false;
    const settle = (delivered: boolean): void => {
      if (told) return; // once, whichever event comes first
      told = true;
      answer.settled?.(delivered);
    };
    reply.raw.once('finish', () => {
      if (!told && onSocket) OUTPUT_CHUNKS.release(sent.splice(0));
      settle(onSocket);
    });
    reply.raw.once('close', () => settle(false));
    async function* bytes(): AsyncGenerator<Buffer> {
      let kept: Buffer[] | undefined = [];
      let size = 0;
      for await (const buffer of inTurns(answer.chunks)) {
        size += buffer.length;
        if (kept && size <= maxStoredBytes) kept.push(buffer);
        else kept = undefined;
        if (sent.length < RETURNED_CHUNKS && OUTPUT_CHUNKS.owns(buffer)) sent.push(buffer);
        yield buffer;
      }
      if (kept) await cache.set(hash, { body: await concatInTurns(kept, size), contentType: answer.contentType });
    }
    return Readable.from(bytes(), { objectMode: false });
  }

  /** 304 when the client holds it, stored bytes when cached, else `compute`. */
  async function lookup(request: FastifyRequest, reply: FastifyReply, kind: ScenarioKind, scenario: unknown, compute: (hash: string) => Promise<FastifyReply>): Promise<FastifyReply> {
    const hash = scenarioHash(kind, scenario);
    if (ifNoneMatchHits(request.headers['if-none-match'], hash)) {
      return reply.code(304).header('etag', etagOf(hash)).send();
    }
    const stored = await cache.get(hash);
    if (stored) return sendStored(request, reply, hash, stored, 'hit');
    return compute(hash);
  }

  const service: AnswerService = {
    cache,
    sendStored,
    respond: (request, reply, kind, scenario, produce) =>
      lookup(request, reply, kind, scenario, async (hash) => {
        const answer = await shared(flights, hash, async () => {
          const produced = await produce(hash);
          await cache.set(hash, produced);
          return produced;
        });
        return sendStored(request, reply, hash, answer, 'miss');
      }),
    respondStream: (request, reply, kind, scenario, produce) =>
      lookup(request, reply, kind, scenario, async (hash) => {
        const format = await shared(streamFlights, hash, async () => produce(hash));
        const answer = format();
        return headers(reply, hash, 'miss', answer.contentType).send(streamAndStore(reply, hash, answer));
      }),
    inFlight: () => flights.size + streamFlights.size,
  };
  app.decorate('answers', service);
  app.addHook('onClose', async () => cache.close());
}, { name: 'answers' });
