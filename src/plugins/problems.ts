// RFC 9457 problem details for every 4xx/5xx answer, and GET /problems/{code} describing each type.
import { STATUS_CODES } from 'node:http';
import type { Socket } from 'node:net';
import fp from 'fastify-plugin';
import type { FastifyError, FastifyInstance, FastifyReply, FastifyRequest } from 'fastify';
import { hasZodFastifySchemaValidationErrors } from 'fastify-type-provider-zod';
import { ERRORS, ProblemError, isErrorCode, problemType, type ErrorCode, type FieldIssue } from '../errors.js';
import { z } from 'zod';
import { MAX_LISTED_ISSUES } from '../schemas/list.js';
import { PROBLEM_MEDIA_TYPE, problemAnswer } from '../schemas/common.js';

/** Longest piece of client text (a path, a message quoting input) a problem or a log line repeats. */
export const MAX_ECHO_CHARS = 200;
/** Longest detail of a problem (our words plus clipped echoes). */
const MAX_DETAIL_CHARS = 1000;

/** Text cut to `max` characters, marked with an ellipsis when cut (never splitting a surrogate pair). */
export function clip(text: string, max = MAX_ECHO_CHARS): string {
  if (text.length <= max) return text;
  let end = max;
  const code = text.charCodeAt(end - 1);
  if (code >= 0xd800 && code <= 0xdbff) end--;
  return `${text.slice(0, end)}…`;
}

export const PROBLEM_CONTENT_TYPE = PROBLEM_MEDIA_TYPE;

/** GET /problems/{code}: one row of the error table. */
const ProblemType = z.object({
  type: z.string().describe('/problems/{code}, as problem documents give it'),
  code: z.string().describe('The error code'),
  status: z.number().int().min(100).max(599).describe('HTTP status answered with this code').meta({ example: 422 }),
  title: z.string(),
  meaning: z.string().describe('When the service answers this code, and what to do about it'),
}).meta({ id: 'ProblemType' });

export interface ProblemDocument {
  type: string;
  title: string;
  status: number;
  detail: string;
  instance: string;
  requestId: string;
  errors?: FieldIssue[];
  errorCount?: number;
}

export function sendProblem(request: FastifyRequest, reply: FastifyReply, problem: ProblemError): FastifyReply {
  const entry = ERRORS[problem.code];
  const body: ProblemDocument = {
    type: problemType(problem.code),
    title: entry.title,
    status: entry.status,
    detail: clip(problem.message, MAX_DETAIL_CHARS),
    instance: clip(request.url.split('?')[0] ?? ''),
    requestId: String(request.id),
    ...(problem.errors ? listed(problem.errors, problem.errorCount) : {}),
  };
  for (const [k, v] of Object.entries(problem.headers)) reply.header(k, v);
  return reply.code(entry.status).type(PROBLEM_CONTENT_TYPE).send(JSON.stringify(body));
}

/** At most MAX_LISTED_ISSUES issues, each clipped, and how many there were. */
function listed(errors: readonly FieldIssue[], total = errors.length): { errors: FieldIssue[]; errorCount: number } {
  return {
    errors: errors.slice(0, MAX_LISTED_ISSUES).map((e) => ({ path: clip(e.path), message: clip(e.message) })),
    errorCount: Math.max(total, errors.length),
  };
}

interface ValidationItem {
  readonly instancePath: string;
  readonly message?: string | undefined;
  readonly keyword?: string;
  readonly params?: Record<string, unknown>;
}
interface PlainIssue {
  readonly path: readonly PropertyKey[];
  readonly message: string;
  readonly code?: string;
  readonly expected?: string;
  readonly values?: readonly unknown[];
  readonly errors?: readonly (readonly PlainIssue[])[];
}

/** The table code a schema issue carries (codedIssue in src/schemas/common.ts), else validation-failed. */
function issueCode(v: ValidationItem): ErrorCode {
  const inner = v.params?.params as { problem?: unknown } | undefined;
  const code = typeof inner?.problem === 'string' ? inner.problem : undefined;
  return code !== undefined && isErrorCode(code) ? code : 'validation-failed';
}

/**
 * The issues of one validation item, paths relative to the body. A union (a built-in body name or
 * an object) is explained by the one branch that fits the value (an object with a bad field gets
 * that field's issue); when none fits, the alternatives are listed, so "pluto" reads
 * `expected one of "sun"|...|"neptune", or an object` rather than zod's bare "Invalid input".
 */
function schemaIssues(v: ValidationItem): PlainIssue[] {
  const path = v.instancePath.split('/').filter((p) => p !== '');
  const message = v.message ?? 'invalid';
  if (v.keyword !== 'invalid_union' || !Array.isArray(v.params?.errors) || v.params.errors.length === 0) return [{ path, message }];
  const branches = v.params.errors as readonly (readonly PlainIssue[])[];
  // A branch that refuses the value as a whole (not its type, not one of its values) does not fit it.
  const refusesWhole = (b: readonly PlainIssue[]) => b.length === 1 && (b[0]!.code === 'invalid_type' || b[0]!.code === 'invalid_value') && b[0]!.path.length === 0;
  const fitting = branches.filter((b) => !refusesWhole(b));
  if (fitting.length === 1) return fitting[0]!.map((i) => ({ path: [...path, ...i.path], message: i.message }));
  const wanted = branches.flatMap((b) => b.map((i) =>
    i.code === 'invalid_value' && i.values ? `one of ${i.values.map((x) => JSON.stringify(x)).join('|')}` : i.code === 'invalid_type' && i.expected ? `a${/^[aeiou]/.test(i.expected) ? 'n' : ''} ${i.expected}` : i.message));
  return [{ path, message: `Invalid input: expected ${[...new Set(wanted)].join(', or ')}` }];
}

/** Fastify's own client errors (body parsing, media type, size) mapped to our codes. */
const FASTIFY_CODES: Record<string, ErrorCode> = {
  FST_ERR_CTP_INVALID_MEDIA_TYPE: 'unsupported-media-type',
  FST_ERR_CTP_INVALID_CONTENT_LENGTH: 'malformed-json',
  FST_ERR_CTP_BODY_TOO_LARGE: 'body-too-large',
  FST_ERR_CTP_EMPTY_JSON_BODY: 'malformed-json',
  FST_ERR_CTP_INVALID_JSON_BODY: 'malformed-json',
  FST_ERR_BAD_URL: 'malformed-url',
  FST_ERR_MAX_PARAM_LENGTH: 'uri-too-long',
};

function toProblem(error: FastifyError, request: FastifyRequest): ProblemError {
  if (error instanceof ProblemError) return error;
  if (hasZodFastifySchemaValidationErrors(error)) {
    const where = error.validationContext ?? 'body';
    // Only the first issues are turned into text; the count says how many there were.
    const issues = error.validation.slice(0, MAX_LISTED_ISSUES).flatMap((v) => schemaIssues(v));
    const errors = issues.slice(0, MAX_LISTED_ISSUES).map((v) => ({
      path: clip(`${where}${v.path.map((p) => `.${String(p)}`).join('')}`),
      message: clip(v.message),
    }));
    const total = Math.max(error.validation.length, errors.length);
    const more = total - errors.length;
    const summary = errors.slice(0, 3).map((e) => `${e.path}: ${e.message}`).join('; ');
    const rest = total > 3 ? ` (and ${total - 3} more${more > 0 ? `, ${MAX_LISTED_ISSUES} listed` : ''})` : '';
    // A body whose every issue carries one code of the table (an epoch that is not a date, ...) is answered with it.
    const codes = new Set(error.validation.map(issueCode));
    const code = codes.size === 1 ? [...codes][0]! : 'validation-failed';
    const lead = code === 'validation-failed' ? 'The request does not match the schema' : ERRORS[code].title;
    return new ProblemError(code, `${lead}: ${summary}${rest}`, { errors, errorCount: total });
  }
  const mapped = error.code ? FASTIFY_CODES[error.code] : undefined;
  if (mapped === 'unsupported-media-type') {
    const given = request.headers['content-type'];
    return new ProblemError(mapped, `${given === undefined ? 'a body without a Content-Type' : `Content-Type ${JSON.stringify(clip(given, 100))}`} is not read here: send the body as application/json`);
  }
  if (mapped) return new ProblemError(mapped, error.message);
  if (error instanceof SyntaxError || (error.statusCode === 400 && /JSON/i.test(error.message))) {
    return new ProblemError('malformed-json', `The body is not valid JSON: ${error.message}`);
  }
  if (error.statusCode && error.statusCode >= 400 && error.statusCode < 500) {
    return new ProblemError('validation-failed', error.message);
  }
  return new ProblemError('internal', 'The service failed while answering; the request id identifies the fault in the logs.');
}

/** Fastify's `frameworkErrors` option: router refusals (bad percent-encoding, over-long path segments) as problems. */
export function frameworkErrors(error: FastifyError, request: FastifyRequest, reply: FastifyReply): void {
  const code = (error.code && FASTIFY_CODES[error.code]) || 'malformed-url';
  const detail = code === 'uri-too-long'
    ? `a path segment is longer than ${MAX_PATH_SEGMENT_CHARS} characters; no identifier of this service is that long`
    : 'the request path is not a valid URL (bad percent-encoding?)';
  request.log.info({ code }, 'client error');
  void sendProblem(request, reply, new ProblemError(code, detail));
}

/** Longest path parameter the router accepts (fastify's maxParamLength); job ids are 36 characters, hashes 64. */
export const MAX_PATH_SEGMENT_CHARS = 100;

/**
 * Fastify's `clientErrorHandler` option: errors met before a request exists (headers not received in
 * time, headers too large, unparsable HTTP) answered as problems on the raw socket, which then closes.
 */
export function clientErrorHandler(error: NodeJS.ErrnoException, socket: Socket): void {
  if (error.code === 'ECONNRESET' || socket.destroyed) return;
  const code: ErrorCode = error.code === 'ERR_HTTP_REQUEST_TIMEOUT' ? 'request-timeout'
    : error.code === 'HPE_HEADER_OVERFLOW' ? 'header-too-large' : 'malformed-request';
  const detail = code === 'request-timeout' ? 'the request was not received in time; the connection is closed'
    : code === 'header-too-large' ? 'the request headers are too large' : 'the request is not valid HTTP';
  const { status, title } = ERRORS[code];
  const body = JSON.stringify({ type: problemType(code), title, status, detail, instance: '', requestId: '' });
  if (socket.writable) {
    socket.write(`HTTP/1.1 ${status} ${STATUS_CODES[status]}\r\nContent-Type: ${PROBLEM_CONTENT_TYPE}\r\nContent-Length: ${Buffer.byteLength(body)}\r\nConnection: close\r\n\r\n${body}`);
  }
  socket.destroy();
}

export default fp(async function problems(app: FastifyInstance) {
  app.setErrorHandler((error: FastifyError, request, reply) => {
    const problem = toProblem(error, request);
    if (problem.status >= 500) request.log.error({ err: error }, 'request failed');
    else request.log.info({ code: problem.code, detail: clip(problem.message) }, 'client error');
    return sendProblem(request, reply, problem);
  });

  app.setNotFoundHandler((request, reply) =>
    sendProblem(request, reply, new ProblemError('not-found', `No route ${request.method} ${clip(request.url.split('?')[0] ?? '')}`)),
  );
}, { name: 'problems' });

/** GET /problems/{code}: registered after the OpenAPI plugin, so the document lists it. */
export const problemTypes = fp(async function problemTypes(app: FastifyInstance) {
  app.get('/problems/:code', {
    schema: {
      tags: ['service'],
      operationId: 'getProblemType',
      summary: 'What an error code means: its HTTP status, title and meaning (the `type` of every problem document points here)',
      params: z.object({ code: z.string().describe('An error code, e.g. validation-failed') }),
      response: { 200: ProblemType, 404: problemAnswer('problem-type-unknown: no such code') },
    },
  }, async (request, reply) => {
    const { code } = request.params as { code: string };
    if (!isErrorCode(code)) throw new ProblemError('problem-type-unknown', `No problem type "${code}"`);
    return reply.send({ type: problemType(code), code, ...ERRORS[code] });
  });
}, { name: 'problem-types', dependencies: ['problems'] });
