// RFC 9457 problem details for every 4xx/5xx answer, and GET /problems/{code} describing each type.
import fp from 'fastify-plugin';
import type { FastifyError, FastifyInstance, FastifyReply, FastifyRequest } from 'fastify';
import { hasZodFastifySchemaValidationErrors } from 'fastify-type-provider-zod';
import { ERRORS, ProblemError, isErrorCode, problemType, type ErrorCode, type FieldIssue } from '../errors.js';

export const PROBLEM_CONTENT_TYPE = 'application/problem+json';

export interface ProblemDocument {
  type: string;
  title: string;
  status: number;
  detail: string;
  instance: string;
  requestId: string;
  errors?: FieldIssue[];
}

export function sendProblem(request: FastifyRequest, reply: FastifyReply, problem: ProblemError): FastifyReply {
  const entry = ERRORS[problem.code];
  const body: ProblemDocument = {
    type: problemType(problem.code),
    title: entry.title,
    status: entry.status,
    detail: problem.message,
    instance: request.url,
    requestId: String(request.id),
    ...(problem.errors ? { errors: problem.errors } : {}),
  };
  for (const [k, v] of Object.entries(problem.headers)) reply.header(k, v);
  return reply.code(entry.status).type(PROBLEM_CONTENT_TYPE).send(JSON.stringify(body));
}

/** Fastify's own client errors (body parsing, media type, size) mapped to our codes. */
const FASTIFY_CODES: Record<string, ErrorCode> = {
  FST_ERR_CTP_INVALID_MEDIA_TYPE: 'unsupported-media-type',
  FST_ERR_CTP_INVALID_CONTENT_LENGTH: 'malformed-json',
  FST_ERR_CTP_BODY_TOO_LARGE: 'body-too-large',
  FST_ERR_CTP_EMPTY_JSON_BODY: 'malformed-json',
  FST_ERR_CTP_INVALID_JSON_BODY: 'malformed-json',
};

function toProblem(error: FastifyError): ProblemError {
  if (error instanceof ProblemError) return error;
  if (hasZodFastifySchemaValidationErrors(error)) {
    const where = error.validationContext ?? 'body';
    const errors = error.validation.map((v) => ({
      path: `${where}${v.instancePath === '/' ? '' : v.instancePath.replaceAll('/', '.')}`,
      message: v.message ?? 'invalid',
    }));
    const summary = errors.map((e) => `${e.path}: ${e.message}`).join('; ');
    return new ProblemError('validation-failed', `The request does not match the schema: ${summary}`, { errors });
  }
  const mapped = error.code ? FASTIFY_CODES[error.code] : undefined;
  if (mapped) return new ProblemError(mapped, error.message);
  if (error instanceof SyntaxError || (error.statusCode === 400 && /JSON/i.test(error.message))) {
    return new ProblemError('malformed-json', `The body is not valid JSON: ${error.message}`);
  }
  if (error.statusCode && error.statusCode >= 400 && error.statusCode < 500) {
    return new ProblemError('validation-failed', error.message);
  }
  return new ProblemError('internal', 'The service failed while answering; the request id identifies the fault in the logs.');
}

export default fp(async function problems(app: FastifyInstance) {
  app.setErrorHandler((error: FastifyError, request, reply) => {
    const problem = toProblem(error);
    if (problem.status >= 500) request.log.error({ err: error }, 'request failed');
    else request.log.info({ code: problem.code, detail: problem.message }, 'client error');
    return sendProblem(request, reply, problem);
  });

  app.setNotFoundHandler((request, reply) =>
    sendProblem(request, reply, new ProblemError('not-found', `No route ${request.method} ${request.url.split('?')[0]}`)),
  );

  app.get('/problems/:code', { schema: { hide: true } }, async (request, reply) => {
    const { code } = request.params as { code: string };
    if (!isErrorCode(code)) throw new ProblemError('problem-type-unknown', `No problem type "${code}"`);
    return reply.send({ type: problemType(code), code, ...ERRORS[code] });
  });
}, { name: 'problems' });
