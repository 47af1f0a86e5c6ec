// A queue worker process (`npm run worker`, or `node dist/src/queue-worker.js`): takes BullMQ jobs
// from the Redis at REDIS_URL, runs their items through its own app (buildApp: the same validation,
// cache and solver threads as the API) and stores the lines. Run as many as needed beside the API
// replicas. SIGINT/SIGTERM: the job in hand goes back to the front of the queue, then the process exits.
import { buildApp } from './app.js';
import { loadConfig, type Config } from './config.js';
import { BullJobWorker } from './jobs/bullmq-queue.js';
import { appRunner } from './jobs/runner.js';

let config: Config;
try {
  config = loadConfig();
} catch (error) {
  console.error((error as Error).message);
  process.exit(2);
}
if (!config.REDIS_URL) {
  console.error('queue-worker: REDIS_URL is not set; without Redis the API runs jobs in its own process and needs no worker');
  process.exit(2);
}

const app = await buildApp({ config, logger: { level: config.LOG_LEVEL } });
await app.ready();
const worker = new BullJobWorker(config.REDIS_URL, appRunner(app), {
  prefix: config.JOB_KEY_PREFIX,
  ttlS: config.JOB_RESULT_TTL_S,
  lockDurationMs: config.JOB_LOCK_MS,
  stalledIntervalMs: config.JOB_STALLED_INTERVAL_MS,
  maxStalledCount: config.JOB_MAX_STALLED,
  log: app.log,
});
for (const signal of ['SIGINT', 'SIGTERM'] as const) {
  process.once(signal, () => {
    app.log.info({ signal, worker: worker.id }, 'queue worker stopping');
    worker.stop().then(() => app.close()).then(() => process.exit(0), () => process.exit(1));
  });
}
app.log.info({ worker: worker.id, prefix: config.JOB_KEY_PREFIX }, 'queue worker started');
await worker.run();
