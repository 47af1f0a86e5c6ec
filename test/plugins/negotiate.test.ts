// Content negotiation (RFC 9110 sec. 12.5.1): the format field wins, else the Accept header with
// its q-values, else the first offered format; an Accept header that admits none is 406.
import type { FastifyRequest } from 'fastify';
import { describe, expect, it } from 'vitest';
import { ProblemError } from '../../src/errors.js';
import { chooseFormat } from '../../src/plugins/negotiate.js';

const OFFERED = [['json', 'application/json'], ['csv', 'text/csv'], ['oem', 'text/plain']] as const;
const request = (accept?: string) => ({ headers: accept === undefined ? {} : { accept } }) as unknown as FastifyRequest;

describe('chooseFormat', () => {
  it('takes the explicit format over any Accept header', () => {
    expect(chooseFormat(request('text/csv'), 'oem', OFFERED)).toBe('oem');
  });

  it('follows the Accept header and its q-values', () => {
    expect(chooseFormat(request('text/csv'), undefined, OFFERED)).toBe('csv');
    expect(chooseFormat(request('text/csv;q=0.5, text/plain'), undefined, OFFERED)).toBe('oem');
    expect(chooseFormat(request('text/*'), undefined, OFFERED)).toBe('csv');
  });

  it('answers the first offered format without an Accept header or with */*', () => {
    expect(chooseFormat(request(), undefined, OFFERED)).toBe('json');
    expect(chooseFormat(request('*/*'), undefined, OFFERED)).toBe('json');
  });

  it('refuses with 406 not-acceptable when nothing offered is acceptable', () => {
    try {
      chooseFormat(request('image/png'), undefined, OFFERED);
      expect.fail('no 406');
    } catch (err) {
      expect(err).toBeInstanceOf(ProblemError);
      expect((err as ProblemError).status).toBe(406);
      expect((err as ProblemError).code).toBe('not-acceptable');
    }
  });
});
