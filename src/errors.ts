// Every error the service can answer, in one table: code -> HTTP status, title, and what it means.
// Answers are RFC 9457 problem details with `type` = `/problems/<code>` (served by GET /problems/{code}).
// docs/errors.md lists the same table; test/errors.test.ts checks the two agree.

import type { SolverFailureCode } from './solver/core/result.js';

export interface ErrorEntry {
  readonly status: number;
  readonly title: string;
  readonly meaning: string;
}

const SERVICE_ERRORS = {
  'validation-failed': { status: 400, title: 'Request does not match the schema', meaning: 'A field is missing, has the wrong type, or is out of range; `errors` lists each offending field by its path, and a field that must be one of a list of names (or a name or an object) lists the names allowed. A body whose only issues are of one kind that has its own code (invalid-epoch, epoch-out-of-range, eccentricity-out-of-range) is answered with that code instead, with the same `errors` list.' },
  'malformed-json': { status: 400, title: 'Body is not valid JSON', meaning: 'The request body could not be parsed as JSON.' },
  'json-too-deep': { status: 400, title: 'Body nested too deeply', meaning: 'Objects and arrays in the body are nested deeper than MAX_JSON_DEPTH; no request of this service needs that.' },
  'malformed-url': { status: 400, title: 'URL is not valid', meaning: 'The request path holds a bad percent-encoding or is otherwise not a URL this service can read.' },
  'uri-too-long': { status: 414, title: 'URL too long', meaning: 'A path segment is longer than any identifier of this service (scenario hashes and job ids are far shorter).' },
  'malformed-request': { status: 400, title: 'Request is not valid HTTP', meaning: 'The bytes received are not an HTTP request this server can read; the connection is closed.' },
  'header-too-large': { status: 431, title: 'Request headers too large', meaning: 'The request headers exceed the server\'s header size limit.' },
  'request-timeout': { status: 408, title: 'Request not received in time', meaning: 'The client did not send the whole request (headers and body) within the configured time (HEADERS_TIMEOUT_S, BODY_TIMEOUT_S); the connection is closed.' },
  'body-too-large': { status: 413, title: 'Body too large', meaning: 'The request body exceeds the configured BODY_LIMIT_BYTES.' },
  'unsupported-media-type': { status: 415, title: 'Unsupported media type', meaning: 'POST bodies must be sent with Content-Type application/json; a body of any other type (text/plain, form data, none named) is refused before it is read.' },
  'not-acceptable': { status: 406, title: 'No acceptable representation', meaning: 'The Accept header names no format this endpoint can produce.' },
  'unauthorized': { status: 401, title: 'API key missing or not valid', meaning: 'With API keys configured, requests under /v1 need `Authorization: Bearer <key>` with a key listed in API_KEYS, and /metrics a key or METRICS_TOKEN; WWW-Authenticate says whether the key was missing or not valid (RFC 6750).' },
  'rate-limited': { status: 429, title: 'Too many requests', meaning: 'This API key (or, when the service is open, this client address) sent more requests this minute than RATE_LIMIT_PER_MIN (reads and POST /v1/orbit) or RATE_LIMIT_HEAVY_PER_MIN (other POSTs under /v1); retry after the seconds in Retry-After. RateLimit-Limit, RateLimit-Remaining and RateLimit-Reset say where the budget stands.' },
  'not-found': { status: 404, title: 'Not found', meaning: 'No such route.' },
  'result-not-cached': { status: 404, title: 'Result not in the cache', meaning: 'No answer is stored under this scenario hash (never computed, or evicted): send the scenario again to recompute it.' },
  'problem-type-unknown': { status: 404, title: 'Unknown problem type', meaning: 'GET /problems/{code} was asked for a code that is not in the table.' },
  'unsupported-frame': { status: 422, title: 'Frame or format not available here', meaning: 'Earth-fixed frames (itrf, geodetic) and GeoJSON ground tracks exist for the built-in earth only (so do ground-station passes and eclipses), and an OEM carries Cartesian states (gcrf or itrf).' },
  'too-many-samples': { status: 422, title: 'Too many samples', meaning: 'The requested grid has more samples than the configured maximum; the detail names the maximum.' },
  'non-finite-result': { status: 422, title: 'Answer would hold a non-finite number', meaning: 'A number of the answer is not finite (NaN or an infinity: the scenario overflows or underflows double-precision arithmetic). JSON would print it as null and no format can print it, so nothing is sent; the detail and `errors` name the field. Bring the numbers of the request into a physical range.' },
  'limit-exceeded': { status: 422, title: 'Request exceeds a service limit', meaning: 'A window, list or count is larger than the service accepts; the detail names the limit.' },
  'overloaded': { status: 503, title: 'Service overloaded', meaning: 'The worker queue is full, or the process is under memory or event-loop pressure; retry after the number of seconds in Retry-After.' },
  'deadline-exceeded': { status: 504, title: 'Work took longer than its deadline', meaning: 'The computation ran past REQUEST_DEADLINE_S and was stopped (its worker thread replaced); nothing was stored. Ask for less work (shorter span, fewer samples or stations).' },
  'worker-failed': { status: 503, title: 'Worker thread died', meaning: 'The worker thread computing the answer stopped before it finished (out of memory, a crash); a new thread has taken its place. Retry after the seconds in Retry-After; the request id identifies the fault in the logs.' },
  'shutting-down': { status: 503, title: 'Service shutting down', meaning: 'This instance is stopping and takes no new work; retry after the number of seconds in Retry-After (another instance, or this one after its restart, answers). In a batch stream the items in hand finish and every item not run has a line with this problem, naming the range not run.' },
  'queue-unavailable': { status: 503, title: 'Job queue unavailable', meaning: 'The job queue cannot take or look up jobs now: its Redis store does not answer, or the in-process queue holds JOBS_MAX_KEPT unfinished jobs or JOBS_MAX_BYTES of jobs and results; retry after the number of seconds in Retry-After. Jobs already stored are not lost.' },
  'job-not-found': { status: 404, title: 'No such job', meaning: 'No job has this id: never submitted, expired (JOB_RESULT_TTL_S), or dropped from the in-process queue (JOBS_MAX_KEPT).' },
  'job-not-done': { status: 409, title: 'Job results not ready', meaning: 'Results exist only for a job whose status is done: a queued or running job answers this with Retry-After; a failed job answers it with the reason in the detail.' },
  'job-finished': { status: 409, title: 'Job already finished', meaning: 'DELETE /v1/jobs/{id} cancels a queued or running job; this one is already done, failed or cancelled (its record is in the detail).' },
  'idempotency-conflict': { status: 409, title: 'Idempotency-Key reused with another body', meaning: 'A job was already submitted with this Idempotency-Key and a different body; send the same body to get that job, or use a new key.' },
  'callback-not-allowed': { status: 422, title: 'Callback not allowed', meaning: 'The job\'s callbackUrl is not an http(s) URL of a host in JOB_CALLBACK_HOSTS, or callbacks are off on this service; the detail says which.' },
  'job-not-comparable': { status: 422, title: 'The earlier job cannot be compared with', meaning: 'compareTo names a job that does not exist, is not yours, or has expired; changes are listed against an earlier job of the same caller.' },
  'item-not-written': { status: 404, title: 'Item not written', meaning: 'GET /v1/jobs/{id}/results/{index}: the index is outside the job, or that item\'s line is not written yet (see the job\'s counts).' },
  'oem-malformed': { status: 422, title: 'OEM does not follow the standard', meaning: 'The ephemeris message breaks the CCSDS 502.0-B-3 KVN layout (a block not closed, a data line without 6 or 9 numbers, epochs not increasing, a missing keyword, ...); the detail names the line.' },
  'oem-unsupported': { status: 422, title: 'OEM content not supported', meaning: 'The ephemeris message is well formed but asks for what the service does not read: a centre other than EARTH, a frame other than GCRF, ICRF, EME2000, ITRF or TEME, a time system other than UTC, TAI, TT or GPS, an interpolation other than LAGRANGE, HERMITE or LINEAR, or XML; the detail names the line.' },
  'tle-malformed': { status: 422, title: 'Two-line element set is malformed', meaning: 'A line of the two-line set breaks the layout of Spacetrack Report No. 3: not 69 characters, a wrong line number or checksum, a field that is not its format (the exponent fields like " 12345-4", the assumed-decimal eccentricity), or a value out of its range; the detail names the line, the columns and what was expected, and `errors` lists every problem found.' },
  'omm-malformed': { status: 422, title: 'OMM does not follow the standard', meaning: 'The Orbit Mean-elements Message breaks CCSDS 502.0-B-3: a KVN line that is not "KEYWORD = value", XML that is not well formed, a keyword given twice (one OMM, one orbit), a required keyword missing or a value that is not its number or epoch; the detail and `errors` name each keyword or line.' },
  'omm-unsupported': { status: 422, title: 'OMM content not supported', meaning: 'The OMM is well formed but not what SGP4 propagates: MEAN_ELEMENT_THEORY other than SGP4 (SGP, SGP4-XP, ...), a centre other than EARTH, a frame other than TEME, a time system other than UTC, an ephemeris type other than 0, or a semi-major axis in place of the mean motion.' },
  'internal': { status: 500, title: 'Internal error', meaning: 'A fault in the service itself; the request id in the answer identifies it in the logs.' },
} as const satisfies Record<string, ErrorEntry>;

/** Expected solver failures: physically impossible or numerically unsolvable scenarios answer 422. */
const SOLVER_ERRORS: Record<SolverFailureCode, ErrorEntry> = {
  'invalid-epoch': { status: 400, title: 'Epoch is not a date', meaning: 'An epoch is not calendar text of a real date and time in its time system (ISO 8601 ending in Z or an offset +hh:mm for UTC, the default; zone-less text for TAI, TT and GPS; a second 60 only inside a UTC leap second); `errors` names each such field.' },
  'epoch-out-of-range': { status: 422, title: 'Epoch out of the supported range', meaning: 'Epochs must lie in 1972-2199 UTC (UTC before 1972 had no leap-second form), an epoch given in TAI, TT or GPS included once written in UTC; `errors` names each such field.' },
  'zero-position': { status: 422, title: 'Position is zero', meaning: 'The position vector (or the separation of two bodies) has zero length: no orbit is defined.' },
  'rectilinear-motion': { status: 422, title: 'Rectilinear motion', meaning: 'The angular momentum is zero (velocity parallel to position): there is no orbital plane.' },
  'eccentricity-out-of-range': { status: 422, title: 'Eccentricity out of range', meaning: 'Eccentricity must be a finite number >= 0 (elements.eccentricity; `errors` names the field).' },
  'semi-major-axis-sign': { status: 422, title: 'Semi-major axis inconsistent with the eccentricity', meaning: 'Ellipses need a > 0, hyperbolas a < 0, and a parabola (e = 1) is given by its semi-latus rectum.' },
  'anomaly-beyond-asymptote': { status: 422, title: 'True anomaly beyond the asymptote', meaning: 'On a hyperbola the true anomaly must satisfy |nu| < acos(-1/e).' },
  'no-convergence': { status: 422, title: 'Solver did not converge', meaning: 'An iterative solution did not converge within its iteration limit for this input.' },
  'impact': { status: 422, title: 'Trajectory meets the central body', meaning: 'The trajectory passes below the central body radius while the request asked for a trajectory that does not.' },
  'invalid-parameter': { status: 422, title: 'Parameter out of its physical range', meaning: 'A number is outside the range where the physics is defined (the detail names it).' },
  'invalid-horizon-mask': { status: 422, title: 'Horizon mask is not usable', meaning: 'A station horizon mask has azimuths outside [0, 360), repeated azimuths or elevations outside [-90, 90].' },
  'window-too-long': { status: 422, title: 'Time window too long', meaning: 'The pass- or eclipse-search window is longer than the service accepts; the detail names the maximum.' },
  'too-many-stations': { status: 422, title: 'Too many stations', meaning: 'More ground stations than the service accepts in one request; the detail names the maximum.' },
  'integration-failed': { status: 422, title: 'Numerical integration failed', meaning: 'The integrator exceeded its step budget or met a non-finite value (e.g. a fall into the centre); the detail says where.' },
  'energy-below-minimum': { status: 422, title: 'Energy below the effective-potential minimum', meaning: 'No radius satisfies E >= U_eff(r): the motion is not possible with this energy and angular momentum.' },
  'outside-coverage': { status: 422, title: 'Epoch outside the ephemeris coverage', meaning: 'An epoch asked for (a sample, or any instant of a pass-search window) lies before, after or in a gap between the segments of the given ephemeris; the detail names the coverage. Ephemerides are interpolated, never extrapolated.' },
  'sgp4-failed': { status: 422, title: 'SGP4 stopped', meaning: 'The SGP4 method reported an error at some epoch of the request (mean or perturbed eccentricity out of range, mean motion or semi-latus rectum below zero, the satellite decayed); the detail names the epoch and the reason. A track ends there; a pass or eclipse search reports what it found before that epoch and why it stopped.' },
  'no-radial-period': { status: 422, title: 'No radial period', meaning: 'The radial motion is not periodic (unbound, captured or rectilinear), so a period or apsidal angle does not exist.' },
};

export const ERRORS = { ...SERVICE_ERRORS, ...SOLVER_ERRORS } as const;
export type ErrorCode = keyof typeof SERVICE_ERRORS | SolverFailureCode;

export const errorCodes = (): ErrorCode[] => Object.keys(ERRORS) as ErrorCode[];
export const isErrorCode = (code: string): code is ErrorCode => Object.hasOwn(ERRORS, code);
export const problemType = (code: ErrorCode): string => `/problems/${code}`;

export interface FieldIssue {
  path: string;
  message: string;
}

/** An error the service answers as a problem document. Thrown from routes and plugins; the error handler formats it. */
export class ProblemError extends Error {
  readonly code: ErrorCode;
  readonly status: number;
  readonly errors: FieldIssue[] | undefined;
  /** How many issues there were when `errors` lists only the first ones. */
  readonly errorCount: number | undefined;
  readonly headers: Record<string, string>;

  constructor(code: ErrorCode, detail: string, extra: { errors?: FieldIssue[]; errorCount?: number; headers?: Record<string, string> } = {}) {
    super(detail);
    this.name = 'ProblemError';
    this.code = code;
    this.status = ERRORS[code].status;
    this.errors = extra.errors;
    this.errorCount = extra.errorCount;
    this.headers = extra.headers ?? {};
  }
}

/** A solver failure (coded value) turned into the service's problem. */
export function solverProblem(failure: { code: SolverFailureCode; message: string }): ProblemError {
  return new ProblemError(failure.code, failure.message);
}

