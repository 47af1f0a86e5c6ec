// Runs batch items through the app itself (app.inject), so that each item gets exactly the
// validation, cache, worker pool and error mapping of its endpoint, and writes one NDJSON line per
// item: {"index","id","kind","status","scenarioHash"?,"answer"?|"problem"?}. The endpoint's JSON
// is spliced in as bytes (never parsed and re-serialised), so a line's answer is byte for byte
// what the endpoint answers alone. A runner never throws: every failure is that item's problem.
import { setTimeout as sleep } from 'node:timers/promises';
import type { FastifyInstance } from 'fastify';
import type { Config } from '../config.js';
import { ERRORS, problemType, type ErrorCode } from '../errors.js';
import type { BatchItem } from '../schemas/batch.js';
import { DEFAULT_TRACK_SAMPLES } from '../schemas/central-force.js';
import { epochTT } from '../api/epoch.js';
import { TimeGrid } from '../schemas/grid.js';
import { regularGridCount } from '../solver/core/grid.js';
import { INNER_REQUEST_HEADER } from '../plugins/metrics.js';
import { CALLER_HEADER } from '../plugins/auth.js';
import type { LineOut, RunLines } from './queue.js';
import { isJsonMediaType, productTail } from './products.js';

export interface RunnerOptions {
  /** Items solved at the same time; lines still come out in input order. */
  readonly concurrency: number;
  /** Most samples in one track of an item (checked before solving). */
  readonly maxTrackSamples: number;
  /** Largest answer a line carries, bytes. */
  readonly maxAnswerBytes: number;
  /** Item requests get the request id `${requestIdPrefix}/${index}` (it appears in their problems and logs). */
  readonly requestIdPrefix: string;
  /** Stop starting items (and stop waiting to retry) when aborted. */
  readonly signal?: AbortSignal;
  /** The caller the items run for (the batch's or the job's owner); null: the open service. */
  readonly caller?: string | null;
  /**
   * Aborted when the service shuts down: no item starts after it; the items in hand finish, and
   * every item not run gets a 503 shutting-down line, so the stream still ends with a line per item.
   */
  readonly stopping?: AbortSignal;
  /** Items in the whole batch (named in a shutting-down line). */
  readonly total?: number;
}

export const runnerOptions = (config: Config, requestIdPrefix: string, signal?: AbortSignal, caller: string | null = null): RunnerOptions => ({
  caller,
  concurrency: config.BATCH_CONCURRENCY,
  maxTrackSamples: config.BATCH_MAX_TRACK_SAMPLES,
  maxAnswerBytes: config.BATCH_MAX_ANSWER_BYTES,
  requestIdPrefix,
  ...(signal ? { signal } : {}),
});

/** A job runner on this app: the in-process queue and the queue workers use it. */
export const appRunner = (app: FastifyInstance): RunLines =>
  (job, from, signal) => runItems(app, job.items, from, runnerOptions(app.config, `job-${job.id}`, signal, job.owner ?? null));

/** A 503 from the worker pool is retried this many times, after its Retry-After (at most MAX_RETRY_WAIT_S). */
const OVERLOAD_RETRIES = 2;
const MAX_RETRY_WAIT_S = 5;

const NEWLINE = 0x0a;
const RETURN = 0x0d;

/** Samples in a time grid as the endpoints count them; undefined when the grid is invalid (the endpoint then answers 400). */
function gridSamples(grid: unknown): number | undefined {
  const parsed = TimeGrid.safeParse(grid);
  if (!parsed.success) return undefined;
  const g = parsed.data;
  if (g.times) return g.times.length;
  return regularGridCount(epochTT(g.start!, g.timeSystem), epochTT(g.stop!, g.timeSystem), g.step!);
}

const field = (value: unknown, key: string): unknown =>
  value !== null && typeof value === 'object' && !Array.isArray(value) ? (value as Record<string, unknown>)[key] : undefined;

/** Samples of the item's track, if it asks for one. */
function trackSamples(item: BatchItem): number | undefined {
  const r = item.request;
  switch (item.kind) {
    case 'track': return gridSamples(r.grid);
    case 'two-body': return r.track === undefined ? undefined : gridSamples(field(r.track, 'grid'));
    case 'central-force': {
      if (r.track === undefined) return undefined;
      const samples = field(r.track, 'samples') ?? DEFAULT_TRACK_SAMPLES;
      return typeof samples === 'number' ? samples : undefined;
    }
    default: return undefined;
  }
}

/** The part of a line before the answer or problem. */
function lineHead(index: number, item: BatchItem, status: number): string {
  return `{"index":${index},"id":${item.id === undefined ? 'null' : JSON.stringify(item.id)},"kind":"${item.kind}","status":${status}`;
}

/** A problem made here (not by the endpoint), shaped like the problems the endpoints answer. */
function localProblem(index: number, item: BatchItem, opts: RunnerOptions, code: ErrorCode, detail: string, scenarioHash?: string): LineOut {
  const { status, title } = ERRORS[code];
  const problem = { type: problemType(code), title, status, detail, instance: `/v1/${item.kind}`, requestId: `${opts.requestIdPrefix}/${index}` };
  const hash = scenarioHash ? `,"scenarioHash":"${scenarioHash}"` : '';
  return { line: Buffer.from(`${lineHead(index, item, status)}${hash},"problem":${JSON.stringify(problem)}}\n`), failed: true };
}

/** Raw newlines in valid JSON are whitespace between tokens (inside strings they are escaped): drop them to keep one line. */
function oneLine(json: Buffer): Buffer {
  if (!json.includes(NEWLINE) && !json.includes(RETURN)) return json;
  return Buffer.from(json.filter((byte) => byte !== NEWLINE && byte !== RETURN));
}

/** The line of an item not run because the service is shutting down. */
function notRun(index: number, item: BatchItem, opts: RunnerOptions, first: number, total: number): LineOut {
  const left = total - first;
  return localProblem(index, item, opts, 'shutting-down',
    `the service is shutting down: items ${first} to ${total - 1} (${left} of ${total}) were not run; send them again (another instance answers, or this one after its restart)`);
}

/** Solve one item through its endpoint and write its line. Never throws. */
export async function runItem(app: FastifyInstance, item: BatchItem, index: number, opts: RunnerOptions): Promise<LineOut> {
  try {
    const samples = trackSamples(item);
    if (samples !== undefined && samples > opts.maxTrackSamples) {
      return localProblem(index, item, opts, 'too-many-samples', `the track has ${samples} samples; inside a batch the maximum is ${opts.maxTrackSamples} (BATCH_MAX_TRACK_SAMPLES): send it to /v1/${item.kind} alone for up to MAX_TRACK_SAMPLES`);
    }
    // Any format the endpoint has (csv, oem, geojson, svg): the endpoint validates the name.
    const format = typeof item.request.format === 'string' ? item.request.format : undefined;
    // A track without a format is asked for JSON explicitly (the same scenario hash as Accept: application/json).
    const payload = item.kind === 'track' && item.request.format === undefined ? { ...item.request, format: 'json' } : item.request;
    for (let attempt = 0; ; attempt++) {
      const res = await app.inject({
        method: 'POST',
        url: `/v1/${item.kind}`,
        payload,
        headers: {
          'content-type': 'application/json', accept: 'application/json', 'x-request-id': `${opts.requestIdPrefix}/${index}`,
          [INNER_REQUEST_HEADER]: app.jobMetrics.innerToken,
          ...(opts.caller ? { [CALLER_HEADER]: opts.caller } : {}),
        },
      });
      const retryAfter = Number(res.headers['retry-after']);
      if (res.statusCode === 503 && attempt < OVERLOAD_RETRIES && Number.isFinite(retryAfter) && !opts.signal?.aborted && !opts.stopping?.aborted) {
        try {
          await sleep(Math.min(Math.max(retryAfter, 0), MAX_RETRY_WAIT_S) * 1000, undefined, opts.signal ? { signal: opts.signal } : {});
          continue;
        } catch {
          // aborted while waiting: the 503 stands
        }
      }
      const contentType = String(res.headers['content-type'] ?? '');
      if (res.statusCode === 200 && (format === undefined || format === 'json' ? contentType.startsWith('application/json') : contentType !== '')) {
        const hash = String(res.headers.etag ?? '').replaceAll('"', '');
        // JSON answers are spliced as they are (raw newlines dropped: whitespace); text products are escaped whole.
        const tail = productTail(format, contentType, isJsonMediaType(contentType) ? oneLine(res.rawPayload) : res.rawPayload);
        if (tail.length > opts.maxAnswerBytes) {
          return localProblem(index, item, opts, 'limit-exceeded',
            `the answer is ${tail.length} bytes in its line; a batch line carries at most ${opts.maxAnswerBytes} (BATCH_MAX_ANSWER_BYTES): it is cached, GET /v1/results/${hash} while it stays in the cache, or send the item alone`, hash);
        }
        return { line: Buffer.concat([Buffer.from(`${lineHead(index, item, 200)},"scenarioHash":"${hash}"`), tail, Buffer.from('}\n')]), failed: false };
      }
      if (res.statusCode >= 400 && contentType.startsWith('application/problem+json')) {
        return { line: Buffer.concat([Buffer.from(`${lineHead(index, item, res.statusCode)},"problem":`), oneLine(res.rawPayload), Buffer.from('}\n')]), failed: true };
      }
      app.log.error({ index, kind: item.kind, status: res.statusCode, contentType }, 'batch item answered neither JSON nor a problem');
      return localProblem(index, item, opts, 'internal', `the endpoint answered ${res.statusCode} ${contentType || 'without a media type'}, neither its product nor a problem`);
    }
  } catch (error) {
    // The app began to close between the last check and this item's start.
    if ((error as { code?: string }).code === 'FST_ERR_REOPENED_CLOSE_SERVER') return notRun(index, item, opts, index, opts.total ?? index + 1);
    app.log.error({ err: error, index, kind: item.kind }, 'batch item failed');
    return localProblem(index, item, opts, 'internal', 'The service failed while answering this item; the request id identifies the fault in the logs.');
  }
}

/**
 * The lines of items[from..], in input order, with up to `concurrency` items being solved at once.
 * Items start only while the consumer keeps reading, so at most `concurrency` finished lines wait.
 */
export async function* runItems(app: FastifyInstance, items: readonly BatchItem[], from: number, opts: RunnerOptions): AsyncGenerator<LineOut> {
  const inFlight: Promise<LineOut>[] = [];
  let next = from;
  const launch = () => {
    while (inFlight.length < opts.concurrency && next < items.length && !opts.signal?.aborted && !opts.stopping?.aborted) {
      const index = next++;
      inFlight.push(runItem(app, items[index]!, index, { ...opts, total: items.length }));
    }
  };
  launch();
  while (inFlight.length > 0) {
    const line = await inFlight.shift()!;
    if (opts.signal?.aborted) return;
    launch();
    yield line;
  }
  // Shutting down: what was not started gets its line, so the stream ends clearly.
  for (let index = next, first = next; index < items.length; index++) yield notRun(index, items[index]!, opts, first, items.length);
}
