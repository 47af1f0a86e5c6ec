// POST /v1/batch and POST /v1/jobs: many scenarios of any kind in one body; the answer is NDJSON,
// one line per item in input order. Each item's request is validated by its own endpoint when it
// runs, so one bad item becomes that line's problem and never spoils the others.
import { z } from 'zod';
import { SCENARIO_KINDS, type ScenarioKind } from '../scenario/hash.js';
import { DEMO_EPOCH, Problem, ScenarioHash } from './common.js';
import { boundedList } from './list.js';

export const BATCH_KINDS = SCENARIO_KINDS;
export type BatchKind = ScenarioKind;

export const NDJSON_MEDIA_TYPE = 'application/x-ndjson';

export const BatchItem = z
  .object({
    id: z.string().min(1).max(200).optional().describe('Your name for the item, echoed in its line (null when not given); need not be unique'),
    kind: z.enum(BATCH_KINDS).describe('Which endpoint answers the item: orbit -> POST /v1/orbit, two-body, central-force, track, passes, eclipses likewise'),
    request: z.record(z.string(), z.unknown()).describe(
      'The JSON body of that endpoint, exactly as it would be sent alone (same fields, units and defaults). It is validated when the item runs: ' +
      'an invalid request becomes that line\'s 400 problem. A request may name any format its endpoint has (format: csv, oem, geojson, svg): the line then carries the product (see the line\'s format, mediaType and product). ' +
      'Tracks (track grid, two-body track grid, central-force track samples) hold at most BATCH_MAX_TRACK_SAMPLES samples (default 10000), else 422 too-many-samples'),
  })
  .strict()
  .describe('One scenario of the batch')
  .meta({ id: 'BatchItem' });
export type BatchItem = z.output<typeof BatchItem>;

const DEMO_ITEMS: BatchItem[] = [
  {
    id: 'plover-7',
    kind: 'orbit',
    request: { centralBody: 'earth', elements: { epoch: DEMO_EPOCH, semiMajorAxis: 6928.137, eccentricity: 0.0012, inclination: 97.6, raan: 40, argPeriapsis: 90, trueAnomaly: 10 } },
  },
  {
    id: 'plover-7-hyperbolic-a',
    kind: 'orbit',
    request: { centralBody: 'earth', elements: { epoch: DEMO_EPOCH, semiMajorAxis: 6928.137, eccentricity: 1.5, inclination: 97.6, raan: 40, argPeriapsis: 90, trueAnomaly: 10 } },
  },
];

const itemsField = boundedList(BatchItem, { min: 1, max: 100_000 }).describe('The scenarios, 1 to BATCH_MAX_ITEMS (default 1000; more answers 422 limit-exceeded); the whole body is also bounded by BODY_LIMIT_BYTES');

export const BatchRequest = z
  .object({ items: itemsField })
  .strict()
  .meta({ description: 'Many scenarios of any kind in one call', examples: [{ items: DEMO_ITEMS }] })
  .meta({ id: 'BatchRequest' });
export type BatchRequest = z.output<typeof BatchRequest>;

/** One NDJSON line. `answer` is spliced in as the endpoint's bytes, so it is byte for byte what the endpoint answers alone. */
export const BatchLine = z
  .object({
    index: z.number().int().min(0).describe('Position of the item in the request, from 0; lines come in this order'),
    id: z.string().nullable().describe('The item\'s id, or null'),
    kind: z.enum(BATCH_KINDS).describe('The item\'s kind'),
    status: z.number().int().describe('The HTTP status the endpoint answered for this item alone: 200, or the problem\'s status (400, 406, 422, 503, 500)'),
    scenarioHash: ScenarioHash.optional().describe('With status 200 (and with 422 limit-exceeded for an answer too big for a line): the item\'s scenario hash; GET /v1/results/{scenarioHash} serves the answer while it is cached'),
    format: z.string().optional().describe('With status 200, when the request named a format other than json (csv, oem, geojson, svg): that format'),
    mediaType: z.string().optional().describe('With format: the media type the endpoint answers that format with (e.g. text/csv; charset=utf-8; header=present)'),
    answer: z.unknown().optional().describe('With status 200 and a JSON product (JSON, GeoJSON): exactly the JSON the endpoint answers for this request alone (same fields, same bytes)'),
    product: z.string().optional().describe('With status 200 and a text product (CSV, CCSDS OEM, SVG): the endpoint\'s answer for this request alone as one JSON string (decoded, the same bytes); GET /v1/jobs/{id}/results/{index} serves it in its own media type'),
    problem: Problem.optional().describe('Otherwise: the RFC 9457 problem the endpoint answers for this request alone'),
  })
  .describe(`One line of the ${NDJSON_MEDIA_TYPE} answer: one per item, in input order, each a JSON object ending with a newline`)
  .meta({ id: 'BatchLine' });
export type BatchLine = z.output<typeof BatchLine>;

export const JobStatus = z.enum(['queued', 'running', 'done', 'failed', 'cancelled'])
  .describe('queued: waiting for a worker; running: items being solved; done: every item has its line (items may have failed: see counts.failed); ' +
    'failed: the job as a whole could not run or missed its deadline (see error; kept, like every finished job, for JOB_RESULT_TTL_S: the dead letters); ' +
    'cancelled: DELETE /v1/jobs/{id} stopped it (the lines written before stay readable)');
export type JobStatus = z.output<typeof JobStatus>;

export const IDEMPOTENCY_KEY_PATTERN = /^[\x21-\x7e]{1,200}$/;

export const JobRequest = z
  .object({
    label: z.string().min(1).max(200).optional().describe('Your name for the job, echoed in its status'),
    items: itemsField,
    deadline: z.iso.datetime({ offset: false }).optional().describe('ISO 8601 UTC: a job not done by then stops and fails with the reason "deadline" (the lines written stay readable by index); at most JOB_MAX_DEADLINE_S ahead'),
    compareTo: z.string().min(1).max(100).optional().describe('The id of an earlier job of yours: GET /v1/jobs/{id}/changes then lists, item by item (matched by item id), what moved since that job'),
    thresholdSeconds: z.number().min(0).max(86_400).default(1).describe('With compareTo: a pass whose AOS, LOS or TCA, or an eclipse whose entry or exit (penumbra or umbra), moved by more than this, seconds, is reported as moved'),
    thresholdDegrees: z.number().min(0).max(90).default(0.1).describe('With compareTo: a pass whose maximum elevation changed by more than this, degrees, is reported as moved'),
    callbackUrl: z.string().min(1).max(2000).optional().describe(
      'http(s) URL: once the job is done, failed or cancelled, its status (the answer of GET /v1/jobs/{id}) is POSTed there as JSON, ' +
      'signed with HMAC-SHA256 under the service\'s JOB_CALLBACK_SECRET: header apsides-signature = "sha256=" + hex HMAC of "<apsides-signature-timestamp>.<body>"; ' +
      'apsides-delivery is one id per callback (the same on retries). A non-2xx answer, a redirect (never followed) or no answer within JOB_CALLBACK_TIMEOUT_MS is retried ' +
      'JOB_CALLBACK_ATTEMPTS times in all with exponential backoff from JOB_CALLBACK_BACKOFF_MS. Only hosts in JOB_CALLBACK_HOSTS are allowed: any other answers 422 callback-not-allowed'),
  })
  .strict()
  .meta({ description: 'A batch to run later: the same items as POST /v1/batch', examples: [{ label: 'nightly recalculation', items: DEMO_ITEMS }] })
  .meta({ id: 'JobRequest' });
export type JobRequest = z.output<typeof JobRequest>;

export const JobId = z.string().min(1).max(100).describe('The job id (a UUID)');

export const JobLinks = z.object({
  self: z.string().describe('GET: the job status; DELETE: cancel it'),
  results: z.string().describe('GET: the NDJSON results once the job is done'),
  archive: z.string().describe('GET: every item\'s product as one .tar.gz with a manifest, once the job is done'),
  changes: z.string().describe('GET: with compareTo, what moved since the earlier job (NDJSON)'),
})
  .meta({ id: 'JobLinks' });

export const JobAccepted = z.object({
  id: JobId,
  status: JobStatus.describe('queued for a new job; with a repeated Idempotency-Key, the status of the job stored first'),
  links: JobLinks,
})
  .meta({ id: 'JobAccepted' });

export const JobAnswer = z.object({
  id: JobId,
  label: z.string().nullable().describe('The label given at submission, or null'),
  status: JobStatus,
  counts: z.object({
    items: z.number().int().describe('Items in the job'),
    done: z.number().int().describe('Items whose line is written (answered or failed)'),
    failed: z.number().int().describe('Of those, items whose line carries a problem'),
  }),
  progress: z.object({
    fraction: z.number().min(0).max(1).describe('counts.done / counts.items'),
    estimatedFinishAt: z.string().nullable().describe('While running: now plus the items left at the rate seen since startedAt, ISO 8601 UTC (an estimate); null otherwise'),
  }),
  attempts: z.number().int().describe('Times a worker took the job (more than 1 after a worker stopped under it or a retry; the job resumes after the lines already stored)'),
  createdAt: z.string().describe('Submission time, ISO 8601 UTC'),
  startedAt: z.string().nullable().describe('When a worker first took it, ISO 8601 UTC; null while queued'),
  finishedAt: z.string().nullable().describe('When it became done, failed or cancelled, ISO 8601 UTC; null before'),
  deadline: z.string().nullable().describe('The deadline given at submission, or null'),
  compareTo: z.string().nullable().describe('The earlier job compared with, or null'),
  callbackUrl: z.string().nullable().describe('Where the status is POSTed once the job is done, failed or cancelled, or null'),
  error: z.string().nullable().describe('Why a failed or cancelled job stopped; null otherwise'),
  links: JobLinks,
})
  .meta({ id: 'JobAnswer' });
export type JobAnswer = z.output<typeof JobAnswer>;

export const JobList = z.object({
  jobs: z.array(JobAnswer).describe('Your jobs, newest first'),
  next: z.string().nullable().describe('Cursor of the next (older) page: GET /v1/jobs?cursor=...; null on the last page'),
})
  .meta({ id: 'JobList' });

export const JobListQuery = z.object({
  limit: z.coerce.number().int().min(1).max(100).default(20).describe('Jobs per page (1 to 100, default 20)'),
  cursor: z.string().regex(/^[0-9]{1,15}$/).optional().describe('The `next` of the previous page'),
}).strict();
