// Output format: the request's `format` field wins; else the Accept header (RFC 9110 sec. 12.5.1);
// else the first offered format. An Accept header that admits none of them is a 406.
import Negotiator from 'negotiator';
import type { FastifyRequest } from 'fastify';
import { ProblemError } from '../errors.js';

export function chooseFormat<F extends string>(request: FastifyRequest, explicit: F | undefined, offered: ReadonlyArray<readonly [F, string]>): F {
  if (explicit !== undefined) return explicit;
  const accept = request.headers.accept;
  if (!accept) return offered[0]![0];
  const mediaTypes = offered.map(([, type]) => type);
  const chosen = new Negotiator({ headers: { accept } }).mediaType(mediaTypes);
  const match = offered.find(([, type]) => type === chosen);
  if (!match) {
    throw new ProblemError('not-acceptable', `Accept "${accept}" admits none of ${mediaTypes.join(', ')}; or choose with the format field`);
  }
  return match[0];
}
