// POST /v1/batch: many scenarios of any kind in one call, answered as NDJSON in input order while
// they are solved. Each item runs through its own endpoint (src/jobs/runner.ts), so it is validated,
// cached and answered exactly as if sent alone; one bad item is that line's problem.
import { Readable } from 'node:stream';
import type { FastifyReply } from 'fastify';
import type { FastifyPluginAsyncZod } from 'fastify-type-provider-zod';
import { ProblemError } from '../errors.js';
import { runItems, runnerOptions } from '../jobs/runner.js';
import { BatchLine, BatchRequest, NDJSON_MEDIA_TYPE } from '../schemas/batch.js';
import { problemAnswer, problemResponses } from '../schemas/common.js';
import type { LineOut } from '../jobs/queue.js';

/** Stream NDJSON bytes (the 200 schema above documents the lines; streams are not serialised). */
export function sendNdjson(reply: FastifyReply, chunks: AsyncIterable<Buffer>): FastifyReply {
  return reply.type(NDJSON_MEDIA_TYPE).send(Readable.from(chunks, { objectMode: false }));
}

async function* bytes(lines: AsyncIterable<LineOut>): AsyncGenerator<Buffer> {
  for await (const out of lines) yield out.line;
}

const batch: FastifyPluginAsyncZod = async (app) => {
  // At shutdown a batch in flight finishes the items in hand and answers the rest as 503 shutting-down lines.
  const stopping = new AbortController();
  app.addHook('preClose', async () => { stopping.abort(); });
  app.post('/v1/batch', {
    schema: {
      tags: ['batch'],
      operationId: 'runBatch', summary: 'Many scenarios of any kind in one call, answered as NDJSON in input order',
      description: 'Each item names an endpoint (kind) and carries the body that endpoint takes (request). The answer is application/x-ndjson, ' +
        'streamed while the items are solved (up to BATCH_CONCURRENCY at a time, default 4): one line per item, in input order, ' +
        '{"index","id","kind","status","scenarioHash","answer"} for an answer or {"index","id","kind","status","problem"} for a problem. ' +
        'A line\'s answer is byte for byte the JSON the endpoint answers for that request alone, and comes from the same cache; ' +
        'a line\'s problem is the problem the endpoint answers. One bad item (400, 406, 422, 500) never spoils the others: the status of the whole answer is 200. ' +
        'An item may ask for any format its endpoint has (format csv, oem, geojson, svg): its line then carries format, mediaType and the product (answer for GeoJSON, product as a JSON string for text). ' +
        'Inside a batch tracks hold at most BATCH_MAX_TRACK_SAMPLES samples (default 10000) and an answer at most BATCH_MAX_ANSWER_BYTES (default 4 MiB). ' +
        'The whole body is refused (400) only when it is not a list of items of the known kinds, or (422 limit-exceeded) when it holds more than BATCH_MAX_ITEMS items (default 1000).',
      body: BatchRequest,
      response: {
        200: {
          description: 'One JSON object per line, one line per item, in input order',
          content: { [NDJSON_MEDIA_TYPE]: { schema: BatchLine } },
        },
        ...problemResponses,
        413: problemAnswer('The body exceeds BODY_LIMIT_BYTES'),
      },
    },
  }, async (request, reply) => {
    const { items } = request.body;
    const max = app.config.BATCH_MAX_ITEMS;
    if (items.length > max) throw new ProblemError('limit-exceeded', `the batch holds ${items.length} items; the maximum is ${max} (BATCH_MAX_ITEMS): split it, or submit it as several jobs`);
    // The generator starts items only while the client reads: a slow reader holds back the work, and
    // a client that goes away stops it (the stream is destroyed and the generator returns).
    const lines = runItems(app, items, 0, { ...runnerOptions(app.config, String(request.id), undefined, request.callerId), stopping: stopping.signal });
    return sendNdjson(reply.header('cache-control', 'no-store'), bytes(lines));
  });
};
export default batch;
