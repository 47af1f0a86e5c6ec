// buildApp(options) assembles the service and never listens: server.ts listens, tests inject.
import Fastify, { type FastifyInstance, type FastifyRequest } from 'fastify';
import { serializerCompiler, validatorCompiler, type ZodTypeProvider } from 'fastify-type-provider-zod';
import { defaultConfig, type Config } from './config.js';
import { MemoryCache } from './cache/memory.js';
import type { AnswerCache } from './cache/types.js';
import { RedisCache, TieredCache } from './cache/redis.js';
import problems, { clientErrorHandler, clip, frameworkErrors, MAX_PATH_SEGMENT_CHARS, problemTypes } from './plugins/problems.js';
import body, { requestIds } from './plugins/body.js';
import edge from './plugins/edge.js';
import pressure from './plugins/pressure.js';
import auth from './plugins/auth.js';
import limits from './plugins/limits.js';
import openapi from './plugins/openapi.js';
import answers from './plugins/answers.js';
import eop from './plugins/eop.js';
import memo from './plugins/memo.js';
import metrics from './plugins/metrics.js';
import pool from './plugins/pool.js';
import page from './plugins/page.js';
import health from './routes/health.js';
import bodies from './routes/bodies.js';
import orbit from './routes/orbit.js';
import results from './routes/results.js';
import track from './routes/track.js';
import passes from './routes/passes.js';
import eclipses from './routes/eclipses.js';
import twoBody from './routes/two-body.js';
import centralForce from './routes/central-force.js';
import batch from './routes/batch.js';
import jobs from './routes/jobs.js';
import { callbackSender } from './jobs/callback.js';

export interface BuildOptions {
  config?: Partial<Config>;
  /** pino options or false; tests pass false. */
  logger?: boolean | object;
  /** Replace the answer cache (tests, or a tiered cache built by server.ts). */
  cache?: AnswerCache;
}

/** The in-process LRU, with the shared Redis tier behind it when REDIS_URL is set. */
function answerCache(config: Config): AnswerCache {
  const local = new MemoryCache(config.CACHE_MAX_BYTES);
  return config.REDIS_URL ? new TieredCache(local, new RedisCache(config.REDIS_URL, { keyPrefix: config.CACHE_KEY_PREFIX })) : local;
}

function logRequest(request: FastifyRequest) {
  return { method: request.method, url: clip(request.url), requestId: request.id };
}

/** TRUST_PROXY: a hop count, or addresses and CIDR ranges. */
function trustProxy(text: string): string[] | ((address: string, hop: number) => boolean) {
  if (!/^\d+$/.test(text)) return text.split(',').map((s) => s.trim()).filter((s) => s !== '');
  const hops = Number(text);
  return (_address, hop) => hop < hops;
}

export async function buildApp(options: BuildOptions = {}): Promise<FastifyInstance> {
  const config: Config = { ...defaultConfig(), ...options.config };
  const logger = options.logger ?? { level: config.LOG_LEVEL };
  const app = Fastify({
    // Request log lines carry the method and a clipped path, never a 10 kB URL.
    logger: typeof logger === 'object' ? { ...logger, serializers: { req: logRequest } } : logger,
    bodyLimit: config.BODY_LIMIT_BYTES,
    requestIdHeader: false,
    genReqId: requestIds(),
    routerOptions: { ignoreTrailingSlash: true, maxParamLength: MAX_PATH_SEGMENT_CHARS },
    frameworkErrors,
    // Requests that arrive while closing get our 503 shutting-down problem (src/plugins/pressure.ts), not fastify's plain 503.
    return503OnClosing: false,
    ...(config.TRUST_PROXY === undefined ? {} : { trustProxy: trustProxy(config.TRUST_PROXY) }),
    clientErrorHandler,
    keepAliveTimeout: config.KEEP_ALIVE_TIMEOUT_S * 1000,
    // Whole-request bound for Node itself; the body's own bound (BODY_TIMEOUT_S) answers first.
    requestTimeout: (config.HEADERS_TIMEOUT_S + config.BODY_TIMEOUT_S) * 1000,
    // Node checks its header and request timeouts on this interval (default 30 s: far too coarse).
    http: { headersTimeout: config.HEADERS_TIMEOUT_S * 1000, connectionsCheckingInterval: 1000 },
  }).withTypeProvider<ZodTypeProvider>();

  app.setValidatorCompiler(validatorCompiler);
  app.setSerializerCompiler(serializerCompiler);
  app.decorate('config', config);
  // Readiness checks, added by the plugins that hold a dependency; GET /readyz runs them all.
  app.decorate('readiness', new Map());
  // Completion callbacks of in-process jobs (routes/jobs.ts sends them; tests wait with idle()).
  app.decorate('jobCallbacks', callbackSender(config, app.log));
  app.addHook('onClose', async () => app.jobCallbacks.close());

  await app.register(problems);
  // CORS (preflight before the key check), security headers and compression for every route after.
  await app.register(edge);
  await app.register(pressure);
  await app.register(body);
  await app.register(auth);
  await app.register(openapi);
  await app.register(problemTypes);
  await app.register(answers, {
    cache: options.cache ?? answerCache(config),
    maxStoredBytes: Math.floor(config.CACHE_MAX_BYTES / 4),
  });
  await app.register(eop);
  await app.register(memo, { maxBytes: config.REQUEST_MEMO_MAX_BYTES });
  await app.register(pool);
  await app.register(metrics);

  await app.register(page);
  await app.register(health);
  // Budgets attach to the routes registered after this (all of /v1).
  await app.register(limits);
  await app.register(bodies);
  await app.register(orbit);
  await app.register(track);
  await app.register(passes);
  await app.register(eclipses);
  await app.register(twoBody);
  await app.register(centralForce);
  await app.register(results);
  await app.register(batch);
  await app.register(jobs);
  return app;
}

declare module 'fastify' {
  interface FastifyInstance {
    config: Config;
  }
}
