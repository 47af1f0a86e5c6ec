// A queue worker process (`npm run worker`, or `node dist/src/queue-worker.js`): takes BullMQ jobs
// from the Redis at REDIS_URL, runs their items through its own app (buildApp: the same validation,
// cache and solver threads as the API) and stores the lines. Run as many as needed beside the API
// replicas. SIGINT/SIGTERM: the job in hand goes back to the front of the queue, then the process exits.
import { buildApp } from './app.js';
import { loadConfig, type Config } from './config.js';
import { BullJobQueue, BullJobWorker } from './jobs/bullmq-queue.js';
import { toAnswer } from './jobs/answer.js';
import { callbackSender } from './jobs/callback.js';
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
process.on('SIGHUP', () => { void app.eop.reload(); });
/** On stop, callbacks still being delivered get this long; retries after it are dropped (logged as given up). */
const CALLBACK_GRACE_MS = 5000;

// Completion callbacks: this worker reads the record of each job it finishes and POSTs it.
const records = new BullJobQueue(config.REDIS_URL, { prefix: config.JOB_KEY_PREFIX, ttlS: config.JOB_RESULT_TTL_S, attempts: config.JOB_ATTEMPTS, backoffMs: config.JOB_BACKOFF_MS });
const callbacks = callbackSender(config, app.log);
const worker = new BullJobWorker(config.REDIS_URL, appRunner(app), {
  prefix: config.JOB_KEY_PREFIX,
  ttlS: config.JOB_RESULT_TTL_S,
  lockDurationMs: config.JOB_LOCK_MS,
  stalledIntervalMs: config.JOB_STALLED_INTERVAL_MS,
  maxStalledCount: config.JOB_MAX_STALLED,
  log: app.log,
  onFinished: (id) => {
    void records.get(id).then((job) => {
      if (job?.callbackUrl) void callbacks.send(job.callbackUrl, toAnswer(job), { job: id });
    }, (error: unknown) => app.log.warn({ job: id, err: error }, 'queue worker: job record unreadable; no callback'));
  },
});
for (const signal of ['SIGINT', 'SIGTERM'] as const) {
  process.once(signal, () => {
    app.log.info({ signal, worker: worker.id }, 'queue worker stopping');
    worker.stop().then(() => Promise.race([callbacks.idle(), new Promise((resolve) => setTimeout(resolve, CALLBACK_GRACE_MS))])).then(() => { callbacks.close(); return records.close(); }).then(() => app.close()).then(() => process.exit(0), () => process.exit(1));
  });
}
app.log.info({ worker: worker.id, prefix: config.JOB_KEY_PREFIX }, 'queue worker started');
await worker.run();
