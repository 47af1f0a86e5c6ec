// What every answer gets on its way out, and what comes before any route:
// - CORS (@fastify/cors): off unless CORS_ORIGINS lists the portals' origins; preflight answered
//   before the key check (a preflight carries no Authorization).
// - Security headers (@fastify/helmet) with a same-origin Content-Security-Policy under which
//   /docs and the scenario page at / work (neither uses inline script or style).
// - Compression (@fastify/compress): br or gzip as Accept-Encoding asks, for answers of at least
//   COMPRESS_MIN_BYTES, streamed answers (tracks, NDJSON) included.
import fp from 'fastify-plugin';
import cors from '@fastify/cors';
import helmet from '@fastify/helmet';
import compress from '@fastify/compress';
import type { FastifyInstance } from 'fastify';
import { constants as zlib } from 'node:zlib';

/** The one CSP of the service: same-origin scripts, styles, images (data: for the docs' icons) and fetches. */
export const CONTENT_SECURITY_POLICY = {
  defaultSrc: ["'self'"],
  scriptSrc: ["'self'"],
  styleSrc: ["'self'"],
  imgSrc: ["'self'", 'data:'],
  fontSrc: ["'self'"],
  connectSrc: ["'self'"],
  objectSrc: ["'none'"],
  baseUri: ["'none'"],
  formAction: ["'self'"],
  frameAncestors: ["'none'"],
  // helmet's default upgrade-insecure-requests would send a plain-HTTP page's own requests to https.
  upgradeInsecureRequests: null,
};

/** JSON, NDJSON, GeoJSON, problem+json, CSV, OEM (text/plain) and SVG. */
const COMPRESSIBLE = /^text\/|^application\/(?:[a-z.+-]*\+)?(?:json|x-ndjson)(?:;|$)|\+xml(?:;|$)/;

export default fp(async function edge(app: FastifyInstance) {
  const { CORS_ORIGINS, COMPRESS_MIN_BYTES } = app.config;
  const origins = (CORS_ORIGINS ?? '').split(',').map((o) => o.trim()).filter((o) => o !== '');
  if (origins.length > 0) {
    await app.register(cors, {
      origin: origins,
      methods: ['GET', 'HEAD', 'POST', 'DELETE'],
      allowedHeaders: ['authorization', 'content-type', 'accept', 'if-none-match', 'idempotency-key', 'x-request-id'],
      exposedHeaders: ['etag', 'content-location', 'location', 'x-cache', 'retry-after', 'ratelimit-limit', 'ratelimit-remaining', 'ratelimit-reset'],
      maxAge: 600,
      credentials: false,
    });
  }
  await app.register(helmet, {
    contentSecurityPolicy: { useDefaults: false, directives: CONTENT_SECURITY_POLICY },
    // The API may be read by allowed cross-origin portals (CORS decides); same-site by default otherwise.
    crossOriginResourcePolicy: { policy: origins.length > 0 ? 'cross-origin' : 'same-origin' },
  });
  if (COMPRESS_MIN_BYTES > 0) {
    await app.register(compress, {
      global: true,
      threshold: COMPRESS_MIN_BYTES,
      encodings: ['br', 'gzip'],
      customTypes: COMPRESSIBLE,
      // Brotli's default quality (11) costs far more CPU than it saves on the wire for numbers.
      brotliOptions: { params: { [zlib.BROTLI_PARAM_QUALITY]: 4 } },
      zlibOptions: { level: 6 },
    });
  }
}, { name: 'edge' });
